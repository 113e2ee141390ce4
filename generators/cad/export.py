"""Write STEP, STL and 3MF files from a solid, reproducibly.

The mesh comes from the kernel's tessellation, merged into one indexed mesh with
trimesh, so STL and 3MF share vertices between neighbouring triangles (the 3MF core
specification requires a manifold mesh), and is checked watertight before writing.
"""

from __future__ import annotations

import io
import re
import zipfile
from pathlib import Path

import cadquery as cq
import numpy as np
import trimesh

from generators.errors import UserError

FIXED_ZIP_TIME = (1980, 1, 1, 0, 0, 0)
_STEP_TIME = re.compile(rb"(FILE_NAME\('[^']*',')[^']*(')")


def write_step(solid: cq.Shape, path: Path) -> None:
    """STEP AP214 in millimetres, with the header time fixed so builds repeat."""
    solid.exportStep(str(path))
    data = path.read_bytes()
    path.write_bytes(_STEP_TIME.sub(rb"\g<1>1970-01-01T00:00:00\g<2>", data, count=1))


def mesh_of(solid: cq.Shape, tolerance: float, angular_deg: float, feature: str = "hub") -> trimesh.Trimesh:
    """A merged, watertight triangle mesh of the solid; refuses to return a leaky one."""
    import math

    verts, tris = solid.tessellate(tolerance, math.radians(angular_deg))
    v = np.array([(p.x, p.y, p.z) for p in verts], dtype=np.float64)
    f = np.array(tris, dtype=np.int64)
    mesh = trimesh.Trimesh(vertices=v, faces=f, process=True, validate=True)
    mesh.merge_vertices(digits_vertex=6)
    if not mesh.is_watertight:
        raise UserError(feature, "the tessellated mesh is not watertight",
                        "report it with the config written beside the output")
    if mesh.volume < 0:
        mesh.invert()
    return mesh


def write_stl(mesh: trimesh.Trimesh, path: Path) -> None:
    path.write_bytes(trimesh.exchange.stl.export_stl(mesh))


def write_3mf(mesh: trimesh.Trimesh, path: Path) -> None:
    """3MF with unit millimetre, re-zipped with fixed timestamps for reproducible bytes."""
    raw = trimesh.exchange.threemf.export_3MF(mesh)
    src = zipfile.ZipFile(io.BytesIO(raw))
    out = io.BytesIO()
    with zipfile.ZipFile(out, "w", compression=zipfile.ZIP_DEFLATED) as dst:
        for name in src.namelist():
            info = zipfile.ZipInfo(name, date_time=FIXED_ZIP_TIME)
            info.compress_type = zipfile.ZIP_DEFLATED
            info.external_attr = 0o644 << 16
            dst.writestr(info, src.read(name))
    path.write_bytes(out.getvalue())


def write_solid_files(solid: cq.Shape, folder: Path, stem: str, tolerance: float,
                      angular_deg: float) -> dict[str, float]:
    """STEP, STL and 3MF of one solid; returns volumes for the manifest and checks."""
    write_step(solid, folder / f"{stem}.step")
    mesh = mesh_of(solid, tolerance, angular_deg, feature=stem)
    write_stl(mesh, folder / f"{stem}.stl")
    write_3mf(mesh, folder / f"{stem}.3mf")
    return {"solid_volume_mm3": float(solid.Volume()), "mesh_volume_mm3": float(mesh.volume)}
