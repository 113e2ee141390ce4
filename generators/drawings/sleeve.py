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
        dxfs = []
        for sheet in sheets:
            dxf = folder / f"{s.stem}-{sheet.name}.dxf"
            write_sheet_dxf(sheet, dxf, f"{plan.name}: sleeve {sheet.name} template, 1:1 in {cfg.units}")
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
