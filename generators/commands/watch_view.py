"""What ``hubwright build CONFIG --watch`` prints: each build's summary and what changed.

Ctrl-C (or SIGTERM) while waiting for a change ends the watch with exit 0; during a
rebuild it ends like any build (exit 130/143, the previous output left in place).
"""

from __future__ import annotations

import argparse
import contextlib
import sys
import threading

from generators import signals


def changed_line(event) -> str:
    """One line: hub files, cut lengths and rules against the previous good build."""
    from generators.units import format_both

    c = event.changes
    parts = []
    if "hub_unchanged" in c:
        parts.append("hub files identical" if c["hub_unchanged"] else "hub files changed")
    if "cut_length_change_mm" in c:
        d = float(c["cut_length_change_mm"])
        units = event.result.manifest.get("units_in_config", "mm")
        sign = "+" if d > 0 else "-" if d < 0 else ""
        parts.append(f"cut lengths {sign}{format_both(abs(d), units)}"
                     + (" (re-cut)" if c.get("recut_since_previous") else " (no re-cut)"))
    elif c.get("recut_since_previous"):
        parts.append("cut lengths changed (re-cut)")
    parts.append("rules " + ("; ".join(event.rules) if event.rules else "unchanged"))
    return f"changed: {', '.join(parts)}"


def _print(*lines: str, err: bool = False) -> None:
    stream = sys.stderr if err else sys.stdout
    for line in lines:
        print(line, file=stream)
    stream.flush()


def run_watch(config: str, args: argparse.Namespace) -> int:
    from generators.report.summary import CAUTION, summary_lines
    from generators.watch import watch

    _print(f"watch: {config} (Ctrl-C to stop)")
    events = watch(config, args.out, tuple(args.mast or ()), bool(args.force),
                   on_wait=lambda: _print(f"watch: waiting for {config} to change"),
                   waiting=signals.raising if threading.current_thread() is threading.main_thread()
                   else contextlib.nullcontext)
    try:
        for event in events:
            head = f"build {event.number} ({event.seconds:.1f} s)"
            if event.result is None:
                _print(f"{head} failed")
                _print(f"error: {event.error}", err=True)
                continue
            lines = [ln for ln in summary_lines(event.result) if ln != CAUTION]
            _print(f"{head}:", *lines)
            if event.number > 1 or event.changes:
                _print(changed_line(event))
    except (signals.Stopped, KeyboardInterrupt):
        _print("watch: stopped")
        _print(CAUTION)
        return 0
    return 0
