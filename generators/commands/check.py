"""``hubwright check [CONFIG] [--json] [--mast SIZE ...]``: design rules and wind loads, without solids.

Exit 0 when no rule fails, 1 when one does, 2 for bad input or an unbuildable design.
Only the config, standards and plan layers are imported, so it starts fast.
"""

from __future__ import annotations

import argparse
import json
import sys
import textwrap

from generators.report.figures import figure

CAUTION = ("The wind figures are an estimate, not a structural certification: follow local codes,"
           " the mast maker's ratings and licensed engineering practice; keep clear of power lines,"
           " never climb without fall protection, and wear eye protection when drilling.")


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("config", nargs="?", metavar="CONFIG", help="config file (default: the metric demo)")
    p.add_argument("--json", action="store_true", help="print the results as JSON")
    p.add_argument("--mast", metavar="SIZE", action="append", default=[],
                   help="also check a reducer sleeve for this mast, as build --mast makes it (repeatable)")


def wind_lines(wind: dict, units: str) -> list[str]:
    from generators.plan.rules import speed_text

    w = wind
    from generators.units import format_force as F
    from generators.units import format_moment as M
    from generators.units import format_pressure as P
    from generators.units import format_stress as S

    lines = [f"wind  {speed_text(w['speed_m_s'], units)}: design pressure {P(w['pressure_pa'], units)}"
             f" ({w.get('pressure_basis') or 'reference height'})"]
    if w["force_per_spreader_n"] is None:
        return lines + ["      loads not estimated (no tip position: spreaders.tip_radius or tip_spacing)"]
    if w.get("plate_stress_mpa") is not None:  # a plate hub: U-bolt and plate figures
        held = (f"      spreader stress {S(w['spreader_stress_mpa'], units)}, plate bending"
                f" {S(w['plate_stress_mpa'], units)}, U-bolt leg {F(w['u_bolt_leg_tension_n'], units)}")
        where = "the outer U-bolt"
    else:
        held = (f"      spreader stress {S(w['spreader_stress_mpa'], units)}, bearing on the socket"
                f" {S(w['bearing_pressure_mpa'], units, 1)}, set-screw pull {F(w['set_screw_pull_n'], units)}")
        where = "the socket mouth"
    lines += [
        f"      force per spreader {F(w['force_per_spreader_n'], units, 1)},"
        f" moment at {where} {M(w['moment_at_hub_nm'], units)}",
        held,
        f"      lowest safety factor {w['safety_factor']:.2f}"
        if w["safety_factor"] is not None else "      no safety factor computed",
    ]
    from generators.report.mast_figures import ADVICE, mast_rows

    lines += [f"      {label}: {value}" for label, value in mast_rows(w, units)]
    lines += textwrap.wrap(ADVICE, 94, initial_indent="      ", subsequent_indent="      ")
    return lines


def table(checks: dict, units: str, width: int = 100) -> str:
    rows = [("rule", "status", "figure", "limit")]
    for r in checks["rules"]:
        rows.append((r["id"], r["status"], figure(r["value"], r["unit"], units), figure(r["limit"], r["unit"], units)))
    w = [max(len(row[i]) for row in rows) for i in range(4)]
    out = []
    for k, row in enumerate(rows):
        out.append("  ".join(c.ljust(w[i]) for i, c in enumerate(row)).rstrip())
        if k == 0:
            out.append("-" * (sum(w) + 6))
            continue
        msg = checks["rules"][k - 1]["message"]
        out.extend(textwrap.wrap(msg, width, initial_indent="    ", subsequent_indent="    "))
    return "\n".join(out)


def run(args: argparse.Namespace) -> int:
    from generators.config import load_config
    from generators.demos import default_config
    from generators.design import design
    from generators.plan.rules import failed, warned

    path = args.config or str(default_config())
    cfg = load_config(path)
    d = design(cfg, tuple(args.mast or ()))
    checks = d.checks_json
    bad = failed(checks)
    if args.json:
        sleeves = [{k: round(v, 4) if isinstance(v, float) else v for k, v in r.items()} for r in d.checks.sleeves]
        json.dump({**checks, "sleeves": sleeves}, sys.stdout, indent=2)
        sys.stdout.write("\n")
    else:
        print(f"{cfg.name}: {len(checks['rules'])} rules, {len(bad)} failed, {len(warned(checks))} warned")
        print(table(checks, cfg.units))
        print()
        print("\n".join(wind_lines(checks["wind"], cfg.units)))
        print()
        print(CAUTION)
    return 1 if bad else 0

