"""Sleeve templates read back: the DXF with ezdxf, the PDF with PyMuPDF (1 in = 72 pt,
100 mm = 283.465 pt by definition)."""

from __future__ import annotations

import math
from pathlib import Path

import ezdxf
import pymupdf
import pytest

from generators.build import build_config
from generators.config import parse_config
from generators.drawings import sheet as S

from .test_templates import segments

ROOT = Path(__file__).resolve().parents[2]
CFG = {
    "name": "sleeve-tpl", "units": "in",
    "mast": {"size": "2 in"},
    "hub": {"across_flats": 6, "thickness": 1.5, "corner_chamfer": 0.75, "material": "pom",
            "bore": 2.3},
    "spreaders": {"count": 4, "diameter": 0.75, "socket_depth": 1.6},
    "mast_clamp": {"thread": "1/4-20", "count": 1},
    "reducers": [{"mast": "1-1/4 in EMT"}, {"mast": "1-1/2 in", "flange": True}],
}


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    out = tmp_path_factory.mktemp("sleeve-tpl")
    return build_config(parse_config(CFG), out, force=True)


@pytest.mark.slow
def test_every_sleeve_has_a_top_template_at_its_inside_diameter(built):
    recs = built.manifest["sleeve_templates"]
    sleeves = {r["mast"]: r for r in built.manifest["reducers"]}
    assert len(recs) == len(sleeves) == 2
    for rec in recs:
        sleeve = sleeves[rec["mast"]]
        top = next(s for s in rec["sheets"] if s["face"] == "top")
        doc = ezdxf.readfile(built.folder / top["file"])
        assert doc.header["$INSUNITS"] == 1  # inches (DXF reference: 1 = inches)
        holes = [e for e in doc.modelspace() if e.dxf.layer == S.HOLES]
        assert len(holes) == 1 and holes[0].dxftype() == "CIRCLE"
        assert 2 * holes[0].dxf.radius * 25.4 == pytest.approx(sleeve["id_mm"], abs=0.01)
        assert (holes[0].dxf.center.x, holes[0].dxf.center.y) == (pytest.approx(0.0), pytest.approx(0.0))


@pytest.mark.slow
def test_sleeve_clamp_hole_on_its_wrap_strip(built):
    with_hole = [r for r in built.manifest["reducers"] if r.get("holes")]
    assert with_hole, "the config's clamp hole should pass through the sleeves"
    rec = next(r for r in built.manifest["sleeve_templates"] if r["mast"] == with_hole[0]["mast"])
    rim = next(s for s in rec["sheets"] if s["face"] == "rim")
    doc = ezdxf.readfile(built.folder / rim["file"])
    holes = [e for e in doc.modelspace() if e.dxf.layer == S.HOLES]
    assert len(holes) == len(with_hole[0]["holes"])


@pytest.mark.slow
def test_sleeve_pdf_pages_carry_both_scale_bars(built):
    for rec in built.manifest["sleeve_templates"]:
        doc = pymupdf.open(built.folder / rec["pdf"])
        assert len(doc) == rec["pages"] == len(rec["previews"])
        for page in doc:
            lengths = [math.dist(a, b) for a, b in segments(page, S.SCALE_BARS)]
            assert sum(abs(x - 283.46) <= 0.1 for x in lengths) == 1
            assert sum(abs(x - 288.0) <= 0.1 for x in lengths) == 1


def test_rim_strip_is_as_long_as_the_surface_its_holes_are_drilled_on(built):
    # wrapped on the sleeve body (not the flange), the strip's length is pi x the body OD
    for rec, sleeve in zip(built.manifest["sleeve_templates"], built.manifest["reducers"]):
        rims = [s for s in rec["sheets"] if s["face"] == "rim"]
        for s in rims:
            msp = ezdxf.readfile(built.folder / s["file"]).modelspace()
            xs = [p[0] for e in msp.query(f'LWPOLYLINE[layer=="{S.OUTLINE}"]') for p in e.get_points()]
            k = 25.4 if built.manifest["units_in_config"] == "in" else 1.0  # DXF in the config's units
            assert (max(xs) - min(xs)) * k == pytest.approx(math.pi * sleeve["od_mm"], abs=0.1)
