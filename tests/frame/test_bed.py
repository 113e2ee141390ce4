"""Print-bed fit: the footprint turned on the bed, the refusal and its fixes.

References: a p x q rectangle turned by t has the bounding box
(p cos t + q sin t) x (p sin t + q cos t) (rotation of its corners); a circle's is its
diameter at any turn; 1 in = 25.4 mm exactly (NIST SP 811, B.8).
"""

from __future__ import annotations

import math

import pytest

from generators.config.bed import parse_bed
from generators.config.load import parse_config
from generators.design import design
from generators.errors import UserError
from generators.plan.bed_fit import bed_fit, circle


def _rect(p, q):
    return [(-p / 2, -q / 2), (p / 2, -q / 2), (p / 2, q / 2), (-p / 2, q / 2)]


def test_bed_text_with_units():
    assert parse_bed("250 x 210 x 210 mm") == (250.0, 210.0, 210.0)
    assert parse_bed("10 x 8 x 8 in") == pytest.approx((254.0, 203.2, 203.2))
    assert parse_bed("25cm x 210mm x 0.21 m") == pytest.approx((250.0, 210.0, 210.0))
    with pytest.raises(ValueError):
        parse_bed("250 x 210")


def test_a_long_part_fits_only_on_the_diagonal():
    # 260 x 30 on 220 x 220: square it is 40 mm too long; at 45 deg (260 + 30) cos 45 = 205.1 mm each way
    fit = bed_fit("bar", _rect(260, 30), 10, (220, 220, 100))
    assert fit.fits
    w, d = fit.size_mm[:2]
    t = math.radians(fit.angle_deg)
    assert w == pytest.approx(260 * abs(math.cos(t)) + 30 * abs(math.sin(t)), abs=1e-6)
    assert max(w, d) <= 220 + 1e-9
    assert fit.square_mm == pytest.approx((260, 30))
    # 300 x 30: at best (300 + 30) cos 45 = 233.3 mm > 220 at 45 deg, and worse at any other turn
    assert not bed_fit("bar", _rect(300, 30), 10, (220, 220, 100)).fits


def test_height_and_circle():
    assert bed_fit("cap", circle(219), 50, (220, 220, 100)).fits
    assert not bed_fit("cap", circle(221), 50, (220, 220, 100)).fits  # a circle's width is its diameter
    assert not bed_fit("cap", circle(100), 101, (220, 220, 100)).fits


def _printed(bed: str) -> dict:
    return {"name": "print-bed-case", "units": "mm", "mast": {"size": "50 mm"},
            "hub": {"style": "puck", "diameter": 240, "thickness": 60, "material": "petg", "process": "printed"},
            "spreaders": {"count": 6, "diameter": 16}, "print": {"bed": bed}}


def test_printed_hub_larger_than_the_bed_refused_with_the_fixes():
    with pytest.raises(UserError) as exc:
        design(parse_config(_printed("220 x 220 x 250 mm")))
    e = exc.value
    assert e.key == "print.bed"
    assert "240 mm x 240 mm x 60 mm" in e.problem and "220 mm x 220 mm x 250 mm bed" in e.problem
    assert "split" in e.accepted and "smaller hub" in e.accepted and "another bed" in e.accepted


def test_the_same_hub_fits_a_larger_bed():
    d = design(parse_config(_printed("300 x 300 x 300 mm")))
    assert [f.part for f in d.bed_fits] == ["hub"] and d.bed_fits[0].fits
