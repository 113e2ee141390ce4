"""Every cut of a hub as its true shape, for measuring walls without a CAD kernel.

A round hole is a solid of revolution: its half-section in (radius, depth along the axis)
holds the countersink cone, the counterbore step and a drill-point bottom. A teardrop or a
hex nut slot is a prism of its true section. Each cutter gives the signed distance of
points to it (negative inside) and sample points on its surface; the cad layer cuts the
same shapes. Plain numpy.
"""

from __future__ import annotations

import math

import numpy as np

from generators.plan.model import Hole
from generators.plan.print_profiles import _basis, hex_slot_outline, teardrop_outline
from generators.plan.geometry import cross, unit
from generators.plan.sdf2d import poly_nearest, poly_sdf

# Segments of a teardrop's 270 deg arc in its section polygon (its surface samples are put on
# the true arc; distances to it are exact).
ARC_POINTS = 48
_SURFACES: dict[tuple, np.ndarray] = {}  # a shape's surface samples in its own frame


def point_depth_mm(hole: Hole) -> float:
    """How far a drill-point cone runs past the flat depth (0 for a flat bottom)."""
    if hole.point_deg is None:
        return 0.0
    return hole.radius_mm / math.tan(math.radians(hole.point_deg / 2))


class Cutter:
    """The material one hole removes."""

    def __init__(self, hole: Hole):
        self.hole = hole
        self.E = np.array(hole.entry_mm, dtype=float)
        self.a = np.array(unit(hole.axis), dtype=float)
        self.roof = None
        t0, t1 = -hole.lead_mm, hole.depth_mm + hole.extend_mm
        if hole.profile == "hex":
            x = unit(hole.slot_dir)
            self.x, self.y = np.array(x), np.array(cross(unit(hole.axis), x))
            self.section, self.t0, self.t1, self.revolved = np.array(hex_slot_outline(hole)), 0.0, hole.depth_mm, False
        elif hole.profile == "teardrop":
            y = unit(hole.roof_up)
            self.x, self.y = np.array(cross(y, unit(hole.axis))), np.array(y)
            self.section = np.array(teardrop_outline(hole.radius_mm, hole.roof_mm, ARC_POINTS))
            self.t0, self.t1, self.revolved = t0, t1, False
            # distances: the round hole and its roof (the tangent points, the apex or the
            # flat top, and the centre), whose union is the teardrop
            roof = self.section[ARC_POINTS:]
            self.roof = np.concatenate([roof, self.section[:1], np.zeros((1, 2))])
        else:
            x, y = _basis(hole.axis)
            self.x, self.y = np.array(x), np.array(y)
            self.half = np.array(_half_section(hole, t0, t1))
            # the closed section mirrored about the axis, for exact distances on both sides
            self.section = np.concatenate([self.half, self.half[::-1] * np.array([-1.0, 1.0])])
            self.t0, self.t1, self.revolved = t0, self.half[:, 1].max(), True
            # a plain cylinder (every vertex off the axis at the drill radius): closed form
            self.plain = (hole.point_deg is None
                          and all(abs(rho - hole.radius_mm) < 1e-12 for rho, _ in self.half[1:-1]))

    def _cylinder(self) -> tuple[float, float, float]:
        """(radius, first depth, last depth) of a cylinder about the axis holding the cut."""
        if getattr(self, "_cyl", None) is None:
            if self.revolved:
                self._cyl = (float(self.half[:, 0].max()), self.t0, float(self.half[:, 1].max()))
            else:
                self._cyl = (float(np.hypot(self.section[:, 0], self.section[:, 1]).max()), self.t0, self.t1)
        return self._cyl

    def bound(self, pts: np.ndarray) -> np.ndarray:
        """A lower bound of ``sdf``: the signed distance to the cylinder holding the cut."""
        R, lo, hi = self._cylinder()
        d = pts - self.E
        t = d @ self.a
        off = d - t[:, None] * self.a  # not sqrt(|d|^2 - t^2): that loses the digits near the axis
        rho = np.sqrt(np.einsum("ij,ij->i", off, off))
        dr, dt = rho - R, np.maximum(lo - t, t - hi)
        return np.where((dr <= 0) & (dt <= 0), np.maximum(dr, dt),
                        np.hypot(np.maximum(dr, 0.0), np.maximum(dt, 0.0)))

    def _local(self, pts: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        d = pts - self.E
        return d @ self.a, np.stack([d @ self.x, d @ self.y], axis=1)

    def sdf(self, pts: np.ndarray) -> np.ndarray:
        """Signed distance of points (N, 3) to the cut (negative inside)."""
        t, q = self._local(pts)
        if self.revolved and not self.plain:
            return poly_sdf(np.stack([np.hypot(q[:, 0], q[:, 1]), t], axis=1), self.half, axis_closed=True)
        if self.revolved:
            d2 = np.hypot(q[:, 0], q[:, 1]) - self.hole.radius_mm
        else:
            d2 = self._section_sdf(q)
        dt = np.maximum(self.t0 - t, t - self.t1)
        out = np.hypot(np.maximum(d2, 0), np.maximum(dt, 0))
        return np.where((d2 <= 0) & (dt <= 0), np.maximum(d2, dt), out)

    def _section_sdf(self, q: np.ndarray) -> np.ndarray:
        """Signed distance in the section of a prism (a teardrop: its round hole and roof)."""
        if self.roof is not None:
            return np.minimum(np.hypot(q[:, 0], q[:, 1]) - self.hole.radius_mm, poly_sdf(q, self.roof))
        return poly_sdf(q, self.section)

    def nearest(self, pts: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """``sdf`` and, for each point, the nearest point of the cut's surface (N, 3); inside
        a teardrop, the nearest point of whichever of its round hole and roof is deeper."""
        t, q = self._local(pts)
        if self.revolved:
            rho = np.hypot(q[:, 0], q[:, 1])
            if self.plain:
                d2, n2 = rho - self.hole.radius_mm, None
            else:
                d, n = poly_nearest(np.stack([rho, t], axis=1), self.half, axis_closed=True)
                return d, self._to_world(q, rho, n[:, 0], n[:, 1])
        elif self.roof is not None:
            rho = np.hypot(q[:, 0], q[:, 1])
            dc = rho - self.hole.radius_mm
            dr, nr = poly_nearest(q, self.roof)
            nc = q * (self.hole.radius_mm / np.where(rho > 0, rho, 1.0))[:, None]
            nc[rho <= 0] = (self.hole.radius_mm, 0.0)
            d2 = np.minimum(dc, dr)
            n2 = np.where((dc <= dr)[:, None], nc, nr)
        else:
            d2, n2 = poly_nearest(q, self.section)
        dt = np.maximum(self.t0 - t, t - self.t1)
        out = np.hypot(np.maximum(d2, 0), np.maximum(dt, 0))
        inside = (d2 <= 0) & (dt <= 0)
        d = np.where(inside, np.maximum(d2, dt), out)
        cap = np.where(t - self.t0 < self.t1 - t, self.t0, self.t1)
        to_side = ~inside & (d2 > 0) | inside & (d2 >= dt)  # else the section stays: a cap or inside it
        t_n = np.where(inside, np.where(d2 >= dt, t, cap), np.clip(t, self.t0, self.t1))
        if self.revolved:  # the plain cylinder
            return d, self._to_world(q, rho, np.where(to_side, self.hole.radius_mm, rho), t_n)
        q_n = np.where(to_side[:, None], n2, q)
        return d, self.E + t_n[:, None] * self.a + q_n[:, 0:1] * self.x + q_n[:, 1:2] * self.y

    def _to_world(self, q, rho, rho_n, t_n) -> np.ndarray:
        """A point at radius ``rho_n`` and depth ``t_n`` on the side of the axis ``q`` is on."""
        safe = np.where(rho > 0, rho, 1.0)
        ux, uy = np.where(rho > 0, q[:, 0] / safe, 1.0), np.where(rho > 0, q[:, 1] / safe, 0.0)
        return (self.E + t_n[:, None] * self.a + (rho_n * ux)[:, None] * self.x
                + (rho_n * uy)[:, None] * self.y)

    def surface(self, step: float, near: tuple | None = None) -> np.ndarray:
        """Points on the cutter's surface, about ``step`` apart; with ``near = (point, r)``
        only those within ``r`` of the point. The whole surface is laid out once per shape
        and step in the cut's own frame (a hub's like sockets and screws share it)."""
        if near is None:
            key = (self._shape_key(), step)
            local = _SURFACES.get(key)
            if local is None:
                local = self._local_surface(step, None)
                if len(_SURFACES) > 512:
                    _SURFACES.clear()
                _SURFACES[key] = local
        else:
            local = self._local_surface(step, near)
        out = self.E + local @ np.stack([self.a, self.x, self.y])
        if near is not None and len(out):
            out = out[np.linalg.norm(out - np.asarray(near[0]), axis=1) <= near[1]]
        return out

    def _shape_key(self) -> tuple:
        if self.revolved:
            return ("revolved", self.half.tobytes())
        return (self.hole.profile, self.section.tobytes(), self.t0, self.t1, self.hole.depth_mm)

    def _local_surface(self, step: float, near: tuple | None) -> np.ndarray:
        """``surface`` as (depth along the axis, x, y) in the cut's frame (N, 3)."""
        tp, qp, r = -np.inf, None, np.inf
        if near is not None:
            t_, q_ = self._local(np.asarray(near[0], dtype=float)[None])
            tp, qp, r = float(t_[0]), q_[0], float(near[1])
        pts = []
        if self.revolved:
            phi_p = math.atan2(qp[1], qp[0]) if qp is not None else 0.0
            walk = _walk(self.half, step, closed=False)
            if near is not None:
                walk = walk[np.abs(walk[:, 1] - tp) <= r]
            rho, t = walk[:, 0], walk[:, 1]
            n = np.where(rho > 1e-9, np.maximum(6, np.ceil(2 * math.pi * rho / step)), 1).astype(int)
            k = np.repeat(np.arange(len(n)), n)  # each point's ring
            j = np.arange(len(k)) - np.repeat(np.cumsum(n) - n, n)  # its place round the ring
            ang = j * (2 * math.pi / n[k])
            if near is not None:
                dphi = (ang - phi_p + math.pi) % (2 * math.pi) - math.pi
                reach = 2 * np.arcsin(np.minimum(1.0, r / (2 * np.maximum(rho, 1e-300)))) + 2 * math.pi / n
                keep = (rho <= r)[k] | (np.abs(dphi) <= reach[k])
                k, ang = k[keep], ang[keep]
            rk = rho[k]
            pts.append(np.stack([t[k], rk * np.cos(ang), rk * np.sin(ang)], axis=1))
        else:
            ring = self._ring(step)
            levels = np.linspace(self.t0, self.t1, max(2, int(math.ceil((self.t1 - self.t0) / step)) + 1))
            # the entry and the depth: where a cut meets the face it enters or its far face
            levels = np.union1d(levels, [t for t in (0.0, self.hole.depth_mm) if self.t0 < t < self.t1])
            if near is not None:
                ring = ring[np.hypot(*(ring - qp).T) <= r]
                levels = levels[np.abs(levels - tp) <= r]
            if len(ring) and len(levels):
                pts.append(np.column_stack([np.repeat(levels, len(ring)), np.tile(ring, (len(levels), 1))]))
            lo, hi = self.section.min(axis=0), self.section.max(axis=0)
            if near is not None:
                lo, hi = np.maximum(lo, qp - r), np.minimum(hi, qp + r)
            gx, gy = np.meshgrid(np.arange(lo[0], hi[0] + step, step), np.arange(lo[1], hi[1] + step, step))
            grid = np.stack([gx.ravel(), gy.ravel()], axis=1)
            grid = grid[self._section_sdf(grid) <= 0] if len(grid) else grid
            for t in (self.t0, self.t1):
                if abs(t - tp) <= r or near is None:
                    pts.append(np.column_stack([np.full(len(grid), t), grid]))
        pts = [p for p in pts if len(p)]
        return np.concatenate(pts) if pts else np.empty((0, 3))

    def _ring(self, step: float) -> np.ndarray:
        """Points round a prism's section about ``step`` apart; a teardrop's on its true arc
        (the polygon's chords lie inside it, by up to 0.12 % of the radius)."""
        ring = _walk(self.section, step, closed=True)
        if self.roof is not None:
            rho = np.hypot(ring[:, 0], ring[:, 1])
            arc = (poly_sdf(ring, self.roof) > 1e-9) & (rho > 0)
            ring[arc] *= (self.hole.radius_mm / rho[arc])[:, None]
        return ring

    def lines(self, step: float, near: tuple | None = None):
        """Straight lines lying on the cutter's side, about ``step`` apart round it, as
        (start points (N, 3), direction, length): the side of a prism, or the main cylinder
        of a round hole."""
        if self.revolved:
            r = self.hole.radius_mm
            seg = [(a[1], b[1]) for a, b in zip(self.half[:-1], self.half[1:])
                   if abs(a[0] - r) < 1e-9 and abs(b[0] - r) < 1e-9 and b[1] > a[1]]
            if not seg:
                return None
            ta, tb = seg[0][0], seg[-1][1]
            n = max(6, int(math.ceil(2 * math.pi * r / step)))
            ang = np.arange(n) * (2 * math.pi / n)
            ring = np.stack([r * np.cos(ang), r * np.sin(ang)], axis=1)
        else:
            ta, tb = self.t0, self.t1
            ring = self._ring(step)
        if near is not None:
            _, q_ = self._local(np.asarray(near[0], dtype=float)[None])
            ring = ring[np.hypot(*(ring - q_[0]).T) <= near[1]]
        starts = self.E + self.a * ta + np.outer(ring[:, 0], self.x) + np.outer(ring[:, 1], self.y)
        return starts, self.a, tb - ta

    def bounds(self) -> tuple[np.ndarray, np.ndarray]:
        """An axis-aligned box holding the cutter."""
        if getattr(self, "_box", None) is None:
            ends = np.array([self.E + self.a * self.t0, self.E + self.a * self.t1])
            reach = float(np.hypot(*np.abs(self.section).max(axis=0)))
            self._box = (ends.min(axis=0) - reach, ends.max(axis=0) + reach)
        return self._box

    def sdf_or_box(self, pts: np.ndarray, margin: float = 1.0) -> np.ndarray:
        """The signed distance where a point is within ``margin`` of the cut's holding cylinder
        (``bound``), else the distance to its box or to that cylinder: a lower bound of the
        same (positive) sign, for the many tests that only ask whether a point is inside a cut."""
        lo, hi = self.bounds()
        gap = np.maximum(np.maximum(lo - pts, pts - hi), 0.0)
        out = np.sqrt(np.einsum("ij,ij->i", gap, gap))
        near = np.nonzero(out <= margin)[0]
        if len(near):
            b = self.bound(pts[near])
            out[near] = b
            close = near[b <= margin]
            if len(close):
                out[close] = self.sdf(pts[close])
        return out


def _half_section(h: Hole, t0: float, t1: float) -> list[tuple[float, float]]:
    """(radius, depth) from the axis at the start, out, down the side and back to the axis:
    the widest of the drilled hole, its countersink cone, its counterbore and the clearance
    before its thread at every depth, then the drill point."""
    r = h.radius_mm
    pieces = [(t0, t1, r, r)]  # (from, to, radius at from, radius at to)
    if h.countersink is not None:
        half = math.radians(h.countersink.angle_deg / 2)
        R = h.countersink.diameter_mm / 2
        pieces.append((t0, (R - r) / math.tan(half), R + h.lead_mm * math.tan(half), r))
    if h.counterbore is not None:
        R = h.counterbore.diameter_mm / 2
        pieces.append((t0, h.counterbore.depth_mm, R, R))
    run = h.tapped
    if run is not None and run.clear_mm is not None and run.start_mm > 0:
        pieces.append((t0, run.start_mm, run.clear_mm / 2, run.clear_mm / 2))
    cuts = {t0, t1, 0.0, h.depth_mm} | {p[1] for p in pieces}
    for a in pieces:  # where two pieces cross inside an interval
        for b in pieces:
            ka, kb = (a[3] - a[2]) / (a[1] - a[0]), (b[3] - b[2]) / (b[1] - b[0])
            if abs(ka - kb) > 1e-12:
                t = (b[2] - kb * b[0] - a[2] + ka * a[0]) / (ka - kb)
                cuts.add(t)
    ts = sorted(t for t in cuts if t0 - 1e-12 <= t <= t1 + 1e-12)

    def radius(t: float, after: bool) -> float:
        out = 0.0
        for a, b, ra, rb in pieces:
            if (a - 1e-9 <= t < b - 1e-9) if after else (a + 1e-9 < t <= b + 1e-9):
                out = max(out, ra + (rb - ra) * (t - a) / (b - a))
        return out

    pts = [(0.0, t0)]
    for k, t in enumerate(ts):
        before = radius(t, after=False) if k else None
        after = radius(t, after=True) if k < len(ts) - 1 else None
        for rho in (before, after):
            if rho is not None and (abs(rho - pts[-1][0]) > 1e-12 or abs(t - pts[-1][1]) > 1e-12):
                pts.append((rho, t))
    pts.append((0.0, t1 + point_depth_mm(h)))
    return pts


def _walk(poly: np.ndarray, step: float, closed: bool) -> np.ndarray:
    """Points along a polyline about ``step`` apart, every vertex included (M, 2)."""
    a = poly if closed else poly[:-1]
    b = np.roll(poly, -1, axis=0) if closed else poly[1:]
    k = np.maximum(1, np.ceil(np.hypot(*(b - a).T) / step)).astype(int)
    e = np.repeat(np.arange(len(k)), k)
    f = (np.arange(len(e)) - np.repeat(np.cumsum(k) - k, k)) / k[e]
    out = a[e] + (b[e] - a[e]) * f[:, None]
    return out if closed else np.concatenate([out, poly[-1:]])
