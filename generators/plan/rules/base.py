"""Design rules: what every rule group shares (results, grading, limits, helpers).

Rules run on the plan (no solids): plain data, one result per rule.

Each rule gives ``pass``, ``warn`` (below the recommended figure) or ``fail`` (below the
minimum), the worst figure over the holes it looks at, its limit and what to change.
Lengths are in mm. The hard limits in ``plan/limits.py`` refuse unbuildable parts before
these run; these rules are the shop's margins above them.
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass

from generators.config.models import Config
from generators.plan.kinds import POCKET_KINDS
from generators.plan.model import Hole, HubPlan
from generators.units import format_length

PASS, WARN, FAIL = "pass", "warn", "fail"

# Least material around a cut, by hub material class (common practice: plastics and wood
# tear out and creep in thin sections, aluminium holds a thinner wall).
MIN_WALL_MM = {"plastic": 3.0, "wood": 4.0, "metal": 1.5, "composite": 2.0}
# Recommended = 1.5 x the minimum, and for a socket wall at least a quarter of the socket
# diameter (common practice).
RECOMMENDED_OVER_MIN = 1.5
WALL_OVER_SOCKET = 0.25
# Hole rim to face edge: at least half the hole diameter, recommended one diameter
# (common practice; the half-diameter figure is also the planner's hard limit).
EDGE_MIN_D, EDGE_RECOMMENDED_D = 0.5, 1.0
# Socket depth for bending support: at least 1.5 x the pole diameter (common practice);
# under 1 x D fails.
DEPTH_MIN_D, DEPTH_RECOMMENDED_D = 1.0, 1.5
# Thread engagement: the material table's factor x D is recommended (1.5 D in plastics
# and wood, common practice); under 1 x D fails.
ENGAGE_MIN_D = 1.0
# A set screw needs at least 1 x D of its own length in the thread when it bears on the
# pole (common practice).
SET_SCREW_MIN_ENGAGED_D = 1.0
# Reducer sleeve wall (common practice): under 1.5 mm fails, under 3 mm warns.
SLEEVE_MIN_MM, SLEEVE_RECOMMENDED_MM = 1.5, 3.0
# Wind safety factors below these warn (common practice for an estimate like this one);
# below 1 the estimate says the part fails in the design wind, and the rule fails.
SF_SPREADER, SF_BEARING, SF_SET_SCREW = 1.5, 2.0, 2.0
SF_FAIL = 1.0
# Mass above this fraction of hub.max_mass warns.
MASS_WARN_FRACTION = 0.9

COMMON = "common practice"
# Pockets for captive nuts and inserts (printed hubs): the nut carries the thread.
POCKETS = POCKET_KINDS


@dataclass(frozen=True)
class RuleResult:
    id: str
    status: str
    value: float | None
    limit: float | None
    unit: str
    message: str
    source: str

    def as_json(self) -> dict:
        d = asdict(self)
        for k in ("value", "limit"):
            if d[k] is not None:
                d[k] = round(d[k], 6)  # the table and messages round the figure once, not twice
        return d


def speed_text(m_s: float, units: str) -> str:
    """A wind speed as the config's users say it (1 mph = 0.44704 m/s exactly)."""
    if units == "in":
        return f"{m_s / 0.44704:.0f} mph ({m_s:.1f} m/s)"
    return f"{m_s:.1f} m/s ({m_s * 3.6:.0f} km/h)"


def _grade(value: float, fail_below: float, warn_below: float) -> tuple[str, float]:
    """Status and the limit it was judged against (the minimum when failing)."""
    if value < fail_below - 1e-9:
        return FAIL, fail_below
    if value < warn_below - 1e-9:
        return WARN, warn_below
    return PASS, warn_below


def rule_wall_mm(material: str) -> float:
    """The wall rules' minimum for a hub material (by its class)."""
    from generators.standards.materials import get_material

    return MIN_WALL_MM[get_material(material).material_class]


def named_wall_mm(material: str) -> float:
    """Walls under this are named one by one in the hole-wall rule's message (its recommended
    figure), so each is measured finely, not only the least."""
    return RECOMMENDED_OVER_MIN * rule_wall_mm(material)


class RulesBase:
    """What every rule group shares: the config, the plan, the material and small helpers."""

    def __init__(self, cfg: Config, plan: HubPlan, sleeves: tuple = (), walls: tuple | None = None):
        from generators.plan.measured_walls import REFINE_BELOW_MM, measure_walls
        from generators.standards.materials import get_material

        self.cfg, self.plan, self.sleeve_plans = cfg, plan, tuple(sleeves)
        self.walls = tuple(measure_walls(plan, named_wall_mm(plan.material)) if walls is None else walls)
        self.far = REFINE_BELOW_MM
        self.mat = get_material(plan.material)
        self.cls = self.mat.material_class
        self.min_wall = MIN_WALL_MM[self.cls]
        self.T = plan.body.thickness_mm
        self.sockets = [h for h in plan.holes if h.kind == "socket"]

    def fmt(self, mm: float) -> str:
        return format_length(mm, self.cfg.units, fractions=False)

    def _elev(self, h: Hole) -> float:
        return math.asin(max(-1.0, min(1.0, -h.axis[2])))

    def _blind(self, h: Hole) -> bool:
        sp = next((s for s in self.plan.spreaders if s.socket_hole == h.id), None)
        return sp is not None and sp.stop == "socket floor"

    def _engaged(self, h: Hole) -> float:
        """Full thread length of a tapped hole in the hub material."""
        if h.kind in ("set_screw", "clamp", "split_bolt") and h.tapped is not None:
            return h.tapped.length_mm  # threaded only this long, ending at the wall
        if h.kind == "set_screw":
            sock = next(s for s in self.sockets if s.spreader == h.spreader)
            e = self._elev(sock)
            return h.depth_mm - sock.radius_mm / math.cos(e)
        if h.kind == "clamp" or h.through:
            return h.depth_mm
        pitch = self._thread(h).pitch_mm
        return h.depth_mm - 2.0 * pitch  # the tap's lead-in leaves ~2 pitches short (common practice)

    def _thread(self, h: Hole):
        from generators.standards.threads import parse_thread

        return parse_thread(h.thread)

    def _pocket(self, h: Hole) -> Hole | None:
        """The captive-nut or insert pocket serving a clearance hole (printed hubs)."""
        return next((p for p in self.plan.holes if p.kind in POCKETS and getattr(p, "serves", None) == h.id), None)

    def _na(self, rid: str, unit: str, why: str) -> RuleResult:
        return RuleResult(rid, PASS, None, None, unit, f"not applicable: {why}", COMMON)
