"""Holding rules: the hub held on the mast, and set-screw points that do not crush the pole.

Forces from tightening torque by ``T = K F d`` (standards/holding.py: K and its source; the
default torques' table and sources in data/tightening_torque.csv). Half the strip-out force
of the hub's thread (plan/loads.py step 8) stays as the upper bound of any screw force.
"""

from __future__ import annotations

from generators.plan.rules.base import COMMON, FAIL, PASS, WARN, RuleResult, RulesBase, _grade

# Safety factors (common practice for an estimate like this one): retention warns below 2
# and fails below 1; point crush warns below 1.5 and fails below 1.
SF_RETENTION, SF_CRUSH = 2.0, 1.5


class RetentionRules(RulesBase):
    def _torque(self, section, thread, captive: bool) -> tuple[float, str]:
        from generators.standards.holding import default_torque_nm

        if section.torque is not None:
            return section.torque, "torque from the config"
        # a captive steel nut holds a steel screw's thread, but it bears on the hub's material:
        # the hub's class sets the torque either way
        t, src = default_torque_nm(thread, self.cls)
        return t, f"default torque ({src})"

    def _capped(self, h, thread, force: float) -> float:
        from generators.plan.loads import TIGHTEN_FRACTION, strip_force_n

        if not h.thread:  # a captive steel nut: the hub's thread does not limit it
            return force
        return min(force, TIGHTEN_FRACTION * strip_force_n(thread.major_mm, self._engaged(h), self.mat.yield_mpa))

    def set_screw_forces(self, k: float | None = None) -> list[tuple]:
        """(hole, thread, torque N m, torque source, force N) per set screw."""
        from generators.standards.holding import K_CRUSH, preload_n
        from generators.standards.threads import parse_thread

        ss = self.cfg.set_screws
        out = []
        for h in (h for h in self.plan.holes if h.kind == "set_screw"):
            pocket = None if h.thread else self._pocket(h)
            name = h.thread or (pocket.thread if pocket is not None else None)
            if name is None:
                continue
            thread = parse_thread(name)
            t, src = self._torque(ss, thread, captive=not h.thread)
            f = self._capped(h, thread, preload_n(t, thread, K_CRUSH if k is None else k))
            out.append((h, thread, t, src, f))
        return out

    def set_screw_clamp_n(self) -> float | None:
        """Least holding force of a set screw (K for holding), for the wind estimate's hold."""
        from generators.standards.holding import K_HOLD

        forces = [f for *_, f in self.set_screw_forces(K_HOLD)]
        return min(forces) if forces else None

    def rule_set_screw_crush(self) -> RuleResult:
        from generators.standards.holding import K_CRUSH, point_contact_mm2, transverse_strength_mpa

        forces = self.set_screw_forces()
        if not forces:
            return self._na("set-screw-crush", "SF", "no set screws")
        point = self.cfg.set_screws.point
        pole = self.cfg.loads.spreader_material
        strength, s_src = transverse_strength_mpa(pole)
        worst = None
        for h, thread, t, t_src, f in forces:
            area, a_src = point_contact_mm2(thread, point)
            sf = strength / (f / area)
            if worst is None or sf < worst[0]:
                worst = (sf, h, thread, t, t_src, f, area, a_src)
        sf, h, thread, t, t_src, f, area, a_src = worst
        status, limit = _grade(sf, 1.0, SF_CRUSH)
        wall = self.cfg.spreaders.wall
        from generators.plan.screws import torque_text
        from generators.units import format_force, format_stress

        u = self.cfg.units
        msg = (f"{h.id}: {point} point of {thread.size} at {torque_text(t, u)} presses {format_force(f, u)} on"
               + (f" {area / 645.16:.4f} in2 ({area:.1f} mm2)" if u == "in" else f" {area:.1f} mm2")
               + f" = {format_stress(f / area, u)} on the {pole} pole"
               + (f" ({self.fmt(wall)} wall)" if wall else "")
               + f" against {format_stress(strength, u)} across its wall: safety factor {sf:.2f}")
        if status != PASS:
            need = f * sf / SF_CRUSH if sf > 0 else 0.0
            msg += (("; the point crushes the pole" if status == FAIL else "; little margin against crushing the pole")
                    + ": a pad (a metal or plastic saddle) under the point, "
                    + ("" if point == "soft" else "a soft point (set_screws.point = \"soft\"), ")
                    + f"a smaller torque (set_screws.torque, about"
                    f" {torque_text(need * K_CRUSH * thread.major_mm / 1000.0, u)} for {SF_CRUSH:g}), or a hose clamp"
                    " round the pole instead")
        return RuleResult("set-screw-crush", status, sf, limit, "SF", msg,
                          f"T = K F d, K = {K_CRUSH:g} (standards/holding.py); {t_src}; point area: {a_src};"
                          f" transverse strength: {s_src}; half the thread strip-out force as the upper"
                          f" bound; SF under 1 fails, under {SF_CRUSH:g} warns ({COMMON})")

    def rule_mast_retention(self, wind) -> RuleResult:
        """Sliding (weight) and turning (uneven-gust torque) against a through bolt
        ([mast_pin], rules/pin_hold.py) or else clamp-screw friction; turning held by friction
        alone under SF 1 fails."""
        from generators.units import format_force as _F, format_moment as _M
        from generators.plan.pin import pin_of
        from generators.standards.holding import K_HOLD, friction, preload_n
        from generators.standards.threads import parse_thread

        _u = self.cfg.units

        pin = pin_of(self.plan)
        if pin is not None:
            from generators.plan.rules.pin_hold import pin_retention

            return pin_retention(self, wind, pin, SF_RETENTION)
        mast = wind.mast
        demand = "" if mast is None else (
            f"the antenna weighs {_F(mast.weight_n, _u)} (+ {_F(mast.ice_weight_n, _u)} ice) and an uneven gust"
            f" turns it with {_M(mast.mast_torque_nm, _u, 0)}")
        clamps = [h for h in self.plan.holes if h.kind == "clamp"]
        mc = self.cfg.mast_clamp
        split = self.split_hold()
        if (mc is None or not clamps) and split is None:
            loose = ["the hub"] + [f"the sleeve for {s.mast_designation}" for s in self.sleeve_plans]
            # nothing to rate: a warning that names what to add (the rule: warn when
            # nothing retains the hub, fail when what retains it rates under 1)
            return RuleResult("mast-retention", WARN, None, SF_RETENTION, "SF",
                              f"nothing retains {', nor '.join(loose)} on the mast" + (f"; {demand}" if demand else "")
                              + ": add [mast_pin] (a through bolt across the hub and the mast, drilled in place),"
                              " [mast_clamp] screws, or a stop collar under the hub (a collar holds weight, not"
                              " turning)", COMMON)
        mu, mu_src = friction(self.cls)
        total, t, t_src = 0.0, None, ""
        for h in clamps if mc is not None else ():
            name = h.thread or (self._pocket(h).thread if self._pocket(h) is not None else None)
            thread = parse_thread(name) if name else mc.thread
            t, t_src = self._torque(mc, thread, captive=not h.thread)
            total += 2.0 * mu * self._capped(h, thread, preload_n(t, thread, K_HOLD))
        r_m = min([self.plan.mast_od_mm] + [s.mast_od_mm for s in self.sleeve_plans]) / 2000.0
        src = (f"friction 2 mu F per screw (point and opposite wall), mu = {mu:g} ({mu_src}); F = T / (K d),"
               f" K = {K_HOLD:g} (standards/holding.py); {t_src}; torque from an uneven gust: plan/mast_loads.py;"
               f" SF under 1 fails (sliding or turning); under {SF_RETENTION:g} warns ({COMMON})")
        held = f"{len(clamps)} clamp screw{'s' if len(clamps) > 1 else ''}" if clamps else ""
        if split is not None:  # the split bolts clamp the mast as well (rules/split.py)
            total += split[0]
            src += f"; split: {split[1]}"
            held = (held + " and " if held else "") + f"{len(self.plan.split.bolts)} split bolts"
        if mast is None:
            return RuleResult("mast-retention", PASS, None, None, "SF",
                              f"{held} hold {_F(total, _u)}; loads not estimated", src)
        sf_slide = total / max(mast.weight_n + mast.ice_weight_n, 1e-9)
        sf_turn = total * r_m / max(mast.mast_torque_nm, 1e-9)
        sf = min(sf_slide, sf_turn)
        status = FAIL if sf < 1.0 else WARN if sf < SF_RETENTION else PASS
        from generators.plan.screws import torque_text

        what = (f"{len(clamps)} x {thread.designation} clamp screw{'s' if len(clamps) > 1 else ''} at"
                f" {torque_text(t, _u)}" if clamps else "")
        if split is not None:
            what = (what + " and " if what else "") + f"{len(self.plan.split.bolts)} split bolts"
        msg = (f"{what} hold {_F(total, _u)} along the mast"
               f" and {_M(total * r_m, _u)} about it; {demand}: safety factor {sf_slide:.2f} sliding,"
               f" {sf_turn:.2f} turning")
        if sf_turn < 1.0:
            msg += ("; friction cannot hold the hub from turning in the gust: add [mast_pin] with a thread"
                    " (e.g. \"M10\" or \"3/8-16\"), a through bolt across the hub and the mast, drilled in place")
        elif status != PASS:
            msg += ("; more or larger clamp screws, a higher clamp torque (mast_clamp.torque) in a metal hub,"
                    " or a through bolt ([mast_pin]; a hub that turns on the mast in a gust is not held by friction)")
        return RuleResult("mast-retention", status, sf, 1.0 if status == FAIL else SF_RETENTION, "SF", msg, src)
