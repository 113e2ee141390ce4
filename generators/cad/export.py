"""Write STEP, STL and 3MF files from a solid, reproducibly.

The mesh comes from the kernel's tessellation, merged into one indexed mesh with
trimesh, so STL and 3MF share vertices between neighbouring triangles (the 3MF core
specification requires a manifold mesh), and is checked watertight before writing.
"""

from __future__ import annotations

import hashlib
import io
import re
import uuid
import zipfile
from pathlib import Path

import cadquery as cq
import numpy as np
import trimesh

from generators.errors import KernelError

FIXED_ZIP_TIME = (1980, 1, 1, 0, 0, 0)
_UUID = re.compile(rb'(UUID=")[0-9a-fA-F-]{36}"')
_STEP_TIME = re.compile(rb"(FILE_NAME\('[^']*',')[^']*(')")
# the translator numbers each export in a process: name the product after the file instead
_STEP_PRODUCT = re.compile(rb"PRODUCT\('Open CASCADE STEP translator[^']*',\s*'Open CASCADE STEP translator[^']*'")


def write_step(solid: cq.Shape, path: Path) -> None:
    """STEP AP214 in millimetres, with the header time fixed so builds repeat."""
    solid.exportStep(str(path))
    data = _STEP_TIME.sub(rb"\g<1>1970-01-01T00:00:00\g<2>", path.read_bytes(), count=1)
    name = path.stem.encode()
    path.write_bytes(_STEP_PRODUCT.sub(b"PRODUCT('" + name + b"','" + name + b"'", data, count=1))


def tessellate_mm(shape: cq.Shape, deflection_mm: float, angular_rad: float):
    """Vertices and triangles of a shape meshed afresh with an absolute chordal deflection in
    mm (cadquery's ``tessellate`` takes a deflection relative to each edge's size, and keeps
    any finer mesh the shape already carries)."""
    from OCP.BRepMesh import BRepMesh_IncrementalMesh
    from OCP.BRepTools import BRepTools

    BRepTools.Clean_s(shape.wrapped)
    BRepMesh_IncrementalMesh(shape.wrapped, deflection_mm, False, angular_rad, False)
    return shape.tessellate(deflection_mm, angular_rad)


def mesh_of(solid: cq.Shape, tolerance: float, angular_deg: float, feature: str = "hub") -> trimesh.Trimesh:
    """A merged, watertight triangle mesh of the solid; refuses to return a leaky one."""
    import math

    verts, tris = tessellate_mm(solid, tolerance, math.radians(angular_deg))
    v = np.array([(p.x, p.y, p.z) for p in verts], dtype=np.float64)
    f = np.array(tris, dtype=np.int64)
    mesh = trimesh.Trimesh(vertices=v, faces=f, process=True, validate=True)
    mesh.merge_vertices(digits_vertex=6)
    if not mesh.is_watertight:
        raise KernelError(feature, "the tessellated mesh is not watertight",
                        "a bug: please report it with the saved config")
    if mesh.volume < 0:
        mesh.invert()
    return mesh


def write_stl(mesh: trimesh.Trimesh, path: Path) -> None:
    path.write_bytes(trimesh.exchange.stl.export_stl(mesh))


def write_3mf(mesh: trimesh.Trimesh, path: Path) -> None:
    """3MF with unit millimetre, re-zipped with fixed timestamps for reproducible bytes."""
    raw = trimesh.exchange.threemf.export_3MF(mesh)
    src = zipfile.ZipFile(io.BytesIO(raw))
    digest = hashlib.sha256(mesh.vertices.tobytes() + mesh.faces.tobytes()).hexdigest()
    out = io.BytesIO()
    with zipfile.ZipFile(out, "w", compression=zipfile.ZIP_DEFLATED) as dst:
        for name in src.namelist():
            info = zipfile.ZipInfo(name, date_time=FIXED_ZIP_TIME)
            info.compress_type = zipfile.ZIP_DEFLATED
            info.external_attr = 0o644 << 16
            data = src.read(name)
            if name.endswith(".model"):
                data = _stable_uuids(data, digest)
            dst.writestr(info, data)
    path.write_bytes(out.getvalue())


def _stable_uuids(xml: bytes, digest: str) -> bytes:
    """Replace the random production-extension UUIDs with ones derived from the mesh."""
    count = iter(range(1_000_000))

    def repl(m: re.Match) -> bytes:
        u = uuid.uuid5(uuid.NAMESPACE_URL, f"hubwright:{digest}:{next(count)}")
        return m.group(1) + str(u).encode() + b'"'

    return _UUID.sub(repl, xml)


# STL and STEP volumes must agree within this fraction (or within the surface area times the
# chordal deflection, when that is more), or the mesh has lost material (a seam or a missing
# face) and the part is refused.
VOLUME_AGREEMENT = 0.005


def write_solid_files(solid: cq.Shape, folder: Path, stem: str, tolerance: float,
                      angular_deg: float, keep: dict | None = None) -> dict[str, float]:
    """STEP, STL and 3MF of one solid, the mesh checked against the solid's volume;
    returns both volumes for the manifest. With ``keep``, the mesh is stored there under
    ``stem`` for later writers (so nothing reads the STL back)."""
    write_step(solid, folder / f"{stem}.step")
    mesh = mesh_of(solid, tolerance, angular_deg, feature=stem)
    v_solid, v_mesh = float(solid.Volume()), float(mesh.volume)
    # every point of the mesh lies within the deflection of the surface, so the volumes can
    # differ by at most the surface area times the deflection
    allowed = max(VOLUME_AGREEMENT * v_solid, float(solid.Area()) * tolerance)
    if abs(v_mesh - v_solid) > allowed:
        raise KernelError(stem, f"the mesh volume ({v_mesh:.0f} mm3) disagrees with the solid"
                          f" ({v_solid:.0f} mm3)", "a bug: please report it with the saved config")
    write_stl(mesh, folder / f"{stem}.stl")
    write_3mf(mesh, folder / f"{stem}.3mf")
    if keep is not None:
        keep[stem] = mesh
    return {"solid_volume_mm3": v_solid, "mesh_volume_mm3": v_mesh}
