"""One sized demo goes through ``build`` (the slow path: the CAD kernel cuts it)."""

from __future__ import annotations

import json

import pytest

from tests.sizing.helpers import ROOT, copy, size_json


@pytest.mark.slow
def test_sized_demo_builds(tmp_path):
    from generators.build import build

    code, data = size_json(copy(ROOT / "configs" / "six-spreader-portable.toml", tmp_path / "cfg"))
    assert code == 0
    result = build(data["file"], out=tmp_path / "out")
    manifest = json.loads((result.folder / "manifest.json").read_text(encoding="utf-8"))
    assert result.folder.name == "hex-portable-50-sized"
    assert (result.folder / "hub.step").stat().st_size > 0
    assert not [r for r in manifest["checks"]["rules"] if r["status"] == "fail"]
