"""``check`` and ``build`` agree over a wide config space, and the part as cut keeps the
hard-limit wall (hypothesis; short profile in CI, ``HYPOTHESIS_PROFILE=long`` for the long run).

For every config: check exit 0 or 1 => build (with --force) succeeds with the same rule table;
check exit 2 <=> build exit 2 with the same line. The solid's least wall, measured with the
CAD kernel (manifest ``hub.min_wall_mm``), is never under the hard limit.
"""

from __future__ import annotations

import pytest
from hypothesis import HealthCheck, given, settings, strategies as st

from generators.build import build_config
from generators.config import parse_config
from generators.design import design
from generators.errors import UserError
from generators.plan.hard_limits import wall_limit_mm
from generators.plan.limits import MIN_BORE_WALL_MM

from .test_property_builds import THREADS, configs


@st.composite
def wide_configs(draw):
    """The property-test configs widened to blind and counterbored holes, printed hubs,
    coarse mesh tolerances and thin bore walls."""
    data = draw(configs())
    k = 25.4 if data["units"] == "in" else 1.0
    hub = data["hub"]
    if draw(st.booleans()):
        hub["process"], hub["material"] = "printed", draw(st.sampled_from(["petg", "asa"]))
    else:
        hub["material"] = draw(st.sampled_from(["hdpe", "pom", "6061"]))
    size = hub.get("across_flats", hub.get("diameter"))
    if draw(st.booleans()):  # a bore leaving 2.5 to 8 mm of wall: some under the 3 mm limit
        hub["bore"] = round(size - 2 * draw(st.floats(2.5, 8.0)) / k, 4)
    holes = []
    for i in range(draw(st.integers(0, 2))):
        r = draw(st.floats(0.2, 0.45)) * size
        at = [round(r, 4), round(draw(st.floats(-0.2, 0.2)) * size, 4)]
        spec = {"id": f"X{i}", "face": draw(st.sampled_from(["top", "bottom"])), "at": at}
        kind = draw(st.sampled_from(["thread", "clearance", "diameter"]))
        if kind == "diameter":
            spec["diameter"] = round(draw(st.floats(3, 12)) / k, 4)
        else:
            spec[kind] = draw(st.sampled_from(THREADS))
            if kind == "clearance":
                extra = draw(st.sampled_from([None, "countersink", "counterbore"]))
                if extra:
                    spec[extra] = True
        if draw(st.booleans()):
            spec["depth"] = round(draw(st.floats(0.3, 1.0)) * hub["thickness"], 4)
        holes.append(spec)
    if holes:
        data["holes"] = holes
    data["output"] = {"tolerance": round(draw(st.sampled_from([0.02, 0.05, 0.3, 1.0])) / k, 6),
                      "angular_tolerance": draw(st.sampled_from([5, 10, 30]))}
    return data


def _check(data):
    try:
        d = design(parse_config(data))
    except UserError as exc:
        return 2, exc.line(), None
    return (1 if d.failed() else 0), None, d


@pytest.mark.slow
@settings(suppress_health_check=[HealthCheck.too_slow, HealthCheck.filter_too_much])
@given(wide_configs())
def test_check_and_build_agree_and_the_cut_part_keeps_its_walls(tmp_path_factory, data):
    code, line, d = _check(data)
    try:
        cfg = parse_config(data)
        result = build_config(cfg, tmp_path_factory.mktemp("agree"), force=True)
    except UserError as exc:
        assert code == 2, f"check said {code} but build refused: {exc.line()}"
        assert exc.line() == line
        return
    assert code in (0, 1), f"check refused ({line}) but build succeeded"
    m = result.manifest
    assert m["checks"]["rules"] == d.checks_json["rules"]  # the same rule table
    hub = m["hub"]
    if hub.get("min_wall_between"):
        a, b = hub["min_wall_between"]
        limit = MIN_BORE_WALL_MM if "bore" in (a, b) and (a.startswith("face:") or b.startswith("face:")) \
            else wall_limit_mm(cfg)
        assert hub["min_wall_mm"] >= limit - 1e-3, f"{a}-{b}: {hub['min_wall_mm']} mm on the solid"
        # the plan measures the same cuts: its least wall is never more than the solid's
        assert hub["plan_min_wall_mm"] <= hub["min_wall_mm"] + 0.05
