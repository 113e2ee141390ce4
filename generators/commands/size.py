"""``hubwright size [CONFIG] [--vary KEY ...] [--materials ID ...] [--objective mass|stock] [--json]``.

Finds the lightest (or smallest-stock) hub that passes every rule of ``check``, holding the
mast, spreaders, fasteners and loads, and writes it to ``<name>.sized.toml`` beside the
config. Exit 0 with a design, 1 when nothing in the space passes, 2 for bad input.
"""

from __future__ import annotations

import argparse
import json
import sys
import tomllib
from pathlib import Path

from generators.report.figures import figure

CAUTION = ("Sized to the rule minimums of an estimate, not a structural certification: follow"
           " local codes, the mast maker's ratings and licensed practice; keep clear of power lines.")


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("config", nargs="?", metavar="CONFIG", help="config file (default: the metric demo)")
    p.add_argument("--vary", nargs="+", metavar="KEY", default=None,
                   help="config keys to vary (default: hub.thickness, hub.across_flats or hub.diameter,"
                        " and spreaders.socket_depth when it is a length)")
    p.add_argument("--materials", nargs="+", metavar="ID", default=None,
                   help="hub materials to try (default: the config's)")
    p.add_argument("--objective", choices=("mass", "stock"), default="mass",
                   help="minimise the estimated mass, or the stock blank (plate or bar sizes)")
    p.add_argument("--strict", action="store_true",
                   help="treat warnings as failures (size to the recommended figures)")
    p.add_argument("--json", action="store_true", help="print the result as JSON")
    p.add_argument("--jobs", type=_jobs, default=None, metavar="N",
                   help="designs judged at once (default and most: one per core; 1: one after another)")


def _jobs(text: str) -> int:
    n = int(text) if text.isdigit() and text.isascii() else 0  # not " 2", "1_0" or "+2"
    if n < 1:
        raise argparse.ArgumentTypeError(f"a whole number of 1 or more is accepted, not {text!r}")
    return n


def _load(args):
    from generators.config import load_config
    from generators.demos import default_config
    from generators.errors import UserError
    from generators.standards.materials import get_material

    path = Path(args.config or default_config())
    cfg = load_config(path)
    raw = tomllib.loads(path.read_text(encoding="utf-8").removeprefix("\ufeff"))
    mats = [get_material(m, key="--materials").id for m in args.materials] if args.materials else None
    if args.objective == "stock" and cfg.hub.process == "printed":
        raise UserError("--objective", "a printed hub is not cut from stock", "--objective mass")
    return path, cfg, raw, mats


def _fmt(value: float, kind: str, units: str) -> str:
    if kind == "length":
        from generators.units import format_length
        return format_length(value, units)
    return f"{value:g} deg" if kind == "angle" else f"{value:g}"


def _binds(rec: dict) -> str:
    """The binds column: rule ids, a refusal by the key it names, or why there is none."""
    out = [r["id"] for row in rec["binding"] for r in row["rules"]]
    out += [f"refused ({row['refusal'].split(':', 1)[0]})" for row in rec["binding"]
            if row["refusal"] and row["below"] is not None]
    return ", ".join(dict.fromkeys(out)) or "none (smallest on the grid)"


def _table(rows: list[list[str]]) -> list[str]:
    w = [max(len(r[i]) for r in rows) for i in range(len(rows[0]))]
    out = ["  ".join(c.ljust(w[i]) for i, c in enumerate(r)).rstrip() for r in rows]
    out.insert(1, "-" * (sum(w) + 2 * (len(w) - 1)))
    return out


def _text(result, records, path: Path, target: Path, cfg, orig_mass: float) -> list[str]:
    from generators.sizing.explain import sensitivity

    units, best, dims = cfg.units, result.best, result.dims
    rec = records[0]
    lines = [f"{cfg.name}: sized {', '.join(d.key for d in dims)} ({result.objective};"
             f" {result.evaluations} designs checked)", ""]
    lines += [f"  {d.key} = {_fmt(v, d.kind, units)}" for d, v in zip(dims, best.values)]
    rules = best.design.checks_json["rules"]
    sfs = [(r["value"], r["id"]) for r in rules if r["unit"] == "SF" and r["value"] is not None]
    sf = "-" if not sfs else f"{min(sfs)[0]:.2f} ({min(sfs)[1]})"
    warns = [r["id"] for r in rules if r["status"] == "warn"]
    was = "refused" if orig_mass is None else f"{orig_mass:.0f} g"
    lines += [f"  material {best.material}, about {best.mass_g:.0f} g (the config: {was}),"
              f" lowest safety factor {sf}", f"  wrote {target}"]
    fixed = [w for w in warns if w in result.strict_ignored]
    liftable = [w for w in warns if w not in result.strict_ignored]
    if liftable:
        lines.append(f"  warns: {', '.join(liftable)} (below the recommended figure; --strict sizes to it)")
    if fixed:
        lines.append(f"  warns whatever the hub's size in this space: {', '.join(fixed)} (--strict leaves"
                     " them: the fix is outside the hub, see check)")
    start = result.space(best)(tuple(d.start for d in dims))
    if start.design is not None:
        before = {r["id"] for r in start.design.checks_json["rules"] if r["status"] == "warn"}
        new = [w for w in warns if w not in before]
        if new:
            lines.append(f"  new warnings, not given by the config's own values: {', '.join(new)}")
    lines += ["", "what binds (one step smaller):"]
    for row in rec["binding"]:
        d = next(x for x in dims if x.key == row["key"])
        if row["below"] is None:
            lines.append(f"  {row['key']}: {row['refusal']}")
            continue
        at = f"  {row['key']} at {_fmt(row['below'], d.kind, units)}: "
        if row["refusal"]:
            lines.append(at + f"refused: {row['refusal']} (a hard limit: no design is made past it)")
        for r in row["rules"]:
            verb = "warns" if r.get("status") == "warn" else "fails"
            lines.append(at + f"{r['id']} {verb} ({figure(r['below'], r['unit'], units)} against"
                              f" {figure(r['limit'], r['unit'], units)}; now {figure(r['now'], r['unit'], units)})")
    lines += ["", "mass per step:"]
    rows = [["dimension", "value", "one step up", "one step down"]]
    lighter = []
    for s in sensitivity(result, best):
        d = next(x for x in dims if x.key == s["key"])
        if s["up_refused"] or s["grams_per_step"] is None:
            up = "refused"
        else:
            up = f"{s['grams_per_step']:+.0f} g" + ("" if s["up_passes"] else ", fails")
            if s["up_passes"] and s["grams_per_step"] < 0:
                lighter.append(f"{s['key']} one step up passes and is {-s['grams_per_step']:.0f} g lighter")
        down = "fails" if not s["down_passes"] else f"{s['mass_down_g'] - best.mass_g:+.0f} g"
        rows.append([s["key"], _fmt(s["value"], d.kind, units), up, down])
    lines += ["  " + r for r in _table(rows)]
    if lighter:  # deeper blind sockets remove material: smallest is not always lightest
        lines.append(f"  note: {'; '.join(lighter)} (each dimension is kept as small as passes;"
                     " set it by hand for the lighter hub)")
    lines += ["", "best candidates:"]
    stock = result.objective == "stock"
    rows = [["#", "material"] + [d.key for d in dims] + ["mass"] + (["stock"] if stock else []) + ["lowest SF", "binds"]]
    for k, c in enumerate(records, 1):
        vals = [_fmt(c["design"][d.key], d.kind, units) for d in dims]
        blank = [f"{c['objective_value'] / 1000:.2f} L"] if stock else []
        sfc = "-" if c["lowest_safety_factor"] is None else f"{c['lowest_safety_factor']:.2f}"
        rows.append([str(k), c["material"]] + vals + [f"{c['mass_g']:.0f} g"] + blank +
                    [sfc, _binds(c)])
    lines += ["  " + r for r in _table(rows)]
    if result.objective == "stock":
        from generators.sizing.stock import SOURCE
        lines.append(f"  stock sizes: {SOURCE}")
    lines += ["", f"next: hubwright check {target} (read its warnings), then hubwright build {target}"]
    return lines + ["", CAUTION]


def _unmet(result, cfg) -> dict:
    a = result.attempt
    return {"file": None, "objective": result.objective, "design": None, "mass_g": None,
            "lowest_safety_factor": None, "binding_rules": list(result.unmet), "candidates": [],
            "unmet_rules": list(result.unmet),
            "best_attempt": {"material": a.material,
                             "design": {d.key: round(v, 4) for d, v in zip(result.dims, a.values)},
                             "failed": list(a.failed), "refusal": a.refusal}}


def _mass_of(cfg) -> float | None:
    """The config's own estimated mass, or None when ``design()`` refuses it."""
    from generators.design import design
    from generators.errors import UserError

    try:
        return design(cfg).checks.mass_estimate_g
    except UserError:
        return None


def _get(cfg, key: str):
    for part in key.split("."):
        cfg = getattr(cfg, part)
    return cfg


def run(args: argparse.Namespace) -> int:
    from generators.sizing.parallel import Judges
    from generators.sizing.space import dimensions
    from generators.sizing.write import check_target, target_for

    path, cfg, raw, mats = _load(args)
    dims = dimensions(cfg, raw, args.vary, args.objective)
    check_target(path, target_for(path))
    with Judges(args.jobs) as judges:
        return _search(args, path, cfg, raw, mats, dims, judges)


def _search(args, path, cfg, raw, mats, dims, judges) -> int:
    from generators.sizing import size
    from generators.sizing.explain import candidates, prefetch, record
    from generators.sizing.write import target_for, write_sized

    result = size(raw, cfg.units, dims, mats, args.objective, args.strict, judges)
    if result.best is None:
        data = _unmet(result, cfg)
        if args.json:
            json.dump(data, sys.stdout, indent=2)
            sys.stdout.write("\n")
        else:
            a = data["best_attempt"]
            why = ", ".join(result.unmet) or a["refusal"] or ", ".join(a["failed"])
            vals = ", ".join(f"{k} = {_fmt(v, d.kind, cfg.units)}" for d, (k, v) in zip(dims, a["design"].items()))
            print(f"{cfg.name}: no design in this space passes; cannot be met: {why}")
            print(f"  best attempt ({a['material']}): {vals}: " +
                  (f"refused: {a['refusal']}" if a["refusal"] else "fails " + ", ".join(a["failed"])))
        return 1
    best = result.best
    shown = candidates(result)  # before the points around them are judged (they may pass too)
    prefetch(result, shown)
    records = [record(result, c) for c in shown]
    summary = [f"{d.key} = {_fmt(v, d.kind, cfg.units)}" for d, v in zip(dims, best.values)]
    summary.append(f"objective {result.objective}: about {best.mass_g:.0f} g in {best.material}")
    data = result.space(best).data(best.point)
    target = write_sized(data, path, summary)
    start = result.space(best)(tuple(d.start for d in dims))
    on_grid = all(abs(v - _get(cfg, d.key)) < 1e-6 for d, v in zip(dims, start.values))
    if start.mass_g is not None and on_grid and start.material == cfg.hub.material:
        orig_mass = start.mass_g
    else:
        orig_mass = _mass_of(cfg)
    if args.json:
        rec = records[0]
        out = {"file": str(target), "objective": result.objective, "material": best.material,
               "design": rec["design"], "mass_g": rec["mass_g"],
               "lowest_safety_factor": rec["lowest_safety_factor"], "binding_rules": rec["binding_rules"],
               "binding": rec["binding"], "candidates": records,
               "strict_left_warnings": list(result.strict_ignored)}
        json.dump(out, sys.stdout, indent=2)
        sys.stdout.write("\n")
    else:
        print("\n".join(_text(result, records, path, target, cfg, orig_mass)))
    return 0
