"""CadQuery solids built from a HubPlan: the body, then one boolean cut of every hole."""

from __future__ import annotations

import math

import cadquery as cq

from generators.errors import UserError
from generators.plan.model import Body, Hole, HubPlan


def _vec(p) -> cq.Vector:
    return cq.Vector(float(p[0]), float(p[1]), float(p[2]))


def body_solid(body: Body) -> cq.Solid:
    """The uncut body: a prism from the outline, or a true cylinder for a puck."""
    if body.style == "puck":
        return cq.Solid.makeCylinder(body.diameter_mm / 2, body.thickness_mm)
    wp = cq.Workplane("XY").polyline([(float(x), float(y)) for x, y in body.outline]).close()
    return wp.extrude(body.thickness_mm).val()


def hole_cutters(hole: Hole) -> list[cq.Solid]:
    """Cutter solids for one hole: the drilled cylinder plus countersink or counterbore."""
    axis = _vec(hole.axis).normalized()
    entry = _vec(hole.entry_mm)
    start = entry - axis * hole.lead_mm
    length = hole.lead_mm + hole.depth_mm + hole.extend_mm
    cutters = [cq.Solid.makeCylinder(hole.radius_mm, length, start, axis)]
    if hole.countersink is not None:
        cs = hole.countersink
        half = math.radians(cs.angle_deg / 2)
        depth = (cs.diameter_mm / 2 - hole.radius_mm) / math.tan(half)
        r_top = cs.diameter_mm / 2 + hole.lead_mm * math.tan(half)
        cutters.append(cq.Solid.makeCone(r_top, hole.radius_mm, hole.lead_mm + depth, start, axis))
    if hole.counterbore is not None:
        cb = hole.counterbore
        cutters.append(cq.Solid.makeCylinder(cb.diameter_mm / 2, hole.lead_mm + cb.depth_mm, start, axis))
    return cutters


def hub_solid(plan: HubPlan) -> cq.Solid:
    """The finished hub as one solid."""
    body = body_solid(plan.body)
    cutters = [c for h in plan.holes for c in hole_cutters(h)]
    try:
        result = body.cut(*cutters).clean()
    except Exception as exc:  # the kernel raises bare StdFail/OCP errors
        raise UserError("hub", f"the CAD kernel failed while cutting the holes ({type(exc).__name__})",
                        "report it with the config written beside the output") from None
    return single_solid(result, "hub")


def single_solid(shape, feature: str) -> cq.Solid:
    solids = shape.Solids()
    if len(solids) != 1 or not solids[0].isValid():
        raise UserError(feature, f"the cut {feature} came out as {len(solids)} solid(s)"
                        f"{'' if solids and solids[0].isValid() else ', not valid'}",
                        "report it with the config written beside the output")
    return solids[0]
