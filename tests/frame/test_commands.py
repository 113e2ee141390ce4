"""``hubwright check`` in a real process: the spider-quad demo passes (exit 0); a printed hub
larger than a 220 x 220 mm bed is refused with exit 2, one line naming print.bed and the fixes.

Reference: DEVELOPERS.md exit codes (0 ok, 2 bad input or unbuildable design)."""

from __future__ import annotations

import subprocess
import sys

from tests.checks.helpers import ROOT, toml_text

DEMO = ROOT / "configs" / "spider-quad-tilted.toml"


def hubwright(*args):
    return subprocess.run([sys.executable, "-m", "generators", *args], cwd=ROOT, capture_output=True,
                          text=True, timeout=60)


def test_spider_demo_checks_clean():
    r = hubwright("check", str(DEMO))
    assert r.returncode == 0, r.stdout + r.stderr
    assert "0 failed" in r.stdout


def test_too_big_for_the_bed_exit_2(tmp_path):
    # a 230 mm puck: wider than 220 at any turn (a circle's width is its diameter)
    cfg = {"name": "big-print", "units": "mm", "mast": {"size": "50 mm"},
           "hub": {"style": "puck", "diameter": 230, "thickness": 60, "material": "petg", "process": "printed"},
           "spreaders": {"count": 6, "diameter": 16}, "print": {"bed": "220 x 220 x 250 mm"}}
    path = tmp_path / "big.toml"
    path.write_text(toml_text(cfg), encoding="utf-8")
    r = hubwright("check", str(path))
    assert r.returncode == 2
    line = r.stderr.strip()
    assert line.count("\n") == 0 and line.startswith("error: print.bed:")
    assert "220 mm x 220 mm x 250 mm" in line and "split" in line and "another bed" in line


def test_bed_in_inches_from_an_inch_config(tmp_path):
    # 9 in = 228.6 mm of bed (1 in = 25.4 mm exactly): the 230 mm (9.055 in) puck is 1.4 mm too wide
    cfg = {"name": "big-print-in", "units": "in", "mast": {"size": "2 in"},
           "hub": {"style": "puck", "diameter": "230 mm", "thickness": 2.4, "material": "petg",
                   "process": "printed"},
           "spreaders": {"count": 6, "diameter": 0.625}, "print": {"bed": "9 x 9 x 9"}}
    path = tmp_path / "big.toml"
    path.write_text(toml_text(cfg), encoding="utf-8")
    r = hubwright("check", str(path))
    assert r.returncode == 2 and "print.bed" in r.stderr
    assert "9.055 in x 9.055 in x 2.400 in" in r.stderr and "9.000 in x 9.000 in x 9.000 in bed" in r.stderr
