"""Mast sizes: plain diameters, NPS pipe (ASME B36.10M) and EMT conduit (ANSI C80.3)."""

from __future__ import annotations

import functools
import re
from dataclasses import dataclass

from generators.errors import UserError, did_you_mean
from generators.standards._data import table
from generators.units import MM_PER_IN, length_mm

ACCEPTED = ("a diameter (38, \"38 mm\", \"1-1/2 in\"), NPS pipe (\"1-1/4 NPS\", \"1 in sch 40 pipe\", "
            "\"1 NPS sch 80\", \"2 in pipe\") or EMT (\"1 in EMT\", \"3/4 EMT\")")
SCHEDULES = ("40", "80")


@dataclass(frozen=True)
class MastSize:
    """The mast's outside diameter and where it came from."""

    designation: str
    od_mm: float
    kind: str
    wall_mm: float | None


def _key(value) -> str:
    return value if isinstance(value, str) else f"{value:g}"


@functools.cache
def _nps() -> dict[str, dict]:
    return {_key(r["nps"]): r for r in table("nps_pipe.csv")}


@functools.cache
def _emt() -> dict[str, dict]:
    return {_key(r["trade_size"]): r for r in table("emt.csv")}


_SIZE = r"(?P<size>\d+(?:[- ]\d+/\d+)?|\d+/\d+)"
_PIPE = re.compile(rf"^{_SIZE}\s*(?:in|\"|inch)?\s*(?P<nps>nps)?\s*(?:sch(?:edule)?\.?\s*(?P<sch>\d+))?"
                   r"\s*(?P<pipe>pipe)?\s*(?:sch(?:edule)?\.?\s*(?P<sch2>\d+))?$")
_EMT = re.compile(rf"^{_SIZE}\s*(?:in|\"|inch)?\s*(?:trade\s*size\s*)?emt(?:\s*conduit)?$")


def _size(text: str) -> str:
    return text.replace(" ", "-")


def _designation(value: str, key: str) -> MastSize | None:
    text = " ".join(value.strip().lower().split())
    m = _EMT.match(text)
    if m:
        size = _size(m["size"])
        if size not in _emt():
            hint = did_you_mean(size, _emt())
            raise UserError(key, f"no EMT trade size {size!r} (ANSI C80.3)",
                            f"{hint} trade sizes {', '.join(_emt())}".strip())
        row = _emt()[size]
        return MastSize(f"{size} in EMT", row["od_in"] * MM_PER_IN, "emt", row["wall_in"] * MM_PER_IN)
    m = _PIPE.match(text)
    if m and (m["nps"] or m["pipe"] or m["sch"] or m["sch2"]):
        size = _size(m["size"])
        sch = m["sch"] or m["sch2"] or "40"
        if size not in _nps():
            hint = did_you_mean(size, _nps())
            raise UserError(key, f"no NPS pipe size {size!r} (ASME B36.10M)",
                            f"{hint} sizes {', '.join(_nps())}".strip())
        if sch not in SCHEDULES:
            raise UserError(key, f"schedule {sch} is not tabulated", "schedule 40 or 80")
        row = _nps()[size]
        return MastSize(f"{size} NPS sch {sch} pipe", row["od_in"] * MM_PER_IN, "pipe",
                        row[f"sch{sch}_wall_in"] * MM_PER_IN)
    return None


def resolve_mast(value, key: str = "mast.size", units: str = "mm") -> MastSize:
    """A MastSize from a number, a length string, or an NPS / EMT designation."""
    if isinstance(value, str):
        found = _designation(value, key)
        if found:
            return found
        try:
            od = length_mm(value, key, units)
        except UserError:
            words = [f"{s} NPS" for s in _nps()] + [f"{s} in EMT" for s in _emt()]
            hint = did_you_mean(value.strip(), words)
            raise UserError(key, f"cannot read mast size {value!r}", f"{hint} {ACCEPTED}".strip()) from None
    else:
        od = length_mm(value, key, units)
    if od <= 0:
        raise UserError(key, f"mast diameter must be positive, got {value!r}", ACCEPTED)
    if units == "in":  # named in the config's own units
        from generators.units import format_length

        return MastSize(f"{format_length(od, 'in')} tube", od, "tube", None)
    return MastSize(f"{od:g} mm tube", od, "tube", None)
