"""Build writer for the whole frame in 3D: assembly.step, the hub with a mast stub, every
spreader as a tube from its stop to its cut end, and the wires between tips.

It renders the design's FramePlan only (tube end points, diameters, wire chords); the
hub solid comes from the same plan through generators.cad.solids.
"""

from __future__ import annotations

import cadquery as cq

from generators.cad.export import write_step
from generators.cad.solids import hub_solid
from generators.units import format_both

ASSEMBLY = "assembly.step"
# A wire drawn 2 mm across when loads.wire_diameter is not given (only for the picture).
SHOWN_WIRE_MM = 2.0


def _rod(start, end, diameter: float, inner: float | None = None) -> cq.Solid:
    a, b = cq.Vector(*start), cq.Vector(*end)
    d = b - a
    rod = cq.Solid.makeCylinder(diameter / 2, d.Length, a, d.normalized())
    if inner:
        rod = rod.cut(cq.Solid.makeCylinder(inner / 2, d.Length, a, d.normalized()))
    return rod


def write_assembly(ctx) -> None:
    """assembly.step; ctx.manifest["assembly"] (its parts and the tip points)."""
    from generators.plan.loads import pole_bore_mm

    frame = ctx.design.frame
    if frame is None:
        ctx.manifest["assembly"] = None
        return
    cfg = ctx.config
    parts = [hub_solid(ctx.plan)]
    if ctx.plan.split is not None:  # the two halves in place
        from generators.cad.split import half_solids

        parts = [solid for _, solid in half_solids(ctx.plan, parts[0])]
    mast_id = max(frame.mast_od_mm - 2 * max(frame.mast_od_mm * 0.08, 1.5), 0.0)  # a tube, drawn only
    parts.append(_rod((0, 0, frame.mast_bottom_mm), (0, 0, frame.mast_top_mm), frame.mast_od_mm, mast_id))
    for t in frame.tubes:
        inner = pole_bore_mm(cfg, t.diameter_mm)
        parts.append(_rod(t.start_mm, t.end_mm, t.diameter_mm, inner))
    wire_d = cfg.loads.wire_diameter or SHOWN_WIRE_MM
    for w in frame.wires:
        parts.append(_rod(w.start_mm, w.end_mm, wire_d))
    write_step(cq.Compound.makeCompound(parts), ctx.folder / ASSEMBLY)
    ctx.manifest["assembly"] = {
        "file": ASSEMBLY,
        "parts": ["hub", "mast stub"] + [f"spreader {t.spreader}" for t in frame.tubes]
                 + [f"wire {w.a}-{w.b}" for w in frame.wires],
        "tubes": [{"spreader": t.spreader, "start_mm": [round(v, 3) for v in t.start_mm],
                   "end_mm": [round(v, 3) for v in t.end_mm], "tip_mm": [round(v, 3) for v in t.tip_mm],
                   "diameter_mm": round(t.diameter_mm, 3), "length_mm": round(t.length_mm, 3)}
                  for t in frame.tubes],
        "wire_shown_diameter_mm": round(wire_d, 3),
    }
    ctx.summary.append(f"  frame  {ASSEMBLY}: hub, mast stub, {len(frame.tubes)} spreaders to tips"
                       f" {format_both(frame.tip_radius_mm, cfg.units)} from the mast"
                       + (f", {len(frame.wires)} wires" if frame.wires else ""))
