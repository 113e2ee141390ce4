"""Parse lengths, angles and speeds from config values; format them for shop people.

Inside hubwright everything is millimetres, degrees and metres per second. A config
value is either a bare number in the file's declared ``units`` or a string carrying
its own unit (``"38 mm"``, ``"1-1/2 in"``, ``"1 1/4\\""``, ``"2.4 m"``, ``"7 ft"``,
``"12 deg"``, ``"90 mph"``).

The accepted units are a small closed set whose factors are exact by definition
(NIST SP 811, appendix B), so they live in one table here; importing a general units
library costs 0.3 s at every start of ``check``. The tests check every factor against
pint, the general-purpose reference.
"""

from __future__ import annotations

import math
import re
from fractions import Fraction

from generators.errors import UserError

MM_PER_IN = 25.4  # exact by definition (international inch, 1959)

LENGTH_UNITS = ("mm", "cm", "m", "in", '"', "ft")
ANGLE_UNITS = ("deg", "rad")
SPEED_UNITS = ("m/s", "km/h", "mph", "kn")

_ALIASES = {
    '"': "inch", "in": "inch", "inch": "inch", "inches": "inch", "''": "inch",
    "'": "foot", "ft": "foot", "foot": "foot", "feet": "foot",
    "mm": "millimeter", "cm": "centimeter", "m": "meter",
    "deg": "degree", "degree": "degree", "degrees": "degree", "°": "degree",
    "rad": "radian", "m/s": "meter/second", "km/h": "kilometer/hour",
    "kph": "kilometer/hour", "mph": "mile/hour", "kn": "knot", "kt": "knot", "knots": "knot",
}

# A number: integer, decimal, fraction, or mixed number ("1-1/2", "1 1/4").
_NUMBER = r"[+-]?(?:\d+(?:[ -]\d+/\d+)|\d+/\d+|\d*\.\d+|\d+\.?)(?:[eE][+-]?\d+)?"
_QUANTITY = re.compile(rf"^\s*(?P<num>{_NUMBER})\s*(?P<unit>[^\d\s].*?)?\s*$")


# Factors to the base unit of each kind (millimetre, degree, metre per second).
_FACTORS = {
    "millimeter": 1.0, "centimeter": 10.0, "meter": 1000.0,
    "inch": MM_PER_IN, "foot": 12 * MM_PER_IN,           # international inch and foot, exact
    "degree": 1.0, "radian": 180.0 / math.pi,
    "meter/second": 1.0, "kilometer/hour": 1000.0 / 3600.0,
    "mile/hour": 5280 * 12 * MM_PER_IN / 1000.0 / 3600.0,  # 0.44704 m/s exact
    "knot": 1852.0 / 3600.0,                               # international knot, exact
}


def parse_number(text: str) -> float:
    """Parse ``"1-1/2"``, ``"1 1/4"``, ``"3/8"``, ``"2.5"`` to a float."""
    text = text.strip()
    m = re.fullmatch(r"([+-]?)(\d+)[ -](\d+)/(\d+)", text)
    if m:
        sign = -1 if m.group(1) == "-" else 1
        return sign * float(int(m.group(2)) + Fraction(int(m.group(3)), int(m.group(4))))
    if "/" in text:
        return float(Fraction(text))
    return float(text)


def _split(text: str) -> tuple[float, str | None]:
    m = _QUANTITY.match(text)
    if not m:
        raise ValueError(text)
    number = parse_number(m.group("num"))
    unit = m.group("unit")
    return number, (unit.strip() if unit else None)


def _convert(value: float, unit: str, target: str) -> float:
    name = _ALIASES.get(unit, _ALIASES.get(unit.lower(), unit))
    if name not in _FACTORS:
        raise ValueError(unit)
    return value * _FACTORS[name] / _FACTORS[target]


# The largest magnitude accepted in the base unit of each kind: 1 km, two turns, 1 km/s.
# Anything beyond is a typing slip, and stating the limit up front keeps every later
# product finite.
LIMITS = {"millimeter": 1e6, "degree": 720.0, "meter/second": 1000.0}
SMALLEST_MM = 0.001  # below a micrometre a length is a typing slip, and products underflow
LIMIT_TEXT = {"millimeter": "at most 1 km", "degree": "from -720 to 720 deg", "meter/second": "at most 1000 m/s"}


def _a(kind: str) -> str:
    return ("an " if kind[0] in "aeiou" else "a ") + kind


def _quantity(value, key: str, default_unit: str | None, allowed: tuple[str, ...],
              target: str, kind: str, example: str) -> float:
    number = _quantity_raw(value, key, default_unit, allowed, target, kind, example)
    if abs(number) > LIMITS[target]:
        raise UserError(key, f"{value!r} is too large for {_a(kind)}", LIMIT_TEXT[target])
    if target == "millimeter" and 0 < abs(number) < SMALLEST_MM:
        raise UserError(key, f"{value!r} is too small for a length", "0, or at least 0.001 mm")
    return number


def _quantity_raw(value, key: str, default_unit: str | None, allowed: tuple[str, ...],
                  target: str, kind: str, example: str) -> float:
    accepted = f"a number in the file's units or a string like {example}; units {', '.join(allowed)}"
    if isinstance(value, bool):
        raise UserError(key, f"expected {_a(kind)}, got {value!r}", accepted)
    if isinstance(value, (int, float)):
        try:
            number, unit = float(value), default_unit
        except OverflowError:
            raise UserError(key, f"{value!r} is too large for {_a(kind)}", LIMIT_TEXT[target]) from None
    elif isinstance(value, str):
        try:
            number, unit = _split(value)
        except OverflowError:
            raise UserError(key, f"{value!r} is too large for {_a(kind)}", LIMIT_TEXT[target]) from None
        except (ValueError, ZeroDivisionError):
            raise UserError(key, f"cannot read {value!r} as {_a(kind)}", accepted) from None
        if unit is None and "/" in value and default_unit in ("mm", "millimeter"):
            # a shop fraction is an inch size; "1-1/4" meaning 1.25 mm is a slip
            raise UserError(key, f"{value!r} is a fraction with no unit in a millimetre file",
                            f"a unit with it, such as '{value.strip()} in', or a number of mm")
        unit = unit or default_unit
    else:
        raise UserError(key, f"expected {_a(kind)}, got {type(value).__name__}", accepted)
    if not math.isfinite(number):
        raise UserError(key, f"{value!r} is not a finite number", accepted)
    if unit is None:
        raise UserError(key, f"{value!r} has no unit", accepted)
    if _ALIASES.get(unit, _ALIASES.get(unit.lower())) not in {_ALIASES[a] for a in allowed}:
        raise UserError(key, f"unknown or wrong kind of unit {unit!r} for {_a(kind)}", accepted)
    if unit == target or _ALIASES.get(unit) == _ALIASES.get(target, target):
        return number
    if target == "millimeter" and unit in ("in", '"', "inch"):
        return number * MM_PER_IN  # the common case
    try:
        return _convert(number, unit, target)
    except ValueError:
        raise UserError(key, f"unknown or wrong kind of unit {unit!r} for {_a(kind)}", accepted) from None


def length_mm(value, key: str, units: str = "mm") -> float:
    """A length in millimetres from a config value (bare numbers are in ``units``)."""
    return _quantity(value, key, units, LENGTH_UNITS, "millimeter", "length",
                     '"38 mm", "1-1/2 in", "1 1/4\\"", "2.4 m", "7 ft"')


def angle_deg(value, key: str) -> float:
    """An angle in degrees (bare numbers are degrees)."""
    return _quantity(value, key, "deg", ANGLE_UNITS, "degree", "angle", '"12 deg"')


def azimuth_deg(value, key: str) -> float:
    """An azimuth in degrees, reduced to [0, 360) exactly (decimal arithmetic, no float drift)."""
    from decimal import Decimal, InvalidOperation

    deg = angle_deg(value, key)
    text = str(value).strip()
    for suffix in ("degrees", "degree", "deg", "°"):
        if text.endswith(suffix):
            text = text[: -len(suffix)].strip()
            break
    try:
        exact = Decimal(text) if not isinstance(value, float) else Decimal(repr(value))
    except InvalidOperation:  # a fraction or radians: float arithmetic is all there is
        return deg % 360.0
    if not exact.is_finite():
        return deg % 360.0
    return float(exact % 360 + (360 if exact % 360 < 0 else 0))


def speed_m_s(value, key: str) -> float:
    """A speed in metres per second (bare numbers are m/s)."""
    return _quantity(value, key, "m/s", SPEED_UNITS, "meter/second", "speed",
                     '"40 m/s", "90 mph", "140 km/h"')


def _fraction_text(inches: float, denominator: int = 64) -> str | None:
    frac = Fraction(inches).limit_denominator(denominator)
    # within 0.0006 mm: a fraction read back from the manifest's mm to 0.001 mm is still that fraction
    if abs(float(frac) - inches) > 2.5e-5 or frac.denominator & (frac.denominator - 1):
        return None  # shop fractions have power-of-two denominators
    whole, rest = divmod(frac, 1)
    if rest == 0:
        return f"{int(whole)}"
    if whole == 0:
        return f"{rest.numerator}/{rest.denominator}"
    return f"{int(whole)}-{rest.numerator}/{rest.denominator}"


def format_length(mm: float, units: str = "mm", fractions: bool = True) -> str:
    """Show a length as a shop person writes it: ``"38.1 mm"``, ``"1-1/2 in"``, ``"0.201 in"``."""
    mm = 0.0 if abs(mm) < 5e-4 else mm  # no "-0 mm" from rounding noise
    if units == "in":
        inches = round(mm / MM_PER_IN, 9)  # 4.7625 mm is 0.1875 in, not 0.18749999...
        text = _fraction_text(inches) if fractions else None
        if text is None:
            text = f"{inches:.3f}"
        return f"{text.replace('-0.000', '0.000')} in"
    text = f"{mm:.2f}".rstrip("0").rstrip(".")
    return f"{'0' if text == '-0' else text} mm"


def format_both(mm: float, units: str = "mm") -> str:
    """Length in the config's units with the other system in brackets."""
    mm = 0.0 if abs(mm) < 5e-4 else mm
    if units == "in":
        return f"{format_length(mm, 'in')} ({mm:.2f} mm)".replace("(-0.00 mm)", "(0.00 mm)")
    return f"{format_length(mm, 'mm')} ({mm / MM_PER_IN:.3f} in)".replace("(-0.000 in)", "(0.000 in)")


# Loads in the user's units; exact by definition: 1 lbf = 4.4482216152605 N, 1 ft = 0.3048 m,
# 1 in = 0.0254 m (NIST SP 811).
LBF_N = 4.4482216152605
FT_M = 0.3048


def format_force(n: float, units: str = "mm", digits: int = 0) -> str:
    """``272 N``; in an inch config ``61.2 lbf (272 N)``."""
    si = f"{n:.{digits}f} N"
    return f"{n / LBF_N:.1f} lbf ({si})" if units == "in" else si


def format_moment(nm: float, units: str = "mm", digits: int = 1) -> str:
    """``237.7 N m``; in an inch config ``175.3 ft-lbf (237.7 N m)``."""
    si = f"{nm:.{digits}f} N m"
    return f"{nm / (LBF_N * FT_M):.1f} ft-lbf ({si})" if units == "in" else si


def format_pressure(pa: float, units: str = "mm") -> str:
    """A wind pressure: ``783 Pa``; in an inch config ``16.4 psf (783 Pa)``."""
    psf = pa * FT_M ** 2 / LBF_N
    return f"{psf:.1f} psf ({pa:.0f} Pa)" if units == "in" else f"{pa:.0f} Pa"


def format_stress(mpa: float, units: str = "mm", digits: int = 0) -> str:
    """A stress: ``130 MPa``; in an inch config ``18.9 ksi (130 MPa)``."""
    ksi = mpa * 1e6 * 0.0254 ** 2 / LBF_N / 1000.0
    si = f"{mpa:.{digits}f} MPa"
    return (f"{ksi:.2f} ksi ({si})" if ksi < 10 else f"{ksi:.1f} ksi ({si})") if units == "in" else si
