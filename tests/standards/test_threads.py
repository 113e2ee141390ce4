"""Thread series, parsing and minor-diameter limits against published tables."""

import pytest
from hypothesis import given, strategies as st

from generators.errors import UserError
from generators.standards.threads import (all_threads, common_threads, iso_td1_formula_um, iso_td1_um,
                                          parse_thread)

IN = 25.4

# Class 2B minor diameter min / max, inches. From memory: ASME B1.1 / Machinery's Handbook
# "Standard Series Unified Screw Threads" internal-thread limits (tables round some to 3 places).
UNIFIED_2B = {
    "#0-80": (0.0465, 0.0514), "#1-64": (0.0561, 0.0623), "#2-56": (0.0667, 0.0737),
    "#4-40": (0.0849, 0.0939), "#6-32": (0.1042, 0.1140), "#8-32": (0.1302, 0.1389),
    "#10-24": (0.1449, 0.1555), "#10-32": (0.1562, 0.1640), "1/4-20": (0.1960, 0.2070),
    "5/16-18": (0.2520, 0.2650), "3/8-16": (0.3070, 0.3210), "3/8-24": (0.3300, 0.3400),
    "1/2-13": (0.4170, 0.4340), "1/2-20": (0.4460, 0.4570),
}

# Class 6H D1 min / max, mm. From memory: ISO 965-2 limits of sizes for internal threads.
METRIC_6H = {
    "M3": (2.459, 2.599), "M4": (3.242, 3.422), "M5": (4.134, 4.334), "M6": (4.917, 5.153),
    "M8": (6.647, 6.912), "M10": (8.376, 8.676), "M12": (10.106, 10.441), "M16": (13.835, 14.210),
    "M20": (17.294, 17.744), "M8x1": (6.917, 7.153), "M10x1.25": (8.647, 8.912),
    "M12x1.5": (10.376, 10.676),
}


@pytest.mark.parametrize("spec", UNIFIED_2B)
def test_unified_2b_minor_limits(spec):
    lo, hi = UNIFIED_2B[spec]  # ASME B1.1 2B table (from memory), 0.0006 in allows 3-place rounding
    t = parse_thread(spec)
    assert t.minor_min_mm / IN == pytest.approx(lo, abs=0.0006)
    assert t.minor_max_mm / IN == pytest.approx(hi, abs=0.0006)
    assert t.thread_class == "2B"


@pytest.mark.parametrize("spec", METRIC_6H)
def test_metric_6h_minor_limits(spec):
    lo, hi = METRIC_6H[spec]  # ISO 965-2 table (from memory)
    t = parse_thread(spec)
    assert t.minor_min_mm == pytest.approx(lo, abs=0.0006)
    assert t.minor_max_mm == pytest.approx(hi, abs=0.0006)
    assert t.thread_class == "6H"


@pytest.mark.parametrize("pitch,table_um", [(0.35, 100), (0.5, 140), (0.7, 180), (0.8, 200),
                                            (1.0, 236), (1.25, 265), (1.5, 300), (1.75, 335),
                                            (2.0, 375), (2.5, 450), (3.0, 500)])
def test_iso965_td1_formula_matches_rounded_table(pitch, table_um):
    # ISO 965-1: T_D1(6) = 433P - 190P^1.22 (P <= 0.8), 230P^0.7 (P >= 1); table rounded (from memory)
    assert iso_td1_um(pitch) == table_um
    assert iso_td1_formula_um(pitch) == pytest.approx(table_um, rel=0.05)


def test_numbered_sizes_follow_the_formula():
    # ASME B1.1: numbered size N has D = 0.060 + 0.013 N in
    for n, tpi in [(0, 80), (2, 56), (4, 40), (6, 32), (8, 32), (10, 24), (12, 24)]:
        t = parse_thread(f"#{n}-{tpi}")
        assert t.major_mm / IN == pytest.approx(0.060 + 0.013 * n)


def test_basic_minor_formula():
    # ASME B1.1 / ISO 68-1: D1 = D - 1.082532 P;  1/4-20 -> 0.1959 in, M6x1 -> 4.917 mm
    assert parse_thread("1/4-20").basic_minor_mm / IN == pytest.approx(0.19587, abs=1e-5)
    assert parse_thread("M6x1").basic_minor_mm == pytest.approx(4.917468, abs=1e-6)


@pytest.mark.parametrize("text,designation", [
    ("1/4-20", "1/4-20 UNC"), ("#10-24", "#10-24 UNC"), ("10-24", "#10-24 UNC"),
    ("10-32 UNF", "#10-32 UNF"), ("1/4-20 UNC-2B", "1/4-20 UNC"), ("1/4 UNC", "1/4-20 UNC"),
    ("1/4 UNF", "1/4-28 UNF"), ("M6", "M6x1"), ("M6x1", "M6x1"), ("M8x1", "M8x1"), ("M8", "M8x1.25"),
    ("m6 x 1.0", "M6x1"), ("M6x1-6H", "M6x1"), ("1-8", "1-8 UNC"), ("1-64", "#1-64 UNC"),
    ("#0", "#0-80 UNF"), ("0.250-28", "1/4-28 UNF"), ("11/16", "11/16-24 UNEF"),
])
def test_parse_forms(text, designation):
    # coarse pitch implied when none is given (ASME B1.1 UNC, ISO 261 coarse)
    assert parse_thread(text).designation == designation


@pytest.mark.parametrize("text,suggestions", [
    ("1/4-19", ["'1/4-20 UNC'", "'1/4-28 UNF'"]),
    ("M6x0.8", ["'M6x0.75'", "'M6x1'"]),     # ISO 261: M6 pitches 1 and 0.75 only
    ("M7x3", ["'M6x1'", "'M8x1.25'"]),
    ("#13-24", ["'#12-24 UNC'"]),             # ASME B1.1 numbered sizes stop at #12
])
def test_bad_designations_suggest(text, suggestions):
    with pytest.raises(UserError) as err:
        parse_thread(text, key="hub.set_screw")
    assert err.value.key == "hub.set_screw"
    assert "did you mean" in str(err.value)
    for s in suggestions:
        assert s in str(err.value)


@pytest.mark.parametrize("text", ["1/4-20 UNC-3B", "M6x1-5H", "", "bolt", "1/0-20"])
def test_unsupported_raise_user_error(text):
    with pytest.raises(UserError):
        parse_thread(text)


def test_round_trip_every_thread():
    threads = all_threads()
    assert len(threads) == len({t.designation for t in threads})
    for t in threads:
        assert parse_thread(t.designation) == t


def test_ranges_covered():
    names = {t.designation for t in all_threads()}
    # ISO 261 coarse M1.6..M24; ASME B1.1 #0..1 in
    for d in ["M1.6x0.35", "M2x0.4", "M20x2.5", "M24x3", "#0-80 UNF", "#12-32 UNEF", "1-8 UNC", "1-20 UNEF"]:
        assert d in names


def test_common_chart():
    chart = [t.designation for t in common_threads()]
    assert chart[0] == "#4-40 UNC" and "1/2-20 UNF" in chart
    assert {"M3x0.5", "M12x1.75", "M8x1", "M10x1.25", "M12x1.5"} <= set(chart)


def test_limits_ordered():
    for t in all_threads():
        assert t.basic_minor_mm == t.minor_min_mm < t.minor_max_mm < t.major_mm


@given(st.text(max_size=20))
def test_parse_never_crashes(text):
    try:
        t = parse_thread(text)
    except UserError:
        return
    assert t in all_threads()
