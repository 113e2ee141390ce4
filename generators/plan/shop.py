"""What the shop has and how it cuts: drill series, pilots, opening up, and the cutter for a
hole no stock drill makes, by hub material and depth.

Every drilling instruction of a build (templates, report, manifest) is made from these
choices once, in ``generators.plan.operations``.
"""

from __future__ import annotations

from dataclasses import dataclass

from generators.standards.drills import INCH_SERIES, METRIC_SERIES, SAME_SIZE_MM, Drill, drills, find_drill
from generators.units import MM_PER_IN

# Drills over 10 mm (3/8 in in an inch shop) wander and grab unless a pilot goes first; the
# pilot is about a third of the drill, never under 3 mm (common practice).
PILOT_ABOVE_MM = {"mm": 10.0, "in": 3 / 8 * MM_PER_IN}
PILOT_FRACTION = 1.0 / 3.0
PILOT_MIN_MM = 3.0
# A hole with no stock drill of its size is drilled with the largest drill under it and opened
# up when that drill is at least 90 % of it; else it is cut (common practice).
OPEN_UP_FRACTION = 0.9
# Depth a hole saw cuts in one pass: about 38 mm (1-1/2 in) for the common bi-metal saws
# (from memory: makers' catalogues; deep-cut saws reach about 50 mm).
HOLE_SAW_DEPTH_MM = 38.0
# Depth of cut of a common annular cutter: 25 mm and 50 mm lengths (from memory: makers'
# catalogues); diameters 12 to 60 mm in common sets (from memory).
ANNULAR_DEPTH_MM = 50.0
ANNULAR_MAX_DIAMETER_MM = 60.0
# Drill names match a plan diameter within this much (0.001 in).
MATCH_MM = SAME_SIZE_MM


def drill_series(cfg) -> tuple[str, ...]:
    """The drill sets the shop has (``shop.drills``), else the config's system."""
    if cfg.shop.drills:
        return tuple(cfg.shop.drills)
    return INCH_SERIES if cfg.units == "in" else METRIC_SERIES


def drill_label(name: str, diameter_mm: float, units: str) -> str:
    """The shop label of a plan's drill: ``#7 (0.2010 in)``, ``5/16 (0.3125 in)``, ``5.0 mm``.

    Looked up by name and size together: a 1 in fractional drill is named ``1`` like the
    number drill ``#1`` is found by ``"1"``."""
    from generators.standards.drills import SERIES

    for d in drills(SERIES):
        if d.name == name and abs(d.diameter_mm - diameter_mm) <= MATCH_MM:
            return d.label(units)
    return find_drill(name).label(units)


def stock_drill(diameter_mm: float, series: tuple[str, ...]) -> Drill | None:
    """A stock drill of exactly this size (within 0.02 mm) in the shop's series."""
    for d in drills(series):
        if abs(d.diameter_mm - diameter_mm) <= MATCH_MM:
            return d
    return None


def _round_size(d: Drill) -> bool:
    if d.series == "metric":
        return abs(d.diameter_mm * 2 - round(d.diameter_mm * 2)) < 1e-9
    if d.series == "fractional":
        return abs(d.diameter_in * 32 - round(d.diameter_in * 32)) < 1e-9
    return True


def pilot_drill(diameter_mm: float, series: tuple[str, ...]) -> Drill:
    """A pilot about a third of the drill from the shop's sets, on round sizes."""
    target = max(diameter_mm * PILOT_FRACTION, PILOT_MIN_MM)
    have = drills(series)
    pool = ([d for d in have if d.series in ("metric", "fractional") and _round_size(d)]
            or [d for d in have if _round_size(d)] or have)
    under = [d for d in pool if d.diameter_mm <= target + 1e-9]
    return under[-1] if under else pool[0]


def largest_drill_under(diameter_mm: float, series: tuple[str, ...]) -> Drill | None:
    """The largest stock drill clearly smaller than the size (not a float twin of it)."""
    under = [d for d in drills(series) if d.diameter_mm < diameter_mm - MATCH_MM]
    return under[-1] if under else None


def needs_pilot(diameter_mm: float, units: str) -> bool:
    return diameter_mm > PILOT_ABOVE_MM[units] + 1e-9


@dataclass(frozen=True)
class Cutter:
    """How one hole is made: a stock drill, a drill opened up, or a cutter for large holes."""

    method: str  # drill | open_up | cut
    drill: Drill | None  # the twist drill (the under-size one when opening up)
    tool: str  # the finishing tool's words (open_up / cut)
    note: str = ""


def cutter_for(diameter_mm: float, drill_name: str | None, depth_mm: float, through: bool,
               material_class: str, series: tuple[str, ...], units: str) -> Cutter:
    """The cutter a shop uses for a hole of this size, depth and material."""
    if drill_name:
        d = next((x for x in drills(series) + drills(("fractional", "number", "letter", "metric"))
                  if x.name == drill_name and abs(x.diameter_mm - diameter_mm) <= MATCH_MM), None)
        if d is None:
            d = find_drill(drill_name)
        return Cutter("drill", d, d.label(units))
    metal = material_class == "metal"
    under = largest_drill_under(diameter_mm, series)
    if under is not None and under.diameter_mm >= OPEN_UP_FRACTION * diameter_mm:
        tool = "a boring head or a reamer" if metal else "a reamer, step drill or boring head"
        return Cutter("open_up", under, tool, "no stock drill of that size")
    return Cutter("cut", None, large_hole_tool(diameter_mm, depth_mm, through, material_class, units),
                  "larger than the stock drills")


def large_hole_tool(diameter_mm: float, depth_mm: float, through: bool, material_class: str,
                    units: str = "mm") -> str:
    """Words for the cutter of a hole larger than the stock drills.

    Aluminium and other metals: never a Forstner or spade bit (made for wood and plastics);
    a hole saw only through a wall it cuts in one pass; else an annular cutter where its
    depth and size reach, else a boring head on a mill or a lathe. Plastics and wood:
    Forstner bit (blind or through), hole saw through a wall it reaches."""
    from generators.units import format_length

    L = lambda mm: format_length(mm, units, fractions=False)  # noqa: E731
    if material_class == "metal":
        if through and depth_mm <= HOLE_SAW_DEPTH_MM:
            return (f"a bi-metal hole saw (through {L(depth_mm)}, within its about"
                    f" {L(HOLE_SAW_DEPTH_MM)} depth of cut), then a boring head to size;"
                    " or a boring head on a mill or a lathe")
        if depth_mm <= ANNULAR_DEPTH_MM and diameter_mm <= ANNULAR_MAX_DIAMETER_MM:
            return ("an annular cutter in a mill or magnetic drill (to about"
                    f" {L(ANNULAR_DEPTH_MM)} deep), or a boring head on a mill or a lathe,"
                    " after a pilot")
        return "a boring head on a mill, or a lathe, after a pilot drill; flat bottom" if not through \
            else "a boring head on a mill, or a lathe, after a pilot drill"
    bit = forstner_words(diameter_mm, units)
    if through and depth_mm <= HOLE_SAW_DEPTH_MM:
        return f"{bit}, or a hole saw (its pilot in the centre mark) and a boring head to size"
    if through:
        return f"{bit} (drill from both faces if it does not reach), or a boring head or lathe"
    return f"{bit} (on a bit extension if it does not reach; flat bottom), or a boring head on a mill"


# Forstner bits are sold in 1/16 in steps in inch sets and 1 mm steps in metric ones
# (common practice, from memory; some sets skip sizes).
FORSTNER_STEP_MM = {"in": 25.4 / 16, "mm": 1.0}


def forstner_words(diameter_mm: float, units: str) -> str:
    """The Forstner bit for a hole: the size itself when one is made, else the sizes either side."""
    import math

    from generators.units import format_length

    step = FORSTNER_STEP_MM["in" if units == "in" else "mm"]
    L = lambda mm: format_length(mm, units)  # noqa: E731  fractions for inch bits
    n = diameter_mm / step
    if abs(n - round(n)) * step <= MATCH_MM:
        return f"a {L(round(n) * step)} Forstner bit"
    under, over = math.floor(n) * step, math.ceil(n) * step
    exact = format_length(diameter_mm, units, fractions=False)
    return (f"a {L(under)} Forstner bit opened to {exact} with a boring head ({exact} is not a common"
            f" Forstner size; the next, {L(over)}, is {format_length(over - diameter_mm, units, fractions=False)}"
            " over)")
