"""Checks of a mesh as it will sit on the printer bed: on Z = 0, millimetre 3MF, no
unsupported overhang, flat roofs (bridges) no wider than the printed-plan limit."""

from __future__ import annotations

import math
import re
import zipfile
from pathlib import Path

import numpy as np
import trimesh

from generators.plan.printed import BRIDGE_LIMIT_MM, OVERHANG_DEG

# A facet counts as an overhang when its surface is flatter than the limit less this much
# (tessellated 45 deg roofs come out a few degrees either side).
OVERHANG_TOLERANCE_DEG = 5.0
BED_TOLERANCE_MM = 1e-6


def threemf_unit(path: Path) -> str | None:
    """The ``unit`` attribute of the 3MF model (the core specification's default is millimeter)."""
    with zipfile.ZipFile(path) as z:
        name = next(n for n in z.namelist() if n.endswith(".model"))
        head = z.read(name)[:4000].decode("utf-8", "replace")
    m = re.search(r"<model\b[^>]*\bunit=\"([a-z]+)\"", head)
    return m.group(1) if m else None


def downward_regions(mesh: trimesh.Trimesh, bed_z: float = 0.0):
    """Connected regions of facets flatter than the overhang limit facing down, above the bed.

    Each region is (normal_z_min, area_mm2, width_mm, z_mm): width is the smaller side of the
    region's smallest bounding rectangle seen from below, which is what a bridge must span.
    """
    limit = -math.cos(math.radians(OVERHANG_DEG - OVERHANG_TOLERANCE_DEG))
    nz = mesh.face_normals[:, 2]
    zc = mesh.triangles_center[:, 2]
    sel = np.nonzero((nz < limit) & (zc > bed_z + 1e-3))[0]
    if len(sel) == 0:
        return []
    adj = mesh.face_adjacency
    keep = np.isin(adj[:, 0], sel) & np.isin(adj[:, 1], sel)
    groups = trimesh.graph.connected_components(adj[keep], nodes=sel, min_len=1)
    out = []
    for g in groups:
        g = np.asarray(g)
        pts = mesh.vertices[mesh.faces[g].ravel()][:, :2]
        try:
            _, extents = trimesh.bounds.oriented_bounds_2D(pts)
            width = float(min(extents))
        except Exception:  # degenerate (a sliver): its extent is all there is
            width = float(np.ptp(pts, axis=0).min())
        out.append((float(nz[g].max()), float(mesh.area_faces[g].sum()), width,
                    float(zc[g].mean())))
    return out


def print_problems(mesh: trimesh.Trimesh) -> list[str]:
    """What would not print without support: sloped overhangs, too-wide bridges, off the bed."""
    problems = []
    zmin = float(mesh.bounds[0][2])
    if abs(zmin) > BED_TOLERANCE_MM:
        problems.append(f"the mesh does not sit on the bed (min Z = {zmin:.6f} mm)")
    for nz_max, area, width, z in downward_regions(mesh, bed_z=zmin):
        flat = nz_max < -0.999
        if not flat and area > 1.0:
            problems.append(f"an overhang of {area:.1f} mm2 at Z = {z:.1f} mm is flatter than {OVERHANG_DEG:g} deg from horizontal")
        elif flat and width > BRIDGE_LIMIT_MM:
            problems.append(f"a flat roof {width:.1f} mm wide at Z = {z:.1f} mm is over the"
                            f" {BRIDGE_LIMIT_MM:g} mm bridge limit")
    return problems
