"""The batch pool: several configs, one of them broken; the others are built whole and the
broken one comes back as its one error line, the same line a single build gives."""

from __future__ import annotations

import hashlib
import json
import shutil
from pathlib import Path

import pytest

from generators.batch import build_many, exit_status
from generators.config import load_config
from generators.errors import UserError

ROOT = Path(__file__).resolve().parents[2]
pytestmark = pytest.mark.slow

GOOD = ("configs/four-spreader-conduit.toml", "configs/six-spreader-portable.toml",
        "configs/six-spreader-printed.toml")


def test_one_failure_never_stops_the_others(tmp_path):
    bad = tmp_path / "broken.toml"
    text = (ROOT / GOOD[1]).read_text(encoding="utf-8").replace('name = "hex-portable-50"', 'name = "broken"')
    bad.write_text(text.replace('size = "50 mm"', 'size = "a broomstick"'), encoding="utf-8")
    with pytest.raises(UserError) as single:
        load_config(bad)
    configs = [str(ROOT / GOOD[0]), str(bad), str(ROOT / GOOD[1]), str(ROOT / GOOD[2])]
    seen = []
    results = build_many(configs, str(tmp_path / "out"), on_result=lambda r: seen.append(r.config))

    assert [r.config for r in results] == configs  # in the order given
    assert sorted(seen) == sorted(configs)  # the progress callback heard of each once
    assert [r.code for r in results] == [0, 2, 0, 0]
    assert results[1].error == single.value.line()
    assert exit_status(results) == 2
    assert not (tmp_path / "out" / "broken").exists()
    for r in results[:1] + results[2:]:
        folder = Path(r.folder)
        manifest = json.loads((folder / "manifest.json").read_text(encoding="utf-8"))
        assert manifest["name"] == load_config(r.config).name
        for name, digest in manifest["files"].items():  # every file whole (sha256, hashlib)
            assert hashlib.sha256((folder / name).read_bytes()).hexdigest() == digest, name
    leftovers = [p.name for p in (tmp_path / "out").iterdir() if p.name.startswith(".")]
    assert leftovers == []
    shutil.rmtree(tmp_path / "out")
