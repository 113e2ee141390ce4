"""Drawing primitives of a template sheet (lines, circles, polygons, labels), the sheet itself,
and how numbers are written on it. No ezdxf or matplotlib here."""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

from generators.plan.geometry import Pt
from generators.plan.model import Face
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
from generators.plan.tilt_notes import TILT_MIN_DEG  # noqa: E402,F401
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
