"""A captive nut pulled into its printed pocket: the nut's face bearing on the print.

A tightened set screw or clamp screw pushes on the pole or the mast, and the reaction pulls
its captive nut against the pocket's wall on the face side. The force is ``F = T / (K d)``
(standards/holding.py, the same torque the crush and holding checks assume); it bears on
the nut's face, the hexagon ``(sqrt 3 / 2) s^2`` (s across flats, ISO 4032 / ASME B18.2.2)
less the clearance hole. The stress is judged against the materials table's bearing
allowable (warn past it) and the material's yield (fail past it: the nut sinks into the
print and the screw loses its hold).
"""

from __future__ import annotations

from generators.plan.geometry import hex_face_mm2
from generators.plan.rules.base import COMMON, FAIL, PASS, WARN, RuleResult, RulesBase


class NutRules(RulesBase):
    def rule_nut_bearing(self) -> RuleResult:
        from generators.plan.screws import torque_text
        from generators.standards.fasteners import hex_nut
        from generators.standards.holding import K_CRUSH, preload_n
        from generators.standards.threads import parse_thread
        from generators.units import format_force, format_stress

        sections = {"set_screw": self.cfg.set_screws, "clamp": self.cfg.mast_clamp}
        worst = None
        for p in (p for p in self.plan.holes if p.kind == "nut_pocket"):
            h = self.plan.hole(p.serves)
            section = sections.get(h.kind)
            if section is None:
                continue  # a feed-point or other screw: tightened to what it holds, no torque set
            thread = parse_thread(p.thread)
            torque, t_src = self._torque(section, thread, captive=True)
            force = preload_n(torque, thread, K_CRUSH)
            nut = hex_nut(thread)
            hole = h.diameter_mm - h.compensation_mm
            area = hex_face_mm2(nut.across_flats_mm, hole)
            stress = force / area
            if worst is None or stress > worst[0]:
                worst = (stress, h, thread, torque, t_src, force, area, nut)
        if worst is None:
            return self._na("nut-bearing", "MPa", "no captive nuts under a set or clamp screw")
        stress, h, thread, torque, t_src, force, area, nut = worst
        u, mat = self.cfg.units, self.mat
        status = FAIL if stress > mat.yield_mpa else WARN if stress > mat.bearing_mpa else PASS
        msg = (f"{h.id}: {thread.size} at {torque_text(torque, u)} pulls its captive nut with {format_force(force, u)}"
               f" on {area:.1f} mm2 of nut face = {format_stress(stress, u, 1)} on the {mat.name}, against"
               f" {format_stress(mat.bearing_mpa, u)} allowed in bearing ({format_stress(mat.yield_mpa, u)} yield)")
        if status != PASS:
            key = "set_screws.torque" if h.kind == "set_screw" else "mast_clamp.torque"
            ok = mat.bearing_mpa * area * K_CRUSH * thread.major_mm / 1000.0
            msg += ("; the nut sinks into the print" if status == FAIL else "; past the bearing allowable") + (
                f": a smaller torque ({key}, about {torque_text(ok, u)} at the allowable), a washer or a"
                " square nut under it (a larger face), a heat-set insert, or a stiffer material")
        return RuleResult("nut-bearing", status, stress, mat.bearing_mpa, "MPa", msg,
                          f"F = T / (K d), K = {K_CRUSH:g} (standards/holding.py); {t_src}; nut face (sqrt 3 / 2)"
                          f" s^2 - pi/4 d_h^2, s across flats from {nut.standard}; bearing allowable and yield"
                          f" from the materials table ({mat.source}); over the yield fails, over the"
                          f" allowable warns ({COMMON})")
