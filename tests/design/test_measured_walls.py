"""Walls measured between the true cutter shapes (generators/plan/measured_walls.py),
checked against plane and solid geometry worked by hand, and against the CAD kernel's own
distance on the cut solid (OCCT BRepExtrema, an independent reader of the same part)."""

from __future__ import annotations

import math

import pytest

CONFIGS = __import__("pathlib").Path(__file__).resolve().parents[2] / "configs"

from generators.config.load import parse_config
from generators.design import design
from generators.errors import UserError
from generators.plan.edges import free_edges
from generators.plan.hub import build_plan
from generators.plan.measured_walls import measure_walls
from tests.checks.helpers import ROOT, demo

# points on the line at azimuth 150 deg, between sockets S3 and S4 of the metric demo
P40, P47, P50, P55 = ([r * math.cos(math.radians(150)), r * math.sin(math.radians(150))] for r in (40, 47.6, 50, 55))
# the walls are sampled, then refined to 0.2 mm spacing: within 0.02 mm on these shapes
TOL = 0.02


def _wall(walls, a, b):
    return next(w.mm for w in walls if {w.a, w.b} == {a, b})


def _with_holes(*holes, **sections):
    data = demo()
    data["holes"] = list(holes)
    for key, value in sections.items():
        data[key] = {**data.get(key, {}), **value}
    return data


def test_two_parallel_through_holes_leave_centre_distance_minus_radii():
    # two vertical cylinders of radius r1, r2 with axes c apart: wall = c - r1 - r2 (plane geometry)
    data = _with_holes({"id": "A", "face": "top", "at": P40, "diameter": 6.0},
                       {"id": "B", "face": "top", "at": P50, "diameter": 4.0})
    walls = measure_walls(build_plan(parse_config(data)))
    assert _wall(walls, "A", "B") == pytest.approx(10.0 - 3.0 - 2.0, abs=TOL)


def test_teardrop_samples_lie_on_its_true_arc():
    """A printed socket's surface samples sit on the circle of its drilled radius (or on its
    roof), not on the polygon's chords inside it, which read the wall up to 0.12 % of the
    radius too thick."""
    import numpy as np

    from generators.config import load_config
    from generators.plan.cutters import Cutter

    plan = build_plan(load_config(CONFIGS / "six-spreader-printed.toml"))
    tear = [Cutter(h) for h in plan.holes if h.profile == "teardrop"]
    assert tear
    for c in tear:
        pts = c.surface(0.5)
        assert np.abs(c.sdf(pts)).max() < 1e-9, c.hole.id


@pytest.mark.parametrize("far,da,db", [(P50, 6.0, 4.0), (P47, 6.0, 4.0), (P50, 5.0, 3.3)])
def test_the_least_wall_is_walked_to_the_exact_figure_not_a_samples(far, da, db):
    """Samples on a circle stand off the least wall by a little; the nearest-point walk ends
    on the exact figure (c - r1 - r2, plane geometry), never above it by more than rounding."""
    data = _with_holes({"id": "A", "face": "top", "at": P40, "diameter": da},
                       {"id": "B", "face": "top", "at": far, "diameter": db})
    walls = measure_walls(build_plan(parse_config(data)))
    c = math.dist(P40, far)
    assert _wall(walls, "A", "B") == pytest.approx(c - da / 2 - db / 2, abs=1e-6)


def test_a_countersink_is_widest_at_the_face():
    # the cone's rim (its head diameter D) on the face is nearest the neighbour: c - D/2 - r2
    data = _with_holes({"id": "A", "face": "top", "at": P40, "clearance": "M5", "countersink": True},
                       {"id": "B", "face": "top", "at": P55, "diameter": 4.0})
    plan = build_plan(parse_config(data))
    D = plan.hole("A").countersink.diameter_mm
    assert _wall(measure_walls(plan), "A", "B") == pytest.approx(15.0 - D / 2 - 2.0, abs=TOL)


def test_a_counterbore_step_is_measured_at_its_full_width():
    data = _with_holes({"id": "A", "face": "top", "at": P40, "clearance": "M5", "counterbore": True},
                       {"id": "B", "face": "top", "at": P55, "diameter": 4.0})
    plan = build_plan(parse_config(data))
    Dc = plan.hole("A").counterbore.diameter_mm
    assert _wall(measure_walls(plan), "A", "B") == pytest.approx(15.0 - Dc / 2 - 2.0, abs=TOL)


def test_teardrop_roof_is_the_wall_to_the_top_face():
    # a printed hub with level sockets: each socket axis is at T/2 and its roof (the 45 deg
    # point at r * sqrt 2, cut flat at roof_mm) rises roof_mm above it, so the wall to the top
    # face is T/2 - roof_mm, not T/2 - r as a round socket would have
    data = demo(ROOT / "configs" / "six-spreader-printed.toml")
    data["spreaders"]["elevation"] = 0
    plan = build_plan(parse_config(data))
    s1 = plan.hole("S1")
    T = plan.body.thickness_mm
    assert s1.profile == "teardrop"
    walls = measure_walls(plan)
    assert _wall(walls, "S1", "face:top") == pytest.approx(T / 2 - s1.roof_mm, abs=TOL)
    assert s1.roof_mm > s1.radius_mm + 1.0  # the roof is what decides it


def test_a_drill_point_leaves_less_floor_than_the_flat_depth():
    # 118 deg point on a 6 mm drill: r / tan 59 deg = 1.80 mm past the depth (cone geometry)
    data = _with_holes({"id": "A", "face": "top", "at": P40, "diameter": 6.0, "depth": 30.0})
    plan = build_plan(parse_config(data))
    T = plan.body.thickness_mm
    tip = 3.0 / math.tan(math.radians(59.0))
    assert _wall(measure_walls(plan), "A", "face:bottom") == pytest.approx(T - 30.0 - tip, abs=TOL)


def test_neighbouring_blind_sockets_meet_at_their_floor_rims():
    # four flat-bottomed sockets 90 deg apart ending at radius r_i: the nearest points are the
    # floor rims (r_i, +-r) of each, sqrt 2 (r_i - r) apart (plane geometry), not the axis ends
    data = demo(ROOT / "configs" / "four-spreader-conduit.toml")
    data["spreaders"]["elevation"] = 0
    plan = build_plan(parse_config(data))
    s1, s2 = plan.hole("S1"), plan.hole("S2")
    r_i = math.hypot(*s1.bottom_mm[:2])
    assert _wall(measure_walls(plan), "S1", "S2") == pytest.approx(math.sqrt(2) * (r_i - s1.radius_mm), abs=TOL)
    assert s2.radius_mm == s1.radius_mm


@pytest.mark.parametrize("sides, free_sides", [(8, True), (12, False)])
def test_obtuse_corners_are_no_free_edges(sides, free_sides):
    # a 135 deg corner (octagon) is an edge; a 150 deg one (12 sides) continues the material
    data = demo()
    data["spreaders"]["count"] = 4 if sides == 8 else 6
    data["hub"].update({"sides": sides, "corner_chamfer": 0})
    data.pop("mast_clamp", None)
    data["holes"] = []
    plan = build_plan(parse_config(data))
    flat = plan.face("flat-1")
    edges = free_edges(plan, flat)
    vertical = [e for e in edges if e[0][0] == e[1][0]]
    assert len(edges) == (4 if free_sides else 2) and bool(vertical) == free_sides


def test_a_wall_under_the_hard_limit_is_refused_with_or_without_force():
    # a 6 mm hole 0.6 mm of material away from an 8 mm one: under the 1.5 mm web
    data = _with_holes({"id": "A", "face": "top", "at": P40, "diameter": 6.0},
                       {"id": "B", "face": "top", "at": P47, "diameter": 8.0})
    with pytest.raises(UserError) as err:
        design(parse_config(data))
    assert err.value.key == "holes[1].at" or err.value.key == "holes[0].at"


@pytest.mark.slow
@pytest.mark.parametrize("name", ["four-spreader-conduit.toml", "six-spreader-printed.toml"])
def test_the_solid_measures_what_the_plan_measures(tmp_path, name):
    from generators.build import build_config

    cfg = parse_config(demo(ROOT / "configs" / name))
    m = build_config(cfg, tmp_path, force=True).manifest["hub"]
    assert m["min_wall_mm"] == pytest.approx(m["plan_min_wall_mm"], abs=0.05)
    assert m["plan_min_wall_mm"] <= m["min_wall_mm"] + 0.05


def test_a_twist_drilled_socket_keeps_its_point_and_the_web_is_measured_to_it():
    """A blind socket made with a stock twist drill ends in the 118 deg point (ISO 5419 names
    the point angle; 118 deg the usual grind, from memory): the web to the bore is measured
    from the cone's apex, r_floor - r / tan 59 deg - R_bore (hand geometry, elevation 0)."""
    import math

    from generators.config import load_config
    from generators.design import design

    d = design(load_config(CONFIGS / "five-spreader-aluminium.toml"))
    s = d.plan.hole("S1")
    assert s.point_deg == 118.0 and not s.flat_bottom
    r_floor = math.hypot(*s.bottom_mm[:2])
    web = r_floor - s.radius_mm / math.tan(math.radians(59)) - d.plan.bore_mm / 2
    least = min(w.mm for w in d.walls if {w.a, w.b} == {"S1", "bore"})
    assert least == pytest.approx(web, abs=0.05)


def test_a_point_that_would_near_the_bore_gives_a_flat_floor_instead():
    """Where the point would leave less than the recommended wall, the floor is squared flat
    (an end mill), the plan has no point and the drill step says so."""
    import tomllib

    from generators.config.load import parse_config
    from generators.design import design

    data = tomllib.loads((CONFIGS / "five-spreader-aluminium.toml").read_text())
    data["spreaders"]["socket_depth"] = 1.45  # the floor 0.16 in from the bore, the point 0.19 in long
    data.pop("mast_clamp")  # its holes would meet the deeper sockets
    d = design(parse_config(data))
    s = d.plan.hole("S1")
    assert s.flat_bottom and s.point_deg is None
    drill = next(o for o in d.operations if "S1" in o.holes and o.operation in ("drill", "open_up"))
    assert "square the floor flat" in drill.note


@pytest.mark.parametrize("name", ["four-spreader-conduit", "six-spreader-printed", "five-spreader-aluminium"])
def test_the_holding_cylinder_never_overstates_a_cuts_distance(name):
    """The measurer orders and skips points by ``Cutter.bound``; it must be a lower bound of
    the true signed distance everywhere (inside, outside, past the ends), for round holes
    with points, countersinks and threads, teardrops and nut slots alike. Geometric
    consequence of the cut lying inside its cylinder; checked on random points."""
    import numpy as np

    from generators.config import load_config
    from generators.plan.cutters import Cutter

    plan = build_plan(load_config(CONFIGS / f"{name}.toml"))
    rng = np.random.default_rng(7)
    for h in plan.holes:
        c = Cutter(h)
        lo, hi = c.bounds()
        pts = rng.uniform(lo - 5.0, hi + 5.0, size=(4000, 3))
        on_axis = c.E + np.outer(rng.uniform(c.t0 - 3.0, c.t1 + 3.0, 500), c.a)  # where digits are lost
        pts = np.concatenate([pts, on_axis])
        exact, bound = c.sdf(pts), c.bound(pts)
        assert np.all(bound <= exact + 1e-9), (h.id, float((bound - exact).max()))
        quick = c.sdf_or_box(pts)
        # the same sign as the exact distance wherever either is within the margin of the cut
        assert np.all((quick >= 0) == (exact >= 0)), h.id


def test_every_wall_the_hole_wall_rule_names_is_measured_finely():
    """The hole-wall rule names each wall under its recommended figure (4.5 mm in acetal), so
    those are refined too, not only the least of the rule: three drilled holes on one line,
    walls c - r1 - r2 = 1.6 mm and 4.1 mm (plane geometry); coarse sampling alone read the
    second about 0.04 mm thick."""
    from generators.design import design

    P = lambda r: [r * math.cos(math.radians(150)), r * math.sin(math.radians(150))]  # noqa: E731
    data = _with_holes({"id": "A", "face": "top", "at": P(40), "diameter": 6.0},
                       {"id": "B", "face": "top", "at": P(46.6), "diameter": 4.0},
                       {"id": "C", "face": "top", "at": P(30.9), "diameter": 4.0})
    walls = design(parse_config(data)).walls
    assert _wall(walls, "A", "B") == pytest.approx(1.6, abs=1e-6)
    assert _wall(walls, "A", "C") == pytest.approx(4.1, abs=1e-6)
