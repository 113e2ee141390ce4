"""A printable spreader tip cap (plain data): a sleeve over the pole tip with a closed end
and a cross hole (eye) for the element wire or cord.

Printed standing on its closed end (Z = 0), open end up, so the bore needs no support;
the cross hole is horizontal and gets the teardrop roof of ``generators.plan.printed``.
``bore_mm`` is the fit the user asked for (tip diameter + fit); the modelled bore, like
every printed hole, is ``[print] hole_compensation`` larger.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.config.models import Config
from generators.errors import UserError
from generators.plan.model import Hole
from generators.plan.printed import min_wall_mm
from generators.units import format_length

# Side wall of the cap: never under 2.5 mm, so it does not split when pushed on (common practice).
MIN_CAP_WALL_MM = 2.5


@dataclass(frozen=True)
class TipCapPlan:
    tip_diameter_mm: float
    fit_mm: float
    bore_mm: float  # tip diameter + fit
    modelled_bore_mm: float  # bore + hole compensation
    depth_mm: float  # how far the tip goes in
    wall_mm: float
    outer_diameter_mm: float
    end_thickness_mm: float  # closed end under the bore, holding the cord hole
    length_mm: float
    compensation_mm: float
    cord_hole: Hole  # the eye, across the closed end along X


def tip_cap_plan(cfg: Config) -> TipCapPlan | None:
    tc = cfg.tip_cap
    if tc is None:
        return None
    comp = cfg.print.hole_compensation
    wall = max(MIN_CAP_WALL_MM, min_wall_mm(cfg))
    bore = tc.tip_diameter + tc.fit
    bore_model = bore + comp
    od = bore_model + 2 * wall
    d_c = tc.cord_diameter + comp
    if d_c > od - 2 * wall:
        fmt = lambda v: format_length(v, cfg.units, fractions=False)  # noqa: E731
        raise UserError("tip_cap.cord_diameter", f"a {fmt(tc.cord_diameter)} cord hole does not fit across a"
                        f" {fmt(od)} cap with {fmt(wall)} walls", f"at most {fmt(od - 2 * wall - comp)}")
    r_c = d_c / 2
    z_c = wall + r_c
    end = z_c + r_c * math.sqrt(2.0) + wall
    R = od / 2
    hole = Hole(id="EYE", kind="cord", face="side", entry_mm=(-R, 0.0, z_c), axis=(1.0, 0.0, 0.0),
                diameter_mm=d_c, depth_mm=od, through=True, extend_mm=1.0, lead_mm=1.0,
                profile="teardrop", roof_up=(0.0, 0.0, 1.0), roof_mm=r_c * math.sqrt(2.0),
                compensation_mm=comp, note="eye for the element wire or cord")
    return TipCapPlan(tip_diameter_mm=tc.tip_diameter, fit_mm=tc.fit, bore_mm=bore, modelled_bore_mm=bore_model,
                      depth_mm=tc.depth, wall_mm=wall, outer_diameter_mm=od, end_thickness_mm=end,
                      length_mm=end + tc.depth, compensation_mm=comp, cord_hole=hole)
