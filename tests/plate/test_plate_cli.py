"""The plate demo through the command line: ``check`` and ``build`` exit 0 and print the plate."""

from __future__ import annotations

import pathlib

import pytest

from generators.cli import main

DEMO = pathlib.Path(__file__).resolve().parents[2] / "configs" / "four-spreader-plate.toml"


def test_check_passes_every_rule(capsys):
    assert main(["check", str(DEMO)]) == 0
    out = capsys.readouterr().out
    assert "0 failed" in out and "plate-bending" in out and "u-bolt-legs" in out


@pytest.mark.slow
def test_build_writes_the_plate(tmp_path, capsys):
    assert main(["build", str(DEMO), "--out", str(tmp_path)]) == 0
    out = capsys.readouterr().out
    assert "plate hub" in out and "two U-bolts each" in out and "plate.dxf" in out
    assert main(["build", str(DEMO), "--out", str(tmp_path)]) == 0  # a rebuild over it
    assert main(["build", str(DEMO), "--out", str(tmp_path), "--mast", "30 mm"]) == 2
