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


Length = Annotated[float, BeforeValidator(_wrap(_length, "length"))]
"""A length in mm."""
Angle = Annotated[float, BeforeValidator(_wrap(_angle, "angle"))]
"""An angle in degrees."""
Azimuth = Annotated[float, BeforeValidator(_wrap(_azimuth, "angle"))]
"""An azimuth in degrees, in [0, 360)."""
Speed = Annotated[float, BeforeValidator(_wrap(_speed, "speed"))]
"""A speed in m/s."""


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
