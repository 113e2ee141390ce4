"""Signed distance of 2D points to a simple polygon, all edges at once (plain numpy).

Kept apart so the wall measurer, the printed-pocket checks and the face regions share one
routine. Each polygon's edge data is cached by array identity: a cutter's section is asked
thousands of times.
"""

from __future__ import annotations

import numpy as np

_EDGES: dict[int, tuple] = {}
CHUNK = 8192


def _edges(poly: np.ndarray) -> tuple:
    key = id(poly)
    got = _EDGES.get(key)
    if got is not None and got[0] is poly:
        return got[1]
    ax, ay = poly[:, 0].copy(), poly[:, 1].copy()
    ab = np.roll(poly, -1, axis=0) - poly
    abx, aby = ab[:, 0].copy(), ab[:, 1].copy()
    L2 = abx * abx + aby * aby
    inv = np.where(L2 > 0, 1.0 / np.where(L2 > 0, L2, 1.0), 0.0)  # a repeated vertex: t = 0
    slope = np.where(aby == 0, 0.0, abx / np.where(aby == 0, 1.0, aby))
    data = (ax, ay, abx, aby, inv, slope, ay + aby)
    if len(_EDGES) > 4096:
        _EDGES.clear()
    _EDGES[key] = (poly, data)
    return data


def poly_sdf(q: np.ndarray, poly: np.ndarray, axis_closed: bool = False) -> np.ndarray:
    """Signed distance of points ``q`` (N, 2) to the closed polygon ``poly`` (M, 2),
    negative inside (even-odd rule). ``axis_closed``: the polygon is half a section of
    revolution, closed by its last edge along the axis ``x = 0``, and every point has
    ``x >= 0``; that edge is then no boundary (the mirrored half is never nearer)."""
    return _sdf(q, poly, None, axis_closed)


def poly_nearest(q: np.ndarray, poly: np.ndarray, axis_closed: bool = False) -> tuple[np.ndarray, np.ndarray]:
    """``poly_sdf`` and the nearest point of the polygon's boundary to each point (N, 2)."""
    near = np.empty((len(q), 2))
    return _sdf(q, poly, near, axis_closed), near


def _sdf(q: np.ndarray, poly: np.ndarray, near: np.ndarray | None, axis_closed: bool = False) -> np.ndarray:
    ax, ay, abx, aby, inv, slope, by = _edges(poly)
    out = np.empty(len(q))
    for lo in range(0, len(q), CHUNK):
        px, py = q[lo:lo + CHUNK, 0:1], q[lo:lo + CHUNK, 1:2]
        apx, apy = px - ax, py - ay
        t = (apx * abx + apy * aby) * inv
        np.clip(t, 0.0, 1.0, out=t)
        dx, dy = apx - t * abx, apy - t * aby
        d2 = dx * dx + dy * dy
        if axis_closed:
            d2[:, -1] = np.inf
        if near is None:
            d = np.sqrt(d2.min(axis=1))
        else:
            k = d2.argmin(axis=1)
            rows = np.arange(len(k))
            d = np.sqrt(d2[rows, k])
            tk = t[rows, k]
            near[lo:lo + CHUNK, 0] = ax[k] + tk * abx[k]
            near[lo:lo + CHUNK, 1] = ay[k] + tk * aby[k]
        crossing = (ay > py) != (by > py)
        crossing &= px < ax + apy * slope
        inside = (np.count_nonzero(crossing, axis=1) & 1).astype(bool)
        out[lo:lo + CHUNK] = np.where(inside, -d, d)
    return out
