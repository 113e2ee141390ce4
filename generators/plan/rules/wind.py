"""Wind rules: the safety factors of the wind estimate, graded."""

from __future__ import annotations

from generators.standards.materials import get_material

from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


# A brittle composite pole (pultruded glass fibre) against its ultimate strength: warn below
# 2.5, the safety factor on ultimate flexural strength of pultruded FRP design manuals'
# allowable-stress tables (from memory; the ASCE pre-standard for LRFD of pultruded FRP
# structures, 2010, reaches a similar margin through resistance factor 0.65 and load
# factors, from memory); fail below 1.5 (common practice: no margin left for creep rupture,
# ageing, notches at the socket mouth and a pole's scatter).
SF_BRITTLE, SF_BRITTLE_FAIL = 2.5, 1.5
BRITTLE_SOURCE = ("brittle composite against its ultimate strength: SF 2.5 of pultruded FRP design manuals"
                  " (from memory), under 1.5 fails (common practice)")


class WindRules(RulesBase):
    def wind_rules(self, wind) -> list[RuleResult]:
        """Wind safety factors warn below the recommended figure and fail below 1."""
        if wind.skipped:
            return [RuleResult("wind", WARN, None, None, "", f"wind not estimated: {wind.skipped}",
                               "issue: wind needs the tip position")]
        from generators.units import format_force as F
        from generators.units import format_stress as S

        u = self.cfg.units
        out = []
        src_pole = ("sigma = M c / I, I = pi (D^4 - d^4)/64 (Roark; Gere; from memory); q = rho V^2 / 2"
                    f" or EN 1991-1-4 qp(z) ({wind.pressure_basis});"
                    " Cd 1.2 long cylinder (Hoerner; White; from memory); allowable from the materials table")
        note = (" (no spreaders.wall or inner_diameter: taken as a solid rod, which understates the stress in a"
                " tube: give the pole's wall)") if wind.solid_pole else ""
        sf = wind.sf_spreader
        brittle = get_material(self.cfg.loads.spreader_material).material_class == "composite"
        fail_below, warn_below = (SF_BRITTLE_FAIL, SF_BRITTLE) if brittle else (SF_FAIL, SF_SPREADER)
        st = FAIL if sf < fail_below else WARN if sf < warn_below else PASS
        if wind.solid_pole and st == PASS:
            st = WARN  # a solid rod's figure is no proof for a tube
        ld = self.cfg.loads
        extra = [x for x, on in (("wire pre-tension", ld.wire_tension > 0), ("ice", ld.ice_thickness > 0)) if on]
        msg = (f"spreader {wind.worst_spreader}: {S(wind.spreader_stress_mpa, u)} at the socket mouth in"
               f" {speed_text(wind.speed_m_s, self.cfg.units)} (wind, own weight{''.join(', ' + x for x in extra)})"
               f" against {S(wind.spreader_allowable_mpa, u)}"
               f" ({'ultimate' if brittle else 'yield'}, {ld.spreader_material}){note}: safety factor {sf:.2f}")
        if st != PASS:
            msg += ("; the pole itself is at risk in this wind" if sf < 1 else "") + \
                   (f"; a brittle pole wants {SF_BRITTLE:g}" if brittle else "") + \
                   ": a stiffer or thicker-walled pole, shorter spreaders, less wire tension, or lower it before storms"
        src_pole += "; " + (BRITTLE_SOURCE if brittle else f"yield, under {SF_FAIL:g} fails ({COMMON})") + \
            "; pre-tension, weight and ice superposed (plan/beam.py), ice per plan/ice.py"
        out.append(RuleResult("wind-spreader", st, sf, warn_below if st != FAIL else fail_below, "SF", msg, src_pole))
        sf = wind.sf_bearing
        st = FAIL if sf < SF_FAIL else WARN if sf < SF_BEARING else PASS
        msg = (f"pole on the socket walls: {S(wind.bearing_pressure_mpa, u, 1)} peak against"
               f" {S(wind.hub_bearing_allowable_mpa, u, 1)} in {self.mat.name}: safety factor {sf:.2f}")
        if st != PASS:
            msg += ": deeper sockets (spreaders.socket_depth), a stiffer hub material, or a metal sleeve"
        out.append(RuleResult("wind-bearing", st, sf, SF_FAIL if st == FAIL else SF_BEARING, "SF", msg,
                              "rigid post in a socket, linear bearing pressure (common practice);"
                              " allowable bearing from the materials table"))
        if wind.sf_set_screw is None:
            out.append(RuleResult("wind-set-screw", PASS if self.cfg.set_screws else WARN, None, None, "SF",
                                  f"axial pull {F(wind.set_screw_pull_n, u)} per pole;"
                                  + (" no set screws hold it: add [set_screws]" if not self.cfg.set_screws
                                     else " set-screw hold not estimated"), COMMON))
        else:
            sf = wind.sf_set_screw
            st = FAIL if sf < SF_FAIL else WARN if sf < SF_SET_SCREW else PASS
            msg = (f"axial pull {F(wind.set_screw_pull_n, u)} per pole against about"
                   f" {F(wind.set_screw_capacity_n, u)} held by its set screws: safety factor {sf:.2f}")
            if st != PASS:
                msg += ": two set screws per spreader, a larger thread, or a through bolt"
            out.append(RuleResult("wind-set-screw", st, sf, SF_FAIL if st == FAIL else SF_SET_SCREW, "SF", msg,
                                  "friction 2 mu N, mu 0.2 (common practice), N from the set-screw torque,"
                                  " T = K F d with K 0.3 (standards/holding.py), at most half the thread"
                                  " strip-out force (shear area pi D Le / 2, Machinery's Handbook, from memory)"))
        return out
