"""One design, rendered many ways: the templates, the report and the manifest list the same
operations in the same order, and a build computes its design exactly once."""

from __future__ import annotations

import json
import pathlib

import pytest

from tests.support.operations import operation_mismatches

CONFIGS = pathlib.Path(__file__).resolve().parents[2] / "configs"

DEMOS = sorted(p.name for p in CONFIGS.glob("*.toml"))


@pytest.fixture(scope="module")
def builds(tmp_path_factory):
    from generators.build import build

    out = tmp_path_factory.mktemp("demos")
    return {name: build(CONFIGS / name, out) for name in DEMOS}


@pytest.mark.slow
@pytest.mark.parametrize("demo", DEMOS)
def test_report_templates_and_manifest_list_the_same_operations(builds, demo):
    r = builds[demo]
    assert r.manifest["operations"], "every demo has operations"
    assert operation_mismatches(r.folder, r.manifest) == []
    ops = r.manifest["operations"]
    for face in {o["face"] for o in ops}:
        steps = sorted(o["step"] for o in ops if o["face"] == face)
        assert steps == list(range(1, len(steps) + 1)), face


@pytest.mark.slow
@pytest.mark.parametrize("demo", DEMOS)
def test_bore_and_sockets_come_before_the_holes_that_break_into_them(builds, demo):
    ops = builds[demo].manifest["operations"]
    order = {"mark": 0, "bore": 1, "sockets": 2, "holes": 3}
    for face in {o["face"] for o in ops}:
        stages = [order[o["stage"]] for o in sorted((o for o in ops if o["face"] == face), key=lambda o: o["step"])]
        assert stages == sorted(stages), face


def test_a_build_computes_its_design_once(tmp_path, monkeypatch):
    import generators.plan.hub as hub
    import generators.plan.reducer as reducer
    import generators.plan.rules as rules
    from generators.build import build

    monkeypatch.setenv("HUBWRIGHT_SERIAL", "1")  # every writer in this process, where it is counted
    calls = {"plan": 0, "sleeve": 0, "rules": 0}

    def counted(name, fn):
        def wrapper(*a, **k):
            calls[name] += 1
            return fn(*a, **k)
        return wrapper

    monkeypatch.setattr(hub._Planner, "plan", counted("plan", hub._Planner.plan))
    monkeypatch.setattr(reducer, "plan_sleeve", counted("sleeve", reducer.plan_sleeve))
    monkeypatch.setattr(rules, "evaluate", counted("rules", rules.evaluate))
    result = build(CONFIGS / "six-spreader-sleeves.toml", tmp_path, masts=("38 mm",))
    n_sleeves = len(result.manifest["reducers"])
    assert calls == {"plan": 1, "sleeve": n_sleeves, "rules": 1}


def test_manifest_operations_are_plain_json(builds):
    ops = builds[DEMOS[0]].manifest["operations"]
    keys = {"face", "step", "operation", "holes", "tool", "tool_diameter_mm", "depth_mm", "note"}
    assert all(keys <= set(o) for o in ops)
    assert json.loads(json.dumps(ops)) == ops


def test_every_tapped_hole_has_its_tap_depth(builds):
    for r in builds.values():
        for h in r.manifest["holes"]:
            if h["thread"] and h["kind"] not in ("nut_pocket", "insert_pocket"):
                assert 0 < h["tap_depth_mm"] <= h["depth_mm"] + 1e-9, h["id"]


def test_tap_step_depth_is_where_the_manifest_says_the_thread_ends(builds):
    """The report's and templates' tap step and the manifest's ``tap_to_mm`` are one figure."""
    seen = 0
    for r in builds.values():
        holes = {h["id"]: h for h in r.manifest["holes"]}
        for op in r.manifest["operations"]:
            if op["operation"] != "tap" or op["through"]:
                continue
            for hid in op["holes"]:
                h = holes[hid]
                assert op["depth_mm"] == pytest.approx(h["tap_to_mm"], abs=1e-4), hid
                assert h["tap_to_mm"] == pytest.approx(h["thread_start_mm"] + h["tap_depth_mm"], abs=1e-4)
                seen += 1
    assert seen > 0


def test_threads_ending_in_a_socket_or_the_bore_are_tapped_on_through_the_wall(builds):
    """A plug tap stopped at the wall leaves part threads there, where the screw bears (common practice)."""
    r = builds["four-spreader-conduit.toml"]
    taps = [o for o in r.manifest["operations"] if o["operation"] == "tap"]
    assert taps and all("run the tap on into" in o["note"] for o in taps
                        if all(h[0] in "TC" for h in o["holes"]))


def test_the_report_gives_the_templates_tilt_notes(builds):
    """A tilted socket's set-up (angle, which way, jig) is in the report as on its template."""
    from generators.plan.tilt_notes import tilt_notes
    from generators.config import load_config
    from generators.plan.hub import build_plan

    r = builds["spider-quad-tilted.toml"]
    report = (r.folder / "report.md").read_text()
    cfg = load_config(CONFIGS / "spider-quad-tilted.toml")
    plan = build_plan(cfg)
    notes = [n for f in plan.faces for n in tilt_notes(plan, cfg, f.id)]
    assert notes, "the tilted demo has tilted holes"
    for n in notes:
        assert n in report
    dxf_text = " ".join(p.read_text(errors="ignore") for p in (r.folder / "templates").glob("*.dxf"))
    assert "Tilt for" in dxf_text


def test_a_face_waits_for_sockets_cut_from_other_faces(builds):
    """The top face's set screws break into sockets drilled from the flats: its template says
    STOP before them, in its own order (a template is read top to bottom)."""
    ops = builds["five-spreader-aluminium.toml"].manifest["operations"]
    top = sorted((o for o in ops if o["face"] == "top"), key=lambda o: o["step"])
    wait = next(i for i, o in enumerate(top) if o["operation"] == "wait")
    first_set_screw = next(i for i, o in enumerate(top) if o["operation"] in ("pilot", "drill")
                           and any(h.startswith("T") for h in o["holes"]))
    assert wait < first_set_screw
    assert set(top[wait]["holes"]) == {"S1", "S2", "S3", "S4", "S5"}
