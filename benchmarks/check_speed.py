"""How long ``hubwright check`` takes on each demo, against its half-second budget.

Prints ratios, not pass/fail: whole-process wall time (python start, imports, config,
plan, rules, output) as the median of a few runs, and the rules alone in-process.
"""

from __future__ import annotations

import pathlib
import statistics
import subprocess
import sys
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from _installed import as_installed  # noqa: E402

ROOT = pathlib.Path(__file__).resolve().parents[1]
DEMOS = ("configs/six-spreader-portable.toml", "configs/four-spreader-conduit.toml")
BUDGET_S = 0.5
RUNS = 5


def process_time(config: str) -> float:
    times = []
    for _ in range(RUNS):
        t = time.perf_counter()
        subprocess.run([sys.executable, "-m", "generators", "check", config], cwd=ROOT,
                       capture_output=True, check=False)
        times.append(time.perf_counter() - t)
    return statistics.median(times)


def rules_time(config: str) -> float:
    sys.path.insert(0, str(ROOT))
    from generators.config import load_config
    from generators.plan.hub import build_plan
    from generators.plan.rules import evaluate

    cfg = load_config(ROOT / config)
    plan = build_plan(cfg)
    t = time.perf_counter()
    for _ in range(20):
        evaluate(cfg, plan)
    return (time.perf_counter() - t) / 20


def heavy_modules(config: str) -> str:
    """The CAD and drawing libraries a ``check`` run has loaded (none is the aim)."""
    code = ("import sys, contextlib, io\n"
            "with contextlib.redirect_stdout(io.StringIO()):\n"
            f"    from generators.cli import main; main(['check', {config!r}])\n"
            "print(','.join(m for m in ('cadquery','OCP','ezdxf','matplotlib','trimesh','vtk') if m in sys.modules))")
    out = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, check=False)
    return out.stdout.strip().splitlines()[-1] if out.stdout.strip() else ""


def main() -> None:
    as_installed()
    for config in DEMOS:
        p = process_time(config)
        r = rules_time(config)
        print(f"{config}: whole process {p:.3f} s ({p / BUDGET_S:.2f} x budget);"
              f" rules + wind {r * 1000:.1f} ms; heavy modules loaded: {heavy_modules(config) or 'none'}")


if __name__ == "__main__":
    main()
