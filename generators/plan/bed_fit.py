"""Does a printed part fit the printer's bed in its print orientation?

A part is given by its footprint on the bed (the outline of the face it is printed on,
any closed point set in mm) and its height. It may be turned on the bed by any angle
``t`` about the vertical: the rotated footprint's bounding box is then ``w(t) x d(t)``
(the extents of the rotated points), and the part fits when for some ``t``
``w(t) <= W``, ``d(t) <= D`` and its height ``<= H``. The angle is searched over half a
turn (a bounding box repeats every 180 deg) in 1 deg steps and refined to 0.001 deg
around the best step, so a diagonal placement is found when the square one fails.
Each part is checked on its own (the halves of a split hub each with their own
footprint).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.errors import UserError
from generators.plan.geometry import Pt
from generators.units import format_length


@dataclass(frozen=True)
class BedFit:
    part: str
    fits: bool
    angle_deg: float  # the turn on the bed that fits (or comes closest)
    size_mm: tuple[float, float, float]  # the footprint's extents at that turn, and the height
    square_mm: tuple[float, float]  # extents unturned (as modelled, X by Y)
    margin_mm: float  # least room left at that turn (negative: over by this much)


def extents(points: list[Pt] | tuple[Pt, ...], angle_deg: float) -> tuple[float, float]:
    """Width and depth of the points turned by ``angle_deg`` about the origin."""
    c, s = math.cos(math.radians(angle_deg)), math.sin(math.radians(angle_deg))
    xs = [x * c - y * s for x, y in points]
    ys = [x * s + y * c for x, y in points]
    return max(xs) - min(xs), max(ys) - min(ys)


def bed_fit(part: str, footprint, height_mm: float, bed: tuple[float, float, float]) -> BedFit:
    """How ``footprint`` (points, mm) ``height_mm`` tall sits best on ``bed`` (W, D, H)."""
    W, D, H = bed
    pts = list(footprint)

    def margin(t: float) -> float:
        w, d = extents(pts, t)
        return min(W - w, D - d)

    best = max((float(k) for k in range(180)), key=margin)
    step = 1.0
    while step > 0.001:
        step /= 10
        best = max((best + k * step for k in range(-10, 11)), key=margin)
    m = margin(best)
    w, d = extents(pts, best)
    best = best % 180
    return BedFit(part=part, fits=m >= -1e-9 and height_mm <= H + 1e-9, angle_deg=best,
                  size_mm=(w, d, height_mm), square_mm=extents(pts, 0.0), margin_mm=min(m, H - height_mm))


def circle(diameter_mm: float, segments: int = 72) -> list[Pt]:
    r = diameter_mm / 2
    return [(r * math.cos(2 * math.pi * k / segments), r * math.sin(2 * math.pi * k / segments))
            for k in range(segments)]


def printed_parts(plan, sleeves, tip_cap) -> list[tuple[str, list[Pt], float, str]]:
    """(part, footprint, height, key to name) for each printed part of a design, printed
    bottom face down (the hub), flange down (a sleeve), closed end down (the tip cap)."""
    parts = []
    if plan.process == "printed" and plan.split is not None:
        for half in plan.split.halves:  # each half on its own, bottom face down
            parts.append((f"hub half {half.name[-1].upper()}", list(half.footprint), plan.body.thickness_mm, "hub"))
    elif plan.process == "printed":
        parts.append(("hub", list(plan.body.outline), plan.body.thickness_mm, "hub"))
    for s in sleeves:
        if s.process == "printed":
            od = s.flange.od_mm if s.flange else s.od_mm
            parts.append((f"sleeve {s.stem}", circle(od), s.height_mm, s.key))
    if tip_cap is not None:
        parts.append(("tip cap", circle(tip_cap.outer_diameter_mm), tip_cap.length_mm, "tip_cap"))
    return parts


def check_bed(cfg, plan, sleeves, tip_cap) -> tuple[BedFit, ...]:
    """Every printed part against ``[print] bed``; a ``UserError`` for the first that does
    not fit, with the bed, the part's size and the fixes."""
    bed = cfg.print.bed
    if bed is None:
        return ()
    fmt = lambda mm: format_length(mm, cfg.units, fractions=False)  # noqa: E731
    fits = []
    for part, footprint, height, key in printed_parts(plan, sleeves, tip_cap):
        fit = bed_fit(part, footprint, height, bed)
        if not fit.fits:
            w, d = fit.square_mm
            fixes = ("split the hub into halves, a smaller hub (hub.across_flats /"
                     " hub.diameter, hub.thickness), or another bed" if part == "hub" else
                     "a smaller hub (hub.across_flats / hub.diameter), or another bed" if part.startswith("hub half") else
                     f"a smaller {part} or another bed")
            turned = ""
            if max(abs(fit.size_mm[0] - w), abs(fit.size_mm[1] - d)) > 0.1:  # turning helps, not enough
                turned = f", at best {fmt(fit.size_mm[0])} x {fmt(fit.size_mm[1])} turned {fit.angle_deg:.1f} deg"
            raise UserError("print.bed", f"the {part} ({fmt(w)} x {fmt(d)} x {fmt(height)}{turned})"
                            f" does not fit the {fmt(bed[0])} x {fmt(bed[1])} x {fmt(bed[2])} bed", fixes)
        fits.append(fit)
    return tuple(fits)
