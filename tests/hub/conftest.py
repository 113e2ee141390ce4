"""Shared fixtures: each hub config is built once per test session and its STEP re-read."""

from __future__ import annotations

import pathlib
from dataclasses import dataclass, field

import pytest

from tests.support.cases import all_cases

ROOT = pathlib.Path(__file__).resolve().parents[2]

CASES = all_cases()


@dataclass
class Built:
    name: str
    raw: dict
    config: object
    folder: pathlib.Path
    manifest: dict
    _solid: object = field(default=None, repr=False)

    @property
    def solid(self):
        """The hub as re-imported from hub.step by cadquery (what a user receives)."""
        if self._solid is None:
            import cadquery as cq

            shape = cq.importers.importStep(str(self.folder / "hub.step"))
            solids = shape.solids().vals()
            assert len(solids) == 1, f"{self.name}: hub.step holds {len(solids)} solids"
            self._solid = solids[0]
        return self._solid


@pytest.fixture(scope="session")
def build_case(tmp_path_factory):
    """``build_case(name)`` builds the named case once and returns a ``Built``."""
    from generators.build import build_config
    from generators.config import parse_config

    cache: dict[str, Built] = {}
    out = tmp_path_factory.mktemp("hubs")

    def get(name: str) -> Built:
        if name not in cache:
            raw = CASES[name]
            cfg = parse_config(raw)
            result = build_config(cfg, out=out)
            cache[name] = Built(name=name, raw=raw, config=cfg, folder=result.folder,
                                manifest=result.manifest)
        return cache[name]

    return get
