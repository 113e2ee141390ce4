"""Design rules run on the plan (no solids), in groups with an explicit order.

Each rule gives ``pass``, ``warn`` or ``fail``, the worst figure, its limit and what to change.
No rule reads state another rule set: each is a pure function of the config, the plan and
its sleeves.
"""

from __future__ import annotations

from dataclasses import dataclass

from generators.config.models import Config
from generators.plan.model import HubPlan
from generators.plan.rules.base import (  # noqa: F401 - the rules' public vocabulary
    COMMON, FAIL, MIN_WALL_MM, PASS, WARN, RuleResult, speed_text)
from generators.plan.rules.fasteners import FastenerRules
from generators.plan.rules.nut_bearing import NutRules
from generators.plan.rules.placement import PlacementRules, estimate_volume_mm3  # noqa: F401
from generators.plan.rules.retention import RetentionRules
from generators.plan.rules.split import SplitRules
from generators.plan.rules.walls import WallRules
from generators.plan.rules.wind import WindRules

# The order the rules run and are shown in, group by group.
GROUPS = (
    ("walls", ("rule_socket_wall", "rule_socket_web", "rule_socket_bore", "rule_hole_wall")),
    ("fasteners", ("rule_thread_engagement", "rule_set_screw_length", "rule_set_screw_crush",
                   "rule_nut_bearing", "rule_split_bearing")),
    ("placement", ("rule_edge_distance", "rule_socket_depth", "rule_socket_tilt", "rule_split_bolt_edge")),
    ("sleeves", ("rule_sleeve_wall",)),
    ("mass", ("rule_mass",)),
    ("retention", ("rule_mast_retention", "rule_split_clamp")),  # after the wind estimate: it needs its loads
)
WITH_WIND = ("rule_mast_retention", "rule_split_clamp")


def group_ids(group: str) -> frozenset[str]:
    """The rule ids of one group (each ``rule_x_y`` method returns rule ``x-y``)."""
    return frozenset(name[len("rule_"):].replace("_", "-") for g, names in GROUPS if g == group for name in names)
RULES = tuple(name for _, names in GROUPS for name in names)


class _Rules(WallRules, FastenerRules, NutRules, PlacementRules, RetentionRules, SplitRules, WindRules):
    pass


@dataclass(frozen=True)
class Checks:
    """Rule results and the wind estimate, plus figures the report shows."""

    rules: tuple[RuleResult, ...]
    wind: object  # loads.WindResult
    set_screws: tuple[dict, ...]
    sleeves: tuple[dict, ...]
    mass_estimate_g: float

    def as_json(self) -> dict:
        """``{"rules": [...], "wind": {...}}``: what ``check --json`` prints and the manifest keeps."""
        return {"rules": [r.as_json() for r in self.rules], "wind": self.wind.as_json()}


def evaluate(cfg: Config, plan: HubPlan, sleeves: tuple = (), walls: tuple | None = None) -> Checks:
    """Every rule and the wind estimate for a plan (``sleeves``: its sleeve plans; ``walls``:
    its measured walls, measured here when not given)."""
    from generators.plan.hard_limits import check_hard_limits
    from generators.plan.loads import wind_estimate

    r = _Rules(cfg, plan, sleeves, walls)
    check_hard_limits(cfg, plan, r.walls)
    wind = wind_estimate(cfg, plan, r.engaged_set_screw_mm(), r.mass_estimate_g(), r.set_screw_clamp_n())
    results = [getattr(r, name)(wind) if name in WITH_WIND else getattr(r, name)() for name in RULES]
    results += r.wind_rules(wind)
    return Checks(rules=tuple(results), wind=wind, set_screws=tuple(r.set_screw_fit()),
                  sleeves=tuple(r.sleeves()), mass_estimate_g=r.mass_estimate_g())


def run_checks(cfg: Config, plan: HubPlan, sleeves: tuple = ()) -> dict:
    """``{"rules": [...], "wind": {...}}`` as plain data."""
    return evaluate(cfg, plan, sleeves).as_json()


def failed(checks: dict) -> list[dict]:
    return [r for r in checks["rules"] if r["status"] == FAIL]


def warned(checks: dict) -> list[dict]:
    return [r for r in checks["rules"] if r["status"] == WARN]
