"""Hand calculations for issue 15: screw force from torque, set-screw point crush, the hub
held on the mast, the brittle spreader margin and what the antenna puts on the mast.

Formulas and sources, each typed here with the numbers:
- T = K F d, short-form torque-tension relation (Shigley, "Mechanical Engineering Design"
  section 8-8; K 0.2 zinc-plated / 0.3 non-plated, Shigley table 8-15; from memory)
- set-screw points: ISO 4029 cup dz, ISO 4026 flat dp (from memory, data/set_screw_points.csv)
- cantilever tip deflection w L^4 / 8EI + P L^3 / 3EI (Roark table 8.1 cases 1a, 2a; Gere)
- radial ice area pi t (d + t), 900 kg/m3 glaze (ASCE 7-16 eq. 10.4-1; ISO 12494; from memory)
- uneven-gust torque 0.75 F x 0.15 B (ASCE 7-16 figure 27.3-8 case 2, from memory)
- EN 1991-1-4 eqs. (4.4), (4.5), (4.7), (4.8) and table 4.1 for the pressure at height
- 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m (exact)
"""

from __future__ import annotations

import math

import pytest

from generators.config.load import parse_config
from generators.standards import holding
from .helpers import INCH, INCH_CASE, METRIC, METRIC_CASE, checks_for, demo, modified, rule

G = 9.80665


def test_preload_and_point_areas_by_hand():
    # M6 at 2 N m with K = 0.2: F = 2 / (0.2 x 0.006) = 1666.7 N
    assert holding.preload_n(2.0, "M6", 0.2) == pytest.approx(1666.67, abs=0.01)
    # ISO 4026 flat point M6 dp = 4.0 mm: pi/4 x 16 = 12.566 mm2
    assert holding.point_contact_mm2("M6", "flat")[0] == pytest.approx(12.566, abs=1e-3)
    # ISO 4029 cup M6 dz = 3.0 mm, a rim ring 0.3 mm wide: pi x 3 x 0.3 = 2.827 mm2
    assert holding.point_contact_mm2("M6", "cup")[0] == pytest.approx(2.827, abs=1e-3)
    # soft tip flattened to the major diameter: pi/4 x 36 = 28.27 mm2
    assert holding.point_contact_mm2("M6", "soft")[0] == pytest.approx(28.274, abs=1e-3)


def test_torque_in_inch_pound_force():
    data = modified(set_screws={"torque": "25 in-lbf"})
    assert parse_config(data).set_screws.torque == pytest.approx(25 * 0.0254 * 4.4482216152605)


def test_metric_demo_without_a_clamp_or_pin_warns_on_retention():
    # nothing retains the hub: a warning naming what to add (fail is for a holding rated under 1)
    cfg, _, checks = checks_for(modified(mast_pin=None))
    assert cfg.mast_clamp is None and cfg.mast_pin is None
    r = rule(checks, "mast-retention")
    assert r.status == "warn" and r.value is None and "nothing retains the hub" in r.message
    assert "[mast_pin]" in r.message and "[mast_clamp]" in r.message


def test_set_screws_on_a_thin_fibreglass_wall_fail_crush_and_name_the_fix():
    # a 1.5 mm fibreglass wall, cup point, default torque (M6 in acetal: 2.0 N m, tightening table)
    data = modified(spreaders={"wall": 1.5}, set_screws={"point": None, "torque": None})
    _, _, checks = checks_for(data)
    r = rule(checks, "set-screw-crush")
    F = 2.0 / (0.2 * 0.006)                 # T = K F d
    stress = F / (math.pi * 3.0 * 0.3)      # on the ISO 4029 cup rim
    assert r.status == "fail"
    assert r.value == pytest.approx(70.0 / stress, rel=1e-6)  # transverse strength 70 MPa, materials table
    for fix in ("pad", "soft point", "smaller torque", "hose clamp"):
        assert fix in r.message


def test_soft_point_at_a_light_torque_by_hand():
    # the metric demo: soft M6 at 1.5 N m: F = 1250 N on 28.27 mm2 = 44.2 MPa; SF 70 / 44.2 = 1.58
    _, _, checks = checks_for(demo(METRIC))
    r = rule(checks, "set-screw-crush")
    assert r.value == pytest.approx(70.0 / (1.5 / (0.2 * 0.006) / (math.pi / 4 * 36)), rel=1e-6)
    assert r.status == "pass"


def test_quad_demo_spreader_reflects_the_brittle_margin():
    _, _, checks = checks_for(demo(INCH))
    r = rule(checks, "wind-spreader")
    assert checks.wind.spreader_allowable_mpa == 207.0  # ultimate, materials table
    assert r.value == pytest.approx(207.0 / checks.wind.spreader_stress_mpa)
    assert 1.5 <= r.value < 2.5 and r.status == "warn" and r.limit == 2.5
    assert "2.5" in r.source and "ultimate" in r.message


def test_brittle_pole_below_1_5_fails():
    _, _, checks = checks_for(demo(INCH_CASE))  # 3/4 in pole in 90 mph
    r = rule(checks, "wind-spreader")
    assert r.value < 1.5 and r.status == "fail"


def test_retention_with_clamp_screws_by_hand():
    cfg, plan, checks = checks_for(modified(INCH, mast_pin=None, mast_clamp={"azimuths": None, "count": 2}))
    # two 1/4-20 screws in acetal, default 3.0 N m (a third of 87 in-lbf seating torque), K = 0.3
    F = 3.0 / (0.3 * 0.25 * 0.0254)
    hold = 2 * (2 * 0.15 * F)                           # 2 mu F per screw, mu 0.15 plastic on metal
    m = checks.wind.mast
    sf_slide = hold / (m.weight_n + m.ice_weight_n)
    sf_turn = hold * (1.510 * 0.0254 / 2) / m.mast_torque_nm  # 1-1/4 in EMT, OD 1.510 in (ANSI C80.3)
    r = rule(checks, "mast-retention")
    assert r.value == pytest.approx(min(sf_slide, sf_turn), rel=1e-4)
    # friction alone cannot hold the turning: under SF 1 it fails, naming the through bolt
    assert sf_slide > 2 and sf_turn < 1 and r.status == "fail" and r.limit == 1.0
    assert "[mast_pin]" in r.message and "through bolt" in r.message


def _inch_case_mast(ice_mm=0.0):
    data = modified(INCH_CASE, loads={"ice_thickness": f"{ice_mm} mm"})
    cfg, plan, checks = checks_for(data)
    return cfg, plan, checks


@pytest.mark.parametrize("ice_mm", [0.0, 10.0])
def test_mast_figures_by_hand_four_level_spreaders(ice_mm):
    cfg, plan, checks = _inch_case_mast(ice_mm)
    w, m = checks.wind, checks.wind.mast
    t = ice_mm / 1000
    d = 0.75 * 0.0254 + 2 * t                 # iced pole diameter
    dw = 0.08 * 0.0254 + 2 * t                # iced wire
    lw = 210 * 0.0254
    L = (148 - 3) * 0.0254
    q = 0.5 * 1.225 * (90 * 0.44704) ** 2
    hub = 152.4 / math.cos(math.pi / 4) * 38.1 * 1e-6   # square block across corners x 1.5 in
    # four level poles at 90 deg: across the wind at 45 deg each shows sin 45 of its length
    # (the largest area); the drag sin^2 psi is 2 d L in every direction
    assert m.wind_area_m2 == pytest.approx(4 * d * L * math.sin(math.pi / 4) + 4 * dw * lw + hub, rel=1e-6)
    F = q * 1.2 * (2 * d * L + 4 * dw * lw + hub)
    assert m.mast_force_n == pytest.approx(F, rel=1e-6)
    assert m.mast_torque_nm == pytest.approx(0.75 * F * 0.15 * 2 * 148 * 0.0254, rel=1e-6)
    D, di = 0.75 * 25.4, 0.625 * 25.4
    A = math.pi / 4 * (D ** 2 - di ** 2) * 1e-6
    sock = plan.hole("S1").depth_mm / 1000
    weight = (4 * 1900 * G * A * (L + sock) + 4 * 8960 * G * math.pi / 4 * (0.08 * 0.0254) ** 2 * lw
              + checks.mass_estimate_g / 1000 * G)
    assert m.weight_n == pytest.approx(weight, rel=1e-6)
    ice_w = 4 * 900 * G * math.pi * t * (D / 1000 + t) * L + 4 * 900 * G * math.pi * t * (0.08 * 0.0254 + t) * lw
    assert m.ice_weight_n == pytest.approx(ice_w, rel=1e-6, abs=1e-9)
    # tip deflection in the design wind: cantilever, E = 17.2 GPa (materials table)
    I = math.pi * (D ** 4 - di ** 4) / 64 * 1e-12
    defl = q * 1.2 * d * L ** 4 / (8 * 17.2e9 * I) + q * 1.2 * dw * lw * L ** 3 / (3 * 17.2e9 * I)
    assert m.tip_deflection_mm == pytest.approx(defl * 1000, rel=1e-6)
    js = checks.as_json()["wind"]
    assert js["mast_force_n"] == pytest.approx(F, abs=1e-3) and js["ice_weight_n"] == pytest.approx(ice_w, abs=1e-3)


def test_wire_pretension_across_the_pole_by_hand():
    # 60 N at 90 deg from the pole axis adds 60 L to the horizontal moment (P L, Gere)
    base = checks_for(demo(METRIC_CASE))[2].wind
    w = checks_for(modified(METRIC_CASE, loads={"wire_tension": 60.0, "wire_angle": "90 deg"}))[2].wind
    L = w.exposed_length_m
    mv = math.sqrt(base.root_moment_nm ** 2 - base.moment_at_hub_nm ** 2)
    assert w.root_moment_nm == pytest.approx(math.hypot(base.moment_at_hub_nm + 60 * L, mv), rel=1e-9)
    # along the pole (0 deg): no bending, the axial stress T / A adds
    a = checks_for(modified(METRIC_CASE, loads={"wire_tension": 60.0, "wire_angle": 0}))[2].wind
    area = math.pi / 4 * (20 ** 2 - 15 ** 2)
    assert a.spreader_stress_mpa == pytest.approx(base.spreader_stress_mpa + 60 / area, rel=1e-9)
    # and pulls the pole out of its socket: the set screws hold 60 N more
    assert a.set_screw_pull_n == pytest.approx(base.set_screw_pull_n + 60, rel=1e-9)


def test_pressure_at_height_en_1991_1_4():
    V, rho = 40.0, 1.225
    at10 = checks_for(modified(METRIC_CASE, loads={"height": "10 m"}))[2].wind
    # wind_speed is a 3 s gust at 10 m in category II: qp(10 m, II) = 1/2 rho V^2
    assert at10.pressure_pa == pytest.approx(0.5 * rho * V ** 2, rel=1e-9)
    w = checks_for(modified(METRIC_CASE, loads={"height": "30 m", "terrain": "III"}))[2].wind
    ce = lambda kr, z, z0: (1 + 7 / math.log(z / z0)) * (kr * math.log(z / z0)) ** 2  # noqa: E731 eqs. 4.4, 4.7, 4.8
    ce_iii_30 = ce(0.19 * (0.3 / 0.05) ** 0.07, 30, 0.3)   # table 4.1: z0 = 0.3 m; eq. 4.5
    ce_ii_10 = ce(0.19, 10, 0.05)
    assert ce_iii_30 == pytest.approx(2.4797, abs=1e-3) and ce_ii_10 == pytest.approx(2.3523, abs=1e-3)
    assert w.pressure_pa == pytest.approx(0.5 * rho * V ** 2 * ce_iii_30 / ce_ii_10, rel=1e-9)
    assert "EN 1991-1-4" in w.pressure_basis
    base = checks_for(demo(METRIC_CASE))[2].wind
    assert "reference speed" in base.pressure_basis and "no height" in base.pressure_basis
