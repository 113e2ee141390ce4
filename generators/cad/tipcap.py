"""The spreader tip cap as a solid, standing on its closed end."""

from __future__ import annotations

import cadquery as cq

from generators.cad.solids import hole_cutters, single_solid
from generators.plan.tipcap import TipCapPlan


def tip_cap_solid(cap: TipCapPlan) -> cq.Solid:
    body = cq.Solid.makeCylinder(cap.outer_diameter_mm / 2, cap.length_mm)
    bore = cq.Solid.makeCylinder(cap.modelled_bore_mm / 2, cap.depth_mm + 1.0,
                                 cq.Vector(0, 0, cap.end_thickness_mm), cq.Vector(0, 0, 1))
    return single_solid(body.cut(bore, *hole_cutters(cap.cord_hole)).clean(), "tip cap")
