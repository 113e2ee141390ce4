"""The angle jig as a solid (STEP/STL); its drawing is generators/drawings/jig_dxf.py."""

from __future__ import annotations

import cadquery as cq

from generators.cad.solids import single_solid
from generators.plan.jig import JigPlan


def jig_solid(jig: JigPlan) -> cq.Solid:
    """The side profile in the YZ plane at X = -width/2, extruded along +X."""
    x0 = -jig.width_mm / 2
    pts = [cq.Vector(x0, float(y), float(z)) for y, z in jig.profile]
    face = cq.Face.makeFromWires(cq.Wire.makePolygon(pts, close=True))
    return single_solid(cq.Solid.extrudeLinear(face, cq.Vector(jig.width_mm, 0, 0)), "jig")
