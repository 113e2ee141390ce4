"""Small vector and 2D helpers for the plan (plain floats, no numpy)."""

from __future__ import annotations

import math
from collections.abc import Sequence

Vec = tuple[float, float, float]
Pt = tuple[float, float]


def add(a: Vec, b: Vec) -> Vec:
    return (a[0] + b[0], a[1] + b[1], a[2] + b[2])


def sub(a: Vec, b: Vec) -> Vec:
    return (a[0] - b[0], a[1] - b[1], a[2] - b[2])


def scale(a: Vec, k: float) -> Vec:
    return (a[0] * k, a[1] * k, a[2] * k)


def dot(a: Vec, b: Vec) -> float:
    return a[0] * b[0] + a[1] * b[1] + a[2] * b[2]


def cross(a: Vec, b: Vec) -> Vec:
    return (a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0])


def norm(a: Vec) -> float:
    return math.sqrt(dot(a, a))


def unit(a: Vec) -> Vec:
    n = norm(a)
    return scale(a, 1.0 / n)


def polar(radius: float, azimuth_deg: float, z: float = 0.0) -> Vec:
    t = math.radians(azimuth_deg)
    return (radius * math.cos(t), radius * math.sin(t), z)


def segment_distance(p1: Vec, q1: Vec, p2: Vec, q2: Vec) -> float:
    """Shortest distance between segments p1-q1 and p2-q2 (closest-point method)."""
    d1, d2, r = sub(q1, p1), sub(q2, p2), sub(p1, p2)
    a, e, f = dot(d1, d1), dot(d2, d2), dot(d2, r)
    eps = 1e-12
    if a <= eps and e <= eps:
        return norm(r)
    if a <= eps:
        s, t = 0.0, min(max(f / e, 0.0), 1.0)
    else:
        c = dot(d1, r)
        if e <= eps:
            t, s = 0.0, min(max(-c / a, 0.0), 1.0)
        else:
            b = dot(d1, d2)
            denom = a * e - b * b
            s = min(max((b * f - c * e) / denom, 0.0), 1.0) if denom > eps else 0.0
            t = (b * s + f) / e
            if t < 0.0:
                t, s = 0.0, min(max(-c / a, 0.0), 1.0)
            elif t > 1.0:
                t, s = 1.0, min(max((b - c) / a, 0.0), 1.0)
    c1 = add(p1, scale(d1, s))
    c2 = add(p2, scale(d2, t))
    return norm(sub(c1, c2))


def point_segment_distance_2d(p: Pt, a: Pt, b: Pt) -> float:
    dx, dy = b[0] - a[0], b[1] - a[1]
    L2 = dx * dx + dy * dy
    t = 0.0 if L2 == 0 else max(0.0, min(1.0, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / L2))
    return math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy)


def inside_polygon(p: Pt, poly: Sequence[Pt]) -> bool:
    """Even-odd rule point-in-polygon test."""
    x, y = p
    inside = False
    n = len(poly)
    for i in range(n):
        x1, y1 = poly[i]
        x2, y2 = poly[(i + 1) % n]
        if (y1 > y) != (y2 > y) and x < x1 + (y - y1) * (x2 - x1) / (y2 - y1):
            inside = not inside
    return inside


def edge_distance(p: Pt, poly: Sequence[Pt]) -> float:
    """Distance from ``p`` to the polygon boundary; negative when outside."""
    d = min(point_segment_distance_2d(p, poly[i], poly[(i + 1) % len(poly)]) for i in range(len(poly)))
    return d if inside_polygon(p, poly) else -d


def hex_face_mm2(across_flats_mm: float, hole_mm: float) -> float:
    """Bearing area of a hex nut's face on a flat wall with a round hole through it: the
    hexagon, (sqrt 3 / 2) s^2, less the hole."""
    return math.sqrt(3) / 2 * across_flats_mm ** 2 - math.pi / 4 * hole_mm ** 2
