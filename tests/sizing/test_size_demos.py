"""``hubwright size`` on every demo: the sized file passes ``check``, is no heavier than the
demo, and is locally minimal -- one shop step smaller in any varied dimension makes ``check``
fail a rule or refuse the design (judged here by loading the edited TOML, not by the search)."""

from __future__ import annotations

import tomllib

import pytest

from tests.sizing.helpers import DEMOS, ROOT, mass_g, one_step_smaller, run, sized_demo, verdict


@pytest.fixture(params=DEMOS)
def sized(request, tmp_path_factory):
    return sized_demo(request.param, tmp_path_factory)


def test_sized_passes_check(sized):
    cfg, code, data = sized
    assert code == 0
    assert data["file"].endswith(".sized.toml")
    assert run(["check", data["file"]])[0] == 0


def test_sized_is_no_heavier(sized):
    cfg, code, data = sized
    from pathlib import Path

    assert mass_g(Path(data["file"])) <= mass_g(cfg) + 1e-6
    assert abs(mass_g(Path(data["file"])) - data["mass_g"]) < 0.1


def test_sized_is_locally_minimal(sized):
    cfg, code, data = sized
    raw = tomllib.loads(open(data["file"], encoding="utf-8").read())
    assert verdict(raw) == "pass"
    for key in data["design"]:
        smaller = verdict(one_step_smaller(raw, key))
        assert smaller != "pass", f"{key} one step smaller still passes"


def test_config_left_alone(sized):
    cfg, code, data = sized
    assert cfg.read_bytes() == (ROOT / "configs" / cfg.name).read_bytes()
