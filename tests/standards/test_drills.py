"""Twist-drill series against decimal-equivalent tables."""

import pytest

from generators.errors import UserError
from generators.standards.drills import SERIES, default_series, drills, find_drill
from generators.standards.threads import parse_thread

# From memory: ASME B94.11M twist drill decimal equivalents (number and letter sizes), inches.
DECIMAL = {"#1": 0.2280, "#7": 0.2010, "#21": 0.1590, "#25": 0.1495, "#29": 0.1360, "#36": 0.1065,
           "#43": 0.0890, "#80": 0.0135, "A": 0.234, "F": 0.257, "Q": 0.332, "Z": 0.413}


@pytest.mark.parametrize("name", DECIMAL)
def test_decimal_sizes(name):
    assert find_drill(name).diameter_in == pytest.approx(DECIMAL[name], abs=1e-6)


def test_series_counts():
    assert len(drills(["number"])) == 80     # #1-#80
    assert len(drills(["letter"])) == 26     # A-Z
    assert len(drills(["fractional"])) == 64  # 1/64..1 in by 64ths
    metric = drills(["metric"])
    assert metric[0].name == "0.3 mm" and metric[-1].name == "32.0 mm"
    assert find_drill("12.9 mm").diameter_mm == 12.9 and find_drill("13.5 mm").diameter_mm == 13.5
    with pytest.raises(UserError):
        find_drill("13.1 mm")  # 0.5 mm steps above 13 mm


def test_number_drills_shrink_with_number():
    nums = [find_drill(f"#{n}").diameter_mm for n in range(1, 81)]
    assert nums == sorted(nums, reverse=True)


def test_labels():
    assert find_drill("#7").label() == "#7 (0.2010 in)"
    assert find_drill("F").label() == "F (0.2570 in)"
    assert find_drill("13/64").label() == "13/64 (0.2031 in)"  # 13/64 = 0.203125
    assert find_drill("5mm").label() == "5.0 mm"
    assert find_drill("7").name == "#7"


def test_sorted_and_unknown_series():
    all_ = drills(SERIES)
    assert [d.diameter_mm for d in all_] == sorted(d.diameter_mm for d in all_)
    with pytest.raises(UserError) as err:
        drills(["numbr"])
    assert err.value.key == "shop.drills" and "number" in str(err.value)


def test_default_series():
    assert default_series(parse_thread("1/4-20")) == ("fractional", "number", "letter")
    assert default_series(parse_thread("M6")) == ("metric",)
