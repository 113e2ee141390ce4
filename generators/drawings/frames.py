"""Face frames of a template sheet: a 3D point on a face to sheet (u, v), the rim's unrolled
frame, and how a tilted hole leans on the sheet."""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from generators.plan.geometry import Pt, Vec
from generators.plan.model import Face, Hole
from generators.plan.tilt_notes import Tilt, face_axes
from generators.plan.tilt_notes import tilt_of as plan_tilt_of

__all__ = ["Frame", "Tilt", "rim_join_azimuth", "tilt_of"]

def rim_join_azimuth(holes: list[Hole]) -> float:
    """Where the wrap strip starts: the middle of the widest gap between rim holes, so no
    hole is cut by the join."""
    if not holes:
        return 0.0
    azs = sorted(math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) % 360 for h in holes)
    best, join = -1.0, 0.0
    for i, a in enumerate(azs):
        b = azs[(i + 1) % len(azs)] + (360 if i == len(azs) - 1 else 0)
        if b - a > best + 1e-9:
            best, join = b - a, (a + (b - a) / 2) % 360
    return round(join, 6)


@dataclass(frozen=True)
class Frame:
    """Maps a 3D point on a face to sheet (u, v) mm, and gives the local face axes."""

    face: Face
    radius_mm: float | None = None  # rim only
    join_deg: float = 0.0  # rim only

    def uv(self, p: Vec) -> Pt:
        if self.face.kind != "rim":
            return self.face.to_face(p)
        az = (math.degrees(math.atan2(p[1], p[0])) - self.join_deg) % 360
        return (self.radius_mm * math.radians(az), p[2])

    def axes_at(self, p: Vec) -> tuple[Vec, Vec, Vec]:
        """(outward normal, u, v) of the face at ``p``."""
        return face_axes(self.face, p)

    def record(self) -> dict[str, Any]:
        if self.face.kind == "rim":
            return {"kind": "rim", "radius_mm": self.radius_mm, "join_azimuth_deg": self.join_deg,
                    "u": "arc length counter-clockwise seen from above, from the join", "v": "height above the bottom face"}
        f = self.face
        return {"kind": "plane", "origin_mm": list(f.origin), "u_axis": list(f.u_axis), "v_axis": list(f.v_axis)}


def tilt_of(frame: Frame, hole: Hole) -> Tilt | None:
    return plan_tilt_of(frame.face, hole)
