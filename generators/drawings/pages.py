"""Page layout of templates.pdf: which part of which sheet goes where on which page, at 1:1.

Pure arithmetic in millimetres; the renderer (``pdf.py``) only draws what this decides.
A sheet whose drawing fits the printable area goes on one page, with its hole table and
drilling order under it when they fit too, else on a page of their own. A larger one is
tiled: windows of the printable area that overlap by ``OVERLAP_MM``; the middle of each
overlap is a dashed join line with alignment marks on it, printed on both pages.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from generators.drawings.sheet import HOLES, Circle, Sheet, item_extent
from generators.drawings.prose import info_lines

PAPER_MM = {"a4": (210.0, 297.0), "letter": (215.9, 279.4)}  # ISO 216; ANSI/ASME Y14.1
# Home inkjet and laser printers cannot print the outer 3-6 mm; 1/2 in keeps every line on
# the paper (common practice).
MARGIN_MM = 12.7
HEADER_MM = 15.0
FOOTER_MM = 27.0
OVERLAP_MM = 15.0
MARK_RADIUS_MM = 3.0
PAD_MM = 2.0  # clear space kept round the drawing
GAP_MM = 6.0  # between the drawing and the info under it
# The info block is 7 pt DejaVu Sans Mono: 0.602 em a character, counted as 0.65 em to stay
# inside the margin whatever the renderer rounds; 3.4 mm a line.
INFO_PT = 7.0
CHAR_MM = 0.65 * INFO_PT * 25.4 / 72
LINE_MM = 3.4


@dataclass
class Page:
    number: int
    sheet: Sheet
    paper: str
    size_mm: tuple[float, float]
    orientation: str  # portrait | landscape
    window: tuple[float, float, float, float] | None = None  # sheet (u0, v0, u1, v1) shown
    box: tuple[float, float, float, float] | None = None  # where on the page, mm from bottom left
    tile: tuple[int, int] = (1, 1)  # row (from the top), column (from the left), 1-based
    tiles: tuple[int, int] = (1, 1)
    joins: list[tuple[tuple[float, float], tuple[float, float]]] = field(default_factory=list)
    marks: list[tuple[float, float]] = field(default_factory=list)
    info: list[str] = field(default_factory=list)
    info_top_mm: float = 0.0  # page y of the first info line's top
    info_part: tuple[int, int] = (0, 0)  # (k, n) when the info runs over n pages

    @property
    def tiled(self) -> bool:
        return self.tiles != (1, 1)

    def shows(self, item) -> bool:
        if self.window is None:
            return False
        x0, y0, x1, y1 = item_extent(item)
        u0, v0, u1, v1 = self.window
        return x1 >= u0 and x0 <= u1 and y1 >= v0 and y0 <= v1


def area(size_mm: tuple[float, float]) -> tuple[float, float, float, float]:
    """The printable drawing area of a page (x0, y0, x1, y1): inside the margins, between the
    header and the footer."""
    w, h = size_mm
    return (MARGIN_MM, MARGIN_MM + FOOTER_MM, w - MARGIN_MM, h - MARGIN_MM - HEADER_MM)


def _size(paper: str, orientation: str) -> tuple[float, float]:
    w, h = PAPER_MM[paper]
    return (w, h) if orientation == "portrait" else (h, w)


def _chunks(lines: list[str], per_page: int) -> list[list[str]]:
    out, cur = [], []
    for line in lines:
        cur.append(line)
        if len(cur) >= per_page:
            out.append(cur)
            cur = []
    if cur:
        out.append(cur)
    return out


@dataclass
class _Plan:
    pages: int
    orientation: str
    below: bool
    grid: tuple[int, int]


def _options(sheet: Sheet, paper: str) -> _Plan:
    x0, y0, x1, y1 = sheet.bbox()
    bw, bh = x1 - x0 + 2 * PAD_MM, y1 - y0 + 2 * PAD_MM
    best = None
    for orientation in ("portrait", "landscape"):
        a = area(_size(paper, orientation))
        W, H = a[2] - a[0], a[3] - a[1]
        lines = info_lines(sheet, int(W / CHAR_MM))
        info_h = len(lines) * LINE_MM
        info_pages = len(_chunks(lines, int(H / LINE_MM)))
        if bw <= W and bh + GAP_MM + info_h <= H:
            cand = _Plan(1, orientation, True, (1, 1))
        else:
            cols = 1 if bw <= W else math.ceil((bw - OVERLAP_MM) / (W - OVERLAP_MM))
            rows = 1 if bh <= H else math.ceil((bh - OVERLAP_MM) / (H - OVERLAP_MM))
            cand = _Plan(rows * cols + info_pages, orientation, False, (rows, cols))
        if best is None or cand.pages < best.pages:
            best = cand
    return best


def layout(sheets: list[Sheet], paper: str) -> list[Page]:
    """Every page of templates.pdf, in order: each sheet's template pages, then its info."""
    pages: list[Page] = []
    for sheet in sheets:
        opt = _options(sheet, paper)
        size = _size(paper, opt.orientation)
        ax0, ay0, ax1, ay1 = area(size)
        W, H = ax1 - ax0, ay1 - ay0
        x0, y0, x1, y1 = sheet.bbox()
        cx, cy = (x0 + x1) / 2, (y0 + y1) / 2
        bh = y1 - y0 + 2 * PAD_MM
        if opt.below:
            window = (cx - W / 2, y1 + PAD_MM - bh, cx + W / 2, y1 + PAD_MM)
            box = (ax0, ay1 - bh, ax1, ay1)
            lines = info_lines(sheet, int(W / CHAR_MM))
            pages.append(Page(len(pages) + 1, sheet, paper, size, opt.orientation, window, box,
                              info=lines, info_top_mm=ay1 - bh - GAP_MM))
            continue
        rows, cols = opt.grid
        sx, sy = W - OVERLAP_MM, H - OVERLAP_MM
        gw, gh = (cols - 1) * sx + W, (rows - 1) * sy + H
        circles = [(it.c, it.r) for it in sheet.items if isinstance(it, Circle) and it.layer == HOLES]
        # slide the grid inside its slack so no join line runs through a hole
        gx0 = _slide(x0 - PAD_MM, x1 + PAD_MM, gw, [W - OVERLAP_MM / 2 + c * sx for c in range(cols - 1)],
                     [(c[0], r) for c, r in circles])
        gy0 = _slide(y0 - PAD_MM, y1 + PAD_MM, gh, [H - OVERLAP_MM / 2 + r * sy for r in range(rows - 1)],
                     [(c[1], r) for c, r in circles])
        gy1 = gy0 + gh
        xs = [gx0 + c * sx + W - OVERLAP_MM / 2 for c in range(cols - 1)]
        ys = [gy1 - r * sy - H + OVERLAP_MM / 2 for r in range(rows - 1)]
        joins = [((x, gy0), (x, gy1)) for x in xs] + [((gx0, y), (gx0 + gw, y)) for y in ys]
        marks = []
        for x in xs:  # two marks on each vertical join in each row, clear of the holes
            for r in range(rows):
                lo, hi = gy1 - r * sy - H + OVERLAP_MM, gy1 - r * sy - OVERLAP_MM
                marks += [(x, y) for y in _mark_spots(lo, hi, lambda t, x=x: (x, t), circles)]
        for y in ys:
            for c in range(cols):
                lo, hi = gx0 + c * sx + OVERLAP_MM, gx0 + c * sx + W - OVERLAP_MM
                marks += [(x, y) for x in _mark_spots(lo, hi, lambda t, y=y: (t, y), circles)]
        for r in range(rows):
            for c in range(cols):
                win = (gx0 + c * sx, gy1 - r * sy - H, gx0 + c * sx + W, gy1 - r * sy)
                inside = [m for m in marks if win[0] + MARK_RADIUS_MM <= m[0] <= win[2] - MARK_RADIUS_MM
                          and win[1] + MARK_RADIUS_MM <= m[1] <= win[3] - MARK_RADIUS_MM]
                pages.append(Page(len(pages) + 1, sheet, paper, size, opt.orientation, win,
                                  (ax0, ay0, ax1, ay1), tile=(r + 1, c + 1), tiles=(rows, cols),
                                  joins=[j for j in joins if _crosses(j, win)], marks=inside))
        isize = _size(paper, "portrait")
        ia = area(isize)
        lines = info_lines(sheet, int((ia[2] - ia[0]) / CHAR_MM))
        parts = _chunks(lines, int((ia[3] - ia[1]) / LINE_MM))
        for k, part in enumerate(parts, 1):
            pages.append(Page(len(pages) + 1, sheet, paper, isize, "portrait", info=part, info_top_mm=ia[3],
                              info_part=(k, len(parts))))
    return pages


def _slide(lo: float, hi: float, length: float, offsets: list[float], circles: list[tuple[float, float]]) -> float:
    """Where a grid of ``length`` starts so it covers lo..hi and its join lines (at ``offsets``
    from its start) keep clearest of the hole circles (centre, radius along that axis)."""
    slack = max(length - (hi - lo), 0.0)
    centred = lo - slack / 2
    if not offsets or not circles:
        return centred
    best, start = -math.inf, centred
    steps = int(slack) + 1
    for k in range(steps + 1):
        g = lo - slack + slack * k / steps
        # a join may cross a big circle (the bore) but should keep off every crosshair
        clear = min(abs(g + o - c) - min(r, 6.0) for o in offsets for c, r in circles)
        score = (min(round(clear, 1), 8.0), -abs(g - centred))  # clear joins, then centred
        if best == -math.inf or score > best:
            best, start = score, g
    return start


def _mark_spots(lo: float, hi: float, point, circles) -> list[float]:
    """Two alignment-mark positions between lo and hi on a join line, clear of the holes."""
    if hi - lo < 4 * MARK_RADIUS_MM:
        return [(lo + hi) / 2] if hi - lo >= 2 * MARK_RADIUS_MM else []
    mid = (lo + hi) / 2
    spots = []
    for a, b, ideal in ((lo, mid, (lo + mid) / 2), (mid, hi, (mid + hi) / 2)):
        best, spot = None, ideal
        n = max(int(b - a), 1)
        for k in range(n + 1):
            t = a + (b - a) * k / n
            x, y = point(t)
            clear = min((math.hypot(x - c[0], y - c[1]) - r for c, r in circles), default=1e9)
            score = (min(round(clear, 1), 8.0), -abs(t - ideal))
            if best is None or score > best:
                best, spot = score, t
        spots.append(spot)
    return spots


def _crosses(seg, win) -> bool:
    (ax, ay), (bx, by) = seg
    return max(ax, bx) >= win[0] and min(ax, bx) <= win[2] and max(ay, by) >= win[1] and min(ay, by) <= win[3]
