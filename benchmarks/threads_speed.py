"""Benchmark: whole-process time of ``hubwright threads`` (target under 0.3 s).

Prints the median of repeated runs beside a bare ``python -c pass`` and the ratio, and
whether any heavy module (cadquery, ezdxf, matplotlib, pint, numpy) was imported.

    python benchmarks/threads_speed.py [--runs N]
"""

from __future__ import annotations

import argparse
import pathlib
import statistics
import subprocess
import sys
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from _installed import as_installed  # noqa: E402


def timed(cmd: list[str], runs: int) -> float:
    times = []
    for _ in range(runs):
        t0 = time.perf_counter()
        subprocess.run(cmd, check=True, capture_output=True)
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def main() -> None:
    as_installed()
    ap = argparse.ArgumentParser()
    ap.add_argument("--runs", type=int, default=7)
    runs = ap.parse_args().runs
    py = sys.executable
    bare = timed([py, "-c", "pass"], runs)
    chart = timed([py, "-m", "generators", "threads"], runs)
    two = timed([py, "-m", "generators", "threads", "1/4-20", "M6", "--json"], runs)
    heavy = subprocess.run(
        [py, "-c", "import sys, runpy; sys.argv=['hubwright','threads'];\n"
         "import contextlib, io\n"
         "with contextlib.redirect_stdout(io.StringIO()):\n"
         "    from generators.cli import main; main(['threads'])\n"
         "print(','.join(m for m in ('cadquery','OCP','ezdxf','matplotlib','trimesh','pint','numpy') if m in sys.modules))"],
        capture_output=True, text=True, check=True).stdout.strip()
    print(f"python -c pass          {bare * 1000:7.1f} ms")
    print(f"hubwright threads       {chart * 1000:7.1f} ms  (x{chart / bare:.1f} bare python)")
    print(f"threads 1/4-20 M6 --json {two * 1000:6.1f} ms  (x{two / bare:.1f})")
    print(f"heavy modules imported: {heavy or 'none'}")
    print("target: under 300 ms" + (" - met" if max(chart, two) < 0.3 else " - NOT met"))


if __name__ == "__main__":
    main()
