"""One drill-template sheet per face, as plain drawing primitives in face millimetres.

A sheet is built from the plan alone: every hole drawn is a hole of the plan on that
face. The DXF writer and the PDF renderer both draw the same sheet, so the two agree.
No ezdxf or matplotlib here.

Sheet frame: ``u`` to the right and ``v`` up looking at the face from outside, from the
face datum (the plan's face origin: the mast axis on the top and bottom faces, the middle
of the bottom edge on a side face). The rim of a puck is unrolled into a wrap strip:
``u`` is the arc length counter-clockwise (seen from above) from the join, ``v`` the
height above the bottom face.
"""

from __future__ import annotations

import math

from generators.drawings.frames import Frame, Tilt, rim_join_azimuth, tilt_of
from generators.drawings.primitives import (  # noqa: F401 - the sheet's vocabulary, used by its readers
    CENTERS, CROSS_EXTRA_MM, CSK_CBORE, DATUM, DATUM_ARROW_MM, DRILL_DIRECTION, GLUE_TAB_MM, HOLE_TABLE, HOLES,
    LABEL_MM, LABELS, LAYERS, NOTES, OUTLINE, SCALE_BARS, SMALL_MM, TILT_MIN_DEG, UNIT_WORDS, Circle, Item,
    Label, Line, Poly, Sheet, coord, extent, id_list, item_extent, size, text_extent)
from generators.drawings.prose import SheetProse, info_lines  # noqa: F401
from generators.plan.geometry import Pt
from generators.plan.model import Face, Hole, HubPlan
from generators.plan.operation_text import step_sentence
from generators.plan.pin import exits_on
from generators.plan.shop import drill_series


# ---- building a sheet -------------------------------------------------------------------

def faces_with_holes(plan: HubPlan) -> list[Face]:
    """Faces a hole enters, and the faces a through pin leaves by (marked there so a pin
    too long for one drill can be drilled half from each face in line)."""
    used = {h.face for h in plan.holes} | {h.exit_face for h in plan.holes if h.kind == "pin" and h.exit_face}
    return [f for f in plan.faces if f.id in used]


def build_sheets(plan: HubPlan, cfg, operations) -> list[Sheet]:
    """One sheet a face with holes; its drilling order is the design's operations for it."""
    return [_SheetBuilder(plan, cfg, f, [op for op in operations if op.face == f.id]).build()
            for f in faces_with_holes(plan)]


class _SheetBuilder(SheetProse):
    def __init__(self, plan: HubPlan, cfg, face: Face, operations):
        self.plan, self.cfg, self.face = plan, cfg, face
        self.operations = operations
        self.units = cfg.units
        self.series = drill_series(cfg)
        self.holes = plan.holes_on(face.id) + exits_on(plan, face.id)  # a pin's far end, where this face has a sheet
        if face.kind == "rim":
            radius = face.rim_radius_mm if face.rim_radius_mm is not None else plan.body.diameter_mm / 2
            self.frame = Frame(face, radius, rim_join_azimuth(self.holes))
        else:
            self.frame = Frame(face)
        self.items: list[Item] = []
        self.notes: list[str] = []

    def fmt(self, mm: float) -> str:
        return size(mm, self.units)

    def build(self) -> Sheet:
        sheet = Sheet(face=self.face, name=self.face.id, title=self._title(), units=self.units,
                      frame=self.frame.record())
        self._outline()
        self._orientation()
        self._marks()
        self._datum()
        tilts = {}
        for h in self.holes:
            u, v = self.frame.uv(h.entry_mm)
            sheet.positions[h.id] = (u, v)
            self._hole(h, u, v)
            t = tilt_of(self.frame, h)
            if t is not None:
                tilts[h.id] = t
                self._tilt_arrow(h, u, v, t)
        self._tilt_insets(tilts, sheet.positions)
        sheet.items = self.items
        sheet.table = self._table(sheet.positions, tilts)
        sheet.steps = [step_sentence(op, self.units) for op in self.operations]
        sheet.notes = self._notes(tilts)
        return sheet

    # -- what the sheet says about itself
    def _outline(self):
        f, body = self.face, self.plan.body
        if f.kind in ("top", "bottom") and body.style == "puck":
            self.items.append(Circle(OUTLINE, (0.0, 0.0), body.diameter_mm / 2))
        elif f.kind == "rim":
            C, T = 2 * math.pi * self.frame.radius_mm, max(p[1] for p in f.outline)
            self.items.append(Poly(OUTLINE, ((0.0, 0.0), (C, 0.0), (C, T), (0.0, T))))
            self._wrap_marks(C, T)
        else:
            self.items.append(Poly(OUTLINE, tuple(f.outline)))

    def _wrap_marks(self, C: float, T: float):
        tab = GLUE_TAB_MM
        self.items.append(Poly(NOTES, ((C, 0.0), (C + tab, 2.0), (C + tab, T - 2.0), (C, T)), closed=False,
                               dashed=True))
        self.items.append(Label(NOTES, (C + tab / 2, T / 2), "tab", SMALL_MM, "center", "center"))
        for x, side in ((0.0, "left"), (C, "right")):
            # a join mark: a triangle pointing at the join line from below and above the strip
            for y0, y1 in ((-1.0, -5.0), (T + 1.0, T + 5.0)):
                self.items.append(Poly(LABELS, ((x, y0), (x - 2.0, y1), (x + 2.0, y1))))
            self.items.append(Label(LABELS, (x + (1.5 if side == "left" else -1.5), T + 5.5),
                                    "JOIN: meets the other JOIN mark", SMALL_MM,
                                    "left" if side == "left" else "right", "bottom"))
        # azimuth ticks along the bottom edge every 15 deg, labelled every 45 deg
        R = self.frame.radius_mm
        start = math.ceil(self.frame.join_deg / 15) * 15
        for k in range(25):
            az = start + 15 * k
            u = R * math.radians((az - self.frame.join_deg) % 360)
            if u > C - 1e-6 or (k > 0 and u < 1e-6):
                continue
            self.items.append(Line(LABELS, (u, 0.0), (u, -2.5 if az % 45 else -4.0)))
            if az % 45 == 0:
                self.items.append(Label(LABELS, (u, -4.5), f"{az % 360:g} deg", SMALL_MM, "center", "top"))
        for x in (C / 4, 3 * C / 4):
            self.items.append(Label(LABELS, (x, T + 1.0), "top face edge", SMALL_MM, "center", "bottom"))

    def _orientation(self):
        f, body = self.face, self.plan.body
        if f.kind in ("top", "bottom"):
            # spreader names just inside the edge they face, written along it
            r = body.outer_radius_mm - 1.5
            z = f.origin[2]
            for s in self.plan.spreaders:
                t = math.radians(s.azimuth_deg)
                p = (r * math.cos(t), r * math.sin(t), z)
                u, v = f.to_face(p)
                q = f.to_face((p[0] - math.sin(t), p[1] + math.cos(t), z))
                rot = math.degrees(math.atan2(q[1] - v, q[0] - u))
                rot = (rot + 90) % 180 - 90  # keep it readable
                # the side of the text towards the centre: top of the text when the baseline is outside
                inward = (-u, -v)
                up = (-math.sin(math.radians(rot)), math.cos(math.radians(rot)))
                va = "top" if inward[0] * up[0] + inward[1] * up[1] < 0 else "bottom"
                self.items.append(Label(LABELS, (u, v), f"spreader {s.id} side", LABEL_MM, "center", va, rot))
            if body.style == "puck":
                rim_holes = self.plan.holes_on("rim")
                if rim_holes:
                    join = rim_join_azimuth(rim_holes)
                    t = math.radians(join)
                    R = body.diameter_mm / 2
                    a = f.to_face((R * math.cos(t), R * math.sin(t), z))
                    b = f.to_face(((R + 6) * math.cos(t), (R + 6) * math.sin(t), z))
                    self.items.append(Line(LABELS, a, b))
                    self.items.append(Label(LABELS, (b[0], b[1] - 0.5), "strip join", SMALL_MM,
                                            "left" if b[0] >= 0 else "right", "top"))
        elif f.kind in ("flat", "chamfer"):
            x0, y0, x1, y1 = extent([Poly(OUTLINE, tuple(f.outline))])
            self.items.append(Label(LABELS, ((x0 + x1) / 2, y1 + 1.0), "this edge towards the top face",
                                    SMALL_MM, "center", "bottom"))
            self.items.append(Label(LABELS, (x0, y0 - 4.0), "bottom face edge", SMALL_MM, "left", "top"))

    def _marks(self):
        """The plan's scribe lines on this face (a plate's pole stops and footprints)."""
        for m in getattr(self.plan, "marks", ()):
            if m.face != self.face.id:
                continue
            a, b = self.frame.uv(m.a), self.frame.uv(m.b)
            self.items.append(Line(NOTES, a, b, dashed=m.dashed))
            if m.label:
                self.items.append(Label(LABELS, (b[0] + 1.0, b[1] + 1.0), m.label, SMALL_MM))

    def _datum(self):
        L = DATUM_ARROW_MM
        self.items.append(Circle(DATUM, (0.0, 0.0), 1.5))
        for (dx, dy), name in (((1, 0), "X"), ((0, 1), "Y")):
            tip = (dx * L, dy * L)
            self.items.append(Line(DATUM, (0.0, 0.0), tip))
            px, py = -dy, dx
            self.items.append(Line(DATUM, tip, (tip[0] - 2 * dx + 0.8 * px, tip[1] - 2 * dy + 0.8 * py)))
            self.items.append(Line(DATUM, tip, (tip[0] - 2 * dx - 0.8 * px, tip[1] - 2 * dy - 0.8 * py)))
            self.items.append(Label(DATUM, (tip[0] + 0.6 * dx + 0.6 * dy, tip[1] + 0.6 * dy + 0.3 * dx), name,
                                    SMALL_MM, "left", "bottom" if dx else "bottom"))
        self.items.append(Label(DATUM, (-1.2, -1.2), "0,0", SMALL_MM, "right", "top"))

    def _hole(self, h: Hole, u: float, v: float):
        r = h.radius_mm
        self.items.append(Circle(HOLES, (u, v), r, hole=h.id))
        a = r + CROSS_EXTRA_MM
        self.items.append(Line(CENTERS, (u - a, v), (u + a, v)))
        self.items.append(Line(CENTERS, (u, v - a), (u, v + a)))
        outer = r
        if h.countersink is not None:
            self.items.append(Circle(CSK_CBORE, (u, v), h.countersink.diameter_mm / 2))
            outer = max(outer, h.countersink.diameter_mm / 2)
        if h.counterbore is not None:
            self.items.append(Circle(CSK_CBORE, (u, v), h.counterbore.diameter_mm / 2))
            outer = max(outer, h.counterbore.diameter_mm / 2)
        if h.tapped is not None and h.tapped.clear_mm is not None:  # the clearance before the thread
            self.items.append(Circle(CSK_CBORE, (u, v), h.tapped.clear_mm / 2))
            outer = max(outer, h.tapped.clear_mm / 2)
        d = outer * math.sqrt(0.5) + 0.6
        text = h.id
        if self.face.kind == "rim":
            az = math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) % 360
            text = f"{h.id} {az:g} deg"
        self.items.append(Label(LABELS, (u + d, v + d), text, LABEL_MM))

    def _tilt_arrow(self, h: Hole, u: float, v: float, t: Tilt):
        """The drill direction drawn on the face: the line the tip travels under the paper,
        and the mouth the tilted drill leaves (an ellipse)."""
        run = h.depth_mm * math.sin(math.radians(t.deg))
        end = (u + t.du * run, v + t.dv * run)
        self.items.append(Line(DRILL_DIRECTION, (u, v), end))
        px, py = -t.dv, t.du
        back = (end[0] - 2.5 * t.du, end[1] - 2.5 * t.dv)
        self.items.append(Line(DRILL_DIRECTION, end, (back[0] + px, back[1] + py)))
        self.items.append(Line(DRILL_DIRECTION, end, (back[0] - px, back[1] - py)))
        r = h.radius_mm
        a_long = r / math.cos(math.radians(t.deg))
        pts = []
        for k in range(72):
            th = 2 * math.pi * k / 72
            x, y = a_long * math.cos(th), r * math.sin(th)  # x along the tilt direction
            pts.append((u + x * t.du + y * px, v + x * t.dv + y * py))
        self.items.append(Poly(DRILL_DIRECTION, tuple(pts), dashed=True))

    def _tilt_insets(self, tilts: dict[str, Tilt], positions: dict[str, Pt]):
        """A true-angle section beside the face for each distinct tilt: set a bevel from it."""
        groups: dict[tuple, list[str]] = {}
        for hid, t in tilts.items():
            if abs(t.du) < 1e-6:  # tilted up or down the face: the section is a side view
                groups.setdefault((round(t.deg, 2), t.dv < 0), []).append(hid)
        if not groups:
            return
        x0, y0, x1, y1 = extent(self.items)
        T = self.plan.body.thickness_mm
        wide = (x1 - x0) > 2.5 * max(y1 - y0, 1.0)  # a wrap strip: sections go below it
        ox, oy = (x0, y0 - 14.0 - T) if wide else (x1 + 14.0, self.face.outline[0][1])
        for (deg, down), ids in groups.items():
            h = self.plan.hole(ids[0])
            v_e = positions[ids[0]][1]
            e = math.radians(deg)
            run = h.depth_mm * math.cos(e)
            span = run + 6.0
            sgn = -1.0 if down else 1.0

            def P(s, z, ox=ox, oy=oy):  # s inward from the face, z above the bottom face
                return (ox + s, oy + z)

            self.items.append(Line(DRILL_DIRECTION, P(0, 0), P(0, T)))
            self.items.append(Line(DRILL_DIRECTION, P(0, T), P(span, T)))
            self.items.append(Line(DRILL_DIRECTION, P(0, 0), P(span, 0)))
            end = (run, v_e + sgn * h.depth_mm * math.sin(e))
            self.items.append(Line(DRILL_DIRECTION, P(0, v_e), P(*end)))
            half = h.radius_mm / math.cos(e)
            for side in (-1, 1):
                self.items.append(Line(DRILL_DIRECTION, P(0, v_e + side * half), P(end[0], end[1] + side * half),
                                       dashed=True))
            self.items.append(Line(DRILL_DIRECTION, P(0, v_e), P(min(span, 30.0), v_e), dashed=True))
            arc_r = min(20.0, run * 0.6)
            arc = tuple(P(arc_r * math.cos(a), v_e + sgn * arc_r * math.sin(a))
                        for a in [e * k / 12 for k in range(13)])
            self.items.append(Poly(DRILL_DIRECTION, arc, closed=False))
            self.items.append(Label(DRILL_DIRECTION, P(arc_r + 1.0, v_e + sgn * 1.0), f"{deg:g} deg",
                                    LABEL_MM, "left", "top" if down else "bottom"))
            self.items.append(Label(DRILL_DIRECTION, P(0, T + 1.5),
                                    f"section through {id_list(ids)}, true angle", SMALL_MM))
            self.items.append(Label(DRILL_DIRECTION, P(-1.0, T - 0.5), "face", SMALL_MM, "right", "top"))
            self.items.append(Label(DRILL_DIRECTION, P(span + 1.0, T), "top face", SMALL_MM, "left", "center"))
            self.items.append(Label(DRILL_DIRECTION, P(span + 1.0, 0), "bottom face", SMALL_MM, "left", "center"))
            if wide:
                ox += span + 40.0
            else:
                oy -= T + 14.0

    # -- words
