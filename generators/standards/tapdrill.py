"""Tap-drill choice: the drill nearest the target % of thread inside the class minor-diameter limits."""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass

from generators.errors import UserError, did_you_mean
from generators.standards.drills import Drill, default_series, drills
from generators.standards.threads import Thread

# 100 % thread = a hole of D - 1.299 P (2 x 3/4 H, H = 0.866 P). The handbook form for
# inch threads is % = (D - drill) x TPI / 0.01299 (from memory: Machinery's Handbook,
# "percentage of thread" formula); 0.01299 = 1.299 / 100 with P = 1/TPI, so one formula
# in millimetres serves both systems.
FULL_THREAD = 1.299

_TARGETS = {
    # Inch tap-drill charts are drawn at 75 % (common practice: shop tap-drill charts).
    "metal": 75.0,
    # Softer stock taps cleaner and strips less with a larger hole (common practice).
    "plastic": 65.0,
    "wood": 65.0,
    "composite": 70.0,  # glass-fibre laminates: between plastic and metal (common practice)
}
# Metric charts use drill = D - P (from memory: ISO 2306 / metric tap-drill charts),
# which is 100 / 1.299 = 77.0 % of thread.
METRIC_METAL = 100.0 / FULL_THREAD

_EPS_MM = 1e-6


@dataclass(frozen=True)
class TapDrill:
    """The chosen drill for tapping a thread and how good a choice it is."""

    thread: Thread
    drill: Drill
    thread_percent: float
    target_percent: float
    within_limits: bool
    note: str | None


def target_percent(material_class: str, thread: Thread | None = None, key: str = "material") -> float:
    """Target % of thread for a material class; ISO metric in metal follows D - P (77 %)."""
    if material_class not in _TARGETS:
        hint = did_you_mean(str(material_class), _TARGETS)
        raise UserError(key, f"unknown material class {material_class!r}",
                        f"{hint} one of {', '.join(_TARGETS)}".strip())
    if material_class == "metal" and thread is not None and not thread.inch:
        return METRIC_METAL
    return _TARGETS[material_class]


def percent_thread(thread: Thread, drill_mm: float) -> float:
    """% of thread a hole of ``drill_mm`` gives: (D - drill) / (1.299 P) x 100."""
    return (thread.major_mm - drill_mm) / (FULL_THREAD * thread.pitch_mm) * 100.0


def drill_for_percent(thread: Thread, percent: float) -> float:
    """The hole diameter (mm) that gives ``percent`` of thread."""
    return thread.major_mm - FULL_THREAD * thread.pitch_mm * percent / 100.0


def _rank(drill: Drill, target_mm: float) -> tuple:
    # Exact ties (M8: 6.7/6.8 around 6.75; M12: 10.2/10.3 around 10.25) go to the even
    # step of the series, as in rounding rule B of ISO 80000-1 (round half to even).
    step = drill.step_index
    odd = 1 if step is None else step % 2
    return (round(abs(drill.diameter_mm - target_mm), 6), odd, -drill.diameter_mm)


def _inside(thread: Thread, d: float) -> bool:
    return thread.minor_min_mm - _EPS_MM <= d <= thread.minor_max_mm + _EPS_MM


def _gap(thread: Thread, d: float) -> float:
    return max(thread.minor_min_mm - d, d - thread.minor_max_mm, 0.0)


def tap_drill(thread: Thread, material_class: str = "metal",
              series: Iterable[str] | None = None) -> TapDrill:
    """Pick the drill nearest the target % whose diameter lies within the minor-diameter limits."""
    series = tuple(default_series(thread) if series is None else series)
    target = target_percent(material_class, thread)
    target_mm = drill_for_percent(thread, target)
    candidates = drills(series)
    inside = [d for d in candidates if _inside(thread, d.diameter_mm)]
    note = None
    if inside:
        best = min(inside, key=lambda d: _rank(d, target_mm))
    else:
        best = min(candidates, key=lambda d: (round(_gap(thread, d.diameter_mm), 6),
                                              _rank(d, target_mm)))
        note = (f"no {'/'.join(series)} drill lies within the {thread.thread_class} minor-diameter "
                f"limits {thread.minor_min_mm:.3f}-{thread.minor_max_mm:.3f} mm; nearest is "
                f"{best.label()} = {best.diameter_mm:.3f} mm")
    return TapDrill(thread=thread, drill=best, thread_percent=percent_thread(thread, best.diameter_mm),
                    target_percent=target, within_limits=not note, note=note)
