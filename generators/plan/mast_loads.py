"""What the whole antenna puts on the mast top: wind area, force, torque, weight, ice (SI).

Model (an estimate for choosing a mast, clamp or rotator; not a certification):

- Wind area: for each wind direction (swept like the spreader loads) the projected area
  of every pole across the wind, ``D L |sin psi|`` on its iced diameter, plus every wire
  share broadside on its iced diameter, plus the hub's side (widest plan width x
  thickness); the largest over the directions.
- Force: the drag ``q Cd`` on the same parts, the poles by the cross-flow principle
  (``sin^2 psi``, Hoerner, from memory), the magnitudes added (an upper bound on their
  vector sum); the largest over the directions.
- Torque about the mast from an uneven gust: the force taken at 75 % with an eccentricity
  of 15 % of the antenna's span across the wind, ``M_T = 0.75 F x 0.15 B`` (ASCE 7-16
  figure 27.3-8, load case 2, the torsional case of the main wind-force system; from
  memory), with ``B`` = twice the tip radius.
- Weight: poles (density and section from the materials table, exposed length plus the
  socket), wire shares (copper, 8.96 g/cm3: CRC Handbook of Chemistry and Physics, from
  memory) and the hub's estimated mass; ice separately (plan/ice.py).
- Tip deflection: the worst spreader as a cantilever under the design wind (horizontal
  plane), ``w L^4 / 8EI + P L^3 / 3EI`` (Roark table 8.1, plan/beam.py).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.plan import beam, ice

COPPER_DENSITY = 8960.0    # kg/m3, CRC Handbook (from memory)
GUST_FRACTION = 0.75       # ASCE 7-16 fig. 27.3-8 case 2 (from memory)
GUST_ECCENTRICITY = 0.15   # of the span B, ASCE 7-16 fig. 27.3-8 case 2 (from memory)


@dataclass(frozen=True)
class MastLoads:
    wind_area_m2: float
    mast_force_n: float
    mast_torque_nm: float
    weight_n: float
    ice_weight_n: float
    tip_deflection_mm: float


def hub_side_area_m2(plan) -> float:
    """The hub seen from the side: its widest plan width times its thickness."""
    b = plan.body
    width = 2 * b.corner_radius_mm  # across the corners: the widest the wind can see
    return width * b.thickness_mm * 1e-6


def mast_loads(cfg, plan, q: float, lengths_m: list[float], directions: list[float], hub_mass_g: float,
               tip_radius_mm: float, pole_mat, worst_length_m: float) -> MastLoads:
    """The figures above; ``lengths_m`` per spreader (socket mouth to tip)."""
    ld, sp = cfg.loads, cfg.spreaders
    t = ld.ice_thickness
    d_ice = ice.iced_diameter_mm(sp.diameter, t) / 1000.0
    wire_ice = ice.iced_diameter_mm(ld.wire_diameter, t) / 1000.0 if ld.wire_diameter > 0 else 0.0
    wire_len = ld.wire_length_per_spreader / 1000.0
    n = len(plan.spreaders)
    hub_a = hub_side_area_m2(plan)
    best_area, best_force = 0.0, 0.0
    for az in directions:
        w = (math.cos(math.radians(az)), math.sin(math.radians(az)), 0.0)
        area = hub_a + n * wire_ice * wire_len
        drag_area = hub_a + n * wire_ice * wire_len
        for s, L in zip(plan.spreaders, lengths_m):
            c = sum(a * b for a, b in zip(s.outward, w))
            s2 = max(0.0, 1.0 - c * c)
            area += d_ice * L * math.sqrt(s2)
            drag_area += d_ice * L * s2
        best_area = max(best_area, area)
        best_force = max(best_force, q * ld.drag_coefficient * drag_area)
    torque = GUST_FRACTION * best_force * GUST_ECCENTRICITY * 2.0 * tip_radius_mm / 1000.0
    bore = sp.inner_diameter if sp.inner_diameter is not None else (
        max(sp.diameter - 2.0 * sp.wall, 0.0) if sp.wall is not None else 0.0)
    # the pole's length inside the hub: its socket, or on a plate from the stop line to the edge
    socket = {s.id: (plan.hole(s.socket_hole).depth_mm if s.socket_hole else math.dist(s.mouth_mm, s.bottom_mm))
              / 1000.0 for s in plan.spreaders}
    pole_w = sum(pole_mat.density_g_cm3 * 1000.0 * beam.G * beam.tube_area_m2(sp.diameter, bore)
                 * (L + socket[s.id]) for s, L in zip(plan.spreaders, lengths_m))
    wire_w = n * COPPER_DENSITY * beam.G * math.pi / 4 * (ld.wire_diameter / 1000.0) ** 2 * wire_len
    weight = pole_w + wire_w + hub_mass_g / 1000.0 * beam.G
    ice_w = sum(ice.ice_weight_per_m(sp.diameter, t) * L for L in lengths_m)
    if ld.wire_diameter > 0:
        ice_w += n * ice.ice_weight_per_m(ld.wire_diameter, t) * wire_len
    # worst spreader across the wind: uniform drag on the iced pole, the wire share at the tip
    w_pole = q * ld.drag_coefficient * d_ice
    f_wire = q * ld.drag_coefficient * wire_ice * wire_len
    i = beam.tube_second_moment_m4(sp.diameter, bore)
    e = pole_mat.modulus_gpa * 1e9
    defl = beam.PlaneLoads(w_pole, f_wire).tip_deflection_m(worst_length_m, e, i) if i > 0 else math.inf
    return MastLoads(wind_area_m2=best_area, mast_force_n=best_force, mast_torque_nm=torque,
                     weight_n=weight, ice_weight_n=ice_w, tip_deflection_mm=defl * 1000.0)
