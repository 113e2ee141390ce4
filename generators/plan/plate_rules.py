"""Design rules and the wind estimate of a plate hub (pure functions of config, plan, layout).

Wind model (SI; an estimate, not a structural certification). The worst case for the plate
is wind square to it, across every pole at once:

1. ``q`` as for the block hub (``plan/loads.py`` steps 1 and 9: ``1/2 rho V^2`` at reference
   height, or the EN 1991-1-4 peak velocity pressure at ``[loads] height``), ``w = q Cd d`` per
   metre of pole on its iced diameter, the wire share ``F_w = q Cd d_w L_w`` at the tip (White,
   "Fluid Mechanics"; Hoerner, "Fluid-Dynamic Drag"; ice per plan/ice.py; from memory).
2. The pole beyond its outer U-bolt B is a cantilever of length ``L`` (B to the tip) under the
   wind, the wire pre-tension across it and its own, the ice's and the wire's weight,
   superposed as ``plan/beam.py`` states (``plan/loads.py`` step 10; Gere, "Mechanics of
   Materials"; Roark, from memory); the resultant moment ``M_B`` and shear ``F`` are taken
   square to the plate (conservative). Pole stress ``sigma = M_B (D/2) / I + N / A`` against
   the ultimate strength of a brittle composite (SF as rules/wind.py) or a metal's yield.
3. The pole rests on two supports, the U-bolts B and A, ``s`` apart (statics of an
   overhanging beam): ``R_B = F + M_B / s`` at B and ``R_A = M_B / s`` (the other way) at A.
   Each U-bolt's two legs share its force: leg tension ``R / 2`` against the tensile stress
   area ``A_s = pi/4 (d - 0.9382 P)^2`` (ISO 898-1; 0.9743 P for Unified threads, ASME B1.1;
   from memory).
4. Plate bending between the U-bolts, elastic rectangle ``sigma = 6 M / (b t^2)`` (Roark,
   "Formulas for Stress and Strain", beam of rectangular section; from memory):
   - at the inner U-bolt A, square to the pole: ``M = R_B s``, ``b`` the width B's load
     spreads to at 45 deg over ``s`` (the outer rims of its washers plus ``2 s``; the 45 deg
     load spread is common practice), at most the plate's chord there, less A's two holes;
   - at each line of mast U-bolt legs (parallel to the mast, half a leg spacing off its
     axis): ``M`` the sum of every spreader force on that side times its lever to the line,
     ``b`` the plate's chord along the line, less the two legs' holes.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.plan.cutlist import tip_radius_mm
from generators.plan.geometry import inside_polygon
from generators.plan.loads import pole_bore_mm
from generators.plan.rules.base import COMMON, FAIL, PASS, SF_FAIL, SF_SPREADER, WARN, RuleResult, speed_text
from generators.plan.rules.placement import PlacementRules

SF_PLATE = 2.0  # plate bending and U-bolt legs warn below this (common practice, as the socket bearing)
EDGE_MIN_ROD, EDGE_RECOMMENDED_ROD = 1.0, 1.5  # hole centre to edge over rod diameter (common practice)
PLATE_SRC = "sigma = 6 M / (b t^2), rectangular section (Roark, from memory); loads: overhanging beam statics"


@dataclass(frozen=True)
class PlateWind:
    speed_m_s: float
    pressure_pa: float
    skipped: str | None
    force_per_spreader_n: float | None = None
    moment_at_hub_nm: float | None = None  # at the outer U-bolt
    spreader_stress_mpa: float | None = None
    sf_spreader: float | None = None
    exposed_length_m: float | None = None
    outer_force_n: float | None = None  # R_B
    inner_force_n: float | None = None  # R_A
    plate_stress_mpa: float | None = None  # the worse of the two sections
    leg_tension_n: float | None = None
    solid_pole: bool = False
    sf_plate: float | None = None
    sf_legs: float | None = None
    pressure_basis: str = "1/2 rho V^2, V taken as the 10 m open-country reference speed, no height or terrain factor"
    spreader_allowable_mpa: float | None = None
    brittle: bool = False
    mast: object | None = None  # mast_loads.MastLoads

    @property
    def safety_factor(self) -> float | None:
        """The lowest of the pole's, the plate's and the U-bolt legs' safety factors."""
        sfs = [x for x in (self.sf_spreader, self.sf_plate, self.sf_legs) if x is not None]
        return min(sfs) if sfs else None

    def as_json(self) -> dict:
        from generators.plan.loads import MAST_KEYS, wind_json
        from generators.plan.loads import rounded as r

        return {**wind_json(self), "bearing_pressure_mpa": None, "set_screw_pull_n": None,
                "u_bolt_forces_n": None if self.outer_force_n is None else
                [r(self.inner_force_n, 2), r(self.outer_force_n, 2)],
                "plate_stress_mpa": r(self.plate_stress_mpa, 2),
                "u_bolt_leg_tension_n": r(self.leg_tension_n, 2),
                **{k: (r(getattr(self.mast, k), 4) if self.mast else None) for k in MAST_KEYS}}


def _grade(sf: float, warn_below: float) -> str:
    return FAIL if sf < SF_FAIL else WARN if sf < warn_below else PASS


class PlateRules(PlacementRules):
    """The plate's rules; ``rule_mass`` comes from the placement group unchanged."""

    def __init__(self, cfg, plan, layout):
        super().__init__(cfg, plan, ())
        self.layout = layout

    def wind(self) -> PlateWind:
        from generators.plan.ice import iced_diameter_mm
        from generators.plan.loads import SpreaderLoad, design_pressure, pole_bending
        from generators.standards.materials import get_material
        from generators.standards.ubolts import U_BOLT_YIELD_MPA, stress_area_mm2

        cfg, lay = self.cfg, self.layout
        ld = cfg.loads
        q, basis = design_pressure(cfg)
        R = tip_radius_mm(cfg)
        if R is None:
            return PlateWind(ld.wind_speed, q, "no tip position: set spreaders.tip_radius or spreaders.tip_spacing",
                             pressure_basis=basis)
        D = cfg.spreaders.diameter
        r_b = max(math.hypot(*u.centre) for u in lay.for_spreader(1))
        L = (R - r_b) / 1000.0
        if L <= 0:
            return PlateWind(ld.wind_speed, q, "the tips are on the plate: check spreaders.tip_radius",
                             pressure_basis=basis)
        w = q * ld.drag_coefficient * iced_diameter_mm(D, ld.ice_thickness) / 1000.0
        wire_d = iced_diameter_mm(ld.wire_diameter, ld.ice_thickness) if ld.wire_diameter > 0 else 0.0
        f_wire = q * ld.drag_coefficient * wire_d / 1000.0 * ld.wire_length_per_spreader / 1000.0
        pole = get_material(ld.spreader_material, key="loads.spreader_material")
        across = SpreaderLoad(spreader=1, wind_azimuth_deg=0.0, exposed_length_m=L, pole_force_n=w * L,
                              wire_force_n=f_wire, force_n=w * L + f_wire, moment_nm=w * L * L / 2 + f_wire * L,
                              shear_n=w * L + f_wire)
        # wind, wire pre-tension and weight (plan/loads.py step 10), the resultant taken square
        # to the plate: the U-bolts and the plate carry it whichever way it points (conservative)
        bend, axial, F = pole_bending(cfg, across, 0.0, pole)
        m_b = bend.moment_nm
        s = lay.spacing_mm / 1000.0
        d_in = pole_bore_mm(cfg)
        area_mm2 = math.pi / 4 * (D * D - (d_in or 0.0) ** 2)
        sigma = bend.stress_pa / 1e6 + max(axial, 0.0) / area_mm2
        brittle = pole.material_class == "composite"
        allowable = pole.tensile_mpa if brittle else pole.yield_mpa
        from generators.plan.loads import _directions
        from generators.plan.mast_loads import mast_loads

        lengths = [(R - math.hypot(sp.mouth_mm[0], sp.mouth_mm[1])) / 1000.0 for sp in self.plan.spreaders]
        mast = mast_loads(cfg, self.plan, q, lengths, _directions(), self.mass_estimate_g(), R, pole, max(lengths))
        r_B, r_A = F + m_b / s, m_b / s
        plate = max(self._strip_stress(r_B), self._mast_stress(r_B, r_A))
        leg = r_B / 2 / stress_area_mm2(lay.for_spreader(1)[-1].size.thread)
        return PlateWind(ld.wind_speed, q, None, force_per_spreader_n=F, moment_at_hub_nm=m_b,
                         spreader_stress_mpa=sigma, sf_spreader=allowable / sigma if sigma > 0 else None,
                         exposed_length_m=L, outer_force_n=r_B, inner_force_n=r_A, plate_stress_mpa=plate,
                         leg_tension_n=r_B / 2, solid_pole=d_in is None,
                         sf_plate=self.mat.yield_mpa / plate if plate > 0 else None,
                         sf_legs=U_BOLT_YIELD_MPA / leg if leg > 0 else None,
                         pressure_basis=basis, spreader_allowable_mpa=allowable, brittle=brittle, mast=mast)

    # ---- the plate sections ---------------------------------------------------------------
    def _strip_stress(self, r_b_n: float) -> float:
        a = self.layout.for_spreader(1)[0]
        s = self.layout.spacing_mm
        across = (-a.along[1], a.along[0])
        chord = self._chord(across, math.hypot(*a.centre), normal=a.along)
        b = min(a.leg_spacing_mm + a.washer.outside_mm + 2 * s, chord) - 2 * a.hole_mm
        return 6 * r_b_n * s / (b * self.T ** 2)

    def _mast_lines(self):
        m = self.layout.mast_u_bolts[0]
        md = m.along
        off = m.leg_spacing_mm / 2
        return md, off, m

    def _mast_stress(self, r_b_n: float, r_a_n: float) -> float:
        md, off, m = self._mast_lines()
        worst = 0.0
        for side in (-1.0, 1.0):
            moment = 0.0
            for u in self.layout.u_bolts:
                if u.holds != "spreader":
                    continue
                lever = side * (-md[1] * u.centre[0] + md[0] * u.centre[1]) - off
                if lever <= 0:
                    continue
                force = r_b_n if u.id.endswith("B") else -r_a_n
                moment += force * lever
            b = self._chord(md, side * off, normal=(-md[1], md[0])) - 2 * m.hole_mm
            worst = max(worst, 6 * abs(moment) / (b * self.T ** 2))
        return worst

    def _chord(self, md, offset: float, normal, samples: int = 4000) -> float:
        """Length of the plate along the line parallel to ``md``, ``offset`` from the centre
        along ``normal`` (sampled)."""
        R = self.plan.body.corner_radius_mm
        px, py = normal[0] * offset, normal[1] * offset
        step = 2 * R / samples
        inside = sum(inside_polygon((px + md[0] * (-R + (k + 0.5) * step), py + md[1] * (-R + (k + 0.5) * step)),
                                    self.plan.body.outline) for k in range(samples))
        return inside * step

    # ---- rules -------------------------------------------------------------------------------
    def rules(self, wind: PlateWind) -> list[RuleResult]:
        out = [self.rule_edge(), self.rule_legs()]
        if wind.skipped:
            out.append(RuleResult("wind", WARN, None, None, "", f"wind not estimated: {wind.skipped}", COMMON))
        else:
            out += self.wind_rules(wind)
        out.append(self.rule_mass())
        return out

    def rule_edge(self) -> RuleResult:
        from generators.plan.geometry import edge_distance

        worst = None
        for u in self.layout.u_bolts:
            for p in u.leg_points:
                ratio = edge_distance(p, self.plan.body.outline) / u.size.rod_mm
                if worst is None or ratio < worst[0]:
                    worst = (ratio, u)
        ratio, u = worst
        st = FAIL if ratio < EDGE_MIN_ROD - 1e-6 else WARN if ratio < EDGE_RECOMMENDED_ROD - 1e-6 else PASS
        msg = f"U-bolt {u.id}: hole centre {ratio:.2f} rod diameters from the plate edge"
        if st != PASS:
            msg += ": a larger plate or a larger plate.edge_margin"
        return RuleResult("plate-edge", st, ratio, EDGE_RECOMMENDED_ROD, "x d", msg,
                          "about 1.5 d at a sheared edge (AISC 360 table J3.4, from memory); common practice")

    def rule_legs(self) -> RuleResult:
        short = [(u.size.leg_length_mm - u.leg_needed_mm, u) for u in self.layout.u_bolts]
        spare, u = min(short, key=lambda x: x[0])
        st = FAIL if spare < 0 else PASS
        msg = (f"U-bolt {u.id} ({u.size.size}): needs {self.fmt(u.leg_needed_mm)} of leg inside the bend"
               f" (what it holds + plate + washer + nut + 2 threads), the stock one has {self.fmt(u.size.leg_length_mm)}")
        if st == FAIL:
            msg += ": order it with longer legs, or a thinner plate"
        return RuleResult("u-bolt-legs", st, spare, 0.0, "mm", msg,
                          "leg length from the U-bolt table (" + u.size.source + "); 2 threads past the nut, common practice")

    def wind_rules(self, w: PlateWind) -> list[RuleResult]:
        from generators.standards.ubolts import U_BOLT_YIELD_MPA, U_BOLT_YIELD_SOURCE, stress_area_mm2

        out = []
        from generators.plan.rules.wind import BRITTLE_SOURCE, SF_BRITTLE, SF_BRITTLE_FAIL

        note = (" (no spreaders.wall or inner_diameter: taken as a solid rod, which understates the stress in a"
                " tube: give the pole's wall)") if w.solid_pole else ""
        fail_below, warn_below = (SF_BRITTLE_FAIL, SF_BRITTLE) if w.brittle else (SF_FAIL, SF_SPREADER)
        sf = w.sf_spreader
        st = FAIL if sf < fail_below else WARN if sf < warn_below else PASS
        if w.solid_pole and st == PASS:
            st = WARN  # a solid rod's figure is no proof for a tube
        ld = self.cfg.loads
        extra = "".join(", " + x for x, on in (("wire pre-tension", ld.wire_tension > 0), ("ice", ld.ice_thickness > 0))
                        if on)
        out.append(RuleResult("wind-spreader", st, sf, warn_below if st != FAIL else fail_below, "SF",
                              f"{w.spreader_stress_mpa:.0f} MPa in each pole at its outer U-bolt in"
                              f" {speed_text(w.speed_m_s, self.cfg.units)} (wind, own weight{extra}, taken square to"
                              f" the plate) against {w.spreader_allowable_mpa:.0f} MPa"
                              f" ({'ultimate' if w.brittle else 'yield'}, {ld.spreader_material}){note}: safety factor"
                              f" {sf:.2f}" + ("" if st == PASS else (f"; a brittle pole wants {SF_BRITTLE:g}" if w.brittle
                                                                    else "") + ": a stiffer pole or shorter spreaders"),
                              "sigma = M c / I + N / A, M from wind, pre-tension and weight superposed (plan/beam.py;"
                              " Gere; Roark; from memory); q = rho V^2 / 2 or EN 1991-1-4 qp(z)"
                              f" ({w.pressure_basis}); Cd from the config (Hoerner; White; from memory); "
                              + (BRITTLE_SOURCE if w.brittle else f"yield, under {SF_FAIL:g} fails ({COMMON})")))
        sf = w.sf_plate
        st = _grade(sf, SF_PLATE)
        out.append(RuleResult("plate-bending", st, sf, SF_FAIL if st == FAIL else SF_PLATE, "SF",
                              f"plate {self.fmt(self.T)} thick: {w.plate_stress_mpa:.0f} MPa in bending between the"
                              f" U-bolts against {self.mat.yield_mpa:g} MPa ({self.mat.name}): safety factor {sf:.2f}"
                              + ("" if st == PASS else ": a thicker plate (hub.thickness), a stronger material or"
                                 " a wider plate.u_bolt_spacing"), PLATE_SRC))
        u = self.layout.for_spreader(1)[-1]
        sigma = w.leg_tension_n / stress_area_mm2(u.size.thread)
        sf = w.sf_legs
        st = _grade(sf, SF_PLATE)
        out.append(RuleResult("u-bolt-tension", st, sf, SF_FAIL if st == FAIL else SF_PLATE, "SF",
                              f"outer U-bolt legs ({u.size.thread.designation}): {w.leg_tension_n:.0f} N each,"
                              f" {sigma:.0f} MPa on the stress area: safety factor {sf:.2f}"
                              + ("" if st == PASS else ": a wider plate.u_bolt_spacing or a larger U-bolt"),
                              f"A_s = pi/4 (d - k P)^2, k 0.9382 metric (ISO 898-1), 0.9743 Unified (ASME B1.1), from memory;"
                              f" {U_BOLT_YIELD_SOURCE}"))
        return out


def plate_checks(cfg, plan, layout):
    """The plate's rule results and wind estimate, as a ``rules.Checks``."""
    from generators.plan.rules import Checks

    r = PlateRules(cfg, plan, layout)
    wind = r.wind()
    return Checks(rules=tuple(r.rules(wind)), wind=wind, set_screws=(), sleeves=(),
                  mass_estimate_g=r.mass_estimate_g())
