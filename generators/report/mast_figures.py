"""What the antenna puts on the mast, as rows in the config's units (report and ``check``)."""

from __future__ import annotations

from generators.units import FT_M as FT
from generators.units import LBF_N as LBF
from generators.units import format_force

ADVICE = ("Compare these with the mast maker's rating for a top load (force and its height), the"
          " rotator's turning and braking torque, and the clamp or thrust bearing's rating; add the"
          " mast's own wind load and follow local codes and licensed engineering practice. A tip"
          " deflection over a tenth of the spreader's length is past the small-deflection theory the"
          " stresses and safety factors also rest on: read it as a pole that bends a lot, and the"
          " figures as rough. An estimate, not a certification.")


def _force(n: float, units: str) -> str:
    return format_force(n, units)


def mast_rows(w: dict, units: str) -> list[list[str]]:
    """[label, value] per figure of ``check --json``'s ``wind`` section; empty when not estimated."""
    if w.get("mast_force_n") is None:
        return []
    inch = units == "in"
    area = (f"{w['wind_area_m2'] / FT ** 2:.2f} ft2 ({w['wind_area_m2']:.3f} m2)" if inch
            else f"{w['wind_area_m2']:.3f} m2")
    torque = (f"{w['mast_torque_nm'] / (LBF * FT):.0f} ft-lbf ({w['mast_torque_nm']:.0f} N m)" if inch
              else f"{w['mast_torque_nm']:.0f} N m")
    defl = (f"{w['tip_deflection_mm'] / 25.4:.1f} in ({w['tip_deflection_mm']:.0f} mm)" if inch
            else f"{w['tip_deflection_mm']:.0f} mm")
    return [["wind area, worst direction (spreaders, wires, hub)", area],
            ["horizontal force on the mast top (each member's cross-flow part, sin^2 of its angle to the"
             " wind, so less than pressure x area x drag)", _force(w["mast_force_n"], units)],
            ["torque about the mast from an uneven gust: 0.75 F x 0.15 B, B the span across the wind"
             " (ASCE 7-16 fig. 27.3-8 case 2, a load case for buildings taken as an assumption)", torque],
            ["weight of the antenna (poles, wires, hub)", _force(w["weight_n"], units)],
            ["weight of the ice", _force(w["ice_weight_n"], units)],
            ["spreader tip deflection in the design wind", defl]]
