"""Fastener rules: thread engagement and set-screw length from stock."""

from __future__ import annotations

import math

from generators.units import format_length
from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


class FastenerRules(RulesBase):
    def rule_thread_engagement(self) -> RuleResult:
        tapped = [h for h in self.plan.holes if h.thread and h.kind not in POCKETS]
        if not tapped:
            return self._na("thread-engagement", "x D", "no tapped holes")
        from generators.standards.engagement import ENGAGEMENT_D

        factor = ENGAGEMENT_D[self.mat.material_class]  # the same figure the taps are planned to
        worst = None
        for h in tapped:
            le = self._engaged(h)
            ratio = le / self._thread(h).major_mm
            if worst is None or ratio < worst[2]:
                worst = (h, le, ratio)
        h, le, ratio = worst
        status, limit = _grade(ratio, ENGAGE_MIN_D, factor)
        msg = f"{h.id} ({h.thread}): {self.fmt(le)} of thread in {self.mat.name} = {ratio:.2f} x D"
        if status != PASS:
            msg += (f"; want {factor:g} x D = {self.fmt(factor * self._thread(h).major_mm)}: a thicker hub,"
                    " a finer or smaller thread, a threaded insert, or a deeper hole")
        return RuleResult("thread-engagement", status, ratio, limit, "x D", msg,
                          f"engagement {factor:g} x D in {self.mat.material_class} (standards/engagement.py, the depth the"
                          f" taps are planned to; {COMMON}); under {ENGAGE_MIN_D:g} x D fails")

    def set_screw_fit(self) -> list[dict]:
        """Per set screw: distance from its face to the seated pole, where its thread is (a
        tapped run, a captive nut or an insert), the stock length the plan chose (or the
        configured one) and how much of it sits in the thread."""
        from generators.standards.fasteners import set_screw_lengths
        from generators.standards.threads import parse_thread

        ss = self.cfg.set_screws
        out = []
        for h in (h for h in self.plan.holes if h.kind == "set_screw"):
            if h.screw is None:
                continue
            sock = next(s for s in self.sockets if s.spreader == h.spreader)
            e = self._elev(sock)
            # the pole pushed onto the far side of its socket by the screw
            pole = next(p.diameter_mm for p in self.plan.spreaders if p.id == h.spreader)
            r_true = sock.radius_mm - sock.compensation_mm / 2  # a printed socket as it prints, not as modelled
            gap_to_pole = h.depth_mm - (pole - r_true) / math.cos(e)
            pocket = None if h.thread else self._pocket(h)
            if h.tapped is not None:
                start, end = h.tapped.start_mm, h.tapped.end_mm
            elif pocket is not None:
                from generators.plan.printed_screws import thread_span

                start, end = thread_span(h, pocket)
            else:
                continue
            thread, length = h.screw.thread, h.screw.length_mm
            in_thread = min(gap_to_pole, end) - max(gap_to_pole - length, start)
            out.append({"hole": h.id, "thread": thread, "length_mm": length,
                        "chosen": ss is None or ss.length is None,
                        "gap_to_pole_mm": gap_to_pole, "thread_mm": end - start, "thread_start_mm": start,
                        "thread_end_mm": end, "in_thread_mm": in_thread,
                        "major_mm": parse_thread(thread).major_mm,
                        "captive_nut": pocket is not None and pocket.kind == "nut_pocket",
                        "stock_mm": set_screw_lengths(thread)})
        return out

    def rule_set_screw_length(self) -> RuleResult:
        fits = self.set_screw_fit()
        if not fits:
            return self._na("set-screw-length", "mm", "no set screws")
        src = f"stock lengths (ISO 4026/4029, ASME B18.3; from memory); {SET_SCREW_MIN_ENGAGED_D:g} x D in the thread, {COMMON}"

        def grade(f):
            proud = f["length_mm"] - f["gap_to_pole_mm"]
            if proud > 1e-6:
                return FAIL, f"stands {self.fmt(proud)} proud of the face when tight"
            if f["in_thread_mm"] <= 0:
                return FAIL, "does not reach the pole while still in its thread"
            if f["in_thread_mm"] < self._need_in_thread(f) - 1e-9:
                return WARN, f"only {self.fmt(f['in_thread_mm'])} of it is in the thread when tight"
            return PASS, ""

        order = {FAIL: 0, WARN: 1, PASS: 2}
        graded = [(f, *grade(f)) for f in fits]
        f, status, why = min(graded, key=lambda t: (order[t[1]], t[0]["in_thread_mm"]))
        size = f"{f['thread']} x {format_length(f['length_mm'], self.cfg.units)}"  # as sold: 5/16 in
        if status == PASS:
            msg = (f"{f['hole']}: {size} {'(chosen from stock)' if f['chosen'] else ''} reaches the pole with"
                   f" {self.fmt(f['in_thread_mm'])} in the thread, {self.fmt(f['gap_to_pole_mm'] - f['length_mm'])}"
                   " below the face").replace("  ", " ")
        else:
            g, lo, hi = f["gap_to_pole_mm"], f["thread_start_mm"], f["thread_end_mm"]
            fit = [x for x in f["stock_mm"] if x <= g + 1e-9
                   and min(g, hi) - max(g - x, lo) >= self._need_in_thread(f) - 1e-9]
            hint = (f"use {f['thread']} x {format_length(max(fit), self.cfg.units)} (set_screws.length)" if fit else
                    "no stock length fits: a thicker hub, or a set screw position where the hole is longer")
            msg = f"{f['hole']}: {size} {why}; {hint}"
        return RuleResult("set-screw-length", status, f["length_mm"], f["gap_to_pole_mm"], "mm", msg, src)

    def _need_in_thread(self, f: dict) -> float:
        """Thread a tight set screw must still have: 1 x D in a tapped hole, or (nearly)
        the whole captive nut (common practice)."""
        if f.get("captive_nut"):
            return 0.9 * f["thread_mm"]
        return SET_SCREW_MIN_ENGAGED_D * f["major_mm"]

    def engaged_set_screw_mm(self) -> float | None:
        """Least full thread of any tapped set-screw hole (what the wind estimate's hold uses)."""
        vals = [self._engaged(h) for h in self.plan.holes if h.kind == "set_screw" and h.thread]
        return min(vals) if vals else None
