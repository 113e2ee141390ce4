"""Run ``hubwright size`` in-process on a copy of a config and read back what it wrote."""

from __future__ import annotations

import contextlib
import io
import json
import shutil
import tomllib
from pathlib import Path

import tomli_w

from generators import cli
from generators.config import load_config
from generators.design import design
from generators.errors import UserError

ROOT = Path(__file__).resolve().parents[2]
# every demo: block, puck, printed, split and the U-bolt plate
DEMOS = sorted(p.name for p in (ROOT / "configs").glob("*.toml") if not p.name.endswith(".sized.toml"))
MM_PER_IN = 25.4


def run(argv: list[str]) -> tuple[int, str, str]:
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        code = cli.main(argv)
    return code, out.getvalue(), err.getvalue()


def copy(src: Path, folder: Path) -> Path:
    folder.mkdir(parents=True, exist_ok=True)
    return Path(shutil.copy(src, folder / src.name))


def size_json(config: Path, *extra: str) -> tuple[int, dict]:
    code, out, err = run(["size", str(config), "--json", *extra])
    assert err == "" or code != 0, err
    return code, (json.loads(out) if out.strip() else {})


def verdict(data: dict) -> str:
    """``pass``, the failing rule ids, or the refusal: what ``check`` says of this TOML data."""
    try:
        d = design(load_config_from(data))
    except UserError as exc:
        return f"refused: {exc.line()}"
    bad = [r["id"] for r in d.checks_json["rules"] if r["status"] == "fail"]
    return "pass" if not bad else "fail: " + ", ".join(bad)


def load_config_from(data: dict):
    from generators.config.load import parse_config

    return parse_config(tomllib.loads(tomli_w.dumps(data)))


def one_step_smaller(data: dict, key: str) -> dict:
    """The same TOML data with ``key`` one shop step smaller (1 mm, or 1/16 in in an inch file)."""
    step = 1 / 16 if data.get("units", "mm") == "in" else 1.0
    out = json.loads(json.dumps(data))
    table = out
    *path, last = key.split(".")
    for part in path:
        table = table[part]
    table[last] = table[last] - step
    return out


def mass_g(path: Path) -> float:
    return design(load_config(path)).checks.mass_estimate_g


_SIZED: dict[str, tuple] = {}


def sized_demo(name: str, tmp_path_factory) -> tuple[Path, int, dict]:
    """``size --json`` on a copy of demo ``name`` (once per session): (copy, exit code, JSON)."""
    if name not in _SIZED:
        cfg = copy(ROOT / "configs" / name, tmp_path_factory.mktemp("size"))
        _SIZED[name] = (cfg, *size_json(cfg))
    return _SIZED[name]
