"""Rules of a split hub: the bolts' edge distance on the split faces, and the clamp the
bolts put on the mast (the retention model of rules/retention.py: ``T = K F d`` and
friction ``2 mu F``, the halves pressed onto the mast from both sides)."""

from __future__ import annotations

import math

from generators.plan.rules.base import COMMON, EDGE_MIN_D, EDGE_RECOMMENDED_D, FAIL, PASS, WARN, RuleResult, RulesBase, _grade

SF_SPLIT_CLAMP = 2.0  # as the mast retention: warns below 2, fails below 1 (common practice)


class SplitRules(RulesBase):
    def _bolt_edges(self) -> list[tuple]:
        """(bolt, rim distance, edge) for each bolt on the split face: its rim to the top and
        bottom faces, the bore and the outside of the body, in the split plane."""
        sp = self.plan.split
        out = []
        for b in sp.bolts:
            h = self.plan.hole(b.hole)
            r = h.radius_mm
            if h.roof_mm is not None:  # a teardrop reaches up to its roof
                up = h.roof_mm
            else:
                up = r
            outer = self._outer_along(sp, b.offset_mm)
            out += [(h, b.height_mm - r, "bottom face"), (h, self.T - b.height_mm - up, "top face"),
                    (h, abs(b.offset_mm) - r - self.plan.bore_mm / 2, "bore"),
                    (h, outer - abs(b.offset_mm) - r, "outside of the split face")]
        return out

    def _outer_along(self, sp, offset: float) -> float:
        """How far the split face runs from the mast axis on the bolt's side."""
        from generators.plan.split import half_outline

        pts = half_outline(self.plan.body.outline, sp.normal, -sp.gap_mm / 2, -1)
        s = 1.0 if offset >= 0 else -1.0
        return max(s * (x * sp.along[0] + y * sp.along[1]) for x, y in pts)

    def rule_split_bolt_edge(self) -> RuleResult:
        if self.plan.split is None:
            return self._na("split-bolt-edge", "x D", "the hub is not split")
        h, d, edge = min(self._bolt_edges(), key=lambda e: e[1] / e[0].diameter_mm)
        ratio = d / h.diameter_mm
        status, limit = _grade(ratio, EDGE_MIN_D, EDGE_RECOMMENDED_D)
        msg = (f"{h.id}: rim {self.fmt(d)} from the {edge} on the split face = {ratio:.2f} x its"
               f" {self.fmt(h.diameter_mm)} hole")
        if status != PASS:
            msg += (f"; want {EDGE_RECOMMENDED_D:g} x D = {self.fmt(EDGE_RECOMMENDED_D * h.diameter_mm)}:"
                    " move the bolts (split.height, split.offset), a smaller split.thread or a larger hub")
        return RuleResult("split-bolt-edge", status, ratio, limit, "x D", msg,
                          f"{COMMON}: rim at least {EDGE_MIN_D:g} x D from an edge of the split face,"
                          f" recommended {EDGE_RECOMMENDED_D:g} x D")

    def split_hold(self) -> tuple[float, str] | None:
        """(force along the mast the bolts hold, N; how it was found), or None unsplit."""
        from generators.standards.holding import K_HOLD, friction, preload_n
        from generators.standards.threads import parse_thread

        sp = self.plan.split
        if sp is None:
            return None
        mu, mu_src = friction(self.cls)
        total = 0.0
        for b in sp.bolts:
            h = self.plan.hole(b.hole)
            thread = parse_thread(b.thread)
            total += 2.0 * mu * self._capped(h, thread, preload_n(b.torque_nm, thread, K_HOLD))
        b = sp.bolts[0]
        return total, (f"{len(sp.bolts)} {b.thread} bolts at {b.torque_nm:.2f} N m ({b.torque_source}); F = T / (K d),"
                       f" K = {K_HOLD:g}; friction 2 mu F per bolt (both halves on the mast), mu = {mu:g} ({mu_src})")

    def rule_split_clamp(self, wind) -> RuleResult:
        """The bolts' grip on the mast against what the antenna puts on it."""
        from generators.units import format_force as _F, format_moment as _M

        _u = self.cfg.units
        got = self.split_hold()
        if got is None:
            return self._na("split-clamp", "SF", "the hub is not split")
        total, src = got
        sp = self.plan.split
        r_m = self.plan.mast_od_mm / 2000.0
        src += (f"; the gap ({self.fmt(sp.gap_mm)}) less the bore clearance ({self.fmt(sp.clearance_mm)}) leaves"
                f" {self.fmt(sp.interference_mm)} to close on the mast; SF under 1 fails when the hub slides,"
                f" warns when it turns or under {SF_SPLIT_CLAMP:g} ({COMMON})")
        mast = wind.mast
        if mast is None:
            return RuleResult("split-clamp", PASS, None, None, "SF",
                              f"the split bolts hold {_F(total, _u)} along the mast; loads not estimated", src)
        sf_slide = total / max(mast.weight_n + mast.ice_weight_n, 1e-9)
        sf_turn = total * r_m / max(mast.mast_torque_nm, 1e-9)
        pinned = any(h.kind == "pin" for h in self.plan.holes)
        # with a through bolt ([mast_pin]) the turning is the pin's (mast-retention), not the grip's
        sf = sf_slide if pinned else min(sf_slide, sf_turn)
        status = FAIL if sf_slide < 1.0 else WARN if sf < SF_SPLIT_CLAMP else PASS
        msg = (f"the split bolts hold {_F(total, _u)} along the mast and {_M(total * r_m, _u)} about it;"
               f" the antenna weighs {_F(mast.weight_n, _u)} (+ {_F(mast.ice_weight_n, _u)} ice) and an uneven"
               f" gust turns it with {_M(mast.mast_torque_nm, _u, 0)}: safety factor {sf_slide:.2f} sliding,"
               f" {sf_turn:.2f} turning" + ("; the through bolt holds the turning (mast-retention)" if pinned else ""))
        if status != PASS:
            msg += ("; a larger split.thread, a higher split.torque, [mast_clamp] screws as well, or a"
                    " through bolt ([mast_pin])")
        return RuleResult("split-clamp", status, sf if math.isfinite(sf) else None,
                          1.0 if status == FAIL else SF_SPLIT_CLAMP, "SF", msg, src)

    def rule_split_bearing(self) -> RuleResult:
        """The head and the nut of each bolt at its torque against the hub's yield."""
        from generators.plan.split_bolts import SF_BEARING, bearing_area_mm2
        from generators.standards.holding import K_CRUSH, preload_n

        sp = self.plan.split
        if sp is None:
            return self._na("split-bearing", "SF", "the hub is not split")
        worst = None
        for b in sp.bolts:
            area, where = bearing_area_mm2(self.plan, b.hole)
            f = preload_n(b.torque_nm, b.thread, K_CRUSH)
            sf = self.mat.yield_mpa / (f / area)
            if worst is None or sf < worst[0]:
                worst = (sf, b, area, where, f)
        sf, b, area, where, f = worst
        status, limit = _grade(sf, 1.0, SF_BEARING)
        msg = (f"{b.hole}: at {b.torque_nm:.2f} N m the bolt pulls {f:.0f} N; {where} presses {area:.0f} mm2 of"
               f" {self.mat.name} at {f / area:.0f} MPa against its {self.mat.yield_mpa:g} MPa yield: safety"
               f" factor {sf:.2f}")
        if status != PASS:
            msg += "; a lower split.torque, a washer under the head, or a larger split.thread"
        return RuleResult("split-bearing", status, sf, limit, "SF", msg,
                          f"T = K F d, K = {K_CRUSH:g} (standards/holding.py); {b.torque_source}; yield from the"
                          f" materials table; SF under 1 fails, under {SF_BEARING:g} warns ({COMMON})")
