"""``hubwright check``: JSON keys, exit codes 0 / 1 / 2 in a real process, no CAD import."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

from .helpers import INCH, METRIC, ROOT, modified, toml_text

RULE_KEYS = {"id", "status", "value", "limit", "unit", "message", "source"}
WIND_KEYS = {"speed_m_s", "pressure_pa", "force_per_spreader_n", "moment_at_hub_nm", "spreader_stress_mpa",
             "bearing_pressure_mpa", "set_screw_pull_n", "safety_factor", "pressure_basis",
             # what the antenna puts on the mast (issue 15)
             "wind_area_m2", "mast_force_n", "mast_torque_nm", "weight_n", "ice_weight_n", "tip_deflection_mm"}


def hubwright(*args, cwd=ROOT):
    return subprocess.run([sys.executable, "-m", "generators", *args], cwd=cwd, capture_output=True,
                          text=True, timeout=60)


@pytest.mark.parametrize("path", [METRIC, INCH], ids=["metric", "inch"])
def test_json_keys_and_exit_0_on_the_demos(path):
    p = hubwright("check", str(path), "--json")
    assert p.returncode == 0, p.stderr
    data = json.loads(p.stdout)
    assert set(data) == {"rules", "wind", "sleeves"}
    assert data["rules"] and all(set(r) == RULE_KEYS for r in data["rules"])
    assert set(data["wind"]) == WIND_KEYS


def test_json_lists_each_sleeve_for_its_mast():
    """Mast ODs from the standards (ASME B36.10M: 1 NPS 1.315 in, 1-1/4 NPS 1.660 in; ANSI C80.3
    EMT 1-1/4 in 1.510 in; from memory); each sleeve fills the bore and clears its mast."""
    p = hubwright("check", str(ROOT / "configs" / "six-spreader-sleeves.toml"), "--json")
    sleeves = json.loads(p.stdout)["sleeves"]
    od_in = {s["mast"]: s["mast_od_mm"] / 25.4 for s in sleeves}
    assert od_in == {"1-1/4 in EMT": pytest.approx(1.510, abs=5e-4), "1 NPS sch 40 pipe": pytest.approx(1.315, abs=5e-4),
                     "1-1/4 NPS sch 40 pipe": pytest.approx(1.660, abs=5e-4)}
    for s in sleeves:
        assert s["mast_od_mm"] < s["id_mm"] < s["od_mm"]
        assert s["wall_mm"] == pytest.approx((s["od_mm"] - s["id_mm"]) / 2, abs=1e-3)


def test_default_config_is_the_metric_demo_and_prints_a_table():
    p = hubwright("check")
    assert p.returncode == 0, p.stderr
    assert "hex-portable-50" in p.stdout and "socket-wall" in p.stdout and "design pressure" in p.stdout
    assert "not a structural certification" in p.stdout


def test_thin_wall_exits_1_with_a_suggestion(tmp_path):
    cfg = tmp_path / "thin.toml"
    cfg.write_text(toml_text(modified(hub={"thickness": 24}, spreaders={"elevation": 0}, mast_pin=None)), encoding="utf-8")
    p = hubwright("check", str(cfg))
    assert p.returncode == 1, p.stdout + p.stderr
    line = next(ln for ln in p.stdout.splitlines() if ln.startswith("socket-wall"))
    assert "fail" in line
    assert "hub.thickness" in p.stdout


@pytest.mark.parametrize("args", [("check", "no-such.toml"), ("check", "BAD")])
def test_bad_input_exits_2(tmp_path, args):
    if args[1] == "BAD":
        bad = tmp_path / "bad.toml"
        bad.write_text(toml_text(modified(hub={"thickness": "thick"})), encoding="utf-8")
        args = ("check", str(bad))
    p = hubwright(*args, cwd=tmp_path)
    assert p.returncode == 2
    assert p.stderr.startswith("error: ") and len(p.stderr.strip().splitlines()) == 1


def test_check_does_not_import_the_cad_kernel():
    code = ("import sys; from generators.cli import main; rc = main(['check']);"
            "print(rc, 'cadquery' in sys.modules, 'matplotlib' in sys.modules, 'ezdxf' in sys.modules)")
    p = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, timeout=60)
    assert p.stdout.strip().splitlines()[-1] == "0 False False False"


def test_build_refuses_a_failed_rule_unless_forced():
    from generators.build import design_checks
    from generators.config.load import parse_config
    from generators.errors import DesignRuleError
    from generators.design import design

    d = design(parse_config(modified(hub={"thickness": 24}, spreaders={"elevation": 0}, mast_pin=None)))
    with pytest.raises(DesignRuleError) as exc:
        design_checks(d, force=False)
    assert exc.value.exit_code == 1 and "socket-wall" in exc.value.line() and "\n" not in exc.value.line()
    checks = design_checks(d, force=True)
    assert any(r["status"] == "fail" for r in checks["rules"])


def test_build_cli_exits_1_and_writes_nothing(tmp_path):
    cfg = tmp_path / "thin.toml"
    cfg.write_text(toml_text(modified(hub={"thickness": 24}, spreaders={"elevation": 0}, mast_pin=None)), encoding="utf-8")
    p = hubwright("build", str(cfg), "--out", str(tmp_path / "out"))
    assert p.returncode == 1
    assert "socket-wall" in p.stderr and "--force" in p.stderr
    assert not (tmp_path / "out" / "hex-portable-50").exists()


def test_mast_checks_the_sleeve_build_would_make():
    # the sleeve is bore less fit (0.1 mm) outside, mast OD plus clearance inside, as the
    # reducer planner makes it; its wall graded against 1.5 mm minimum, 3 mm recommended
    # (common practice)
    p = hubwright("check", str(METRIC), "--json", "--mast", "40 mm")
    assert p.returncode == 0, p.stderr
    rule = next(r for r in json.loads(p.stdout)["rules"] if r["id"] == "sleeve-wall")
    assert rule["status"] == "pass" and "40 mm" in rule["message"]
    thin = hubwright("check", str(METRIC), "--json", "--mast", "46 mm")
    assert next(r for r in json.loads(thin.stdout)["rules"] if r["id"] == "sleeve-wall")["status"] == "warn"
    bad = hubwright("check", str(METRIC), "--mast", "49 mm")
    assert bad.returncode == 2 and bad.stdout == ""
    assert bad.stderr.count("\n") == 1 and "--mast" in bad.stderr


def test_mast_on_a_printed_hub_with_captive_clamp_nuts():
    # the printed clamp hole has no tapped thread (its nut holds the screw): the sleeve note
    # takes the screw's own thread
    p = hubwright("check", str(ROOT / "configs" / "six-spreader-printed.toml"), "--json", "--mast", "30 mm")
    assert p.returncode in (0, 1), p.stderr
    assert "30 mm" in next(r for r in json.loads(p.stdout)["rules"] if r["id"] == "sleeve-wall")["message"]
