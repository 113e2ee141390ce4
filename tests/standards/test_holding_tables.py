"""The holding tables (standards/holding.py, data/*.csv) against the published figures they
name (from memory of the tables, as the CSV source column says)."""

import math

import pytest

from generators.standards import holding


def test_set_screw_point_rows():
    # ISO 4026 flat point dp max: M8 5.5 mm, M10 7.0 mm; ISO 4029 cup point dz max: M8 5.0 mm
    assert holding.point_contact_mm2("M8", "flat")[0] == pytest.approx(math.pi / 4 * 5.5 ** 2)
    assert holding.point_contact_mm2("M10", "dog")[0] == pytest.approx(math.pi / 4 * 7.0 ** 2)
    assert holding.point_contact_mm2("M8", "cup")[0] == pytest.approx(math.pi * 5.0 * 0.5)
    # ASME B18.3: 1/4 in cup and flat point diameter C max 0.132 in
    assert holding.point_contact_mm2("1/4-20", "flat")[0] == pytest.approx(math.pi / 4 * (0.132 * 25.4) ** 2, rel=2e-3)


def test_seating_torque_rows():
    # catalogue seating torque of a 1/4 in socket set screw, 87 in-lbf = 9.83 N m (1 lbf = 4.4482216152605 N)
    assert holding.default_torque_nm("1/4-20", "metal")[0] == pytest.approx(87 * 0.0254 * 4.4482216152605, abs=0.05)
    # #10: 36 in-lbf = 4.07 N m
    assert holding.default_torque_nm("10-24", "metal")[0] == pytest.approx(36 * 0.0254 * 4.4482216152605, abs=0.1)
    # a plastic hub takes a third (common practice)
    assert holding.default_torque_nm("M6", "plastic")[0] < holding.default_torque_nm("M6", "metal")[0] / 3 + 0.1


def test_sizes_outside_the_table_scale_from_the_nearest():
    # M16 from M12 by (16/12)^3 (common practice: same thread stress)
    assert holding.default_torque_nm("M16", "metal")[0] == pytest.approx(50 * (16 / 12) ** 3)
    assert holding.point_contact_mm2("M16", "flat")[0] == pytest.approx(math.pi / 4 * (8.5 * 16 / 12) ** 2)


def test_friction_and_transverse_strength_have_sources():
    mu, src = holding.friction("plastic")
    assert 0.1 <= mu <= 0.3 and "Machinery's Handbook" in src
    s, src = holding.transverse_strength_mpa("fiberglass")
    assert s < 207 and "from memory" in src  # across the fibres far below the lengthwise strength
