"""``hubwright size``: JSON keys, bad --vary keys, loads no hub can meet, the target file,
stock sizes, several materials."""

from __future__ import annotations

import tomllib

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


def test_strict_cannot_lift_warnings_the_hub_does_not_decide(tmp_path):
    """The metric demo warns on its brittle poles in its wind and on turning on the mast
    (its through bolt bears on acetal): no hub size lifts those, so --strict has no
    answer and says which rules bind, while the plain search finds one."""
    code, loose = size_json(copy(HEX, tmp_path / "a"))
    code_s, strict = size_json(copy(HEX, tmp_path / "b"), "--strict")
    assert code == 0 and code_s == 1
    assert set(strict["unmet_rules"]) & {"wind-spreader", "mast-retention"}


def test_strict_cannot_lift_a_pole_warning(tmp_path):
    """The quad demo's poles warn in its wind whatever the hub (the spreader stress does not
    depend on the hub), so sizing to the recommended figures has no answer."""
    base = design(load_config(QUAD)).checks_json
    assert next(r for r in base["rules"] if r["id"] == "wind-spreader")["status"] == "warn"
    code, data = size_json(copy(QUAD, tmp_path), "--strict")
    assert code == 1 and "wind-spreader" in data["unmet_rules"]


def test_stock_grid_ends_at_the_table():
    """Past the largest plate in the table a point is off the grid: refused, not a crash."""
    from generators.sizing.search import Space
    from generators.sizing.space import dimensions

    raw = tomllib.loads(HEX.read_text(encoding="utf-8"))
    dims = dimensions(load_config(HEX), raw, ["hub.thickness"], "stock")
    assert dims[0].series == plate_thicknesses_mm("mm")
    assert dims[0].value(dims[0].start) == 50.0  # 46 mm rounds up to the next plate
    space = Space(raw, "mm", dims, None, "stock", False)
    off = space((len(dims[0].series),))
    assert not off.ok and off.refusal == "outside the grid"
