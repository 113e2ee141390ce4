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
   Pre-tension in the wires is not in the config and is not included.
8. What a set screw holds: friction ``2 mu N`` (screw point and the opposite socket
   wall) with ``mu`` = 0.2 (common practice for steel or plastic on glass fibre) and the
   clamp force ``N`` set to half the strip-out force of the hub's thread (common
   practice). Strip-out = hub shear strength ``0.577 x yield`` (von Mises) over a thread
   shear area ``pi D Le / 2`` (the usual approximation for an internal thread, from
   memory: Machinery's Handbook, "Strength of screw threads").

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

    @property
    def safety_factor(self) -> float | None:
        """The lowest of the safety factors computed."""
        sfs = [s for s in (self.sf_spreader, self.sf_bearing, self.sf_set_screw) if s is not None]
        return min(sfs) if sfs else None

    def as_json(self) -> dict:
        """The keys of ``check --json``'s ``wind`` section."""
        r = lambda x, n=3: None if x is None else round(x, n)  # noqa: E731
        return {"speed_m_s": r(self.speed_m_s), "pressure_pa": r(self.pressure_pa, 1),
                "force_per_spreader_n": r(self.force_per_spreader_n, 2),
                "moment_at_hub_nm": r(self.moment_at_hub_nm, 2),
                "spreader_stress_mpa": r(self.spreader_stress_mpa, 2),
                "bearing_pressure_mpa": r(self.bearing_pressure_mpa, 3),
                "set_screw_pull_n": r(self.set_screw_pull_n, 2),
                "safety_factor": r(self.safety_factor, 2)}


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


def set_screw_capacity_n(major_mm: float, engaged_mm: float, hub_yield_mpa: float) -> float:
    """Axial hold of one set screw on the pole (friction model, step 8), in N."""
    strip = SHEAR_OVER_YIELD * hub_yield_mpa * math.pi * major_mm * engaged_mm / 2.0
    return 2.0 * MU_SET_SCREW * TIGHTEN_FRACTION * strip


def _directions() -> list[float]:
    n = int(round(360.0 / SWEEP_DEG))
    return [k * SWEEP_DEG for k in range(n)]


def spreader_loads(cfg: Config, plan: HubPlan, q: float, wind_az: float, L_m: list[float]) -> list[SpreaderLoad]:
    """Force and moment at each socket mouth for wind blowing towards ``wind_az``."""
    ld = cfg.loads
    wire_f = q * ld.drag_coefficient * (ld.wire_diameter / 1000.0) * (ld.wire_length_per_spreader / 1000.0)
    out = []
    w_dir = (math.cos(math.radians(wind_az)), math.sin(math.radians(wind_az)), 0.0)
    for s, L in zip(plan.spreaders, L_m):
        cos_psi = sum(a * b for a, b in zip(s.outward, w_dir))
        sin2 = max(0.0, 1.0 - cos_psi * cos_psi)
        d_m = s.diameter_mm / 1000.0  # this spreader's own pole
        w = q * ld.drag_coefficient * d_m * sin2
        pole = w * L
        moment = w * L * L / 2.0 + wire_f * L
        out.append(SpreaderLoad(spreader=s.id, wind_azimuth_deg=wind_az, exposed_length_m=L,
                                pole_force_n=pole, wire_force_n=wire_f, force_n=pole + wire_f,
                                moment_nm=moment, shear_n=pole + wire_f))
    return out


def wind_estimate(cfg: Config, plan: HubPlan, engaged_mm: float | None = None) -> WindResult:
    """The worst spreader in the worst wind direction; ``engaged_mm`` is the set screws'
    thread length in the hub (from the rules), for their holding capacity."""
    from generators.standards.materials import get_material
    from generators.standards.threads import parse_thread

    ld = cfg.loads
    q = dynamic_pressure(ld.air_density, ld.wind_speed)
    R = tip_radius_mm(cfg)
    if R is None:
        return WindResult(speed_m_s=ld.wind_speed, pressure_pa=q,
                          skipped="no tip position: set spreaders.tip_radius or spreaders.tip_spacing")
    L_m = []
    for s in plan.spreaders:
        rho_mouth = math.hypot(s.mouth_mm[0], s.mouth_mm[1])
        L_m.append((R - rho_mouth) / math.cos(math.radians(s.elevation_deg)) / 1000.0)
    if min(L_m) <= 0:
        return WindResult(speed_m_s=ld.wind_speed, pressure_pa=q, tip_radius_mm=R,
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
    I = tube_second_moment(D, 0.0 if solid else d_in)
    sigma = worst.moment_nm * 1000.0 * (D / 2.0) / I if I > 0 else math.inf
    pole_mat = get_material(ld.spreader_material, key="loads.spreader_material")
    hub_mat = get_material(cfg.hub.material)
    sock = plan.hole(next(s.socket_hole for s in plan.spreaders if s.id == worst.spreader))
    p = bearing_pressure_mpa(worst.moment_nm, worst.shear_n, D, sock.depth_mm)
    cap = None
    ss = cfg.set_screws
    if ss is not None and ss.per_spreader > 0 and engaged_mm is not None and engaged_mm > 0:
        thread = parse_thread(ss.thread) if isinstance(ss.thread, str) else ss.thread
        cap = ss.per_spreader * set_screw_capacity_n(thread.major_mm, engaged_mm, hub_mat.yield_mpa)
    return WindResult(
        speed_m_s=ld.wind_speed, pressure_pa=q, skipped=None, exposed_length_m=L, tip_radius_mm=R,
        force_per_spreader_n=worst.force_n, moment_at_hub_nm=worst.moment_nm, spreader_stress_mpa=sigma,
        spreader_allowable_mpa=pole_mat.yield_mpa, bearing_pressure_mpa=p,
        hub_bearing_allowable_mpa=hub_mat.bearing_mpa, set_screw_pull_n=pull, set_screw_capacity_n=cap,
        sf_spreader=pole_mat.yield_mpa / sigma if sigma > 0 else None,
        sf_bearing=hub_mat.bearing_mpa / p if p > 0 else None,
        sf_set_screw=(cap / pull if cap is not None and pull > 0 else None),
        worst_spreader=worst.spreader, worst_wind_azimuth_deg=worst.wind_azimuth_deg, solid_pole=solid)
