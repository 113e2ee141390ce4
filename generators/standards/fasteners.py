"""Clearance holes, countersinks, counterbores, hex nuts and set-screw lengths per thread size."""

from __future__ import annotations

import functools
import math
from dataclasses import dataclass

from generators.errors import UserError, did_you_mean
from generators.standards._data import table
from generators.standards.threads import Thread, parse_thread
from generators.units import MM_PER_IN

FITS = ("close", "normal", "loose")
# ISO 273 calls its series fine / medium / coarse; hubwright names them close / normal / loose.
ISO273_FITS = {"close": "fine_mm", "normal": "medium_mm", "loose": "coarse_mm"}

# Preferred set-screw lengths (from memory: ISO 4026 / ISO 4029 length series; ASME B18.3 stock).
_METRIC_LENGTHS = (2, 2.5, 3, 4, 5, 6, 8, 10, 12, 16, 20, 25, 30, 35, 40, 45, 50, 55, 60)
_INCH_LENGTHS = (1 / 16, 3 / 32, 1 / 8, 3 / 16, 1 / 4, 5 / 16, 3 / 8, 7 / 16, 1 / 2, 5 / 8, 3 / 4,
                 7 / 8, 1, 1.25, 1.5, 1.75, 2)

# Socket head cap screw lengths (from memory: ISO 4762 preferred length series; ASME B18.3
# lengths as commonly stocked, 1/8 in steps to 1 in, 1/4 in to 4 in, 1/2 in beyond).
_CAP_METRIC_LENGTHS = (5, 6, 8, 10, 12, 16, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 80, 90, 100,
                       110, 120, 130, 140, 150, 160, 180, 200)
_CAP_INCH_LENGTHS = (0.25, 0.375, 0.5, 0.625, 0.75, 0.875, 1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3,
                     3.25, 3.5, 3.75, 4, 4.5, 5, 5.5, 6)

CBORE_EXTRA_DEPTH_MM = 0.5  # sink the head below the surface (common practice)


@dataclass(frozen=True)
class Countersink:
    angle_deg: float
    head_diameter_mm: float
    standard: str


@dataclass(frozen=True)
class Counterbore:
    diameter_mm: float
    depth_mm: float
    standard: str


@dataclass(frozen=True)
class HexNut:
    across_flats_mm: float
    across_corners_mm: float
    height_mm: float
    standard: str


def _size_key(value) -> str:
    return value if isinstance(value, str) else f"{value:g}"


@functools.cache
def _rows(name: str) -> dict[str, dict]:
    return {_size_key(r["size"]): r for r in table(name)}


def _row(thread, name: str, what: str, key: str) -> dict:
    thread = parse_thread(thread, key)
    rows = _rows(name)
    if thread.size not in rows:
        raise UserError(key, f"no {what} tabulated for {thread.size}",
                        f"sizes with one: {', '.join(rows)}")
    return rows[thread.size]


def _mm(row: dict, column: str) -> float:
    """A dimension from a ``<column>_mm`` or ``<column>_in`` cell, in millimetres."""
    if row.get(f"{column}_mm") is not None:
        return row[f"{column}_mm"]
    return row[f"{column}_in"] * MM_PER_IN


def clearance_holes(thread: Thread | str, key: str = "thread") -> dict[str, float]:
    """Close / normal / loose clearance-hole diameters in mm (ISO 273 or ASME B18.2.8)."""
    thread = parse_thread(thread, key)
    if thread.inch:
        row = _row(thread, "inch_clearance.csv", "clearance hole", key)
        return {fit: row[f"{fit}_in"] * MM_PER_IN for fit in FITS}
    row = _row(thread, "iso273_clearance.csv", "clearance hole", key)
    return {fit: row[col] for fit, col in ISO273_FITS.items()}


def clearance_hole(thread: Thread | str, fit: str = "normal", key: str = "fit") -> float:
    """One clearance-hole diameter (mm) for ``fit`` in close / normal / loose."""
    if fit not in FITS:
        hint = did_you_mean(str(fit), FITS)
        raise UserError(key, f"unknown fit {fit!r}", f"{hint} one of {', '.join(FITS)}".strip())
    return clearance_holes(thread)[fit]


def countersink(thread: Thread | str, key: str = "thread") -> Countersink:
    """Countersink for a flat head: 82 deg (ASME B18.6.3) or 90 deg (ISO 10642 / ISO 7046-1)."""
    row = _row(thread, "countersink.csv", "countersunk screw", key)
    return Countersink(row["angle_deg"], _mm(row, "head_diameter"), row["standard"])


def counterbore(thread: Thread | str, key: str = "thread") -> Counterbore:
    """Counterbore for a socket head cap screw (ISO 4762 / ASME B18.3 heads, common-practice bores)."""
    row = _row(thread, "counterbore.csv", "socket head cap screw counterbore", key)
    depth = _mm(row, "head_height") + CBORE_EXTRA_DEPTH_MM
    std = "ASME B18.3 socket head cap screw" if row["head_height_mm"] is None else "ISO 4762 socket head cap screw"
    return Counterbore(_mm(row, "cbore_diameter"), depth, std + "; counterbore common practice")


def cap_screw_head_mm(thread: Thread | str, key: str = "thread") -> float:
    """Head diameter of a socket head cap screw (counterbore.csv: ISO 4762 dk max / ASME B18.3 A max)."""
    return _mm(_row(thread, "counterbore.csv", "socket head cap screw", key), "head_diameter")


def hex_nut(thread: Thread | str, key: str = "thread") -> HexNut:
    """Hex nut: ISO 4032 style 1 (metric; e min), ASME B18.2.2 / B18.6.3 (inch; G min or F/cos 30)."""
    row = _row(thread, "hex_nuts.csv", "hex nut", key)
    af = _mm(row, "af")
    if row["corners_mm"] is None and row["corners_in"] is None:
        corners = af / math.cos(math.radians(30))  # sharp-corner theoretical
    else:
        corners = _mm(row, "corners")
    return HexNut(af, corners, _mm(row, "height"), row["standard"])


def set_screw_lengths(thread: Thread | str, key: str = "thread") -> list[float]:
    """Stock socket set-screw lengths in mm (ISO 4026/4029 metric, ASME B18.3 inch)."""
    row = _row(thread, "set_screws.csv", "set screw", key)
    lo, hi = row["min_length"], row["max_length"]
    if row["unit"] == "mm":
        return [float(x) for x in _METRIC_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]
    return [x * MM_PER_IN for x in _INCH_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]


def cap_screw_lengths(thread: Thread | str, key: str = "thread") -> list[float]:
    """Stock socket head cap screw lengths under the head in mm (ISO 4762, ASME B18.3)."""
    row = _row(thread, "cap_screws.csv", "socket head cap screw", key)
    lo, hi = row["min_length"], row["max_length"]
    if row["unit"] == "mm":
        return [float(x) for x in _CAP_METRIC_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]
    return [x * MM_PER_IN for x in _CAP_INCH_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]


def cap_screw_thread_mm(thread: Thread | str, length_mm: float, key: str = "thread") -> float:
    """Threaded length of a socket head cap screw: the whole screw when short, else the
    standard thread length (from memory: ISO 4762 b = 2 d + 12 mm; ASME B18.3 LT = 2 D + 1/2 in)."""
    t = parse_thread(thread, key)
    b = 2 * t.major_mm + (0.5 * MM_PER_IN if t.inch else 12.0)
    return min(length_mm, b)
