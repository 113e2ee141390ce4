"""What the shop tests measure the demos against, written out here from the sources they
name, not read from the project's tables."""

from __future__ import annotations

import re
from fractions import Fraction
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
DEMOS = sorted((ROOT / "configs").glob("*.toml"))
IN = 25.4  # mm per inch, exact by definition (international inch, 1959)

# Thread engagement by material class: 1.5 D in metals, 2 to 2.5 D in plastics and wood
# (common practice; the upper figure is the limit here), plus 2 pitches of tap lead.
ENGAGE_D = {"metal": 1.5, "plastic": 2.5, "wood": 2.5, "composite": 2.5}
LEAD_PITCHES = 2

# Jobber-length (DIN 338) flute lengths by diameter range, mm (from memory: DIN 338 table).
DIN338_FLUTE = [(2.65, 3.0, 33), (3.0, 3.35, 36), (3.35, 3.75, 39), (3.75, 4.25, 43), (4.25, 4.75, 47),
                (4.75, 5.3, 52), (5.3, 6.0, 57), (6.0, 6.7, 63), (6.7, 7.5, 69), (7.5, 8.5, 75),
                (8.5, 9.5, 81), (9.5, 10.6, 87), (10.6, 11.8, 94), (11.8, 13.2, 101), (13.2, 14.0, 108)]

# ASME B94.11M jobber flute lengths of fractional drills, in (from memory of the makers'
# charts): (drill, flute); a number or letter drill between two takes the smaller's flute
ASME_JOBBER_IN = [(Fraction(1, 8), 1.625), (Fraction(5, 32), 2.0), (Fraction(3, 16), 2.3125),
                  (Fraction(13, 64), 2.5), (Fraction(7, 32), 2.5), (Fraction(1, 4), 2.75),
                  (Fraction(17, 64), 2.875), (Fraction(5, 16), 3.1875), (Fraction(3, 8), 3.625),
                  (Fraction(7, 16), 4.0625), (Fraction(1, 2), 4.5)]

# Hand tap overall lengths, mm (from memory: DIN 371 metric, ASME B94.9 inch); the wrench
# holds about 12 mm of the square (common practice).
HAND_TAP_OVERALL = {"M5": 70.0, "M6": 80.0, "#10": 2.375 * 25.4, "1/4": 2.5 * 25.4}
WRENCH_GRIP_MM = 12.0

# Socket head cap screw lengths (from memory: ISO 4762 preferred lengths; ASME B18.3 inch
# lengths as commonly stocked).
ISO4762_LENGTHS = {5, 6, 8, 10, 12, 16, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 80, 90, 100, 110, 120}
INCH_CAP_LENGTHS = {Fraction(n, 8) for n in range(2, 9)} | {Fraction(n, 4) for n in range(5, 17)} | \
    {Fraction(n, 2) for n in range(9, 13)}


def thread_d_p(designation: str) -> tuple[float, float]:
    """Major diameter and pitch (mm) of a thread designation: ISO 261 (M6x1) or ASME B1.1
    (#10-24, 1/4-20; a numbered size's major diameter is 0.060 + 0.013 N in)."""
    s = designation.split()[0]
    m = re.fullmatch(r"M(\d+(?:\.\d+)?)x(\d+(?:\.\d+)?)", s)
    if m:
        return float(m.group(1)), float(m.group(2))
    size, tpi = s.split("-")
    if size.startswith("#"):
        d = 0.060 + 0.013 * int(size[1:])
    else:
        d = float(sum(Fraction(x) for x in size.split("-")))
    return d * IN, IN / float(tpi)


def jobber_flute_mm(d: float, inch: bool = False) -> float | None:
    """DIN 338 jobber flute (mm); ``inch``: an inch drill up to 1/2 in, ASME B94.11M's."""
    if inch and d <= float(ASME_JOBBER_IN[-1][0]) * IN + 1e-6:
        below = [f for size, f in ASME_JOBBER_IN if float(size) * IN <= d + 1e-6]
        return below[-1] * IN if below else None
    for lo, hi, flute in DIN338_FLUTE:
        if lo < d <= hi + 1e-9:
            return flute
    return None
