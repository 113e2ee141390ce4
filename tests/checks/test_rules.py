"""Each design rule passes on the demos and fires on a crafted bad design.

Limits are shop rules (common practice) unless named: the thread engagement factor comes
from the materials table, set-screw stock lengths from ISO 4026/4029 (from memory).
"""

from __future__ import annotations

import dataclasses
import math

import pytest

from generators.errors import UserError
from generators.plan.rules import evaluate, estimate_volume_mm3
from .helpers import INCH, INCH_CASE, METRIC, METRIC_CASE, checks_for, demo, modified, rule

GEOMETRIC = ("socket-wall", "socket-web", "socket-bore", "thread-engagement", "set-screw-length",
             "edge-distance", "socket-depth", "socket-tilt", "sleeve-wall", "mass")


@pytest.mark.parametrize("path", [METRIC, INCH], ids=["metric", "inch"])
def test_demos_pass_every_design_rule(path):
    _, _, checks = checks_for(demo(path))
    by_id = {r.id: r for r in checks.rules}
    for rid in GEOMETRIC:
        assert by_id[rid].status == "pass", by_id[rid]
    assert not [r for r in checks.rules if r.status == "fail"]
    for rid in ("wind-spreader", "wind-bearing", "wind-set-screw"):
        assert by_id[rid].status in ("pass", "warn")  # wind figures only warn


def test_rule_results_carry_every_key():
    _, _, checks = checks_for(demo(METRIC_CASE))
    for r in checks.as_json()["rules"]:
        assert set(r) == {"id", "status", "value", "limit", "unit", "message", "source"}
        assert r["status"] in ("pass", "warn", "fail") and r["source"]


def test_thin_wall_fails_with_a_suggestion():
    # 24 mm thick, level 20.5 mm sockets: (24 - 20.5) / 2 = 1.75 mm of wall, under the
    # 3 mm minimum for plastics (common practice)
    _, _, checks = checks_for(modified(hub={"thickness": 24}, spreaders={"elevation": 0}, mast_pin=None))
    r = rule(checks, "socket-wall")
    assert r.status == "fail"
    assert r.value == pytest.approx((24 - 20.5) / 2, abs=0.01)  # sampled on the true shapes, to 0.01 mm
    assert "hub.thickness" in r.message


def test_socket_web_between_neighbours():
    # 23.5 mm sockets (r = 11.75) running into the 51 mm bore (R = 25.5), 60 deg apart, level:
    # the nearest material is where each socket's side meets the bore circle, at asin(r/R)
    # either side of its axis, so the web is the chord 2 R sin(30 deg - asin(r/R)) = 2.28 mm
    # (plane geometry; the chord between the axes less the diameter, 2 mm, understates it)
    _, _, checks = checks_for(modified(spreaders={"diameter": 23}))
    r = rule(checks, "socket-web")
    assert r.status == "fail"
    expected = 2 * 25.5 * math.sin(math.radians(30) - math.asin(11.75 / 25.5))
    assert r.value == pytest.approx(expected, abs=0.02)


def test_blind_socket_close_to_the_bore():
    # inch demo: 6 in across flats -> 76.2 mm to the flat; bore 39.37 mm; a 2.146 in socket
    # ends 76.2 - 54.51 = 21.69 mm from the axis, 2.0 mm outside the bore
    _, _, checks = checks_for(modified(INCH_CASE, spreaders={"socket_depth": "2.146 in"}))
    r = rule(checks, "socket-bore")
    assert r.status == "fail"
    assert r.value == pytest.approx(76.2 - 2.146 * 25.4 - 39.37 / 2, abs=0.01)


def test_thread_engagement_in_a_thin_hub():
    # 30 mm thick, level sockets: from the top face to the socket wall 15 - 10.25 = 4.75 mm
    # of M6 thread = 0.79 D, under the 1 x D minimum (table factor 1.5 x D recommended)
    _, _, checks = checks_for(modified(hub={"thickness": 30}, spreaders={"elevation": 0}, mast_pin=None))
    r = rule(checks, "thread-engagement")
    assert r.status == "fail"
    assert r.value == pytest.approx(4.75 / 6.0, abs=1e-3)


def test_set_screw_length_chosen_from_stock_by_hand():
    # hand calculation, metric demo: the set screw hole runs 23 mm from the top face to the
    # socket axis; the 20 mm pole pushed onto the far side of the 20.5 mm socket has its top
    # (20 - 10.25) / cos(10 deg) above the axis (measured vertically in a socket tilted
    # 10 deg), so the gap to the pole is 13.10 mm; the longest ISO 4026 M6 stock length
    # (6, 8, 10, 12, 16 ... mm, from memory) not over it is 12 mm.
    _, _, checks = checks_for(demo(METRIC_CASE))
    gap = 23.0 - (20.0 - 10.25) / math.cos(math.radians(10))
    f = checks.set_screws[0]
    assert f["gap_to_pole_mm"] == pytest.approx(gap, abs=1e-6)
    assert f["length_mm"] == 12.0
    assert rule(checks, "set-screw-length").status == "pass"


@pytest.mark.parametrize("length, status", [(16, "fail"), (6, "warn")])
def test_set_screw_too_long_or_too_short(length, status):
    # frozen metric case: 16 mm stands 2.9 mm proud; 6 mm leaves 6 - (13.10 - 12.59) = 5.5 mm in the thread, < 1 D
    _, _, checks = checks_for(modified(METRIC_CASE, set_screws={"length": length}))
    r = rule(checks, "set-screw-length")
    assert r.status == status
    if status == "fail":
        assert "proud" in r.message and "12 mm" in r.message  # suggests the stock length that fits


def test_edge_distance_warns_then_fails():
    # a 6 mm hole at (0, 83) is 90.64 - 83 - 3 = 4.64 mm (0.77 D) from the chamfer at 90 deg:
    # inside the planner's half-diameter limit, under the recommended 1 x D
    data = modified(holes=[{"id": "TIE", "face": "top", "at": [0.0, 83.0], "diameter": 6}], hub={"corner_chamfer": 6},
                    mast_pin=None)
    cfg, plan, checks = checks_for(data)
    r = rule(checks, "edge-distance")
    assert r.status == "warn" and "TIE" in r.message
    # crafted plan (bypassing the planner's refusal): moved to 0.6 mm from the edge
    holes = tuple(dataclasses.replace(h, entry_mm=(0.0, 87.0, h.entry_mm[2])) if h.id == "TIE" else h
                  for h in plan.holes)
    # under the half-diameter hard limit a design is refused (exit 2), --force or not
    with pytest.raises(UserError) as err:
        evaluate(cfg, dataclasses.replace(plan, holes=holes))
    assert err.value.key == "holes[0].at" and "TIE" in err.value.problem


@pytest.mark.parametrize("depth, status", [(25, "warn"), (18, "fail")])
def test_socket_depth_for_bending_support(depth, status):
    # 25 mm / 20 mm = 1.25 D (under 1.5 D, common practice); 18 mm = 0.9 D (under 1 D)
    _, _, checks = checks_for(modified(spreaders={"socket_depth": depth}))
    r = rule(checks, "socket-depth")
    assert r.status == status
    assert r.value == pytest.approx(depth / 20.0, rel=1e-6)


def test_socket_tilt():
    _, _, checks = checks_for(modified(METRIC_CASE, spreaders={"elevation": "20 deg"}))
    r = rule(checks, "socket-tilt")
    assert r.status == "fail" and r.value == pytest.approx(20.0)
    assert "spreaders.elevation" in r.message
    # the limit agrees with the wall formula: at the limit the wall is the 3 mm minimum
    # (socket centred in the 46 mm body, half-run (80 - 25.5)/2, radius 10.25)
    e = math.radians(r.limit)
    wall = 23.0 - (80 - 25.5) / 2 * math.tan(e) - 10.25 / math.cos(e)
    assert wall == pytest.approx(3.0, abs=1e-3)


def test_tilted_socket_breaking_out_of_a_crafted_body():
    cfg, plan, _ = checks_for(demo(METRIC_CASE))
    thin = dataclasses.replace(plan, body=dataclasses.replace(plan.body, thickness_mm=30.0))
    faces = tuple(dataclasses.replace(f, origin=(0.0, 0.0, 30.0)) if f.id == "top" else f for f in thin.faces)
    # the sockets break out of the thinner body: a hard limit, refused whatever --force says
    with pytest.raises(UserError) as err:
        evaluate(cfg, dataclasses.replace(thin, faces=faces))
    assert err.value.key in ("hub.thickness", "spreaders.elevation") and "socket" in err.value.problem


def test_reducer_sleeve_wall():
    # 51 mm bore - 0.1 mm fit (machined) = 50.9 mm OD; 44 mm mast + 1 mm clearance = 45 mm ID
    _, _, checks = checks_for(modified(reducers=[{"mast": "44 mm"}]))
    r = rule(checks, "sleeve-wall")
    assert r.status == "warn" and r.value == pytest.approx((50.9 - 45.0) / 2, abs=1e-6)
    with pytest.raises(UserError):  # under the 1.5 mm minimum the sleeve is refused outright
        checks_for(modified(reducers=[{"mast": "48 mm"}]))


@pytest.mark.parametrize("limit, status", [(1000, "fail"), (1200, "warn"), (2000, "pass")])
def test_mass_against_the_users_limit(limit, status):
    _, _, checks = checks_for(modified(METRIC_CASE, hub={"max_mass": limit}))
    assert rule(checks, "mass").status == status


def test_mass_estimate_by_hand_for_a_plain_block():
    # a hexagon of across-flats s has area (sqrt 3 / 2) s^2 (plane geometry); minus the bore
    data = modified(METRIC_CASE, hub={"corner_chamfer": 0}, set_screws={"per_spreader": 0}, holes=[], mast_pin=None)
    cfg, plan, _ = checks_for(data)
    hexagon = math.sqrt(3) / 2 * 160 ** 2 * 46
    bore = math.pi * 25.5 ** 2 * 46
    socket = math.pi * 10.25 ** 2 * (80 - 25.5) / math.cos(math.radians(10))
    assert estimate_volume_mm3(plan) == pytest.approx(hexagon - bore - 6 * socket, rel=1e-9)


def test_wind_skipped_without_a_tip():
    _, _, checks = checks_for(modified(spreaders={"tip_radius": None}))
    r = rule(checks, "wind")
    assert r.status == "warn" and "tip_radius" in r.message
    assert checks.as_json()["wind"]["force_per_spreader_n"] is None


def test_tip_spacing_gives_the_same_loads_as_the_equivalent_radius():
    # a regular hexagon's side equals its circumradius (plane geometry)
    a = checks_for(demo())[2].wind
    b = checks_for(modified(spreaders={"tip_radius": None, "tip_spacing": "2.75 m"}))[2].wind
    assert b.moment_at_hub_nm == pytest.approx(a.moment_at_hub_nm, rel=1e-9)
