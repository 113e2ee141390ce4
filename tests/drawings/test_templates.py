"""Drill templates read back: the DXFs with ezdxf, templates.pdf with PyMuPDF and pypdf.

Every check measures the written files against the manifest (the plan's holes in 3D)
and against paper sizes and lengths by definition: 1 in = 25.4 mm = 72 pt exactly, so
100 mm = 283.465 pt and 4 in = 288 pt; A4 is 210 x 297 mm (ISO 216), Letter 8.5 x 11 in
(ANSI/ASME Y14.1).
"""

from __future__ import annotations

import itertools
import math

import ezdxf
import pymupdf
import pypdf
import pytest

from generators.drawings import pdf as PDF
from generators.drawings import sheet as S
from generators.drawings.pages import OVERLAP_MM

from .conftest import CASES, TILED

PT = 72 / 25.4
NAMES = sorted(CASES)
POS_TOL_MM = 0.01
PDF_TOL_PT = 0.3
PAPER_PT = {"a4": (210 * PT, 297 * PT), "letter": (612.0, 792.0)}


# ---- helpers --------------------------------------------------------------------------

def expected_uv(sheet: dict, entry) -> tuple[float, float]:
    """Where a hole's entry point goes on its sheet, from the manifest alone."""
    f = sheet["frame"]
    if f["kind"] == "rim":
        az = (math.degrees(math.atan2(entry[1], entry[0])) - f["join_azimuth_deg"]) % 360
        return f["radius_mm"] * math.radians(az), entry[2]
    d = [entry[i] - f["origin_mm"][i] for i in range(3)]
    return (sum(d[i] * f["u_axis"][i] for i in range(3)), sum(d[i] * f["v_axis"][i] for i in range(3)))


def dxf_scale(sheet: dict) -> float:
    return 25.4 if sheet["dxf_units"] == "in" else 1.0


def same_color(a, b, tol=0.01) -> bool:
    return a is not None and all(abs(x - y) <= tol for x, y in zip(a, b))


def segments(page, kind: str):
    """Straight line segments drawn in the colour of ``kind``, in pt (y down)."""
    color = PDF.STYLE[kind][0]
    for d in page.get_drawings():
        if same_color(d.get("color"), color):
            for item in d["items"]:
                if item[0] == "l":
                    yield item[1], item[2]


def circles(page, kind: str) -> list[tuple[float, float, float, float]]:
    """(cx, cy, width, height) in pt of every closed curve in the colour of ``kind``, from the
    points on the curve (not the bezier control points)."""
    color = PDF.STYLE[kind][0]
    out = []
    for d in page.get_drawings():
        if not same_color(d.get("color"), color):
            continue
        pts = [p for item in d["items"] if item[0] == "c" for p in (item[1], item[4])]
        if len(pts) >= 8:
            xs, ys = [p.x for p in pts], [p.y for p in pts]
            out.append(((max(xs) + min(xs)) / 2, (max(ys) + min(ys)) / 2, max(xs) - min(xs), max(ys) - min(ys)))
    return out


def rects(page, kind: str):
    color = PDF.STYLE[kind][0]
    for d in page.get_drawings():
        if same_color(d.get("color"), color):
            for item in d["items"]:
                if item[0] == "re":
                    yield item[1]
                elif item[0] == "qu":
                    yield item[1].rect
            pts = [p for item in d["items"] if item[0] == "l" for p in (item[1], item[2])]
            if len(pts) >= 4:
                yield pymupdf.Rect(min(p.x for p in pts), min(p.y for p in pts),
                                   max(p.x for p in pts), max(p.y for p in pts))


def to_page_pt(page_rec: dict, uv) -> tuple[float, float]:
    """Where the manifest says a sheet point lands on its page (pt, y down from the top)."""
    u0, v0, _, _ = page_rec["window_mm"]
    bx0, by0, _, _ = page_rec["box_mm"]
    h = page_rec["size_mm"][1]
    return ((bx0 + uv[0] - u0) * PT, (h - (by0 + uv[1] - v0)) * PT)


def marked(manifest) -> list[dict]:
    """Every hole a template marks: the holes by their entry face, and a through pin's far
    end on the face it leaves by (``P1-exit``, at the entry point plus the depth along the axis)."""
    exits = [dict(h, id=f"{h['id']}-exit", face=h["exit_face"], thread=None,
                  entry_mm=[e + a * h["depth_mm"] for e, a in zip(h["entry_mm"], h["axis"])])
             for h in manifest["holes"] if h["kind"] == "pin" and h.get("exit_face")]
    return manifest["holes"] + exits


# ---- DXF ------------------------------------------------------------------------------

@pytest.mark.parametrize("name", NAMES)
def test_a_sheet_for_every_face_with_holes(templates, name):
    t = templates(name)
    faces = {h["face"] for h in marked(t.manifest)}
    assert {s["face"] for s in t.manifest["templates"]} == faces
    for s in t.manifest["templates"]:
        assert (t.folder / s["file"]).is_file()


@pytest.mark.parametrize("name", NAMES)
def test_dxf_units_header(templates, name):
    t = templates(name)
    for s in t.manifest["templates"]:
        doc = ezdxf.readfile(t.folder / s["file"])
        # $INSUNITS 4 = millimetres, 1 = inches; $MEASUREMENT 1 = metric, 0 = imperial (DXF reference)
        assert doc.header["$INSUNITS"] == {"mm": 4, "in": 1}[t.config.units]
        assert doc.header["$MEASUREMENT"] == {"mm": 1, "in": 0}[t.config.units]


@pytest.mark.parametrize("name", NAMES)
def test_dxf_every_hole_once_at_its_position_and_drilled_diameter(templates, name):
    t = templates(name)
    for s in t.manifest["templates"]:
        msp = ezdxf.readfile(t.folder / s["file"]).modelspace()
        k = dxf_scale(s)
        on_layer = list(msp.query(f'*[layer=="{S.HOLES}"]'))
        assert {e.dxftype() for e in on_layer} <= {"CIRCLE"}, "only hole circles on the hole layer"
        found = [((e.dxf.center.x * k, e.dxf.center.y * k), e.dxf.radius * 2 * k) for e in on_layer]
        holes = [h for h in marked(t.manifest) if h["face"] == s["face"]]
        assert len(found) == len(holes)
        for h in holes:
            u, v = expected_uv(s, h["entry_mm"])
            hits = [(c, d) for c, d in found if math.hypot(c[0] - u, c[1] - v) <= POS_TOL_MM]
            assert len(hits) == 1, (s["face"], h["id"], (u, v))
            assert hits[0][1] == pytest.approx(h["diameter_mm"], abs=1e-3), (s["face"], h["id"])


@pytest.mark.parametrize("name", ["metric-demo", "inch-demo", "oct-block-inch"])
def test_dxf_hole_table_and_scale_bars(templates, name):
    t = templates(name)
    for s in t.manifest["templates"]:
        msp = ezdxf.readfile(t.folder / s["file"]).modelspace()
        k = dxf_scale(s)
        cells = {e.dxf.text for e in msp.query(f'TEXT[layer=="{S.HOLE_TABLE}"]')}
        for h in (h for h in marked(t.manifest) if h["face"] == s["face"]):
            assert h["id"] in cells
            if h["thread"]:
                assert h["thread"] in cells
        assert {"hole", "drill", "tap"} <= {c.split(" ")[0] for c in cells}
        bars = sorted(round(math.dist(e.dxf.start, e.dxf.end) * k, 6)
                      for e in msp.query(f'LINE[layer=="{S.SCALE_BARS}"]'))
        assert bars[-2:] == [pytest.approx(100.0), pytest.approx(101.6)]
        notes = " ".join(e.dxf.text for e in msp.query(f'TEXT[layer=="{S.NOTES}"]'))
        assert "Drilling order" in notes and "Centre-punch" in notes


def test_dxf_inch_sheet_is_drawn_in_inches(templates):
    t = templates("quad-emt-frozen")
    s = t.sheet("top")
    msp = ezdxf.readfile(t.folder / s["file"]).modelspace()
    bore = next(e for e in msp.query(f'CIRCLE[layer=="{S.HOLES}"]') if e.dxf.radius > 0.5)
    assert bore.dxf.radius * 2 == pytest.approx(1.550, abs=1e-6)  # 1.510 in EMT OD + 0.040 in clearance


# ---- PDF ------------------------------------------------------------------------------

@pytest.mark.parametrize("name", NAMES)
def test_pdf_pages_paper_bars_and_print_note(templates, name):
    t = templates(name)
    paper = t.manifest["templates_pdf"]["paper"]
    assert paper == (t.config.output.paper or ("letter" if t.config.units == "in" else "a4"))
    doc = pymupdf.open(t.pdf)
    assert len(doc) == len(t.pages())
    reader = pypdf.PdfReader(t.pdf)  # a second reader for the page sizes
    for page, rec, other in zip(doc, t.pages(), reader.pages):
        w, h = PAPER_PT[paper]
        size = sorted((float(other.mediabox.width), float(other.mediabox.height)))
        assert size == [pytest.approx(min(w, h), abs=0.01), pytest.approx(max(w, h), abs=0.01)]
        lengths = [math.dist(a, b) for a, b in segments(page, S.SCALE_BARS)]
        bars_100 = [x for x in lengths if abs(x - 283.46) <= 0.1]
        bars_4in = [x for x in lengths if abs(x - 288.0) <= 0.1]
        assert len(bars_100) == 1 and len(bars_4in) == 1, (rec["page"], sorted(lengths))
        text = " ".join(page.get_text().split())
        assert "print at 100 % / actual size" in text and "measure the bar before drilling" in text
        assert "wear eye protection" in text and "power lines" in text  # the usual cautions, every page
        assert f"page {rec['page']} of {len(doc)}" in text


@pytest.mark.parametrize("name", NAMES)
def test_pdf_holes_at_scale_and_spacing(templates, name):
    t = templates(name)
    doc = pymupdf.open(t.pdf)
    holes = {h["id"]: h for h in marked(t.manifest)}
    shown_whole: set[str] = set()  # holes whose centre mark is printed whole somewhere
    for rec in t.pages():
        if rec["content"] != "template":
            continue
        page = doc[rec["page"] - 1]
        sheet = t.sheet(rec["face"])
        found = circles(page, S.HOLES)
        u0, v0, u1, v1 = rec["window_mm"]
        matched = []
        for hid, (u, v) in sheet["holes"].items():
            r = holes[hid]["diameter_mm"] / 2
            eu, ev = expected_uv(sheet, holes[hid]["entry_mm"])
            assert (u, v) == (pytest.approx(eu, abs=1e-4), pytest.approx(ev, abs=1e-4))
            if u + r < u0 or u - r > u1 or v + r < v0 or v - r > v1:
                continue  # on another tile
            x, y = to_page_pt(rec, (u, v))
            hits = [c for c in found if math.hypot(c[0] - x, c[1] - y) <= 2.0]
            assert len(hits) == 1, (rec["page"], hid)
            cx, cy, wd, ht = hits[0]
            # the circle's width is the drilled diameter at 1:1
            assert wd == pytest.approx(holes[hid]["diameter_mm"] * PT, abs=PDF_TOL_PT), (rec["page"], hid)
            assert ht == pytest.approx(holes[hid]["diameter_mm"] * PT, abs=PDF_TOL_PT), (rec["page"], hid)
            matched.append((hid, (cx, cy), (u, v)))
            m = min(r, 3.0)  # the centre and the crosshair round it, for the punch
            if u0 <= u - m and u + m <= u1 and v0 <= v - m and v + m <= v1:
                shown_whole.add(hid)
        assert len(found) == len(matched), f"page {rec['page']}: circles on the hole layer that are no hole"
        # distances between hole centres on the paper are the plan's
        for (a, pa, qa), (b, pb, qb) in itertools.combinations(matched, 2):
            assert math.dist(pa, pb) == pytest.approx(math.dist(qa, qb) * PT, abs=PDF_TOL_PT), (rec["page"], a, b)
    assert shown_whole == set(holes), "every hole's centre on some page"


@pytest.mark.parametrize("name", sorted(TILED))
def test_tiled_face_overlaps_as_stated(templates, name):
    t = templates(name)
    face = TILED[name]
    doc = pymupdf.open(t.pdf)
    recs = [r for r in t.pages(face) if r["content"] == "template"]
    rows, cols = recs[0]["tiles"]
    assert rows * cols == len(recs) > 1
    by_tile = {tuple(r["tile"]): r for r in recs}
    assert set(by_tile) == {(r, c) for r in range(1, rows + 1) for c in range(1, cols + 1)}
    frames, marks = {}, {}
    for tile, rec in by_tile.items():
        page = doc[rec["page"] - 1]
        text = " ".join(page.get_text().split())
        assert f"tile row {tile[0]} of {rows}, column {tile[1]} of {cols}" in text
        assert f"tiles overlap {OVERLAP_MM:g} mm" in text
        fr = [r for r in rects(page, "TILE_FRAME") if r.width > 100]
        assert len(fr) == 1
        frames[tile] = fr[0]
        marks[tile] = [(c[0], c[1]) for c in circles(page, "ALIGN")]
        assert marks[tile], f"alignment marks on tile {tile}"
    want = OVERLAP_MM * PT
    checked = 0
    for (r, c), fa in frames.items():
        for dr, dc in ((0, 1), (1, 0)):
            nb = (r + dr, c + dc)
            if nb not in frames:
                continue
            fb = frames[nb]
            # a mark printed on both pages: the same point of the part
            pairs = [(a, b) for a in marks[(r, c)] for b in marks[nb]
                     if (abs(a[1] - b[1]) < PDF_TOL_PT if dc else abs(a[0] - b[0]) < PDF_TOL_PT)]
            pairs = [(a, b) for a, b in pairs
                     if (abs((a[0] - fa.x0) - (b[0] - fb.x0) - (fa.width - want)) < 2 if dc else
                         abs((a[1] - fa.y0) - (b[1] - fb.y0) - (fa.height - want)) < 2)]
            assert pairs, ((r, c), nb)
            for a, b in pairs:
                if dc:  # right neighbour: its window starts (width - overlap) further along
                    overlap = fa.width - ((a[0] - fa.x0) - (b[0] - fb.x0))
                else:  # the tile below starts (height - overlap) further down
                    overlap = fa.height - ((a[1] - fa.y0) - (b[1] - fb.y0))
                assert overlap == pytest.approx(want, abs=PDF_TOL_PT)
                checked += 1
    assert checked >= 2


def test_paper_defaults_and_override(templates):
    assert templates("metric-demo").manifest["templates_pdf"]["paper"] == "a4"
    assert templates("inch-demo").manifest["templates_pdf"]["paper"] == "letter"
    a4 = templates("quad-emt-a4")
    assert a4.manifest["templates_pdf"]["paper"] == "a4"
    page = pymupdf.open(a4.pdf)[0]
    assert sorted((page.rect.width, page.rect.height)) == [pytest.approx(595.276, abs=0.01),
                                                           pytest.approx(841.89, abs=0.01)]


# ---- what the sheets say ---------------------------------------------------------------

def info_text(t, face: str) -> str:
    doc = pymupdf.open(t.pdf)
    return " ".join(" ".join(doc[p["page"] - 1].get_text().split()) for p in t.pages(face))


def test_drilling_order_in_shop_names_inch(templates):
    t = templates("quad-emt-frozen")
    text = info_text(t, "top")
    # sizes typed from the drill tables, not from the code: #23 = 0.1540 in (ASME B94.11M number
    # drills, from memory of the handbook's table); 82 deg countersink to the #10 flat head's
    # 0.385 in (ASME B18.6.3, from memory)
    steps = ["Centre-punch every crosshair", "Drill #23 (0.1540 in): T1, T2, T3, T4",
             "Tap #10-24 UNC: T1, T2, T3, T4", "Countersink 82 deg to 0.385 in across: FP1, FP2"]
    where = [text.find(s) for s in steps]
    assert -1 not in where, list(zip(steps, where))
    assert where == sorted(where)
    side = info_text(t, "flat-1")
    assert "Pilot 1/4 (0.2500 in): S1" in side  # 3/4 in class drill: a pilot a third of it
    assert "Open up to 0.770 in with" in side  # no stock drill of the socket's 0.770 in
    assert "Tap 1/4-20 UNC: C1" in info_text(t, "chamfer-1")


def test_a_one_inch_drill_is_not_the_number_1_drill(templates):
    text = info_text(templates("big-block-inch"), "top")
    assert "Drill 1 (1.0000 in): BIG, 1.000 in deep" in text  # fractional 1 in, not #1 (0.2280 in)
    assert "Pilot 5/16 (0.3125 in): BIG" in text


def test_drilling_order_metric_and_counterbore(templates):
    t = templates("hex-portable-frozen")
    text = info_text(t, "top")
    assert "Drill 5.1 mm: T1, T2, T3, T4, T5, T6" in text and "Tap M6x1" in text and "Tap M5x0.8: FP1, FP2" in text
    assert "Pilot 6.5 mm: S1" in info_text(t, "flat-1")
    # 51 mm is past the 32 mm metric set: cut, not drilled; 20.5 mm is a stock drill
    assert "Cut 51 mm with a 51 mm Forstner bit" in text and "bore, through (larger than the stock drills; mast bore)" in text
    assert "Drill 20.5 mm: S1" in info_text(t, "flat-1")
    oct_ = templates("oct-block-inch")
    bottom = info_text(oct_, "bottom")
    assert "Counterbore" in bottom and "CB2" in bottom and "Countersink 82 deg" in bottom


def test_tilted_socket_has_entry_angle_direction_and_setup(templates):
    t = templates("hex-portable-frozen")
    s = t.sheet("flat-1")
    msp = ezdxf.readfile(t.folder / s["file"]).modelspace()
    u, v = s["holes"]["S1"]
    lines = [(e.dxf.start, e.dxf.end) for e in msp.query(f'LINE[layer=="{S.DRILL_DIRECTION}"]')]
    s1 = t.plan.hole("S1")
    run = s1.depth_mm * math.sin(math.radians(10))
    # the drill-direction arrow on the face, from the entry towards the bottom face
    assert any(math.hypot(a.x - u, a.y - v) < 1e-6 and b.x == pytest.approx(u) and v - b.y == pytest.approx(run)
               for a, b in lines)
    # the true-angle section: a line at 10 deg below square to the face
    angles = [math.degrees(math.atan2(b.y - a.y, b.x - a.x)) for a, b in lines if math.dist(a, b) > 20]
    assert any(a == pytest.approx(-10.0, abs=0.01) for a in angles)
    text = info_text(t, "flat-1")
    assert "tilt 10.0 deg" in text
    assert "tilt the drill-press table 10 deg so the top-face edge is higher" in text
    assert "10 deg wedge with its bottom face towards the low end" in text
    assert "angle jig of this build (jig.dxf, jig.step, jig.stl)" in text


def test_wrap_strip_for_a_puck(templates):
    t = templates("tri-puck-30")
    s = t.sheet("rim")
    body = t.plan.body
    msp = ezdxf.readfile(t.folder / s["file"]).modelspace()
    outline = [e for e in msp.query(f'LWPOLYLINE[layer=="{S.OUTLINE}"]')]
    assert len(outline) == 1
    xs = [p[0] for p in outline[0].get_points()]
    ys = [p[1] for p in outline[0].get_points()]
    assert max(xs) - min(xs) == pytest.approx(math.pi * body.diameter_mm, abs=1e-6)  # circumference long
    assert max(ys) - min(ys) == pytest.approx(body.thickness_mm, abs=1e-6)  # thickness high
    labels = [e.dxf.text for e in msp.query(f'TEXT[layer=="{S.LABELS}"]')]
    assert sum("JOIN" in x for x in labels) == 2
    join = s["frame"]["join_azimuth_deg"]
    for h in (h for h in t.manifest["holes"] if h["face"] == "rim"):
        az = math.degrees(math.atan2(h["entry_mm"][1], h["entry_mm"][0])) % 360
        assert f"{h['id']} {az:g} deg" in labels
        # the join cuts no hole
        half = math.degrees(h["diameter_mm"] / 2 / s["frame"]["radius_mm"])
        assert abs(((az - join + 180) % 360) - 180) > half
    assert "top" in {x["face"] for x in t.manifest["templates"]}  # and the top face template


def test_previews_one_png_a_page(templates):
    from PIL import Image

    t = templates("quad-puck-10")
    for rec in t.pages():
        png = t.folder / rec["preview"]
        with Image.open(png) as im:
            w, h = rec["size_mm"]
            assert im.size == (pytest.approx(w / 25.4 * PDF.PREVIEW_DPI, abs=1),
                               pytest.approx(h / 25.4 * PDF.PREVIEW_DPI, abs=1))


def test_same_plan_same_bytes(templates, tmp_path):
    from .conftest import make_templates

    a = templates("inch-demo")
    b = make_templates(CASES["inch-demo"], tmp_path / "again")
    files = sorted(p.relative_to(a.folder) for p in a.folder.rglob("*") if p.is_file())
    assert files == sorted(p.relative_to(b.folder) for p in b.folder.rglob("*") if p.is_file())
    assert [f for f in files if (a.folder / f).read_bytes() != (b.folder / f).read_bytes()] == []


def test_printed_hub_gets_no_templates(tmp_path):
    import tomllib

    from .conftest import ROOT, make_templates

    raw = tomllib.loads((ROOT / "configs" / "six-spreader-printed.toml").read_text(encoding="utf-8"))
    t = make_templates(raw, tmp_path / "printed")
    assert t.manifest["templates"] == [] and t.manifest["templates_pdf"]["made"] is False
    assert not (tmp_path / "printed" / "templates").exists()
    assert any("templates none" in line for line in t.summary)
