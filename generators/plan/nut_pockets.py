"""Where a printed hub's captive nut or heat-set insert goes: the pocket search and its
wall checks, mixed into the printer of generators.plan.printed."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import Vec, cross, dot, edge_distance, unit
from generators.plan.model import Hole
from generators.plan.print_profiles import (BRIDGE_LIMIT_MM, MIN_WALL_LINES, SLOT_DIRECTIONS, _basis,
                                            edge_distances, pocket_surface_points, regions_of)


class PocketSearch:
    """Nut and insert pockets for the printer (needs its plan, cfg, walls and helpers)."""

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
        from generators.plan.rules.base import rule_wall_mm

        for need in dict.fromkeys((max(self.wall, rule_wall_mm(self.cfg.hub.material)), self.wall)):
            # first a place that keeps the hole-wall rule's minimum to the other cuts, else one
            # that keeps the printed wall (and the rule then says what is thin)
            best, reason = self._place_nut(h, orig, nut, centres, dirs, a, corners, flats, height,
                                           holes, pockets, need, reason)
            if best is not None:
                break
        if best is None:
            raise UserError(self._key(h), f"no room for the captive {orig.thread} nut of {h.id}: {reason}",
                            "a thicker or wider hub, a smaller thread, or heat-set inserts"
                            " ([print] insert_hole and insert_depth)")
        return best

    def _place_nut(self, h, orig, nut, centres, dirs, a, corners, flats, height, holes, pockets, need, reason):
        """The first pocket (middle of the span first, the slot up first) that keeps ``need``
        to the other cuts and its printed walls elsewhere; and the last reason one did not."""
        best = None
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
                              slot_exit_mm=tuple(C[i] + s[i] * L_ for i in range(3)),
                              nut=f"{orig.thread} hex nut, {nut.standard}"
                                  f" ({self.fmt(nut.across_flats_mm)} across flats, {self.fmt(nut.height_mm)} high)",
                              note=f"captive nut for {h.id}: slide it in from the {face} face")
                problem = self._check_pocket(pocket, holes, pockets, exit_face=face, raise_=False, hole_wall=need)
                if problem is None:
                    best = pocket
                    break
                reason = problem
            if best is not None:
                break
        return best, reason

    def _material_span(self, h: Hole, holes: list[Hole]) -> float:
        """How far along its axis the hole runs through material before it meets another cut."""
        others = [r for o in holes if o.id != h.id for r in regions_of(o)]
        ts = np.linspace(0.0, h.depth_mm, max(2, int(h.depth_mm / 0.25) + 1))
        pts = np.array([h.point_at(float(t)) for t in ts])
        inside = np.zeros(len(ts), dtype=bool)
        for r in others:
            if r.least(pts, 0.0) < 0:
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
                      raise_: bool = True, hole_wall: float | None = None) -> str | None:
        """None when the pocket keeps its walls (``hole_wall`` to the other cuts, default the
        printed wall), else what is too thin (or raise)."""
        problem = self._pocket_problem(pocket, holes, pockets, exit_face, hole_wall or self.wall)
        if problem is not None and raise_:
            raise UserError(self._key(self.plan.hole(pocket.serves)), f"{pocket.id}: {problem}",
                            f"at least {MIN_WALL_LINES} lines = {self.fmt(self.wall)}: a thicker hub,"
                            " a smaller thread or a shorter insert_depth")
        return problem

    def _pocket_problem(self, pocket: Hole, holes: list[Hole], pockets: list[Hole], exit_face,
                        hole_wall: float) -> str | None:
        pts = pocket_surface_points(pocket)
        # keep only points inside the body (the slot runs out through its exit face)
        z_ok = (pts[:, 2] > -1e-6) & (pts[:, 2] < self.T + 1e-6)
        outline = self.plan.body.outline
        ed = edge_distances(pts, outline)
        inside = z_ok & (ed > -1e-6)
        pts_in = pts[inside]
        for o in holes + pockets:
            if o.id == pocket.serves:
                continue
            for r in regions_of(o):
                d = r.least(pts_in, hole_wall)
                if d < hole_wall - 1e-6:
                    return f"{self.fmt(max(d, 0))} of material to {o.id}"
        # walls to the outer faces, from the pocket itself (not its slot)
        core = pocket if pocket.profile != "hex" else replace(pocket, slot_length_mm=0.0)
        cpts = pocket_surface_points(core)
        if pocket.kind == "insert_pocket":  # it opens on its entry face; only the far end counts
            a = np.array(unit(pocket.axis))
            cpts = cpts[(cpts - np.array(pocket.entry_mm)) @ a > pocket.depth_mm - 1e-6]
        near = {"top": np.min(self.T - cpts[:, 2]), "bottom": np.min(cpts[:, 2]),
                "side": float(edge_distances(cpts, outline).min())}
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
