"""Drill and tap choices for the plan's holes, from the standards tables."""

from __future__ import annotations

from collections.abc import Iterable

from generators.standards.drills import drills
from generators.standards.materials import get_material
from generators.standards.tapdrill import TapDrill, tap_drill

# A drill "matches" a plain diameter when within 0.01 mm of it.
MATCH_MM = 0.01


def material_class(material_id: str) -> str:
    return get_material(material_id).material_class


def tap_hole(thread, material_class: str, series: Iterable[str]) -> TapDrill:
    return tap_drill(thread, material_class, tuple(series))


def drill_name_for(diameter_mm: float, series: Iterable[str]) -> str | None:
    """The name of a stock drill of this diameter (within ``SAME_SIZE_MM``), or None (bored or milled)."""
    from generators.standards.drills import SAME_SIZE_MM

    best = min(drills(tuple(series)), key=lambda d: abs(d.diameter_mm - diameter_mm), default=None)
    if best is not None and abs(best.diameter_mm - diameter_mm) <= SAME_SIZE_MM:
        return best.name
    return None


def clearance_drill(target_mm: float, series: Iterable[str]) -> tuple[str | None, float]:
    """The smallest stock drill not under the target clearance (name, diameter)."""
    for d in drills(tuple(series)):
        if d.diameter_mm >= target_mm - MATCH_MM:
            return d.name, d.diameter_mm
    return None, target_mm
