"""``hubwright build`` writes the templates for both demos, listed and hashed in the manifest."""

from __future__ import annotations

import json
import pathlib

import pytest

from generators.cli import main

ROOT = pathlib.Path(__file__).resolve().parents[2]


@pytest.mark.slow
@pytest.mark.parametrize("demo, name, faces", [
    ("six-spreader-portable.toml", "hex-portable-50", {"top", "flat-1", "flat-6"}),
    ("four-spreader-conduit.toml", "quad-emt-125", {"top", "flat-1", "chamfer-1", "chamfer-2"}),  # clamps 90 deg apart
])
def test_build_writes_templates(tmp_path, capsys, demo, name, faces):
    assert main(["build", str(ROOT / "configs" / demo), "--out", str(tmp_path)]) == 0
    out = capsys.readouterr().out
    assert "templates/templates.pdf" in out and "print at 100 %" in out
    folder = tmp_path / name
    manifest = json.loads((folder / "manifest.json").read_text(encoding="utf-8"))
    files = manifest["files"]
    assert "templates/templates.pdf" in files
    for sheet in manifest["templates"]:
        assert sheet["file"] in files
    assert faces <= {s["face"] for s in manifest["templates"]}
    for page in manifest["templates_pdf"]["pages"]:
        assert page["preview"] in files and (folder / page["preview"]).stat().st_size > 0
