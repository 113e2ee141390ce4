"""nut-bearing: a captive nut pulled into its printed pocket by a tightened screw.

Hand figures: F = T / (K d) with K = 0.2 (Shigley table 8-15, from memory); the nut face is
the hexagon (sqrt 3 / 2) s^2 (plane geometry) with s from ISO 4032 (M5 8 mm, M6 10 mm) less
the ISO 273 medium clearance hole (M5 5.5 mm, M6 6.6 mm); PETG 12 MPa bearing allowable and
45 MPa yield from the materials table (filament datasheets, from memory).
"""

from __future__ import annotations

import math

import pytest

from generators.config.load import parse_config
from generators.design import design
from tests.checks.helpers import ROOT, demo

PRINTED = ROOT / "configs" / "six-spreader-printed.toml"


def _rule(data):
    return next(r for r in design(parse_config(data)).checks.rules if r.id == "nut-bearing")


def test_printed_demo_clamp_nut_by_hand():
    r = _rule(demo(PRINTED))
    # the clamp at 0.75 N m governs: 0.75 / (0.2 x 0.006) = 625 N on 86.60 - 34.21 mm2
    area = math.sqrt(3) / 2 * 10 ** 2 - math.pi / 4 * 6.6 ** 2
    assert r.value == pytest.approx(625.0 / area, rel=1e-3)
    assert r.status == "pass" and r.limit == pytest.approx(12.0)


@pytest.mark.parametrize("torque, status", [(2.0, "warn"), (6.0, "fail")])
def test_a_heavy_torque_warns_then_fails(torque, status):
    data = demo(PRINTED)
    data["mast_clamp"]["torque"] = torque
    r = _rule(data)
    area = math.sqrt(3) / 2 * 10 ** 2 - math.pi / 4 * 6.6 ** 2
    stress = torque / (0.2 * 0.006) / area   # 2 N m: 31.8 MPa, over 12; 6 N m: 95 MPa, over 45
    assert r.value == pytest.approx(stress, rel=1e-3) and r.status == status
    assert "mast_clamp.torque" in r.message


def test_machined_hubs_have_no_captive_nuts():
    r = _rule(demo(ROOT / "configs" / "six-spreader-portable.toml"))
    assert r.status == "pass" and r.value is None and "not applicable" in r.message
