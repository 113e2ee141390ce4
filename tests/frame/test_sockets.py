"""Per-socket overrides ([[sockets]]): angles, sizes, refusals, cut lengths.

References: the socket axis of a pole at azimuth a and elevation e points into the hub
along -(cos e cos a, cos e sin a, sin e) (the hub frame of DEVELOPERS.md), so
e = asin(-axis_z) and a = atan2(-axis_y, -axis_x); cut lengths by the hand formula in
helpers.blind_cut_mm.
"""

from __future__ import annotations

import math

import pytest

from generators.config.load import parse_config
from generators.design import design
from generators.errors import UserError
from tests.frame.helpers import blind_cut_mm, spider_raw


def _design(raw):
    return design(parse_config(raw))


def test_alternating_elevations_in_the_socket_axes():
    d = _design(spider_raw())
    want = {1: 12.0, 2: -12.0, 3: 12.0, 4: -12.0}
    for h in (h for h in d.plan.holes if h.kind == "socket"):
        e = math.degrees(math.asin(-h.axis[2]))
        a = math.degrees(math.atan2(-h.axis[1], -h.axis[0])) % 360
        assert e == pytest.approx(want[h.spreader], abs=1e-9)
        assert a == pytest.approx((45 + 90 * (h.spreader - 1)) % 360, abs=1e-9)
        # a rising socket enters above mid-thickness, a falling one below (centred at half its run)
        assert (h.entry_mm[2] > 30.0) == (want[h.spreader] > 0)


def test_equal_cut_lengths_by_hand():
    d = _design(spider_raw())
    lines = d.cut_cases[0].lines
    # octagon 170 mm across flats: the flat is 85 mm out; blind 45 mm; tips 2600 mm; 30 mm allowance
    hand = blind_cut_mm(85.0, 45.0, 12.0, 2600.0, 30.0)
    assert [ln.cut_length_mm for ln in lines] == pytest.approx([hand] * 4, abs=1e-6)


def test_a_socket_of_its_own_angle_cut_to_its_own_length():
    # S2 at -8 deg: its floor is 85 - 45 cos 8 from the axis, its run to the tip longer by 1 / cos 8
    raw = spider_raw()
    raw["sockets"][0]["elevation"] = -8
    lines = {ln.spreader: ln.cut_length_mm for ln in _design(raw).cut_cases[0].lines}
    assert lines[2] == pytest.approx(blind_cut_mm(85.0, 45.0, -8.0, 2600.0, 30.0), abs=1e-6)
    assert lines[1] == pytest.approx(blind_cut_mm(85.0, 45.0, 12.0, 2600.0, 30.0), abs=1e-6)


def test_one_set_screw_over_each_socket_at_its_own_angle():
    d = _design(spider_raw())
    for s in d.plan.spreaders:
        sock, screw = d.plan.hole(f"S{s.id}"), d.plan.hole(f"T{s.id}")
        # the screw's axis (vertical) meets the socket axis: its x, y lie on the socket's vertical plane
        az = math.radians(s.azimuth_deg)
        assert screw.entry_mm[0] * math.sin(az) - screw.entry_mm[1] * math.cos(az) == pytest.approx(0, abs=1e-9)
        # and it runs down to the socket axis below it: depth = T - z of the axis there
        rho = math.hypot(screw.entry_mm[0], screw.entry_mm[1])
        t = (85.0 - rho) / math.cos(math.radians(abs(s.elevation_deg)))
        assert screw.depth_mm == pytest.approx(60.0 - sock.point_at(t)[2], abs=1e-6)


def test_a_thicker_pole_in_one_socket():
    raw = spider_raw()
    raw["sockets"].append({"index": 1, "diameter": 25, "fit": 0.8})
    d = _design(raw)
    assert d.plan.hole("S1").diameter_mm == pytest.approx(25.8)  # pole + fit
    assert d.plan.hole("S2").diameter_mm == pytest.approx(22.5)
    assert d.plan.spreaders[0].diameter_mm == 25.0


def test_unknown_index_refused():
    raw = spider_raw()
    raw["sockets"].append({"index": 5, "elevation": 3})
    with pytest.raises(UserError) as exc:
        parse_config(raw)
    assert exc.value.key == "sockets[2].index" and "1 to 4" in exc.value.accepted


def test_twice_the_same_index_refused():
    raw = spider_raw()
    raw["sockets"].append({"index": 2, "fit": 0.2})
    with pytest.raises(UserError) as exc:
        parse_config(raw)
    assert exc.value.key == "sockets[2].index"


def test_elevation_range_is_minus_45_to_45():
    raw = spider_raw()
    raw["sockets"][0]["elevation"] = -50
    with pytest.raises(UserError) as exc:
        parse_config(raw)
    assert exc.value.key == "sockets[0].elevation"


def test_sockets_turned_into_each_other_refused():
    # a puck takes any azimuth; S2 turned to 10 deg from S1: axes about 2 * 45 * sin(5 deg) = 7.8 mm
    # apart at the socket floor, far less than the two 22.5 mm sockets need
    raw = spider_raw()
    raw["hub"] = {"style": "puck", "diameter": 170, "thickness": 60, "material": "pom"}
    raw["sockets"][0]["azimuth"] = 55
    with pytest.raises(UserError) as exc:
        _design(raw)
    assert exc.value.key == "sockets[0].azimuth" and "S1 and S2" in exc.value.problem


def test_azimuth_without_a_flat_refused_on_a_block():
    raw = spider_raw()
    raw["sockets"][0]["azimuth"] = 150  # octagon flats face 45 + k 45 deg
    with pytest.raises(UserError) as exc:
        _design(raw)
    assert exc.value.key == "sockets[0].azimuth"


def test_steep_fall_breaks_out():
    # 45 deg on a 60 mm hub: z changes 45 mm over the 45 mm run (tan 45 = 1), centred on
    # mid-thickness, so each end comes 22.5 mm + r / cos 45 = 38.4 mm from the middle: past
    # the 30 mm to either face (the mouth below the bottom, the inner end above the top)
    raw = spider_raw()
    raw["sockets"][0]["elevation"] = -45
    with pytest.raises(UserError) as exc:
        _design(raw)
    assert exc.value.key == "sockets[0].elevation" and "-45 deg break out" in exc.value.problem


def test_one_jig_for_plus_and_minus_the_same_angle():
    d = _design(spider_raw())
    assert [j.wedge_angle_deg for j in d.jigs] == [12.0]
    assert set(d.jigs[0].flipped) == {"S2", "S4"}  # drilled with the hub upside down
    raw = spider_raw()
    raw["sockets"][1]["elevation"] = -8
    angles = [j.wedge_angle_deg for j in _design(raw).jigs]
    assert angles == [8.0, 12.0]
