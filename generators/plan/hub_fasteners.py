"""Set-screw and mast-clamp holes of a hub plan: a mixin of the hub planner.

Uses the planner's ``cfg``, ``faces``, ``body``, ``T``, ``N``, ``Rb`` and its helpers
``fmt``, ``_series_for``, ``_mat_class`` and ``_edge_check``.
"""

from __future__ import annotations

import math

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import segment_distance
from generators.plan.holes import tap_hole
from generators.plan.model import Face, Hole


class FastenerHoles:
    def _set_screws(self, sockets: list[Hole]) -> list[Hole]:
        ss = self.cfg.set_screws
        if ss is None or ss.per_spreader == 0:
            return []
        tap = tap_hole(ss.thread, self._mat_class(), self._series_for(ss.thread))
        r_d = tap.drill.diameter_mm / 2
        face = self.faces[0] if ss.face == "top" else self.faces[1]
        holes = []
        for sock in sockets:
            # along this socket's own axis (its elevation is in the axis: sin e = -axis z)
            depth = sock.depth_mm if self.cfg.spreaders.socket_depth != "to-bore" else \
                (self.body.outer_radius_mm - self.Rb) / math.sqrt(1.0 - sock.axis[2] ** 2)
            if ss.per_spreader == 1:
                positions = [ss.position if ss.position is not None else depth / 2]
            else:
                first = ss.position if ss.position is not None else depth / 3
                positions = [first, first + (depth - first) / 2]
                if positions[1] - positions[0] < 2 * r_d + L.MIN_WEB_MM:
                    raise UserError("set_screws.position", f"the two set screws of each socket would be"
                                    f" {self.fmt(positions[1] - positions[0])} apart, closer than their"
                                    f" {self.fmt(2 * r_d)} pilots allow",
                                    "a position nearer the outer face, a smaller thread or per_spreader = 1")
            for j, p in enumerate(positions):
                hid = f"T{sock.spreader}" + ("" if ss.per_spreader == 1 else "ab"[j])
                if not (r_d < p < depth - r_d):
                    raise UserError("set_screws.position", f"{self.fmt(p)} is not along the socket",
                                    f"more than {self.fmt(r_d)} and less than {self.fmt(depth - r_d)} from the outer face")
                P = sock.point_at(p)
                if ss.face == "top":
                    entry, axis, d = (P[0], P[1], self.T), (0.0, 0.0, -1.0), self.T - P[2]
                else:
                    entry, axis, d = (P[0], P[1], 0.0), (0.0, 0.0, 1.0), P[2]
                self._edge_check("set_screws.position", face, face.to_face(entry), r_d, f"set screw {hid}")
                rho = math.hypot(P[0], P[1])
                if rho - r_d < self.Rb + L.MIN_WEB_MM:
                    raise UserError("set_screws.position", f"set screw {hid} would break into the bore",
                                    "a position nearer the outer face")
                self._clear_of_sockets("set_screws.thread", entry, axis, d, r_d, sockets, skip=sock.id,
                                       what=f"set screw {hid}")
                holes.append(Hole(id=hid, kind="set_screw", face=ss.face, entry_mm=entry, axis=axis,
                                  diameter_mm=tap.drill.diameter_mm, depth_mm=d, drill=tap.drill.name,
                                  thread=ss.thread.designation, thread_percent=tap.thread_percent,
                                  spreader=sock.spreader, lead_mm=L.CUT_OVERRUN_MM,
                                  note=f"set screw for spreader {sock.spreader}"))
        return holes

    def _clear_of_sockets(self, key, entry, axis, depth, radius, sockets, skip=None, what="hole"):
        end = (entry[0] + axis[0] * depth, entry[1] + axis[1] * depth, entry[2] + axis[2] * depth)
        for s in sockets:
            if s.id == skip:
                continue
            gap = segment_distance(entry, end, s.entry_mm, s.bottom_mm) - radius - s.radius_mm
            if gap < L.MIN_WEB_MM:
                raise UserError(key, f"{what} would break into socket {s.id}"
                                f" (web {self.fmt(max(gap, 0))})",
                                f"at least {self.fmt(L.MIN_WEB_MM)} of material between them")

    def _clamps(self, sockets: list[Hole]) -> list[Hole]:
        mc = self.cfg.mast_clamp
        if mc is None:
            return []
        if mc.count > self.N:
            raise UserError("mast_clamp.count", f"{mc.count} clamp holes but only {self.N} gaps between sockets",
                            f"1 to {self.N}")
        tap = tap_hole(mc.thread, self._mat_class(), self._series_for(mc.thread))
        r_c = tap.drill.diameter_mm / 2
        gaps = [round(k * self.N / mc.count) for k in range(mc.count)]
        first = self.cfg.spreaders.first_azimuth
        holes = []
        for k, g in enumerate(gaps):
            az = first + (g + 0.5) * 360 / self.N
            if self.body.style == "puck":
                r_e, face_id = self.body.outer_radius_mm, "rim"
                lead = L.CUT_OVERRUN_MM + r_e - math.sqrt(r_e ** 2 - r_c ** 2)
            else:
                face = self._face_at(az)
                if face is None:
                    need = self.fmt(2 * r_c + 2 * L.MIN_EDGE_MM)
                    raise UserError("mast_clamp", "clamp holes sit between sockets, where this block has a"
                                    " sharp corner", f"hub.sides = {2 * self.N} (a flat between sockets) or"
                                    f" hub.corner_chamfer of at least {need}")
                half_w = face.outline[1][0]
                if half_w - r_c < L.MIN_EDGE_MM:
                    raise UserError("hub.corner_chamfer" if face.kind == "chamfer" else "hub.across_flats",
                                    f"the {face.id} face ({self.fmt(2 * half_w)} wide) is too narrow to"
                                    f" drill the {tap.drill.name} clamp hole",
                                    f"at least {self.fmt(2 * r_c + 2 * L.MIN_EDGE_MM)}")
                r_e, face_id = math.hypot(face.origin[0], face.origin[1]), face.id
                lead = L.CUT_OVERRUN_MM
            t = math.radians(az)
            entry = (r_e * math.cos(t), r_e * math.sin(t), self.T / 2)
            axis = (-math.cos(t), -math.sin(t), 0.0)
            depth = r_e - self.Rb
            extend = self.Rb - (math.sqrt(self.Rb ** 2 - r_c ** 2) - 0.2)
            hid = f"C{k + 1}"
            self._clear_of_sockets("mast_clamp", entry, axis, depth, r_c, sockets, what=f"clamp hole {hid}")
            holes.append(Hole(id=hid, kind="clamp", face=face_id, entry_mm=entry, axis=axis,
                              diameter_mm=tap.drill.diameter_mm, depth_mm=depth, drill=tap.drill.name,
                              thread=mc.thread.designation, thread_percent=tap.thread_percent,
                              extend_mm=extend, lead_mm=lead, note="mast clamp screw"))
        return holes

    def _face_at(self, az: float) -> Face | None:
        for f in self.faces:
            if f.kind in ("flat", "chamfer") and abs(((f.azimuth_deg - az + 180) % 360) - 180) < 1e-6:
                return f
        return None
