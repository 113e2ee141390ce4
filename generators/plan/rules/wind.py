"""Wind rules: the safety factors of the wind estimate, graded."""

from __future__ import annotations


from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


class WindRules(RulesBase):
    def wind_rules(self, wind) -> list[RuleResult]:
        """Wind safety factors warn below the recommended figure and fail below 1."""
        if wind.skipped:
            return [RuleResult("wind", WARN, None, None, "", f"wind not estimated: {wind.skipped}",
                               "issue: wind needs the tip position")]
        out = []
        src_pole = ("sigma = M c / I, I = pi (D^4 - d^4)/64 (Roark; Gere; from memory); q = rho V^2 / 2;"
                    " Cd 1.2 long cylinder (Hoerner; White; from memory); allowable from the materials table")
        note = " (no spreaders.wall or inner_diameter: taken as a solid rod)" if wind.solid_pole else ""
        sf = wind.sf_spreader
        st = FAIL if sf < SF_FAIL else WARN if sf < SF_SPREADER else PASS
        msg = (f"spreader {wind.worst_spreader}: {wind.spreader_stress_mpa:.0f} MPa at the socket mouth in"
               f" {speed_text(wind.speed_m_s, self.cfg.units)} against {wind.spreader_allowable_mpa:.0f} MPa"
               f" ({self.cfg.loads.spreader_material}){note}: safety factor {sf:.2f}")
        if st != PASS:
            msg += ("; the pole itself is at risk in this wind" if sf < 1 else "") + \
                   ": a stiffer or thicker-walled pole, shorter spreaders, or lower it before storms"
        out.append(RuleResult("wind-spreader", st, sf, SF_SPREADER, "SF", msg, src_pole))
        sf = wind.sf_bearing
        st = FAIL if sf < SF_FAIL else WARN if sf < SF_BEARING else PASS
        msg = (f"pole on the socket walls: {wind.bearing_pressure_mpa:.1f} MPa peak against"
               f" {wind.hub_bearing_allowable_mpa:g} MPa in {self.mat.name}: safety factor {sf:.2f}")
        if st != PASS:
            msg += ": deeper sockets (spreaders.socket_depth), a stiffer hub material, or a metal sleeve"
        out.append(RuleResult("wind-bearing", st, sf, SF_BEARING, "SF", msg,
                              "rigid post in a socket, linear bearing pressure (common practice);"
                              " allowable bearing from the materials table"))
        if wind.sf_set_screw is None:
            out.append(RuleResult("wind-set-screw", PASS if self.cfg.set_screws else WARN, None, None, "SF",
                                  f"axial pull {wind.set_screw_pull_n:.0f} N per pole;"
                                  + (" no set screws hold it: add [set_screws]" if not self.cfg.set_screws
                                     else " set-screw hold not estimated"), COMMON))
        else:
            sf = wind.sf_set_screw
            st = FAIL if sf < SF_FAIL else WARN if sf < SF_SET_SCREW else PASS
            msg = (f"axial pull {wind.set_screw_pull_n:.0f} N per pole against about"
                   f" {wind.set_screw_capacity_n:.0f} N held by its set screws: safety factor {sf:.2f}")
            if st != PASS:
                msg += ": two set screws per spreader, a larger thread, or a through bolt"
            out.append(RuleResult("wind-set-screw", st, sf, SF_SET_SCREW, "SF", msg,
                                  "friction 2 mu N, mu 0.2, N = half the thread strip-out force (common"
                                  " practice); shear area pi D Le / 2 (Machinery's Handbook, from memory)"))
        return out
