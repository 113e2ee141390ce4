"""Spreader cut lengths against the shop rule and hand-worked trigonometry."""

from __future__ import annotations

import math

import numpy as np
import pytest

from generators.plan.cutlist import DEFAULT_TIP_ALLOWANCE_MM, cut_list, end_radius_mm, tip_radius_mm
from generators.plan.hub import build_plan

from .helpers import config

# A hub tall enough for 30 deg sockets: 12 mm poles, 70 mm thick.
TILT = {"hub": {"thickness": 70}, "spreaders": {"diameter": 12}}


def _cut(bore_mm: float, elevation_deg: float) -> float:
    cfg = config(hub={**TILT["hub"], "bore": bore_mm},
                 spreaders={**TILT["spreaders"], "elevation": elevation_deg})
    plan = build_plan(cfg)
    (case,) = cut_list(cfg, plan)
    assert case.stop_kind == "bore"  # bore larger than the mast + clearance: the stop is in the bore
    lengths = {ln.cut_length_mm for ln in case.lines}
    assert len(lengths) == 1  # every spreader the same
    return lengths.pop()


def test_shop_rule_half_the_diameter_difference_at_zero_elevation():
    # Shop rule of thumb (common practice): with the poles butting on the stop, a stop 4 mm
    # smaller in diameter lets each spreader 2 mm further in, so each is cut 2 mm longer.
    assert _cut(53.0, 0) - _cut(57.0, 0) == pytest.approx(2.0, abs=1e-9)


@pytest.mark.parametrize("elevation, expected", [
    # worked by hand: the pole end moves in 2 mm horizontally (half of 57 - 53); along the
    # tilted axis that is 2 / cos(e):  cos 15 deg = 0.965926 -> 2.070552 mm,
    #                                 cos 30 deg = 0.866025 -> 2.309401 mm
    (15, 2.070552), (30, 2.309401),
])
def test_tilted_difference_follows_the_axis(elevation, expected):
    assert _cut(53.0, elevation) - _cut(57.0, elevation) == pytest.approx(expected, abs=1e-6)


@pytest.mark.parametrize("elevation", [0, 15, 30])
def test_end_contact_matches_a_sampled_disc(elevation):
    """The square-cut end (a disc of the pole's radius, normal along the tilted axis) first
    touches the vertical stop cylinder where the plan says: checked by sampling the disc
    in 3D with numpy and bisecting for the axis end radius (independent of the formula)."""
    R, r, e = 25.5, 10.0, math.radians(elevation)
    n = np.array([math.cos(e), 0.0, math.sin(e)])  # outward along the pole
    u = np.array([-math.sin(e), 0.0, math.cos(e)])
    w = np.array([0.0, 1.0, 0.0])
    phi = np.linspace(0, 2 * np.pi, 3601)
    rad = np.linspace(0, r, 41)
    P, Q = np.meshgrid(phi, rad)
    pts = (np.cos(P)[..., None] * u + np.sin(P)[..., None] * w) * Q[..., None]

    def nearest(rho_c):  # least horizontal distance of the end face from the mast axis
        c = np.array([rho_c, 0.0, 0.0]) + pts
        return np.hypot(c[..., 0], c[..., 1]).min()

    lo, hi = R, R + 2 * r
    for _ in range(60):
        mid = (lo + hi) / 2
        lo, hi = (mid, hi) if nearest(mid) < R else (lo, mid)
    rho, meet = end_radius_mm(R, False, 2 * r, elevation, 6)
    assert not meet and n[0] > 0
    assert rho == pytest.approx(lo, abs=1e-4)


def test_cut_length_is_the_axis_run_plus_allowance():
    # hand-worked: 10 deg, mast 50 mm -> stop radius 25; pole r = 10 -> end at
    # 25 + 10 sin 10 deg = 26.736482; (2750 - 26.736482) / cos 10 deg + 30 = 2795.2737
    cfg = config(spreaders={"elevation": 10})
    (case,) = cut_list(cfg, build_plan(cfg))
    assert case.stop == "mast"
    assert case.cut_length_mm == pytest.approx(2795.2737, abs=1e-3)


def test_blind_socket_stops_on_the_floor():
    # floor 40 mm along a level socket from the flat at 80 mm: axis end at 40 mm radius
    cfg = config(spreaders={"socket_depth": 40})
    (case,) = cut_list(cfg, build_plan(cfg))
    assert case.stop_kind == "floor" and case.end_radius_mm == pytest.approx(40.0)
    assert case.cut_length_mm == pytest.approx(2750 - 40 + 30)


@pytest.mark.parametrize("count, spacing, radius", [
    # a regular hexagon's circumradius equals its side (Euclid, Elements IV.15);
    # a square's is side / sqrt(2)
    (6, 2750.0, 2750.0), (4, 2000.0, 2000.0 / math.sqrt(2)),
])
def test_tip_spacing_gives_the_circumradius(count, spacing, radius):
    sp = {"count": count, "tip_radius": None, "tip_spacing": spacing}
    if count == 4:
        sp["diameter"] = 20
    data = config(spreaders=sp)
    assert tip_radius_mm(data) == pytest.approx(radius, rel=1e-12)


def test_default_allowance_and_no_tips():
    cfg = config(spreaders={"tip_allowance": None})
    (case,) = cut_list(cfg, build_plan(cfg))
    assert case.tip_allowance_mm == DEFAULT_TIP_ALLOWANCE_MM
    cfg = config(spreaders={"tip_radius": None})
    assert cut_list(cfg, build_plan(cfg)) == []


def test_a_small_stop_lets_the_poles_meet_first():
    # six 20 mm poles touch side by side at 10 / sin 30 deg = 20 mm from the axis, before a
    # 30 mm mast (15 mm radius)
    rho, meet = end_radius_mm(15.0, False, 20.0, 0, 6)
    assert meet and rho == pytest.approx(20.0)
