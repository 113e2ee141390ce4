"""A print bed written as ``"250 x 210 x 210 mm"`` (width x depth x height): three lengths,
the unit after the last one (or after each), bare numbers in the file's units."""

from __future__ import annotations

import re

from generators.units import length_mm

_SEP = re.compile(r"\s*[x\u00d7*]\s*", re.IGNORECASE)
_UNIT = re.compile(r"^(?P<body>.*?\d)\s*(?P<unit>[A-Za-z\"']+)\s*$")


def parse_bed(text, key: str = "bed", units: str = "mm") -> tuple[float, float, float]:
    """(width, depth, height) in mm; ``ValueError`` with what is accepted otherwise."""
    if not isinstance(text, str):
        raise ValueError(f"expected a text like \"250 x 210 x 210 mm\", got {text!r}")
    m = _UNIT.match(text.strip())
    common = m.group("unit") if m else None
    parts = _SEP.split(m.group("body") if m else text.strip())
    if len(parts) != 3 or not all(parts):
        raise ValueError(f"{text!r} is not three lengths (width x depth x height, e.g. \"250 x 210 x 210 mm\")")
    out = []
    for p in parts:
        has_unit = any(c.isalpha() or c in "\"'" for c in p)
        value = p if has_unit or common is None else f"{p} {common}"
        mm = length_mm(value, key, units)
        if mm <= 0:
            raise ValueError(f"{text!r}: each side must be a positive length")
        out.append(mm)
    return (out[0], out[1], out[2])
