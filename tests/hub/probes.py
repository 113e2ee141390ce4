"""An independent model of where the hub should be solid, from the config and manifest.

The body comes from the config (regular prism with corner chamfers, or a cylinder);
the holes from the manifest (entry, axis, diameter, depth, countersink, counterbore).
The tests pick probe points whose expected state is unambiguous under this model
(well inside material, or well inside one hole) and ask the CAD kernel about the
re-imported STEP solid.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np


def unit(v) -> np.ndarray:
    v = np.asarray(v, dtype=float)
    return v / np.linalg.norm(v)


def perpendiculars(axis, count: int = 12) -> list[np.ndarray]:
    """``count`` unit vectors perpendicular to ``axis``, evenly spread (vertical first)."""
    a = unit(axis)
    ref = np.array([0.0, 0.0, 1.0]) if abs(a[2]) < 0.9 else np.array([1.0, 0.0, 0.0])
    e1 = unit(ref - a * np.dot(ref, a))
    e2 = np.cross(a, e1)
    return [math.cos(2 * math.pi * k / count) * e1 + math.sin(2 * math.pi * k / count) * e2
            for k in range(count)]


def segment_distance(p, a, b) -> float:
    p, a, b = (np.asarray(x, dtype=float) for x in (p, a, b))
    d = b - a
    t = np.clip(np.dot(p - a, d) / np.dot(d, d), 0.0, 1.0)
    return float(np.linalg.norm(p - (a + t * d)))


@dataclass(frozen=True)
class HoleModel:
    id: str
    kind: str
    face: str
    entry: np.ndarray
    axis: np.ndarray
    r: float
    depth: float
    through: bool
    cs: dict | None
    cb: dict | None
    tip: float = 0.0  # a blind drilled hole's point cone runs this far past depth on the axis
    cl: dict | None = None  # the clearance before a thread that starts inside the hole

    @classmethod
    def from_manifest(cls, rec: dict) -> "HoleModel":
        return cls(rec["id"], rec["kind"], rec["face"], np.array(rec["entry_mm"], dtype=float),
                   unit(rec["axis"]), rec["diameter_mm"] / 2, rec["depth_mm"], rec["through"],
                   rec["countersink"], rec["counterbore"], cl=rec.get("clearance"),
                   # cone of included angle point_deg on radius r: r / tan(angle / 2) (geometry)
                   tip=rec["diameter_mm"] / 2 / math.tan(math.radians(rec["point_deg"] / 2)) if rec.get("point_deg") else 0.0)

    def at(self, t: float) -> np.ndarray:
        return self.entry + self.axis * t

    @property
    def bottom(self) -> np.ndarray:
        return self.at(self.depth)

    @property
    def outer_r(self) -> float:
        return max(self.r, (self.cs or {}).get("diameter_mm", 0) / 2, (self.cb or {}).get("diameter_mm", 0) / 2,
                   (self.cl or {}).get("diameter_mm", 0) / 2)

    @property
    def recess_depth(self) -> float:
        """Axial length of the countersink cone, counterbore or clearance at the entry (0 if none)."""
        if self.cl:
            return max(self.cl["depth_mm"], (self.cb or {}).get("depth_mm", 0.0))
        if self.cs:
            return (self.cs["diameter_mm"] / 2 - self.r) / math.tan(math.radians(self.cs["angle_deg"] / 2))
        if self.cb:
            return self.cb["depth_mm"]
        return 0.0

    def keep_out(self, p) -> float:
        """Distance from ``p`` to this hole's generous envelope (negative inside).

        The envelope runs 1 mm before the entry and r + 1 mm past the bottom, so the
        cutter overruns into the bore or a socket never make a probe ambiguous.
        """
        a = self.at(-1.0)
        b = self.at(self.depth + max(self.r, self.tip) + 1.0)
        return segment_distance(p, a, b) - self.outer_r

    def face_normal(self) -> np.ndarray:
        """Outward normal of the face the hole enters (top/bottom, or radial at the entry)."""
        if self.face == "top":
            return np.array([0.0, 0.0, 1.0])
        if self.face == "bottom":
            return np.array([0.0, 0.0, -1.0])
        return unit([-self.axis[0], -self.axis[1], 0.0])


class BodyModel:
    """The uncut body from the config (mm): block prism with corner chamfers, or puck."""

    def __init__(self, cfg):
        hub, sp = cfg.hub, cfg.spreaders
        self.T = hub.thickness
        self.style = hub.style
        if self.style == "puck":
            self.R = hub.diameter / 2
            return
        n = hub.sides or sp.count
        self.n = n
        self.apothem = hub.across_flats / 2
        # circumradius of a regular n-gon = apothem / cos(pi/n) (standard plane geometry)
        self.Rc = self.apothem / math.cos(math.pi / n)
        # a chamfer of width c across a corner of interior angle pi - 2 pi/n sits
        # (c/2) tan(pi/n) inside the corner along its bisector (right-triangle trigonometry)
        self.d_chamfer = self.Rc - hub.corner_chamfer / 2 * math.tan(math.pi / n) \
            if hub.corner_chamfer > 0 else None
        self.flat_az = [sp.first_azimuth + k * 360 / n for k in range(n)]

    def depth_inside(self, p) -> float:
        """Distance inside the body envelope (negative outside)."""
        x, y, z = (float(c) for c in p)
        d = min(z, self.T - z)
        if self.style == "puck":
            return min(d, self.R - math.hypot(x, y))
        for az in self.flat_az:
            t = math.radians(az)
            d = min(d, self.apothem - (x * math.cos(t) + y * math.sin(t)))
            if self.d_chamfer is not None:
                tc = t + math.pi / self.n
                d = min(d, self.d_chamfer - (x * math.cos(tc) + y * math.sin(tc)))
        return d


class Oracle:
    def __init__(self, cfg, manifest):
        self.body = BodyModel(cfg)
        self.holes = [HoleModel.from_manifest(h) for h in manifest["holes"]]

    def hole(self, hid: str) -> HoleModel:
        return next(h for h in self.holes if h.id == hid)

    def surely_material(self, p, margin: float = 0.2) -> bool:
        """True when ``p`` is at least ``margin`` inside the body and outside every hole."""
        return self.body.depth_inside(p) >= margin and all(h.keep_out(p) >= margin for h in self.holes)

    def material_beside(self, hole: HoleModel, gap: float = 0.1):
        """(t, u): a depth along the hole and a direction across it where the point just
        outside the radius is surely material; None if the hole is crowded everywhere."""
        start = hole.recess_depth + 0.5
        ts = [hole.depth / 2, hole.depth / 4, 3 * hole.depth / 4, hole.depth / 8, start]
        ts = [t for t in ts if start <= t <= hole.depth - 0.3]
        others = [h for h in self.holes if h.id != hole.id]
        for t in ts:
            c = hole.at(t)
            for u in perpendiculars(hole.axis, 24):
                p = c + u * (hole.r + gap)
                if self.body.depth_inside(p) >= 0.2 and all(h.keep_out(p) >= 0.2 for h in others):
                    return t, u
        return None
