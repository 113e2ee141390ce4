"""One design, rendered many ways: the templates, the report and the manifest list the same
operations in the same order, and a build computes its design exactly once."""

from __future__ import annotations

import json
import re

import pymupdf
import pytest

import pathlib

CONFIGS = pathlib.Path(__file__).resolve().parents[2] / "configs"

DEMOS = sorted(p.name for p in CONFIGS.glob("*.toml"))


@pytest.fixture(scope="module")
def builds(tmp_path_factory):
    from generators.build import build

    out = tmp_path_factory.mktemp("demos")
    return {name: build(CONFIGS / name, out) for name in DEMOS}


def _report_rows(md: str) -> list[tuple[str, int, tuple[str, ...], str]]:
    """(face, step, holes, tool) for every row of the report's schedule tables."""
    rows, face = [], None
    for line in md.splitlines():
        head = re.match(r"^### \d+\. (\S+)", line)
        if head:
            face = head.group(1)
            continue
        if line.startswith("## ") and face is not None and not line.startswith("### "):
            face = None
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if face and line.startswith("| ") and cells and cells[0].isdigit():
            holes = tuple(h for h in cells[2].split(", ") if h and h != "-")
            rows.append((face, int(cells[0]), holes, cells[3]))
    return rows


@pytest.mark.slow
@pytest.mark.parametrize("demo", DEMOS)
def test_report_and_manifest_list_the_same_operations(builds, demo):
    r = builds[demo]
    ops = r.manifest["operations"]
    assert ops, "every demo has operations"
    manifest_rows = sorted((o["face"], o["step"], tuple(o["holes"]), o["tool"].replace("|", "/")) for o in ops)
    report = (r.folder / "report.md").read_text(encoding="utf-8")
    assert sorted(_report_rows(report)) == manifest_rows
    for face in {o["face"] for o in ops}:
        steps = sorted(o["step"] for o in ops if o["face"] == face)
        assert steps == list(range(1, len(steps) + 1)), face


def _pdf_text(r, face: str) -> str:
    tp = r.manifest["templates_pdf"]
    doc = pymupdf.open(r.folder / tp["file"])
    return " ".join(" ".join(doc[p["page"] - 1].get_text().split()) for p in tp["pages"] if p["face"] == face)


@pytest.mark.slow
@pytest.mark.parametrize("demo", DEMOS)
def test_templates_follow_the_manifest_operations_in_order(builds, demo):
    r = builds[demo]
    if not r.manifest["templates_pdf"].get("made"):
        pytest.skip("a printed hub has no templates")
    for face in sorted({o["face"] for o in r.manifest["operations"]}):
        text = _pdf_text(r, face)
        at = -1
        for o in sorted((o for o in r.manifest["operations"] if o["face"] == face), key=lambda o: o["step"]):
            lead = f"{o['step']}. "
            pos = text.find(lead, at + 1)
            assert pos > at, (face, o["step"], "step number missing or out of order")
            window = text[pos:pos + 400]
            for hid in o["holes"]:
                assert hid in window, (face, o["step"], hid)
            at = pos


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
    result = build(CONFIGS / "six-spreader-sleeves.toml", tmp_path, masts=("30 mm",))
    n_sleeves = len(result.manifest["reducers"])
    assert calls == {"plan": 1, "sleeve": n_sleeves, "rules": 1}


def test_manifest_operations_are_plain_json(builds):
    ops = builds[DEMOS[0]].manifest["operations"]
    keys = {"face", "step", "operation", "holes", "tool", "tool_diameter_mm", "depth_mm", "note"}
    assert all(keys <= set(o) for o in ops)
    assert json.loads(json.dumps(ops)) == ops
