"""One design, computed once: config (plus extra masts) → every plan, rule and operation.

``check`` is ``design()`` plus printing; ``build`` is ``design()`` plus the writers, which
only render what is here (no writer plans, chooses a screw or runs a rule again). No CAD
import: this runs in ``check`` and in the sizing search.
"""

from __future__ import annotations

from dataclasses import dataclass

from generators.config.models import Config


@dataclass(frozen=True)
class Design:
    config: Config
    masts: tuple[str, ...]
    plan: object  # HubPlan
    sleeves: tuple  # SleevePlan per extra mast
    sleeve_plans: tuple  # (SleevePlan, its round HubPlan for templates and operations)
    cut_cases: tuple  # CutCase: the hub as planned, then one per sleeve OD
    jig: object | None  # JigPlan
    jig_reason: str | None
    tip_cap: object | None  # TipCapPlan
    checks: object  # rules.Checks
    walls: tuple  # measured_walls.Wall, least first
    series: tuple[str, ...]
    material_class: str
    operations: tuple  # Operation, hub faces in plan order
    sleeve_operations: tuple  # (sleeve stem, tuple of Operation)
    plate: object | None = None  # plan.plate.PlateLayout of a plate hub (its U-bolts and stops)
    jigs: tuple = ()  # JigPlan per distinct socket angle; ``jig`` is the first
    frame: object | None = None  # FramePlan: tip points, tubes and wires of the whole antenna
    bed_fits: tuple = ()  # BedFit per printed part when [print] bed is given

    @property
    def checks_json(self) -> dict:
        return self.checks.as_json()

    def failed(self) -> list[dict]:
        return [r for r in self.checks_json["rules"] if r["status"] == "fail"]

    def operations_on(self, face_id: str) -> list:
        return [op for op in self.operations if op.face == face_id]

    def operation_records(self) -> list[dict]:
        return [op.record() for op in self.operations]


def _hub_parts(cfg: Config, masts: tuple[str, ...], plan):
    """The plan (built unless given), its sleeves, the tip cap and the print-bed fits: what
    every rule needs before a wall is measured."""
    from generators.plan.bed_fit import check_bed
    from generators.plan.hub import build_plan
    from generators.plan.reducer import plan_sleeves
    from generators.plan.tipcap import tip_cap_plan

    plan = build_plan(cfg) if plan is None else plan
    sleeves = tuple(plan_sleeves(cfg, plan, masts))
    tip_cap = tip_cap_plan(cfg)
    return plan, sleeves, tip_cap, check_bed(cfg, plan, sleeves, tip_cap)


def failing_before_walls(cfg: Config) -> tuple[object, tuple[tuple[str, str], ...]]:
    """The plan (None for a plate) and (rule id, status) of the rules that fail or warn
    before a wall is measured: every rule but the walls' group, with the hard limits but the
    walls'. A design with any failing here fails ``check`` whatever its walls; the sizing
    search uses it to pass over such designs without measuring them (``design(cfg,
    plan=...)`` then goes on from the same plan). Raises ``UserError`` as ``design()`` does."""
    from generators.plan.rules import evaluate, group_ids

    if cfg.hub.style == "plate":
        return None, ()
    plan, sleeves, _, _ = _hub_parts(cfg, (), None)
    walls = group_ids("walls")
    checks = evaluate(cfg, plan, sleeves, walls=())
    return plan, tuple((r.id, r.status) for r in checks.rules if r.status in ("fail", "warn") and r.id not in walls)


def design(cfg: Config, masts: tuple[str, ...] | list[str] = (), plan=None) -> Design:
    """The whole design, or a ``UserError`` naming what cannot be built (``plan``: this
    config's plan, when already built)."""
    from generators.plan.cutlist import cut_list
    from generators.plan.frame import frame_plan
    from generators.plan.holes import material_class
    from generators.plan.jig import jig_plans, jig_reason
    from generators.plan.measured_walls import measure_walls
    from generators.plan.rules.base import named_wall_mm
    from generators.plan.operations import plan_operations
    from generators.plan.rules import evaluate
    from generators.plan.shop import drill_series
    from generators.plan.sleeve_faces import sleeve_as_plan

    masts = tuple(masts)
    if cfg.hub.style == "plate":
        return _plate_design(cfg, masts)
    plan, sleeves, tip_cap, bed_fits = _hub_parts(cfg, masts, plan)
    series = drill_series(cfg)
    mclass = material_class(cfg.hub.material)
    sleeve_plans = tuple((s, sleeve_as_plan(plan, s)) for s in sleeves)
    walls = tuple(measure_walls(plan, named_wall_mm(plan.material)))
    checks = evaluate(cfg, plan, sleeves, walls)
    cut_cases = tuple(cut_list(cfg, plan, sleeves))
    jigs = jig_plans(plan, cfg)
    return Design(
        config=cfg, masts=masts, plan=plan, sleeves=sleeves, sleeve_plans=sleeve_plans,
        cut_cases=cut_cases, jig=jigs[0] if jigs else None, jig_reason=jig_reason(plan, cfg), jigs=jigs,
        frame=frame_plan(plan, cut_cases), bed_fits=bed_fits,
        tip_cap=tip_cap, checks=checks, walls=walls, series=series, material_class=mclass,
        operations=plan_operations(plan, cfg, series, mclass),
        sleeve_operations=tuple((s.stem, plan_operations(sp, cfg, series, mclass)) for s, sp in sleeve_plans),
    )


def _plate_design(cfg: Config, masts: tuple[str, ...]) -> Design:
    """A plate hub: its own planner and rules, rendered by the same writers."""
    from generators.errors import UserError
    from generators.plan.cutlist import cut_case, tip_radius_mm
    from generators.plan.holes import material_class
    from generators.plan.operations import plan_operations
    from generators.plan.plate import plate_plan
    from generators.plan.hard_limits import check_hard_limits
    from generators.plan.measured_walls import measure_walls
    from generators.plan.rules.base import named_wall_mm
    from generators.plan.plate_rules import plate_checks
    from generators.plan.shop import drill_series
    from generators.plan.tipcap import tip_cap_plan

    if masts:
        raise UserError("--mast", "a plate hub has no bore for a sleeve", "build a plate without --mast")
    plan, layout = plate_plan(cfg)
    walls = tuple(measure_walls(plan, named_wall_mm(plan.material)))
    check_hard_limits(cfg, plan, walls)
    series, mclass = drill_series(cfg), material_class(cfg.hub.material)
    cuts = ()
    if tip_radius_mm(cfg) is not None:
        cuts = (cut_case(cfg, plan, "stop line on the plate", "floor", plan.spreaders[0].stop_radius_mm),)
    return Design(
        config=cfg, masts=(), plan=plan, sleeves=(), sleeve_plans=(), cut_cases=cuts, jig=None,
        jig_reason="a plate's poles lie flat: no angle to drill", tip_cap=tip_cap_plan(cfg),
        checks=plate_checks(cfg, plan, layout), walls=walls, series=series, material_class=mclass,
        operations=plan_operations(plan, cfg, series, mclass), sleeve_operations=(), plate=layout)
