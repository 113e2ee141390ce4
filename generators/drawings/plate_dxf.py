"""Build writer for a plate hub's cutting drawing: plate.dxf, the plate's outline and its
holes at 1:1 in the config's units, for a laser, waterjet or bandsaw and a drill press.

Seen from the top face (the poles' side), the origin at the plate's centre. Layers: ``CUT``
the outline (one closed polyline, or a circle for a round plate), ``DRILL`` one circle a
hole at its drill diameter, ``CENTERS`` a cross on each, ``MARKS`` the plan's scribe lines
(pole stops and footprints, the mast's line) and ``TEXT`` the ids. Manifest: ``plate_dxf``.
"""

from __future__ import annotations

from generators.units import MM_PER_IN

FILE = "plate.dxf"
CUT, DRILL, CENTERS, MARKS, TEXT = "CUT", "DRILL", "CENTERS", "MARKS", "TEXT"
COLORS = {CUT: 7, DRILL: 1, CENTERS: 8, MARKS: 3, TEXT: 8}
CROSS_MM = 3.0  # centre-cross arms past the hole circle


def write_plate_dxf(ctx) -> None:
    if ctx.design.plate is None:
        return
    import ezdxf

    from generators.drawings.dxf import INSUNITS, MEASUREMENT, _fixed_metadata, stable_classes

    plan, units = ctx.plan, ctx.config.units
    k = 1.0 / MM_PER_IN if units == "in" else 1.0
    P = lambda p: (p[0] * k, p[1] * k)  # noqa: E731
    top = plan.face("top")
    with _fixed_metadata():
        doc = ezdxf.new("R2010", setup=True)
        doc.header["$INSUNITS"] = INSUNITS[units]
        doc.header["$MEASUREMENT"] = MEASUREMENT[units]
        for name, color in COLORS.items():
            doc.layers.add(name, color=color)
        msp = doc.modelspace()
        body = plan.body
        if body.diameter_mm is not None:
            msp.add_circle((0.0, 0.0), body.diameter_mm / 2 * k, dxfattribs={"layer": CUT})
        else:
            msp.add_lwpolyline([P(p) for p in body.outline], close=True, dxfattribs={"layer": CUT})
        holes = {}
        for h in plan.holes_on("top"):
            u, v = top.to_face(h.entry_mm)
            holes[h.id] = [round(u, 6), round(v, 6)]
            msp.add_circle(P((u, v)), h.radius_mm * k, dxfattribs={"layer": DRILL})
            a = h.radius_mm + CROSS_MM
            msp.add_line(P((u - a, v)), P((u + a, v)), dxfattribs={"layer": CENTERS})
            msp.add_line(P((u, v - a)), P((u, v + a)), dxfattribs={"layer": CENTERS})
            t = msp.add_text(h.id, height=2.0 * k, dxfattribs={"layer": TEXT})
            t.set_placement(P((u + a, v + 1.0)))
        for m in plan.marks:
            if m.face != "top":
                continue
            a, b = top.to_face(m.a), top.to_face(m.b)
            attrs = {"layer": MARKS}
            if m.dashed:
                attrs.update(linetype="DASHED", ltscale=0.5 * k)
            msp.add_line(P(a), P(b), dxfattribs=attrs)
            if m.label:
                t = msp.add_text(m.label, height=2.0 * k, dxfattribs={"layer": TEXT})
                t.set_placement(P((b[0] + 1.0, b[1] + 1.0)))
        stable_classes(doc)
        doc.saveas(ctx.folder / FILE)
    ctx.manifest["plate_dxf"] = {
        "file": FILE, "units": units, "seen_from": "top face", "layers": list(COLORS),
        "outline": "circle" if body.diameter_mm is not None else "polyline",
        "holes": holes,
    }
    ctx.summary.append(f"  plate  {FILE}: outline ({CUT}) and {len(holes)} holes ({DRILL}) at 1:1 ({units}),"
                       " for cutting and the drill press")
