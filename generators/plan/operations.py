"""The shop operations of a plan: for each face, one ordered list of what to do to it.

Machined hubs: mark from the template, centre-punch, then in three stages (the bore, the
sockets, then the holes that break into them) pilot, drill, open up or cut, and finally
tap, countersink and counterbore. Printed hubs: print, clear, check with a caliper, fit the
nuts or press the inserts. The templates, the report's schedule and the manifest's
``operations`` are all rendered from this one list, so they cannot disagree.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

from generators.plan.geometry import dot
from generators.plan.kinds import POCKET_KINDS, HoleKind
from generators.plan.model import Hole, HubPlan
from generators.plan.pin_ops import exit_rows, match_drill_rows, pin_breaks_into, pin_why
from generators.plan.shop import PILOT_ABOVE_MM, cutter_for, drill_label, needs_pilot, pilot_drill
from generators.units import format_length

# Stages: marking, then the bore, the sockets, and last the holes that break into them.
STAGE_MARK, STAGE_BORE, STAGE_SOCKETS, STAGE_HOLES = 0, 1, 2, 3
STAGE_NAMES = {STAGE_MARK: "mark", STAGE_BORE: "bore", STAGE_SOCKETS: "sockets", STAGE_HOLES: "holes"}
# A hole is tilted when its axis leans more than this from square to its face.
from generators.plan.tilt_notes import TILT_MIN_DEG  # noqa: E402


@dataclass(frozen=True)
class Operation:
    """One step on one face."""

    face: str
    step: int
    operation: str  # mark | centre_punch | wait | pilot | drill | open_up | cut | tap | countersink |
    # counterbore | print | clear | check | fit_nut | press_insert | match_drill
    holes: tuple[str, ...]
    tool: str
    tool_diameter_mm: float | None
    depth_mm: float | None
    through: bool
    stage: int
    tilt_deg: float | None = None
    note: str = ""

    def record(self) -> dict:
        r = lambda x: None if x is None else round(float(x), 4)  # noqa: E731
        return {"face": self.face, "step": self.step, "operation": self.operation, "holes": list(self.holes),
                "tool": self.tool, "tool_diameter_mm": r(self.tool_diameter_mm),
                "depth_mm": r(self.depth_mm), "through": self.through, "stage": STAGE_NAMES[self.stage],
                "tilt_deg": r(self.tilt_deg), "note": self.note}


def stage_of(h: Hole) -> int:
    return {HoleKind.BORE: STAGE_BORE, HoleKind.SOCKET: STAGE_SOCKETS}.get(h.kind, STAGE_HOLES)


def hole_tilt_deg(plan: HubPlan, h: Hole) -> float:
    """Angle between the hole axis and square to its face at the entry (a rim's is radial)."""
    face = plan.face(h.face)
    if face.kind == "rim":
        t = math.atan2(h.entry_mm[1], h.entry_mm[0])
        n = (math.cos(t), math.sin(t), 0.0)
    else:
        n = face.normal
    c = max(-1.0, min(1.0, -dot(h.axis, n)))
    deg = math.degrees(math.acos(c))
    return 0.0 if deg < TILT_MIN_DEG else deg


def faces_with_work(plan: HubPlan) -> list[str]:
    used = {h.face for h in plan.holes}
    return [f.id for f in plan.faces if f.id in used]


def plan_operations(plan: HubPlan, cfg, series: tuple[str, ...], material_class: str) -> tuple[Operation, ...]:
    """Every face's operations, faces in plan order, steps numbered per face from 1."""
    out: list[Operation] = []
    faces = faces_with_work(plan)
    if plan.process != "printed":  # a through pin's far face is marked and may be drilled from too
        leaving = {h.exit_face for h in plan.holes if h.kind == HoleKind.PIN and h.exit_face}
        faces = [f.id for f in plan.faces if f.id in set(faces) | leaving]
    for face_id in faces:
        if plan.process == "printed":
            out += _Printed(plan, cfg, face_id).ops()
        else:
            out += _Machined(plan, cfg, face_id, series, material_class).ops()
    return tuple(out)


class _Face:
    def __init__(self, plan: HubPlan, cfg, face_id: str):
        self.plan, self.cfg, self.face = plan, cfg, face_id
        self.units = cfg.units
        self.holes = plan.holes_on(face_id)
        self.rows: list[dict] = []

    def L(self, mm: float) -> str:
        return format_length(mm, self.units, fractions=False)

    def add(self, operation: str, holes, tool: str, tool_mm=None, depth=None, through=False,
            stage=STAGE_HOLES, tilt=None, note: str = "") -> None:
        self.rows.append(dict(operation=operation, holes=tuple(h.id if isinstance(h, Hole) else h for h in holes),
                              tool=tool, tool_diameter_mm=tool_mm, depth_mm=depth, through=through,
                              stage=stage, tilt_deg=tilt, note=note))

    def ops(self) -> list[Operation]:
        self.fill()
        return [Operation(face=self.face, step=i + 1, **r) for i, r in enumerate(self.rows)]

    def fill(self) -> None:  # pragma: no cover - overridden
        raise NotImplementedError

    def breaks_into_all(self, hs: list[Hole]) -> str:
        """What a group of holes breaks into: one socket named, several as "the sockets"."""
        words = {self.breaks_into(h) for h in hs}
        if len(words) == 1:
            return words.pop()
        return "each breaks into its socket" if all(h.kind == HoleKind.SET_SCREW for h in hs) else ""

    def breaks_into(self, h: Hole) -> str:
        if h.kind == HoleKind.SET_SCREW and h.spreader is not None:
            sock = next((s.socket_hole for s in self.plan.spreaders if s.id == h.spreader), None)
            return f"breaks into socket {sock}" if sock else ""
        if h.kind == HoleKind.CLAMP:
            return "breaks into the bore"
        if h.kind == HoleKind.SOCKET and h.extend_mm > 0:
            return "runs into the bore"
        return pin_breaks_into(h)

    def reach(self, drill_mm: float, h: Hole) -> str:
        """What a drill this deep needs beyond a jobber drill (DIN 338 / 340 flutes, and ASME
        B94.11M jobber flutes for the inch drills of an inch config; from memory)."""
        from generators.standards.drill_lengths import flute_length_mm, series_reaching

        length, inch = h.depth_mm, self.units == "in"
        jobber = flute_length_mm(drill_mm, "jobber", inch)
        if jobber is None or length <= jobber + 1e-9:
            return ""
        series = series_reaching(drill_mm, length, inch)
        if series == "long":
            return (f"deeper than a jobber drill's {self.L(jobber)} of flute: use a long-series drill"
                    f" ({self.L(flute_length_mm(drill_mm, 'long'))} of flute)")
        longest = flute_length_mm(drill_mm, "long") or jobber
        if h.through and length / 2 <= longest + 1e-9:
            return (f"{self.L(length)} is past a long-series drill's {self.L(longest)} of flute: drill half"
                    " from each face with one")
        ext = "(aircraft) drill (made 6 to 12 in / 150 to 300 mm long, from memory)"
        if h.through:
            return (f"{self.L(length)} is past a long-series drill's {self.L(longest)} of flute: drill half"
                    f" from each face, {self.L(length / 2)} each, with an extension {ext} reaching that"
                    " far, pecking often")
        return (f"{self.L(length)} is past a long-series drill's {self.L(longest)} of flute: an extension"
                f" {ext} reaching {self.L(length)} or more, pecking often")


class _Machined(_Face):
    def __init__(self, plan, cfg, face_id, series, material_class):
        super().__init__(plan, cfg, face_id)
        self.series, self.mclass = series, material_class

    def fill(self) -> None:
        holes = self.holes
        tilts = {h.id: hole_tilt_deg(self.plan, h) for h in holes}
        first_bar = "4 in" if self.units == "in" else "100 mm"
        other_bar = "100 mm" if self.units == "in" else "4 in"
        self.add("mark", [], "1:1 template", stage=STAGE_MARK,
                 note=f"check the {first_bar} bar (and the {other_bar} bar) with a rule, then tape the template"
                      " on with its outline on the face's edges")
        tilted = [h for h in holes if tilts[h.id] > 0]
        from generators.plan.pin import exits_on

        self.add("centre_punch", holes + exits_on(self.plan, self.face), "centre punch or centre drill",
                 stage=STAGE_MARK, note="with the work already tilted for the tilted holes" if tilted else "")
        for stage in (STAGE_BORE, STAGE_SOCKETS, STAGE_HOLES):
            group = [h for h in holes if stage_of(h) == stage]
            if stage == STAGE_HOLES and group:
                self._wait_for_sockets(group)
            if group:
                self._cut_stage(group, stage, tilts)
        self._finish(holes)
        match_drill_rows(self, holes)
        exit_rows(self)

    def _wait_for_sockets(self, holes: list[Hole]) -> None:
        """A hole that breaks into a socket drilled from another face waits for that socket:
        a step saying so, in the face's own order (a template is read top to bottom)."""
        socket_of = {s.id: s.socket_hole for s in self.plan.spreaders}
        others = []
        for h in holes:
            sid = socket_of.get(h.spreader) if h.kind == HoleKind.SET_SCREW else None
            if sid and self.plan.hole(sid).face != self.face and sid not in others:
                others.append(sid)
        if others:
            faces = sorted({self.plan.hole(s).face for s in others}, key=lambda f: [x.id for x in self.plan.faces].index(f))
            self.add("wait", others, "-", stage=STAGE_HOLES,
                     note=f"cut sockets {', '.join(others)} first, from their own faces ({', '.join(faces)}),"
                          " then come back to the steps below")

    def _cut_stage(self, holes: list[Hole], stage: int, tilts: dict[str, float]) -> None:
        plans = []
        for h in sorted(holes, key=lambda x: (x.diameter_mm, x.id)):
            depth = h.depth_mm
            c = cutter_for(h.diameter_mm, h.drill, depth, h.through, self.mclass, self.series, self.units)
            plans.append((h, c))
        pilots: dict[tuple, list[Hole]] = {}
        for h, c in plans:
            if c.method == "cut" and c.drill is None:
                continue  # a Forstner bit's spur, a hole saw's arbor drill or a step drill's tip starts it
            first = c.drill.diameter_mm if c.drill is not None else h.diameter_mm
            if needs_pilot(first, self.units):
                p = pilot_drill(first, self.series)
                pilots.setdefault((p.label(self.units), p.diameter_mm, self._depth_key(h)), []).append(h)
        for (label, dia, (depth, through, tilt)), hs in pilots.items():
            limit = format_length(PILOT_ABOVE_MM[self.units], self.units)
            self.add("pilot", hs, label, dia, depth, through, stage, tilt,
                     "; ".join(x for x in (f"drills over {limit} need one", self.reach(dia, hs[0])) if x))
        groups: dict[tuple, list[tuple[Hole, object]]] = {}
        for h, c in plans:
            key = (c.method, c.drill.label(self.units) if c.drill else "", c.tool, round(h.diameter_mm, 4),
                   self._depth_key(h))
            groups.setdefault(key, []).append((h, c))
        for (method, dlabel, tool, dia, (depth, through, tilt)), pairs in groups.items():
            hs = [h for h, _ in pairs]
            h0, c0 = pairs[0]
            why = self._why(h0)
            extra = "; ".join(x for x in (why, self.breaks_into_all(hs), self._point_note(h0)) if x)
            if method == "drill":
                self.add("drill", hs, drill_label(h0.drill, h0.diameter_mm, self.units), c0.drill.diameter_mm,
                         depth, through, stage, tilt,
                         "; ".join(x for x in (extra, self.reach(c0.drill.diameter_mm, h0)) if x))
            elif method == "open_up":
                self.add("drill", hs, c0.drill.label(self.units), c0.drill.diameter_mm, depth, through, stage, tilt,
                         "; ".join(x for x in (f"under size for {self.L(h0.diameter_mm)}", extra,
                                               self.reach(c0.drill.diameter_mm, h0)) if x))
                self.add("open_up", hs, tool, h0.diameter_mm, depth, through, stage, tilt,
                         "; ".join(x for x in (f"to {self.L(h0.diameter_mm)}", c0.note, extra) if x))
            else:
                self.add("cut", hs, tool, h0.diameter_mm, depth, through, stage, tilt,
                         "; ".join(x for x in (f"{self.L(h0.diameter_mm)}", c0.note, extra) if x))

    def tap_reach(self, thread: str, depth_mm: float, run_on_mm: float = 0.0) -> str:
        """What a thread this deep needs beyond a hand tap (DIN 371 / ASME B94.9, from memory)."""
        from generators.standards.drill_lengths import hand_tap_reach_mm

        reach = hand_tap_reach_mm(thread)
        total = depth_mm + run_on_mm
        if reach is None or total <= reach + 1e-9:
            return ""
        where = (f"{self.L(total)} ({self.L(depth_mm)} and the {self.L(run_on_mm)} run-on)" if run_on_mm > 0
                 else self.L(total))
        return (f"{where} is past a hand tap's reach of about {self.L(reach)} (its length"
                " less the square in the wrench): a tap extension or a long-shank (pulley) tap")

    def _cbore_note(self, h: Hole, dia: float, depth: float) -> str:
        """A counterbore sinks a socket head cap screw's head (height = D, ISO 4762 k max /
        ASME B18.3, from memory) only when it is that deep; a shallower one is a spot face
        that lets the stock screw reach."""
        from generators.standards.threads import parse_thread

        head = parse_thread(h.thread).major_mm if h.thread else 0.0
        if head and depth < head - 1e-6:
            return (f"{self.L(dia)} across, a spot face so the stock screw reaches; its head stands"
                    f" {self.L(head - depth)} proud")
        return f"{self.L(dia)} across, head below the surface"

    def _point_note(self, h: Hole) -> str:
        """Where a blind twist-drilled hole's depth is taken, and how far its point runs on."""
        if h.flat_bottom:
            return ("then square the floor flat with an end mill or a flat-bottom drill of the size (a"
                    " drill point here would come too near the bore)")
        if h.point_deg is None or h.through:
            return ""
        tip = h.radius_mm / math.tan(math.radians(h.point_deg / 2))
        return f"depth to the full diameter; the {h.point_deg:g} deg point goes {self.L(tip)} further"

    def _tap_on(self, hs: list[Hole]) -> str:
        """A thread that ends where its hole breaks into a socket or the bore: the tap's chamfer
        cuts only part threads over its first 3 to 5 pitches (common practice), so it runs on
        into the void until full threads fill the wall."""
        ends = [h for h in hs if h.kind in (HoleKind.SET_SCREW, HoleKind.CLAMP) and h.tapped is not None]
        if not ends or len(ends) != len(hs):
            return ""
        into = "the socket" if all(h.kind == HoleKind.SET_SCREW for h in hs) else "the bore"
        return (f"run the tap on into {into} until its full threads are through the wall (a plug tap's"
                " chamfer cuts only part threads over its first 3 to 5 pitches), then deburr inside")

    def _depth_key(self, h: Hole) -> tuple:
        tilt = hole_tilt_deg(self.plan, h)
        return (None if h.through else round(h.depth_mm, 4), h.through, round(tilt, 2) if tilt > 0 else None)

    def _why(self, h: Hole) -> str:
        if h.thread:
            return f"tap drill for {h.thread}"
        if h.kind == HoleKind.SOCKET:
            return "spreader socket"
        if h.kind == HoleKind.BORE:
            return "mast bore"
        if h.kind == HoleKind.U_BOLT:
            return "U-bolt leg clearance"
        if h.kind == HoleKind.PIN:
            return pin_why(h)
        if h.countersink is not None or h.counterbore is not None:
            return "screw clearance"
        return "plain hole"

    def _finish(self, holes: list[Hole]) -> None:
        from generators.standards.threads import parse_thread

        clears: dict[tuple, list[Hole]] = {}
        for h in holes:
            run = h.tapped
            if h.thread and run is not None and run.clear_mm is not None and h.kind not in POCKET_KINDS:
                clears.setdefault((run.clear_drill, round(run.clear_mm, 4), round(run.start_mm, 4),
                                   self._depth_key(h)[2]), []).append(h)
        for (drill, dia, depth, tilt), hs in clears.items():
            note = "; ".join(x for x in (f"clearance for the {hs[0].thread} screw down to its thread",
                                         self.reach(dia, replace(hs[0], depth_mm=depth, through=False))) if x)
            self.add("drill", hs, drill_label(drill, dia, self.units), dia, depth, False, STAGE_HOLES, tilt, note)
        taps: dict[tuple, list[Hole]] = {}
        for h in holes:
            if h.thread and h.kind not in POCKET_KINDS:
                start = h.tapped.start_mm if h.tapped is not None else 0.0
                depth = start + tap_depth_mm(h, self.mclass)
                taps.setdefault((h.thread, None if h.through else round(depth, 4), h.through,
                                 h.thread_percent, round(start, 4)), []).append(h)
        for (thread, depth, through, pct, start), hs in taps.items():
            blind = not through and all(h.kind == HoleKind.EXTRA for h in hs)
            notes = [f"{pct:.0f}% thread" if pct else "", "finish with a bottoming tap" if blind else "",
                     self._tap_on(hs),
                     f"thread only the last {self.L(depth - start)} ({self.L(start)} to {self.L(depth)} from"
                     " the face), through the clearance hole with "
                     + ("a reduced-shank tap (DIN 376) or a pulley tap, whose shank passes it (a DIN 371"
                        " tap's shank is about the thread's size)" if thread.upper().startswith("M") else
                        "a pulley (long-shank) tap, whose shank passes it (a standard tap's shank is about the"
                        " thread's size)")
                     if start > 0 else "",
                     self.tap_reach(thread, depth if not through else max(h.depth_mm for h in hs),
                                    RUN_ON_PITCHES * parse_thread(thread).pitch_mm if self._tap_on(hs) else 0.0),
                     "tap straight, back off every turn to break the chip"]
            self.add("tap", hs, f"{thread} tap", None, depth, through, STAGE_HOLES, None,
                     "; ".join(x for x in notes if x))
        sinks: dict[tuple, list[Hole]] = {}
        for h in holes:
            if h.countersink is not None:
                sinks.setdefault(("countersink", f"{h.countersink.angle_deg:g} deg countersink",
                                  h.countersink.diameter_mm, None), []).append(h)
            if h.counterbore is not None:
                sinks.setdefault(("counterbore", "counterbore (piloted) or end mill",
                                  h.counterbore.diameter_mm, h.counterbore.depth_mm), []).append(h)
        for (op, tool, dia, depth), hs in sinks.items():
            note = (f"to {self.L(dia)} across, screw head flush" if op == "countersink"
                    else self._cbore_note(hs[0], dia, depth))
            self.add(op, hs, tool, dia, depth, False, STAGE_HOLES, None, note)


# A tap run on through a wall goes about 4 pitches past it before its full threads fill the
# wall (a plug tap's chamfer is 3 to 5 pitches, common practice).
RUN_ON_PITCHES = 4.0


def tap_depth_mm(h: Hole, material_class: str) -> float:
    """How long a tapped hole is threaded: the plan's thread run (``Hole.tapped``).

    Set-screw and clamp holes are threaded only over their engagement plus the tap's lead,
    ending at the socket or bore wall (generators/plan/screws.py); a blind extra hole over
    its engagement plus lead (1.5 D metals, 2.5 D plastics and wood, 2 pitches of lead;
    generators.standards.engagement, common practice), never more than it is drilled."""
    from generators.standards.engagement import tap_depth_mm as needed

    if h.tapped is not None:
        return h.tapped.length_mm
    if h.kind == HoleKind.EXTRA and not h.through:
        return min(h.depth_mm, needed(h.thread, material_class))
    return h.depth_mm


class _Printed(_Face):
    def fill(self) -> None:
        holes = self.holes
        if self.face == self._print_face():
            self.add("print", [], "printer", stage=STAGE_MARK,
                     note="print with the bottom face on the bed, as modelled; no support needed")
        cleared = [h for h in holes if h.profile in ("teardrop", "hex") or h.kind in POCKET_KINDS]
        if cleared:
            self.add("clear", cleared, "deburring blade or hobby knife", stage=min(stage_of(h) for h in cleared),
                     note="trim strings and any sag from teardrop roofs and nut slots")
        round_ = [h for h in holes if h.kind not in POCKET_KINDS]
        by_size: dict[float, list[Hole]] = {}
        for h in round_:
            by_size.setdefault(round(h.diameter_mm - h.compensation_mm, 4), []).append(h)
        for designed, hs in sorted(by_size.items()):
            comp = hs[0].compensation_mm
            self.add("check", hs, "caliper", designed, None, False, stage_of(hs[0]), None,
                     f"designed {self.L(designed)}" + (f" (modelled {self.L(designed + comp)} to print true)"
                                                      if comp else ""))
        for h in holes:
            if h.kind == HoleKind.NUT_POCKET:
                self.add("fit_nut", [h], h.nut or f"{h.thread} hex nut", h.across_flats_mm, None, False,
                         STAGE_HOLES, None, f"for {h.serves}: push it in from the slot on the {h.face} face until it"
                                            " lines up with the hole; a screw through pulls it home")
            elif h.kind == HoleKind.INSERT_POCKET:
                self.add("press_insert", [h], h.insert or f"{h.thread} heat-set insert", h.diameter_mm, h.depth_mm,
                         False, STAGE_HOLES, None,
                         f"for {h.serves}: press in square with a soldering iron and insert tip, about 220-250 C"
                         " for PETG (common practice; follow the insert maker's figure), flush with the face")
        match_drill_rows(self, holes)

        self.rows.sort(key=lambda r: r["stage"])  # stable: the bore, then sockets, then the rest

    def _print_face(self) -> str:
        faces = faces_with_work(self.plan)
        return "bottom" if "bottom" in faces else faces[0]
