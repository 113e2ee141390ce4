"""The words on a template sheet: its title, hole table, depths and notes; and the text
block (hole table, drilling order, notes) the PDF prints beside the template."""

from __future__ import annotations

import math
import textwrap

from generators.drawings.frames import Tilt
from generators.drawings.primitives import UNIT_WORDS, Sheet, coord, id_list
from generators.plan.geometry import Pt
from generators.plan.model import Hole
from generators.plan.shop import drill_label
from generators.plan.tilt_notes import tilt_notes


class SheetProse:
    """Mixed into the sheet builder: everything it writes in words."""

    def _spreaders_near(self, az: float) -> str:
        sp = sorted(self.plan.spreaders, key=lambda s: s.azimuth_deg % 360)
        for s in sp:
            if abs(((s.azimuth_deg - az + 180) % 360) - 180) < 1e-6:
                return f"spreader {s.id} (socket {s.socket_hole})"
        before = max((s for s in sp if s.azimuth_deg % 360 < az % 360), default=sp[-1], key=lambda s: s.azimuth_deg % 360)
        after = min((s for s in sp if s.azimuth_deg % 360 > az % 360), default=sp[0], key=lambda s: s.azimuth_deg % 360)
        return f"between spreader {before.id} and spreader {after.id}"

    def _title(self) -> str:
        f = self.face
        if f.kind == "top":
            return "top face, seen from above"
        if f.kind == "bottom":
            return "bottom face, seen from below"
        if f.kind == "rim":
            return (f"rim wrap strip, seen from outside, from the join at azimuth {self.frame.join_deg:g} deg"
                    " counter-clockwise (seen from above)")
        return (f"{f.kind} face {f.id} at azimuth {f.azimuth_deg % 360:g} deg, {self._spreaders_near(f.azimuth_deg)},"
                " seen from outside")

    def _depth(self, h: Hole) -> str:
        if h.through:
            return "THRU"
        d = f"{coord(h.depth_mm, self.units)}"
        if h.kind == "clamp":
            return d + " into bore"
        if h.kind == "socket" and h.extend_mm > 0:
            return d + " to bore"
        if h.kind == "set_screw" and h.spreader is not None:
            sock = next((s.socket_hole for s in self.plan.spreaders if s.id == h.spreader), None)
            return d + (f" into {sock}" if sock else "")
        return d

    def _run_text(self, h: Hole) -> str:
        """Where a thread runs when it does not start at the entry, and the clearance before it."""
        run = h.tapped
        if not h.thread or run is None or run.start_mm <= 0:
            return ""
        u = self.units
        return (f"thread {coord(run.start_mm, u)}-{coord(run.end_mm, u)},"
                f" clear {coord(run.clear_mm, u)} x {coord(run.start_mm, u)}")

    def _drill_text(self, h: Hole) -> str:
        if h.drill:
            return drill_label(h.drill, h.diameter_mm, self.units)
        return f"bore {coord(h.diameter_mm, self.units)}"

    def _table(self, pos: dict[str, Pt], tilts: dict[str, Tilt]) -> list[tuple[str, ...]]:
        u = self.units
        head = ("hole", f"X {u}", f"Y {u}", "drill", f"depth {u}", "tap", "csk / cbore", "axis")
        rows = [head]
        for h in self.holes:
            x, y = pos[h.id]
            if h.countersink is not None:
                cs = f"csk {h.countersink.angle_deg:g} deg to {coord(h.countersink.diameter_mm, u)} {u}"
            elif h.counterbore is not None:
                cs = f"cbore {coord(h.counterbore.diameter_mm, u)} x {coord(h.counterbore.depth_mm, u)} {u}"
            else:
                cs = "-"
            t = tilts.get(h.id)
            axis = "square" if t is None else f"tilt {t.deg:.1f} deg"
            run = self._run_text(h)
            cs = run if cs == "-" and run else "; ".join(x for x in (cs, run) if x)
            rows.append((h.id, coord(x, u), coord(y, u), self._drill_text(h), self._depth(h), h.thread or "-", cs,
                         axis))
        return rows

    def _notes(self, tilts: dict[str, Tilt]) -> list[str]:
        f, u = self.face, self.units
        notes = []
        if f.kind == "top" and self.plan.body.style == "plate":
            notes.append("Up on the sheet is +Y of the plate, right is +X; each spreader's name is written on its"
                         " pole's footprint (dashed). Datum 0,0: the plate's centre. Each pole's cut end sits on"
                         " its stop line; the dashed line through the datum is the mast's axis, under the plate.")
        elif f.kind == "top":
            notes.append("Up on the sheet is +Y of the hub, right is +X; each spreader's name is written just inside"
                         " the edge its socket enters. Datum 0,0: the mast axis.")
        elif f.kind == "bottom":
            notes.append("Seen from below: right on the sheet is +X of the hub, up is -Y (a mirror of the top"
                         " view). Datum 0,0: the mast axis.")
        elif f.kind == "rim":
            C = 2 * math.pi * self.frame.radius_mm
            notes.append(f"Cut the strip out on its outline ({self.fmt(C)} long, {self.fmt(max(p[1] for p in f.outline))}"
                         " high) and wrap it round the rim, bottom edge on the bottom face, printed side out. The two"
                         " JOIN marks meet at azimuth"
                         f" {self.frame.join_deg:g} deg; glue the start over the tab.")
            notes.append("Datum 0,0: the join on the bottom edge; X runs along the strip counter-clockwise seen from"
                         " above, Y up. Hole labels give each hole's azimuth.")
        else:
            notes.append("Seen from outside with the top face up: the edge marked 'this edge towards the top face'"
                         " goes to the top face. Datum 0,0: the middle of the bottom edge.")
        notes.append(f"Hole table X and Y from the datum in {UNIT_WORDS[u]}, as printed (X right, Y up).")
        notes += tilt_notes(self.plan, self.cfg, self.face.id)
        for kind, what in (("set_screw", "the sockets"), ("clamp", "the bore")):
            ids = [h.id for h in self.holes if h.kind == kind]
            if ids:
                verb = "breaks" if len(ids) == 1 else "break"
                notes.append(f"{id_list(ids)} {verb} into {what}: cut {what} first and deburr inside.")
        return notes


def info_lines(sheet: Sheet, width: int) -> list[str]:
    rows = sheet.table
    cols = len(rows[0])
    widths = [max(len(r[i]) for r in rows) for i in range(cols)]
    out = ["Hole table"]
    for k, r in enumerate(rows):
        out.append("  ".join(c.ljust(widths[i]) for i, c in enumerate(r)).rstrip())
        if k == 0:
            out.append("  ".join("-" * w for w in widths))
    out.append("")
    out.append("Drilling order")
    for i, s in enumerate(sheet.steps, 1):
        lead = f"{i}. "
        out += textwrap.wrap(s, width, initial_indent=lead, subsequent_indent=" " * len(lead))
    out.append("")
    out.append("Notes")
    for s in sheet.notes:
        out += textwrap.wrap(s, width, initial_indent="- ", subsequent_indent="  ")
    return out
