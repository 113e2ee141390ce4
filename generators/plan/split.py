"""A split hub (``hub.split = true``, block or puck): the planned body cut through the mast
axis into two halves joined by bolts across the split.

- **The plane** runs through the mast axis at ``split.azimuth`` (default: between sockets 1
  and 2, so with an even spreader count it falls between sockets on both sides). A socket
  whose axis lies in the plane is **shared**: each half holds half of it and the bolts clamp
  the pole as they clamp the mast; its set screws are left out (they would be cut in two).
  A plane that cuts any other hole (a socket off its axis, a set screw, a clamp or extra
  hole), or leaves less than the wall minimum to one, is refused.
- **The gap** (``split.gap``, 1 mm by default, common practice) is taken out of the body
  about the plane (a saw kerf on a machined hub, printed as two parts). Tightening the
  bolts closes the bore, whose diametral clearance round the mast is ``bore - mast OD``, so
  the gap must exceed that clearance by at least ``MIN_INTERFERENCE_MM``: that is the
  interference the bolts still close once the halves sit on the mast. A gap over
  ``MAX_GAP_MM`` is refused (the bolts would bend the halves and carry the mast in
  bending, common practice).
- **The bolts** (plan/split_bolts.py): one each side of the bore at ``split.offset`` from
  the mast axis, along the plane's normal, at ``split.height``; by default the highest
  height whose cuts keep the recommended wall to every other cut (the printed nut slots
  open on the top face, so a bolt near the top has the shortest slot).

The halves are named ``hub-a`` (the bolt heads, behind the plane) and ``hub-b`` (the nuts
or the threads). Every cut stays a ``Hole`` of the plan, so the measured walls see the bolt
holes and their pockets; the walls to the split faces are measured here, on the same
cutter shapes.
"""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np

from generators.config.models import Config, Split as SplitSection
from generators.errors import UserError
from generators.plan.cutters import Cutter
from generators.plan.model import HubPlan, Mark, Split, SplitBolt, SplitHalf
from generators.plan.split_bolts import BoltPlanner
from generators.units import format_length

MAX_GAP_MM = 3.0  # common practice: a split clamp's slot is a saw cut of 0.5 to 3 mm
MIN_INTERFERENCE_MM = 0.2  # common practice: the grip must not hang on the part being exactly to size
HEIGHT_STEP_MM, COARSE_STEP_MM = 0.5, 2.0  # the search for the bolts' height
SAMPLE_MM = 1.0  # surface samples of the cuts, for the walls to the split faces
# The height search samples the bolts' cuts this coarsely and asks this much more than the
# recommended wall, so the measured walls (finer) still find it.
SEARCH_SAMPLE_MM, SEARCH_MARGIN_MM = 1.5, 0.6
# cuts that may run across the plane
CROSSING_KINDS = ("bore", "split_bolt")


def split_plan(plan: HubPlan, cfg: Config) -> HubPlan:
    """The plan with the split, its bolts and its halves (see the module docstring)."""
    return _Splitter(plan, cfg).run()


class _Splitter(BoltPlanner):
    def __init__(self, plan: HubPlan, cfg: Config):
        from generators.plan.hard_limits import wall_limit_mm
        from generators.plan.holes import material_class
        from generators.plan.rules.base import MIN_WALL_MM, RECOMMENDED_OVER_MIN
        from generators.plan.shop import drill_series
        from generators.standards.threads import parse_thread

        self.plan, self.cfg = plan, cfg
        self.sec = cfg.split or SplitSection()
        self.thread = self.sec.thread or parse_thread("M5" if cfg.units == "mm" else "10-24")
        self.T = plan.body.thickness_mm
        self.printed = plan.process == "printed"
        self.comp = cfg.print.hole_compensation if self.printed else 0.0
        self.wall = wall_limit_mm(cfg)
        self.mclass = material_class(cfg.hub.material)
        self.want_wall = max(self.wall, MIN_WALL_MM[self.mclass] * RECOMMENDED_OVER_MIN)
        self.series = drill_series(cfg)
        self.gap = self.sec.gap
        N = cfg.spreaders.count
        az = self.sec.azimuth if self.sec.azimuth is not None else cfg.spreaders.first_azimuth + 180.0 / N
        self.azimuth = az % 360
        t = math.radians(self.azimuth)
        self.along = (math.cos(t), math.sin(t), 0.0)
        self.normal = (-math.sin(t), math.cos(t), 0.0)

    def fmt(self, mm: float) -> str:
        return format_length(mm, self.cfg.units, fractions=False)

    def run(self) -> HubPlan:
        plan = self.plan
        clearance = plan.bore_mm - plan.mast_od_mm
        interference = self.gap - clearance
        if self.gap > MAX_GAP_MM + 1e-9:
            raise UserError("split.gap", f"{self.fmt(self.gap)} is too wide: the bolts would bend the halves"
                            " to close it", f"at most {self.fmt(MAX_GAP_MM)} (a saw cut, common practice)")
        if interference < MIN_INTERFERENCE_MM - 1e-9:
            raise UserError("split.gap", f"{self.fmt(self.gap)} closes before the bore grips the mast (the bore"
                            f" has {self.fmt(clearance)} of clearance round it)",
                            f"at least {self.fmt(clearance + MIN_INTERFERENCE_MM)}, or less mast.clearance")
        shared = tuple(sp.socket_hole for sp in plan.spreaders if _on_line(sp.azimuth_deg, self.azimuth))
        shared_sp = {sp.id for sp in plan.spreaders if sp.socket_hole in shared}
        dropped = {h.id for h in plan.holes if h.kind == "set_screw" and h.spreader in shared_sp}
        holes = [h for h in plan.holes if h.id not in dropped and getattr(h, "serves", None) not in dropped]
        self.plan = plan = replace(plan, holes=tuple(holes))
        self.cutters = {h.id: Cutter(h) for h in holes}
        self.boxes = [c.bounds() for c in self.cutters.values()]
        self.shared = shared
        self._plane_walls()
        offset = self.sec.offset if self.sec.offset is not None else self._default_offset()
        z = self.sec.height if self.sec.height is not None else self._best_height(offset)
        if not (0 < z < self.T):
            raise UserError("split.height", f"{self.fmt(z)} is outside the body",
                            f"between 0 and {self.fmt(self.T)} above the bottom face")
        bolts, cuts = [], []
        for k, s in enumerate((offset, -offset)):
            c = self.bolt_cuts(f"B{k + 1}", s, z)
            cuts += [c.hole, *c.pockets]
            bolts.append(SplitBolt(hole=c.hole.id, offset_mm=s, height_mm=z, thread=self.thread.designation,
                                   length_mm=c.length_mm, grip_mm=c.grip_mm, seat_mm=c.seat, nut=c.nut,
                                   torque_nm=0.0, torque_source=""))
        plan = replace(plan, holes=plan.holes + tuple(cuts))
        split = Split(azimuth_deg=self.azimuth, along=self.along, normal=self.normal, gap_mm=self.gap,
                      clearance_mm=clearance, interference_mm=interference, shared=shared,
                      dropped=tuple(sorted(dropped)), bolts=tuple(bolts), halves=self._halves(plan))
        plan = replace(plan, split=split)
        t, src = self._torque(plan)
        split = replace(split, bolts=tuple(replace(b, torque_nm=t, torque_source=src) for b in bolts))
        notes = [f"split: cut through the mast axis at {self.azimuth:g} deg with a {self.fmt(self.gap)} gap;"
                 f" two {bolts[0].thread} x {self.fmt(bolts[0].length_mm)} bolts close it"
                 f" ({self.fmt(interference)} left when the bore sits on the mast)"]
        if shared:
            notes.append(f"split: {', '.join(shared)} shared by the halves, which clamp the pole"
                         + (f"; set screw(s) {', '.join(sorted(dropped))} left out" if dropped else ""))
        return replace(plan, split=split, notes=plan.notes + tuple(notes), marks=plan.marks + self._saw_marks(plan))

    def _saw_marks(self, plan: HubPlan) -> tuple[Mark, ...]:
        """The saw line on the top and bottom templates (a machined hub is drilled whole, then
        sawn along it), with a tick into half A."""
        from generators.plan.geometry import inside_polygon

        outline = plan.body.outline

        def reach(d) -> float:
            lo, hi = 0.0, 2 * max(math.hypot(*p) for p in outline)
            for _ in range(40):
                mid = (lo + hi) / 2
                lo, hi = (mid, hi) if inside_polygon((mid * d[0], mid * d[1]), outline) else (lo, mid)
            return lo

        al, nm = self.along, self.normal
        a, b = reach((-al[0], -al[1])), reach((al[0], al[1]))
        out = []
        for face, z in (("top", self.T), ("bottom", 0.0)):
            p0, p1 = (-a * al[0], -a * al[1], z), (b * al[0], b * al[1], z)
            out.append(Mark(face, p0, p1, f"saw line: {self.fmt(self.gap)} kerf on it, after every hole"))
            t0 = (0.8 * b * al[0], 0.8 * b * al[1], z)
            out.append(Mark(face, t0, (t0[0] - 6 * nm[0], t0[1] - 6 * nm[1], z), "half A"))
        return tuple(out)

    # ---- the plane ------------------------------------------------------------------
    def _samples(self, h) -> np.ndarray:
        """Surface points of a cut that lie in the body (outside the bore for other cuts)."""
        from generators.plan.measured_walls import _Body

        pts = self.cutters[h.id].surface(SAMPLE_MM)
        pts = pts[_Body(self.plan).inside(pts)]
        if h.kind != "bore" and "bore" in self.cutters and len(pts):
            pts = pts[self.cutters["bore"].sdf(pts) >= 0]
        return pts

    def _plane_walls(self) -> None:
        """Refuse a cut the plane runs through (other than the bore and the shared sockets)
        or passes closer than the wall minimum."""
        nrm = np.array(self.normal)
        for h in self.plan.holes:
            if h.kind in CROSSING_KINDS or h.id in self.shared:
                continue
            pts = self._samples(h)
            if not len(pts):
                continue
            crosses, wall = False, np.inf
            for part in self._pieces(h, pts):  # a mast pin is two cuts, one each side of the bore
                s = part @ nrm
                c = bool(s.min() < -self.gap / 2 and s.max() > self.gap / 2)
                crosses |= c
                wall = min(wall, 0.0 if c else float(np.abs(s).min() - self.gap / 2))
            if wall < self.wall - 1e-9:
                what = "runs across" if crosses else f"comes within {self.fmt(max(wall, 0))} of"
                kind = {"clamp": "clamp hole", "extra": "hole"}.get(h.kind, h.kind.replace("_", " "))
                raise UserError(self._key(h), f"{kind} {h.id} {what} the split at"
                                f" {self.azimuth:g} deg", f"at least {self.fmt(self.wall)} of material:"
                                " a split.azimuth between sockets or along a socket's axis, or move the hole")

    @staticmethod
    def _pieces(h, pts: np.ndarray) -> list[np.ndarray]:
        if h.kind != "pin":
            return [pts]
        d = np.array(h.bottom_mm[:2]) - np.array(h.entry_mm[:2])
        along = pts[:, :2] @ (d / np.linalg.norm(d))
        return [p for p in (pts[along >= 0], pts[along < 0]) if len(p)]

    def _key(self, h) -> str:
        if h.kind == "pin":
            return "mast_pin.azimuth"
        if h.kind == "clamp":
            return "mast_clamp.azimuths"
        i = next((k for k, spec in enumerate(self.cfg.holes) if spec.id == h.id), None)
        return f"holes[{i}].at" if i is not None else "split.azimuth"

    def _halves(self, plan: HubPlan) -> tuple[SplitHalf, ...]:
        nrm = np.array(self.normal)
        side: dict[str, set[int]] = {}
        for h in plan.holes:
            c = Cutter(h)
            pts = c.surface(SAMPLE_MM)
            s = pts @ nrm
            side[h.id] = {k for k, hit in ((-1, (s < -self.gap / 2).any()), (1, (s > self.gap / 2).any())) if hit}
        out = []
        for name, k in (("hub-a", -1), ("hub-b", 1)):
            out.append(SplitHalf(name=name, side=k, holes=tuple(h.id for h in plan.holes if k in side[h.id]),
                                 footprint=tuple(half_outline(plan.body.outline, self.normal, k * self.gap / 2, k))))
        return tuple(out)

    # ---- where the bolts go ---------------------------------------------------------------
    def _default_offset(self) -> float:
        """Just clear of the bore: the widest cut of a bolt and the recommended wall."""
        from generators.standards.fasteners import counterbore

        r_big = (counterbore(self.thread, key="split.thread").diameter_mm + self.comp) / 2
        return self.plan.bore_mm / 2 + r_big + self.want_wall + 1.0

    def _best_height(self, offset: float) -> float:
        """The highest bolt height whose cuts keep the recommended wall to every other cut and
        the faces (else the one with the most wall): a coarse pass down from the top, then
        ``HEIGHT_STEP_MM`` steps above the first height found."""
        def wall(z: float) -> float:
            try:
                return self._bolt_wall(offset, z)
            except UserError:
                return -math.inf

        ok = lambda w: w >= self.want_wall + SEARCH_MARGIN_MM  # noqa: E731
        top = self.T - self.want_wall
        need = self.want_wall + SEARCH_MARGIN_MM
        coarse = [round(top - k * COARSE_STEP_MM, 6) for k in range(int(top / COARSE_STEP_MM))]
        seen: dict[float, float] = {}

        def bound(z: float) -> float:
            """The most wall ``z`` can have, from the heights measured: a wall changes by at
            most the distance the bolts move (less a sample step, as samples enter the body)."""
            return min((w + abs(z - z0) + SEARCH_SAMPLE_MM for z0, w in seen.items() if w > -math.inf),
                       default=math.inf)

        first = None
        for z in coarse:  # top down; the first that keeps the wall ends the pass
            if bound(z) < need:
                continue  # too near a height measured thin to keep the wall
            seen[z] = wall(z)
            if ok(seen[z]):
                first = z
                break
        if first is None:  # the most wall of all the heights, skipping those that cannot beat it
            for z in coarse:
                if z not in seen and bound(z) >= max(seen.values(), default=-math.inf):
                    seen[z] = wall(z)
            return max((w, z) for z, w in seen.items())[1] if seen else self.T / 2
        z = min(top, first + COARSE_STEP_MM)
        while z > first + 1e-9:
            if bound(z) >= need and ok(wall(z)):
                return z
            z = round(z - HEIGHT_STEP_MM, 6)
        return first

    def _bolt_wall(self, offset: float, z: float) -> float:
        """The least material from the bolts' cuts at ``z`` to the other cuts and to the
        top and bottom faces (the nut slots open onto the top face by design). Exact up to
        the recommended wall and its search margin; past that a lower bound, which is all the
        search asks of it."""
        from generators.plan.measured_walls import _Body

        body = _Body(self.plan)
        least = math.inf
        exact_to = self.want_wall + SEARCH_MARGIN_MM + 1.0
        for k, s in enumerate((offset, -offset)):
            c = self.bolt_cuts(f"B{k + 1}", s, z)
            for h in (c.hole, *c.pockets):
                pts = Cutter(h).surface(SEARCH_SAMPLE_MM)
                pts = pts[body.inside(pts)]
                if not len(pts):
                    continue
                lo, hi = pts.min(axis=0) - self.want_wall - 1.0, pts.max(axis=0) + self.want_wall + 1.0
                for o, (olo, ohi) in zip(self.cutters.values(), self.boxes):
                    if np.any(olo > hi) or np.any(ohi < lo):
                        continue  # farther than any wall that counts
                    least = min(least, float(o.sdf_or_box(pts, margin=exact_to).min()))
                least = min(least, float(pts[:, 2].min()))
                if h.kind != "nut_pocket":
                    least = min(least, float((self.T - pts[:, 2]).min()))
        return least

    def _torque(self, plan: HubPlan) -> tuple[float, str]:
        """The config's torque, or the table's (a captive steel nut takes a steel screw's
        seating torque, a thread in the hub the hub material's) held down so the head and
        nut do not crush the hub (``SF_BEARING`` on its yield)."""
        from generators.plan.split_bolts import SF_BEARING, bearing_area_mm2
        from generators.standards.holding import K_CRUSH, default_torque_nm
        from generators.standards.materials import get_material

        if self.sec.torque is not None:
            return self.sec.torque, "torque from the config"
        t, src = default_torque_nm(self.thread, "metal" if self.printed else self.mclass, key="split.thread")
        mat = get_material(plan.material)
        area, where = min(bearing_area_mm2(plan, b.hole) for b in plan.split.bolts)
        t_bear = mat.yield_mpa * area / SF_BEARING * K_CRUSH * self.thread.major_mm / 1000.0
        if t_bear < t:
            return t_bear, (f"held under the table's {t:.1f} N m so {where} ({area:.0f} mm2) presses the"
                            f" {mat.name} at its yield ({mat.yield_mpa:g} MPa) over {SF_BEARING:g},"
                            f" T = K F d with K = {K_CRUSH:g}")
        return t, f"default torque ({src})"


def _on_line(azimuth: float, plane: float) -> bool:
    """True when an azimuth lies along the plane's line (either way)."""
    d = (azimuth - plane) % 180.0
    return min(d, 180.0 - d) < 1e-6


def half_outline(outline, normal, offset: float, side: int) -> list[tuple[float, float]]:
    """The part of a convex outline on one side of the line ``p . normal = offset``
    (``side`` +1: beyond it, -1: before it), by clipping (Sutherland-Hodgman)."""
    def f(p):
        return side * (p[0] * normal[0] + p[1] * normal[1] - offset)

    out = []
    pts = list(outline)
    for i, p in enumerate(pts):
        q = pts[(i + 1) % len(pts)]
        fp, fq = f(p), f(q)
        if fp >= 0:
            out.append(p)
        if (fp >= 0) != (fq >= 0):
            t = fp / (fp - fq)
            out.append((p[0] + (q[0] - p[0]) * t, p[1] + (q[1] - p[1]) * t))
    return out
