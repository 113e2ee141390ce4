"""A batch of the four demos against the sum of their single builds (target: at most
0.45 on 2 cores). Both sides are whole processes: four ``hubwright build CONFIG`` one
after another, then one ``hubwright build`` of all four (the fork-server pool). Prints
both wall times and the ratio; ``--spawn`` also times the pool with spawned workers
(each loads the libraries itself) for comparison. Ratios, not pass/fail.

    python benchmarks/batch_speed.py [--runs N] [--spawn]
"""

from __future__ import annotations

import argparse
import os
import pathlib
import shutil
import statistics
import subprocess
import sys
import tempfile
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from _installed import as_installed  # noqa: E402

ROOT = pathlib.Path(__file__).resolve().parents[1]
DEMOS = sorted(str(p) for p in (ROOT / "configs").glob("*.toml"))
TARGET = 0.45


def _run(configs: list[str], out: pathlib.Path, env: dict | None = None) -> float:
    t = time.perf_counter()
    subprocess.run([sys.executable, "-m", "generators", "build", *configs, "--out", str(out)], cwd=ROOT,
                   check=True, capture_output=True, env=env)
    return time.perf_counter() - t


def main() -> None:
    as_installed()
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--runs", type=int, default=1)
    ap.add_argument("--spawn", action="store_true")
    ap.add_argument("--configs", nargs="+", metavar="TOML", help="these configs instead of every demo")
    args = ap.parse_args()
    demos = [str(pathlib.Path(c).resolve()) for c in args.configs] if args.configs else DEMOS
    work = pathlib.Path(tempfile.mkdtemp(prefix="hubwright-batch-"))
    try:
        singles, batches, spawned = [], [], []
        for i in range(args.runs):
            singles.append(sum(_run([c], work / f"s{i}") for c in demos))
            batches.append(_run(demos, work / f"b{i}"))
            if args.spawn:
                spawned.append(_run(demos, work / f"p{i}", env={**os.environ, "HUBWRIGHT_SPAWN": "1"}))
        s, b = statistics.median(singles), statistics.median(batches)
        print(f"{len(demos)} demos, {args.runs} run(s), whole processes, median:")
        print(f"  sum of single builds   {s:6.2f} s")
        print(f"  batch (fork server)    {b:6.2f} s   ratio {b / s:.2f} (target <= {TARGET})")
        if spawned:
            p = statistics.median(spawned)
            print(f"  batch (spawned pool)   {p:6.2f} s   ratio {p / s:.2f}")
        print(f"  machine: {os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} (noisy when > 0.5)")
    finally:
        shutil.rmtree(work, ignore_errors=True)


if __name__ == "__main__":
    main()
