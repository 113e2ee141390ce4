"""Placement rules: edge distance, socket depth and tilt; and the mass estimate."""

from __future__ import annotations

import math

from generators.plan.model import Hole, HubPlan
from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


class PlacementRules(RulesBase):
    def hole_edge(self, h: Hole) -> float | None:
        """Rim of the hole to the nearest free edge of the face it is drilled into
        (``plan/edges.py``: the crease of an obtuse corner is no free edge). Sockets are the
        socket-wall rule's; the material a hole leaves to every face is the hole-wall rule's."""
        from generators.plan.edges import free_edge_distance

        if h.kind in ("bore", "socket") or h.kind in POCKETS:
            return None  # the bore has its own wall limit; pockets open onto a face by design
        face = self.plan.face(h.face)
        return free_edge_distance(self.plan, face, face.to_face(h.entry_mm)) - h.face_radius_mm

    def rule_edge_distance(self) -> RuleResult:
        worst = None
        for h in self.plan.holes:
            d = self.hole_edge(h)
            if d is None:
                continue
            ratio = d / h.bolt_hole_mm  # the fastener's hole at the face, its seat's rim measured
            if worst is None or ratio < worst[2]:
                worst = (h, d, ratio)
        if worst is None:
            return self._na("edge-distance", "x D", "no holes but the bore")
        h, d, ratio = worst
        status, limit = _grade(ratio, EDGE_MIN_D, EDGE_RECOMMENDED_D)
        D = h.bolt_hole_mm
        seat = 2 * h.face_radius_mm
        at = ("" if abs(D - h.diameter_mm) < 1e-9 else f" at the face, {self.fmt(D)}") + \
            ("" if seat <= D + 1e-9 else f", rim of its {self.fmt(seat)} seat")
        msg = (f"{h.id}: rim {self.fmt(d)} from the nearest free edge of the {h.face} face = {ratio:.2f} x its"
               f" diameter{at}")
        if status != PASS:
            msg += (f"; want {EDGE_RECOMMENDED_D:g} x D = {self.fmt(EDGE_RECOMMENDED_D * D)}:"
                    " move the hole inward or use a larger hub")
        return RuleResult("edge-distance", status, ratio, limit, "x D", msg,
                          f"{COMMON}: rim at least {EDGE_MIN_D:g} x D from a free edge (faces meeting at"
                          f" under 150 deg), recommended"
                          f" {EDGE_RECOMMENDED_D:g} x D")

    def rule_socket_depth(self) -> RuleResult:
        if not self.sockets:
            return self._na("socket-depth", "x D", "no sockets")
        pole = {p.socket_hole: p.diameter_mm for p in self.plan.spreaders}
        h = min(self.sockets, key=lambda s: s.depth_mm / pole.get(s.id, self.cfg.spreaders.diameter))
        D = pole.get(h.id, self.cfg.spreaders.diameter)
        ratio = h.depth_mm / D
        status, limit = _grade(ratio, DEPTH_MIN_D, DEPTH_RECOMMENDED_D)
        msg = f"{h.id}: {self.fmt(h.depth_mm)} deep for a {self.fmt(D)} pole = {ratio:.2f} x D"
        if status != PASS:
            msg += (f"; want {DEPTH_RECOMMENDED_D:g} x D = {self.fmt(DEPTH_RECOMMENDED_D * D)} for bending"
                    ' support: a deeper spreaders.socket_depth, "to-bore", or a larger hub')
        return RuleResult("socket-depth", status, ratio, limit, "x D", msg,
                          f"{COMMON}: socket at least {DEPTH_RECOMMENDED_D:g} x the pole diameter")

    def rule_socket_tilt(self) -> RuleResult:
        """Elevation against the most this body allows before a socket breaks out (0 wall)
        and before its wall drops under the minimum."""
        if not self.sockets:
            return self._na("socket-tilt", "deg", "no sockets")
        # the socket nearest breaking out: the most tilt for its size
        h = max(self.sockets, key=lambda s: (round(abs(self._elev(s)), 9), s.diameter_mm))
        e_now = abs(math.degrees(self._elev(h)))
        rho0 = math.hypot(h.entry_mm[0], h.entry_mm[1])
        rho1 = math.hypot(h.bottom_mm[0], h.bottom_mm[1])
        half_run = abs(rho0 - rho1) / 2
        z_mid = (h.entry_mm[2] + h.bottom_mm[2]) / 2
        room = min(self.T - z_mid, z_mid)
        r = h.radius_mm

        def wall(e_deg: float) -> float:
            e = math.radians(e_deg)
            return room - half_run * math.tan(e) - r / math.cos(e)

        def max_elev(w: float) -> float:
            if wall(0.0) < w:
                return 0.0
            lo, hi = 0.0, 89.0
            for _ in range(60):
                mid = (lo + hi) / 2
                lo, hi = (mid, hi) if wall(mid) >= w else (lo, mid)
            return lo

        rec = max(RECOMMENDED_OVER_MIN * self.min_wall, WALL_OVER_SOCKET * h.diameter_mm)
        at_break, at_min, at_rec = max_elev(0.0), max_elev(self.min_wall), max_elev(rec)
        if wall(e_now) < self.min_wall - 1e-9:
            status, limit = FAIL, at_min
        elif wall(e_now) < rec - 1e-9:
            status, limit = WARN, at_rec
        else:
            status, limit = PASS, at_rec
        msg = (f"{h.id}: elevation {e_now:.1f} deg; this body takes up to {at_rec:.1f} deg with the"
               f" recommended {self.fmt(rec)} of wall, {at_min:.1f} deg with the minimum"
               f" {self.fmt(self.min_wall)} (breaks out past {at_break:.1f} deg)")
        if status != PASS and e_now < 1e-9:  # level: no tilt to take back
            msg += ("; level sockets already leave less than that (socket-wall): a thicker hub"
                    " (hub.thickness) or thinner spreaders before any elevation")
        elif status != PASS:
            msg += "; less elevation (spreaders.elevation) or a thicker hub (hub.thickness)"
        return RuleResult("socket-tilt", status, e_now, limit, "deg", msg,
                          f"geometry of the tilted socket; minimum wall {COMMON}")

    def mass_estimate_g(self) -> float:
        return estimate_volume_mm3(self.plan) / 1000.0 * self.mat.density_g_cm3

    def rule_mass(self) -> RuleResult:
        m = self.mass_estimate_g()
        limit = self.cfg.hub.max_mass
        src = (f"estimate without solids: body minus hole cylinders (overlaps and countersinks ignored),"
               f" density {self.mat.density_g_cm3:g} g/cm3 ({self.mat.source})")
        if limit is None:
            return RuleResult("mass", PASS, m, None, "g",
                              f"about {m:.0f} g in {self.mat.name}; no limit set (hub.max_mass)", src)
        if m > limit:
            status = FAIL
        elif m > MASS_WARN_FRACTION * limit:
            status = WARN
        else:
            status = PASS
        msg = f"about {m:.0f} g in {self.mat.name} against hub.max_mass = {limit:g} g"
        if status != PASS:
            msg += "; a lighter material (hub.material), a smaller or thinner hub"
        return RuleResult("mass", status, m, limit, "g", msg, src)


def estimate_volume_mm3(plan: HubPlan) -> float:
    """Body volume minus each hole as a plain cylinder (approximate: overlaps between
    holes, countersinks and counterbores are ignored)."""
    pts = plan.body.outline
    area = 0.5 * abs(sum(pts[i][0] * pts[(i + 1) % len(pts)][1] - pts[(i + 1) % len(pts)][0] * pts[i][1]
                         for i in range(len(pts))))
    vol = area * plan.body.thickness_mm
    sockets = {h.spreader: h for h in plan.holes if h.kind == "socket"}
    for h in plan.holes:
        length = h.depth_mm
        if h.kind == "set_screw" and h.spreader in sockets:
            s = sockets[h.spreader]
            length -= s.radius_mm / math.cos(math.asin(max(-1.0, min(1.0, -s.axis[2]))))
        vol -= math.pi * h.radius_mm ** 2 * max(length, 0.0)
    return vol
