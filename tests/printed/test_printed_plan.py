"""The printed plan, without solids: clearance holes, compensation, pockets, profiles, walls."""

from __future__ import annotations

import math

import pytest

from generators.config import load_config
from generators.errors import UserError
from generators.plan.hub import build_plan
from generators.plan.printed import BRIDGE_LIMIT_MM

from .conftest import PRINTED

# ISO 273 medium (normal) clearance holes, mm (from memory: ISO 273 table 1)
ISO273_MEDIUM = {"M4": 4.5, "M5": 5.5, "M6": 6.6}
# ISO 4032 hex nuts: s max across flats, e min across corners, m max height, mm
# (from memory: ISO 4032 table 1)
ISO4032 = {"M4": (7.0, 7.66, 3.2), "M5": (8.0, 8.79, 4.7), "M6": (10.0, 11.05, 5.2)}


def _size(thread: str) -> str:
    return thread.split("x")[0]


def _variant(cfg, **print_fields):
    return cfg.model_copy(update={"print": cfg.print.model_copy(update=print_fields)})


@pytest.fixture(scope="module")
def cfg():
    return load_config(PRINTED)


@pytest.fixture(scope="module")
def plans(cfg):
    machined = cfg.model_copy(update={"hub": cfg.hub.model_copy(update={"process": "machined"})})
    return build_plan(machined), build_plan(cfg)


def test_compensated_diameters_equal_drilled_plus_compensation(cfg, plans):
    machined, printed = plans
    comp = cfg.print.hole_compensation
    for m in machined.holes:
        p = printed.hole(m.id)
        if m.thread is None:
            assert p.diameter_mm == pytest.approx(m.diameter_mm + comp), m.id
        else:  # tapped -> ISO 273 normal clearance hole, then compensated
            assert p.thread is None and p.drill is None
            assert p.diameter_mm == pytest.approx(ISO273_MEDIUM[_size(m.thread)] + comp), m.id
        assert p.compensation_mm == pytest.approx(comp)


def test_every_tapped_hole_gets_a_nut_pocket_on_its_axis(cfg, plans):
    machined, printed = plans
    allow = cfg.print.nut_allowance
    tapped = [h for h in machined.holes if h.thread is not None]
    assert {h.kind for h in tapped} >= {"set_screw", "clamp"}
    pockets = {h.serves: h for h in printed.holes if h.kind == "nut_pocket"}
    assert set(pockets) == {h.id for h in tapped}
    for m in tapped:
        pk = pockets[m.id]
        s, e, height = ISO4032[_size(m.thread)]
        assert pk.across_flats_mm >= s + allow - 1e-9
        assert pk.diameter_mm >= e + allow - 1e-9  # across corners
        assert pk.depth_mm == pytest.approx(height + allow)
        # the pocket centre lies on the screw axis, inside the run of the hole
        c = pk.point_at(pk.depth_mm / 2)
        d = tuple(c[i] - m.entry_mm[i] for i in range(3))
        t = sum(d[i] * m.axis[i] for i in range(3))
        off = math.dist(c, m.point_at(t))
        assert off < 1e-6 and 0 < t < m.depth_mm, m.id
        # slot square to the screw, so the nut slides in across it
        assert abs(sum(pk.slot_dir[i] * m.axis[i] for i in range(3))) < 1e-9


def test_horizontal_holes_get_a_teardrop_and_vertical_ones_stay_round(plans):
    _, printed = plans
    for h in printed.holes:
        if h.kind in ("nut_pocket",):
            continue
        tilt = math.degrees(math.acos(min(1.0, abs(h.axis[2]))))
        if tilt > 45:
            assert h.profile == "teardrop", h.id
            up = h.roof_up
            assert abs(sum(up[i] * h.axis[i] for i in range(3))) < 1e-9 and up[2] > 0
            assert h.radius_mm <= h.roof_mm <= h.radius_mm * math.sqrt(2) + 1e-9
            assert 2 * (h.radius_mm * math.sqrt(2) - h.roof_mm) <= BRIDGE_LIMIT_MM
        else:
            assert h.profile == "round", h.id
    assert {h.kind for h in printed.holes if h.profile == "teardrop"} >= {"socket", "clamp"}


def test_insert_pockets_replace_nuts_when_insert_sizes_are_given(cfg):
    plan = build_plan(_variant(cfg, insert_hole=7.9, insert_depth=8.0))
    inserts = [h for h in plan.holes if h.kind == "insert_pocket"]
    assert not [h for h in plan.holes if h.kind == "nut_pocket"]
    assert len(inserts) == sum(1 for h in plan.holes if h.kind in ("set_screw", "clamp", "extra"))
    for h in inserts:
        assert h.diameter_mm == pytest.approx(7.9 + cfg.print.hole_compensation)
        assert h.depth_mm == pytest.approx(8.0)
        assert h.entry_mm == plan.hole(h.serves).entry_mm


def test_insert_needs_both_sizes(cfg):
    with pytest.raises(UserError) as err:
        build_plan(_variant(cfg, insert_hole=6.4))
    assert err.value.key == "print.insert_depth"


def test_thin_printed_walls_are_refused(cfg):
    # 1.5 mm lines x 4 = 6 mm walls cannot fit between the clamp holes and the sockets
    with pytest.raises(UserError) as err:
        build_plan(_variant(cfg, line_width=1.5))
    assert "wall" in err.value.problem or "material" in err.value.problem


def test_machined_plan_is_unchanged_by_the_print_section():
    from .conftest import TILTED

    plan = build_plan(load_config(TILTED))
    assert all(h.profile == "round" and h.compensation_mm == 0 for h in plan.holes)
    assert not [h for h in plan.holes if h.kind.endswith("_pocket")]


def test_a_pin_too_near_a_socket_names_the_pin_height(cfg):
    # the M8 pin raised to 15.5 mm comes within 1.71 mm of socket S1 in the print, under the
    # four 0.45 mm lines (1.8 mm, common practice) a printed wall wants: move the pin
    moved = cfg.model_copy(update={"mast_pin": cfg.mast_pin.model_copy(update={"height": 15.5})})
    with pytest.raises(UserError) as err:
        build_plan(moved)
    assert err.value.key == "mast_pin.height" and "printed wall" in err.value.problem


@pytest.mark.parametrize("thickness", [50, 51, 52])
def test_a_captive_nut_is_placed_where_the_hole_wall_minimum_holds(thickness):
    """The pocket planner first looks for a place along the screw that keeps the hole-wall
    rule's minimum (3 mm in plastic, common practice) to the other cuts, not only the printed
    wall; at 51 mm the middle of the span used to leave 1.83 mm to the socket while other
    places along the screw kept more than 3 mm. Measured on the true cutter shapes."""
    import tomllib

    from generators.config.load import parse_config
    from generators.design import design

    data = tomllib.loads(PRINTED.read_text(encoding="utf-8"))
    data["hub"].update(thickness=thickness, across_flats=128)
    d = design(parse_config(data))
    nut_walls = [w.mm for w in d.walls if "-nut" in w.a + w.b and not w.b.startswith("face:")]
    assert nut_walls and min(nut_walls) >= 3.0 - 1e-9, min(nut_walls)
    assert {r["id"]: r["status"] for r in d.checks_json["rules"]}["hole-wall"] != "fail"
