"""The whole antenna frame around the hub (plain data): a mast stub, every spreader as a
tube from where it stops in the hub to its cut end, the tip points and the wires
between neighbouring tips.

Geometry (hub frame, mm): a pole's axis passes through its socket mouth ``M`` along the
unit vector ``u`` (azimuth ``a``, elevation ``e``); the axis point at horizontal radius
``rho`` is ``M + u (rho - rho_M) / cos e``. The tube runs from the cut list's inner end
radius to the tip radius plus the tip allowance along the axis, so its length is the cut
length. The wires run tip to tip around the frame in azimuth order (the loop of a quad
or a spider frame); their lengths are straight chords, not the sag of a real wire.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.plan.geometry import Vec, add, norm, scale, sub

# Mast drawn below and above the hub in the assembly: 150 mm each way (a stub to show
# the fit, not a mast length).
MAST_STUB_MM = 150.0


@dataclass(frozen=True)
class Tube:
    spreader: int
    start_mm: Vec  # pole axis at its inner end (the stop)
    end_mm: Vec  # pole axis at its cut end (tip point plus the allowance)
    tip_mm: Vec  # where the wire is attached
    diameter_mm: float
    azimuth_deg: float
    elevation_deg: float
    cut_length_mm: float

    @property
    def length_mm(self) -> float:
        return norm(sub(self.end_mm, self.start_mm))


@dataclass(frozen=True)
class Wire:
    a: int  # spreader ids at its ends
    b: int
    start_mm: Vec
    end_mm: Vec

    @property
    def length_mm(self) -> float:
        return norm(sub(self.end_mm, self.start_mm))


@dataclass(frozen=True)
class FramePlan:
    mast_od_mm: float
    mast_bottom_mm: float  # z of the stub's ends
    mast_top_mm: float
    hub_thickness_mm: float
    tip_radius_mm: float
    tip_allowance_mm: float
    tubes: tuple[Tube, ...]
    wires: tuple[Wire, ...]
    stop: str

    def tip(self, spreader: int) -> Vec:
        return next(t.tip_mm for t in self.tubes if t.spreader == spreader)


def axis_point(mouth: Vec, outward: Vec, rho: float) -> Vec:
    """The pole axis point at horizontal radius ``rho`` (formula in the module docstring)."""
    rho_m = math.hypot(mouth[0], mouth[1])
    cos_e = math.hypot(outward[0], outward[1])
    return add(mouth, scale(outward, (rho - rho_m) / cos_e))


def frame_plan(plan, cut_cases) -> FramePlan | None:
    """The frame for the hub as planned (the first cut case); None without a tip radius."""
    if not cut_cases:
        return None
    case = cut_cases[0]
    lines = {ln.spreader: ln for ln in case.lines}
    tubes = []
    for s in plan.spreaders:
        ln = lines[s.id]
        rho_end = ln.end_radius_mm or case.end_radius_mm
        start = axis_point(s.mouth_mm, s.outward, rho_end)
        tip = axis_point(s.mouth_mm, s.outward, case.tip_radius_mm)
        end = add(tip, scale(s.outward, case.tip_allowance_mm))
        tubes.append(Tube(spreader=s.id, start_mm=start, end_mm=end, tip_mm=tip, diameter_mm=s.diameter_mm,
                          azimuth_deg=s.azimuth_deg % 360, elevation_deg=s.elevation_deg,
                          cut_length_mm=ln.cut_length_mm))
    ring = sorted(tubes, key=lambda t: t.azimuth_deg)
    wires = tuple(Wire(a=t.spreader, b=u.spreader, start_mm=t.tip_mm, end_mm=u.tip_mm)
                  for t, u in zip(ring, ring[1:] + ring[:1])) if len(ring) > 2 else ()
    T = plan.body.thickness_mm
    return FramePlan(mast_od_mm=plan.mast_od_mm, mast_bottom_mm=-MAST_STUB_MM, mast_top_mm=T + MAST_STUB_MM,
                     hub_thickness_mm=T, tip_radius_mm=case.tip_radius_mm,
                     tip_allowance_mm=case.tip_allowance_mm, tubes=tuple(tubes), wires=wires, stop=case.stop)
