"""Build writer for the 1:1 drill templates: templates/<face>.dxf, templates/templates.pdf and a
PNG preview of each page (templates/page-NN.png).

Manifest: ``templates`` lists one record a face with holes (its DXF, the sheet frame, every
hole's sheet position in mm, its pages); ``templates_pdf`` describes the PDF and each page
(paper, tile, the window of the sheet it shows and where on the page, its preview).
"""

from __future__ import annotations

from generators.drawings import pages as P
from generators.drawings.sheet import build_sheets
from generators.units import MM_PER_IN

FOLDER = "templates"
PDF = "templates.pdf"
PREVIEW_STEM = "page-"


def paper_for(cfg) -> str:
    """``[output] paper``, else Letter for an inch config and A4 for a millimetre one."""
    if cfg.output.paper:
        return cfg.output.paper
    return "letter" if cfg.units == "in" else "a4"


def _layout(ctx):
    """The sheets and pages of a machined hub's templates, or None for a printed hub."""
    cfg, plan = ctx.config, ctx.plan
    if plan.process != "machined":
        return None
    sheets = build_sheets(plan, cfg, ctx.design.operations)
    paper = paper_for(cfg)
    return sheets, paper, P.layout(sheets, paper)


def write_templates(ctx) -> None:
    """Both halves in order: the DXF sheets, then the PDF and its previews."""
    write_template_dxf(ctx)
    write_template_pdf(ctx)


def write_template_dxf(ctx) -> None:
    """templates/<face>.dxf, one a face with holes; ctx.manifest["templates"]."""
    from generators.drawings.dxf import write_sheet_dxf

    laid = _layout(ctx)
    if laid is None:
        ctx.manifest["templates"] = []
        return
    sheets, _paper, pages = laid
    cfg, plan = ctx.config, ctx.plan
    folder = ctx.folder / FOLDER
    folder.mkdir(exist_ok=True)
    records = []
    for sheet in sheets:
        dxf = folder / f"{sheet.name}.dxf"
        write_sheet_dxf(sheet, dxf, f"{plan.name}: {sheet.name} template, 1:1, {'inches' if cfg.units == 'in' else 'millimetres'}")
        records.append({
            "face": sheet.face.id,
            "file": f"{FOLDER}/{dxf.name}",
            "dxf_units": cfg.units,
            "frame": sheet.frame,
            "holes": {hid: [round(u, 6), round(v, 6)] for hid, (u, v) in sheet.positions.items()},
            "pages": [p.number for p in pages if p.sheet is sheet],
        })
    ctx.manifest["templates"] = records  # one DXF sheet a face with holes


def write_template_pdf(ctx) -> None:
    """templates/templates.pdf at 1:1 and a PNG preview a page; ctx.manifest["templates_pdf"]."""
    from generators.drawings.pdf import write_pdf

    laid = _layout(ctx)
    if laid is None:
        ctx.manifest["templates_pdf"] = {"made": False, "reason": "a printed hub's holes are printed, not drilled"}
        ctx.summary.append("  templates none: a printed hub's holes are printed, not drilled")
        return
    sheets, paper, pages = laid
    cfg, plan = ctx.config, ctx.plan
    folder = ctx.folder / FOLDER
    folder.mkdir(exist_ok=True)
    previews = write_pdf(pages, folder / PDF, folder / PREVIEW_STEM, plan.name)
    ctx.manifest["templates_pdf"] = {
        "made": True,
        "file": f"{FOLDER}/{PDF}",
        "paper": paper,
        "scale": "1:1",
        "margin_mm": P.MARGIN_MM,
        "overlap_mm": P.OVERLAP_MM,
        "scale_bars_mm": [100.0, 4 * MM_PER_IN],
        "pages": [{
            "page": p.number,
            "face": p.sheet.face.id,
            "content": "template" if p.window is not None else "info",
            "size_mm": list(p.size_mm),
            "orientation": p.orientation,
            "tile": list(p.tile),
            "tiles": list(p.tiles),
            "window_mm": None if p.window is None else [round(x, 6) for x in p.window],
            "box_mm": None if p.box is None else [round(x, 6) for x in p.box],
            "preview": f"{FOLDER}/{png.name}",
        } for p, png in zip(pages, previews)],
    }
    tiled = sorted({p.sheet.face.id for p in pages if p.tiled})
    ctx.summary.append(f"  templates {FOLDER}/{PDF}: {len(pages)} {paper_name(paper)} pages at 1:1 (print at 100 %,"
                       f" check the {'4 in' if cfg.units == 'in' else '100 mm'} bar), {len(sheets)} DXF, a PNG preview a page"
                       + (f"; tiled: {', '.join(tiled)}" if tiled else ""))


def paper_name(paper: str) -> str:
    return {"a4": "A4", "letter": "Letter"}[paper]
