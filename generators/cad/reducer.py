"""CadQuery solid of a reducer sleeve from its SleevePlan (tube, flange, slit, flat, holes)."""

from __future__ import annotations

import cadquery as cq

from generators.cad.solids import hole_cutters, single_solid
from generators.errors import UserError
from generators.plan.limits import CUT_OVERRUN_MM
from generators.plan.reducer import SleevePlan


def _box_along(azimuth_deg: float, r0: float, r1: float, width: float, z0: float, z1: float) -> cq.Solid:
    """A box from radius r0 to r1 along the azimuth, ``width`` across, z0..z1 high."""
    box = cq.Solid.makeBox(r1 - r0, width, z1 - z0, cq.Vector(r0, -width / 2, z0))
    return box.rotate(cq.Vector(0, 0, 0), cq.Vector(0, 0, 1), azimuth_deg)


def sleeve_solid(sleeve: SleevePlan) -> cq.Solid:
    """The finished sleeve as one solid, in the hub's frame (bottom at z = 0)."""
    body = cq.Solid.makeCylinder(sleeve.od_mm / 2, sleeve.length_mm)
    if sleeve.flange is not None:
        ring = cq.Solid.makeCylinder(sleeve.flange.od_mm / 2, sleeve.flange.thickness_mm,
                                     cq.Vector(0, 0, sleeve.length_mm))
        body = body.fuse(ring).clean()
    lo, hi = -CUT_OVERRUN_MM, sleeve.height_mm + CUT_OVERRUN_MM
    r_in = sleeve.id_mm / 2
    inner: cq.Shape = cq.Solid.makeCylinder(r_in, hi - lo, cq.Vector(0, 0, lo))
    if sleeve.key_flat is not None:
        k = sleeve.key_flat
        # keep only the part of the bore on the mast's side of the flat
        keep = _box_along(k.azimuth_deg, -r_in - 1, k.distance_mm, 2 * r_in + 2, lo - 1, hi + 1)
        inner = inner.intersect(keep)
    cutters = [inner]
    if sleeve.slit is not None:
        outer_r = (sleeve.flange.od_mm if sleeve.flange else sleeve.od_mm) / 2 + CUT_OVERRUN_MM
        cutters.append(_box_along(sleeve.slit.azimuth_deg, r_in * 0.5, outer_r, sleeve.slit.width_mm, lo, hi))
    cutters += [c for h in sleeve.holes for c in hole_cutters(h)]
    try:
        result = body.cut(*cutters).clean()
    except Exception as exc:  # the kernel raises bare StdFail/OCP errors
        raise UserError(sleeve.key, f"the CAD kernel failed while cutting the {sleeve.stem} sleeve"
                        f" ({type(exc).__name__})", "report it with the config") from None
    return single_solid(result, sleeve.stem)


def measured_radii(shape: cq.Shape) -> list[float]:
    """Radii of every cylindrical face of a shape, for checks against the plan."""
    from OCP.BRepAdaptor import BRepAdaptor_Surface

    out = []
    for f in shape.Faces():
        if f.geomType() == "CYLINDER":
            out.append(BRepAdaptor_Surface(f.wrapped).Cylinder().Radius())
    return sorted(set(round(r, 9) for r in out))


__all__ = ["sleeve_solid", "measured_radii"]
