"""The drill-press angle jig for a machined hub with tilted sockets (plain data).

To drill a socket that rises outward at the elevation angle ``e``, lay the hub on the
flat opposite that socket (the socket's own flat faces up) with the hub's bottom face
against the fence: on a wedge tilted by ``e`` the socket axis is then vertical under
the drill. A socket that falls outward (negative elevation) is drilled on the same
wedge with the hub upside down (its top face against the fence), so one jig serves
every socket of one angle, and there is one jig per distinct angle. Jig frame: X across the wedge (centred),
Y along the slope (fence at the low end, Y = 0 where the slope starts), Z up, the base
on Z = 0.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.config.models import Config
from generators.plan.geometry import Pt
from generators.plan.model import HubPlan

# Stock under the low end of the slope and the fence size: enough to clamp and to stop
# the hub sliding (common practice for shop-made drilling wedges).
LOW_HEIGHT_MM = 12.0
FENCE_HEIGHT_MM = 20.0
FENCE_THICKNESS_MM = 10.0
# Slope beyond the hub's thickness, and width beyond the hub, for clamps (common practice).
MARGIN_MM = 15.0


@dataclass(frozen=True)
class JigPlan:
    wedge_angle_deg: float
    width_mm: float  # along X
    slope_length_mm: float  # the top face, along the slope from the fence
    base_length_mm: float  # footprint along Y
    low_height_mm: float
    high_height_mm: float
    fence_height_mm: float  # above the slope, square to it
    fence_thickness_mm: float
    profile: tuple[Pt, ...]  # side view (y, z), counter-clockwise, extruded along X
    top_normal: tuple[float, float, float]  # the slope's outward normal
    rests_on: tuple[tuple[str, str], ...]  # (socket hole id, face the hub lies on)
    stem: str = "jig"  # file stem: jig for the first angle, jig-<angle>deg for the others
    flipped: tuple[str, ...] = ()  # sockets drilled with the hub upside down (falling ones)


def jig_reason(plan: HubPlan, cfg: Config) -> str | None:
    """Why no jig is made for this hub, or None when one is."""
    if plan.process != "machined":
        return "printed hubs need no drilling jig"
    if all(abs(s.elevation_deg) < 1e-9 for s in plan.spreaders):
        return "the sockets are level"
    if plan.body.style != "block" or plan.body.sides % 2:
        return "the hub has no flat opposite each socket to rest on (a block with an even number of sides has)"
    return None


def jig_plans(plan: HubPlan, cfg: Config) -> tuple[JigPlan, ...]:
    """One wedge per distinct socket angle (a falling socket uses its rising twin's)."""
    if jig_reason(plan, cfg) is not None:
        return ()
    angles = sorted({round(abs(s.elevation_deg), 6) for s in plan.spreaders if abs(s.elevation_deg) > 1e-9})
    return tuple(_jig(plan, a, "jig" if k == 0 else f"jig-{a:g}deg") for k, a in enumerate(angles))


def jig_plan(plan: HubPlan, cfg: Config) -> JigPlan | None:
    """The first (smallest-angle) jig, or None."""
    jigs = jig_plans(plan, cfg)
    return jigs[0] if jigs else None


def _jig(plan: HubPlan, angle_deg: float, stem: str) -> JigPlan:
    e = math.radians(angle_deg)
    body = plan.body
    slope = body.thickness_mm + FENCE_THICKNESS_MM + 2 * MARGIN_MM
    width = 2 * body.corner_radius_mm + 2 * MARGIN_MM
    h0, hf, tf = LOW_HEIGHT_MM, FENCE_HEIGHT_MM, FENCE_THICKNESS_MM
    d, n = (math.cos(e), math.sin(e)), (-math.sin(e), math.cos(e))
    s0 = (0.0, h0)
    top_end = (slope * d[0], h0 + slope * d[1])
    f1 = (s0[0] + hf * n[0], s0[1] + hf * n[1])
    f2 = (f1[0] - tf * d[0], f1[1] - tf * d[1])
    profile = ((f2[0], 0.0), (top_end[0], 0.0), top_end, s0, f1, f2)
    sides = body.sides
    rests, flipped = [], []
    for s in plan.spreaders:
        if abs(abs(s.elevation_deg) - angle_deg) > 1e-6:
            continue
        face = plan.hole(s.socket_hole).face
        k = int(face.split("-")[1]) - 1
        rests.append((s.socket_hole, f"flat-{(k + sides // 2) % sides + 1}"))
        if s.elevation_deg < 0:
            flipped.append(s.socket_hole)
    return JigPlan(wedge_angle_deg=angle_deg, width_mm=width, slope_length_mm=slope,
                   base_length_mm=top_end[0] - f2[0], low_height_mm=h0, high_height_mm=top_end[1],
                   fence_height_mm=hf, fence_thickness_mm=tf, profile=profile,
                   top_normal=(0.0, -math.sin(e), math.cos(e)), rests_on=tuple(rests), stem=stem,
                   flipped=tuple(flipped))
