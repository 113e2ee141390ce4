"""Unified (ASME B1.1) and ISO metric (ISO 261/965-1) threads: parsing and minor-diameter limits."""

from __future__ import annotations

import functools
import re
from dataclasses import dataclass

from generators.errors import UserError
from generators.standards._data import table
from generators.units import MM_PER_IN

BASIC_MINOR = 1.082532  # D1 = D - 1.082532*P, i.e. 5/4 H with H = 0.866025 P (ASME B1.1 / ISO 68-1)

FORMS = "forms like '1/4-20 UNC', '#10-32', '10-24', '1/4 UNC', 'M6', 'M8x1'"


@dataclass(frozen=True)
class Thread:
    """One thread size and pitch with the minor-diameter limits of its tapped hole."""

    designation: str
    standard: str
    series: str
    major_mm: float
    pitch_mm: float
    tpi: float | None
    basic_minor_mm: float
    minor_min_mm: float
    minor_max_mm: float
    thread_class: str

    @property
    def inch(self) -> bool:
        return self.standard == "unified"

    @property
    def size(self) -> str:
        """Nominal size without pitch: ``"#10"``, ``"1/4"``, ``"M6"``."""
        if self.inch:
            return self.designation.split("-")[0]
        return self.designation.split("x")[0]


def unified_minor_tolerance_in(major_in: float, tpi: float) -> float:
    """Class 2B minor-diameter tolerance, inches (ASME B1.1-2019 formula for classes 1B/2B)."""
    p = 1.0 / tpi
    if major_in < 0.25:
        tol = 0.05 * p ** (2 / 3) + 0.03 * p / major_in - 0.002
        return min(max(tol, 0.25 * p - 0.4 * p * p), 0.394 * p)
    if tpi <= 4:
        return 0.15 * p
    return 0.25 * p - 0.4 * p * p


def iso_td1_formula_um(pitch_mm: float) -> float:
    """T_D1 for tolerance grade 6 in micrometres (ISO 965-1 formula, before rounding)."""
    if pitch_mm <= 0.8:
        return 433 * pitch_mm - 190 * pitch_mm ** 1.22
    return 230 * pitch_mm ** 0.7


@functools.cache
def _td1_table() -> dict[float, float]:
    return {r["pitch_mm"]: r["td1_grade6_um"] for r in table("iso965_1_td1.csv")}


def iso_td1_um(pitch_mm: float) -> float:
    """T_D1 grade 6 (um): the rounded ISO 965-1 table value, the formula where the table has none."""
    return _td1_table().get(pitch_mm, iso_td1_formula_um(pitch_mm))


def _num(x: float) -> str:
    return f"{x:g}"


def _unified(row: dict) -> Thread:
    d_in, tpi = row["major_in"], row["tpi"]
    basic = d_in - BASIC_MINOR / tpi
    tol = unified_minor_tolerance_in(d_in, tpi)
    size = row["size"] if isinstance(row["size"], str) else _num(row["size"])
    return Thread(
        designation=f"{size}-{int(tpi)} {row['series']}", standard="unified",
        series=row["series"], major_mm=d_in * MM_PER_IN, pitch_mm=MM_PER_IN / tpi, tpi=tpi,
        basic_minor_mm=basic * MM_PER_IN, minor_min_mm=basic * MM_PER_IN,
        minor_max_mm=(basic + tol) * MM_PER_IN, thread_class="2B")


def _metric(row: dict) -> Thread:
    d, p = row["major_mm"], row["pitch_mm"]
    basic = d - BASIC_MINOR * p
    return Thread(
        designation=f"M{_num(d)}x{_num(p)}", standard="iso-metric", series=row["series"],
        major_mm=d, pitch_mm=p, tpi=None, basic_minor_mm=basic, minor_min_mm=basic,
        minor_max_mm=basic + iso_td1_um(p) / 1000.0, thread_class="6H")


@functools.cache
def _all() -> tuple[Thread, ...]:
    unified = [_unified(r) for r in table("unified_threads.csv")]
    metric = [_metric(r) for r in table("iso_metric_threads.csv")]
    return tuple(unified + metric)


def all_threads() -> list[Thread]:
    """Every thread hubwright knows: unified #0-1 in (UNC/UNF/UNEF), ISO metric M1.6-M24."""
    return list(_all())


_COMMON = ("#4-40", "#4-48", "#6-32", "#6-40", "#8-32", "#8-36", "#10-24", "#10-32",
           "1/4-20", "1/4-28", "5/16-18", "5/16-24", "3/8-16", "3/8-24", "7/16-14", "7/16-20",
           "1/2-13", "1/2-20", "M3", "M4", "M5", "M6", "M8", "M8x1", "M10", "M10x1.25",
           "M12", "M12x1.5")


def common_threads() -> list[Thread]:
    """The pin-up chart: #4 to 1/2 in UNC and UNF, M3-M12 coarse and M8x1, M10x1.25, M12x1.5."""
    return [parse_thread(t) for t in _COMMON]


_METRIC_RE = re.compile(
    r"^m\s*(?P<d>\d+(?:\.\d+)?)\s*(?:(?:x|\*|×)\s*(?P<p>\d*\.?\d+)\s*(?:mm)?)?"
    r"\s*(?:-?\s*(?P<cls>\d[a-z]{1,2}))?$")
_UNIFIED_RE = re.compile(
    r"^(?P<hash>#|no\.?\s*)?(?P<size>\d+/\d+|\d*\.\d+|\d+)\s*(?:\"|in\b)?"
    r"(?:\s*-\s*(?P<tpi>\d+)|\s+(?P<tpi2>\d+)(?=\s*(?:un|$)))?"
    r"\s*(?P<series>unef|unc|unf|un)?\s*(?:-?\s*(?P<cls>\d[ab]))?$")


def _suggest(threads: list[Thread], major: float, pitch: float | None, n: int = 2) -> str:
    def score(t: Thread) -> float:
        s = abs(t.major_mm - major) / max(major, 1e-9)
        if pitch:
            s += abs(t.pitch_mm - pitch) / pitch
        return s
    best = sorted(threads, key=score)[:n]
    return "did you mean " + " or ".join(f"'{t.designation}'" for t in best) + "?"


def _error(text: str, key: str, hint: str) -> UserError:
    return UserError(key, f"unknown thread {text!r}", f"{hint} {FORMS}".strip())


def _positive(value: float, text: str, key: str, what: str) -> float:
    if not (0 < value < 1e6):
        raise _error(text, key, f"the {what} must be a positive number;")
    return value


def _parse_metric(m: re.Match, text: str, key: str) -> Thread:
    d = _positive(float(m["d"]), text, key, "diameter")
    p = _positive(float(m["p"]), text, key, "pitch") if m["p"] else None
    metric = [t for t in _all() if not t.inch]
    if m["cls"] and m["cls"] != "6h":
        raise UserError(key, f"{text!r}: only class 6H tapped holes are tabulated", "drop the class or write 6H")
    same = [t for t in metric if abs(t.major_mm - d) < 1e-9]
    if not same:
        raise _error(text, key, f"no ISO metric size M{_num(d)}; " + _suggest(metric, d, p) + ";")
    if p is None:
        return next(t for t in same if t.series == "coarse")
    for t in same:
        if abs(t.pitch_mm - p) < 1e-9:
            return t
    pitches = ", ".join(_num(t.pitch_mm) for t in same)
    raise _error(text, key, f"M{_num(d)} has pitches {pitches} (ISO 261); " + _suggest(same, d, p) + ";")


def _unified_sizes(m: re.Match) -> list[float] | None:
    size = m["size"]
    if m["hash"]:
        n = int(size) if size.isdigit() else None
        return None if n is None else [0.060 + 0.013 * n]  # ASME B1.1 numbered sizes
    if "/" in size:
        num, den = size.split("/")
        return [int(num) / int(den)] if int(den) and int(num) else None
    if "." in size:
        return [float(size)] if float(size) > 0 else None
    n = int(size)
    return [1.0 * n, 0.060 + 0.013 * n] if n == 1 else [0.060 + 0.013 * n]


def _parse_unified(m: re.Match, text: str, key: str) -> Thread:
    unified = [t for t in _all() if t.inch]
    if m["cls"] and m["cls"] != "2b":
        raise UserError(key, f"{text!r}: only class 2B tapped holes are tabulated", "drop the class or write 2B")
    sizes = _unified_sizes(m)
    tpi = m["tpi"] or m["tpi2"]
    tpi = _positive(float(tpi), text, key, "threads per inch") if tpi else None
    series = m["series"].upper() if m["series"] else None
    pitch = MM_PER_IN / tpi if tpi else None
    if sizes is None:
        raise _error(text, key, "")
    candidates = []
    for size_in in sizes:
        same = [t for t in unified if abs(t.major_mm / MM_PER_IN - size_in) < 0.0005]
        if tpi:
            same_tpi = [t for t in same if t.tpi == tpi and series in (None, "UN", t.series)]
            candidates.extend(same_tpi)
        else:
            candidates.extend(t for t in same if series in (None, "UN", t.series))
        if candidates:
            break
    if candidates:
        return min(candidates, key=lambda t: t.tpi)  # coarsest pitch when none given
    major = sizes[-1] * MM_PER_IN
    same = [t for t in unified if any(abs(t.major_mm / MM_PER_IN - s) < 0.0005 for s in sizes)]
    if same:
        tpis = ", ".join(f"{int(t.tpi)} {t.series}" for t in same)
        raise _error(text, key, f"this size comes in {tpis} TPI (ASME B1.1); " + _suggest(same, major, pitch) + ";")
    raise _error(text, key, "no unified size of that diameter; " + _suggest(unified, major, pitch) + ";")


def parse_thread(text: str, key: str = "thread") -> Thread:
    """A thread from ``"1/4-20"``, ``"#10-32 UNF"``, ``"1/4 UNC"``, ``"M6"``, ``"m6 x 1.0"`` ...

    No pitch means the coarse pitch. Unknown sizes or pitches raise UserError naming the
    nearest valid designations.
    """
    if isinstance(text, Thread):
        return text
    if not isinstance(text, str):
        raise UserError(key, f"expected a thread designation, got {text!r}", FORMS)
    norm = " ".join(text.strip().lower().split())
    if len(norm) > 40 or re.search(r"\d{16}", norm):
        raise _error(text, key, "a designation of at most 40 characters and 15 digits;")
    m = _METRIC_RE.match(norm)
    if m:
        return _parse_metric(m, text, key)
    m = _UNIFIED_RE.match(norm)
    if m:
        return _parse_unified(m, text, key)
    from generators.errors import did_you_mean
    hint = did_you_mean(text.strip(), [t.designation for t in _all()])
    raise _error(text, key, (hint + ";") if hint else "")
