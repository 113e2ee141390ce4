"""Tap-drill choice against handbook tap-drill charts."""

import pytest

from generators.errors import UserError
from generators.standards.tapdrill import percent_thread, tap_drill, target_percent
from generators.standards.threads import all_threads, parse_thread

# Inch: shop tap-drill charts at 75 % (common practice, no published source).
# Metric: handbook tap-drill tables / ISO 2306 drill = D - P (from memory).
CHART = {"1/4-20": "#7", "#10-24": "#25", "#10-32": "#21", "8-32": "#29", "6-32": "#36",
         "4-40": "#43", "5/16-18": "F", "3/8-16": "5/16", "1/2-13": "27/64", "1/4-28": "#3",
         "M3": "2.5 mm", "M4": "3.3 mm", "M5": "4.2 mm", "M6x1": "5.0 mm", "M8": "6.8 mm",
         "M10": "8.5 mm", "M12": "10.2 mm"}


@pytest.mark.parametrize("spec", CHART)
def test_chart_drills_in_metal(spec):
    td = tap_drill(parse_thread(spec), "metal")
    assert td.drill.name == CHART[spec]
    assert td.within_limits and td.note is None


def test_percent_formula():
    # Machinery's Handbook (from memory): % = (D - drill) x TPI / 0.01299; 1/4-20 with #7 -> 75.4 %
    assert percent_thread(parse_thread("1/4-20"), 0.201 * 25.4) == pytest.approx(75.44, abs=0.01)
    # drill = D - P gives 100/1.299 = 77.0 % (M6 with 5.0 mm)
    assert percent_thread(parse_thread("M6"), 5.0) == pytest.approx(76.98, abs=0.01)


def test_targets():
    assert target_percent("metal") == 75.0
    assert target_percent("plastic") < target_percent("metal")
    with pytest.raises(UserError):
        target_percent("cheese")


def test_plastic_takes_a_larger_drill():
    t = parse_thread("1/4-20")
    assert tap_drill(t, "plastic").drill.diameter_mm > tap_drill(t, "metal").drill.diameter_mm


def test_every_thread_inside_limits_or_explained():
    for t in all_threads():
        for material in ("metal", "plastic"):
            td = tap_drill(t, material)
            d = td.drill.diameter_mm
            inside = t.minor_min_mm - 1e-6 <= d <= t.minor_max_mm + 1e-6
            assert inside == td.within_limits
            if not inside:
                assert td.note and "nearest is" in td.note and td.drill.name in td.note


def test_no_drill_fits_case():
    # 9/16-18 2B max minor 0.5150 in (ASME B1.1 formula); nearest inch drill 33/64 = 0.5156 in
    td = tap_drill(parse_thread("9/16-18"))
    assert not td.within_limits and td.drill.name == "33/64"
    assert tap_drill(parse_thread("9/16-18"), series=["metric"]).within_limits
