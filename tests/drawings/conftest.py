"""Templates for every hub test config, written once per session without the CAD kernel.

Each case runs the plan and the templates writer only (no solids), into a temporary
folder, and keeps the manifest sections the writer adds next to the plan's own record.
"""

from __future__ import annotations

import copy
import pathlib
import tomllib
from dataclasses import dataclass

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
from tests.support.cases import all_cases, demo

# An inch block too big for one Letter page: its top face is tiled 2 x 2.
BIG_BLOCK_INCH = {
    "name": "big-block-inch", "units": "in",
    "mast": {"size": "2 in"},
    "hub": {"style": "block", "across_flats": 11, "thickness": 2, "corner_chamfer": 1.5, "material": "hdpe"},
    "spreaders": {"count": 4, "diameter": 1.25, "first_azimuth": 0, "socket_depth": 3},
    "set_screws": {"thread": "5/16-18", "per_spreader": 2, "point": "soft"},
    "mast_clamp": {"thread": "3/8-16", "count": 2},
    "holes": [{"id": "CB1", "at": [-3.5, 2.0], "clearance": "1/4-20", "counterbore": True},
              {"id": "BIG", "at": [3.0, -3.0], "diameter": 1.0, "depth": 1.0}],
}


def _a4_inch() -> dict:
    raw = demo("inch-demo")
    raw["name"] = "quad-emt-a4"
    raw.setdefault("output", {})["paper"] = "a4"
    return raw


CASES = all_cases()
CASES["big-block-inch"] = BIG_BLOCK_INCH
# Frozen designs for the tests that expect particular drill, tap and pilot names.
for _path in sorted((pathlib.Path(__file__).parent / "cases").glob("*.toml")):
    CASES[_path.stem] = tomllib.loads(_path.read_text(encoding="utf-8"))
CASES["quad-emt-a4"] = _a4_inch()
TILED = {"big-block-inch": "top", "tri-puck-30": "rim", "quad-puck-10": "rim"}


@dataclass
class Templates:
    name: str
    config: object
    plan: object
    folder: pathlib.Path
    manifest: dict
    summary: list

    def sheet(self, face: str) -> dict:
        return next(s for s in self.manifest["templates"] if s["face"] == face)

    def pages(self, face: str | None = None) -> list[dict]:
        pages = self.manifest["templates_pdf"]["pages"]
        return [p for p in pages if face is None or p["face"] == face]

    @property
    def pdf(self) -> pathlib.Path:
        return self.folder / self.manifest["templates_pdf"]["file"]


def make_templates(raw: dict, folder: pathlib.Path) -> Templates:
    from generators.build import BuildContext
    from generators.config.load import parse_config
    from generators.drawings.writer import write_templates
    from generators.design import design
    from generators.manifest import plan_record

    cfg = parse_config(copy.deepcopy(raw))
    d = design(cfg)
    plan = d.plan
    folder.mkdir(parents=True, exist_ok=True)
    ctx = BuildContext(design=d, folder=folder)
    write_templates(ctx)
    manifest = plan_record(plan)
    manifest.update(ctx.manifest)
    return Templates(cfg.name, cfg, plan, folder, manifest, ctx.summary)


@pytest.fixture(scope="session")
def templates(tmp_path_factory):
    cache: dict[str, Templates] = {}

    def get(name: str) -> Templates:
        if name not in cache:
            cache[name] = make_templates(CASES[name], tmp_path_factory.mktemp(name))
        return cache[name]

    return get
