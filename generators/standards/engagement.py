"""Tapped length a thread needs, and the tap depth that gives it (common practice, cited)."""

from __future__ import annotations

from generators.errors import UserError
from generators.standards.threads import Thread, parse_thread

# Engagement as a multiple of the major diameter D.
# metals: 1.5 D for a steel screw in aluminium or steel (common practice; Machinery's
#   Handbook "length of engagement" guidance gives about 1 D in steel, 1.5 D to 2 D in
#   aluminium and cast iron; from memory). plastics and wood: 2.5 D (common practice,
#   the upper end of the 2 to 2.5 D range, for a weak internal thread).
ENGAGEMENT_D = {"metal": 1.5, "plastic": 2.5, "wood": 2.5, "composite": 2.5}
# A plug tap's chamfer cuts incomplete threads over about 3 to 5 pitches; 2 pitches of
# lead beyond the full-thread depth are allowed for the tap's point here (common practice).
LEAD_PITCHES = 2.0


def engagement_mm(thread: Thread | str, material_class: str, key: str = "thread") -> float:
    """Full-thread length the tapped hole needs: factor x D (mm)."""
    t = parse_thread(thread, key)
    if material_class not in ENGAGEMENT_D:
        raise UserError("material_class", f"unknown material class {material_class!r}",
                        ", ".join(ENGAGEMENT_D))
    return ENGAGEMENT_D[material_class] * t.major_mm


def tap_depth_mm(thread: Thread | str, material_class: str, lead_pitches: float = LEAD_PITCHES,
                 key: str = "thread") -> float:
    """Depth to tap: engagement plus ``lead_pitches`` pitches of tap lead (mm)."""
    t = parse_thread(thread, key)
    return engagement_mm(t, material_class) + lead_pitches * t.pitch_mm
