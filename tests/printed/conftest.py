"""Builds shared by the printed-hub tests: each demo is built once per session, with only
the writers these tests are about (the hub solid, print checks, jig, tip cap)."""

from __future__ import annotations

import pathlib
from dataclasses import dataclass

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
PRINTED = ROOT / "configs" / "six-spreader-printed.toml"
TILTED = ROOT / "configs" / "six-spreader-portable.toml"


@dataclass
class Built:
    config: object
    plan: object
    folder: pathlib.Path
    manifest: dict
    summary: list


def _build(path: pathlib.Path, folder: pathlib.Path) -> Built:
    from generators.build import BuildContext
    from generators.cad.extras_writer import write_jig, write_print_checks, write_tip_cap
    from generators.cad.writer import write_hub
    from generators.config import load_config
    from generators.design import design
    from generators.drawings.jig_dxf import write_jig_drawing

    cfg = load_config(path)
    d = design(cfg)
    plan = d.plan
    folder.mkdir(parents=True, exist_ok=True)
    ctx = BuildContext(design=d, folder=folder, config_path=path)
    for writer in (write_hub, write_print_checks, write_jig, write_jig_drawing, write_tip_cap):
        writer(ctx)
    return Built(cfg, plan, folder, ctx.manifest, ctx.summary)


@pytest.fixture(scope="session")
def printed(tmp_path_factory) -> Built:
    return _build(PRINTED, tmp_path_factory.mktemp("printed"))


@pytest.fixture(scope="session")
def tilted(tmp_path_factory) -> Built:
    return _build(TILTED, tmp_path_factory.mktemp("tilted"))


@pytest.fixture(scope="session")
def printed_solid(printed):
    import cadquery as cq

    return cq.importers.importStep(str(printed.folder / "hub.step")).solids().vals()[0]


@pytest.fixture(scope="session")
def cap_solid(printed):
    from generators.cad.tipcap import tip_cap_solid
    from generators.plan.tipcap import tip_cap_plan

    return tip_cap_solid(tip_cap_plan(printed.config))
