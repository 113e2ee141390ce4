"""Twist-drill series: fractional, number, letter (ASME B94.11M) and metric."""

from __future__ import annotations

import functools
from collections.abc import Iterable
from dataclasses import dataclass
from fractions import Fraction

from generators.errors import UserError, did_you_mean
from generators.standards._data import table
from generators.units import MM_PER_IN

SERIES = ("fractional", "number", "letter", "metric")
INCH_SERIES = ("fractional", "number", "letter")
METRIC_SERIES = ("metric",)
# A planned hole is made by a stock drill within 0.001 in (0.0254 mm) of its size: finer than
# a twist drill holds its size in the cut (common practice), so 41/64 in (0.6406 in) drills a
# 0.640 in socket.
SAME_SIZE_MM = 0.0254


@dataclass(frozen=True)
class Drill:
    """One twist drill: its shop name, diameter and series."""

    name: str
    diameter_mm: float
    series: str

    @property
    def diameter_in(self) -> float:
        return self.diameter_mm / MM_PER_IN

    def label(self, units: str = "mm") -> str:
        """``"#7 (0.2010 in)"``, ``"13/64 (0.2031 in)"``, ``"5.0 mm"`` (``"5.0 mm (0.1969 in)"`` in inches)."""
        if self.series == "metric":
            return f"{self.name} ({self.diameter_in:.4f} in)" if units == "in" else self.name
        return f"{self.name} ({self.diameter_in:.4f} in)"

    @property
    def step_index(self) -> int | None:
        """Position in a regular series (64ths, tenths or halves of a mm); None for number/letter."""
        if self.series == "fractional":
            return round(self.diameter_in * 64)
        if self.series == "metric":
            return round(self.diameter_mm * 10) if self.diameter_mm <= 13 + 1e-9 else round(self.diameter_mm * 2)
        return None


def _fraction_name(sixty_fourths: int) -> str:
    f = Fraction(sixty_fourths, 64)
    return str(f.numerator) if f.denominator == 1 else f"{f.numerator}/{f.denominator}"


@functools.cache
def _series(name: str) -> tuple[Drill, ...]:
    if name == "fractional":  # 1/64 in steps, 1/64 to 1 in (common practice: jobber sets)
        out = [Drill(_fraction_name(n), n / 64 * MM_PER_IN, name) for n in range(1, 65)]
    elif name == "metric":
        # 0.1 mm steps 0.3-13 mm, then 0.5 mm steps to 32 mm (common practice: ISO 235 / DIN 338 sets)
        tenths = [Drill(f"{n / 10:.1f} mm", n / 10, name) for n in range(3, 131)]
        halves = [Drill(f"{n / 2:.1f} mm", n / 2, name) for n in range(27, 65)]
        out = tenths + halves
    else:
        rows = table("twist_drills_inch.csv")
        out = [Drill(r["name"], r["diameter_in"] * MM_PER_IN, name) for r in rows if r["series"] == name]
    return tuple(sorted(out, key=lambda d: d.diameter_mm))


def drills(series: Iterable[str]) -> list[Drill]:
    """All drills of the named series, smallest first."""
    if isinstance(series, str):
        series = [series]
    out: list[Drill] = []
    for name in series:
        if name not in SERIES:
            hint = did_you_mean(str(name), SERIES)
            raise UserError("shop.drills", f"unknown drill series {name!r}",
                            f"{hint} one or more of {', '.join(SERIES)}".strip())
        out.extend(_series(name))
    return sorted(set(out), key=lambda d: (d.diameter_mm, d.series))


def default_series(thread) -> tuple[str, ...]:
    """Inch drills for unified threads, metric drills for ISO metric threads."""
    return INCH_SERIES if thread.inch else METRIC_SERIES


@functools.cache
def _by_name() -> dict[str, Drill]:
    out = {}
    for name in SERIES:
        for d in _series(name):
            out[d.name.lower()] = d
    return out


def find_drill(name: str) -> Drill:
    """A drill by its name: ``"#7"``, ``"7"``, ``"F"``, ``"13/64"``, ``"5.0 mm"``, ``"5mm"``."""
    text = " ".join(str(name).strip().lower().split())
    table_ = _by_name()
    if text in table_:
        return table_[text]
    if text.isdigit() and f"#{text}" in table_:
        return table_[f"#{text}"]
    mm = text.removesuffix("mm").strip()
    try:
        key = f"{float(mm):.1f} mm"
    except ValueError:
        key = None
    if key in table_ and abs(float(mm) - table_[key].diameter_mm) < 1e-9:
        return table_[key]
    hint = did_you_mean(text, table_)
    raise UserError("shop.drills", f"unknown drill {name!r}",
                    f"{hint} e.g. '#7', 'F', '13/64', '5.0 mm'".strip())
