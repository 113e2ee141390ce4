"""Through bolts and threaded rod: stock lengths, thread lengths and shear strength.

A through bolt across a hub and its mast is a hex bolt (ISO 4014 metric, ASME B18.2.1 inch;
stock length ranges in data/hex_bolts.csv) with a plain washer under its head and under its
nut, or, where no stock bolt is long enough, threaded rod (DIN 976-1) cut to length with a
washer and a nut at each end. Nuts: ISO 4032 / ASME B18.2.2 (data/hex_nuts.csv); washers:
ISO 7089 / ASME B18.21.1 (data/plain_washers.csv).
"""

from __future__ import annotations

import functools
import math
from dataclasses import dataclass

from generators.errors import UserError
from generators.standards._data import table
from generators.standards.threads import Thread, parse_thread
from generators.units import MM_PER_IN

# ISO 4014 preferred lengths, mm (from memory: ISO 4014 length series).
_METRIC_LENGTHS = (20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 80, 90, 100, 110, 120, 130, 140, 150,
                   160, 180, 200, 220, 240, 260, 280, 300)
# Hex cap screw lengths as commonly stocked, in (common practice, from memory): 1/4 in steps to
# 6 in, 1/2 in steps to 8 in, then whole inches.
_INCH_LENGTHS = tuple([0.5, 0.625, 0.75, 0.875] + [1 + k / 4 for k in range(21)] + [6.5, 7, 7.5, 8, 9, 10, 11, 12])

# Ultimate tensile strength of the bolt or rod: ISO 898-1 property class 8.8, 800 MPa
# (nominal Rm; from memory), and SAE J429 grade 5, 120 ksi for 1/4 to 1 in (from memory).
UTS_METRIC_MPA = 800.0
UTS_INCH_MPA = 120.0 * 6.894757293168  # 1 ksi = 6.894757 MPa (NIST SP 811)
GRADE_METRIC, GRADE_INCH = "property class 8.8 (ISO 898-1)", "SAE J429 grade 5"
# Yield strength: class 8.8 ReL 640 MPa (ISO 898-1 nominal), grade 5 92 ksi (SAE J429); from memory.
YIELD_METRIC_MPA = 640.0
YIELD_INCH_MPA = 92.0 * 6.894757293168


def yield_mpa(thread: Thread) -> float:
    """The bolt's yield strength (see YIELD_METRIC_MPA)."""
    return YIELD_INCH_MPA if thread.inch else YIELD_METRIC_MPA


def bending_capacity_nm(thread: Thread) -> float:
    """First yield in bending on the stress-area section: f_y pi d_s^3 / 32 (Gere, elastic
    section modulus of a round bar), N m."""
    from generators.standards.ubolts import stress_area_mm2

    d_s = math.sqrt(4 * stress_area_mm2(thread) / math.pi)
    return yield_mpa(thread) * math.pi * d_s ** 3 / 32 / 1000.0
UTS_SOURCE = ("ISO 898-1 property class 8.8: Rm 800 MPa; SAE J429 grade 5: 120 ksi (from memory)")
# Shear strength of a bolt as a fraction of its tensile strength on the stress area:
# alpha_v = 0.6 for class 8.8 with the shear plane through the thread (EN 1993-1-8 table 3.4,
# from memory; without its partial factor gamma_M2), the usual 0.6 for grade 5 (common practice).
SHEAR_FRACTION = 0.6
SHEAR_SOURCE = ("0.6 f_ub A_s: EN 1993-1-8 table 3.4, alpha_v = 0.6 for class 8.8, shear plane"
                " through the thread (from memory; no partial factor); 0.6 for grade 5 (common practice)")
# Bolt or rod end past the nut: two pitches (common practice).
END_PITCHES = 2


@dataclass(frozen=True)
class ThroughBolt:
    """The bolt (or rod) across the hub and mast, its nut(s) and washers."""

    kind: str  # "hex bolt" | "threaded rod"
    thread: Thread
    length_mm: float  # under the head for a bolt; the cut length of a rod
    needed_mm: float  # the least length that works
    standard: str
    grade: str
    nuts: int
    nut_standard: str
    nut_height_mm: float
    washers: int
    washer_standard: str
    washer_thickness_mm: float
    source: str

    @property
    def with_parts(self) -> tuple[str, ...]:
        size = self.thread.designation
        return (f"{self.nuts} x {size} hex nut ({self.nut_standard})",
                f"{self.washers} x {self.thread.size} plain washer ({self.washer_standard})")


@functools.cache
def _rows() -> dict[str, dict]:
    return {r["size"] if isinstance(r["size"], str) else f"{r['size']:g}": r for r in table("hex_bolts.csv")}


def bolt_sizes() -> tuple[str, ...]:
    """Sizes with a stock hex bolt row, a nut, a washer and a clearance hole."""
    return tuple(_rows())


def check_bolt_thread(thread: Thread | str, key: str = "mast_pin.thread") -> Thread:
    """The thread, or a ``UserError`` when no through bolt of its size is tabulated."""
    t = parse_thread(thread, key)
    if t.size not in _rows():
        raise UserError(key, f"no through bolt tabulated for {t.size}", "sizes " + ", ".join(_rows()))
    return t


def stock_lengths_mm(thread: Thread) -> list[float]:
    """Stock hex bolt lengths for the size, in mm."""
    row = _rows()[thread.size]
    lo, hi = row["min_length"], row["max_length"]
    if row["unit"] == "mm":
        return [float(x) for x in _METRIC_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]
    return [x * MM_PER_IN for x in _INCH_LENGTHS if lo - 1e-9 <= x <= hi + 1e-9]


def bolt_thread_length_mm(thread: Thread, length_mm: float) -> float:
    """Threaded length of a partly threaded hex bolt (from memory: ISO 4014 b = 2d + 6 mm to
    125 mm long, 2d + 12 mm to 200 mm, 2d + 25 mm beyond; ASME B18.2.1 hex cap screws
    LT = 2D + 1/4 in to 6 in long, 2D + 1/2 in beyond)."""
    d = thread.major_mm
    if thread.inch:
        return min(length_mm, 2 * d + (0.25 if length_mm <= 6 * MM_PER_IN + 1e-9 else 0.5) * MM_PER_IN)
    extra = 6.0 if length_mm <= 125 + 1e-9 else 12.0 if length_mm <= 200 + 1e-9 else 25.0
    return min(length_mm, 2 * d + extra)


def ultimate_mpa(thread: Thread) -> tuple[float, str]:
    """The bolt's tensile strength and its grade."""
    return (UTS_INCH_MPA, GRADE_INCH) if thread.inch else (UTS_METRIC_MPA, GRADE_METRIC)


def shear_capacity_n(thread: Thread) -> float:
    """One shear plane: 0.6 x tensile strength x tensile stress area (see SHEAR_SOURCE)."""
    from generators.standards.ubolts import stress_area_mm2

    return SHEAR_FRACTION * ultimate_mpa(thread)[0] * stress_area_mm2(thread)


def through_bolt(thread: Thread | str, grip_mm: float) -> ThroughBolt:
    """The stock hex bolt for a grip of ``grip_mm`` (the body width along it): the shortest
    stock length of at least grip + two washers + nut + two pitches whose thread still
    reaches into the grip (so the nut tightens); else threaded rod cut to grip + two washers
    + two nuts + two pitches past each nut."""
    from generators.standards.fasteners import hex_nut
    from generators.standards.ubolts import plain_washer

    t = check_bolt_thread(thread)
    nut, washer = hex_nut(t), plain_washer(t)
    row = _rows()[t.size]
    grade = ultimate_mpa(t)[1]
    common = dict(thread=t, grade=grade, nut_standard=nut.standard, nut_height_mm=nut.height_mm, washers=2,
                  washer_standard=washer.standard, washer_thickness_mm=washer.thickness_mm)
    need = grip_mm + 2 * washer.thickness_mm + nut.height_mm + END_PITCHES * t.pitch_mm
    for length in stock_lengths_mm(t):
        if length >= need - 1e-6 and length - bolt_thread_length_mm(t, length) <= grip_mm + 2 * washer.thickness_mm:
            return ThroughBolt(kind="hex bolt", length_mm=length, needed_mm=need, standard=row["standard"],
                               nuts=1, source=row["source"], **common)
    rod = grip_mm + 2 * washer.thickness_mm + 2 * (nut.height_mm + END_PITCHES * t.pitch_mm)
    step = MM_PER_IN / 8 if t.inch else 1.0  # cut to the next 1 mm or 1/8 in (common practice)
    return ThroughBolt(kind="threaded rod", length_mm=math.ceil(rod / step - 1e-9) * step, needed_mm=rod,
                       standard="DIN 976-1", nuts=2,
                       source="DIN 976-1 threaded rod, cut to length (no stock bolt that long in data/hex_bolts.csv)",
                       **common)
