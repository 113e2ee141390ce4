"""Spreader cut lengths: from where the pole stops in the hub to its tip, along its axis.

Geometry (hub frame; each pole axis lies in the vertical plane through the mast axis at
its azimuth and rises outward at elevation ``e``; ``rho`` is horizontal distance from
the mast axis):

- Along the axis, horizontal distance grows by ``cos e`` per unit length, so the pole
  from an axis point at ``rho_end`` to the tip point at ``rho_tip`` is
  ``(rho_tip - rho_end) / cos e`` long.
- **To-bore socket.** The pole's square-cut end is a disc of radius ``r`` (half the pole
  OD) perpendicular to the axis; it slides in until it touches the vertical stop
  cylinder of radius ``R`` (the mast, or the sleeve in the bore). A disc point at angle
  ``phi`` around the axis sits at squared horizontal distance
  ``rho_c**2 + r**2 - 2*rho_c*r*sin(e)*cos(phi) - r**2*cos(e)**2*cos(phi)**2`` from the
  mast axis (``rho_c``: the axis end point). That is concave in ``cos(phi)``, so its
  minimum is at ``phi = 0``, the top edge of the end (``(rho_c - r*sin e)**2``); the end
  touches when ``rho_c = R + r*sin e``. At 0 deg this is ``R``: a stop ``d`` smaller in
  diameter lets the pole in ``d/2`` further (the shop rule); tilted, the pole gets
  ``d / (2 cos e)`` longer.
- **Blind socket.** The end sits flat on the socket floor, so ``rho_c`` is the floor's
  axis point (the plan's ``stop_radius_mm``).
- **Poles meeting.** If the stop is so small that neighbouring pole sides touch first
  (axes ``2 rho sin(pi/N)`` apart at radius ``rho``), the poles stop at
  ``rho = r / sin(pi/N)`` instead (ignoring the small tilt of the end corners).
- The tip point is on the pole axis ``tip_radius`` from the mast axis, horizontally;
  ``tip_spacing`` between neighbouring tips gives ``tip_radius = spacing / (2 sin(pi/N))``
  (chord of the tip circle). The allowance beyond it holds the wire attachment.
  Spreader bending under wire tension is ignored.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.config.models import Config
from generators.errors import UserError
from generators.plan.model import HubPlan
from generators.units import format_length

# Length left beyond the wire attachment point for the tip cap, hole or clamp: 25 mm
# (common practice) when spreaders.tip_allowance is not given.
DEFAULT_TIP_ALLOWANCE_MM = 25.0


@dataclass(frozen=True)
class CutLine:
    spreader: int
    azimuth_deg: float
    elevation_deg: float
    cut_length_mm: float
    end_radius_mm: float = 0.0  # horizontal radius of this pole's axis at its inner end


@dataclass(frozen=True)
class CutCase:
    """Every spreader's cut length for one thing the poles stop on."""

    stop: str  # "mast", "socket floor", "sleeve OD 50.9 mm", ...
    stop_kind: str  # mast | sleeve | bore | floor | poles
    stop_radius_mm: float
    end_radius_mm: float  # horizontal radius of the pole axis at its inner end
    tip_radius_mm: float
    tip_allowance_mm: float
    lines: tuple[CutLine, ...]
    sleeves: tuple[str, ...] = ()  # sleeve file stems this case applies to

    @property
    def cut_length_mm(self) -> float:
        return self.lines[0].cut_length_mm


def tip_radius_mm(cfg: Config) -> float | None:
    """Mast axis to the tip, horizontally: ``tip_radius``, or from ``tip_spacing`` between
    neighbouring tips of a regular polygon, R = s / (2 sin(pi / n))."""
    sp = cfg.spreaders
    if sp.tip_radius is not None:
        return sp.tip_radius
    if sp.tip_spacing is not None:
        return sp.tip_spacing / (2 * math.sin(math.pi / sp.count))
    return None


def tip_allowance_mm(cfg: Config) -> float:
    a = cfg.spreaders.tip_allowance
    return DEFAULT_TIP_ALLOWANCE_MM if a is None else a


def end_radius_mm(stop_radius_mm: float, blind: bool, pole_diameter_mm: float, elevation_deg: float,
                  count: int, gap_deg: float | None = None, other_diameter_mm: float | None = None
                  ) -> tuple[float, bool]:
    """Horizontal radius of the pole axis at its inner end; True if the poles meet first.

    ``gap_deg`` is the azimuth to the nearest neighbour (default 360 / count) and
    ``other_diameter_mm`` that neighbour's pole (default the same pole): their sides
    touch where ``2 rho sin(gap / 2) = r + r_other``. A falling pole (negative
    elevation) touches the stop with its lower edge: the same ``r sin |e|``.
    """
    r = pole_diameter_mm / 2
    if blind:
        return stop_radius_mm, False
    rho = stop_radius_mm + r * math.sin(math.radians(abs(elevation_deg)))
    half = math.radians(gap_deg) / 2 if gap_deg is not None else math.pi / count
    r_other = r if other_diameter_mm is None else other_diameter_mm / 2
    meet = (r + r_other) / 2 / math.sin(half)
    if meet > rho:
        return meet, True
    return rho, False


def cut_length_mm(tip_radius: float, end_radius: float, elevation_deg: float, allowance: float) -> float:
    return (tip_radius - end_radius) / math.cos(math.radians(elevation_deg)) + allowance


def cut_case(cfg: Config, plan: HubPlan, stop: str, stop_kind: str, stop_radius: float,
             sleeves: tuple[str, ...] = ()) -> CutCase:
    tip = tip_radius_mm(cfg)
    allowance = tip_allowance_mm(cfg)
    ends = [_pole_end(plan, s, stop_radius, stop_kind == "floor") for s in plan.spreaders]
    rho = ends[0][0]
    meet = any(m for _, m in ends)
    if meet:
        stop, stop_kind = f"neighbouring poles (before the {stop})", "poles"
    outer = plan.body.corner_radius_mm
    if tip <= outer:
        key = "spreaders.tip_radius" if cfg.spreaders.tip_radius is not None else "spreaders.tip_spacing"
        raise UserError(key, f"the tips ({format_length(tip, cfg.units, fractions=False)} from the mast"
                        " axis) are inside the hub", f"more than {format_length(outer, cfg.units, False)}")
    lines = tuple(CutLine(spreader=s.id, azimuth_deg=s.azimuth_deg % 360, elevation_deg=s.elevation_deg,
                          cut_length_mm=cut_length_mm(tip, end[0], s.elevation_deg, allowance),
                          end_radius_mm=end[0])
                  for s, end in zip(plan.spreaders, ends))
    return CutCase(stop=stop, stop_kind=stop_kind, stop_radius_mm=stop_radius, end_radius_mm=rho,
                   tip_radius_mm=tip, tip_allowance_mm=allowance, lines=lines, sleeves=sleeves)


def _pole_end(plan: HubPlan, s, stop_radius: float, blind: bool) -> tuple[float, bool]:
    """One pole's inner end radius, against its nearest neighbour in azimuth. A blind
    socket's floor is the pole's own (it moves in with the socket's elevation)."""
    if blind:
        stop_radius = s.stop_radius_mm
    others = [o for o in plan.spreaders if o.id != s.id]
    gap = lambda o: abs(((o.azimuth_deg - s.azimuth_deg + 180) % 360) - 180)  # noqa: E731
    near = min(others, key=gap) if others else None
    return end_radius_mm(stop_radius, blind, s.diameter_mm, s.elevation_deg, len(plan.spreaders),
                         gap(near) if near else None, near.diameter_mm if near else None)


def cut_list(cfg: Config, plan: HubPlan, sleeves=()) -> list[CutCase]:
    """Cut cases: the hub as planned, then one per distinct sleeve OD (to-bore sockets).

    With blind sockets the poles never reach the bore, so sleeves do not change the
    length. When the config itself has reducers, the hub-as-planned case is the sleeve.
    Empty when neither tip_radius nor tip_spacing is given.
    """
    if tip_radius_mm(cfg) is None or not plan.spreaders:
        return []
    sp = plan.spreaders[0]
    fmt = lambda mm: format_length(mm, cfg.units, fractions=False)  # noqa: E731
    if sp.stop == "socket floor":
        return [cut_case(cfg, plan, "socket floor", "floor", sp.stop_radius_mm,
                         tuple(s.stem for s in sleeves))]
    cases: list[CutCase] = []
    if not (cfg.reducers and sleeves):
        kind = "mast" if sp.stop == "mast" else "bore"
        label = "mast" if kind == "mast" else f"{sp.stop} ({fmt(2 * sp.stop_radius_mm)} bore)"
        cases.append(cut_case(cfg, plan, label, kind, sp.stop_radius_mm))
    by_od: dict[float, list[str]] = {}
    for s in sleeves:
        by_od.setdefault(round(s.od_mm, 6), []).append(s.stem)
    for od, stems in by_od.items():
        cases.append(cut_case(cfg, plan, f"sleeve OD {fmt(od)}", "sleeve", od / 2, tuple(stems)))
    return cases
