"""Top and rim templates of the reducer sleeves, drawn by the same sheet builder as the hub.

Each sleeve is a small round plan of its own (``generators.plan.sleeve_faces``). The sheets
land in ``templates/sleeve-<mast OD>-<face>.dxf`` and a PDF a sleeve,
``templates/sleeve-<mast OD>.pdf``, with a PNG preview a page.
"""

from __future__ import annotations

from generators.drawings import pages as P
from generators.drawings.sheet import build_sheets
from generators.drawings.writer import FOLDER, paper_for


def write_sleeve_templates(ctx) -> None:
    from generators.drawings.dxf import write_sheet_dxf
    from generators.drawings.pdf import write_pdf
    d = ctx.design
    if not d.sleeve_plans:
        return
    folder = ctx.folder / FOLDER
    folder.mkdir(exist_ok=True)
    cfg = ctx.config
    records = []
    ops = dict(d.sleeve_operations)
    for s, plan in d.sleeve_plans:
        sheets = build_sheets(plan, cfg, ops[s.stem])
        for sheet in sheets:
            if sheet.face.kind == "top" and s.key_flat is not None:
                _draw_key_flat(sheet, s)
        dxfs = []
        for sheet in sheets:
            dxf = folder / f"{s.stem}-{sheet.name}.dxf"
            write_sheet_dxf(sheet, dxf, f"{plan.name}: sleeve {sheet.name} template, 1:1, {'inches' if cfg.units == 'in' else 'millimetres'}")
            dxfs.append({"face": sheet.face.id, "file": f"{FOLDER}/{dxf.name}",
                         "holes": {hid: [round(u, 6), round(v, 6)] for hid, (u, v) in sheet.positions.items()}})
        pages = P.layout(sheets, paper_for(cfg))
        title = f"{ctx.plan.name} sleeve for {s.mast_designation} ({s.stem})"
        previews = write_pdf(pages, folder / f"{s.stem}.pdf", folder / f"{s.stem}-page-", title)
        records.append({"mast": s.mast_designation, "mast_od_mm": round(s.mast_od_mm, 6),
                        "pdf": f"{FOLDER}/{s.stem}.pdf", "pages": len(pages), "sheets": dxfs,
                        "previews": [f"{FOLDER}/{p.name}" for p in previews]})
    ctx.manifest["sleeve_templates"] = records
    ctx.summary.append(f"  sleeve templates {', '.join(r['pdf'] for r in records)} at 1:1")


def _draw_key_flat(sheet, sleeve) -> None:
    """The key flat inside the sleeve as a chord of its inside circle on the top template."""
    import math

    from generators.drawings.primitives import LABELS, OUTLINE, SMALL_MM, Label, Line
    from generators.units import format_length

    k, r = sleeve.key_flat, sleeve.id_mm / 2
    d = min(k.distance_mm, r)
    half = math.sqrt(max(r * r - d * d, 0.0))
    t = math.radians(k.azimuth_deg)
    n, along = (math.cos(t), math.sin(t)), (-math.sin(t), math.cos(t))
    a = (d * n[0] + half * along[0], d * n[1] + half * along[1])
    b = (d * n[0] - half * along[0], d * n[1] - half * along[1])
    sheet.items.append(Line(OUTLINE, a, b))
    sheet.items.append(Label(LABELS, ((d - 5.0) * n[0], (d - 5.0) * n[1]), "key flat", SMALL_MM, "center", "center"))
    L = lambda mm: format_length(mm, sheet.units, fractions=False)  # noqa: E731
    sheet.notes.append(f"Key flat: the inside is flat {L(d)} from the axis, facing azimuth"
                       f" {k.azimuth_deg % 360:g} deg (the chord drawn inside the bore circle); file a matching"
                       f" {L(k.mast_flat_depth_mm)} flat on the mast.")
