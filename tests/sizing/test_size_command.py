"""``hubwright size``: JSON keys, bad --vary keys, loads no hub can meet, the target file,
stock sizes, several materials."""

from __future__ import annotations

import tomllib
from pathlib import Path

import pytest

from generators.config import load_config
from generators.design import design
from generators.sizing.stock import plate_thicknesses_mm
from tests.sizing.helpers import ROOT, copy, run, size_json

QUAD = ROOT / "configs" / "four-spreader-conduit.toml"
HEX = ROOT / "configs" / "six-spreader-portable.toml"


def test_json_keys(tmp_path):
    code, data = size_json(copy(HEX, tmp_path))
    assert code == 0
    assert {"file", "objective", "design", "mass_g", "lowest_safety_factor", "binding_rules",
            "candidates"} <= set(data)
    assert set(data["design"]) == {"hub.thickness", "hub.across_flats"}  # socket_depth is "to-bore"
    assert data["objective"] == "mass"
    assert data["binding_rules"]
    assert data["candidates"][0]["design"] == data["design"]
    masses = [c["mass_g"] for c in data["candidates"]]
    assert masses == sorted(masses)
    # design values in mm: the written file holds them in the config's (mm) units
    written = tomllib.loads(open(data["file"], encoding="utf-8").read())
    assert written["hub"]["thickness"] == pytest.approx(data["design"]["hub.thickness"])
    assert written["name"] == "hex-portable-50-sized"


def test_inch_values_stay_in_inches(tmp_path):
    code, data = size_json(copy(QUAD, tmp_path))
    assert code == 0
    written = tomllib.loads(open(data["file"], encoding="utf-8").read())
    t_in = written["hub"]["thickness"]
    assert t_in * 16 == pytest.approx(round(t_in * 16))  # a sixteenth of an inch
    assert data["design"]["hub.thickness"] == pytest.approx(t_in * 25.4)  # 25.4 mm/in exact
    assert set(data["design"]) == {"hub.thickness", "hub.across_flats", "spreaders.socket_depth"}


@pytest.mark.parametrize("key", ["hub.thicknes", "loads.wind_speed", "name", "hub.bore", "holes"])
def test_bad_vary_key_exits_2(tmp_path, key):
    cfg = copy(HEX, tmp_path)
    code, out, err = run(["size", str(cfg), "--vary", key])
    assert code == 2
    assert err.startswith("error: --vary:") and err.count("\n") == 1
    assert not (tmp_path / "six-spreader-portable.sized.toml").exists()


@pytest.mark.parametrize("jobs", ["0", "x", " 2", "1_0", "+2", "-1"])
def test_bad_jobs_exits_2_and_writes_nothing(tmp_path, jobs):
    cfg = copy(HEX, tmp_path)
    code, _, err = run(["size", str(cfg), "--jobs", jobs])
    assert code == 2 and "--jobs" in err and "a whole number of 1 or more" in err
    assert not (tmp_path / "six-spreader-portable.sized.toml").exists()


def test_loads_no_hub_can_meet_exit_1(tmp_path):
    """Drag goes as q = rho V^2 / 2, so the pole's safety factor scales as (V0 / V)^2 whatever the
    hub: at 4 x the demo's wind it is 1/16 of the demo's, below 1, and no hub size helps."""
    base = design(load_config(HEX)).checks_json
    sf0 = next(r["value"] for r in base["rules"] if r["id"] == "wind-spreader")
    assert sf0 / 16 < 1.0
    text = HEX.read_text(encoding="utf-8").replace('wind_speed = "30 m/s"', 'wind_speed = "120 m/s"')
    cfg = tmp_path / "storm.toml"
    cfg.write_text(text, encoding="utf-8")
    code, data = size_json(cfg)
    assert code == 1
    assert "wind-spreader" in data["unmet_rules"]
    assert data["best_attempt"]["design"]
    assert not (tmp_path / "storm.sized.toml").exists()
    code, out, err = run(["size", str(cfg)])
    assert code == 1 and "wind-spreader" in out and "best attempt" in out


def test_foreign_target_is_left_alone(tmp_path):
    cfg = copy(HEX, tmp_path)
    target = tmp_path / "six-spreader-portable.sized.toml"
    target.write_text("# mine\n", encoding="utf-8")
    code, out, err = run(["size", str(cfg)])
    assert code == 2 and "not written by hubwright size" in err
    assert target.read_text(encoding="utf-8") == "# mine\n"


def test_own_target_is_replaced(tmp_path):
    cfg = copy(HEX, tmp_path)
    assert size_json(cfg)[0] == 0
    assert size_json(cfg)[0] == 0  # the second run replaces what the first wrote


def test_stock_objective_takes_plate_thicknesses(tmp_path):
    code, data = size_json(copy(HEX, tmp_path), "--objective", "stock")
    assert code == 0
    assert min(abs(data["design"]["hub.thickness"] - t) for t in plate_thicknesses_mm("mm")) < 1e-9
    assert run(["check", data["file"]])[0] == 0


def test_several_materials(tmp_path):
    code, data = size_json(copy(HEX, tmp_path), "--materials", "pom", "hdpe")
    assert code == 0
    assert data["material"] in ("pom", "hdpe")
    assert {c["material"] for c in data["candidates"]} <= {"pom", "hdpe"}
    assert run(["size", str(tmp_path / "six-spreader-portable.toml"), "--materials", "unobtainium"])[0] == 2


def test_failing_start_is_grown(tmp_path):
    """A hub too small across the flats for its holes (check refuses) is grown, then sized.
    (Not too thin: the demo's through bolt sits at a fixed height, which sizing holds.)"""
    text = HEX.read_text(encoding="utf-8").replace("across_flats = 160", "across_flats = 110")
    cfg = tmp_path / "small.toml"
    cfg.write_text(text, encoding="utf-8")
    assert run(["check", str(cfg)])[0] != 0
    code, data = size_json(cfg)
    assert code == 0
    assert data["design"]["hub.across_flats"] > 110
    assert run(["check", data["file"]])[0] == 0


def test_strict_is_no_lighter_than_the_plain_search(tmp_path):
    """The metric demo warns on turning on the mast whatever the hub (friction cannot hold a
    gust's torque): --strict leaves that warning, sizes the rest to the recommended figures,
    and is never lighter than the plain search."""
    code, loose = size_json(copy(HEX, tmp_path / "a"), "--vary", "hub.thickness")
    code_s, strict = size_json(copy(HEX, tmp_path / "b"), "--strict", "--vary", "hub.thickness")
    assert code == 0 and code_s == 0
    assert strict["mass_g"] >= loose["mass_g"] - 1e-6
    base = design(load_config(HEX)).checks_json
    warned = {r["id"] for r in base["rules"] if r["status"] == "warn"}
    assert set(strict["strict_left_warnings"]) <= warned


def test_stock_grid_ends_at_the_table():
    """Past the largest plate in the table a point is off the grid: refused, not a crash."""
    from generators.sizing.search import Space
    from generators.sizing.space import dimensions

    raw = tomllib.loads(HEX.read_text(encoding="utf-8"))
    dims = dimensions(load_config(HEX), raw, ["hub.thickness"], "stock")
    assert dims[0].series == plate_thicknesses_mm("mm")
    assert dims[0].value(dims[0].start) == 55.0  # 51 mm rounds up to the next plate
    space = Space(raw, "mm", dims, None, "stock", False)
    off = space((len(dims[0].series),))
    assert not off.ok and off.refusal == "outside the grid"


def test_strict_leaves_warnings_no_hub_size_lifts(tmp_path):
    """A pole's own strength and friction against a gust do not depend on the hub: --strict
    sizes every other rule to its recommended figure and says which it left (the rules' own
    verdicts, judged by loading the sized file)."""
    from tests.sizing.helpers import load_config_from

    cfg = copy(ROOT / "configs" / "four-spreader-conduit.toml", tmp_path)
    code, data = size_json(cfg, "--strict", "--vary", "hub.thickness")
    assert code == 0, data
    assert "wind-spreader" in data["strict_left_warnings"]
    raw = tomllib.loads(Path(data["file"]).read_text())
    from generators.design import design

    rules = design(load_config_from(raw)).checks_json["rules"]
    warns = {r["id"] for r in rules if r["status"] == "warn"}
    assert not [r for r in rules if r["status"] == "fail"]
    assert warns <= set(data["strict_left_warnings"]), warns
