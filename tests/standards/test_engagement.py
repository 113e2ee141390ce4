"""Thread engagement and tap depth (common practice figures, see engagement.py)."""

import pytest

from generators.errors import UserError
from generators.standards.engagement import engagement_mm, tap_depth_mm


def test_metal_and_plastic_engagement():
    assert engagement_mm("M6", "metal") == pytest.approx(9.0)          # 1.5 x 6
    assert engagement_mm("1/4-20", "metal") == pytest.approx(1.5 * 6.35)
    assert engagement_mm("M6", "plastic") == pytest.approx(15.0)       # 2.5 x 6


def test_tap_depth_adds_two_pitches():
    assert tap_depth_mm("M6", "metal") == pytest.approx(9.0 + 2 * 1.0)       # ISO 261 M6 P = 1
    assert tap_depth_mm("1/4-20", "metal") == pytest.approx(9.525 + 2 * 1.27)  # 20 tpi -> 1.27 mm


def test_unknown_class():
    with pytest.raises(UserError):
        engagement_mm("M6", "glass")
