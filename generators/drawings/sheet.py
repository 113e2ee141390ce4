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
import textwrap
from dataclasses import dataclass, field
from typing import Any

from generators.plan.geometry import Pt, Vec, dot
from generators.plan.model import Face, Hole, HubPlan
from generators.plan.operation_text import step_sentence
from generators.plan.shop import drill_label, drill_series
from generators.units import MM_PER_IN, format_length

# Layers (DXF) and element kinds (PDF).
OUTLINE = "OUTLINE"
HOLES = "HOLES"  # one circle per hole of the face, at its drilled diameter; nothing else
CENTERS = "CENTERS"
CSK_CBORE = "CSK_CBORE"
LABELS = "LABELS"
HOLE_TABLE = "HOLE_TABLE"
SCALE_BARS = "SCALE_BARS"
NOTES = "NOTES"
DATUM = "DATUM"
DRILL_DIRECTION = "DRILL_DIRECTION"
LAYERS = (OUTLINE, HOLES, CENTERS, CSK_CBORE, LABELS, HOLE_TABLE, SCALE_BARS, NOTES, DATUM, DRILL_DIRECTION)

LABEL_MM = 2.5  # text size of hole ids and edge notes
SMALL_MM = 2.0
CROSS_EXTRA_MM = 4.0  # crosshair arms run this far past the hole circle
DATUM_ARROW_MM = 8.0
# A hole is tilted when its axis leans more than this from square to its face.
TILT_MIN_DEG = 0.05
# The wrap strip runs on past the join by a glue tab that the start of the strip is laid over.
GLUE_TAB_MM = 12.0


@dataclass(frozen=True)
class Line:
    layer: str
    a: Pt
    b: Pt
    dashed: bool = False


@dataclass(frozen=True)
class Circle:
    layer: str
    c: Pt
    r: float
    hole: str | None = None  # the plan hole it draws (HOLES layer only)


@dataclass(frozen=True)
class Poly:
    layer: str
    pts: tuple[Pt, ...]
    closed: bool = True
    dashed: bool = False


@dataclass(frozen=True)
class Label:
    layer: str
    at: Pt
    text: str
    size: float = LABEL_MM
    halign: str = "left"  # left | center | right
    valign: str = "bottom"  # bottom | center | top
    rotation: float = 0.0  # degrees counter-clockwise about the anchor


Item = Line | Circle | Poly | Label


def text_extent(label: Label) -> tuple[float, float, float, float]:
    """An estimate of the label's box (DejaVu Sans: about 0.6 em a character)."""
    w = 0.6 * label.size * max(len(label.text), 1)
    h = label.size
    x0 = -{"left": 0.0, "center": w / 2, "right": w}[label.halign]
    y0 = -{"bottom": 0.0, "center": h / 2, "top": h}[label.valign]
    c, s = math.cos(math.radians(label.rotation)), math.sin(math.radians(label.rotation))
    xs, ys = [], []
    for x, y in ((x0, y0), (x0 + w, y0), (x0, y0 + h), (x0 + w, y0 + h)):
        xs.append(label.at[0] + x * c - y * s)
        ys.append(label.at[1] + x * s + y * c)
    return (min(xs), min(ys), max(xs), max(ys))


def item_extent(item: Item) -> tuple[float, float, float, float]:
    if isinstance(item, Line):
        return (min(item.a[0], item.b[0]), min(item.a[1], item.b[1]),
                max(item.a[0], item.b[0]), max(item.a[1], item.b[1]))
    if isinstance(item, Circle):
        return (item.c[0] - item.r, item.c[1] - item.r, item.c[0] + item.r, item.c[1] + item.r)
    if isinstance(item, Poly):
        xs, ys = [p[0] for p in item.pts], [p[1] for p in item.pts]
        return (min(xs), min(ys), max(xs), max(ys))
    return text_extent(item)


def extent(items) -> tuple[float, float, float, float]:
    boxes = [item_extent(i) for i in items]
    return (min(b[0] for b in boxes), min(b[1] for b in boxes),
            max(b[2] for b in boxes), max(b[3] for b in boxes))


@dataclass
class Sheet:
    """The template of one face: drawing, hole table, drilling order and notes."""

    face: Face
    name: str  # file stem: the face id
    title: str
    units: str
    items: list[Item] = field(default_factory=list)
    positions: dict[str, Pt] = field(default_factory=dict)  # hole id -> (u, v) mm
    table: list[tuple[str, ...]] = field(default_factory=list)  # header row first
    steps: list[str] = field(default_factory=list)
    notes: list[str] = field(default_factory=list)
    frame: dict[str, Any] = field(default_factory=dict)

    def bbox(self) -> tuple[float, float, float, float]:
        return extent(self.items)

    def info_lines(self, width: int) -> list[str]:
        """Hole table, drilling order and notes as monospaced lines at most ``width`` wide."""
        return info_lines(self, width)


# ---- numbers and names ------------------------------------------------------------------

def coord(mm: float, units: str) -> str:
    """A coordinate for the hole table, in the config's units without the unit."""
    value = round(mm / MM_PER_IN, 3) if units == "in" else round(mm, 2)
    value += 0.0  # no "-0.00"
    return f"{value:.3f}" if units == "in" else f"{value:.2f}"


UNIT_WORDS = {"mm": "millimetres", "in": "inches"}


def size(mm: float, units: str) -> str:
    """A size as shop people write it: ``20.5 mm``, ``0.770 in``."""
    return format_length(mm, units, fractions=False)


def id_list(ids: list[str]) -> str:
    return ", ".join(ids)


# ---- face frames ------------------------------------------------------------------------

def rim_join_azimuth(holes: list[Hole]) -> float:
    """Where the wrap strip starts: the middle of the widest gap between rim holes, so no
    hole is cut by the join."""
    if not holes:
        return 0.0
    azs = sorted(math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) % 360 for h in holes)
    best, join = -1.0, 0.0
    for i, a in enumerate(azs):
        b = azs[(i + 1) % len(azs)] + (360 if i == len(azs) - 1 else 0)
        if b - a > best + 1e-9:
            best, join = b - a, (a + (b - a) / 2) % 360
    return round(join, 6)


@dataclass(frozen=True)
class Frame:
    """Maps a 3D point on a face to sheet (u, v) mm, and gives the local face axes."""

    face: Face
    radius_mm: float | None = None  # rim only
    join_deg: float = 0.0  # rim only

    def uv(self, p: Vec) -> Pt:
        if self.face.kind != "rim":
            return self.face.to_face(p)
        az = (math.degrees(math.atan2(p[1], p[0])) - self.join_deg) % 360
        return (self.radius_mm * math.radians(az), p[2])

    def axes_at(self, p: Vec) -> tuple[Vec, Vec, Vec]:
        """(outward normal, u, v) of the face at ``p``."""
        f = self.face
        if f.kind != "rim":
            return f.normal, f.u_axis, f.v_axis
        t = math.atan2(p[1], p[0])
        return (math.cos(t), math.sin(t), 0.0), (-math.sin(t), math.cos(t), 0.0), (0.0, 0.0, 1.0)

    def record(self) -> dict[str, Any]:
        if self.face.kind == "rim":
            return {"kind": "rim", "radius_mm": self.radius_mm, "join_azimuth_deg": self.join_deg,
                    "u": "arc length counter-clockwise seen from above, from the join", "v": "height above the bottom face"}
        f = self.face
        return {"kind": "plane", "origin_mm": list(f.origin), "u_axis": list(f.u_axis), "v_axis": list(f.v_axis)}


@dataclass(frozen=True)
class Tilt:
    deg: float
    du: float  # unit in-plane direction the drill tip moves as it goes in
    dv: float
    towards: str  # "the bottom face", "the top face" or a direction on the sheet


def tilt_of(frame: Frame, hole: Hole) -> Tilt | None:
    n, u, v = frame.axes_at(hole.entry_mm)
    du, dv = dot(hole.axis, u), dot(hole.axis, v)
    s = math.hypot(du, dv)
    deg = math.degrees(math.asin(min(s, 1.0)))
    if deg < TILT_MIN_DEG:
        return None
    du, dv = du / s, dv / s
    side = frame.face.kind in ("flat", "chamfer", "rim")
    if side and abs(du) < 1e-6:
        towards = "the bottom face" if dv < 0 else "the top face"
    else:
        towards = f"{math.degrees(math.atan2(dv, du)) % 360:.1f} deg on the sheet (0 = right, 90 = up)"
    return Tilt(deg=deg, du=du, dv=dv, towards=towards)


# ---- building a sheet -------------------------------------------------------------------

def faces_with_holes(plan: HubPlan) -> list[Face]:
    used = {h.face for h in plan.holes}
    return [f for f in plan.faces if f.id in used]


def build_sheets(plan: HubPlan, cfg, operations) -> list[Sheet]:
    """One sheet a face with holes; its drilling order is the design's operations for it."""
    return [_SheetBuilder(plan, cfg, f, [op for op in operations if op.face == f.id]).build()
            for f in faces_with_holes(plan)]


class _SheetBuilder:
    def __init__(self, plan: HubPlan, cfg, face: Face, operations):
        self.plan, self.cfg, self.face = plan, cfg, face
        self.operations = operations
        self.units = cfg.units
        self.series = drill_series(cfg)
        self.holes = plan.holes_on(face.id)
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
                cs = f"csk {h.countersink.angle_deg:g} deg to {coord(h.countersink.diameter_mm, u)}"
            elif h.counterbore is not None:
                cs = f"cbore {coord(h.counterbore.diameter_mm, u)} x {coord(h.counterbore.depth_mm, u)}"
            else:
                cs = "-"
            t = tilts.get(h.id)
            axis = "square" if t is None else f"tilt {t.deg:.1f} deg"
            rows.append((h.id, coord(x, u), coord(y, u), self._drill_text(h), self._depth(h), h.thread or "-", cs,
                         axis))
        return rows

    def _jig_note(self) -> str:
        from generators.plan.jig import jig_reason

        if self.face.kind != "flat" or jig_reason(self.plan, self.cfg) is not None:
            return ""
        return (" The angle jig of this build (jig.dxf, jig.step, jig.stl) is that wedge: the hub on the flat"
                " opposite this one, bottom face against the fence.")

    def _notes(self, tilts: dict[str, Tilt]) -> list[str]:
        f, u = self.face, self.units
        notes = []
        if f.kind == "top":
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
            notes.append(f"Datum 0,0: the join on the bottom edge; X runs along the strip counter-clockwise seen from"
                         f" above, Y up. Hole labels give each hole's azimuth.")
        else:
            notes.append("Seen from outside with the top face up: the edge marked 'this edge towards the top face'"
                         " goes to the top face. Datum 0,0: the middle of the bottom edge.")
        notes.append(f"Hole table X and Y from the datum in {UNIT_WORDS[u]}, as printed (X right, Y up).")
        by_tilt: dict[tuple, list[str]] = {}
        for hid, t in tilts.items():
            by_tilt.setdefault((round(t.deg, 2), t.towards), []).append(hid)
        for (deg, towards), ids in by_tilt.items():
            if "face" in towards:
                high, low = (("top-face", "bottom face") if towards == "the bottom face"
                             else ("bottom-face", "top face"))
                notes.append(f"Tilt for {id_list(ids)}: the drill runs {deg:g} deg off square to the face, towards"
                             f" {towards}. With this face up, tilt the drill-press table {deg:g} deg so the {high}"
                             f" edge is higher, or lay the part on a {deg:g} deg wedge with its {low} towards the low"
                             f" end (against the fence), or use a drill guide set to {deg:g} deg. Spot and drill on the"
                             " crosshair with the work tilted. The arrow shows where the tip goes; the section beside"
                             " the face is at the true angle, to set a bevel from." + self._jig_note())
            else:
                notes.append(f"Tilt for {id_list(ids)}: the drill runs {deg:g} deg off square to the face, towards"
                             f" {towards}; use a drill guide or an angle plate set to {deg:g} deg.")
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
