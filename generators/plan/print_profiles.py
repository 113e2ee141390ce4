"""Printed-hub profile geometry: teardrop and hex-slot outlines, and signed distances to
the cut regions (for the printed wall checks). Plain numpy, no CAD."""

from __future__ import annotations

import math

import numpy as np

from generators.config.models import Config
from generators.plan.geometry import Vec, cross, dot, unit
from generators.plan.model import Hole
from generators.plan.sdf2d import poly_sdf as _poly_sdf

MIN_WALL_LINES = 4
# A flat roof over a void (a bridge) prints clean up to about 15 mm in PETG or ASA with
# part cooling (common practice); wider flat roofs are refused.
BRIDGE_LIMIT_MM = 15.0
# Overhangs steeper than 45 deg from vertical need support (common practice); a hole
# whose axis is further than this from vertical gets the teardrop profile.
OVERHANG_DEG = 45.0
# Slot directions tried around a screw axis (every 15 deg).
SLOT_DIRECTIONS = 24
# Points per circle when holes are approximated as polygons for the wall checks.
_CIRCLE_POINTS = 48
_SQRT2 = math.sqrt(2.0)


def min_wall_mm(cfg: Config) -> float:
    return MIN_WALL_LINES * cfg.print.line_width


# ---- small geometry ---------------------------------------------------------------------
def _basis(axis: Vec, prefer: Vec | None = None) -> tuple[Vec, Vec]:
    """Two unit vectors perpendicular to ``axis`` (the first towards ``prefer`` if given)."""
    a = unit(axis)
    ref = prefer if prefer is not None else ((1.0, 0.0, 0.0) if abs(a[0]) < 0.9 else (0.0, 1.0, 0.0))
    k = dot(ref, a)
    p = (ref[0] - k * a[0], ref[1] - k * a[1], ref[2] - k * a[2])
    if math.hypot(*p) < 1e-9:
        ref = (0.0, 1.0, 0.0) if abs(a[1]) < 0.9 else (1.0, 0.0, 0.0)
        k = dot(ref, a)
        p = (ref[0] - k * a[0], ref[1] - k * a[1], ref[2] - k * a[2])
    p = unit(p)
    return p, cross(a, p)


def needs_teardrop(axis: Vec) -> bool:
    """True when the axis is more than ``OVERHANG_DEG`` from vertical."""
    return abs(unit(axis)[2]) < math.cos(math.radians(OVERHANG_DEG)) - 1e-9


def roof_up(axis: Vec) -> Vec:
    """+Z made perpendicular to the axis: where a teardrop's point goes."""
    p, _ = _basis(axis, prefer=(0.0, 0.0, 1.0))
    return p


def teardrop_outline(radius: float, roof: float, n: int = _CIRCLE_POINTS) -> list[tuple[float, float]]:
    """Section of a teardrop in (x = sideways, y = roof_up), counter-clockwise.

    The circle below the two 45 deg tangent points, then the roof lines to the point
    ``(0, radius*sqrt 2)``, cut flat at ``y = roof`` when ``roof`` is lower.
    """
    pts = []
    for k in range(n + 1):  # arc from 45 deg right of the top, round the bottom, to 45 deg left
        ang = math.radians(45.0 + 270.0 * k / n)
        pts.append((radius * math.sin(ang), radius * math.cos(ang)))
    apex = radius * _SQRT2
    if roof >= apex - 1e-9:
        pts.append((0.0, apex))
    else:
        half = apex - roof
        pts += [(-half, roof), (half, roof)]
    return pts


def hex_slot_outline(hole: Hole) -> list[tuple[float, float]]:
    """A nut pocket's section in (x = slot_dir, y = axis x slot_dir): hexagon plus slot."""
    R, F = hole.diameter_mm / 2, hole.across_flats_mm / 2
    L_ = max(hole.slot_length_mm, R)
    return [(-R / 2, F), (-R, 0.0), (-R / 2, -F), (L_, -F), (L_, F)]


class _Region:
    def __init__(self, hole: Hole, x: Vec, y: Vec, poly, t0: float, t1: float):
        self.hole = hole
        self.E = np.array(hole.entry_mm, dtype=float)
        self.a = np.array(unit(hole.axis), dtype=float)
        self.x, self.y = np.array(x, dtype=float), np.array(y, dtype=float)
        self.poly = np.array(poly, dtype=float)
        self.t0, self.t1 = t0, t1

    def least(self, pts: np.ndarray, limit: float) -> float:
        """The least ``distance`` of the points, exact when it is under ``limit`` (else a
        figure at least ``limit``): points whose distance to the region's axis segment, less
        its widest reach, is not under the limit are not measured."""
        if not len(pts):
            return math.inf
        d = pts - self.E
        t = np.clip(d @ self.a, self.t0, self.t1)
        lb = np.linalg.norm(d - t[:, None] * self.a, axis=1) - float(np.hypot(*self.poly.T).max())
        close = lb < limit
        if not close.any():
            return float(lb.min())
        return float(self.distance(pts[close]).min())

    def distance(self, pts: np.ndarray) -> np.ndarray:
        """Signed distance of points (N, 3) to the region (negative inside)."""
        d = pts - self.E
        t = d @ self.a
        q = np.stack([d @ self.x, d @ self.y], axis=1)
        d2 = _poly_sdf(q, self.poly)
        dt = np.maximum(self.t0 - t, t - self.t1)
        out = np.hypot(np.maximum(d2, 0), np.maximum(dt, 0))
        return np.where((d2 <= 0) & (dt <= 0), np.maximum(d2, dt), out)


def edge_distances(pts: np.ndarray, outline) -> np.ndarray:
    """``geometry.edge_distance`` for many points at once (their x, y; negative outside)."""
    return -_poly_sdf(np.asarray(pts, dtype=float)[:, :2], np.asarray(outline, dtype=float))


def regions_of(hole: Hole) -> list[_Region]:
    """The material a hole removes, as prisms (countersink/counterbore as their full width)."""
    t0, t1 = -hole.lead_mm, hole.depth_mm + hole.extend_mm
    if hole.profile == "hex":
        x = unit(hole.slot_dir)
        y = cross(unit(hole.axis), x)
        return [_Region(hole, x, y, hex_slot_outline(hole), 0.0, hole.depth_mm)]
    if hole.profile == "teardrop":
        y = unit(hole.roof_up)
        x = cross(y, unit(hole.axis))
        poly = teardrop_outline(hole.radius_mm, hole.roof_mm)
    else:
        x, y = _basis(hole.axis)
        poly = [(hole.radius_mm * math.cos(2 * math.pi * k / _CIRCLE_POINTS),
                 hole.radius_mm * math.sin(2 * math.pi * k / _CIRCLE_POINTS)) for k in range(_CIRCLE_POINTS)]
    out = [_Region(hole, x, y, poly, t0, t1)]
    for extra_r, depth in ((hole.countersink.diameter_mm / 2 if hole.countersink else None, hole.radius_mm),
                           (hole.counterbore.diameter_mm / 2 if hole.counterbore else None,
                            hole.counterbore.depth_mm if hole.counterbore else 0.0)):
        if extra_r:
            circ = [(extra_r * math.cos(2 * math.pi * k / _CIRCLE_POINTS),
                     extra_r * math.sin(2 * math.pi * k / _CIRCLE_POINTS)) for k in range(_CIRCLE_POINTS)]
            out.append(_Region(hole, x, y, circ, -hole.lead_mm, max(depth, 0.5)))
    return out


def pocket_surface_points(hole: Hole, step: float = 1.0) -> np.ndarray:
    """Sample points on a pocket's boundary (outline edges at several levels, and its end faces)."""
    E = np.array(hole.entry_mm, dtype=float)
    a = np.array(unit(hole.axis), dtype=float)
    if hole.profile == "hex":
        x = np.array(unit(hole.slot_dir))
        poly = hex_slot_outline(hole)
        y = np.cross(a, x)
    else:
        x_, y_ = _basis(hole.axis) if hole.profile != "teardrop" else (
            cross(unit(hole.roof_up), unit(hole.axis)), unit(hole.roof_up))
        x, y = np.array(x_), np.array(y_)
        poly = (teardrop_outline(hole.radius_mm, hole.roof_mm) if hole.profile == "teardrop" else
                [(hole.radius_mm * math.cos(2 * math.pi * k / 24), hole.radius_mm * math.sin(2 * math.pi * k / 24))
                 for k in range(24)])
    ring = []
    for i in range(len(poly)):
        p, q = np.array(poly[i]), np.array(poly[(i + 1) % len(poly)])
        n = max(1, int(math.ceil(np.linalg.norm(q - p) / step)))
        for k in range(n):
            ring.append(p + (q - p) * k / n)
    ring = np.array(ring)
    levels = np.linspace(0.0, hole.depth_mm, max(2, int(math.ceil(hole.depth_mm / step)) + 1))
    pts = [E + a * t + np.outer(ring[:, 0], x) + np.outer(ring[:, 1], y) for t in levels]
    # the two end faces: a grid over the section
    poly_a = np.array(poly, dtype=float)
    lo, hi = poly_a.min(axis=0), poly_a.max(axis=0)
    gx, gy = np.meshgrid(np.arange(lo[0], hi[0] + step, step), np.arange(lo[1], hi[1] + step, step))
    grid = np.stack([gx.ravel(), gy.ravel()], axis=1)
    grid = grid[_poly_sdf(grid, poly_a) <= 0]
    for t in (0.0, hole.depth_mm):
        pts.append(E + a * t + np.outer(grid[:, 0], x) + np.outer(grid[:, 1], y))
    return np.concatenate(pts)


# ---- the transform -----------------------------------------------------------------------
