"""The plate hub's plan, rules and refusals against hand calculations and published values."""

from __future__ import annotations

import math
import pathlib
import tomllib

import pytest

from generators.config.load import parse_config
from generators.errors import UserError

CASE = pathlib.Path(__file__).parent / "cases" / "quad-plate.toml"


def case(**changes) -> dict:
    data = tomllib.loads(CASE.read_text())
    for dotted, value in changes.items():
        section, _, key = dotted.partition("__")
        if value is None:
            data[section].pop(key, None)
        else:
            data.setdefault(section, {})[key] = value
    return data


def design_of(**changes):
    from generators.design import design

    return design(parse_config(case(**changes)))


# ---- standards ---------------------------------------------------------------------------

@pytest.mark.parametrize("thread, area", [("M8", 36.6), ("M10", 58.0), ("M12", 84.3), ("M16", 157.0)])
def test_stress_area_metric(thread, area):
    """ISO 898-1 table of tensile stress areas (from memory): M8 36.6, M10 58.0, M12 84.3, M16 157 mm2."""
    from generators.standards.threads import parse_thread
    from generators.standards.ubolts import stress_area_mm2

    assert stress_area_mm2(parse_thread(thread)) == pytest.approx(area, rel=0.003)


@pytest.mark.parametrize("thread, area_in2", [("1/4-20", 0.0318), ("3/8-16", 0.0775), ("1/2-13", 0.1419)])
def test_stress_area_unified(thread, area_in2):
    """ASME B1.1 table of tensile stress areas (from memory): 1/4-20 0.0318, 3/8-16 0.0775, 1/2-13 0.1419 in2."""
    from generators.standards.threads import parse_thread
    from generators.standards.ubolts import stress_area_mm2

    assert stress_area_mm2(parse_thread(thread)) / 25.4 ** 2 == pytest.approx(area_in2, rel=0.005)


def test_nps_u_bolts_fit_the_pipe_table_ods():
    """Every NPS U-bolt row is for the ASME B36.10M OD of its pipe and is wider inside than it."""
    from generators.standards.pipes import resolve_mast
    from generators.standards.ubolts import u_bolt_sizes

    nps = [u for u in u_bolt_sizes("inch") if u.size.startswith("NPS")]
    assert len(nps) >= 8
    for u in nps:
        od = resolve_mast(u.size.replace("NPS ", "") + " in NPS").od_mm
        assert u.pipe_od_mm == pytest.approx(od, abs=0.01), u.size
        assert 0 < u.inside_width_mm - od < 4.0, u.size


def test_iso_7089_washer_m8():
    """ISO 7089 (from memory): M8 plain washer 8.4 mm inside, 16 mm outside, 1.6 mm thick."""
    from generators.standards.ubolts import plain_washer

    w = plain_washer("M8")
    assert (w.inside_mm, w.outside_mm, w.thickness_mm) == (8.4, 16.0, 1.6)


# ---- the plan ----------------------------------------------------------------------------

def test_pole_stop_and_cut_length_by_hand():
    """The pole's end sits one pole diameter inboard of the inner U-bolt's bar; the cut
    length is tip radius - end radius + allowance (poles flat, cos 0 = 1)."""
    d = design_of()
    lay, cfg = d.plate, d.config
    inner = lay.for_spreader(1)[0]
    r_in = math.hypot(*inner.centre)
    r_end = r_in - inner.size.rod_mm / 2 - cfg.spreaders.diameter
    assert dict(lay.stops)[1] == pytest.approx(r_end)
    assert d.cut_cases[0].cut_length_mm == pytest.approx(2650 - r_end + 30)
    outer = lay.for_spreader(1)[1]
    assert math.hypot(*outer.centre) - r_in == pytest.approx(110.0)  # plate.u_bolt_spacing


def test_u_bolt_leg_need_by_hand():
    """Leg needed = pole OD + plate + washer + nut + 2 pitches (ISO 7089 1.6 mm, ISO 4032 M8 nut 6.8 mm, from memory)."""
    u = design_of().plate.for_spreader(1)[0]
    assert u.leg_needed_mm == pytest.approx(30 + 8 + 1.6 + 6.8 + 2 * 1.25)


def test_plate_bending_strip_by_hand():
    """sigma = 6 M / (b t^2) at the inner U-bolt, M = R_B s (overhanging-beam statics), by hand."""
    d = design_of()
    q = 0.5 * 1.225 * 35.0 ** 2  # Pa: default air density, the case's 35 m/s
    w = q * 1.2 * 0.030  # N/m: Cd 1.2 default, 30 mm pole
    f_wire = q * 1.2 * 0.002 * 3.75  # N: 2 mm wire, 3.75 m a spreader
    outer = d.plate.for_spreader(1)[1]
    L = (2650 - math.hypot(*outer.centre)) / 1000
    # horizontal: wind (Gere, cantilever under a uniform and an end load)
    M_h, F_h = w * L ** 2 / 2 + f_wire * L, w * L + f_wire
    # vertical: the pole's own weight and the wire share's (copper 8.96 g/cm3, CRC Handbook, from memory)
    from generators.standards.materials import get_material

    g = 9.80665  # standard gravity (CGPM 1901)
    w_v = get_material("fiberglass").density_g_cm3 * 1000 * g * math.pi / 4 * (0.030 ** 2 - 0.025 ** 2)
    f_v = 8960 * g * math.pi / 4 * 0.002 ** 2 * 3.75
    M_v, F_v = w_v * L ** 2 / 2 + f_v * L, w_v * L + f_v
    # the two planes combine as vectors on a round tube; the resultant is taken square to the plate
    M, F = math.hypot(M_h, M_v), math.hypot(F_h, F_v)
    s = 0.110
    R_B = F + M / s
    assert d.checks.wind.outer_force_n == pytest.approx(R_B, rel=1e-9)
    b = min(39.0 + 16.0 + 2 * 110.0, 1e9) - 2 * 9.0  # leg spacing + washer OD + 2 s, less two 9 mm holes
    sigma = 6 * R_B * 110.0 / (b * 8.0 ** 2)
    from generators.plan.plate_rules import PlateRules

    r = PlateRules(d.config, d.plan, d.plate)
    assert r._strip_stress(R_B) == pytest.approx(sigma, rel=1e-6)
    assert d.checks.wind.plate_stress_mpa >= sigma - 1e-9


def test_thinner_plate_fails_the_bending_rule():
    """Stress goes as 1/t^2: a 2 mm plate carries 16 x the 8 mm plate's stress."""
    thick = design_of().checks.wind.plate_stress_mpa
    thin = design_of(hub__thickness=2)
    assert thin.checks.wind.plate_stress_mpa == pytest.approx(16 * thick, rel=1e-6)
    rule = next(r for r in thin.checks.rules if r.id == "plate-bending")
    assert rule.status == "fail"


def test_round_plate_puts_holes_inside_it():
    d = design_of(hub__across_flats=None, hub__diameter=380, plate__u_bolt_spacing=90)
    R = 190.0
    assert d.plan.body.diameter_mm == 380
    for h in d.plan.holes:
        x, y, _ = h.entry_mm
        assert math.hypot(x, y) + h.radius_mm < R


def test_inch_config_picks_inch_u_bolts():
    d = design_of(plate__u_bolts="inch")
    sizes = {u.size.size for u in d.plate.u_bolts}
    assert all(s.startswith(("NPS", "tube")) for s in sizes)
    assert all(u.size.family == "inch" for u in d.plate.u_bolts)


# ---- refusals ------------------------------------------------------------------------------

def test_elevation_is_refused_with_the_reason():
    with pytest.raises(UserError) as e:
        design_of(spreaders__elevation=10)
    assert e.value.key == "spreaders.elevation" and "flat" in e.value.problem


def test_mast_under_a_pole_is_refused():
    """The mast line along spreader 1 puts its nuts on the pole (and the pole's nuts on the mast)."""
    with pytest.raises(UserError) as e:
        design_of(plate__mast_azimuth=45)
    assert e.value.key in ("plate.mast_azimuth", "plate.u_bolt_spacing")


def test_plate_too_small_is_refused():
    with pytest.raises(UserError):
        design_of(hub__across_flats=120)


def test_set_screws_are_refused_on_a_plate():
    data = case()
    data["set_screws"] = {"thread": "M6"}
    from generators.design import design

    with pytest.raises(UserError) as e:
        design(parse_config(data))
    assert e.value.key == "set_screws"


def test_plate_section_only_with_a_plate():
    data = case(hub__style="block")
    with pytest.raises(UserError):
        parse_config(data)


def test_odd_count_puts_a_pole_on_the_mast_line():
    """Three spreaders 120 deg apart: a line through the centre between two of them runs
    along the third (geometry), whose U-bolt nuts then sit on the mast."""
    with pytest.raises(UserError) as e:
        design_of(spreaders__count=3, spreaders__first_azimuth=90, hub__across_flats=360, plate__u_bolt_spacing=None)
    assert e.value.key == "plate.mast_azimuth" and "odd" in e.value.accepted


def test_plate_wind_at_height_with_ice_and_wire_tension_by_hand():
    """The plate reads [loads] height, ice and wire tension as the block hub does: EN 1991-1-4
    qp(z) (eq. 4.8) replaces 1/2 rho V^2, the iced diameter takes the wind, the pre-tension's
    across part adds at the tip (plan/loads.py step 10)."""
    from generators.plan import wind_height as wh

    base = design_of().checks.wind
    high = design_of(loads__height="30 m").checks.wind
    vb = wh.basic_velocity_from_gust(35.0)
    assert high.pressure_pa == pytest.approx(wh.peak_velocity_pressure(vb, 30.0, "II", rho=1.225), rel=1e-9)
    assert "EN 1991-1-4" in high.pressure_basis
    assert high.pressure_pa > base.pressure_pa and high.spreader_stress_mpa > base.spreader_stress_mpa
    iced = design_of(loads__ice_thickness="10 mm").checks.wind
    assert iced.force_per_spreader_n > base.force_per_spreader_n  # 30 mm + 2 x 10 mm of ice across the wind
    pulled = design_of(loads__wire_tension="100 N", loads__wire_angle=90).checks.wind
    assert pulled.moment_at_hub_nm > base.moment_at_hub_nm + 100 * pulled.exposed_length_m * 0.5


def test_plate_pole_is_held_to_the_brittle_margin():
    """Fiberglass against its ultimate strength with SF 2.5 to pass (rules/wind.py source)."""
    d = design_of(spreaders__wall=1.0)
    rule = next(r for r in d.checks.rules if r.id == "wind-spreader")
    assert d.checks.wind.brittle and rule.value == pytest.approx(d.checks.wind.sf_spreader)
    assert rule.status == ("pass" if rule.value >= 2.5 else "warn" if rule.value >= 1.5 else "fail")


def test_plate_gives_what_the_antenna_puts_on_the_mast():
    """check --json's mast figures for a plate: the weight by hand (poles from the stop line
    to the tip, 2 mm copper wire at 8.96 g/cm3 (CRC Handbook, from memory), the plate's mass)
    and the uneven-gust torque M_T = 0.75 F x 0.15 B (ASCE 7-16 fig. 27.3-8 case 2, from memory)."""
    from generators.standards.materials import get_material

    d = design_of()
    w = d.checks.wind.as_json()
    g = 9.80665  # standard gravity (CGPM 1901)
    rho = get_material("fiberglass").density_g_cm3 * 1000
    area = math.pi / 4 * (0.030 ** 2 - 0.025 ** 2)
    poles = sum(rho * g * area * (2.650 - math.hypot(*s.bottom_mm[:2]) / 1000) for s in d.plan.spreaders)
    wire = 4 * 8960 * g * math.pi / 4 * 0.002 ** 2 * 3.75
    hub = d.checks.mass_estimate_g / 1000 * g
    assert w["weight_n"] == pytest.approx(poles + wire + hub, rel=1e-3)
    assert w["mast_torque_nm"] == pytest.approx(0.75 * w["mast_force_n"] * 0.15 * 2 * 2.650, rel=1e-3)
    assert w["wind_area_m2"] > 0 and w["tip_deflection_mm"] > 0
