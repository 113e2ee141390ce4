"""Machined plan → printed plan, for ``hub.process = "printed"``.

What changes when the hub is printed (PETG, ASA, ...) instead of machined:

- **No tapped threads.** Printed threads strip, so every tapped hole becomes an ISO 273 /
  ASME B18.2.8 "normal" clearance hole plus either
  - a captive hex-nut pocket (kind ``nut_pocket``): a hexagon sized from the nut table
    (``generators.standards.fasteners.hex_nut``) plus ``[print] nut_allowance``, with a
    **slot from the nearest outer face** so the nut slides in sideways. The nut sits inside
    the part with material on the entry side, so a set screw or clamp screw pushing on the
    pole or mast pulls the nut against that material instead of out of its pocket (a
    pocket open on the entry side would let it walk out). Slots opening upwards are
    preferred (no bridge); otherwise the shortest slot that keeps its walls is used;
  - or, when ``[print] insert_hole`` and ``insert_depth`` are both given, a pocket for a
    heat-set insert at the entry (kind ``insert_pocket``).
- **Hole compensation.** Printed holes come out undersize; every round hole, socket,
  bore, countersink, counterbore and insert pocket is modelled ``[print] hole_compensation``
  larger in diameter (default 0.3 mm, see ``generators.config.models.Print``). Nut pockets
  get ``nut_allowance`` instead.
- **Support-free horizontal holes.** A hole whose axis is more than 45 deg from vertical
  (sockets, clamp holes) gets a teardrop profile: its upper half is a 45 deg roof to a
  point ``radius * sqrt(2)`` above the axis, truncated to a flat no wider than
  ``BRIDGE_LIMIT_MM`` where the full point would come too near the top face.
- **Walls.** Every pocket, and every pair of holes that do not meet by design, keeps
  ``MIN_WALL_LINES * [print] line_width`` of material.

The part is printed as modelled: bottom face on the bed (min Z = 0), +Z up.
"""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np

from generators.config.models import Config
from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import Vec, cross, dot, edge_distance, segment_distance, unit
from generators.plan.model import Hole, HubPlan

# A printed wall needs at least four extrusion lines (two perimeters from each side)
# to be solid and not crack along a layer (common practice).
MIN_WALL_LINES = 4
# A flat roof over a void (a bridge) prints clean up to about 15 mm in PETG or ASA with
# part cooling (common practice); wider flat roofs are refused.
BRIDGE_LIMIT_MM = 15.0
# Overhangs steeper than 45 deg from vertical need support (common practice); a hole
# whose axis is further than this from vertical gets the teardrop profile.
OVERHANG_DEG = 45.0
# Slot directions tried around a screw axis (every 15 deg).
SLOT_DIRECTIONS = 24
# Points per circle when holes are approximated as polygons for the wall checks.
_CIRCLE_POINTS = 48
_SQRT2 = math.sqrt(2.0)


def min_wall_mm(cfg: Config) -> float:
    return MIN_WALL_LINES * cfg.print.line_width


# ---- small geometry ---------------------------------------------------------------------
def _basis(axis: Vec, prefer: Vec | None = None) -> tuple[Vec, Vec]:
    """Two unit vectors perpendicular to ``axis`` (the first towards ``prefer`` if given)."""
    a = unit(axis)
    ref = prefer if prefer is not None else ((1.0, 0.0, 0.0) if abs(a[0]) < 0.9 else (0.0, 1.0, 0.0))
    k = dot(ref, a)
    p = (ref[0] - k * a[0], ref[1] - k * a[1], ref[2] - k * a[2])
    if math.hypot(*p) < 1e-9:
        ref = (0.0, 1.0, 0.0) if abs(a[1]) < 0.9 else (1.0, 0.0, 0.0)
        k = dot(ref, a)
        p = (ref[0] - k * a[0], ref[1] - k * a[1], ref[2] - k * a[2])
    p = unit(p)
    return p, cross(a, p)


def needs_teardrop(axis: Vec) -> bool:
    """True when the axis is more than ``OVERHANG_DEG`` from vertical."""
    return abs(unit(axis)[2]) < math.cos(math.radians(OVERHANG_DEG)) - 1e-9


def roof_up(axis: Vec) -> Vec:
    """+Z made perpendicular to the axis: where a teardrop's point goes."""
    p, _ = _basis(axis, prefer=(0.0, 0.0, 1.0))
    return p


def teardrop_outline(radius: float, roof: float, n: int = _CIRCLE_POINTS) -> list[tuple[float, float]]:
    """Section of a teardrop in (x = sideways, y = roof_up), counter-clockwise.

    The circle below the two 45 deg tangent points, then the roof lines to the point
    ``(0, radius*sqrt 2)``, cut flat at ``y = roof`` when ``roof`` is lower.
    """
    pts = []
    for k in range(n + 1):  # arc from 45 deg right of the top, round the bottom, to 45 deg left
        ang = math.radians(45.0 + 270.0 * k / n)
        pts.append((radius * math.sin(ang), radius * math.cos(ang)))
    apex = radius * _SQRT2
    if roof >= apex - 1e-9:
        pts.append((0.0, apex))
    else:
        half = apex - roof
        pts += [(-half, roof), (half, roof)]
    return pts


def hex_slot_outline(hole: Hole) -> list[tuple[float, float]]:
    """A nut pocket's section in (x = slot_dir, y = axis x slot_dir): hexagon plus slot."""
    R, F = hole.diameter_mm / 2, hole.across_flats_mm / 2
    L_ = max(hole.slot_length_mm, R)
    return [(-R / 2, F), (-R, 0.0), (-R / 2, -F), (L_, -F), (L_, F)]


def hex_outline(hole: Hole) -> list[tuple[float, float]]:
    R, F = hole.diameter_mm / 2, hole.across_flats_mm / 2
    return [(R, 0.0), (R / 2, F), (-R / 2, F), (-R, 0.0), (-R / 2, -F), (R / 2, -F)]


# ---- regions: a hole as a prism of a 2D section along its axis ---------------------------
class _Region:
    def __init__(self, hole: Hole, x: Vec, y: Vec, poly, t0: float, t1: float):
        self.hole = hole
        self.E = np.array(hole.entry_mm, dtype=float)
        self.a = np.array(unit(hole.axis), dtype=float)
        self.x, self.y = np.array(x, dtype=float), np.array(y, dtype=float)
        self.poly = np.array(poly, dtype=float)
        self.t0, self.t1 = t0, t1

    def distance(self, pts: np.ndarray) -> np.ndarray:
        """Signed distance of points (N, 3) to the region (negative inside)."""
        d = pts - self.E
        t = d @ self.a
        q = np.stack([d @ self.x, d @ self.y], axis=1)
        d2 = _poly_sdf(q, self.poly)
        dt = np.maximum(self.t0 - t, t - self.t1)
        out = np.hypot(np.maximum(d2, 0), np.maximum(dt, 0))
        return np.where((d2 <= 0) & (dt <= 0), np.maximum(d2, dt), out)


def _poly_sdf(q: np.ndarray, poly: np.ndarray) -> np.ndarray:
    a, b = poly, np.roll(poly, -1, axis=0)
    ab = b - a
    best = np.full(len(q), np.inf)
    inside = np.zeros(len(q), dtype=bool)
    for i in range(len(poly)):
        ap = q - a[i]
        L2 = ab[i] @ ab[i]
        s = np.clip((ap @ ab[i]) / L2, 0.0, 1.0) if L2 > 0 else np.zeros(len(q))
        best = np.minimum(best, np.hypot(ap[:, 0] - s * ab[i, 0], ap[:, 1] - s * ab[i, 1]))
        y1, y2 = a[i, 1], b[i, 1]
        cond = (y1 > q[:, 1]) != (y2 > q[:, 1])
        with np.errstate(divide="ignore", invalid="ignore"):
            xc = a[i, 0] + (q[:, 1] - y1) * ab[i, 0] / np.where(ab[i, 1] == 0, 1, ab[i, 1])
        inside ^= cond & (q[:, 0] < xc)
    return np.where(inside, -best, best)


def regions_of(hole: Hole) -> list[_Region]:
    """The material a hole removes, as prisms (countersink/counterbore as their full width)."""
    t0, t1 = -hole.lead_mm, hole.depth_mm + hole.extend_mm
    if hole.profile == "hex":
        x = unit(hole.slot_dir)
        y = cross(unit(hole.axis), x)
        return [_Region(hole, x, y, hex_slot_outline(hole), 0.0, hole.depth_mm)]
    if hole.profile == "teardrop":
        y = unit(hole.roof_up)
        x = cross(y, unit(hole.axis))
        poly = teardrop_outline(hole.radius_mm, hole.roof_mm)
    else:
        x, y = _basis(hole.axis)
        poly = [(hole.radius_mm * math.cos(2 * math.pi * k / _CIRCLE_POINTS),
                 hole.radius_mm * math.sin(2 * math.pi * k / _CIRCLE_POINTS)) for k in range(_CIRCLE_POINTS)]
    out = [_Region(hole, x, y, poly, t0, t1)]
    for extra_r, depth in ((hole.countersink.diameter_mm / 2 if hole.countersink else None, hole.radius_mm),
                           (hole.counterbore.diameter_mm / 2 if hole.counterbore else None,
                            hole.counterbore.depth_mm if hole.counterbore else 0.0)):
        if extra_r:
            circ = [(extra_r * math.cos(2 * math.pi * k / _CIRCLE_POINTS),
                     extra_r * math.sin(2 * math.pi * k / _CIRCLE_POINTS)) for k in range(_CIRCLE_POINTS)]
            out.append(_Region(hole, x, y, circ, -hole.lead_mm, max(depth, 0.5)))
    return out


def pocket_surface_points(hole: Hole, step: float = 1.0) -> np.ndarray:
    """Sample points on a pocket's boundary (outline edges at several levels, and its end faces)."""
    E = np.array(hole.entry_mm, dtype=float)
    a = np.array(unit(hole.axis), dtype=float)
    if hole.profile == "hex":
        x = np.array(unit(hole.slot_dir))
        poly = hex_slot_outline(hole)
        y = np.cross(a, x)
    else:
        x_, y_ = _basis(hole.axis) if hole.profile != "teardrop" else (
            cross(unit(hole.roof_up), unit(hole.axis)), unit(hole.roof_up))
        x, y = np.array(x_), np.array(y_)
        poly = (teardrop_outline(hole.radius_mm, hole.roof_mm) if hole.profile == "teardrop" else
                [(hole.radius_mm * math.cos(2 * math.pi * k / 24), hole.radius_mm * math.sin(2 * math.pi * k / 24))
                 for k in range(24)])
    ring = []
    for i in range(len(poly)):
        p, q = np.array(poly[i]), np.array(poly[(i + 1) % len(poly)])
        n = max(1, int(math.ceil(np.linalg.norm(q - p) / step)))
        for k in range(n):
            ring.append(p + (q - p) * k / n)
    ring = np.array(ring)
    levels = np.linspace(0.0, hole.depth_mm, max(2, int(math.ceil(hole.depth_mm / step)) + 1))
    pts = [E + a * t + np.outer(ring[:, 0], x) + np.outer(ring[:, 1], y) for t in levels]
    # the two end faces: a grid over the section
    poly_a = np.array(poly, dtype=float)
    lo, hi = poly_a.min(axis=0), poly_a.max(axis=0)
    gx, gy = np.meshgrid(np.arange(lo[0], hi[0] + step, step), np.arange(lo[1], hi[1] + step, step))
    grid = np.stack([gx.ravel(), gy.ravel()], axis=1)
    grid = grid[_poly_sdf(grid, poly_a) <= 0]
    for t in (0.0, hole.depth_mm):
        pts.append(E + a * t + np.outer(grid[:, 0], x) + np.outer(grid[:, 1], y))
    return np.concatenate(pts)


# ---- the transform -----------------------------------------------------------------------
def printed_plan(plan: HubPlan, cfg: Config) -> HubPlan:
    """The printed variant of a machined plan (see the module docstring)."""
    return _Printer(plan, cfg).run()


class _Printer:
    def __init__(self, plan: HubPlan, cfg: Config):
        self.plan, self.cfg = plan, cfg
        self.pr = cfg.print
        self.comp = self.pr.hole_compensation
        self.wall = min_wall_mm(cfg)
        self.T = plan.body.thickness_mm
        self.notes: list[str] = []
        if (self.pr.insert_hole is None) != (self.pr.insert_depth is None):
            missing = "insert_depth" if self.pr.insert_depth is None else "insert_hole"
            raise UserError(f"print.{missing}", "heat-set inserts need both insert_hole and insert_depth",
                            "both lengths, or neither for captive nuts")
        self.inserts = self.pr.insert_hole is not None

    def fmt(self, mm: float) -> str:
        from generators.units import format_length

        return format_length(mm, self.cfg.units, fractions=False)

    def run(self) -> HubPlan:
        from generators.standards.fasteners import clearance_hole

        holes: list[Hole] = []
        tapped: list[Hole] = []
        for h in self.plan.holes:
            if h.thread is not None:
                target = clearance_hole(h.thread, "normal", key=self._key(h))
                h = replace(h, diameter_mm=target + self.comp, drill=None, thread=None, thread_percent=None,
                            compensation_mm=self.comp,
                            note=(h.note + "; " if h.note else "") + f"clearance for {self._thread_of(h)}")
                tapped.append(h)
            else:
                h = replace(h, diameter_mm=h.diameter_mm + self.comp, compensation_mm=self.comp,
                            countersink=None if h.countersink is None else
                            replace(h.countersink, diameter_mm=h.countersink.diameter_mm + self.comp),
                            counterbore=None if h.counterbore is None else
                            replace(h.counterbore, diameter_mm=h.counterbore.diameter_mm + self.comp),
                            drill=None)
            holes.append(self._profiled(h))
        self._check_webs(holes)
        pockets: list[Hole] = []
        for h in tapped:
            h = next(x for x in holes if x.id == h.id)
            pocket = self._insert_pocket(h) if self.inserts else self._nut_pocket(h, holes, pockets)
            if self.inserts:
                self._check_pocket(pocket, holes, pockets, exit_face=None)
            pockets.append(pocket)
        self.notes.append(f"printed: holes {self.fmt(self.comp)} over size (hole_compensation); walls of at"
                          f" least {MIN_WALL_LINES} x {self.fmt(self.pr.line_width)} line width;"
                          f" horizontal holes have a 45 deg teardrop roof; print bottom face down")
        if pockets:
            what = "heat-set insert pockets" if self.inserts else "captive hex-nut pockets (slide the nut in from the side)"
            self.notes.append(f"printed: {len(pockets)} {what} replace the tapped holes")
        return replace(self.plan, holes=tuple(holes + pockets), notes=self.plan.notes + tuple(self.notes))

    # ---- keys and names ----------------------------------------------------------------
    def _thread_of(self, h: Hole) -> str:
        orig = self.plan.hole(h.id)
        return f"{orig.thread} screw"

    def _key(self, h: Hole) -> str:
        if h.kind == "set_screw":
            return "set_screws.thread"
        if h.kind == "clamp":
            return "mast_clamp.thread"
        for i, spec in enumerate(self.cfg.holes):
            if spec.id == h.id:
                return f"holes[{i}].thread"
        return "hub.process"

    # ---- profiles ------------------------------------------------------------------------
    def _profiled(self, h: Hole) -> Hole:
        if not needs_teardrop(h.axis):
            return h
        up = roof_up(h.axis)
        r = h.radius_mm
        apex = r * _SQRT2
        # highest the roof may reach: keep the wall to the top face over the whole length
        room = math.inf
        if up[2] > 1e-9:
            for t in (0.0, h.depth_mm):
                p = h.point_at(t)
                room = min(room, (self.T - self.wall - p[2]) / up[2])
        roof = min(apex, room)
        if roof < r:
            roof = r  # the round hole itself already comes this near; the web check names it
        flat = 2 * (apex - roof)
        if flat > BRIDGE_LIMIT_MM:
            raise UserError("hub.thickness", f"hole {h.id} comes so near the top face that its roof would be"
                            f" a {self.fmt(flat)} flat bridge", f"at most {self.fmt(BRIDGE_LIMIT_MM)}:"
                            " a thicker hub or a smaller hole")
        return replace(h, profile="teardrop", roof_up=up, roof_mm=roof)

    def _check_webs(self, holes: list[Hole]) -> None:
        """Holes that stay apart in the machined plan keep a printed wall between them."""
        orig = {h.id: h for h in self.plan.holes}
        for i, h1 in enumerate(holes):
            for h2 in holes[i + 1:]:
                o1, o2 = orig[h1.id], orig[h2.id]
                d = segment_distance(o1.entry_mm, o1.bottom_mm, o2.entry_mm, o2.bottom_mm)
                if d - o1.radius_mm - o2.radius_mm <= 1e-6:
                    continue  # they meet by design (socket into bore, set screw into socket)
                gap = d - self._reach(h1) - self._reach(h2)
                if gap < self.wall - 1e-6:
                    raise UserError("print.line_width", f"holes {h1.id} and {h2.id} leave a printed wall of"
                                    f" {self.fmt(max(gap, 0))}", f"at least {MIN_WALL_LINES} lines ="
                                    f" {self.fmt(self.wall)}: a narrower line_width, less hole_compensation"
                                    " or the holes further apart")

    @staticmethod
    def _reach(h: Hole) -> float:
        """Radius that counts sideways (a teardrop's roof points up, not towards a neighbour)."""
        return h.radius_mm

    # ---- pockets ---------------------------------------------------------------------------
    def _insert_pocket(self, h: Hole) -> Hole:
        d = self.pr.insert_hole + self.comp
        if d <= h.diameter_mm:
            raise UserError("print.insert_hole", f"{self.fmt(self.pr.insert_hole)} is not wider than the"
                            f" {self.fmt(h.diameter_mm)} clearance hole of {h.id}",
                            "the insert maker's hole diameter for this thread")
        orig = self.plan.hole(h.id)
        pocket = Hole(id=f"{h.id}-insert", kind="insert_pocket", face=h.face, entry_mm=h.entry_mm,
                      axis=h.axis, diameter_mm=d, depth_mm=self.pr.insert_depth, lead_mm=h.lead_mm,
                      thread=orig.thread, spreader=h.spreader, serves=h.id, compensation_mm=self.comp,
                      insert=f"heat-set insert for {orig.thread}, {self.fmt(self.pr.insert_hole)} hole,"
                             f" {self.fmt(self.pr.insert_depth)} deep",
                      note=f"heat-set insert for {h.id}")
        return self._profiled(pocket)

    def _nut_pocket(self, h: Hole, holes: list[Hole], pockets: list[Hole]) -> Hole:
        from generators.standards.fasteners import hex_nut

        orig = self.plan.hole(h.id)
        nut = hex_nut(orig.thread, key=self._key(h))
        allow = self.pr.nut_allowance
        corners = max(nut.across_corners_mm + allow, (nut.across_flats_mm + allow) / math.cos(math.pi / 6))
        flats = corners * math.cos(math.pi / 6)
        height = nut.height_mm + allow
        if flats > BRIDGE_LIMIT_MM:
            raise UserError(self._key(h), f"the {orig.thread} nut pocket ({self.fmt(flats)} across flats) is a"
                            " wider bridge than prints clean", f"at most {self.fmt(BRIDGE_LIMIT_MM)}:"
                            " a smaller thread, or heat-set inserts ([print] insert_hole and insert_depth)")
        span = self._material_span(h, holes)
        lo, hi = self.wall + height / 2, span - self.wall - height / 2
        if hi < lo - 1e-9:
            raise UserError(self._key(h), f"{h.id} runs through {self.fmt(span)} of material, too little for"
                            f" a {self.fmt(height)} nut pocket with {self.fmt(self.wall)} walls",
                            f"at least {self.fmt(height + 2 * self.wall)}: a thicker hub, a smaller thread,"
                            " or heat-set inserts ([print] insert_hole and insert_depth)")
        centres = [(lo + hi) / 2] + [t for t in np.linspace(lo, hi, 7) if abs(t - (lo + hi) / 2) > 1e-6]
        a = unit(h.axis)
        p0, q0 = _basis(a, prefer=(0.0, 0.0, 1.0) if abs(a[2]) < 0.9 else (1.0, 0.0, 0.0))
        dirs = []
        for k in range(SLOT_DIRECTIONS):
            th = 2 * math.pi * k / SLOT_DIRECTIONS
            dirs.append(unit(tuple(math.cos(th) * p0[i] + math.sin(th) * q0[i] for i in range(3))))
        best, reason = None, "no slot direction keeps its walls"
        for t in centres:
            C = h.point_at(t)
            options = []
            for s in dirs:
                exit_ = self._exit(C, s)
                if exit_ is None:
                    continue
                L_, face = exit_
                up = s[2] > 0.99
                options.append((0 if up else 1, L_, s, face))
            options.sort(key=lambda o: (o[0], o[1]))
            for _, L_, s, face in options:
                pocket = Hole(id=f"{h.id}-nut", kind="nut_pocket", face=face,
                              entry_mm=h.point_at(t - height / 2), axis=a, diameter_mm=corners,
                              depth_mm=height, lead_mm=0.0, thread=orig.thread, spreader=h.spreader,
                              profile="hex", across_flats_mm=flats, slot_dir=s,
                              slot_length_mm=L_ + L.CUT_OVERRUN_MM, serves=h.id,
                              nut=f"{orig.thread} hex nut, {nut.standard}"
                                  f" ({self.fmt(nut.across_flats_mm)} across flats, {self.fmt(nut.height_mm)} high)",
                              note=f"captive nut for {h.id}: slide it in from the {face} face")
                problem = self._check_pocket(pocket, holes, pockets, exit_face=face, raise_=False)
                if problem is None:
                    best = pocket
                    break
                reason = problem
            if best is not None:
                break
        if best is None:
            raise UserError(self._key(h), f"no room for the captive {orig.thread} nut of {h.id}: {reason}",
                            "a thicker or wider hub, a smaller thread, or heat-set inserts"
                            " ([print] insert_hole and insert_depth)")
        return best

    def _material_span(self, h: Hole, holes: list[Hole]) -> float:
        """How far along its axis the hole runs through material before it meets another cut."""
        others = [r for o in holes if o.id != h.id for r in regions_of(o)]
        ts = np.linspace(0.0, h.depth_mm, max(2, int(h.depth_mm / 0.25) + 1))
        pts = np.array([h.point_at(float(t)) for t in ts])
        inside = np.zeros(len(ts), dtype=bool)
        for r in others:
            inside |= r.distance(pts) < 0
        hit = np.nonzero(inside)[0]
        return float(ts[hit[0]]) if len(hit) else h.depth_mm

    def _exit(self, C: Vec, s: Vec):
        """Distance along ``s`` from ``C`` to the outside of the body, and the face it leaves by."""
        best = (math.inf, None)
        if s[2] > 1e-9:
            best = min(best, ((self.T - C[2]) / s[2], "top"), key=lambda b: b[0])
        if s[2] < -1e-9:
            best = min(best, (-C[2] / s[2], "bottom"), key=lambda b: b[0])
        if math.hypot(s[0], s[1]) > 1e-9:
            outline = self.plan.body.outline
            for i in range(len(outline)):
                ax, ay = outline[i]
                bx, by = outline[(i + 1) % len(outline)]
                ex, ey = bx - ax, by - ay
                den = s[0] * ey - s[1] * ex
                if abs(den) < 1e-12:
                    continue
                lam = ((ax - C[0]) * ey - (ay - C[1]) * ex) / den
                mu = ((ax - C[0]) * s[1] - (ay - C[1]) * s[0]) / den
                if lam > 1e-9 and -1e-9 <= mu <= 1 + 1e-9 and lam < best[0]:
                    best = (lam, self._side_face_at((C[0] + s[0] * lam, C[1] + s[1] * lam)))
        return None if best[1] is None else best

    def _side_face_at(self, xy) -> str | None:
        for f in self.plan.faces:
            if f.kind in ("flat", "chamfer"):
                n = f.normal
                if abs((xy[0] - f.origin[0]) * n[0] + (xy[1] - f.origin[1]) * n[1]) < 1e-6:
                    return f.id
            if f.kind == "rim":
                return f.id
        return None

    def _check_pocket(self, pocket: Hole, holes: list[Hole], pockets: list[Hole], exit_face,
                      raise_: bool = True) -> str | None:
        """None when the pocket keeps its walls, else what is too thin (or raise)."""
        problem = self._pocket_problem(pocket, holes, pockets, exit_face)
        if problem is not None and raise_:
            raise UserError(self._key(self.plan.hole(pocket.serves)), f"{pocket.id}: {problem}",
                            f"at least {MIN_WALL_LINES} lines = {self.fmt(self.wall)}: a thicker hub,"
                            " a smaller thread or a shorter insert_depth")
        return problem

    def _pocket_problem(self, pocket: Hole, holes: list[Hole], pockets: list[Hole], exit_face) -> str | None:
        pts = pocket_surface_points(pocket)
        # keep only points inside the body (the slot runs out through its exit face)
        z_ok = (pts[:, 2] > -1e-6) & (pts[:, 2] < self.T + 1e-6)
        outline = self.plan.body.outline
        ed = np.array([edge_distance((float(p[0]), float(p[1])), outline) for p in pts])
        inside = z_ok & (ed > -1e-6)
        pts_in = pts[inside]
        for o in holes + pockets:
            if o.id == pocket.serves:
                continue
            for r in regions_of(o):
                d = r.distance(pts_in).min() if len(pts_in) else math.inf
                if d < self.wall - 1e-6:
                    return f"{self.fmt(max(d, 0))} of material to {o.id}"
        # walls to the outer faces, from the pocket itself (not its slot)
        core = pocket if pocket.profile != "hex" else replace(pocket, slot_length_mm=0.0)
        cpts = pocket_surface_points(core)
        if pocket.kind == "insert_pocket":  # it opens on its entry face; only the far end counts
            a = np.array(unit(pocket.axis))
            cpts = cpts[(cpts - np.array(pocket.entry_mm)) @ a > pocket.depth_mm - 1e-6]
        near = {"top": np.min(self.T - cpts[:, 2]), "bottom": np.min(cpts[:, 2]),
                "side": min(edge_distance((float(p[0]), float(p[1])), outline) for p in cpts)}
        for face, d in near.items():
            if face == exit_face or (face == "side" and exit_face not in ("top", "bottom", None)):
                # the slot leaves by this face; its exit must stay clear of the face edges
                continue
            if d < self.wall - 1e-6:
                return f"{self.fmt(max(d, 0))} of material to the {face} face"
        if exit_face is not None and exit_face not in ("top", "bottom") and pocket.profile == "hex":
            face = self.plan.face(exit_face)
            a, s = unit(pocket.axis), unit(pocket.slot_dir)
            w = cross(a, s)
            C = pocket.point_at(pocket.depth_mm / 2)
            L_exit = pocket.slot_length_mm - L.CUT_OVERRUN_MM
            X = tuple(C[i] + s[i] * L_exit for i in range(3))
            F, H = pocket.across_flats_mm / 2, pocket.depth_mm / 2
            for sw in (-1, 1):
                for sa in (-1, 1):
                    P = tuple(X[i] + sw * F * w[i] + sa * H * a[i] for i in range(3))
                    if face.kind != "rim" and edge_distance(face.to_face(P), face.outline) < self.wall - 1e-6:
                        return f"the slot comes within {self.fmt(self.wall)} of an edge of the {exit_face} face"
            if min(near["top"], near["bottom"]) < self.wall - 1e-6:
                return "the slot comes too near the top or bottom edge of its face"
            # the hexagon may not come near the side faces other than the one the slot leaves by
            others = [f for f in self.plan.faces if f.kind in ("flat", "chamfer") and f.id != exit_face]
            for f in others:
                n = f.normal
                dist = min(dot((f.origin[0] - p[0], f.origin[1] - p[1], 0.0), n) for p in cpts)
                if dist < self.wall - 1e-6 and self._near_face_region(f, cpts):
                    return f"{self.fmt(max(dist, 0))} of material to the {f.id} face"
        if exit_face in ("top", "bottom"):
            if near["side"] < self.wall - 1e-6:
                return f"{self.fmt(max(near['side'], 0))} of material to a side face"
        return None

    def _near_face_region(self, f, pts) -> bool:
        """True when the points lie in front of the face (within its width), not beyond its ends."""
        half = f.outline[1][0]
        for p in pts:
            u, _ = f.to_face((float(p[0]), float(p[1]), float(p[2])))
            if -half <= u <= half:
                return True
        return False
