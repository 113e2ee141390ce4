"""``build --watch``: a rebuild after changing ``mast.size`` against the kernel time of that
rebuild (booleans, tessellation and STEP export, probed in the same process; target:
rebuild at most 1.2 x kernel). Runs the watch's own build step
(:func:`generators.watch.build_once`) in one process: a first build (which loads the
libraries), then the edit and the timed rebuild, a few times. Ratios, not pass/fail.

    python benchmarks/watch_speed.py [--runs N] [--config TOML]
"""

from __future__ import annotations

import argparse
import os
import pathlib
import re
import shutil
import statistics
import sys
import tempfile
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from _installed import as_installed  # noqa: E402

ROOT = pathlib.Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "benchmarks"))
CONFIG = ROOT / "benchmarks" / "configs" / "eight-spreader-block.toml"
TARGET = 1.2
SIZES = ("48 mm", "50 mm")  # the edit: mast.size back and forth


def main() -> None:
    as_installed()
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--config", default=str(CONFIG))
    args = ap.parse_args()
    from _probe import kernel_s, probes

    from generators.watch import _preload_beside_cad, build_once

    work = pathlib.Path(tempfile.mkdtemp(prefix="hubwright-watch-"))
    try:
        config = work / "watched.toml"
        shutil.copy(args.config, config)
        t = time.perf_counter()
        first = build_once(config, work / "out", (), False, 1, None)
        assert first.result is not None, first.error
        first_s = time.perf_counter() - t
        _preload_beside_cad()
        walls, kernels, rows = [], [], []
        for i in range(args.runs):
            text = config.read_text(encoding="utf-8")
            config.write_text(re.sub(r'(?m)^size = "[^"]*"', f'size = "{SIZES[i % 2]}"', text, count=1),
                              encoding="utf-8")
            with probes() as spent:
                t = time.perf_counter()
                ev = build_once(config, work / "out", (), False, i + 2, None)
                walls.append(time.perf_counter() - t)
            assert ev.result is not None, ev.error
            kernels.append(kernel_s(spent))
            rows.append(dict(spent))
        wall, kernel = statistics.median(walls), statistics.median(kernels)
        print(f"{pathlib.Path(args.config).name}: first build in the watch {first_s:.2f} s (loads the libraries)")
        print(f"  rebuild after mast.size edit  {wall:6.2f} s median of {args.runs} ({min(walls):.2f} min)")
        print(f"  kernel time of that rebuild   {kernel:6.2f} s (booleans, tessellation, STEP export)")
        print(f"  ratio rebuild/kernel          {wall / kernel:6.2f}   (target <= {TARGET})")
        print(f"  machine: {os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} (noisy when > 0.5)")
        print("  last rebuild, parent process (the drawings run in forked children meanwhile):")
        for what, s in sorted(rows[-1].items(), key=lambda kv: -kv[1]):
            if s >= 0.005:
                print(f"    {what:40s} {s:6.2f} s")
    finally:
        shutil.rmtree(work, ignore_errors=True)


if __name__ == "__main__":
    main()
