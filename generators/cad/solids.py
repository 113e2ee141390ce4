"""CadQuery solids built from a HubPlan: the body, then one boolean cut of every hole."""

from __future__ import annotations

import math

import cadquery as cq

from generators.errors import KernelError
from generators.plan.model import Body, Hole, HubPlan


def _vec(p) -> cq.Vector:
    return cq.Vector(float(p[0]), float(p[1]), float(p[2]))


def body_solid(body: Body) -> cq.Solid:
    """The uncut body: a prism from the outline, or a true cylinder for a puck."""
    if body.style == "puck" or (body.style == "plate" and body.diameter_mm is not None):
        return cq.Solid.makeCylinder(body.diameter_mm / 2, body.thickness_mm)
    wp = cq.Workplane("XY").polyline([(float(x), float(y)) for x, y in body.outline]).close()
    return wp.extrude(body.thickness_mm).val()


def hole_cutters(hole: Hole) -> list[cq.Solid]:
    """Cutter solids for one hole: the drilled cylinder plus the clearance before its thread,
    countersink or counterbore."""
    axis = _vec(hole.axis).normalized()
    entry = _vec(hole.entry_mm)
    start = entry - axis * hole.lead_mm
    length = hole.lead_mm + hole.depth_mm + hole.extend_mm
    if hole.profile == "hex":
        return [_hex_slot(hole)]
    if hole.profile == "teardrop":
        cutters = [_teardrop(hole, start, axis, length)]
    else:
        cutters = [cq.Solid.makeCylinder(hole.radius_mm, length, start, axis)]
    if hole.point_deg is not None:
        tip = hole.radius_mm / math.tan(math.radians(hole.point_deg / 2))
        cutters.append(cq.Solid.makeCone(hole.radius_mm, 0.0, tip, start + axis * length, axis))
    if hole.countersink is not None:
        cs = hole.countersink
        half = math.radians(cs.angle_deg / 2)
        depth = (cs.diameter_mm / 2 - hole.radius_mm) / math.tan(half)
        r_top = cs.diameter_mm / 2 + hole.lead_mm * math.tan(half)
        cutters.append(cq.Solid.makeCone(r_top, hole.radius_mm, hole.lead_mm + depth, start, axis))
    run = hole.tapped
    if run is not None and run.clear_mm is not None and run.start_mm > 0:
        # the unthreaded part before the thread, opened to the screw's clearance
        cutters.append(cq.Solid.makeCylinder(run.clear_mm / 2, hole.lead_mm + run.start_mm, start, axis))
    if hole.counterbore is not None:
        cb = hole.counterbore
        cutters.append(cq.Solid.makeCylinder(cb.diameter_mm / 2, hole.lead_mm + cb.depth_mm, start, axis))
    return cutters


def _prism(points3d: list[cq.Vector], extrude: cq.Vector, edges: list[cq.Edge] | None = None) -> cq.Solid:
    wire = cq.Wire.assembleEdges(edges) if edges else cq.Wire.makePolygon(points3d, close=True)
    return cq.Solid.extrudeLinear(cq.Face.makeFromWires(wire), extrude)


def _teardrop(hole: Hole, start: cq.Vector, axis: cq.Vector, length: float) -> cq.Solid:
    """A round hole whose upper half is a 45 deg roof towards ``roof_up`` (cut flat at roof_mm)."""
    up = _vec(hole.roof_up).normalized()
    side = up.cross(axis).normalized()
    r, apex = hole.radius_mm, hole.radius_mm * math.sqrt(2.0)
    at = lambda x, y: start + side * x + up * y  # noqa: E731
    c45 = r * math.sqrt(0.5)
    right, left, low = at(c45, c45), at(-c45, c45), at(0.0, -r)
    edges = [cq.Edge.makeThreePointArc(right, low, left)]
    if hole.roof_mm >= apex - 1e-9:
        top = at(0.0, apex)
        edges += [cq.Edge.makeLine(left, top), cq.Edge.makeLine(top, right)]
    else:
        half = apex - hole.roof_mm
        tl, tr = at(-half, hole.roof_mm), at(half, hole.roof_mm)
        edges += [cq.Edge.makeLine(left, tl), cq.Edge.makeLine(tl, tr), cq.Edge.makeLine(tr, right)]
    return _prism([], axis * length, edges)


def _hex_slot(hole: Hole) -> cq.Solid:
    """A nut pocket: the hexagon and the slot it slides in by, as one prism along the screw axis."""
    from generators.plan.printed import hex_slot_outline

    axis = _vec(hole.axis).normalized()
    s = _vec(hole.slot_dir).normalized()
    w = axis.cross(s).normalized()
    entry = _vec(hole.entry_mm)
    pts = [entry + s * x + w * y for x, y in hex_slot_outline(hole)]
    return _prism(pts, axis * hole.depth_mm)


def hub_solid(plan: HubPlan) -> cq.Solid:
    """The finished hub as one solid."""
    body = body_solid(plan.body)
    try:
        cutters = [c for h in plan.holes for c in hole_cutters(h)]
        result = body.cut(*cutters).clean()
        return single_solid(result, "hub")
    except Exception:  # the kernel raises bare StdFail/OCP errors: find the hole that fails
        pass
    shape = body
    for h in plan.holes:
        try:
            shape = single_solid(shape.cut(*hole_cutters(h)).clean(), f"hole {h.id}")
        except Exception as exc:
            raise KernelError(f"hole {h.id}", f"the CAD kernel failed cutting this {h.kind} hole"
                              f" ({type(exc).__name__})", "a bug: please report it with the saved config") from None
    return shape


def single_solid(shape, feature: str) -> cq.Solid:
    """The one valid solid of a boolean result, or a KernelError naming the feature."""
    solids = shape.Solids()
    if len(solids) != 1 or not solids[0].isValid():
        raise KernelError(feature, f"the cut {feature} came out as {len(solids)} solid(s)"
                        f"{'' if solids and solids[0].isValid() else ', not valid'}",
                        "a bug: please report it with the saved config")
    return solids[0]
