"""templates.pdf and its page previews, drawn with matplotlib at an exact figure size.

Each page is a figure of exactly the paper size; the face drawing goes in an axes whose
data limits are the page's window onto the sheet in millimetres and whose size on the
page is the same number of millimetres, so one millimetre of the part is one millimetre of
paper. Nothing is fitted to the page. Defaults are reset for the drawing, so a user's
matplotlibrc cannot change the scale (``savefig.bbox = tight`` would).
"""

from __future__ import annotations

import textwrap
from pathlib import Path

import matplotlib
from matplotlib.backends.backend_pdf import PdfPages
from matplotlib.figure import Figure
from matplotlib.lines import Line2D
from matplotlib.patches import Circle, Polygon, Rectangle

from generators import __version__
from generators.drawings import pages as P
from generators.drawings import sheet as S
from generators.units import MM_PER_IN

PT_PER_MM = 72 / MM_PER_IN
PREVIEW_DPI = 100

# Colour (RGB 0-1) and line width (pt) of each kind of line; tests find elements by colour.
STYLE = {
    S.OUTLINE: ((0.0, 0.0, 0.0), 0.8),
    S.HOLES: ((0.85, 0.0, 0.0), 0.5),
    S.CENTERS: ((0.0, 0.0, 0.0), 0.3),
    S.CSK_CBORE: ((0.0, 0.5, 0.0), 0.4),
    S.LABELS: ((0.15, 0.15, 0.15), 0.4),
    S.NOTES: ((0.35, 0.35, 0.35), 0.4),
    S.DATUM: ((0.0, 0.2, 0.8), 0.5),
    S.DRILL_DIRECTION: ((0.55, 0.0, 0.55), 0.5),
    S.SCALE_BARS: ((0.0, 0.35, 0.6), 0.8),
    "TILE_FRAME": ((0.6, 0.6, 0.6), 0.3),
    "JOIN": ((0.3, 0.3, 0.3), 0.5),
    "ALIGN": ((0.0, 0.5, 0.5), 0.5),
}
TEXT_COLOR = (0.0, 0.0, 0.0)
BAR_100MM = 100.0
BAR_4IN = 4 * MM_PER_IN
SAFETY = ("Clamp the work; wear eye protection.", "Keep masts clear of power lines.")
PRINT_AT_100 = "print at 100 % / actual size \u2014 measure the bar before drilling"

_RC = {
    "pdf.fonttype": 42,  # embedded TrueType: text stays text
    "font.family": "DejaVu Sans",  # shipped with matplotlib: the same on every machine
    "font.monospace": ["DejaVu Sans Mono"],
    "savefig.bbox": "standard",
    "savefig.facecolor": "white",
    "savefig.transparent": False,
    "path.simplify": False,
    "path.snap": False,
    "lines.solid_capstyle": "butt",
    "lines.dash_capstyle": "butt",
    "text.usetex": False,
    "axes.unicode_minus": False,
    "pdf.compression": 6,
}


def _pt(mm: float) -> float:
    return mm * PT_PER_MM


def _axes(fig: Figure, size, box, limits):
    w, h = size
    ax = fig.add_axes((box[0] / w, box[1] / h, (box[2] - box[0]) / w, (box[3] - box[1]) / h))
    ax.set_axis_off()
    ax.set_autoscale_on(False)
    ax.set_xlim(limits[0], limits[2])
    ax.set_ylim(limits[1], limits[3])
    ax.patch.set_visible(False)
    return ax


def _line(ax, a, b, kind, dashed=False, clip=True):
    color, lw = STYLE[kind]
    ax.add_line(Line2D([a[0], b[0]], [a[1], b[1]], color=color, linewidth=lw,
                       linestyle=(0, (4, 2)) if dashed else "-", clip_on=clip))


def _text(ax, at, text, size_mm, ha="left", va="bottom", color=TEXT_COLOR, clip=True, **kw):
    ax.text(at[0], at[1], text, fontsize=_pt(size_mm), ha=ha, va=va, color=color, clip_on=clip, **kw)


def _draw_item(ax, it) -> None:
    if isinstance(it, S.Line):
        _line(ax, it.a, it.b, it.layer, it.dashed)
    elif isinstance(it, S.Circle):
        color, lw = STYLE[it.layer]
        ax.add_patch(Circle(it.c, it.r, fill=False, edgecolor=color, linewidth=lw))
    elif isinstance(it, S.Poly):
        color, lw = STYLE[it.layer]
        if it.closed:
            ax.add_patch(Polygon(it.pts, closed=True, fill=False, edgecolor=color, linewidth=lw,
                                 linestyle=(0, (4, 2)) if it.dashed else "-"))
        else:
            ax.add_line(Line2D([p[0] for p in it.pts], [p[1] for p in it.pts], color=color, linewidth=lw,
                               linestyle=(0, (4, 2)) if it.dashed else "-"))
    else:
        _text(ax, it.at, it.text, it.size, it.halign, it.valign,
              color=STYLE[it.layer][0] if it.layer in (S.DATUM, S.DRILL_DIRECTION) else TEXT_COLOR,
              rotation=it.rotation, rotation_mode="anchor")


def _furniture(page: P.Page, pax, total: int, name: str, page_numbers: dict[str, list[int]]) -> None:
    """Header, scale bars and the print-at-100 % line: on every page."""
    w, h = page.size_mm
    m = P.MARGIN_MM
    sheet = page.sheet
    top = h - m
    head = f"{name}: {sheet.name}"
    if page.window is None:
        k, n = page.info_part
        head += " - hole table and drilling order" + (f" ({k} of {n})" if n > 1 else "")
    else:
        head += " template, 1:1"
    _text(pax, (m, top), head, 4.2, va="top", clip=False, fontweight="bold")
    sub = sheet.title
    if page.window is not None and not page.info:
        info = [p for p in page_numbers.get(sheet.name, []) if p != page.number]
        if info:
            sub += f"; hole table and drilling order on page {info[-1]}"
    for k, line in enumerate(textwrap.wrap(sub, int((w - 2 * m - 15.0) / 1.45))[:2]):
        _text(pax, (m, top - 6.0 - 3.2 * k), line, 2.6, va="top", clip=False)
    if page.tiled:
        r, c = page.tile
        R, C = page.tiles
        tile_text = (f"tile row {r} of {R}, column {c} of {C}; tiles overlap {P.OVERLAP_MM:g} mm. Trim each page on"
                     " its dashed join line at the left and top, lay it on its neighbour and match the marks.")
        _text(pax, (m, top - 12.4), tile_text, 2.4, va="top", clip=False)
        # a map of the tiles, this one filled
        cell = 3.0
        x0 = w - m - C * cell
        y0 = top - 5.0 - R * cell
        for rr in range(R):
            for cc in range(C):
                here = (rr + 1, cc + 1) == page.tile
                pax.add_patch(Rectangle((x0 + cc * cell, y0 + (R - 1 - rr) * cell), cell, cell,
                                        facecolor=(0.5, 0.5, 0.5) if here else "none",
                                        edgecolor=(0.3, 0.3, 0.3), linewidth=0.3, clip_on=False))
    # footer: the print-at-100 % line and two scale bars, each one straight segment
    _text(pax, (m, m + 24.0), PRINT_AT_100, 3.0, va="top", clip=False, fontweight="bold")
    for length, label, y in ((BAR_100MM, "100 mm", m + 14.0), (BAR_4IN, "4 in", m + 5.0)):
        _line(pax, (m, y), (m + length, y), S.SCALE_BARS, clip=False)
        for x in (m, m + length):  # end ticks, separate short segments
            _line(pax, (x, y - 2.0), (x, y + 2.0), S.SCALE_BARS, clip=False)
        _text(pax, (m + length + 3.0, y), label, 3.0, va="center", clip=False)
    for k, line in enumerate(SAFETY):  # at the bench: the usual cautions, right of the scale bars
        _text(pax, (w - m, m + 17.0 - 3.6 * k), line, 2.6, ha="right", va="bottom", clip=False)
    _text(pax, (w - m, m + 4.0), f"page {page.number} of {total}", 3.0, ha="right", va="bottom", clip=False)
    _text(pax, (w - m, m), f"hubwright {__version__}: 1:1 drill templates", 2.2, ha="right", va="bottom",
          clip=False, color=(0.4, 0.4, 0.4))


def _template(page: P.Page, fig: Figure) -> None:
    dax = _axes(fig, page.size_mm, page.box, page.window)
    for it in page.sheet.items:
        if page.shows(it):
            _draw_item(dax, it)
    if page.tiled:
        u0, v0, u1, v1 = page.window
        color, lw = STYLE["TILE_FRAME"]
        dax.add_patch(Rectangle((u0, v0), u1 - u0, v1 - v0, fill=False, edgecolor=color, linewidth=lw,
                                clip_on=False))
        for a, b in page.joins:
            a = (max(a[0], u0), max(a[1], v0))
            b = (min(b[0], u1), min(b[1], v1))
            _line(dax, a, b, "JOIN", dashed=True)
        color, lw = STYLE["ALIGN"]
        for mx, my in page.marks:
            r = P.MARK_RADIUS_MM
            dax.add_patch(Circle((mx, my), r, fill=False, edgecolor=color, linewidth=lw))
            _line(dax, (mx - r - 1.5, my), (mx + r + 1.5, my), "ALIGN")
            _line(dax, (mx, my - r - 1.5), (mx, my + r + 1.5), "ALIGN")


def _info(page: P.Page, pax) -> None:
    y = page.info_top_mm
    for line in page.info:
        bold = line in ("Hole table", "Drilling order", "Notes")
        _text(pax, (P.MARGIN_MM, y), line, P.INFO_PT / PT_PER_MM, va="top", clip=False, family="monospace",
              fontweight="bold" if bold else "normal")
        y -= P.LINE_MM


def _figure(page: P.Page, total: int, name: str, page_numbers: dict[str, list[int]]) -> Figure:
    w, h = page.size_mm
    fig = Figure(figsize=(w / MM_PER_IN, h / MM_PER_IN), dpi=72)
    pax = _axes(fig, page.size_mm, (0.0, 0.0, w, h), (0.0, 0.0, w, h))
    if page.window is not None:
        _template(page, fig)
    _info(page, pax)
    _furniture(page, pax, total, name, page_numbers)
    return fig


def write_pdf(pages: list[P.Page], pdf_path: Path, preview_stem: Path, name: str) -> list[Path]:
    """Write templates.pdf and one PNG preview a page; returns the previews."""
    previews = []
    with matplotlib.rc_context():
        matplotlib.rcdefaults()
        matplotlib.rcParams.update(_RC)
        metadata = {"Title": f"{name} drill templates (print at 100 %)", "Creator": f"hubwright {__version__}",
                    "CreationDate": None}
        page_numbers: dict[str, list[int]] = {}
        for page in pages:
            page_numbers.setdefault(page.sheet.name, []).append(page.number)
        with PdfPages(pdf_path, metadata=metadata) as pdf:
            for page in pages:
                pdf.savefig(_figure(page, len(pages), name, page_numbers))
    # The previews are the PDF itself, rasterised by PDFium: what the user checks is what
    # prints, and it is several times faster than drawing every page again.
    import pypdfium2 as pdfium

    doc = pdfium.PdfDocument(str(pdf_path))
    try:
        for page, rendered in zip(pages, doc):
            png = preview_stem.with_name(f"{preview_stem.name}{page.number:02d}.png")
            rendered.render(scale=PREVIEW_DPI / 72.0).to_pil().save(png, format="PNG")
            previews.append(png)
    finally:
        doc.close()
    return previews
