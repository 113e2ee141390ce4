"""The split demo built once per session (every writer), and its design."""

from __future__ import annotations

import json
import pathlib

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
SPLIT = ROOT / "configs" / "six-spreader-split-printed.toml"


@pytest.fixture(scope="session")
def split_design():
    from generators.config import load_config
    from generators.design import design

    return design(load_config(SPLIT))


@pytest.fixture(scope="session")
def split_build(tmp_path_factory):
    from generators.build import build

    res = build(SPLIT, tmp_path_factory.mktemp("split"))
    return res.folder, json.loads((res.folder / "manifest.json").read_text())
