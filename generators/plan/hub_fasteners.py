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
from generators.plan.model import Counterbore, Face, Hole
from generators.plan.screws import clamp_screw, set_screw, thread_run


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
                cos_e = math.sqrt(max(1.0 - sock.axis[2] ** 2, 1e-12))  # this socket's own tilt
                r_s = sock.radius_mm
                pole = self.spreader_of[sock.spreader].diameter_mm
                wall = d - r_s / cos_e  # face to the socket wall, along the screw
                gap = d - (pole - r_s) / cos_e  # to the pole, pushed over
                run = thread_run(wall, ss.thread, self._mat_class(), self._series_for(ss.thread))
                screw = set_screw(ss.thread.designation, gap, run.start_mm, run.end_mm, ss.length,
                                  self.units, self.fmt, point=ss.point,
                                  torque_nm=self._torque_nm(ss.torque, ss.thread))
                holes.append(Hole(id=hid, kind="set_screw", face=ss.face, entry_mm=entry, axis=axis,
                                  diameter_mm=tap.drill.diameter_mm, depth_mm=d, drill=tap.drill.name,
                                  thread=ss.thread.designation, thread_percent=tap.thread_percent,
                                  spreader=sock.spreader, lead_mm=L.CUT_OVERRUN_MM, tapped=run, screw=screw,
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

    def _torque_nm(self, given, thread) -> float:
        """The tightening torque the holding checks assume: the config's, or the table's."""
        from generators.standards.holding import default_torque_nm

        return given if given is not None else default_torque_nm(thread, self._mat_class())[0]

    def _clamps(self, sockets: list[Hole]) -> list[Hole]:
        mc = self.cfg.mast_clamp
        if mc is None:
            return []
        if mc.count > self.N and self.body.style == "puck" and mc.azimuths is None:
            raise UserError("mast_clamp.count", f"{mc.count} clamp holes but only {self.N} gaps between sockets",
                            f"1 to {self.N}")
        tap = tap_hole(mc.thread, self._mat_class(), self._series_for(mc.thread))
        r_c = tap.drill.diameter_mm / 2
        z = self.T / 2 if mc.height is None else mc.height
        if not (r_c + L.MIN_EDGE_MM <= z <= self.T - r_c - L.MIN_EDGE_MM):
            raise UserError("mast_clamp.height", f"{self.fmt(z)} puts the {tap.drill.name} clamp hole"
                            " through the top or bottom face", f"{self.fmt(r_c + L.MIN_EDGE_MM)} to"
                            f" {self.fmt(self.T - r_c - L.MIN_EDGE_MM)} above the bottom face")
        holes = []
        for k, (az, face) in enumerate(self._clamp_places(r_c, tap.drill.name)):
            if face is None:
                r_e, face_id = self.body.outer_radius_mm, "rim"
                lead = L.CUT_OVERRUN_MM + r_e - math.sqrt(r_e ** 2 - r_c ** 2)
            else:
                r_e, face_id = math.hypot(face.origin[0], face.origin[1]), face.id
                lead = L.CUT_OVERRUN_MM
            t = math.radians(az)
            entry = (r_e * math.cos(t), r_e * math.sin(t), z)
            axis = (-math.cos(t), -math.sin(t), 0.0)
            depth = r_e - self.Rb
            extend = self.Rb - (math.sqrt(self.Rb ** 2 - r_c ** 2) - 0.2)
            hid = f"C{k + 1}"
            key = "mast_clamp.azimuths" if mc.azimuths is not None else "mast_clamp"
            self._clear_of_sockets(key, entry, axis, depth, r_c, sockets, what=f"clamp hole {hid}")
            run = thread_run(depth, mc.thread, self._mat_class(), self._series_for(mc.thread))
            screw, cb_depth = clamp_screw(mc.thread.designation, depth, self.bore - self.mast_od,
                                          run.start_mm, run.end_mm, self.units, self.fmt,
                                          torque_nm=self._torque_nm(mc.torque, mc.thread))
            cb = None
            if cb_depth > 0:
                from generators.standards.fasteners import counterbore

                cb = Counterbore(diameter_mm=counterbore(mc.thread).diameter_mm, depth_mm=cb_depth)
            holes.append(Hole(id=hid, kind="clamp", face=face_id, entry_mm=entry, axis=axis,
                              diameter_mm=tap.drill.diameter_mm, depth_mm=depth, drill=tap.drill.name,
                              thread=mc.thread.designation, thread_percent=tap.thread_percent,
                              counterbore=cb, extend_mm=extend, lead_mm=lead, tapped=run, screw=screw,
                              note="mast clamp screw"))
        return holes

    def _clamp_places(self, r_c: float, drill: str) -> list[tuple[float, Face | None]]:
        """(azimuth, face) of each clamp hole; the face is None on a puck's rim."""
        from generators.plan.clamp_places import choose_azimuths

        mc = self.cfg.mast_clamp
        sockets_az = [self.cfg.spreaders.first_azimuth + i * 360 / self.N for i in range(self.N)]
        if self.body.style == "puck":
            free = {(self.cfg.spreaders.first_azimuth + (g + 0.5) * 360 / self.N) % 360: None
                    for g in range(self.N)}
        else:
            free = {f.azimuth_deg % 360: f for f in self.faces if f.kind in ("flat", "chamfer")
                    and all(_apart(f.azimuth_deg, s) > 1e-6 for s in sockets_az)}
        if mc.azimuths is not None:
            out = []
            for az in mc.azimuths:
                face = next((f for a, f in free.items() if _apart(a, az) < 1e-6), None)
                on_socket = [i for i in range(self.N) if _apart(az, sockets_az[i]) < 1e-6]
                if on_socket:
                    raise UserError("mast_clamp.azimuths", f"{az:g} deg runs down socket S{on_socket[0] + 1}",
                                    "an azimuth between sockets")
                if self.body.style == "block" and face is None:
                    near = ", ".join(f"{a:g}" for a in sorted(free)) or "none"
                    raise UserError("mast_clamp.azimuths", f"{az:g} deg has no flat or chamfer between sockets"
                                    " for a clamp hole", f"azimuths of the flats or chamfers between sockets:"
                                    f" {near} deg")
                out.append((az, face))
        else:
            if not free:
                need = self.fmt(2 * r_c + 2 * L.MIN_EDGE_MM)
                raise UserError("mast_clamp", "clamp holes sit between sockets, where this block has a"
                                " sharp corner", f"hub.sides = {2 * self.N} (a flat between sockets) or"
                                f" hub.corner_chamfer of at least {need}")
            if mc.count > len(free):
                raise UserError("mast_clamp.count", f"{mc.count} clamp holes but only {len(free)} flats or"
                                " chamfers between sockets", f"1 to {len(free)}")
            pin = self.cfg.mast_pin
            if pin is not None and pin.azimuth is not None:  # keep the given pin's two ends free
                ends = (pin.azimuth % 360, (pin.azimuth + 180) % 360)
                kept = {a: f for a, f in free.items() if min(_apart(a, e) for e in ends) > 1e-6}
                free = kept if len(kept) >= mc.count else free
            first = (self.cfg.spreaders.first_azimuth + 180 / self.N) % 360
            chosen, note = choose_azimuths(sorted(free), mc.count, first)
            if note:
                self.notes.append(note)
            out = [(az, free[az]) for az in chosen]
        for az, face in out:
            if face is not None:
                half_w = face.outline[1][0]
                if half_w - r_c < L.MIN_EDGE_MM:
                    raise UserError("hub.corner_chamfer" if face.kind == "chamfer" else "hub.across_flats",
                                    f"the {face.id} face ({self.fmt(2 * half_w)} wide) is too narrow to"
                                    f" drill the {drill} clamp hole",
                                    f"at least {self.fmt(2 * r_c + 2 * L.MIN_EDGE_MM)}")
        return out


def _apart(a: float, b: float) -> float:
    """Angle between two azimuths, 0 to 180 deg."""
    return abs(((a - b + 180) % 360) - 180)
