"""Annotated field types that turn config values with units into mm, degrees and m/s.

A bare number is read in the file's declared ``units`` (passed to pydantic as
validation context); a string may carry its own unit.
"""

from __future__ import annotations

from typing import Annotated

from pydantic import BeforeValidator, ValidationInfo

from generators import units as u
from generators.errors import UserError


def _units(info: ValidationInfo) -> str:
    return (info.context or {}).get("units", "mm")


def _wrap(func, kind: str | None = None):
    def validator(value, info: ValidationInfo):
        try:
            return func(value, info)
        except UserError as exc:
            text = exc.problem + (f" ({exc.accepted})" if exc.accepted else "")
            raise ValueError(text) from None

    validator.kind = kind  # read back by the loader to state limits in the file's units
    return validator


def _length(value, info):
    return u.length_mm(value, info.field_name or "", _units(info))


def _angle(value, info):
    return u.angle_deg(value, info.field_name or "")


def _azimuth(value, info):
    return u.azimuth_deg(value, info.field_name or "")


def _speed(value, info):
    return u.speed_m_s(value, info.field_name or "")


# Torque units, exact by definition: 1 lbf = 4.4482216152605 N (NIST SP 811), 1 in = 0.0254 m.
_TORQUE = {"n m": 1.0, "nm": 1.0, "n.m": 1.0, "in-lbf": 0.0254 * 4.4482216152605,
           "in lbf": 0.0254 * 4.4482216152605, "ft-lbf": 0.3048 * 4.4482216152605,
           "ft lbf": 0.3048 * 4.4482216152605}


def _with_unit(value, info, table: dict[str, float], what: str, accepted: str) -> float:
    """A bare number (already in SI) or "<number> <unit>" with the unit in ``table``."""
    if isinstance(value, (int, float)) and not isinstance(value, bool):
        return float(value)
    import re

    m = re.fullmatch(r"\s*([-+]?[0-9]*\.?[0-9]+)\s*([A-Za-z .-]+)\s*", str(value))
    unit = m and m[2].strip().lower()
    if not m or unit not in table:
        raise UserError(info.field_name or what, f"{value!r} is not a {what}", accepted)
    return float(m[1]) * table[unit]


def _torque(value, info):
    """A torque in N m: a bare number is N m; a string may say "N m", "in-lbf" or "ft-lbf"."""
    return _with_unit(value, info, _TORQUE, "torque", 'a number in N m, or "3 N m", "25 in-lbf", "2 ft-lbf"')


# Force units, exact by definition: 1 lbf = 4.4482216152605 N (NIST SP 811).
_FORCE = {"n": 1.0, "kn": 1000.0, "lbf": 4.4482216152605, "lb": 4.4482216152605}


def _force(value, info):
    """A force in N: a bare number is N; a string may say "N", "kN" or "lbf"."""
    return _with_unit(value, info, _FORCE, "force", 'a number in N, or "50 N", "0.2 kN", "11 lbf"')


# Mass units, exact by definition: 1 lb = 453.59237 g, 1 oz = 1/16 lb (NIST SP 811).
_MASS = {"g": 1.0, "kg": 1000.0, "lb": 453.59237, "lbs": 453.59237, "oz": 28.349523125}


def _mass(value, info):
    """A mass in grams: a bare number is grams; a string may say "g", "kg", "lb" or "oz"."""
    return _with_unit(value, info, _MASS, "mass", 'a number of grams, or "800 g", "1.2 kg", "2.5 lb"')


Length = Annotated[float, BeforeValidator(_wrap(_length, "length"))]
"""A length in mm."""
Angle = Annotated[float, BeforeValidator(_wrap(_angle, "angle"))]
"""An angle in degrees."""
Azimuth = Annotated[float, BeforeValidator(_wrap(_azimuth, "angle"))]
"""An azimuth in degrees, in [0, 360)."""
Speed = Annotated[float, BeforeValidator(_wrap(_speed, "speed"))]
"""A speed in m/s."""
Torque = Annotated[float, BeforeValidator(_wrap(_torque))]
"""A tightening torque in N m."""
Force = Annotated[float, BeforeValidator(_wrap(_force))]
Mass = Annotated[float, BeforeValidator(_wrap(_mass))]
"""A mass in grams."""
"""A force in N."""


def field_kind(annotation, metadata=()) -> str | None:
    """"length", "angle" or "speed" for a field typed with one of the types above."""
    import typing

    for item in metadata:
        kind = getattr(getattr(item, "func", None), "kind", None)
        if kind:
            return kind
    if annotation is None:
        return None
    found = field_kind(None, getattr(annotation, "__metadata__", ()))
    if found:
        return found
    for arg in typing.get_args(annotation):
        found = field_kind(arg)
        if found:
            return found
    return None
