"""How long ``hubwright size`` takes for three dimensions, against ``hubwright check``.

Prints ratios, not pass/fail: whole-process wall time (median of a few runs) of ``size`` on
the inch demo (thickness, across flats and socket depth vary) and of ``check`` on the same
file, their ratio, the designs the search checked and the time per design. The config is
copied into a temporary folder so the sized file is not written beside the demo.
"""

from __future__ import annotations

import json
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
DEMOS = ("configs/four-spreader-conduit.toml", "configs/six-spreader-portable.toml")
TARGET_S = 5.0  # "a few seconds" for three dimensions
RUNS = 3


def wall(argv: list[str]) -> tuple[float, str]:
    times, out = [], ""
    for _ in range(RUNS):
        t = time.perf_counter()
        proc = subprocess.run([sys.executable, "-m", "generators", *argv], cwd=ROOT,
                              capture_output=True, text=True, check=False)
        times.append(time.perf_counter() - t)
        out = proc.stdout
    return statistics.median(times), out


def main() -> None:
    as_installed()
    with tempfile.TemporaryDirectory() as tmp:
        for demo in DEMOS:
            cfg = pathlib.Path(shutil.copy(ROOT / demo, tmp))
            t_size, out = wall(["size", str(cfg), "--json"])
            t_check, _ = wall(["check", str(cfg)])
            data = json.loads(out)
            n = len(data["design"])
            print(f"{demo}: size {t_size:.2f} s for {n} dimensions (target {TARGET_S:.0f} s,"
                  f" ratio {t_size / TARGET_S:.2f}); check {t_check:.2f} s; size / check"
                  f" {t_size / t_check:.1f}")


if __name__ == "__main__":
    main()
