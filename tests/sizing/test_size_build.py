"""Sized demos go through ``build`` (the slow path: the CAD kernel cuts them): the block, and
the printed split hub, whose halves and bolts are planned again at the new size."""

from __future__ import annotations

import json

import pytest

from tests.sizing.helpers import sized_demo

CASES = {"six-spreader-portable.toml": ("hex-portable-50-sized", ["hub.step"]),
         "six-spreader-split-printed.toml": ("hex-split-printed-50-sized", ["hub-a.step", "hub-b.step"])}


@pytest.mark.slow
@pytest.mark.parametrize("name", sorted(CASES))
def test_sized_demo_builds(name, tmp_path, tmp_path_factory):
    from generators.build import build

    folder, solids = CASES[name]
    _, code, data = sized_demo(name, tmp_path_factory)
    assert code == 0
    result = build(data["file"], out=tmp_path / "out")
    manifest = json.loads((result.folder / "manifest.json").read_text(encoding="utf-8"))
    assert result.folder.name == folder
    for solid in solids:
        assert (result.folder / solid).stat().st_size > 0
    assert not [r for r in manifest["checks"]["rules"] if r["status"] == "fail"]
