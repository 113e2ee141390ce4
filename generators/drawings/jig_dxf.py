"""The angle jig's drawing: jig.dxf, side and top view with dimensions, 1:1 in the config's units."""

from __future__ import annotations

from pathlib import Path

from generators.drawings.dxf import stable_classes
from generators.plan.jig import JigPlan
from generators.units import MM_PER_IN, format_length


def write_jig_drawing(ctx) -> None:
    """jig.dxf (and jig-<angle>deg.dxf) for each angle jig of the design."""
    jigs = ctx.design.jigs or ((ctx.design.jig,) if ctx.design.jig is not None else ())
    for jig in jigs:
        write_jig_dxf(jig, ctx.folder / f"{jig.stem}.dxf", ctx.config.units)


def write_jig_dxf(jig: JigPlan, path: Path, units: str) -> None:
    """Side view (the profile) and top view (footprint) with their dimensions, 1:1 in the
    config's units (``$INSUNITS`` set).

    Written with ezdxf's fixed metadata (no creation times), so two builds give the same bytes.
    """
    import ezdxf

    before = ezdxf.options.write_fixed_meta_data_for_testing
    ezdxf.options.write_fixed_meta_data_for_testing = True
    try:
        _jig_dxf(jig, path, units)
    finally:
        ezdxf.options.write_fixed_meta_data_for_testing = before


def _jig_dxf(jig: JigPlan, path: Path, cfg_units: str) -> None:
    import ezdxf
    from ezdxf import units

    k = 1.0 / MM_PER_IN if cfg_units == "in" else 1.0
    code = units.IN if cfg_units == "in" else units.MM
    doc = ezdxf.new("R2010", setup=True)
    doc.units = code
    doc.header["$INSUNITS"] = code
    doc.header["$MEASUREMENT"] = 0 if cfg_units == "in" else 1
    for name, color in (("OUTLINE", 7), ("DIMENSIONS", 1), ("NOTES", 3)):
        doc.layers.add(name, color=color)
    msp = doc.modelspace()
    prof = [(float(y) * k, float(z) * k) for y, z in jig.profile]
    gap = (lambda mm: mm * k)
    msp.add_lwpolyline(prof, close=True, dxfattribs={"layer": "OUTLINE"})
    f3, base_end, top_end, s0, f1, f2 = prof
    dim = {"layer": "DIMENSIONS"}
    st = "EZDXF"
    ov = {"dimscale": k, "dimdec": 3 if cfg_units == "in" else 1}
    msp.add_linear_dim(base=(0, gap(-12)), p1=f3, p2=base_end, dimstyle=st, override=ov, dxfattribs=dim).render()
    msp.add_linear_dim(base=(base_end[0] + gap(15), 0), p1=base_end, p2=top_end, angle=90, dimstyle=st, override=ov,
                       dxfattribs=dim).render()
    msp.add_linear_dim(base=(f3[0] - gap(15), 0), p1=(s0[0], 0.0), p2=s0, angle=90, dimstyle=st, override=ov,
                       dxfattribs=dim).render()
    msp.add_aligned_dim(p1=s0, p2=top_end, distance=gap(12), dimstyle=st, override=ov, dxfattribs=dim).render()
    msp.add_aligned_dim(p1=s0, p2=f1, distance=gap(-8), dimstyle=st, override=ov, dxfattribs=dim).render()
    msp.add_aligned_dim(p1=f1, p2=f2, distance=gap(8), dimstyle=st, override=ov, dxfattribs=dim).render()
    msp.add_angular_dim_3p(base=(top_end[0] * 0.55, s0[1] + 0.45 * (top_end[1] - s0[1]) * 0.5),
                           center=s0, p1=(top_end[0], s0[1]), p2=top_end, dimstyle=st, override=ov,
                           dxfattribs=dim).render()
    msp.add_line(s0, (top_end[0], s0[1]), dxfattribs={"layer": "DIMENSIONS", "linetype": "DASHED"})
    # top view below the side view
    y_top = gap(-40) - jig.width_mm * k
    msp.add_lwpolyline([(f3[0], y_top), (base_end[0], y_top), (base_end[0], y_top + jig.width_mm * k),
                        (f3[0], y_top + jig.width_mm * k)], close=True, dxfattribs={"layer": "OUTLINE"})
    fence_in = f2[0] + jig.fence_thickness_mm * k
    msp.add_line((fence_in, y_top), (fence_in, y_top + jig.width_mm * k), dxfattribs={"layer": "OUTLINE"})
    msp.add_linear_dim(base=(base_end[0] + gap(15), 0), p1=(base_end[0], y_top),
                       p2=(base_end[0], y_top + jig.width_mm * k), angle=90, dimstyle=st, override=ov, dxfattribs=dim).render()
    notes = [f"ANGLE JIG: wedge {jig.wedge_angle_deg:g} deg, width {format_length(jig.width_mm, cfg_units, False)}"
             f" (drawing 1:1 in {'inches' if cfg_units == 'in' else 'millimetres'})",
             "Lay the hub on the flat opposite the socket, bottom face against the fence;",
             "the socket axis is then vertical under the drill. Clamp the jig to the table.",
             f"Config units: {cfg_units}."]
    for i, text in enumerate(notes):
        msp.add_text(text, height=gap(3.5), dxfattribs={"layer": "NOTES"}).set_placement(
            (f3[0], y_top - gap(12 + 6 * i)))
    stable_classes(doc)
    doc.saveas(path)
