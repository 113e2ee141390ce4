"""Build writer for the spreader cut list: cutlist.csv, manifest ``cutlist`` and cut lengths."""

from __future__ import annotations

import csv
import io
import math

from generators.manifest import plan_record, previous_manifest
from generators.plan.cutlist import CutCase
from generators.units import MM_PER_IN, format_both

CUTLIST = "cutlist.csv"
# Cut lengths closer than this are the same cut (common practice: about what a marked
# saw cut on a fiberglass pole holds).
RECUT_TOLERANCE_MM = 0.5


def _in_units(mm: float, units: str) -> float:
    return round(mm / MM_PER_IN, 4) if units == "in" else round(mm, 2)


def _stop_radius(case: CutCase, line) -> float:
    """The stop's radius for this pole: a blind socket's floor is its own (its elevation)."""
    return line.end_radius_mm if case.stop_kind == "floor" and line.end_radius_mm else case.stop_radius_mm


def cutlist_csv(cases: list[CutCase], units: str) -> str:
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(["spreader", "azimuth_deg", "elevation_deg", "stop", "stop_diameter_mm", "cut_length",
                "units", "cut_length_mm"])
    for case in cases:
        stop = case.stop + (f" (sleeves {' '.join(case.sleeves)})" if case.sleeves else "")
        for line in case.lines:
            w.writerow([line.spreader, f"{line.azimuth_deg:g}", f"{line.elevation_deg:g}", stop,
                        f"{2 * _stop_radius(case, line):.3f}", f"{_in_units(line.cut_length_mm, units)}",
                        units, f"{line.cut_length_mm:.2f}"])
    return buf.getvalue()


def _difference(new: float, old: float, units: str, what: str) -> str:
    d = new - old
    if abs(d) < RECUT_TOLERANCE_MM:
        return f"no re-cut: within {format_both(RECUT_TOLERANCE_MM, units)} of {what}"
    if d < 0:
        return f"re-cut: {format_both(-d, units)} shorter than {what} (trim each pole)"
    return (f"re-cut: {format_both(d, units)} longer than {what} (poles cut for it are too short;"
            " cut new ones or pack the stop)")


def write_cutlist(ctx) -> None:
    cfg, plan, units = ctx.config, ctx.plan, ctx.config.units
    cases = list(ctx.design.cut_cases)
    if not cases:
        ctx.manifest["cutlist"] = None
        ctx.summary.append("  cut list not made: give spreaders.tip_radius or spreaders.tip_spacing")
        return
    (ctx.folder / CUTLIST).write_text(cutlist_csv(cases, units), encoding="utf-8")
    primary = cases[0]
    spreaders = plan_record(plan)["spreaders"]
    for rec, line in zip(spreaders, primary.lines):
        rec["cut_length_mm"] = round(line.cut_length_mm, 3)
        rec["cut_stop"] = primary.stop
    ctx.manifest["spreaders"] = spreaders
    ctx.manifest["cutlist"] = {
        "file": CUTLIST,
        "tip_radius_mm": round(primary.tip_radius_mm, 3),
        "tip_allowance_mm": round(primary.tip_allowance_mm, 3),
        "cases": [{"stop": c.stop, "stop_kind": c.stop_kind, "stop_radius_mm": round(c.stop_radius_mm, 4),
                   "end_radius_mm": round(c.end_radius_mm, 4), "sleeves": list(c.sleeves),
                   "cut_length_mm": round(c.cut_length_mm, 3)} for c in cases],
    }
    n = len(primary.lines)
    distinct = sorted({round(ln.cut_length_mm, 1) for ln in primary.lines})
    if len(distinct) > 1:  # per-socket sizes or angles: the lengths differ
        ctx.summary.append("  cut    " + ", ".join(f"S{ln.spreader} {format_both(ln.cut_length_mm, units)}"
                                                   for ln in primary.lines)
                           + f" from the {primary.stop} to the tip -> {CUTLIST}")
    else:
        ctx.summary.append(f"  cut    {n} spreaders x {format_both(primary.cut_length_mm, units)} from the"
                           f" {primary.stop} to the tip, {format_both(primary.tip_allowance_mm, units)}"
                           f" allowance included -> {CUTLIST}")
    for c in cases[1:]:
        ctx.summary.append(f"         on the {c.stop}: {format_both(c.cut_length_mm, units)};"
                           f" {_difference(c.cut_length_mm, primary.cut_length_mm, units, 'the cut for the ' + primary.stop)}")
    _compare_previous(ctx, primary, units)


def _compare_previous(ctx, primary: CutCase, units: str) -> None:
    prev = previous_manifest(ctx.folder.parent, ctx.config.name)
    spreaders = (prev or {}).get("spreaders")
    if not isinstance(spreaders, list) or not all(isinstance(s, dict) for s in spreaders):
        return  # an old or odd manifest: nothing to compare with
    old = [s.get("cut_length_mm") for s in spreaders]
    if not old or not all(isinstance(v, (int, float)) and not isinstance(v, bool) and math.isfinite(v)
                          for v in old):
        return
    if len(old) != len(primary.lines):
        ctx.summary.append("  recut  the spreader count changed since the previous build")
        ctx.changes["recut_since_previous"] = True
        return
    worst = max(primary.lines, key=lambda ln: abs(ln.cut_length_mm - old[ln.spreader - 1]))
    text = _difference(worst.cut_length_mm, old[worst.spreader - 1], units, "the previous build")
    ctx.changes["recut_since_previous"] = text.startswith("re-cut")
    ctx.changes["cut_length_change_mm"] = round(worst.cut_length_mm - old[worst.spreader - 1], 3)
    ctx.summary.append(f"  recut  {text}")
