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


from generators.config.models import Config
from generators.errors import UserError
from generators.plan.geometry import segment_distance
from generators.plan.model import Hole, HubPlan
from generators.plan.nut_pockets import PocketSearch
from generators.plan.print_profiles import (  # noqa: F401 - the printed-hub vocabulary
    BRIDGE_LIMIT_MM, MIN_WALL_LINES, OVERHANG_DEG, SLOT_DIRECTIONS, hex_slot_outline, min_wall_mm, needs_teardrop,
    pocket_surface_points, regions_of, roof_up, teardrop_outline)

_SQRT2 = math.sqrt(2.0)


def printed_plan(plan: HubPlan, cfg: Config) -> HubPlan:
    """The printed variant of a machined plan (see the module docstring)."""
    return _Printer(plan, cfg).run()


class _Printer(PocketSearch):
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
                            compensation_mm=self.comp, tapped=None, screw=None,
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
        from generators.plan.printed_screws import printed_screws

        holes = printed_screws(self.plan, self.cfg, holes, pockets, self.fmt)
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
                    raise UserError(self._web_key(h1, h2), f"holes {h1.id} and {h2.id} leave a printed wall of"
                                    f" {self.fmt(max(gap, 0))}", f"at least {MIN_WALL_LINES} lines ="
                                    f" {self.fmt(self.wall)}: a narrower line_width, less hole_compensation"
                                    " or the holes further apart")

    def _web_key(self, *holes: Hole) -> str:
        """The key of the hole a builder would move (a pin, an extra hole, a clamp screw),
        else the print setting that sets the least wall."""
        ids = [x.id for x in self.cfg.holes]
        for kind, key in (("pin", "mast_pin.height"), ("extra", None), ("clamp", "mast_clamp"),
                          ("set_screw", "set_screws")):
            for h in holes:
                if h.kind == kind:
                    return key or (f"holes[{ids.index(h.id)}].at" if h.id in ids else "holes")
        return "print.line_width"

    @staticmethod
    def _reach(h: Hole) -> float:
        """Radius that counts sideways (a teardrop's roof points up, not towards a neighbour)."""
        return h.radius_mm
