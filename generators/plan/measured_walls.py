"""The walls of a hub measured between the true shapes of its cuts (no CAD kernel).

Every cut is a ``Cutter`` (``plan/cutters.py``: teardrop roofs, hex slots, countersink
cones, counterbore steps, drill points). The wall between two cuts is the least distance
from the exposed surface of one (inside the body, outside every other cut) to the other,
sampled on both and taken both ways (to the true shape of the other where its nearest point
is a surface of the part, else to its exposed samples); the wall to a face of the body is the least distance
of a cut's exposed surface to that face (to the face itself, not its plane: past an obtuse
corner the neighbouring face continues the material). Cuts that meet by design (a set screw into its socket, a socket or clamp
hole into the bore, a pocket onto its hole, a hole onto the face it enters) are not walls.

Sampling: a first pass at ``COARSE_MM`` spacing, then the surface near the least wall of
each rule (and any within two coarse steps of it) again at ``FINE_MM``; those figures are then
within a few hundredths of a millimetre of the exact ones for these shapes (the others within
about a tenth). Two cuts more than ``REFINE_BELOW_MM`` apart
are not listed (no rule looks at walls that thick).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from generators.plan.cutters import Cutter
from generators.plan.sdf2d import poly_sdf
from generators.plan.kinds import POCKET_KINDS
from generators.plan.model import Hole, HubPlan

COARSE_MM, FINE_MM, REFINE_BELOW_MM = 1.0, 0.2, 12.0
REFINE_REACH = 3.0  # fine samples within this many coarse steps of the least points
POLISH_STEPS = 6  # nearest-point steps from the least sample to the least of the true shapes
INSIDE_EPS_MM = 1e-6
RIM_TOL_MM = 5e-4  # rims are bisected to this: well under the 0.001 mm walls are reported to


@dataclass(frozen=True)
class Wall:
    """The least material between feature ``a`` (a hole id) and ``b`` (a hole id or ``face:<id>``)."""

    a: str
    b: str
    mm: float
    at: tuple[float, float, float]  # a point on either side where it is least

    def as_json(self) -> dict:
        return {"between": [self.a, self.b], "mm": round(self.mm, 3), "at_mm": [round(v, 3) for v in self.at]}


class _Body:
    def __init__(self, plan: HubPlan):
        self.plan = plan
        self.faces = [f for f in plan.faces]
        flat = [f for f in self.faces if f.kind != "rim"]
        self._n = np.array([f.normal for f in flat], dtype=float).reshape(-1, 3)
        self._c = np.einsum("ij,ij->i", np.array([f.origin for f in flat], dtype=float).reshape(-1, 3), self._n)
        self._rims = [f.rim_radius_mm for f in self.faces if f.kind == "rim"]
        self._frames: dict[str, tuple] = {}

    def depth(self, pts: np.ndarray) -> np.ndarray:
        """The least ``face_distance`` over every face (positive inside the body)."""
        d = (self._c - pts @ self._n.T).min(axis=1) if len(self._n) else np.full(len(pts), np.inf)
        for r in self._rims:
            d = np.minimum(d, r - np.hypot(pts[:, 0], pts[:, 1]))
        return d

    def face_distance(self, face, pts: np.ndarray) -> np.ndarray:
        """Distance inward from the face's plane (positive inside the body)."""
        if face.kind == "rim":
            return face.rim_radius_mm - np.hypot(pts[:, 0], pts[:, 1])
        n = np.array(face.normal, dtype=float)
        return (np.array(face.origin, dtype=float) - pts) @ n

    def region_distance(self, face, pts: np.ndarray) -> np.ndarray:
        """Distance of points inside the body to the face itself (not its whole plane: past
        an obtuse corner the neighbouring face continues the material)."""
        h = self.face_distance(face, pts)
        if face.kind in ("top", "bottom"):
            return h  # the foot of every inside point lies on the outline
        if face.kind == "rim":
            z = pts[:, 2]
            return np.hypot(h, np.maximum(np.maximum(z - self.plan.body.thickness_mm, -z), 0.0))
        origin, uv, outline, box = self._frame(face)
        q = (pts - origin) @ uv
        if box is not None:  # a rectangle in (u, v): its distance in closed form
            gap = np.maximum(np.maximum(box[0] - q, q - box[1]), 0.0)
            off = np.hypot(gap[:, 0], gap[:, 1])
        else:
            off = np.maximum(poly_sdf(q, outline), 0.0)
        return np.hypot(h, off)

    def _frame(self, face):
        """A side face's origin, (u, v) axes (3, 2), outline, and its (lo, hi) corners when
        the outline is a rectangle along u and v."""
        got = self._frames.get(face.id)
        if got is None:
            outline = np.array(face.outline, dtype=float)
            lo, hi = outline.min(axis=0), outline.max(axis=0)
            on_box = np.all((np.abs(outline - lo) < 1e-9) | (np.abs(outline - hi) < 1e-9), axis=1)
            box = (lo, hi) if len(outline) == 4 and on_box.all() and len({tuple(r) for r in outline.round(9)}) == 4 else None
            got = (np.array(face.origin, dtype=float),
                   np.array([face.u_axis, face.v_axis], dtype=float).T, outline, box)
            self._frames[face.id] = got
        return got

    def least_to(self, face, pts: np.ndarray) -> tuple[float, int]:
        """The least ``region_distance`` of the points to the face, and which point: only
        the points whose distance to the face's plane (a lower bound) is under the figure
        found for the nearest of them are measured in full."""
        h = self.face_distance(face, pts)
        k0 = int(np.argmin(h))
        best, best_k = float(self.region_distance(face, pts[k0:k0 + 1])[0]), k0
        idx = np.nonzero(h < best)[0]
        if not len(idx):
            return best, best_k
        idx = idx[np.argsort(h[idx])]
        for lo in range(0, len(idx), 512):  # nearest the plane first, until none can come nearer
            part = idx[lo:lo + 512]
            if h[part[0]] >= best:
                break
            d = self.region_distance(face, pts[part])
            k = int(np.argmin(d))
            if d[k] < best:
                best, best_k = float(d[k]), int(part[k])
        return best, best_k

    def inside(self, pts: np.ndarray) -> np.ndarray:
        return self.depth(pts) >= -INSIDE_EPS_MM


def meets_by_design(a: Hole, b: Hole) -> bool:
    """True when two cuts are meant to run into each other."""
    for x, y in ((a, b), (b, a)):
        if x.kind == "set_screw" and y.kind == "socket" and x.spreader == y.spreader:
            return True
        if x.kind in ("socket", "clamp") and y.kind == "bore" and x.extend_mm > 0:
            return True
        if x.kind == "pin" and y.kind == "bore":  # it crosses the bore on both sides
            return True
        if x.kind in POCKET_KINDS and getattr(x, "serves", None) == y.id:
            return True
    return False


def faces_entered(h: Hole, plan: HubPlan) -> set[str]:
    """The faces a cut opens onto by design."""
    out = {h.face}
    if h.exit_face is not None:  # a pin leaves by the opposite side face
        out.add(h.exit_face)
    elif h.through or h.kind == "bore":
        out |= {"top", "bottom"}
    if h.kind in POCKET_KINDS:
        out |= {f.id for f in plan.faces}  # a nut slot slides in from a face; its walls are the printed rules'
    return out


def category(a: Hole, b: Hole | None) -> str:
    """The rule a wall belongs to: socket to face, socket to socket, socket to bore, or any
    other (``b`` is None for a face)."""
    kinds = {a.kind, b.kind if b is not None else "face"}
    if "socket" in kinds and kinds <= {"socket", "face", "bore"}:
        return "socket-" + (sorted(kinds - {"socket"}) or ["socket"])[0]
    return "other"


def measure_walls(plan: HubPlan, fine_below_mm: float = 0.0) -> list[Wall]:
    """Every wall of the hub: each pair of cuts that do not meet by design, and each cut to
    each face it does not enter; least first. Each is sampled coarsely; the least of each
    rule's walls, any within ``2 x COARSE_MM`` of it, and any under ``fine_below_mm`` (the
    figure under which a rule names every wall) are measured again finely."""
    body = _Body(plan)
    cutters = [Cutter(h) for h in plan.holes]
    boxes = [c.bounds() for c in cutters]
    exposed = {i: _exposed(c, i, cutters, body, COARSE_MM) for i, c in enumerate(cutters)}
    coarse = []  # (w, at, i, j or face)
    for i, ci in enumerate(cutters):
        pts = exposed[i]
        if len(pts) == 0:
            continue
        for j in range(i + 1, len(cutters)):
            if meets_by_design(ci.hole, cutters[j].hole) or _apart(boxes[i], boxes[j]):
                continue
            near = _box_distance(pts, boxes[j]) < REFINE_BELOW_MM
            if not near.any():
                continue  # more than REFINE_BELOW_MM apart: not a wall any rule looks at
            sel = pts[near]
            w, k = _to_exposed(sel, j, cutters, body, exposed[j])
            if np.isfinite(w):
                coarse.append((max(w, 0.0), sel[k], i, j))
        entered = faces_entered(ci.hole, plan)
        for f in body.faces:
            if f.id not in entered:
                d, k = body.least_to(f, pts)
                coarse.append((max(d, 0.0), pts[k], i, f))
    least: dict[str, float] = {}
    for w, _, i, other in coarse:
        c = category(cutters[i].hole, cutters[other].hole if isinstance(other, int) else None)
        least[c] = min(least.get(c, w), w)
    walls: dict[tuple[str, str], Wall] = {}
    for w, at, i, other in coarse:
        pair = isinstance(other, int)
        c = category(cutters[i].hole, cutters[other].hole if pair else None)
        if w < min(REFINE_BELOW_MM, max(least[c] + 2 * COARSE_MM, fine_below_mm)):
            if pair:
                w, at = _refine(cutters[i], i, cutters[other], other, cutters, body, at, w, exposed[other])
            else:
                fine = _exposed(cutters[i], i, cutters, body, FINE_MM, near=(at, 2 * COARSE_MM))
                if len(fine):
                    dd, k = body.least_to(other, fine)
                    if dd < w:
                        w, at = max(dd, 0.0), fine[k]
                if w > 0 and other.kind != "rim":
                    w, at = _polish_to_face(cutters, i, other, body, np.asarray(at, dtype=float), w)
        _keep(walls, cutters[i].hole.id, cutters[other].hole.id if pair else f"face:{other.id}", w, at)
    return sorted(walls.values(), key=lambda w: w.mm)


def _box_distance(pts: np.ndarray, box) -> np.ndarray:
    gap = np.maximum(np.maximum(box[0] - pts, pts - box[1]), 0.0)
    return np.linalg.norm(gap, axis=1)


def _keep(walls: dict, a: str, b: str, mm: float, at) -> None:
    key = (a, b) if b.startswith("face:") or a < b else (b, a)
    old = walls.get(key)
    if old is None or mm < old.mm:
        walls[key] = Wall(a=key[0], b=key[1], mm=mm, at=tuple(float(v) for v in at))


def _apart(box_a, box_b, margin: float = REFINE_BELOW_MM) -> bool:
    gap = np.maximum(box_a[0] - box_b[1], box_b[0] - box_a[1])
    return bool(np.linalg.norm(np.maximum(gap, 0.0)) > margin)


def _partners(cutters: list[Cutter], i: int) -> list[Cutter]:
    """The cuts that cut ``i`` meets by design."""
    return [o for k, o in enumerate(cutters) if k != i and meets_by_design(cutters[i].hole, o.hole)]


def _on_part(pts: np.ndarray, partners: list[Cutter], body: _Body) -> np.ndarray:
    """Which points of a cut's surface are a surface of the part: inside the body and
    outside every cut it meets by design."""
    ok = body.inside(pts)
    for o in partners:
        ok &= o.sdf_or_box(pts) >= -INSIDE_EPS_MM
    return ok


def _exposed(c: Cutter, i: int, cutters: list[Cutter], body: _Body, step: float, near=None) -> np.ndarray:
    """Surface points of cutter ``i`` that are a surface of the part (optionally only
    within ``near = (point, radius)``)."""
    partners = _partners(cutters, i)
    pts = np.concatenate([c.surface(step, near), _rims(c, partners, body, step, near)])
    pts = pts[body.inside(pts)]
    for o in partners:  # one cut at a time: each leaves fewer points for the next
        if len(pts):
            pts = pts[o.sdf_or_box(pts) >= -INSIDE_EPS_MM]
    return pts


def _exposure(pts: np.ndarray, partners: list[Cutter], body: _Body) -> np.ndarray:
    """Positive where a point of a cut's surface is a surface of the part: inside the body and
    outside every cut it meets by design."""
    g = body.depth(pts)
    for o in partners:
        g = np.minimum(g, o.sdf_or_box(pts))
    return g


def _rims(c: Cutter, partners: list[Cutter], body: _Body, step: float, near) -> np.ndarray:
    """Points on the rims where a cut's side leaves the part: where it runs into a cut it
    meets by design (a socket into the bore) or out through a face (a tilted socket's mouth
    on a round rim), found exactly by bisection along the lines of its side. The least wall is
    often on such a rim, which surface samples only come near."""
    got = c.lines(step, near)
    if got is None or len(got[0]) == 0:
        return np.empty((0, 3))
    starts, a, length = got
    t_lo, t_hi = 0.0, length
    if near is not None:  # only the stretch of the lines within reach of the point
        tp = float((np.asarray(near[0], dtype=float) - starts[0]) @ a)
        t_lo, t_hi = max(0.0, tp - near[1] - step), min(length, tp + near[1] + step)
        if t_hi <= t_lo:
            return np.empty((0, 3))
    ts = np.linspace(t_lo, t_hi, max(2, int(math.ceil((t_hi - t_lo) / step)) + 1))
    pts = starts[:, None, :] + ts[None, :, None] * a  # (lines, levels, 3)
    g = _exposure(pts.reshape(-1, 3), partners, body).reshape(pts.shape[:2])
    li, ki = np.nonzero((g[:, :-1] >= 0) != (g[:, 1:] >= 0))
    if len(li) == 0:
        return np.empty((0, 3))
    t = _crossing(starts[li], a, ts[ki], ts[ki + 1], g[li, ki], g[li, ki + 1], partners, body)
    return starts[li] + t[:, None] * a


def _crossing(p0, a, lo, hi, g_lo, g_hi, partners, body) -> np.ndarray:
    """Where ``_exposure`` changes sign on each line ``p0 + t a`` between ``lo`` and ``hi``,
    to ``RIM_TOL_MM``: the exposed end of the last bracket. Regula falsi (the Illinois
    variant: the end kept twice has its value halved) narrows each bracket; a bisection step
    in every third round keeps the worst case within that of bisection alone."""
    lo, hi, g_lo, g_hi = lo.copy(), hi.copy(), g_lo.copy(), g_hi.copy()
    out_lo = g_lo >= 0  # which end is on the exposed side (it stays that side)
    kept = np.zeros(len(lo), dtype=int)  # +1: lo kept last round, -1: hi kept
    todo = np.nonzero(hi - lo > RIM_TOL_MM)[0]
    for k in range(60):
        if not len(todo):
            break
        l, h, gl, gh = lo[todo], hi[todo], g_lo[todo], g_hi[todo]
        denom = gl - gh
        mid = np.where(np.abs(denom) > 0, l + (h - l) * gl / np.where(np.abs(denom) > 0, denom, 1.0), (l + h) / 2)
        if k % 3 == 2:
            mid = (l + h) / 2
        mid = np.clip(mid, l + 0.1 * RIM_TOL_MM, h - 0.1 * RIM_TOL_MM)
        gm = _exposure(p0[todo] + mid[:, None] * a, partners, body)
        side_lo = (gm >= 0) == out_lo[todo]  # the new point replaces the lo end
        gl_new = np.where(side_lo, gm, np.where(kept[todo] == 1, gl / 2, gl))
        gh_new = np.where(side_lo, np.where(kept[todo] == -1, gh / 2, gh), gm)
        lo[todo], hi[todo] = np.where(side_lo, mid, l), np.where(side_lo, h, mid)
        g_lo[todo], g_hi[todo] = gl_new, gh_new
        kept[todo] = np.where(side_lo, -1, 1)
        todo = todo[hi[todo] - lo[todo] > RIM_TOL_MM]
    return np.where(out_lo, lo, hi)


def _refine(ci: Cutter, i: int, cj: Cutter, j: int, cutters, body, at, w: float, cloud_j: np.ndarray):
    """The wall between two cuts again, from fine samples near the coarse least point on
    each (on ``j``: its exposed coarse sample nearest that point), both ways."""
    best, where = w, at
    at = np.asarray(at, dtype=float)
    partner = cloud_j[int(np.argmin(np.einsum("ij,ij->i", cloud_j - at, cloud_j - at)))] if len(cloud_j) else at
    reach = REFINE_REACH * COARSE_MM
    fine = {i: _exposed(ci, i, cutters, body, FINE_MM, near=(at, reach)),
            j: _exposed(cj, j, cutters, body, FINE_MM, near=(partner, reach))}
    side = i
    for src, dst in ((i, j), (j, i)):
        if len(fine[src]) == 0:
            continue
        dk, k = _to_exposed(fine[src], dst, cutters, body, fine[dst])
        if dk < best:
            best, where, side = max(dk, 0.0), fine[src][k], src
    if best > 0:
        other = j if side == i else i
        best, where = _polish(cutters, side, other, body, np.asarray(where, dtype=float), best)
    return best, where


def _polish_to_face(cutters: list[Cutter], a: int, face, body: _Body, p: np.ndarray, best: float):
    """``_polish`` against a flat face: the foot of the point on the face's plane, the
    nearest point of the cut to that foot, and so on, while the foot lies on the face, the
    point is a surface of the part and the wall falls."""
    ca, pa = cutters[a], _partners(cutters, a)
    n = np.array(face.normal, dtype=float)
    x = p[None]
    for _ in range(POLISH_STEPS):
        h = body.face_distance(face, x)
        if h[0] <= 0 or body.region_distance(face, x)[0] > h[0] + 1e-9:
            break  # outside, or the nearest point of the face is not its foot
        _, x2 = ca.nearest(x + h[0] * n)
        if not _on_part(x2, pa, body)[0]:
            break
        d2 = float(body.region_distance(face, x2)[0])
        if d2 >= best - 1e-9:
            break
        best, x = d2, x2
    return best, x[0]


def _polish(cutters: list[Cutter], a: int, b: int, body: _Body, p: np.ndarray, best: float):
    """Walk the least wall from the sample ``p`` on cut ``a`` to the exact least of the two
    true shapes nearby: the nearest point of ``b`` to it, the nearest point of ``a`` to that,
    and so on, while both are surfaces of the part and the distance falls (samples on a
    curve stand off the least by up to a few microns). Each figure is the distance between
    two points of the part's surface, so never under the true wall."""
    ca, cb, pa, pb = cutters[a], cutters[b], _partners(cutters, a), _partners(cutters, b)
    x = p[None]
    for _ in range(POLISH_STEPS):
        d, q = cb.nearest(x)
        if d[0] <= 0 or not _on_part(q, pb, body)[0]:
            break
        _, x2 = ca.nearest(q)
        if not _on_part(x2, pa, body)[0]:
            break
        dist = float(np.linalg.norm(x2[0] - q[0]))
        if dist >= best - 1e-9:
            break
        best, x = dist, x2
    return best, x[0]


def _to_exposed(pts: np.ndarray, j: int, cutters: list[Cutter], body: _Body, cloud: np.ndarray) -> tuple[float, int]:
    """Least distance from the points to the exposed surface of cut ``j``, and which point:
    to its true shape where the nearest point of that shape is a surface of the part, else
    to its exposed samples (where it runs into the bore, a socket or out of the body the
    nearest material is on that rim). Points are taken nearest first and the search stops
    once no remaining point can come nearer (the distance to the cylinder holding the shape
    bounds it)."""
    c = cutters[j]
    d = c.bound(pts)
    order = np.argsort(d)
    partners = _partners(cutters, j)
    best, best_k = np.inf, int(order[0]) if len(order) else 0
    for lo in range(0, len(order), 256):
        idx = order[lo:lo + 256]
        if d[idx[0]] >= best:
            break
        p = pts[idx]
        dd, q = c.nearest(p)  # q: the nearest point of the shape (used only outside it)
        ok = _on_part(q, partners, body) | (dd <= 0)
        dist = np.where(ok, dd, np.inf)
        good = dist[ok].min() if ok.any() else np.inf
        bad = np.nonzero(~ok & (dd < min(best, good)))[0]  # only those that could come nearer
        if len(bad) and len(cloud):
            reach = min(best, good, float(dd[bad].max()) + 2 * COARSE_MM)
            lo_, hi_ = p[bad].min(axis=0) - reach, p[bad].max(axis=0) + reach
            near = cloud[np.all((cloud >= lo_) & (cloud <= hi_), axis=1)]
            if len(near):
                dist[bad] = _cloud_distance(p[bad], near)
        k = int(np.argmin(dist))
        if dist[k] < best:
            best, best_k = float(dist[k]), int(idx[k])
    return best, best_k


def _cloud_distance(p: np.ndarray, cloud: np.ndarray) -> np.ndarray:
    """Distance from each point to the nearest of a cloud, by |p|^2 + |c|^2 - 2 p.c taken
    about the cloud's centre (a matrix product; rounding well under a micron at hub sizes)."""
    o = cloud.mean(axis=0)
    p, c = p - o, cloud - o
    d2 = (p * p).sum(axis=1)[:, None] + (c * c).sum(axis=1)[None, :] - 2.0 * (p @ c.T)
    return np.sqrt(np.maximum(d2.min(axis=1), 0.0))
