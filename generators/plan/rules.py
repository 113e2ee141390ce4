"""Design rules run on the plan (no solids): plain data, one result per rule.

Each rule gives ``pass``, ``warn`` (below the recommended figure) or ``fail`` (below the
minimum), the worst figure over the holes it looks at, its limit and what to change.
Lengths are in mm. The hard limits in ``plan/limits.py`` refuse unbuildable parts before
these run; these rules are the shop's margins above them.
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass

from generators.config.models import Config
from generators.plan.geometry import edge_distance, segment_distance
from generators.plan.model import Hole, HubPlan
from generators.units import format_length

PASS, WARN, FAIL = "pass", "warn", "fail"

# Least material around a cut, by hub material class (common practice: plastics and wood
# tear out and creep in thin sections, aluminium holds a thinner wall).
MIN_WALL_MM = {"plastic": 3.0, "wood": 4.0, "metal": 1.5, "composite": 2.0}
# Recommended = 1.5 x the minimum, and for a socket wall at least a quarter of the socket
# diameter (common practice).
RECOMMENDED_OVER_MIN = 1.5
WALL_OVER_SOCKET = 0.25
# Hole rim to face edge: at least half the hole diameter, recommended one diameter
# (common practice; the half-diameter figure is also the planner's hard limit).
EDGE_MIN_D, EDGE_RECOMMENDED_D = 0.5, 1.0
# Socket depth for bending support: at least 1.5 x the pole diameter (common practice);
# under 1 x D fails.
DEPTH_MIN_D, DEPTH_RECOMMENDED_D = 1.0, 1.5
# Thread engagement: the material table's factor x D is recommended (1.5 D in plastics
# and wood, common practice); under 1 x D fails.
ENGAGE_MIN_D = 1.0
# A set screw needs at least 1 x D of its own length in the thread when it bears on the
# pole (common practice).
SET_SCREW_MIN_ENGAGED_D = 1.0
# Reducer sleeve wall (common practice): under 1.5 mm fails, under 3 mm warns.
SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM = 1.5, 3.0
# Wind safety factors below these warn (common practice for an estimate like this one);
# below 1 the estimate says the part fails in the design wind, and the rule fails.
SF_SPREADER, SF_BEARING, SF_SET_SCREW = 1.5, 2.0, 2.0
SF_FAIL = 1.0
# Mass above this fraction of hub.max_mass warns.
MASS_WARN_FRACTION = 0.9

COMMON = "common practice"
# Pockets for captive nuts and inserts (printed hubs): the nut carries the thread.
POCKETS = ("nut_pocket", "insert_pocket")


@dataclass(frozen=True)
class RuleResult:
    id: str
    status: str
    value: float | None
    limit: float | None
    unit: str
    message: str
    source: str

    def as_json(self) -> dict:
        d = asdict(self)
        for k in ("value", "limit"):
            if d[k] is not None:
                d[k] = round(d[k], 3)
        return d


def speed_text(m_s: float, units: str) -> str:
    """A wind speed as the config's users say it (1 mph = 0.44704 m/s exactly)."""
    if units == "in":
        return f"{m_s / 0.44704:.0f} mph ({m_s:.1f} m/s)"
    return f"{m_s:.1f} m/s ({m_s * 3.6:.0f} km/h)"


def _grade(value: float, fail_below: float, warn_below: float) -> tuple[str, float]:
    """Status and the limit it was judged against (the minimum when failing)."""
    if value < fail_below - 1e-9:
        return FAIL, fail_below
    if value < warn_below - 1e-9:
        return WARN, warn_below
    return PASS, warn_below


class _Rules:
    def __init__(self, cfg: Config, plan: HubPlan, sleeves: tuple = ()):
        from generators.standards.materials import get_material

        self.cfg, self.plan, self.sleeve_plans = cfg, plan, tuple(sleeves)
        self.mat = get_material(plan.material)
        self.cls = self.mat.material_class
        self.min_wall = MIN_WALL_MM[self.cls]
        self.T = plan.body.thickness_mm
        self.sockets = [h for h in plan.holes if h.kind == "socket"]
        self.engaged_set_screw_mm: float | None = None

    def fmt(self, mm: float) -> str:
        return format_length(mm, self.cfg.units, fractions=False)

    def _elev(self, h: Hole) -> float:
        return math.asin(max(-1.0, min(1.0, -h.axis[2])))

    def _blind(self, h: Hole) -> bool:
        sp = next((s for s in self.plan.spreaders if s.socket_hole == h.id), None)
        return sp is not None and sp.stop == "socket floor"

    # ---- walls --------------------------------------------------------------------------
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

    # ---- threads and fasteners ----------------------------------------------------------
    def _engaged(self, h: Hole) -> float:
        """Full thread length of a tapped hole in the hub material."""
        if h.kind == "set_screw":
            sock = next(s for s in self.sockets if s.spreader == h.spreader)
            e = self._elev(sock)
            return h.depth_mm - sock.radius_mm / math.cos(e)
        if h.kind == "clamp" or h.through:
            return h.depth_mm
        pitch = self._thread(h).pitch_mm
        return h.depth_mm - 2.0 * pitch  # the tap's lead-in leaves ~2 pitches short (common practice)

    def _thread(self, h: Hole):
        from generators.standards.threads import parse_thread

        return parse_thread(h.thread)

    def _pocket(self, h: Hole) -> Hole | None:
        """The captive-nut or insert pocket serving a clearance hole (printed hubs)."""
        return next((p for p in self.plan.holes if p.kind in POCKETS and getattr(p, "serves", None) == h.id), None)

    def rule_thread_engagement(self) -> RuleResult:
        tapped = [h for h in self.plan.holes if h.thread and h.kind not in POCKETS]
        if not tapped:
            return self._na("thread-engagement", "x D", "no tapped holes")
        factor = self.mat.engagement_factor
        worst = None
        for h in tapped:
            le = self._engaged(h)
            ratio = le / self._thread(h).major_mm
            if h.kind == "set_screw":
                self.engaged_set_screw_mm = le if self.engaged_set_screw_mm is None else min(le, self.engaged_set_screw_mm)
            if worst is None or ratio < worst[2]:
                worst = (h, le, ratio)
        h, le, ratio = worst
        status, limit = _grade(ratio, ENGAGE_MIN_D, factor)
        msg = f"{h.id} ({h.thread}): {self.fmt(le)} of thread in {self.mat.name} = {ratio:.2f} x D"
        if status != PASS:
            msg += (f"; want {factor:g} x D = {self.fmt(factor * self._thread(h).major_mm)}: a thicker hub,"
                    " a finer or smaller thread, a threaded insert, or a deeper hole")
        return RuleResult("thread-engagement", status, ratio, limit, "x D", msg,
                          f"materials table engagement factor ({self.mat.id}: {factor:g} x D; {COMMON});"
                          f" under {ENGAGE_MIN_D:g} x D fails")

    def set_screw_fit(self) -> list[dict]:
        """Per set screw: distance from its face to the seated pole, thread length, the
        chosen or configured stock length and how much of it sits in the thread."""
        from generators.standards.fasteners import set_screw_lengths
        from generators.standards.threads import parse_thread

        ss = self.cfg.set_screws
        out = []
        for h in (h for h in self.plan.holes if h.kind == "set_screw"):
            sock = next(s for s in self.sockets if s.spreader == h.spreader)
            e = self._elev(sock)
            # the pole pushed onto the far side of its socket by the screw
            gap_to_pole = h.depth_mm - (self.cfg.spreaders.diameter - sock.radius_mm) / math.cos(e)
            pocket = None if h.thread else self._pocket(h)
            if h.thread:
                thread, thread_len, nut_far = h.thread, self._engaged(h), None
            elif pocket is not None and pocket.thread:
                # a captive nut: the screw must run through it; it sits across the hole
                t_nut = sum((pocket.entry_mm[i] - h.entry_mm[i]) * h.axis[i] for i in range(3))
                thread, nut_far = pocket.thread, t_nut + pocket.depth_mm / 2
                thread_len = pocket.depth_mm
            else:
                continue
            lengths = set_screw_lengths(thread)
            D = parse_thread(thread).major_mm
            if ss is not None and ss.length is not None:
                length, chosen = ss.length, False
            else:
                fit = [x for x in lengths if x <= gap_to_pole + 1e-9]
                length, chosen = (max(fit) if fit else min(lengths)), True
            if nut_far is None:
                in_thread = length - (gap_to_pole - thread_len)
            else:  # overlap of the screw [gap - L, gap] with the nut [far - h, far]
                in_thread = min(gap_to_pole, nut_far) - max(gap_to_pole - length, nut_far - thread_len)
                if chosen:  # the shortest stock length that runs through the whole nut
                    ok = [x for x in lengths if x <= gap_to_pole + 1e-9 and gap_to_pole - x <= nut_far - thread_len + 1e-9]
                    if ok:
                        length = min(ok)
                        in_thread = min(gap_to_pole, nut_far) - max(gap_to_pole - length, nut_far - thread_len)
            out.append({"hole": h.id, "thread": thread, "length_mm": length, "chosen": chosen,
                        "gap_to_pole_mm": gap_to_pole, "thread_mm": thread_len,
                        "in_thread_mm": in_thread, "major_mm": D, "captive_nut": nut_far is not None,
                        "stock_mm": lengths})
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
        size = f"{f['thread']} x {self.fmt(f['length_mm'])}"
        if status == PASS:
            msg = (f"{f['hole']}: {size} {'(chosen from stock)' if f['chosen'] else ''} reaches the pole with"
                   f" {self.fmt(f['in_thread_mm'])} in the thread, {self.fmt(f['gap_to_pole_mm'] - f['length_mm'])}"
                   " below the face").replace("  ", " ")
        else:
            fit = [x for x in f["stock_mm"] if x <= f["gap_to_pole_mm"] + 1e-9
                   and x - (f["gap_to_pole_mm"] - f["thread_mm"]) >= self._need_in_thread(f) - 1e-9]
            hint = (f"use {f['thread']} x {self.fmt(max(fit))} (set_screws.length)" if fit else
                    "no stock length fits: a thicker hub, or a set screw position where the hole is longer")
            msg = f"{f['hole']}: {size} {why}; {hint}"
        return RuleResult("set-screw-length", status, f["length_mm"], f["gap_to_pole_mm"], "mm", msg, src)

    def _need_in_thread(self, f: dict) -> float:
        """Thread a tight set screw must still have: 1 x D in a tapped hole, or (nearly)
        the whole captive nut (common practice)."""
        if f.get("captive_nut"):
            return 0.9 * f["thread_mm"]
        return SET_SCREW_MIN_ENGAGED_D * f["major_mm"]

    # ---- hole placement -----------------------------------------------------------------
    def hole_edge(self, h: Hole) -> float | None:
        """Rim of the hole to the nearest edge of its face (sockets: sideways only; their
        top and bottom are the socket-wall rule's)."""
        if h.kind == "bore" or h.kind in POCKETS:
            return None  # the bore has its own wall limit; pockets open onto a face by design
        face = self.plan.face(h.face)
        u, v = face.to_face(h.entry_mm)
        r = max(h.radius_mm, (h.countersink.diameter_mm / 2) if h.countersink else 0.0,
                (h.counterbore.diameter_mm / 2) if h.counterbore else 0.0)
        if face.kind == "rim":
            return None if h.kind == "socket" else min(v, self.T - v) - r
        if h.kind == "socket":
            us = [p[0] for p in face.outline]
            return min(u - min(us), max(us) - u) - r
        return edge_distance((u, v), face.outline) - r

    def rule_edge_distance(self) -> RuleResult:
        worst = None
        for h in self.plan.holes:
            d = self.hole_edge(h)
            if d is None:
                continue
            ratio = d / h.diameter_mm
            if worst is None or ratio < worst[2]:
                worst = (h, d, ratio)
        if worst is None:
            return self._na("edge-distance", "x D", "no holes but the bore")
        h, d, ratio = worst
        status, limit = _grade(ratio, EDGE_MIN_D, EDGE_RECOMMENDED_D)
        msg = f"{h.id}: rim {self.fmt(d)} from the edge of the {h.face} face = {ratio:.2f} x its diameter"
        if status != PASS:
            msg += (f"; want {EDGE_RECOMMENDED_D:g} x D = {self.fmt(EDGE_RECOMMENDED_D * h.diameter_mm)}:"
                    " move the hole inward or use a larger hub")
        return RuleResult("edge-distance", status, ratio, limit, "x D", msg,
                          f"{COMMON}: rim at least {EDGE_MIN_D:g} x D from an edge, recommended"
                          f" {EDGE_RECOMMENDED_D:g} x D")

    def rule_socket_depth(self) -> RuleResult:
        if not self.sockets:
            return self._na("socket-depth", "x D", "no sockets")
        D = self.cfg.spreaders.diameter
        h = min(self.sockets, key=lambda s: s.depth_mm)
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
        h = self.sockets[0]
        e_now = math.degrees(self._elev(h))
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
        if status != PASS:
            msg += "; less elevation (spreaders.elevation) or a thicker hub (hub.thickness)"
        return RuleResult("socket-tilt", status, e_now, limit, "deg", msg,
                          f"geometry of the tilted socket; minimum wall {COMMON}")

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

    # ---- mass ---------------------------------------------------------------------------
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

    # ---- wind ---------------------------------------------------------------------------
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

    def _na(self, rid: str, unit: str, why: str) -> RuleResult:
        return RuleResult(rid, PASS, None, None, unit, f"not applicable: {why}", COMMON)


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


RULES = ("rule_socket_wall", "rule_socket_web", "rule_socket_bore", "rule_thread_engagement",
         "rule_set_screw_length", "rule_edge_distance", "rule_socket_depth", "rule_socket_tilt",
         "rule_sleeve_wall", "rule_mass")


@dataclass(frozen=True)
class Checks:
    """Rule results and the wind estimate, plus figures the report shows."""

    rules: tuple[RuleResult, ...]
    wind: object  # loads.WindResult
    set_screws: tuple[dict, ...]
    sleeves: tuple[dict, ...]
    mass_estimate_g: float

    def as_json(self) -> dict:
        """``{"rules": [...], "wind": {...}}``: what ``check --json`` prints and the manifest keeps."""
        return {"rules": [r.as_json() for r in self.rules], "wind": self.wind.as_json()}


def evaluate(cfg: Config, plan: HubPlan, sleeves: tuple = ()) -> Checks:
    """Every rule and the wind estimate for a plan (``sleeves``: its sleeve plans)."""
    from generators.plan.loads import wind_estimate

    r = _Rules(cfg, plan, sleeves)
    results = [getattr(r, name)() for name in RULES]
    wind = wind_estimate(cfg, plan, r.engaged_set_screw_mm)
    results += r.wind_rules(wind)
    return Checks(rules=tuple(results), wind=wind, set_screws=tuple(r.set_screw_fit()),
                  sleeves=tuple(r.sleeves()), mass_estimate_g=r.mass_estimate_g())


def run_checks(cfg: Config, plan: HubPlan, sleeves: tuple = ()) -> dict:
    """``{"rules": [...], "wind": {...}}`` as plain data."""
    return evaluate(cfg, plan, sleeves).as_json()


def failed(checks: dict) -> list[dict]:
    return [r for r in checks["rules"] if r["status"] == FAIL]


def warned(checks: dict) -> list[dict]:
    return [r for r in checks["rules"] if r["status"] == WARN]
