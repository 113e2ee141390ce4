"""The config's extra holes ([[holes]]) of a hub plan: a mixin of the hub planner."""

from __future__ import annotations

import math

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import segment_distance
from generators.plan.holes import clearance_drill, drill_name_for, tap_hole
from generators.plan.model import Counterbore, Countersink, Hole, ThreadRun
from generators.plan.screws import clearance_screw, tapped_extra_screw

# A twist drill's point: 118 deg included angle, the general-purpose grind (ISO 5419 names
# the point angle; 118 deg is the usual figure, from memory). A blind drilled hole ends in
# this cone, so the wall under it is thinner than the flat depth says.
DRILL_POINT_DEG = 118.0


class ExtraHoles:
    def _extras(self, existing: list[Hole], sockets: list[Hole]) -> list[Hole]:
        from generators.standards.fasteners import clearance_hole, counterbore, countersink

        taken = {h.id for h in existing}
        out: list[Hole] = []
        for i, spec in enumerate(self.cfg.holes):
            key = f"holes[{i}]"
            if spec.id in taken:
                raise UserError(f"{key}.id", f"{spec.id!r} is already used by a generated hole",
                                "ids other than " + ", ".join(sorted(taken)))
            taken.add(spec.id)
            cs = cb = None
            if spec.thread is not None:
                tap = tap_hole(spec.thread, self._mat_class(), self._series_for(spec.thread))
                dia, drill, thread, pct = tap.drill.diameter_mm, tap.drill.name, spec.thread.designation, tap.thread_percent
            elif spec.clearance is not None:
                target = clearance_hole(spec.clearance, spec.fit, key=f"{key}.fit")
                drill, dia = clearance_drill(target, self._series_for(spec.clearance))
                thread, pct = None, None
                if spec.countersink:
                    c = countersink(spec.clearance)
                    cs = Countersink(diameter_mm=c.head_diameter_mm, angle_deg=c.angle_deg)
                if spec.counterbore:
                    c = counterbore(spec.clearance)
                    cb = Counterbore(diameter_mm=c.diameter_mm, depth_mm=c.depth_mm)
            else:
                dia = spec.diameter
                drill = drill_name_for(dia, self._series_for(None))
                thread, pct = None, None
            if spec.through is False and spec.depth is None:
                raise UserError(f"{key}.through", "through = false needs the blind hole's depth",
                                f"give {key}.depth, or leave through out for a through hole")
            through = spec.depth is None
            depth = self.T if through else spec.depth
            point = None if through or self.cfg.hub.process == "printed" else DRILL_POINT_DEG
            tip = 0.0 if point is None else dia / 2 / math.tan(math.radians(point / 2))
            if not through and depth + tip > self.T - L.MIN_WEB_MM + 1e-9:
                under = "under the hole" if point is None else "under the drill point"
                raise UserError(f"{key}.depth", f"{self.fmt(depth)} leaves {self.fmt(max(self.T - depth - tip, 0))}"
                                f" {under}", f"up to {self.fmt(max(self.T - L.MIN_WEB_MM - tip, 0))},"
                                " or no depth for a through hole")
            if cb is not None and not through and cb.depth_mm >= depth - 1e-9:
                raise UserError(f"{key}.counterbore", f"a {self.fmt(cb.depth_mm)} counterbore in a {self.fmt(depth)}"
                                " deep hole", f"a hole deeper than {self.fmt(cb.depth_mm)}, or no counterbore")
            if spec.face == "top":
                entry, axis, face = (spec.at[0], spec.at[1], self.T), (0.0, 0.0, -1.0), self.faces[0]
            else:
                entry, axis, face = (spec.at[0], spec.at[1], 0.0), (0.0, 0.0, 1.0), self.faces[1]
            r_out = max(dia, cs.diameter_mm if cs else 0, cb.diameter_mm if cb else 0) / 2
            self._edge_check(f"{key}.at", face, face.to_face(entry), r_out, f"hole {spec.id}")
            if math.hypot(*spec.at) - r_out < self.Rb + L.MIN_WEB_MM:
                raise UserError(f"{key}.at", f"hole {spec.id} would break into the bore",
                                f"at least {self.fmt(self.Rb + L.MIN_WEB_MM + r_out)} from the mast axis")
            # a quick capsule check; the walls measured on the true shapes (plan/hard_limits.py)
            # decide, so a blind hole's capsule stops a radius short of its flat bottom
            self._clear_of_sockets(f"{key}.at", entry, axis, depth if through else max(depth - dia / 2, 0.0),
                                   dia / 2, sockets, what=f"hole {spec.id}")
            end = (entry[0] + axis[0] * depth, entry[1] + axis[1] * depth, entry[2] + axis[2] * depth)
            for other in existing + out:
                if other.kind in ("bore", "socket"):
                    continue
                gap = segment_distance(entry, end, other.entry_mm, other.bottom_mm) - r_out - other.radius_mm
                if gap < L.MIN_WEB_MM:
                    raise UserError(f"{key}.at", f"hole {spec.id} runs into hole {other.id}",
                                    f"at least {self.fmt(L.MIN_WEB_MM)} of material between them")
            run = screw = None
            if thread is None and spec.clearance is not None and through:
                head = "flat" if cs is not None else "socket" if cb is not None else "pan"
                screw = clearance_screw(spec.clearance.designation, depth, head,
                                        cb.depth_mm if cb is not None else 0.0, self.units, self.fmt)
            if thread is not None:
                from generators.standards.engagement import tap_depth_mm

                # blind: a bottoming tap still leaves about two pitches short of the drilled
                # depth (common practice), so the thread never runs to the bottom
                blind_max = depth - 2 * spec.thread.pitch_mm
                run = ThreadRun(0.0, depth if through else max(min(blind_max, tap_depth_mm(thread, self._mat_class())), 0.0))
                engaged = run.length_mm if through else max(run.length_mm - 2 * spec.thread.pitch_mm, 0.0)
                screw = tapped_extra_screw(thread, engaged, self.fmt)
            out.append(Hole(id=spec.id, kind="extra", face=spec.face, entry_mm=entry, axis=axis,
                            diameter_mm=dia, depth_mm=depth, through=through, drill=drill, thread=thread,
                            thread_percent=pct, countersink=cs, counterbore=cb, tapped=run, screw=screw,
                            extend_mm=L.CUT_OVERRUN_MM if through else 0.0, lead_mm=L.CUT_OVERRUN_MM,
                            point_deg=point))
        return out
