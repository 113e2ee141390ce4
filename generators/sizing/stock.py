"""Stock sizes of plate and round bar for ``hubwright size --objective stock``.

A block hub is cut from plate: its thickness is a plate thickness, its outline is sawn from
the plate (any size). A puck is cut from round bar: its diameter is a bar diameter, its
thickness the length sawn off (any size). The stock objective is the volume of the blank
bought: the outline's bounding rectangle times the plate thickness, or the bar's section
times the length.

The size series below are from memory (typical stockist lists for engineering plastic and
aluminium plate and rod); a stockist's own list is what counts.
"""

from __future__ import annotations

import math

MM_PER_IN = 25.4

# from memory: typical metric plate thicknesses stocked in acetal, nylon, HDPE and 6061 (mm)
PLATE_MM = (3, 4, 5, 6, 8, 10, 12, 15, 16, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75, 80,
            90, 100, 110, 120, 130, 140, 150)
# from memory: typical inch plate thicknesses stocked in the same materials (in)
PLATE_IN = (0.125, 0.1875, 0.25, 0.375, 0.5, 0.625, 0.75, 0.875, 1.0, 1.25, 1.5, 1.75, 2.0,
            2.25, 2.5, 2.75, 3.0, 3.5, 4.0, 4.5, 5.0, 6.0)
# from memory: typical metric round bar diameters (mm)
ROD_MM = (10, 12, 15, 16, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75, 80, 90, 100, 110, 120,
          125, 130, 140, 150, 160, 170, 180, 200, 220, 250, 300)
# from memory: typical inch round bar diameters (in)
ROD_IN = (0.375, 0.5, 0.625, 0.75, 1.0, 1.25, 1.5, 1.75, 2.0, 2.25, 2.5, 2.75, 3.0, 3.25, 3.5,
          4.0, 4.5, 5.0, 5.5, 6.0, 6.5, 7.0, 8.0, 9.0, 10.0, 12.0)

SOURCE = "from memory: typical stockist plate and round-bar lists (check your stockist's list)"


def plate_thicknesses_mm(units: str) -> tuple[float, ...]:
    return tuple(t * MM_PER_IN for t in PLATE_IN) if units == "in" else tuple(float(t) for t in PLATE_MM)


def rod_diameters_mm(units: str) -> tuple[float, ...]:
    return tuple(d * MM_PER_IN for d in ROD_IN) if units == "in" else tuple(float(d) for d in ROD_MM)


def stock_series(key: str, style: str, units: str) -> tuple[float, ...] | None:
    """The stock sizes a varied key must take, or None when it is sawn to any size."""
    if key == "hub.thickness" and style in ("block", "plate"):
        return plate_thicknesses_mm(units)
    if key == "hub.diameter" and style == "puck":
        return rod_diameters_mm(units)
    return None


def blank_volume_mm3(body) -> float:
    """Volume of the stock blank the body is cut from (``plan.body``)."""
    if body.style == "puck":
        return math.pi / 4 * body.diameter_mm ** 2 * body.thickness_mm
    xs = [p[0] for p in body.outline]
    ys = [p[1] for p in body.outline]
    return (max(xs) - min(xs)) * (max(ys) - min(ys)) * body.thickness_mm
