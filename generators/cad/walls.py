"""The least wall of the cut hub, measured on the solid itself with the CAD kernel.

Each face of the finished solid is assigned to the cut (or outer face of the body) it lies
on, by the plan's true cutter shapes (``plan/cutters.py``); then OCCT's exact shape-to-shape
distance (BRepExtrema, through cadquery's ``Shape.distance``) is taken between the faces of
every two features that do not meet by design. A plan bug that leaves a wall thinner than
the plan says shows here, on the part as it will be cut.
"""

from __future__ import annotations

import cadquery as cq
import numpy as np

from generators.cad.export import tessellate_mm
from generators.plan.cutters import Cutter
from generators.plan.measured_walls import faces_entered, meets_by_design
from generators.plan.model import HubPlan

# A face lies on a cut when the centres of its mesh triangles (meshed to TESSELLATE_MM) are
# all this close to the cutter's surface. Measure after the files are written: this leaves a
# fine mesh on the solid.
ON_SURFACE_MM = 0.05
TESSELLATE_MM = 0.01


def _feature_faces(solid: cq.Shape, plan: HubPlan) -> dict[str, list]:
    from generators.plan.measured_walls import _Body

    body = _Body(plan)
    cutters = [Cutter(h) for h in plan.holes]
    groups: dict[str, list] = {}
    for face in solid.Faces():
        verts, tris = tessellate_mm(face, TESSELLATE_MM, 0.2)
        if not tris:
            continue
        v = np.array([(p.x, p.y, p.z) for p in verts], dtype=float)
        pts = v[np.array(tris)].mean(axis=1)  # triangle centres: inside the face, not on its edges
        cands = [(float(np.abs(c.sdf(pts)).max()), c.hole.id) for c in cutters]
        cands += [(float(np.abs(body.face_distance(f, pts)).max()), f"face:{f.id}") for f in body.faces]
        err, ref = min(cands)
        groups.setdefault(ref if err <= ON_SURFACE_MM else "unassigned", []).append(face)
    return groups


def measure_solid_wall(solid: cq.Shape, plan: HubPlan) -> dict:
    """``{"min_wall_mm", "between": [a, b], "unassigned_faces"}`` for the cut solid."""
    groups = _feature_faces(solid, plan)
    holes = {h.id: h for h in plan.holes}
    refs = sorted(k for k in groups if k != "unassigned")
    comp = {k: cq.Compound.makeCompound(groups[k]) for k in refs}
    boxes = {k: comp[k].BoundingBox() for k in refs}
    # nearest boxes first, so the least wall is found early and the box gap (a lower bound
    # of the distance) passes over every pair that cannot beat it
    pairs = sorted((_box_gap(boxes[a], boxes[b]), a, b) for i, a in enumerate(refs) for b in refs[i + 1:]
                   if _walled(a, b, holes, plan))
    best = (float("inf"), None, None)
    for gap, a, b in pairs:
        if gap >= best[0]:
            break
        d = comp[a].distance(comp[b])
        if d < best[0]:
            best = (d, a, b)
    mm, a, b = best
    return {"min_wall_mm": None if a is None else round(mm, 3), "between": [a, b] if a else [],
            "unassigned_faces": len(groups.get("unassigned", []))}


def _walled(a: str, b: str, holes: dict, plan: HubPlan) -> bool:
    """True when material must stand between the two features."""
    fa, fb = a.startswith("face:"), b.startswith("face:")
    if fa and fb:
        return False  # two outer faces of the body
    if fa or fb:
        hole, face = (holes[b], a[5:]) if fa else (holes[a], b[5:])
        return face not in faces_entered(hole, plan)
    return not meets_by_design(holes[a], holes[b])


def _box_gap(p, q) -> float:
    gx = max(p.xmin - q.xmax, q.xmin - p.xmax, 0.0)
    gy = max(p.ymin - q.ymax, q.ymin - p.ymax, 0.0)
    gz = max(p.zmin - q.zmax, q.zmin - p.zmax, 0.0)
    return float(np.sqrt(gx * gx + gy * gy + gz * gz))
