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


def _wrap(func):
    def validator(value, info: ValidationInfo):
        try:
            return func(value, info)
        except UserError as exc:
            text = exc.problem + (f" ({exc.accepted})" if exc.accepted else "")
            raise ValueError(text) from None

    return validator


def _length(value, info):
    return u.length_mm(value, info.field_name or "", _units(info))


def _angle(value, info):
    return u.angle_deg(value, info.field_name or "")


def _speed(value, info):
    return u.speed_m_s(value, info.field_name or "")


Length = Annotated[float, BeforeValidator(_wrap(_length))]
"""A length in mm."""
Angle = Annotated[float, BeforeValidator(_wrap(_angle))]
"""An angle in degrees."""
Speed = Annotated[float, BeforeValidator(_wrap(_speed))]
"""A speed in m/s."""
