"""U-bolts for pipe and round tube, and the plain washers under their nuts.

The U-bolt table (``data/u_bolts.csv``) lists stock sizes by family (metric, inch): the
pipe or tube each is made for, its inside width (the bend's inside diameter, the pipe OD
plus a little clearance), thread and leg length (inside of the bend to the leg end). The
legs' centres sit one inside width plus one rod diameter apart.
"""

from __future__ import annotations

import functools
import math
from dataclasses import dataclass

from generators.errors import UserError
from generators.standards._data import table
from generators.standards.threads import Thread, parse_thread
from generators.units import MM_PER_IN

# A U-bolt must pass over the pole with at least this diametral clearance, and clamps it
# only while the inside width exceeds the OD by no more than the most (common practice:
# a looser U-bolt bends its bar instead of gripping).
MIN_CLEARANCE_MM = 0.3
MAX_CLEARANCE_MM = 4.0
# Tensile stress area A_s = pi/4 (d - k P)^2: k = 0.9382 for ISO metric threads (ISO 898-1),
# k = 0.9743 for Unified threads (ASME B1.1, A_s = 0.7854 (D - 0.9743/n)^2); from memory.
STRESS_AREA_K_METRIC, STRESS_AREA_K_UNIFIED = 0.9382, 0.9743
# Lower yield of a plain-steel U-bolt: ISO 898-1 property class 4.6, 240 MPa (from memory;
# SAE J429 grade 2 is close); the table's U-bolts are assumed no stronger.
U_BOLT_YIELD_MPA = 240.0
U_BOLT_YIELD_SOURCE = "ISO 898-1 property class 4.6 lower yield 240 MPa (from memory)"


@dataclass(frozen=True)
class UBoltSize:
    family: str
    size: str
    pipe_od_mm: float
    inside_width_mm: float
    thread: Thread
    leg_length_mm: float
    source: str

    @property
    def rod_mm(self) -> float:
        return self.thread.major_mm

    @property
    def leg_spacing_mm(self) -> float:
        """Centre to centre of the legs: the inside width plus one rod diameter."""
        return self.inside_width_mm + self.rod_mm


@dataclass(frozen=True)
class Washer:
    inside_mm: float
    outside_mm: float
    thickness_mm: float
    standard: str
    source: str


def _mm(row: dict, column: str) -> float:
    if row.get(f"{column}_mm") is not None:
        return row[f"{column}_mm"]
    return row[f"{column}_in"] * MM_PER_IN


@functools.cache
def u_bolt_sizes(family: str) -> tuple[UBoltSize, ...]:
    """The stock U-bolts of one family, narrowest first."""
    out = [UBoltSize(family=r["family"], size=r["size"], pipe_od_mm=_mm(r, "pipe_od"),
                     inside_width_mm=_mm(r, "inside_width"), thread=parse_thread(r["thread"]),
                     leg_length_mm=_mm(r, "leg_length"), source=r["source"])
           for r in table("u_bolts.csv") if r["family"] == family]
    return tuple(sorted(out, key=lambda u: u.inside_width_mm))


def select_u_bolt(od_mm: float, family: str, key: str) -> UBoltSize:
    """The narrowest stock U-bolt that passes over ``od_mm`` and still clamps it."""
    sizes = u_bolt_sizes(family)
    for u in sizes:
        gap = u.inside_width_mm - od_mm
        if MIN_CLEARANCE_MM - 1e-9 <= gap <= MAX_CLEARANCE_MM + 1e-9:
            return u
    near = ", ".join(f"{u.size} ({u.inside_width_mm:.1f} mm inside)" for u in sizes)
    raise UserError(key, f"no {family} U-bolt in the table fits a {od_mm:.1f} mm OD"
                    f" ({MIN_CLEARANCE_MM:g} to {MAX_CLEARANCE_MM:g} mm wider inside)",
                    f"an OD a stock U-bolt fits: {near}; or plate.u_bolts = the other family")


@functools.cache
def _washers() -> dict[str, dict]:
    return {r["size"]: r for r in table("plain_washers.csv")}


def plain_washer(thread: Thread | str, key: str = "thread") -> Washer:
    thread = parse_thread(thread, key) if isinstance(thread, str) else thread
    row = _washers().get(thread.size)
    if row is None:
        raise UserError(key, f"no plain washer tabulated for {thread.size}", ", ".join(_washers()))
    return Washer(inside_mm=_mm(row, "inside"), outside_mm=_mm(row, "outside"),
                  thickness_mm=_mm(row, "thickness"), standard=row["standard"], source=row["source"])


def stress_area_mm2(thread: Thread) -> float:
    """Tensile stress area A_s = pi/4 (d - k P)^2 (k by thread system, see above)."""
    k = STRESS_AREA_K_UNIFIED if thread.inch else STRESS_AREA_K_METRIC
    return math.pi / 4.0 * (thread.major_mm - k * thread.pitch_mm) ** 2
