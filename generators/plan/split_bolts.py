"""The bolts of a split hub: where they run, the cuts each needs and the stock screw.

Each bolt runs along the split plane's normal, from an outer face of half A (the head side)
across the gap into half B, one on each side of the bore at ``offset`` from the mast axis.
Its head sits at the bottom of a recess (a counterbore; printed: a teardrop pocket) so that
``grip`` of material lies between the head and the split face; in half B the bolt is
tapped (machined) or runs through a captive hex nut slid down a slot from the top face
(printed, as the other printed nuts: printed threads strip). The bolt is the shortest stock
socket head cap screw that passes its nut by two pitches or fills the thread it needs.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import Vec, hex_face_mm2
from generators.plan.model import Counterbore, Hole, Screw, ThreadRun

# Material between a bolt's head (or nut) and the split face: 2 x d, at least 8 mm (common
# practice for a clamped joint in plastic: the head's load spreads at about 45 deg).
GRIP_D, MIN_GRIP_MM = 2.0, 8.0
# A bolt passes its nut by at least two threads (common practice).
PROTRUDE_PITCHES = 2.0
# The hole runs this far past the bolt's end so the bolt never bottoms (common practice).
END_CLEAR_MM = 1.0
DRILL_POINT_DEG = 118.0  # a jobber drill's point (ISO 5419 / NAS 907, from memory)
# Bearing under a bolt's head or nut: the default torque keeps the pressure (T = K F d with
# the low K, the high force) at the hub material's yield over this (common practice).
SF_BEARING = 1.5


def bearing_area_mm2(plan, bolt_hole: str) -> tuple[float, str]:
    """The least area a split bolt presses on the hub with: under its head, and (printed)
    its captive nut's face; and which one it is."""
    from generators.standards.fasteners import cap_screw_head_mm

    h = plan.hole(bolt_hole)
    thread = plan.split.bolts[0].thread
    hole = math.pi / 4 * h.diameter_mm ** 2
    areas = [(math.pi / 4 * cap_screw_head_mm(thread, key="split.thread") ** 2 - hole, "the head")]
    nut = next((p for p in plan.holes if p.kind == "nut_pocket" and p.serves == bolt_hole), None)
    if nut is not None:  # the nut's face on the pocket wall: the hexagon less the hole
        areas.append((hex_face_mm2(nut.across_flats_mm, h.diameter_mm), "the nut"))
    return min(areas)


@dataclass(frozen=True)
class BoltCuts:
    hole: Hole
    pockets: tuple[Hole, ...]  # printed: the head pocket and the nut pocket
    length_mm: float
    grip_mm: float
    seat: Vec
    nut: str | None


class BoltPlanner:
    """Needs the splitter's plan, cfg, thread, T, normal, along, gap, printed, comp and fmt."""

    def _ray_exit(self, p0: Vec, direction: Vec) -> tuple[float, str, Vec]:
        """Distance from ``p0`` along the horizontal ``direction`` to the outside of the
        body, the face it leaves by and that face's outward normal there."""
        body = self.plan.body
        if body.style == "puck":
            R = body.diameter_mm / 2
            b = p0[0] * direction[0] + p0[1] * direction[1]
            c = p0[0] ** 2 + p0[1] ** 2 - R * R
            t = -b + math.sqrt(max(b * b - c, 0.0))
            x, y = p0[0] + direction[0] * t, p0[1] + direction[1] * t
            return t, "rim", (x / R, y / R, 0.0)
        best = None
        outline = body.outline
        for i in range(len(outline)):
            ax, ay = outline[i]
            bx, by = outline[(i + 1) % len(outline)]
            ex, ey = bx - ax, by - ay
            den = direction[0] * ey - direction[1] * ex
            if abs(den) < 1e-12:
                continue
            lam = ((ax - p0[0]) * ey - (ay - p0[1]) * ex) / den
            mu = ((ax - p0[0]) * direction[1] - (ay - p0[1]) * direction[0]) / den
            if lam > 1e-9 and -1e-9 <= mu <= 1 + 1e-9 and (best is None or lam < best[0]):
                best = (lam, (p0[0] + direction[0] * lam, p0[1] + direction[1] * lam))
        lam, xy = best
        for f in self.plan.faces:
            if f.kind in ("flat", "chamfer"):
                n = f.normal
                if abs((xy[0] - f.origin[0]) * n[0] + (xy[1] - f.origin[1]) * n[1]) < 1e-6:
                    return lam, f.id, n
        raise AssertionError("a ray from inside the block leaves by no side face")

    def bolt_cuts(self, bolt_id: str, offset: float, z: float) -> BoltCuts:
        """The hole (and, printed, its pockets) of one bolt at ``offset`` along the plane and
        ``z`` above the bottom face."""
        from generators.standards.fasteners import (cap_screw_lengths, clearance_hole, counterbore,
                                                    hex_nut)

        th, n, g = self.thread, self.normal, self.gap
        p0 = (self.along[0] * offset, self.along[1] * offset, z)
        back = (-n[0], -n[1], 0.0)
        t_a, face, f_n = self._ray_exit(p0, back)
        t_b, _, _ = self._ray_exit(p0, n)
        cos_t = max(abs(f_n[0] * n[0] + f_n[1] * n[1]), 1e-6)
        tan_t = math.sqrt(max(1.0 - cos_t * cos_t, 0.0)) / cos_t
        entry = (p0[0] - n[0] * t_a, p0[1] - n[1] * t_a, z)
        at = lambda t: (p0[0] + n[0] * t, p0[1] + n[1] * t, z)  # noqa: E731 - t from the mid-plane
        cb = counterbore(th, key="split.thread")
        r_cb = (cb.diameter_mm + self.comp) / 2
        head_h = cb.depth_mm  # the head's height plus the sink below the surface
        grip = max(GRIP_D * th.major_mm, MIN_GRIP_MM)
        recess = t_a - g / 2 - grip  # entry to the head's seat, along the axis
        need = head_h + r_cb * tan_t  # the whole head below an oblique face
        if recess < need:
            grip = t_a - g / 2 - need
            recess = need
            if grip < th.major_mm:
                raise UserError("split.offset", f"bolt {bolt_id} has {self.fmt(max(t_a - g / 2, 0))} from"
                                " the split face to the outside: no room for its head and grip",
                                "an offset where the body is wider across the split, or a smaller split.thread")
        seat_t = -g / 2 - grip
        lead = L.CUT_OVERRUN_MM + r_cb * tan_t
        clear = clearance_hole(th, "normal", key="split.thread")
        stock = cap_screw_lengths(th, key="split.thread")
        if self.printed:
            nut = hex_nut(th, key="split.thread")
            allow = self.cfg.print.nut_allowance
            corners = max(nut.across_corners_mm + allow, (nut.across_flats_mm + allow) / math.cos(math.pi / 6))
            flats, height = corners * math.cos(math.pi / 6), nut.height_mm + allow
            nut_t = g / 2 + grip  # the face of the pocket the nut is pulled against
            want = nut_t + nut.height_mm + PROTRUDE_PITCHES * th.pitch_mm - seat_t
        else:
            from generators.standards.engagement import tap_depth_mm

            engage = tap_depth_mm(th, self.mclass) - 2 * th.pitch_mm  # full threads in half B
            want = g / 2 - seat_t + engage
        length = next((s for s in stock if s >= want - 1e-9), None)
        if length is None:
            raise UserError("split.thread", f"bolt {bolt_id} needs a {th.designation} cap screw of"
                            f" {self.fmt(want)}, longer than stock ({self.fmt(stock[-1])})",
                            "a larger split.thread or a shorter grip (split.offset)")
        # the hole's flat end; a tapped one runs two pitches on (blind threads stop two
        # pitches short of the bottom)
        end_t = seat_t + length + END_CLEAR_MM + (0.0 if self.printed else PROTRUDE_PITCHES * th.pitch_mm)
        if end_t > t_b - self.wall:
            raise UserError("split.offset", f"the {th.designation} x {self.fmt(length)} bolt {bolt_id} would come"
                            f" within {self.fmt(max(t_b - end_t, 0))} of the outside of half B",
                            "an offset where the body is wider across the split, or a smaller split.thread")
        depth = end_t + t_a
        screw = Screw(designation=f"{th.designation} x {self.fmt(length)}", kind="cap screw",
                      thread=th.designation, length_mm=length,
                      standard="socket head cap screw (ISO 4762 / ASME B18.3)",
                      note=(f"from the {face} face of half A, through the captive nut in half B" if self.printed
                            else f"from the {face} face of half A into the thread in half B"))
        if self.printed:
            r = (clear + self.comp) / 2
            hole = Hole(id=bolt_id, kind="split_bolt", face=face, entry_mm=entry, axis=n,
                        diameter_mm=2 * r, depth_mm=depth, lead_mm=L.CUT_OVERRUN_MM + r * tan_t,
                        compensation_mm=self.comp, screw=screw, note=f"split bolt; clearance for {th.designation}",
                        **self._roof(r, z))
            head = Hole(id=f"{bolt_id}-head", kind="head_pocket", face=face, entry_mm=entry, axis=n,
                        diameter_mm=2 * r_cb, depth_mm=recess, lead_mm=lead, serves=bolt_id,
                        compensation_mm=self.comp,
                        note=f"recess for the head of {bolt_id}", **self._roof(r_cb, z))
            slot_up = self.T - z
            pocket = Hole(id=f"{bolt_id}-nut", kind="nut_pocket", face="top", entry_mm=at(nut_t - allow / 2),
                          axis=n, diameter_mm=corners, depth_mm=height, lead_mm=0.0, thread=th.designation,
                          profile="hex", across_flats_mm=flats, slot_dir=(0.0, 0.0, 1.0),
                          slot_length_mm=slot_up + L.CUT_OVERRUN_MM, serves=bolt_id,
                          slot_exit_mm=(*at(nut_t - allow / 2 + height / 2)[:2], self.T),
                          nut=f"{th.designation} hex nut, {nut.standard}"
                              f" ({self.fmt(nut.across_flats_mm)} across flats, {self.fmt(nut.height_mm)} high)",
                          note=f"captive nut for {bolt_id}: slide it in from the top face")
            return BoltCuts(hole, (head, pocket), length, grip + g + grip, at(seat_t), pocket.id)
        from generators.plan.holes import clearance_drill, tap_hole

        tap = tap_hole(th, self.mclass, self.series)
        drill, dia = clearance_drill(clear, self.series)
        start = t_a + g / 2  # the thread starts at half B's split face
        run = ThreadRun(start, end_t - PROTRUDE_PITCHES * th.pitch_mm - g / 2, dia, drill)
        hole = Hole(id=bolt_id, kind="split_bolt", face=face, entry_mm=entry, axis=n,
                    diameter_mm=tap.drill.diameter_mm, depth_mm=depth, drill=tap.drill.name,
                    thread=th.designation, thread_percent=tap.thread_percent, lead_mm=lead,
                    counterbore=Counterbore(diameter_mm=2 * r_cb, depth_mm=recess), tapped=run,
                    point_deg=DRILL_POINT_DEG, screw=screw, note="split bolt")
        return BoltCuts(hole, (), length, grip + g, at(seat_t), None)

    def _roof(self, r: float, z: float) -> dict:
        """A printed horizontal hole's teardrop roof, lowered to keep the wall to the top face."""
        roof = max(min(r * math.sqrt(2.0), self.T - self.wall - z), r)
        return {"profile": "teardrop", "roof_up": (0.0, 0.0, 1.0), "roof_mm": roof}
