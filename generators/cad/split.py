"""The halves of a split hub: the cut hub solid (every hole, the bolts' too) taken on each
side of the gap by a half-space box. The gap is what lies between the two boxes."""

from __future__ import annotations

import math

import cadquery as cq

from generators.cad.solids import single_solid
from generators.plan.model import HubPlan


def half_box(plan: HubPlan, side: int) -> cq.Solid:
    """The half-space beyond ``side * gap / 2`` along the split normal, as a box holding the
    whole body (``side`` -1: half A, +1: half B)."""
    sp = plan.split
    T, R = plan.body.thickness_mm, plan.body.corner_radius_mm
    big, over = 2 * R + 20.0, 5.0
    y0 = sp.gap_mm / 2 if side > 0 else -sp.gap_mm / 2 - big
    box = cq.Solid.makeBox(2 * big, big, T + 2 * over, pnt=cq.Vector(-big, y0, -over))
    # the box's +Y is the split normal: turn +Y onto (-sin a, cos a), a the plane's azimuth
    angle = math.degrees(math.atan2(-sp.normal[0], sp.normal[1]))
    return box.rotate(cq.Vector(0, 0, 0), cq.Vector(0, 0, 1), angle)


def half_solids(plan: HubPlan, hub: cq.Shape) -> list[tuple[str, cq.Solid]]:
    """(name, solid) of each half of the cut hub, in the plan's order (hub-a, hub-b)."""
    out = []
    for half in plan.split.halves:
        solid = single_solid(hub.intersect(half_box(plan, half.side)).clean(), half.name)
        out.append((half.name, solid))
    return out


def assembled(halves: list[tuple[str, cq.Solid]]) -> cq.Compound:
    """Both halves in place, the gap open: what hub.* holds for a split hub."""
    return cq.Compound.makeCompound([s for _, s in halves])
