"""Shop work for the mast pin: the words for its hole, and drilling the mast through it.

The hub's pin hole is drilled like any other hole (plan/operations.py: long series, or
half from each face where the reach rules say). The mast is then drilled in place through
that hole with the hub at its final height and orientation, so the two holes line up
(match drilling, common practice), with the same clearance drill.
"""

from __future__ import annotations

import math
from dataclasses import replace

from generators.plan.kinds import HoleKind


def pin_why(h) -> str:
    return "through-bolt clearance" if h.kind == HoleKind.PIN else ""


def pin_breaks_into(h) -> str:
    if h.kind != HoleKind.PIN:
        return ""
    return f"crosses the bore and leaves the {h.exit_face} face opposite, at the same height"


def match_drill_rows(face, holes) -> None:
    """Add the match-drilling step for a pin entering ``face`` (an operations ``_Face``)."""
    from generators.plan.shop import drill_label

    for h in (x for x in holes if x.kind == HoleKind.PIN):
        plan, L = face.plan, face.L
        r_e = math.hypot(h.entry_mm[0], h.entry_mm[1])
        sleeve = " (and the sleeve, when one is fitted)" if face.cfg.reducers else ""
        reach = r_e + plan.mast_od_mm / 2
        dia = h.diameter_mm - h.compensation_mm
        tool = drill_label(h.drill, dia, face.units) if h.drill else L(dia)
        clamps = [x for x in plan.holes if x.kind == HoleKind.CLAMP]
        if clamps:
            where = ", ".join(f"{c.id} on {c.face}" for c in clamps)
            hold = f"the clamp screws ({where}) fitted and snug"
        else:
            hold = "held there with a hose clamp or tape wrapped on the mast under it"
        note = (f"last of all, once every hole of the hub on every face is made: the mast through the hub to"
                f" its top face, hub at its final height and orientation (spreader 1 where it will point),"
                f" {hold}; drill the mast{sleeve} through the hub's pin hole, the hub guiding the drill"
                f" (match drilling, common practice): through both mast walls from this face, {L(reach)} from"
                f" the face to the far wall, or through the near wall from each face if the drill does not"
                f" reach; a drill for steel or aluminium at low speed with cutting fluid; deburr, then fit the"
                f" bolt; drill on the ground with the mast lowered, never up the mast")
        far = face.reach(dia, replace(h, depth_mm=reach, through=False)) if hasattr(face, "reach") else ""
        note += f"; {far}" if far else ""
        face.add("match_drill", [h], tool, dia, reach, note=note)  # the holes stage, last


def exit_rows(face) -> list:
    """The far end of each pin leaving ``face`` (an operations ``_Face``): punched from this
    face's template, and drilled from here when the pin is too long for one drill. Returns
    the exit holes (for the face's centre-punch step); the drill rows are added here."""
    from generators.plan.pin import exits_on
    from generators.plan.shop import drill_label

    exits = exits_on(face.plan, face.face)
    for x in exits:
        pin = x.id[: -len("-exit")]
        dia = x.diameter_mm - x.compensation_mm
        tool = drill_label(x.drill, dia, face.units) if x.drill else face.L(dia)
        half = x.depth_mm / 2
        reach = face.reach(dia, replace(x, depth_mm=half, through=False))
        face.add("drill", [x], tool, dia, half, False, note=(
            f"where {pin} comes out: only when {pin}'s step on the {x.exit_face} face says to drill half from"
            f" each face, drill {face.L(half)} from here to meet it" + (f" ({reach})" if reach else "")
            + "; otherwise the drill comes out here: clamp a scrap block on this face so the exit does not"
            " break out"))
    return exits
