"""The ``hubwright threads`` command: text, JSON and errors."""

import argparse
import json
import pathlib
import subprocess
import sys

import pytest

from generators.commands import threads
from generators.errors import UserError

ROOT = pathlib.Path(__file__).resolve().parents[2]


def _run(argv, capsys):
    parser = argparse.ArgumentParser()
    threads.add_arguments(parser)
    assert threads.run(parser.parse_args(argv)) == 0
    return capsys.readouterr().out


def test_chart_fits_80_columns(capsys):
    out = _run([], capsys)
    assert "1/4-20 UNC" in out and "M12x1.75" in out
    assert max(len(line) for line in out.splitlines()) <= 80


def test_detail(capsys):
    out = _run(["1/4-20", "M6"], capsys)
    assert "#7 (0.2010 in)" in out and "5.0 mm" in out and "ISO 4032" in out
    assert max(len(line) for line in out.splitlines()) <= 80


def test_json(capsys):
    data = json.loads(_run(["M6", "1/4-20", "--json"], capsys))
    m6, q = data
    assert m6["standard"] == "iso-metric" and m6["tpi"] is None
    assert m6["tap_drill"]["name"] == "5.0 mm" and m6["tap_drill"]["diameter_mm"] == 5.0
    assert m6["clearance_mm"] == {"close": 6.4, "normal": 6.6, "loose": 7.0}  # ISO 273
    assert m6["minor_min_mm"] == pytest.approx(4.917, abs=0.001)  # ISO 965-2 6H
    assert q["tpi"] == 20 and q["tap_drill"]["name"] == "#7" and q["within_limits"] is True


def test_material_and_drills(capsys):
    data = json.loads(_run(["1/4-20", "--material", "hdpe", "--drills", "metric", "--json"], capsys))
    assert data[0]["tap_drill"]["series"] == "metric"
    assert data[0]["tap_drill"]["target_percent"] == 65.0


@pytest.mark.parametrize("argv,key", [(["1/4-19"], "thread"), (["--material", "cheese"], "--material"),
                                      (["--drills", "numbr"], "shop.drills")])
def test_errors(argv, key, capsys):
    with pytest.raises(UserError) as err:
        _run(argv, capsys)
    assert err.value.key == key


def test_light_imports():
    code = ("import sys, generators.commands.threads, generators.standards.pipes, generators.standards.materials;"
            "bad = {'cadquery', 'ezdxf', 'matplotlib', 'pint', 'numpy', 'rich'} & set(sys.modules);"
            "print(sorted(bad))")
    out = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"


@pytest.mark.skipif(not (ROOT / "generators" / "cli.py").exists(), reason="generators/cli.py not written yet")
def test_process():
    out = subprocess.run([sys.executable, "-m", "generators", "threads", "M6", "--json"], cwd=ROOT,
                         capture_output=True, text=True)
    assert out.returncode == 0, out.stderr
    assert json.loads(out.stdout)[0]["tap_drill"]["name"] == "5.0 mm"
    bad = subprocess.run([sys.executable, "-m", "generators", "threads", "M7x3"], cwd=ROOT,
                         capture_output=True, text=True)
    assert bad.returncode == 2 and "did you mean" in bad.stderr
