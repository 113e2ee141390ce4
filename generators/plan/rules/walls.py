"""Wall rules: socket to the top and bottom faces, between sockets, socket floor to bore, sleeves."""

from __future__ import annotations

import math

from generators.plan.geometry import segment_distance
from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


class WallRules(RulesBase):
    def socket_face_walls(self) -> list[tuple[str, float]]:
        """(socket id, least wall to the top or bottom face) per socket."""
        out = []
        for h in self.sockets:
            e = self._elev(h)
            r = h.radius_mm
            reach_mouth = r / math.cos(e)  # vertical half-extent where the socket meets a vertical face
            reach_end = r * math.cos(e) if self._blind(h) else r / math.cos(e)
            z0, z1 = h.entry_mm[2], h.bottom_mm[2]
            walls = (self.T - z0 - reach_mouth, z0 - reach_mouth, self.T - z1 - reach_end, z1 - reach_end)
            out.append((h.id, min(walls)))
        return out

    def rule_socket_wall(self) -> RuleResult:
        if not self.sockets:
            return self._na("socket-wall", "mm", "no sockets")
        sid, wall = min(self.socket_face_walls(), key=lambda t: t[1])
        rec = max(RECOMMENDED_OVER_MIN * self.min_wall, WALL_OVER_SOCKET * self.sockets[0].diameter_mm)
        status, limit = _grade(wall, self.min_wall, rec)
        msg = f"{sid}: {self.fmt(wall)} of {self.mat.name} between the socket and the top/bottom face"
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a thicker hub"
                    " (hub.thickness), less elevation or thinner spreaders")
        return RuleResult("socket-wall", status, wall, limit, "mm", msg,
                          f"{COMMON}: minimum {self.min_wall:g} mm in {self.cls}, recommended"
                          f" {RECOMMENDED_OVER_MIN:g} x that and {WALL_OVER_SOCKET:g} x the socket diameter")

    def rule_socket_web(self) -> RuleResult:
        if len(self.sockets) < 2:
            return self._na("socket-web", "mm", "fewer than two sockets")
        n = len(self.sockets)
        worst = None
        for i, a in enumerate(self.sockets):
            b = self.sockets[(i + 1) % n]
            gap = segment_distance(a.entry_mm, a.bottom_mm, b.entry_mm, b.bottom_mm) - a.radius_mm - b.radius_mm
            if worst is None or gap < worst[2]:
                worst = (a.id, b.id, gap)
        a, b, web = worst
        rec = RECOMMENDED_OVER_MIN * self.min_wall
        status, limit = _grade(web, self.min_wall, rec)
        msg = f"{a}-{b}: {self.fmt(web)} of material between neighbouring sockets at their inner ends"
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a larger bore"
                    " (hub.bore), blind sockets (spreaders.socket_depth), fewer or thinner spreaders")
        return RuleResult("socket-web", status, web, limit, "mm", msg,
                          f"{COMMON}: minimum {self.min_wall:g} mm in {self.cls}, recommended"
                          f" {RECOMMENDED_OVER_MIN:g} x that")

    def rule_socket_bore(self) -> RuleResult:
        blind = [h for h in self.sockets if self._blind(h)]
        if not blind:
            return self._na("socket-bore", "mm", "the sockets run into the bore (the poles butt against"
                            " what is in it)")
        Rb = self.plan.bore_mm / 2
        worst = None
        for h in blind:
            e = self._elev(h)
            rho = math.hypot(h.bottom_mm[0], h.bottom_mm[1]) - h.radius_mm * abs(math.sin(e))
            web = rho - Rb
            if worst is None or web < worst[1]:
                worst = (h.id, web)
        sid, web = worst
        rec = RECOMMENDED_OVER_MIN * self.min_wall
        status, limit = _grade(web, self.min_wall, rec)
        msg = f"{sid}: {self.fmt(web)} of material between the socket floor and the bore"
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a shorter"
                    ' spreaders.socket_depth, a larger hub or socket_depth = "to-bore"')
        return RuleResult("socket-bore", status, web, limit, "mm", msg,
                          f"{COMMON}: minimum {self.min_wall:g} mm in {self.cls}")

    def sleeves(self) -> list[dict]:
        """Reducer sleeve OD, ID and wall per ``[[reducers]]`` entry and ``--mast`` size."""
        return [{"key": s.key, "mast": s.mast_designation, "mast_od_mm": s.mast_od_mm, "od_mm": s.od_mm,
                 "id_mm": s.id_mm, "wall_mm": s.wall_mm} for s in self.sleeve_plans]

    def rule_sleeve_wall(self) -> RuleResult:
        sl = self.sleeves()
        if not sl:
            return self._na("sleeve-wall", "mm", "no reducer sleeves")
        s = min(sl, key=lambda x: x["wall_mm"])
        status, limit = _grade(s["wall_mm"], SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM)
        msg = (f"{s['key']} ({s['mast']}): sleeve {self.fmt(s['od_mm'])} OD x {self.fmt(s['id_mm'])} ID,"
               f" wall {self.fmt(s['wall_mm'])}")
        if status != PASS:
            largest = s["od_mm"] - 2 * SLEEVE_RECOMMENDED_MM - (s["id_mm"] - s["mast_od_mm"])
            msg += (f"; want {self.fmt(SLEEVE_RECOMMENDED_MM)}: a larger hub.bore, or a mast of at most"
                    f" {self.fmt(max(largest, 0))} OD in this bore")
        return RuleResult("sleeve-wall", status, s["wall_mm"], limit, "mm", msg,
                          f"{COMMON}: sleeve wall at least {SLEEVE_MIN_MM:g} mm, recommended"
                          f" {SLEEVE_RECOMMENDED_MM:g} mm")
