"""Shared helpers: demo configs as dicts, modified and planned without solids."""

from __future__ import annotations

import copy
import pathlib
import tomllib

from generators.config.load import parse_config
from generators.plan.hub import build_plan
from generators.plan.rules import evaluate

ROOT = pathlib.Path(__file__).resolve().parents[2]
METRIC = ROOT / "configs" / "six-spreader-portable.toml"
INCH = ROOT / "configs" / "four-spreader-conduit.toml"
# frozen copies of the demos as first written: the hand calculations use their numbers,
# so tuning a demo does not change what those tests check
METRIC_CASE = ROOT / "tests" / "checks" / "cases" / "metric-40ms.toml"
INCH_CASE = ROOT / "tests" / "checks" / "cases" / "inch-hdpe-90mph.toml"


def demo(path=METRIC) -> dict:
    return tomllib.loads(path.read_text(encoding="utf-8"))


def modified(path=METRIC, **sections) -> dict:
    """The demo with keys changed: modified(hub={"thickness": 30}); None deletes a key
    (or, for a section, the section: mast_pin=None)."""
    data = copy.deepcopy(demo(path))
    for section, changes in sections.items():
        if changes is None:  # the whole section dropped
            data.pop(section, None)
            continue
        if not isinstance(changes, dict):
            data[section] = changes
            continue
        target = data.setdefault(section, {})
        for k, v in changes.items():
            if v is None:
                target.pop(k, None)
            else:
                target[k] = v
    return data


def checks_for(data: dict):
    from generators.design import design

    d = design(parse_config(data))
    return d.config, d.plan, d.checks


def rule(checks, rule_id: str):
    return next(r for r in checks.rules if r.id == rule_id)


def toml_text(data: dict) -> str:
    """A tiny TOML writer for the configs the tests make (tables, arrays of tables, scalars)."""
    def val(v):
        if isinstance(v, bool):
            return "true" if v else "false"
        if isinstance(v, (int, float)):
            return repr(v)
        if isinstance(v, (list, tuple)):
            return "[" + ", ".join(val(x) for x in v) + "]"
        return '"' + str(v).replace('"', '\\"') + '"'

    lines = [f"{k} = {val(v)}" for k, v in data.items() if not isinstance(v, (dict, list))]
    for k, v in data.items():
        if isinstance(v, dict):
            lines.append(f"[{k}]")
            lines += [f"{kk} = {val(vv)}" for kk, vv in v.items()]
        elif isinstance(v, list) and v and isinstance(v[0], dict):
            for item in v:
                lines.append(f"[[{k}]]")
                lines += [f"{kk} = {val(vv)}" for kk, vv in item.items()]
    return "\n".join(lines) + "\n"
