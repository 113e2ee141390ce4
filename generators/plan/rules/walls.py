"""Wall rules: sockets to the outer faces, between sockets, socket floor to bore, every other
wall between cuts, and sleeves; all measured on the true cutter shapes."""

from __future__ import annotations

import math

from generators.plan.rules.base import (  # noqa: F401
    COMMON, DEPTH_MIN_D, DEPTH_RECOMMENDED_D, EDGE_MIN_D, EDGE_RECOMMENDED_D, ENGAGE_MIN_D, FAIL,
    MASS_WARN_FRACTION, PASS, POCKETS, RECOMMENDED_OVER_MIN, SET_SCREW_MIN_ENGAGED_D, SF_BEARING, SF_FAIL,
    SF_SET_SCREW, SF_SPREADER, SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM, WALL_OVER_SOCKET, WARN, RuleResult,
    RulesBase, _grade, speed_text)


class WallRules(RulesBase):
    """Walls measured between the true shapes of the cuts (``plan/measured_walls.py``)."""

    def _walls_where(self, keep) -> list:
        return [w for w in self.walls if keep(w)]

    def _kind(self, ref: str) -> str:
        return "face" if ref.startswith("face:") else self.plan.hole(ref).kind

    def socket_face_walls(self) -> list[tuple[str, float]]:
        """(socket id, least wall to an outer face it does not open onto) per socket."""
        out = {}
        for w in self._walls_where(lambda w: w.b.startswith("face:") and self._kind(w.a) == "socket"):
            out[w.a] = min(out.get(w.a, w.mm), w.mm)
        return sorted(out.items(), key=lambda t: t[1])

    def rule_socket_wall(self) -> RuleResult:
        if not self.sockets:
            return self._na("socket-wall", "mm", "no sockets")
        rec = max(RECOMMENDED_OVER_MIN * self.min_wall, WALL_OVER_SOCKET * self.sockets[0].diameter_mm)
        found = self._walls_where(lambda w: w.b.startswith("face:") and self._kind(w.a) == "socket")
        if not found:
            return RuleResult("socket-wall", PASS, None, rec, "mm", "every socket has more than"
                              f" {self.fmt(self.far)} of material to the outer faces", self._src())
        w = found[0]
        status, limit = _grade(w.mm, self.min_wall, rec)
        msg = (f"{w.a}: {self.fmt(w.mm)} of {self.mat.name} between the socket and the {w.b[5:]} face"
               f"{self._profile_note(w.a)}")
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a thicker hub"
                    " (hub.thickness), a larger hub, less elevation or thinner spreaders")
        return RuleResult("socket-wall", status, w.mm, limit, "mm", msg, self._src(socket=True))

    def rule_socket_web(self) -> RuleResult:
        if len(self.sockets) < 2:
            return self._na("socket-web", "mm", "fewer than two sockets")
        rec = RECOMMENDED_OVER_MIN * self.min_wall
        found = self._walls_where(lambda w: self._kind(w.a) == "socket" and self._kind(w.b) == "socket")
        if not found:
            return RuleResult("socket-web", PASS, None, rec, "mm", "neighbouring sockets are more than"
                              f" {self.fmt(self.far)} apart", self._src())
        w = found[0]
        status, limit = _grade(w.mm, self.min_wall, rec)
        msg = f"{w.a}-{w.b}: {self.fmt(w.mm)} of material between neighbouring sockets"
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a larger bore"
                    " (hub.bore), blind sockets (spreaders.socket_depth), fewer or thinner spreaders")
        return RuleResult("socket-web", status, w.mm, limit, "mm", msg, self._src())

    def rule_socket_bore(self) -> RuleResult:
        blind = {h.id for h in self.sockets if self._blind(h)}
        if not blind:
            return self._na("socket-bore", "mm", "the sockets run into the bore (the poles butt against"
                            " what is in it)")
        rec = RECOMMENDED_OVER_MIN * self.min_wall
        found = self._walls_where(lambda w: {w.a, w.b} & blind and "bore" in (w.a, w.b))
        if not found:
            return RuleResult("socket-bore", PASS, None, rec, "mm", "the socket floors are more than"
                              f" {self.fmt(self.far)} from the bore", self._src())
        w = found[0]
        sid = w.a if w.a in blind else w.b
        status, limit = _grade(w.mm, self.min_wall, rec)
        msg = f"{sid}: {self.fmt(w.mm)} of material between the socket floor and the bore"
        if status != PASS:
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): a shorter"
                    ' spreaders.socket_depth, a larger hub or socket_depth = "to-bore"')
        return RuleResult("socket-bore", status, w.mm, limit, "mm", msg, self._src())

    def rule_hole_wall(self) -> RuleResult:
        """Every other wall: between holes, holes and sockets, hole bottoms, the bore to the outside."""
        socketish = lambda w: (self._kind(w.a) == "socket" and (w.b.startswith("face:")  # noqa: E731
                               or self._kind(w.b) in ("socket", "bore")))
        found = [w for w in self.walls if not socketish(w) and not self._pocket_face(w)]
        rec = RECOMMENDED_OVER_MIN * self.min_wall
        if not found:
            return RuleResult("hole-wall", PASS, None, rec, "mm", "every hole has more than"
                              f" {self.fmt(self.far)} of material around it", self._src())
        w = found[0]
        status, limit = _grade(w.mm, self.min_wall, rec)
        msg = f"{w.a} to {self._other(w)}: {self.fmt(w.mm)} of material{self._profile_note(w.a, w.b)}"
        if status != PASS:
            thin = [x for x in found if x.mm < rec - 1e-9]
            pins = ["pin" in (self._kind(x.a), self._kind(x.b)) for x in thin]
            move = ("a mast_pin.height above or below the sockets" if all(pins) else
                    "move the hole" + (" (the pin: a mast_pin.height above or below the sockets)" if any(pins) else ""))
            msg += (f"; want at least {self.fmt(rec)} (minimum {self.fmt(self.min_wall)}): {move},"
                    " a smaller thread or a larger or thicker hub")
            more = [f"{x.a} to {self._other(x)} {self.fmt(x.mm)}" for x in thin[1:]]
            if more:
                msg += (f"; also under {self.fmt(rec)}: {', '.join(more[:4])}"
                        + (f" and {len(more) - 4} more" if len(more) > 4 else ""))
        return RuleResult("hole-wall", status, w.mm, limit, "mm", msg, self._src())

    @staticmethod
    def _other(w) -> str:
        return f"the {w.b[5:]} face" if w.b.startswith("face:") else w.b

    def _pocket_face(self, w) -> bool:
        from generators.plan.kinds import POCKET_KINDS

        return w.b.startswith("face:") and self._kind(w.a) in POCKET_KINDS

    def _profile_note(self, *refs: str) -> str:
        shapes = {self.plan.hole(r).profile for r in refs if not r.startswith("face:")}
        return " (measured on the teardrop roof)" if "teardrop" in shapes else ""

    def _src(self, socket: bool = False) -> str:
        extra = f" and {WALL_OVER_SOCKET:g} x the socket diameter" if socket else ""
        return (f"measured between the true cutter shapes; {COMMON}: minimum {self.min_wall:g} mm in"
                f" {self.cls}, recommended {RECOMMENDED_OVER_MIN:g} x that{extra}")

    def sleeves(self) -> list[dict]:
        """Reducer sleeve OD, ID and wall per ``[[reducers]]`` entry and ``--mast`` size."""
        return [s.record() for s in self.sleeve_plans]

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
