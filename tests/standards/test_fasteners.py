"""Clearance holes, countersinks, counterbores, nuts, set screws against the standards' tables."""

import pytest

from generators.errors import UserError
from generators.standards.fasteners import (clearance_hole, clearance_holes, counterbore, countersink,
                                            hex_nut, set_screw_lengths)

IN = 25.4

# ISO 273 fine / medium / coarse (from memory)
ISO273 = {"M3": (3.2, 3.4, 3.6), "M4": (4.3, 4.5, 4.8), "M5": (5.3, 5.5, 5.8), "M6": (6.4, 6.6, 7.0),
          "M8": (8.4, 9.0, 10.0), "M10": (10.5, 11.0, 12.0), "M12": (13.0, 13.5, 14.5)}


@pytest.mark.parametrize("size", ISO273)
def test_iso273(size):
    holes = clearance_holes(size)
    assert (holes["close"], holes["normal"], holes["loose"]) == ISO273[size]


def test_iso273_fine_pitch_same_as_coarse():
    assert clearance_holes("M8x1") == clearance_holes("M8")  # ISO 273 depends on D only


def test_inch_clearance():
    # ASME B18.2.8 table 1a: 1/4 close 17/64, normal 9/32; 1/2 loose 39/64 (full table: test_inch_clearance.py)
    assert clearance_hole("1/4-20", "close") == pytest.approx(0.266 * IN)
    assert clearance_hole("1/4-20", "normal") == pytest.approx(0.281 * IN)
    assert clearance_holes("1/2-13")["loose"] == pytest.approx(0.609 * IN)
    with pytest.raises(UserError) as err:
        clearance_hole("1/4-20", "snug")
    assert err.value.key == "fit"


def test_clearance_order_all_sizes():
    from generators.standards.threads import all_threads
    for t in all_threads():
        h = clearance_holes(t)
        assert t.major_mm < h["close"] < h["normal"] < h["loose"]


def test_iso4032_m6():
    nut = hex_nut("M6")  # ISO 4032 M6: s = 10, e min = 11.05, m max = 5.2
    assert (nut.across_flats_mm, nut.across_corners_mm, nut.height_mm) == (10.0, 11.05, 5.2)
    assert hex_nut("M8").across_flats_mm == 13.0  # ISO 4032 M8 s = 13
    assert hex_nut("M10").height_mm == 8.4        # ISO 4032 M10 m max = 8.4


def test_asme_b18_2_2_quarter_nut():
    nut = hex_nut("1/4-20")  # ASME B18.2.2: 1/4 hex nut 7/16 AF, 7/32 thick
    assert nut.across_flats_mm == pytest.approx(7 / 16 * IN)
    assert nut.height_mm == pytest.approx(7 / 32 * IN)
    assert hex_nut("1/2-13").across_flats_mm == pytest.approx(0.75 * IN)  # 1/2 nut 3/4 AF


def test_countersinks():
    assert countersink("1/4-20").angle_deg == 82  # ASME B18.6.3 flat head
    assert countersink("M6").angle_deg == 90      # ISO 10642
    assert countersink("M6").head_diameter_mm == 13.44  # ISO 10642 M6 dk theoretical max (from memory)
    with pytest.raises(UserError):
        countersink("M24")


def test_counterbore_clears_head():
    cb = counterbore("M6")  # ISO 4762 M6 head 10 mm dia x 6 mm (from memory)
    assert cb.diameter_mm > 10.0 and cb.depth_mm > 6.0
    assert counterbore("1/4-20").diameter_mm > 0.375 * IN  # ASME B18.3 1/4 head 0.375 in


def test_set_screw_lengths():
    assert set_screw_lengths("M6")[0] == 6 and 10 in set_screw_lengths("M6")  # ISO 4026/4029 range
    lengths = set_screw_lengths("1/4-20")
    assert lengths == sorted(lengths) and pytest.approx(0.25 * IN) in lengths


@pytest.mark.parametrize("size, drill_in", [
    ("#4-40", 0.1285), ("#6-32", 0.1695), ("#8-32", 0.196), ("#10-24", 0.221),
    ("1/4-20", 0.281), ("5/16-18", 0.344), ("3/8-16", 0.406), ("7/16-14", 0.469),
])
def test_inch_normal_fit_matches_b18_2_8_table_1a(size, drill_in):
    # ASME B18.2.8-1999 table 1a, normal fit drills #30, #18, #9, #2, 9/32, 11/32, 13/32, 15/32
    # (as reprinted in Machinery's Handbook 31st ed., p. 1741)
    assert clearance_hole(size, "normal") == pytest.approx(drill_in * IN, abs=1e-6)
