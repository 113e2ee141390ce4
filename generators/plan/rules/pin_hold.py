"""The hub held on the mast by a through bolt ([mast_pin]): what it holds turning and sliding.

Model (an estimate, like the rest of the holding rules):

- The bolt crosses the mast and is loaded in shear where it passes each mast wall, so a
  turning hub is held by a couple ``T = 2 F r`` with ``r`` the mast radius (the smallest
  mast when sleeves adapt others) and a sliding hub by ``2 F``.
- ``F`` is the least of
  (a) the bolt's shear strength on one plane, ``0.6 f_ub A_s``
      (standards/bolts.py: class 8.8 800 MPa, ISO 898-1; grade 5 120 ksi, SAE J429;
      alpha_v = 0.6, EN 1993-1-8 table 3.4; from memory), and
  (b) bearing of the bolt on the hub at the bore, ``sigma_b d l`` with the materials
      table's allowable bearing stress and an effective length ``l = min(wall, 2 d)``,
      the hub's wall along the bolt from the bore to the nearer outer face (common
      practice: a pin bears mostly near the shear plane, about two diameters deep),
  (c) the bolt bending across the radial gap ``g`` from the mast wall to the bore wall (a
      reducer sleeve's wall included: the sleeve is a spacer, and a clearance hole in a soft
      sleeve is not counted on to support the bolt), a cantilever ``M = F g`` against first
      yield ``f_y pi d_s^3 / 32`` (standards/bolts.py; conservative).
  The weakest mast (the config's or a sleeve's) decides.
- The mast's own wall in bearing is not checked: the mast tables give a wall thickness but
  no material. Clamp-screw friction is not added: the bolt's clearance lets the hub slip
  before the bolt bears.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.plan.rules.base import COMMON, FAIL, PASS, WARN, RuleResult

BEARING_LENGTH_D = 2.0  # effective bearing length, bolt diameters (common practice)


@dataclass(frozen=True)
class PinHold:
    d_mm: float
    shear_n: float
    bearing_n: float
    bearing_mpa: float
    wall_mm: float
    bearing_len_mm: float
    force_n: float
    governs: str
    mast_radius_mm: float
    limits: dict | None = None
    gap_mm: float = 0.0
    mast: str = ""

    @property
    def torque_nm(self) -> float:
        return 2.0 * self.force_n * self.mast_radius_mm / 1000.0

    @property
    def slide_n(self) -> float:
        return 2.0 * self.force_n


def pin_hold(thread, pin, bore_mm: float, bearing_mpa: float, mast_radius_mm: float,
             gap_mm: float = 0.0, mast: str = "") -> PinHold:
    """What the pin ``pin`` (a plan hole) of ``thread`` holds on one mast; see the module
    docstring. ``gap_mm``: the radial distance the bolt spans from the mast wall to the bore
    wall."""
    from generators.standards.bolts import bending_capacity_nm, shear_capacity_n

    d = thread.major_mm
    ends = (pin.entry_mm, pin.bottom_mm)
    wall = min(math.hypot(p[0], p[1]) for p in ends) - bore_mm / 2
    length = min(wall, BEARING_LENGTH_D * d)
    limits = {"bolt shear": shear_capacity_n(thread), "bearing on the hub": bearing_mpa * d * length}
    if gap_mm > 1e-9:  # a cantilever across the gap, M = F g (conservative)
        limits["bolt bending across the gap"] = bending_capacity_nm(thread) * 1000.0 / gap_mm
    governs = min(limits, key=limits.get)
    return PinHold(d_mm=d, shear_n=limits["bolt shear"], bearing_n=limits["bearing on the hub"],
                   bearing_mpa=bearing_mpa, wall_mm=wall, bearing_len_mm=length, force_n=limits[governs],
                   governs=governs, mast_radius_mm=mast_radius_mm, limits=limits, gap_mm=gap_mm, mast=mast)


def pin_holds(rules, pin) -> PinHold:
    """The weakest hold over the config's mast and every sleeve's mast."""
    thread, plan = rules.cfg.mast_pin.thread, rules.plan
    sigma = rules.mat.bearing_mpa
    cases = [pin_hold(thread, pin, plan.bore_mm, sigma, plan.mast_od_mm / 2,
                      gap_mm=(plan.bore_mm - plan.mast_od_mm) / 2)]
    for s in rules.sleeve_plans:
        cases.append(pin_hold(thread, pin, plan.bore_mm, sigma, s.mast_od_mm / 2,
                              (plan.bore_mm - s.mast_od_mm) / 2, mast=s.mast_designation))
    return min(cases, key=lambda h: h.torque_nm)


def pin_retention(rules, wind, pin, sf_warn: float) -> RuleResult:
    """The mast-retention result of a hub with a pin (``rules``: the rule set)."""
    from generators.units import format_force as _F, format_moment as _M
    from generators.standards.bolts import SHEAR_SOURCE, UTS_SOURCE, ultimate_mpa

    _u = rules.cfg.units

    thread = rules.cfg.mast_pin.thread
    hold = pin_holds(rules, pin)
    r_m = hold.mast_radius_mm
    grade = ultimate_mpa(thread)[1]
    src = (f"T = 2 F r_mast, F = min(bolt shear, bearing on the hub); bolt shear {SHEAR_SOURCE}; {UTS_SOURCE};"
           f" bearing {rules.mat.bearing_mpa:g} MPa ({rules.mat.name}, materials table: {rules.mat.source}) x d x"
           f" min(wall, {BEARING_LENGTH_D:g} d) ({COMMON}), on a sleeve's wall likewise; bending across the bore gap"
           f" M = F g, g mast wall to bore wall (a sleeve not counted), against f_y pi d_s^3 / 32 (Gere; yield from memory);"
           f" stress area A_s = pi/4 (d - k P)^2 (standards/ubolts.py);"
           f" mast wall bearing not checked (no mast material in the tables); torque from an uneven gust:"
           f" plan/mast_loads.py; SF under 1 fails, under {sf_warn:g} warns ({COMMON})")
    from generators.units import format_stress as _S

    f = rules.fmt
    extra = "".join(f"; {k} {_F(v, _u)}" for k, v in hold.limits.items()
                    if k not in ("bolt shear", "bearing on the hub"))
    on = f" with the {hold.mast} in its sleeve" if hold.mast else ""
    what = (f"{thread.designation} through bolt ({grade}, {_F(hold.shear_n, _u)} in shear per plane;"
            f" bearing on the {rules.mat.name} {_S(hold.bearing_mpa, _u)} x {f(hold.d_mm)} x"
            f" {f(hold.bearing_len_mm)} = {_F(hold.bearing_n, _u)}{extra}; {hold.governs} governs) holds"
            f" {_F(hold.slide_n, _u)} along the mast and {_M(hold.torque_nm, _u)} about it{on}"
            f" (2 F x r, r = {f(r_m)})")
    mast = wind.mast
    if mast is None:
        return RuleResult("mast-retention", PASS, None, None, "SF", what + "; loads not estimated; the mast's wall"
                          " in bearing is not checked", src)
    sf_slide = hold.slide_n / max(mast.weight_n + mast.ice_weight_n, 1e-9)
    sf_turn = hold.torque_nm / max(mast.mast_torque_nm, 1e-9)
    sf = min(sf_slide, sf_turn)
    status = FAIL if sf < 1.0 else WARN if sf < sf_warn else PASS
    msg = (f"{what}; the antenna weighs {_F(mast.weight_n, _u)} (+ {_F(mast.ice_weight_n, _u)} ice) and an uneven"
           f" gust turns it with {_M(mast.mast_torque_nm, _u, 0)}: safety factor {sf_slide:.2f} sliding,"
           f" {sf_turn:.2f} turning; the mast's wall in bearing is not checked (no mast material in the tables)")
    if status != PASS:
        fix = {"bolt shear": "a larger mast_pin.thread",
               "bolt bending across the gap": "a larger mast_pin.thread, or a mast closer to the bore"}.get(
            hold.governs, "a larger mast_pin.thread (more bearing), a harder hub material or a metal sleeve in"
                          " the pin hole")
        msg += f"; {fix}"
    return RuleResult("mast-retention", status, sf, 1.0 if status == FAIL else sf_warn, "SF", msg, src)
