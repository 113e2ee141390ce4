"""Blind holes keep a floor, counterbores stay inside their hole, and ``through = false`` is
never silently ignored (the 1.5 mm web is the hard limit of generators/plan/limits.py,
common practice)."""

from __future__ import annotations

import math

import pytest

from generators.config.load import parse_config
from generators.design import design
from generators.errors import UserError
from generators.plan.limits import MIN_WEB_MM
from tests.checks.helpers import demo


def _with_hole(**hole) -> dict:
    data = demo()
    thickness = data["hub"]["thickness"]
    spec = {"id": "X1", "face": "top", "at": [0.0, -40.0], "diameter": 6.0, **hole}
    data["holes"] = [spec]
    return data, thickness


def _refusal(data) -> UserError:
    with pytest.raises(UserError) as exc:
        design(parse_config(data))
    return exc.value


def test_blind_hole_deeper_than_the_floor_allows_is_refused():
    data, T = _with_hole(depth=None)
    data["holes"][0]["depth"] = T - 0.1
    err = _refusal(data)
    assert err.key == "holes[0].depth" and "under the" in err.problem


def test_blind_hole_with_its_floor_builds():
    data, T = _with_hole()
    d0 = design(parse_config(data))
    r = d0.plan.hole("X1").radius_mm
    tip = r / math.tan(math.radians(59.0))  # a 118 deg drill point (ISO 5419 geometry, from memory)
    data["holes"][0]["depth"] = T - MIN_WEB_MM - tip - 0.5
    d = design(parse_config(data))
    h = d.plan.hole("X1")
    assert not h.through and h.point_deg == 118.0
    assert d.plan.body.thickness_mm - h.depth_mm - tip >= MIN_WEB_MM
    floor = next(w for w in d.walls if w.a == "X1" and w.b == "face:bottom")
    assert floor.mm == pytest.approx(T - h.depth_mm - tip, abs=0.02)  # measured under the point


def test_blind_hole_point_deeper_than_the_floor_allows_is_refused():
    # flat depth leaves 1.6 mm, but the drill point runs deeper than the 1.5 mm floor allows
    data, T = _with_hole()
    data["holes"][0]["depth"] = T - 1.6
    err = _refusal(data)
    assert err.key == "holes[0].depth" and "drill point" in err.problem


def test_through_false_without_a_depth_is_refused():
    data, _ = _with_hole(through=False)
    err = _refusal(data)
    assert err.key == "holes[0].through"


def test_counterbore_deeper_than_its_hole_is_refused():
    data, _ = _with_hole(clearance="M12", counterbore=True, depth=2)
    del data["holes"][0]["diameter"]
    data["holes"][0]["at"] = [0.0, -45.0]
    err = _refusal(data)
    assert err.key == "holes[0].counterbore"  # ISO 4762 M12 head 12 mm high: 12.5 mm counterbore


def test_a_hole_deeper_than_a_jobber_drill_names_the_longer_drill():
    # the conduit demo's clamp holes run 3.8 in to the bore: past a #5 jobber's 47 mm and a long
    # series' 87 mm of flute (DIN 338 / DIN 340, from memory)
    from tests.checks.helpers import INCH

    d = design(parse_config(demo(INCH)))
    notes = [op.note for op in d.operations if op.operation == "drill" and "C1" in op.holes]
    assert notes and "extension (aircraft) drill" in notes[0]
    short = [op.note for op in d.operations if op.operation == "drill" and "T1" in op.holes]
    assert short and "flute" not in short[0]  # 0.875 in: a jobber drill reaches


def test_a_deep_blind_thread_is_tapped_only_as_deep_as_it_engages():
    # M5x0.8 in 6061: 1.5 D = 7.5 mm of thread plus 2 pitches of plug-tap lead = 9.1 mm
    # (engagement in metals, common practice; M5 pitch 0.8 mm from ISO 261)
    data, T = _with_hole(thread="M5", depth=20.0)
    del data["holes"][0]["diameter"]
    data["hub"]["material"] = "aluminium-6061"
    d = design(parse_config(data))
    tap = next(op for op in d.operations if op.operation == "tap" and "X1" in op.holes)
    assert tap.depth_mm == pytest.approx(1.5 * 5.0 + 2 * 0.8)
    assert d.plan.hole("X1").depth_mm == pytest.approx(20.0)  # drilled deeper, threaded only where needed
