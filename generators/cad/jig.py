"""The angle jig as a solid (STEP/STL) and a dimensioned side-view outline (DXF)."""

from __future__ import annotations

from pathlib import Path

import cadquery as cq

from generators.cad.solids import single_solid
from generators.plan.jig import JigPlan


def jig_solid(jig: JigPlan) -> cq.Solid:
    """The side profile in the YZ plane at X = -width/2, extruded along +X."""
    x0 = -jig.width_mm / 2
    pts = [cq.Vector(x0, float(y), float(z)) for y, z in jig.profile]
    face = cq.Face.makeFromWires(cq.Wire.makePolygon(pts, close=True))
    return single_solid(cq.Solid.extrudeLinear(face, cq.Vector(jig.width_mm, 0, 0)), "jig")


def write_jig_dxf(jig: JigPlan, path: Path, units_note: str) -> None:
    """Side view (the profile) and top view (footprint) with their dimensions, 1:1 in mm.

    Written with ezdxf's fixed metadata (no creation times), so two builds give the same bytes.
    """
    import ezdxf

    before = ezdxf.options.write_fixed_meta_data_for_testing
    ezdxf.options.write_fixed_meta_data_for_testing = True
    try:
        _jig_dxf(jig, path, units_note)
    finally:
        ezdxf.options.write_fixed_meta_data_for_testing = before


def _jig_dxf(jig: JigPlan, path: Path, units_note: str) -> None:
    import ezdxf
    from ezdxf import units

    doc = ezdxf.new("R2010", setup=True)
    doc.units = units.MM
    doc.header["$INSUNITS"] = units.MM
    for name, color in (("OUTLINE", 7), ("DIMENSIONS", 1), ("NOTES", 3)):
        doc.layers.add(name, color=color)
    msp = doc.modelspace()
    prof = [(float(y), float(z)) for y, z in jig.profile]
    msp.add_lwpolyline(prof, close=True, dxfattribs={"layer": "OUTLINE"})
    f3, base_end, top_end, s0, f1, f2 = prof
    dim = {"layer": "DIMENSIONS"}
    st = "EZDXF"
    msp.add_linear_dim(base=(0, -12), p1=f3, p2=base_end, dimstyle=st, dxfattribs=dim).render()
    msp.add_linear_dim(base=(base_end[0] + 15, 0), p1=base_end, p2=top_end, angle=90, dimstyle=st,
                       dxfattribs=dim).render()
    msp.add_linear_dim(base=(f3[0] - 15, 0), p1=(s0[0], 0.0), p2=s0, angle=90, dimstyle=st,
                       dxfattribs=dim).render()
    msp.add_aligned_dim(p1=s0, p2=top_end, distance=12, dimstyle=st, dxfattribs=dim).render()
    msp.add_aligned_dim(p1=s0, p2=f1, distance=-8, dimstyle=st, dxfattribs=dim).render()
    msp.add_aligned_dim(p1=f1, p2=f2, distance=8, dimstyle=st, dxfattribs=dim).render()
    msp.add_angular_dim_3p(base=(top_end[0] * 0.55, s0[1] + 0.45 * (top_end[1] - s0[1]) * 0.5),
                           center=s0, p1=(top_end[0], s0[1]), p2=top_end, dimstyle=st,
                           dxfattribs=dim).render()
    msp.add_line(s0, (top_end[0], s0[1]), dxfattribs={"layer": "DIMENSIONS", "linetype": "DASHED"})
    # top view below the side view
    y_top = -40 - jig.width_mm
    msp.add_lwpolyline([(f3[0], y_top), (base_end[0], y_top), (base_end[0], y_top + jig.width_mm),
                        (f3[0], y_top + jig.width_mm)], close=True, dxfattribs={"layer": "OUTLINE"})
    fence_in = f2[0] + jig.fence_thickness_mm
    msp.add_line((fence_in, y_top), (fence_in, y_top + jig.width_mm), dxfattribs={"layer": "OUTLINE"})
    msp.add_linear_dim(base=(base_end[0] + 15, 0), p1=(base_end[0], y_top),
                       p2=(base_end[0], y_top + jig.width_mm), angle=90, dimstyle=st, dxfattribs=dim).render()
    notes = [f"ANGLE JIG: wedge {jig.wedge_angle_deg:g} deg, width {jig.width_mm:.1f} mm (all sizes mm)",
             "Lay the hub on the flat opposite the socket, bottom face against the fence;",
             "the socket axis is then vertical under the drill. Clamp the jig to the table.",
             units_note]
    for i, text in enumerate(notes):
        msp.add_text(text, height=3.5, dxfattribs={"layer": "NOTES"}).set_placement(
            (f3[0], y_top - 12 - 6 * i))
    from generators.drawings.dxf import stable_classes

    stable_classes(doc)
    doc.saveas(path)
