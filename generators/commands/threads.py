"""``hubwright threads``: tap drills, minor-diameter limits, clearance holes and nuts per thread."""

from __future__ import annotations

import argparse
import json
import sys
import textwrap

from generators.errors import UserError
from generators.standards import fasteners
from generators.standards.drills import SERIES, default_series
from generators.standards.materials import get_material
from generators.standards.tapdrill import tap_drill
from generators.standards.threads import Thread, common_threads, parse_thread
from generators.units import MM_PER_IN


def add_arguments(parser: argparse.ArgumentParser) -> None:
    """Options of the threads subcommand."""
    parser.add_argument("spec", nargs="*", metavar="SPEC",
                        help="thread designations, e.g. 1/4-20 '#10-32' M6 M8x1 (none: chart of common sizes)")
    parser.add_argument("--material", default=None, metavar="M",
                        help="hub material id; its class sets the target %% of thread (default: metal)")
    parser.add_argument("--drills", nargs="+", default=None, metavar="SET", choices=None,
                        help=f"drill sets to choose from: {', '.join(SERIES)} (default: inch for inch threads, metric for metric)")
    parser.add_argument("--json", action="store_true", help="print JSON instead of a table")


def _optional(fn, thread):
    try:
        return fn(thread)
    except UserError:
        return None


def thread_record(thread: Thread, material_class: str = "metal", series=None) -> dict:
    """Everything the threads command shows about one thread, as a JSON-ready dict."""
    td = tap_drill(thread, material_class, series)
    sink = _optional(fasteners.countersink, thread)
    nut = _optional(fasteners.hex_nut, thread)
    cbore = _optional(fasteners.counterbore, thread)
    clear = _optional(fasteners.clearance_holes, thread)
    return {
        "designation": thread.designation,
        "standard": thread.standard,
        "series": thread.series,
        "thread_class": thread.thread_class,
        "major_mm": round(thread.major_mm, 6),
        "pitch_mm": round(thread.pitch_mm, 6),
        "tpi": thread.tpi,
        "tap_drill": {"name": td.drill.name, "series": td.drill.series,
                      "diameter_mm": round(td.drill.diameter_mm, 6),
                      "diameter_in": round(td.drill.diameter_in, 4),
                      "thread_percent": round(td.thread_percent, 1),
                      "target_percent": round(td.target_percent, 1)},
        "within_limits": td.within_limits,
        "note": td.note,
        "minor_min_mm": round(thread.minor_min_mm, 6),
        "minor_max_mm": round(thread.minor_max_mm, 6),
        "clearance_mm": {k: round(v, 3) for k, v in clear.items()} if clear else None,
        "countersink": ({"angle_deg": sink.angle_deg, "head_diameter_mm": round(sink.head_diameter_mm, 3),
                         "standard": sink.standard} if sink else None),
        "counterbore": ({"diameter_mm": round(cbore.diameter_mm, 3), "depth_mm": round(cbore.depth_mm, 3),
                         "standard": cbore.standard} if cbore else None),
        "nut": ({"across_flats_mm": round(nut.across_flats_mm, 3),
                 "across_corners_mm": round(nut.across_corners_mm, 3),
                 "height_mm": round(nut.height_mm, 3), "standard": nut.standard} if nut else None),
    }


def _pitch(r: dict) -> str:
    return f"{r['tpi']:g} TPI" if r["tpi"] else f"P {r['pitch_mm']:g}"


def _drill(r: dict) -> str:
    d = r["tap_drill"]
    if d["series"] == "metric":
        return d["name"]
    return f"{d['name']} ({d['diameter_in']:.4f} in)"


def _short(v: float) -> str:
    return f"{v:.2f}" if v < 10 else f"{v:.1f}"


def _clear(r: dict) -> str:
    c = r["clearance_mm"]
    return "-" if not c else "/".join(_short(c[k]) for k in ("close", "normal", "loose"))


def _chart(records: list[dict]) -> str:
    """One line per thread, under 80 columns."""
    head = (f"{'thread':<12} {'pitch':<7} {'drill':<6} {'mm':>6} {'in':>6} {'%':>3} "
            f"{'minor mm':<13} clearance mm")
    lines = [head, f"{'':<12} {'':<7} {'':<6} {'':>6} {'':>6} {'':>3} {'min-max':<13} close/normal/loose",
             "-" * 79]
    for r in records:
        d = r["tap_drill"]
        flag = "" if r["within_limits"] else " *"
        name = d["name"].removesuffix(" mm")
        minor = f"{r['minor_min_mm']:.3f}-{r['minor_max_mm']:.3f}"
        lines.append(f"{r['designation']:<12} {_pitch(r):<7} {name:<6} {d['diameter_mm']:>6.3f} "
                     f"{d['diameter_in']:>6.4f} {d['thread_percent']:>3.0f} {minor:<13} {_clear(r)}{flag}")
    if any(not r["within_limits"] for r in records):
        lines.append("* no drill in the set lies within the minor-diameter limits; nearest shown")
    return "\n".join(lines)


def _both(mm: float) -> str:
    return f"{mm:.3f} mm ({mm / MM_PER_IN:.4f} in)"


def _detail(r: dict) -> str:
    d = r["tap_drill"]
    lines = [f"{r['designation']}  ({r['standard']}, {r['series']}, class {r['thread_class']})",
             f"  major         {_both(r['major_mm'])}, pitch {r['pitch_mm']:.4g} mm"
             + (f", {r['tpi']:g} TPI" if r["tpi"] else ""),
             f"  tap drill     {_drill(r)}"
             + ("" if d["series"] == "metric" else f" = {d['diameter_mm']:.3f} mm")
             + f", {d['thread_percent']:.0f}% thread"
             f" (target {d['target_percent']:.0f}%)",
             f"  minor {r['thread_class']:<7} {r['minor_min_mm']:.3f} - {r['minor_max_mm']:.3f} mm"
             f" ({r['minor_min_mm'] / MM_PER_IN:.4f} - {r['minor_max_mm'] / MM_PER_IN:.4f} in)"]
    if r["note"]:
        lines.extend(textwrap.wrap(r["note"], 79, initial_indent="  note          ",
                                   subsequent_indent=" " * 16))
    c = r["clearance_mm"]
    lines.append("  clearance     " + ("-" if not c else
                 f"close {c['close']:.2f}  normal {c['normal']:.2f}  loose {c['loose']:.2f} mm"))
    s = r["countersink"]
    lines.append("  countersink   " + ("-" if not s else
                 f"{s['angle_deg']:g} deg to {s['head_diameter_mm']:.2f} mm ({s['standard']})"))
    b = r["counterbore"]
    lines.append("  counterbore   " + ("-" if not b else
                 f"{b['diameter_mm']:.2f} mm dia x {b['depth_mm']:.2f} mm deep (socket head cap screw)"))
    n = r["nut"]
    lines.append("  hex nut       " + ("-" if not n else
                 f"{n['across_flats_mm']:.2f} AF, {n['across_corners_mm']:.2f} AC, {n['height_mm']:.2f} thick mm"
                 f" ({n['standard']})"))
    return "\n".join(lines)


def run(args: argparse.Namespace) -> int:
    """Print the chart (no SPEC) or one block per thread; JSON with ``--json``."""
    material_class = "metal"
    if getattr(args, "material", None):
        material_class = get_material(args.material, key="--material").material_class
    series = getattr(args, "drills", None)
    if series:
        from generators.standards.drills import drills
        drills(series)  # validates names, raising UserError("shop.drills", ...)
    specs = getattr(args, "spec", None) or []
    threads = [parse_thread(s, key="thread") for s in specs] if specs else common_threads()
    records = [thread_record(t, material_class, series or default_series(t)) for t in threads]
    out = sys.stdout
    if getattr(args, "json", False):
        json.dump(records, out, indent=2)
        out.write("\n")
    elif specs:
        out.write("\n\n".join(_detail(r) for r in records) + "\n")
    else:
        out.write(_chart(records) + "\n")
    return 0
