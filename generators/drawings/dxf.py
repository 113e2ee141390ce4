"""A sheet as a 1:1 DXF: the face drawing, its hole table, drilling order, notes and scale bars.

Drawn in millimetres, or in inches when the config's ``units`` is ``"in"`` (``$INSUNITS``
and ``$MEASUREMENT`` say which). The face datum is the DXF origin.
"""

from __future__ import annotations

import contextlib
import textwrap
from collections import OrderedDict
from collections.abc import Iterator
from pathlib import Path

import ezdxf
from ezdxf.enums import TextEntityAlignment

from generators.drawings import sheet as S
from generators.units import MM_PER_IN

# AutoCAD colour index per layer.
LAYER_COLORS = {S.OUTLINE: 7, S.HOLES: 1, S.CENTERS: 7, S.CSK_CBORE: 3, S.LABELS: 7, S.HOLE_TABLE: 8,
                S.SCALE_BARS: 5, S.NOTES: 8, S.DATUM: 5, S.DRILL_DIRECTION: 6}
# $INSUNITS: 4 millimetres, 1 inches; $MEASUREMENT: 1 metric, 0 imperial (DXF reference).
INSUNITS = {"mm": 4, "in": 1}
MEASUREMENT = {"mm": 1, "in": 0}
TABLE_TEXT_MM = 2.5
TABLE_ROW_MM = 4.5
NOTE_WIDTH = 90  # characters a line in the drilling order and notes

_V = {"bottom": "BOTTOM", "center": "MIDDLE", "top": "TOP"}
_H = {"left": "LEFT", "center": "CENTER", "right": "RIGHT"}
_ALIGN = {(h, v): TextEntityAlignment[f"{_V[v]}_{_H[h]}"] for h in _H for v in _V}


@contextlib.contextmanager
def _fixed_metadata() -> Iterator[None]:
    """Fixed handles, dates and GUIDs, so the same plan writes the same bytes."""
    before = ezdxf.options.write_fixed_meta_data_for_testing
    ezdxf.options.write_fixed_meta_data_for_testing = True
    try:
        yield
    finally:
        ezdxf.options.write_fixed_meta_data_for_testing = before


class _Writer:
    def __init__(self, units: str):
        self.units = units
        self.k = 1.0 / MM_PER_IN if units == "in" else 1.0
        self.doc = ezdxf.new("R2010", setup=True)
        self.doc.header["$INSUNITS"] = INSUNITS[units]
        self.doc.header["$MEASUREMENT"] = MEASUREMENT[units]
        self.doc.header["$LUNITS"] = 2  # decimal
        for name in S.LAYERS:
            self.doc.layers.add(name, color=LAYER_COLORS[name])
        self.msp = self.doc.modelspace()

    def p(self, pt):
        return (pt[0] * self.k, pt[1] * self.k)

    def attrs(self, layer: str, dashed: bool = False) -> dict:
        a = {"layer": layer}
        if dashed:
            a["linetype"] = "DASHED"
            a["ltscale"] = 0.2 if self.units == "mm" else 0.2 / MM_PER_IN
        return a

    def item(self, it) -> None:
        if isinstance(it, S.Line):
            self.msp.add_line(self.p(it.a), self.p(it.b), dxfattribs=self.attrs(it.layer, it.dashed))
        elif isinstance(it, S.Circle):
            self.msp.add_circle(self.p(it.c), it.r * self.k, dxfattribs=self.attrs(it.layer))
        elif isinstance(it, S.Poly):
            self.msp.add_lwpolyline([self.p(q) for q in it.pts], close=it.closed,
                                    dxfattribs=self.attrs(it.layer, it.dashed))
        else:
            self.text(it.layer, it.at, it.text, it.size, it.halign, it.valign, it.rotation)

    def text(self, layer, at, text, size_mm, halign="left", valign="bottom", rotation=0.0) -> None:
        # DXF text height is the cap height, about 0.72 of the em size the sheet gives
        t = self.msp.add_text(text, height=0.72 * size_mm * self.k,
                              dxfattribs={"layer": layer, "rotation": rotation})
        t.set_placement(self.p(at), align=_ALIGN[(halign, valign)])


def write_sheet_dxf(sheet: S.Sheet, path: Path, heading: str) -> None:
    """Write one face's template as DXF."""
    with _fixed_metadata():
        w = _Writer(sheet.units)
        for it in sheet.items:
            w.item(it)
        x0, y0, x1, y1 = sheet.bbox()
        w.text(S.LABELS, (x0, y1 + 9.0), heading, 4.0)
        w.text(S.LABELS, (x0, y1 + 4.0), sheet.title, 3.0)
        # scale bars under the drawing: one straight segment each
        for k, (length, name) in enumerate(((100.0, "100 mm"), (4 * MM_PER_IN, "4 in"))):
            y = y0 - 12.0 - 10.0 * k
            w.msp.add_line(w.p((x0, y)), w.p((x0 + length, y)), dxfattribs={"layer": S.SCALE_BARS})
            for x in (x0, x0 + length):
                w.msp.add_line(w.p((x, y - 2.0)), w.p((x, y + 2.0)), dxfattribs={"layer": S.SCALE_BARS})
            w.text(S.SCALE_BARS, (x0 + length + 3.0, y), f"{name} scale bar", 3.0, "left", "center")
        w.text(S.SCALE_BARS, (x0, y0 - 33.0), "print at 100 % / actual size - measure the bar before drilling",
               3.0)
        w.text(S.LABELS, (x0, y0 - 38.0), "clamp the work; wear eye protection; keep masts clear of power lines",
               2.5)
        # hole table to the right of the drawing, drilling order and notes below it
        tx = x1 + 12.0
        rows = sheet.table
        widths = [max(len(r[i]) for r in rows) for i in range(len(rows[0]))]
        char = 0.62 * TABLE_TEXT_MM  # a generous CAD-font character width
        y = y1
        w.text(S.HOLE_TABLE, (tx, y), "Hole table", 3.5)
        y -= TABLE_ROW_MM + 1.0
        for n, r in enumerate(rows):
            x = tx
            for i, cell in enumerate(r):
                w.text(S.HOLE_TABLE, (x, y), cell, TABLE_TEXT_MM)
                x += (widths[i] + 2) * char
            if n == 0:
                w.msp.add_line(w.p((tx, y - 1.2)), w.p((x, y - 1.2)), dxfattribs={"layer": S.HOLE_TABLE})
            y -= TABLE_ROW_MM
        y -= TABLE_ROW_MM
        for head, lines in (("Drilling order", [f"{i}. {s}" for i, s in enumerate(sheet.steps, 1)]),
                            ("Notes", [f"- {s}" for s in sheet.notes])):
            w.text(S.NOTES, (tx, y), head, 3.5)
            y -= TABLE_ROW_MM + 1.0
            for line in lines:
                for part in textwrap.wrap(line, NOTE_WIDTH, subsequent_indent="   "):
                    w.text(S.NOTES, (tx, y), part, TABLE_TEXT_MM)
                    y -= TABLE_ROW_MM
            y -= TABLE_ROW_MM
        stable_classes(w.doc)
        w.doc.saveas(path)


def stable_classes(doc) -> None:
    """Sort the CLASSES section: ezdxf adds the classes in use from a set, whose order changes
    with Python's hash seed, and the same sheet would write different bytes run to run."""
    doc.classes.add_required_classes(doc.dxfversion)
    doc.classes.classes = OrderedDict(sorted(doc.classes.classes.items()))
