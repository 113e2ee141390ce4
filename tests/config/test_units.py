"""Unit strings → millimetres, degrees, m/s. Conversion factors are exact definitions
(international inch = 25.4 mm, foot = 12 in, mile = 5280 ft, NIST SP 811 appendix B)."""

import math

import pytest
from hypothesis import given, settings, strategies as st

from generators.errors import UserError
from generators.units import angle_deg, format_length, length_mm, parse_number, speed_m_s


@pytest.mark.parametrize("text, mm", [
    ("38 mm", 38.0),
    ("1.5 in", 38.1),            # 1.5 x 25.4, exact (NIST SP 811)
    ("1-1/2 in", 38.1),
    ('1 1/4"', 31.75),
    ("2.4 m", 2400.0),
    ("7 ft", 2133.6),            # 7 x 304.8 mm, exact
    ("3/8 in", 9.525),
    ("12.5 cm", 125.0),
])
def test_length_strings(text, mm):
    assert length_mm(text, "k") == pytest.approx(mm, abs=1e-9)


def test_bare_numbers_use_the_file_units():
    assert length_mm(2, "k", "in") == pytest.approx(50.8)
    assert length_mm(2, "k", "mm") == 2.0


def test_angles_and_speeds():
    assert angle_deg("12 deg", "a") == pytest.approx(12.0)
    assert angle_deg(f"{math.pi / 6} rad", "a") == pytest.approx(30.0)
    assert speed_m_s("90 mph", "s") == pytest.approx(40.2336)     # 1 mph = 0.44704 m/s exact (NIST SP 811)
    assert speed_m_s("140 km/h", "s") == pytest.approx(140 / 3.6)
    assert speed_m_s("40 m/s", "s") == 40.0


@pytest.mark.parametrize("bad", ["12 parsecs", "12 deg", "abc", "", "1//2 in", True, [1], "nan mm"])
def test_bad_lengths_name_the_key(bad):
    with pytest.raises(UserError) as exc:
        length_mm(bad, "mast.size")
    assert exc.value.key == "mast.size"
    assert "\n" not in exc.value.line()


def test_speed_rejects_a_length():
    with pytest.raises(UserError, match="loads.wind_speed"):
        speed_m_s("3 mm", "loads.wind_speed")


def test_mixed_numbers():
    assert parse_number("1-1/4") == 1.25
    assert parse_number("1 1/4") == 1.25
    assert parse_number("3/8") == 0.375


@settings(max_examples=200, deadline=None)
@given(st.integers(min_value=0, max_value=40), st.sampled_from([2, 4, 8, 16, 32, 64]),
       st.integers(min_value=0, max_value=63))
def test_inch_fractions_round_trip(whole, den, num):
    """format_length in inches writes shop fractions that length_mm reads back exactly."""
    num = num % den
    inches = whole + num / den
    if inches == 0:
        return
    text = format_length(inches * 25.4, "in")
    assert length_mm(text, "k") == pytest.approx(inches * 25.4, abs=1e-9)


@settings(max_examples=200, deadline=None)
@given(st.floats(min_value=0.01, max_value=5000, allow_nan=False), st.sampled_from(["mm", "in"]))
def test_formatted_lengths_round_trip(mm, units):
    """Every length the tool prints reads back within its printed precision."""
    text = format_length(mm, units, fractions=False)
    back = length_mm(text, "k")
    tol = 0.005 if units == "mm" else 0.0005 * 25.4
    assert back == pytest.approx(mm, abs=tol + 1e-9)


@pytest.mark.parametrize("text, kind, target", [
    ("1 in", "length", "millimeter"), ("1 ft", "length", "millimeter"), ("1 m", "length", "millimeter"),
    ("1 cm", "length", "millimeter"), ("1 rad", "angle", "degree"), ("1 mph", "speed", "meter/second"),
    ("1 km/h", "speed", "meter/second"), ("1 kn", "speed", "meter/second"),
])
def test_factors_agree_with_pint(text, kind, target):
    """Every unit factor against pint, the general-purpose units library, as reference."""
    pint = pytest.importorskip("pint")
    from generators.units import _ALIASES

    reg = pint.UnitRegistry()
    number, unit = text.split(" ", 1)
    ours = {"length": length_mm, "angle": angle_deg, "speed": speed_m_s}[kind](text, "k")
    ref = reg.Quantity(float(number), _ALIASES[unit]).to(target).magnitude
    assert ours == pytest.approx(ref, rel=1e-12)


def test_load_units_in_an_inch_config_follow_nist_sp_811():
    """1 lbf = 4.4482216152605 N, 1 ft-lbf = 1.3558179 N m, 1 psf = 47.880259 Pa,
    1 ksi = 6.8947573 MPa (NIST SP 811, appendix B.8)."""
    from generators.units import format_force, format_moment, format_pressure, format_stress

    assert format_force(4.4482216152605 * 100, "in") == "100.0 lbf (445 N)"
    assert format_force(445.0, "mm") == "445 N"
    assert format_moment(1.3558179 * 50, "in") == "50.0 ft-lbf (67.8 N m)"
    assert format_pressure(47.880259 * 20, "in") == "20.0 psf (958 Pa)"
    assert format_stress(6.8947573 * 30, "in") == "30.0 ksi (207 MPa)"
    assert format_stress(207.0, "mm") == "207 MPa"


@pytest.mark.parametrize("text, newtons", [("50 N", 50.0), ("0.2 kN", 200.0), ("10 lbf", 44.482216152605), (25, 25.0)])
def test_wire_tension_takes_a_force_with_its_unit(text, newtons):
    """lbf by NIST SP 811; a bare number is N."""
    from generators.config.load import parse_config

    from tests.reducers.helpers import BASE

    data = {**BASE, "loads": {"wire_tension": text}}
    assert parse_config(data).loads.wire_tension == pytest.approx(newtons)


def test_a_force_in_kilograms_is_refused_naming_the_key():
    from generators.config.load import parse_config
    from generators.errors import UserError

    from tests.reducers.helpers import BASE

    with pytest.raises(UserError) as e:
        parse_config({**BASE, "loads": {"wire_tension": "5 kg"}})
    assert e.value.key == "loads.wire_tension" and "lbf" in str(e.value)


@pytest.mark.parametrize("section, text, problem", [
    ("mast_clamp", 'azimuths = "45, 135"', "is not a list"),
    ("mast_clamp", "torque = nan", "nan is not a number"),
    ("mast_clamp", "azimuths = [45, 405]", "45 deg is given twice"),
    ("loads", "wire_tension = inf", "not a finite number"),
])
def test_malformed_values_get_one_line_naming_the_key(tmp_path, section, text, problem):
    """TOML reads nan and inf as floats (TOML 1.0 spec); they are refused as numbers, not as ranges."""
    import tomllib

    from generators.config.load import parse_config
    from generators.errors import UserError

    from tests.reducers.helpers import BASE

    data = {**BASE, **tomllib.loads(f"[{section}]\nthread = \"M5\"\n{text}\n" if section == "mast_clamp"
                                    else f"[{section}]\n{text}\n")}
    with pytest.raises(UserError) as e:
        parse_config(data)
    assert e.value.key == f"{section}.{text.split(' =')[0]}" and problem in str(e.value)


@pytest.mark.parametrize("text", ["1-1/4", "3/8", "1 1/2"])
def test_a_bare_fraction_in_a_millimetre_file_is_refused(text):
    """Shop fractions are inch sizes (ASME B1.1 and drill charts give them in inches); read in a
    millimetre file they would make a 1.25 mm part, so they need their unit there."""
    with pytest.raises(UserError) as e:
        length_mm(text, "hub.thickness", "mm")
    assert e.value.line().startswith("hub.thickness") or "hub.thickness" in e.value.line()
    assert "in" in str(e.value.line())
    assert length_mm(text + " in", "hub.thickness", "mm") == pytest.approx(parse_number(text) * 25.4)
    assert length_mm(text, "hub.thickness", "in") == pytest.approx(parse_number(text) * 25.4)
