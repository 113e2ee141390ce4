"""Wind-load estimate on each spreader and what it puts on the hub (plain arithmetic, SI).

The model, step by step (every step is conservative where a figure is unknown):

1. Dynamic pressure ``q = 1/2 rho V^2`` (Bernoulli; any fluid-mechanics text, e.g. White,
   "Fluid Mechanics", from memory).
2. Drag per metre of pole ``w = q Cd d sin^2(psi)``: ``Cd`` = 1.2 for a long circular
   cylinder in cross-flow below the drag crisis (Hoerner, "Fluid-Dynamic Drag", and White,
   "Fluid Mechanics", cylinder drag curve, from memory); ``psi`` is the angle between the
   wind and the pole, and only the velocity component across the pole makes drag (the
   cross-flow principle, Hoerner, from memory). The pole is taken at its hub-end
   diameter ``d`` all the way out (a tapered pole has less area).
3. The wire share (``wire_diameter`` x ``wire_length_per_spreader``) is taken broadside
   to the wind whatever its direction (its run is not in the config), and acts as one
   force ``F_w`` at the tip.
4. Bending moment at the socket mouth, a cantilever of exposed length ``L`` (mouth to
   tip along the pole): ``M = w L^2 / 2 + F_w L`` (statics of a cantilever under a
   uniform load plus an end load, e.g. Gere, "Mechanics of Materials", from memory).
5. Stress in the tube at the mouth ``sigma = M c / I`` with ``I = pi (D^4 - d_i^4) / 64``
   and ``c = D / 2`` (Roark's "Formulas for Stress and Strain", hollow circle; Gere;
   from memory).
6. Bearing of the pole on the socket walls: the pole is a rigid post in the socket of
   engaged depth ``a``, pressed with a pressure that varies linearly along the depth
   (the usual model for a post embedded in a socket or footing, common practice). With
   the moment about the socket's mid-depth ``Mc = M + F a / 2`` and the shear ``F``:
   ``p_max = 6 Mc / (d a^2) + F / (d a)`` on the projected area ``d x a``. Equivalently
   the moment is a couple of forces ``3 Mc / (2 a)`` (lever ``k a`` with ``k = 2/3``),
   each spread as a triangle over half the depth.
7. Axial pull on the pole that the set screws must hold: the wire share's force when the
   wind blows along the spreader, plus skin friction along the pole
   ``q Cf pi d L`` with ``Cf`` = 0.01 (turbulent skin friction of a few thousandths,
   Hoerner, from memory, doubled for a rough glass-fibre surface: common practice).
   The wire pre-tension's part along the pole (``[loads] wire_tension``, step 10) adds to it.
8. What a set screw holds: friction ``2 mu N`` (screw point and the opposite socket
   wall) with ``mu`` = 0.2 (common practice for steel or plastic on glass fibre) and the
   clamp force ``N`` set to half the strip-out force of the hub's thread (common
   practice). Strip-out = hub shear strength ``0.577 x yield`` (von Mises) over a thread
   shear area ``pi D Le / 2`` (the usual approximation for an internal thread, from
   memory: Machinery's Handbook, "Strength of screw threads").

9. Wind at height (``[loads] height``): the config's ``wind_speed`` is read as a 3 s gust
   at 10 m in open country, turned into the basic velocity of EN 1991-1-4 and the peak
   velocity pressure ``qp(z)`` of eq. (4.8) at the height and terrain category given
   (plan/wind_height.py) replaces ``q``; at 10 m in category II the two agree. Without a
   height, ``q`` is the figure at reference height (10 m, open country).
10. Ice, wire pre-tension and self weight (``[loads] ice_thickness``, ``wire_tension``,
   ``wire_angle``): radial glaze ice (plan/ice.py, ISO 12494 / ASCE 7-16 ch. 10) adds to
   the diameter the wind sees and to the weight; the wire pulls each tip with
   ``wire_tension`` at ``wire_angle`` from the pole axis, its across part taken in the
   wind's plane on the same side (worst case), its along part as axial stress; the pole's
   and the ice's weight and the wire share's weight bend it in the vertical plane. The
   planes are superposed as plan/beam.py states (Roark; Gere). The safety factor is the
   ultimate strength over that stress (a brittle composite: rules/wind.py).

Worst case over wind directions: the direction is swept in steps of ``SWEEP_DEG``; for
each spreader the worst is wind across it. Not a structural certification.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.config.models import Config
from generators.plan.cutlist import tip_radius_mm
from generators.plan.model import HubPlan

# Cd of a long circular cylinder, subcritical Reynolds numbers (Hoerner "Fluid-Dynamic
# Drag" ch. 3 / White "Fluid Mechanics" fig. 7.16, from memory). The config default.
CD_LONG_CYLINDER = 1.2
# Skin-friction coefficient along the pole (see step 7).
CF_AXIAL = 0.01
# Friction coefficient of a set screw on the pole (common practice).
MU_SET_SCREW = 0.2
# Set screws are tightened to half their thread's strip-out force (common practice).
TIGHTEN_FRACTION = 0.5
# Shear strength as a fraction of tensile yield (von Mises, 1/sqrt(3)).
SHEAR_OVER_YIELD = 1.0 / math.sqrt(3.0)
SWEEP_DEG = 5.0
MAST_KEYS = ("wind_area_m2", "mast_force_n", "mast_torque_nm", "weight_n", "ice_weight_n", "tip_deflection_mm")


@dataclass(frozen=True)
class SpreaderLoad:
    """One spreader in the worst wind direction for it (SI units: N, N m, MPa)."""

    spreader: int
    wind_azimuth_deg: float
    exposed_length_m: float
    pole_force_n: float
    wire_force_n: float
    force_n: float
    moment_nm: float
    shear_n: float


@dataclass(frozen=True)
class WindResult:
    speed_m_s: float
    pressure_pa: float
    skipped: str | None  # why nothing but the pressure was computed
    exposed_length_m: float | None = None
    tip_radius_mm: float | None = None
    force_per_spreader_n: float | None = None
    moment_at_hub_nm: float | None = None
    spreader_stress_mpa: float | None = None
    spreader_allowable_mpa: float | None = None
    bearing_pressure_mpa: float | None = None
    hub_bearing_allowable_mpa: float | None = None
    set_screw_pull_n: float | None = None
    set_screw_capacity_n: float | None = None
    sf_spreader: float | None = None
    sf_bearing: float | None = None
    sf_set_screw: float | None = None
    worst_spreader: int | None = None
    worst_wind_azimuth_deg: float | None = None
    solid_pole: bool = False
    pressure_basis: str = "1/2 rho V^2, V taken as the 10 m open-country reference speed, no height or terrain factor"
    root_moment_nm: float | None = None  # wind, wire and weight combined (plan/beam.py)
    root_shear_n: float | None = None
    set_screw_force_n: float | None = None  # clamp force of one set screw (torque, capped)
    mast: object | None = None  # mast_loads.MastLoads

    @property
    def safety_factor(self) -> float | None:
        """The lowest of the safety factors computed."""
        sfs = [s for s in (self.sf_spreader, self.sf_bearing, self.sf_set_screw) if s is not None]
        return min(sfs) if sfs else None

    def as_json(self) -> dict:
        """The keys of ``check --json``'s ``wind`` section."""
        return {**wind_json(self), "bearing_pressure_mpa": rounded(self.bearing_pressure_mpa, 3),
                "set_screw_pull_n": rounded(self.set_screw_pull_n, 2),
                **{k: (rounded(getattr(self.mast, k), 4) if self.mast else None) for k in MAST_KEYS}}


def rounded(x: float | None, n: int = 3) -> float | None:
    return None if x is None else round(x, n)


def wind_json(w) -> dict:
    """The ``wind`` keys every hub style gives (a block's ``WindResult``, a plate's ``PlateWind``)."""
    return {"speed_m_s": rounded(w.speed_m_s), "pressure_pa": rounded(w.pressure_pa, 1),
            "force_per_spreader_n": rounded(w.force_per_spreader_n, 2),
            "moment_at_hub_nm": rounded(w.moment_at_hub_nm, 2),
            "spreader_stress_mpa": rounded(w.spreader_stress_mpa, 2),
            "safety_factor": rounded(w.safety_factor, 2), "pressure_basis": w.pressure_basis}


def dynamic_pressure(rho: float, v: float) -> float:
    """q = 1/2 rho V^2 in Pa."""
    return 0.5 * rho * v * v


def tube_second_moment(od_mm: float, id_mm: float) -> float:
    """I = pi (D^4 - d^4) / 64 in mm^4 (Roark, hollow circle)."""
    return math.pi * (od_mm ** 4 - id_mm ** 4) / 64.0


def pole_bore_mm(cfg: Config, od_mm: float | None = None) -> float | None:
    """The spreader tube's inside diameter at the hub (of a pole ``od_mm`` across, by
    default spreaders.diameter); None when the config gives neither."""
    sp = cfg.spreaders
    od = sp.diameter if od_mm is None else od_mm
    if sp.inner_diameter is not None:
        return sp.inner_diameter
    if sp.wall is not None:
        return max(od - 2.0 * sp.wall, 0.0)
    return None


def bearing_pressure_mpa(moment_nm: float, shear_n: float, d_mm: float, depth_mm: float) -> float:
    """Peak bearing pressure of a rigid post in a socket (linear pressure model, step 6)."""
    a = depth_mm
    mc = moment_nm * 1000.0 + shear_n * a / 2.0  # N mm about mid-depth
    return 6.0 * mc / (d_mm * a * a) + shear_n / (d_mm * a)


def strip_force_n(major_mm: float, engaged_mm: float, hub_yield_mpa: float) -> float:
    """Strip-out force of a tapped thread in the hub (step 8), N."""
    return SHEAR_OVER_YIELD * hub_yield_mpa * math.pi * major_mm * engaged_mm / 2.0


def set_screw_capacity_n(major_mm: float, engaged_mm: float, hub_yield_mpa: float,
                         clamp_n: float | None = None) -> float:
    """Axial hold of one set screw on the pole (friction model, step 8), in N. ``clamp_n``,
    the force from its tightening torque, is used when given; half the strip-out force is
    the upper bound either way."""
    cap = TIGHTEN_FRACTION * strip_force_n(major_mm, engaged_mm, hub_yield_mpa)
    return 2.0 * MU_SET_SCREW * (cap if clamp_n is None else min(clamp_n, cap))


def _directions() -> list[float]:
    n = int(round(360.0 / SWEEP_DEG))
    return [k * SWEEP_DEG for k in range(n)]


def spreader_loads(cfg: Config, plan: HubPlan, q: float, wind_az: float, L_m: list[float]) -> list[SpreaderLoad]:
    """Force and moment at each socket mouth for wind blowing towards ``wind_az``."""
    from generators.plan.ice import iced_diameter_mm

    ld = cfg.loads
    wire_d = iced_diameter_mm(ld.wire_diameter, ld.ice_thickness) if ld.wire_diameter > 0 else 0.0
    wire_f = q * ld.drag_coefficient * (wire_d / 1000.0) * (ld.wire_length_per_spreader / 1000.0)
    out = []
    w_dir = (math.cos(math.radians(wind_az)), math.sin(math.radians(wind_az)), 0.0)
    for s, L in zip(plan.spreaders, L_m):
        cos_psi = sum(a * b for a, b in zip(s.outward, w_dir))
        sin2 = max(0.0, 1.0 - cos_psi * cos_psi)
        d_m = iced_diameter_mm(s.diameter_mm, ld.ice_thickness) / 1000.0  # this spreader's own pole, iced
        w = q * ld.drag_coefficient * d_m * sin2
        pole = w * L
        moment = w * L * L / 2.0 + wire_f * L
        out.append(SpreaderLoad(spreader=s.id, wind_azimuth_deg=wind_az, exposed_length_m=L,
                                pole_force_n=pole, wire_force_n=wire_f, force_n=pole + wire_f,
                                moment_nm=moment, shear_n=pole + wire_f))
    return out


def design_pressure(cfg: Config) -> tuple[float, str]:
    """q in Pa and what it stands for (step 9)."""
    from generators.plan import wind_height as wh

    ld = cfg.loads
    if ld.height is None:
        return dynamic_pressure(ld.air_density, ld.wind_speed), "1/2 rho V^2, V taken as the 10 m open-country reference speed, no height or terrain factor"
    z = ld.height / 1000.0
    vb = wh.basic_velocity_from_gust(ld.wind_speed)
    qp = wh.peak_velocity_pressure(vb, z, ld.terrain, rho=ld.air_density)
    return qp, f"EN 1991-1-4 peak velocity pressure at {z:g} m, terrain category {ld.terrain}"


def pole_bending(cfg: Config, worst: SpreaderLoad, elevation_deg: float, pole_mat):
    """Wind, wire pre-tension and weight at the socket mouth of one spreader (step 10):
    (Bending, axial N, resultant shear N)."""
    from generators.plan import beam, ice
    from generators.plan.mast_loads import COPPER_DENSITY

    ld, sp = cfg.loads, cfg.spreaders
    L = worst.exposed_length_m
    d_in = pole_bore_mm(cfg) or 0.0
    across, along = beam.wire_tension_components(ld.wire_tension, ld.wire_angle)
    horizontal = beam.PlaneLoads(worst.pole_force_n / L, worst.wire_force_n + across)
    cos_e = math.cos(math.radians(elevation_deg))
    w_self = beam.self_weight_line_load_n_m(sp.diameter, d_in, pole_mat.density_g_cm3 * 1000.0, elevation_deg)
    w_ice = ice.ice_weight_per_m(sp.diameter, ld.ice_thickness) * cos_e
    wire_len = ld.wire_length_per_spreader / 1000.0
    wire_w = (COPPER_DENSITY * beam.G * math.pi / 4 * (ld.wire_diameter / 1000.0) ** 2
              + ice.ice_weight_per_m(ld.wire_diameter, ld.ice_thickness) * (ld.wire_diameter > 0)) * wire_len
    vertical = beam.PlaneLoads(w_self + w_ice, wire_w * cos_e)
    b = beam.combined_bending(horizontal, vertical, L, pole_mat.modulus_gpa * 1e9, sp.diameter, d_in)
    shear = math.hypot(horizontal.uniform_n_m * L + horizontal.tip_n, vertical.uniform_n_m * L + vertical.tip_n)
    return b, along, shear


def wind_estimate(cfg: Config, plan: HubPlan, engaged_mm: float | None = None,
                  hub_mass_g: float = 0.0, set_screw_clamp_n: float | None = None) -> WindResult:
    """The worst spreader in the worst wind direction; ``engaged_mm`` is the set screws'
    thread length in the hub (from the rules), for their holding capacity, and
    ``set_screw_clamp_n`` the force each is tightened to (rules/retention.py)."""
    from generators.plan.beam import tube_area_m2
    from generators.plan.mast_loads import mast_loads
    from generators.standards.materials import get_material
    from generators.standards.threads import parse_thread

    ld = cfg.loads
    q, basis = design_pressure(cfg)
    R = tip_radius_mm(cfg)
    if R is None:
        return WindResult(speed_m_s=ld.wind_speed, pressure_pa=q, pressure_basis=basis,
                          skipped="no tip position: set spreaders.tip_radius or spreaders.tip_spacing")
    L_m = []
    for s in plan.spreaders:
        rho_mouth = math.hypot(s.mouth_mm[0], s.mouth_mm[1])
        L_m.append((R - rho_mouth) / math.cos(math.radians(s.elevation_deg)) / 1000.0)
    if min(L_m) <= 0:
        return WindResult(speed_m_s=ld.wind_speed, pressure_pa=q, tip_radius_mm=R, pressure_basis=basis,
                          skipped="the tip radius is inside the hub: check spreaders.tip_radius / tip_spacing")
    loads = [load for az in _directions() for load in spreader_loads(cfg, plan, q, az, L_m)]
    # the largest moment; among equal ones (a symmetric hub) the lowest spreader id
    worst = max(loads, key=lambda x: (round(x.moment_nm, 6), -x.spreader, -x.wind_azimuth_deg))
    # axial pull: wind along the spreader (sin^2 = 0): the wire share plus skin friction
    D = next(s.diameter_mm for s in plan.spreaders if s.id == worst.spreader)
    d_m = D / 1000.0
    L = worst.exposed_length_m
    pull = worst.wire_force_n + q * CF_AXIAL * math.pi * d_m * L
    d_in = pole_bore_mm(cfg, D)
    solid = d_in is None
    pole_mat = get_material(ld.spreader_material, key="loads.spreader_material")
    hub_mat = get_material(cfg.hub.material)
    sp_worst = next(s for s in plan.spreaders if s.id == worst.spreader)
    bend, axial, shear = pole_bending(cfg, worst, sp_worst.elevation_deg, pole_mat)
    pull += max(axial, 0.0)  # a wire pulling the tip outwards pulls the pole out of its socket
    area = tube_area_m2(D, 0.0 if solid else d_in)
    sigma = (bend.stress_pa + axial / area) / 1e6 if area > 0 else math.inf
    sock = plan.hole(sp_worst.socket_hole)
    p = bearing_pressure_mpa(bend.moment_nm, shear, D, sock.depth_mm)
    cap = None
    ss = cfg.set_screws
    if ss is not None and ss.per_spreader > 0 and engaged_mm is not None and engaged_mm > 0:
        thread = parse_thread(ss.thread) if isinstance(ss.thread, str) else ss.thread
        cap = ss.per_spreader * set_screw_capacity_n(thread.major_mm, engaged_mm, hub_mat.yield_mpa,
                                                     set_screw_clamp_n)
    mast = mast_loads(cfg, plan, q, L_m, _directions(), hub_mass_g, R, pole_mat, L)
    # a brittle composite against its ultimate strength, a ductile pole against its yield
    allowable = pole_mat.tensile_mpa if pole_mat.material_class == "composite" else pole_mat.yield_mpa
    return WindResult(
        speed_m_s=ld.wind_speed, pressure_pa=q, skipped=None, exposed_length_m=L, tip_radius_mm=R,
        force_per_spreader_n=worst.force_n, moment_at_hub_nm=worst.moment_nm, spreader_stress_mpa=sigma,
        spreader_allowable_mpa=allowable, bearing_pressure_mpa=p,
        hub_bearing_allowable_mpa=hub_mat.bearing_mpa, set_screw_pull_n=pull, set_screw_capacity_n=cap,
        pressure_basis=basis, root_moment_nm=bend.moment_nm, root_shear_n=shear,
        set_screw_force_n=set_screw_clamp_n, mast=mast,
        sf_spreader=allowable / sigma if sigma > 0 else None,
        sf_bearing=hub_mat.bearing_mpa / p if p > 0 else None,
        sf_set_screw=(cap / pull if cap is not None and pull > 0 else None),
        worst_spreader=worst.spreader, worst_wind_azimuth_deg=worst.wind_azimuth_deg, solid_pole=solid)
