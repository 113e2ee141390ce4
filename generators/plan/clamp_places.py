"""Which gaps between sockets take the mast clamp screws.

Two clamp screws go 90 deg apart: together they push the mast into the wall opposite them,
where it seats on two lines (common practice for clamping a round part in a bore). Three go
120 deg apart; more are spread evenly. A clamp hole can only enter through a flat, chamfer
or rim gap between sockets, so each ideal azimuth takes the nearest such gap still free.
"""

from __future__ import annotations

# Spacing of the clamp screws by count (common practice); others: 360 / count.
SPACING_DEG = {2: 90.0, 3: 120.0}


def _apart(a: float, b: float) -> float:
    return abs(((a - b + 180) % 360) - 180)


def choose_azimuths(free: list[float], count: int, first: float) -> tuple[list[float], str]:
    """``count`` azimuths from ``free`` nearest ``first``, ``first + spacing``, ...; and a
    note saying what was chosen (empty for a single screw)."""
    spacing = SPACING_DEG.get(count, 360.0 / count)
    left = list(free)
    chosen = []
    for k in range(count):
        ideal = (first + k * spacing) % 360
        best = min(left, key=lambda a: (round(_apart(a, ideal), 6), a))
        left.remove(best)
        chosen.append(best)
    if count == 1:
        return chosen, ""
    steps = [_apart(chosen[k], chosen[k - 1]) for k in range(1, count)]
    exact = all(abs(s - spacing) < 1e-6 for s in steps)
    at = ", ".join(f"{a % 360:g}" for a in chosen)
    why = ("so they push the mast into the opposite wall" if count == 2 else "spread round the mast")
    if exact:
        return chosen, f"clamp screws at {at} deg: {spacing:g} deg apart, {why}"
    return chosen, (f"clamp screws at {at} deg: the flats or chamfers between sockets nearest to"
                    f" {spacing:g} deg apart ({why}); [mast_clamp] azimuths sets them")
