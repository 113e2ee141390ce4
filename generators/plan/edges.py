"""Which edges of a hub face are free edges, and how far a hole's rim is from them.

A face's edge is free where the neighbouring face turns away sharply enough that the
material ends there. Where two faces meet at ``CONTINUES_DEG`` or more (the corners of a
12- or 16-sided block, a corner chamfer of a hexagon), the neighbour carries the material
on, and a hole near that crease is no nearer an edge than it is to the next free one
(common practice: such a corner does not break out like a plate edge).
"""

from __future__ import annotations

import math
import weakref

from generators.plan.geometry import Pt, dot, point_segment_distance_2d
from generators.plan.model import Face, HubPlan

CONTINUES_DEG = 150.0
_TOL = 1e-6


def _corners3d(face: Face) -> list[tuple[float, float, float]]:
    o, u, v = face.origin, face.u_axis, face.v_axis
    return [(o[0] + a * u[0] + b * v[0], o[1] + a * u[1] + b * v[1], o[2] + a * u[2] + b * v[2])
            for a, b in face.outline]


def _shares(face: Face, p, q) -> bool:
    pts = _corners3d(face)
    close = lambda a, b: max(abs(a[i] - b[i]) for i in range(3)) < 1e-6  # noqa: E731
    return any(close(p, c) for c in pts) and any(close(q, c) for c in pts)


_CACHE: dict[tuple[int, int], tuple[weakref.ref, Face, list]] = {}


def free_edges(plan: HubPlan, face: Face) -> list[tuple[Pt, Pt]]:
    """The face's outline edges (in face coordinates) where the material ends (kept per
    plan and face: the placement rules ask for every hole)."""
    key = (id(plan), id(face))
    got = _CACHE.get(key)
    if got is not None and got[0]() is plan and got[1] is face:
        return got[2]
    edges = _free_edges(plan, face)
    if len(_CACHE) > 1024:
        _CACHE.clear()
    _CACHE[key] = (weakref.ref(plan), face, edges)
    return edges


def _free_edges(plan: HubPlan, face: Face) -> list[tuple[Pt, Pt]]:
    if face.kind == "rim":
        C, T = face.outline[1][0], face.outline[2][1]
        return [((0.0, 0.0), (C, 0.0)), ((0.0, T), (C, T))]  # the seam at u = 0 is no edge
    out = []
    pts3 = _corners3d(face)
    n = len(face.outline)
    for i in range(n):
        a, b = face.outline[i], face.outline[(i + 1) % n]
        p, q = pts3[i], pts3[(i + 1) % n]
        neighbour = next((f for f in plan.faces if f.id != face.id and f.kind != "rim" and _shares(f, p, q)), None)
        if neighbour is not None:
            between = math.degrees(math.acos(max(-1.0, min(1.0, dot(face.normal, neighbour.normal)))))
            if 180.0 - between >= CONTINUES_DEG - _TOL:
                continue
        out.append((a, b))
    return out


def free_edge_distance(plan: HubPlan, face: Face, at: Pt) -> float:
    """Distance in the face from a point to its nearest free edge (inf when none)."""
    edges = free_edges(plan, face)
    return min((point_segment_distance_2d(at, a, b) for a, b in edges), default=math.inf)
