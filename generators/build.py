"""``build``: config → plan → every output file, written into place all at once."""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from generators.config import Config, load_config
from generators.errors import DesignRuleError, KernelError, UserError
from generators.output import atomic_folder
from generators.design import Design, design
from generators.manifest import plan_record, plate_record, split_record, write_changes, write_manifest
from generators.writers import run_writers

# Each writer is "module:function", called with the BuildContext in this order. A
# writer adds files to ctx.folder, sections to ctx.manifest and lines to ctx.summary.
WRITERS: tuple[str, ...] = (
    "generators.cad.writer:write_hub",
    "generators.cad.extras_writer:write_print_checks",
    "generators.cad.extras_writer:write_jig",
    "generators.drawings.jig_dxf:write_jig_drawing",
    "generators.cad.extras_writer:write_tip_cap",
    "generators.cad.reducer_writer:write_reducers",
    "generators.report.cutlist_writer:write_cutlist",
    "generators.drawings.writer:write_template_dxf",
    "generators.drawings.writer:write_template_pdf",
    "generators.drawings.plate_dxf:write_plate_dxf",
    "generators.drawings.sleeve:write_sleeve_templates",
    "generators.report.frame_png:write_frame_png",
    "generators.cad.frame_writer:write_assembly",
    "generators.report.writer:write_report",
)


@dataclass
class BuildContext:
    design: Design
    folder: Path
    config_path: Path | None = None
    options: dict[str, Any] = field(default_factory=dict)
    manifest: dict[str, Any] = field(default_factory=dict)
    summary: list[str] = field(default_factory=list)
    changes: dict[str, Any] = field(default_factory=dict)  # against the build this one replaces
    volume_mm3: float | None = None
    solid_wall: dict | None = None  # the least wall measured on the cut solid (cad/walls.py)
    meshes: dict[str, Any] = field(default_factory=dict)  # merged meshes by stem, kept for later writers

    @property
    def config(self) -> Config:
        return self.design.config

    @property
    def plan(self):
        return self.design.plan


@dataclass
class BuildResult:
    name: str
    folder: Path
    manifest: dict[str, Any]
    summary: list[str]


def output_folder(cfg: Config, out: str | Path | None) -> Path:
    """``out/<name>`` by default; the name is validated to stay inside the folder."""
    base = Path(out) if out is not None else Path("out")
    target = (base / cfg.name)
    if target.resolve().parent != base.resolve():
        raise UserError("name", f"{cfg.name!r} would write outside {base}", "a plain folder name")
    return target


def save_failed_config(cfg: Config, target: Path, config_path: Path | None) -> Path:
    """Keep the config that made the kernel fail beside the output, for a bug report."""
    import json

    if config_path is not None and config_path.is_file():
        saved = target.parent / f"{target.name}.failed.toml"
        saved.write_bytes(config_path.read_bytes())
    else:
        saved = target.parent / f"{target.name}.failed.json"
        saved.write_text(json.dumps(cfg.model_dump(), indent=2, default=str), encoding="utf-8")
    return saved


def design_checks(d: Design, force: bool) -> dict[str, Any]:
    """The design rules of ``check``; a failed rule stops the build unless ``force``."""
    checks = d.checks_json
    bad = d.failed()
    if bad and not force:
        listed = "; ".join(f"{r['id']}: {r['message']}" for r in bad)
        raise DesignRuleError("checks", f"{len(bad)} design rule(s) failed, nothing written: {listed}",
                              "change the design, or build anyway with --force")
    return checks


def check_summary(checks: dict[str, Any]) -> list[str]:
    """Summary lines: the counts, then every failed or warned rule."""
    rules = checks["rules"]
    n = {s: sum(r["status"] == s for r in rules) for s in ("pass", "warn", "fail")}
    lines = [f"  checks {n['pass']} pass, {n['warn']} warn, {n['fail']} fail (hubwright check for the table)"]
    for r in rules:
        if r["status"] != "pass":
            lines.append(f"    {r['status']} {r['id']}: {r['message']}")
    return lines


def build(config_path: str | Path, out: str | Path | None = None, masts: tuple[str, ...] = (),
          force: bool = False) -> BuildResult:
    """Build everything for one config; nothing is written unless all of it succeeds."""
    cfg = load_config(config_path)
    return build_config(cfg, out, config_path=Path(config_path), masts=tuple(masts), force=force)


def build_with_masts(config_path: str | Path, out: str | Path | None = None, masts: tuple[str, ...] = (),
                     force: bool = False) -> BuildResult:
    """Design the hub and every sleeve first (refusals before any file), then build."""
    return build(config_path, out, masts=masts, force=force)


def build_config(cfg: Config, out: str | Path | None = None, config_path: Path | None = None,
                 masts: tuple[str, ...] = (), force: bool = False) -> BuildResult:
    d = design(cfg, masts)
    return build_design(d, out, config_path=config_path, force=force)


def build_design(d: Design, out: str | Path | None = None, config_path: Path | None = None,
                 force: bool = False) -> BuildResult:
    """Render one design into ``out/<name>/``: the writers only render it."""
    cfg = d.config
    checks = design_checks(d, force)
    target = output_folder(cfg, out)
    try:
        with atomic_folder(target) as tmp:
            ctx = BuildContext(design=d, folder=tmp, config_path=config_path,
                               options={"masts": d.masts, "force": force})
            ctx.manifest["checks"] = checks
            ctx.manifest["operations"] = d.operation_records()
            if d.bed_fits:
                bed = cfg.print.bed
                ctx.manifest["print_bed"] = {
                    "bed_mm": [round(v, 3) for v in bed],
                    "parts": [{"part": f.part, "fits": f.fits, "turn_deg": round(f.angle_deg, 3),
                               "size_mm": [round(v, 3) for v in f.size_mm], "margin_mm": round(f.margin_mm, 3)}
                              for f in d.bed_fits]}
            ctx.summary.extend(check_summary(checks))
            run_writers(WRITERS, ctx)
            record = plan_record(d.plan, ctx.volume_mm3)
            _add_walls(record, d, ctx.solid_wall)
            if d.plate is not None:
                record["plate"] = plate_record(d.plate)
            if d.plan.split is not None:
                record["split"] = split_record(d.plan)
            _add_tap_depths(record, d)
            record.update(ctx.manifest)
            manifest = write_manifest(tmp, record)
            write_changes(tmp, ctx.changes)
    except KernelError as exc:
        saved = save_failed_config(cfg, target, config_path)
        raise KernelError(exc.key, exc.problem, f"a bug: please report it with {saved}") from None
    from generators.output import user_files

    kept = user_files(target)
    if kept:
        shown = ", ".join(kept[:5]) + (f" and {len(kept) - 5} more" if len(kept) > 5 else "")
        ctx.summary.append(f"  kept   {len(kept)} file(s) of yours in {target}/ (not written by hubwright): {shown}")
    return BuildResult(name=cfg.name, folder=target, manifest=manifest, summary=ctx.summary)


def _add_walls(record: dict[str, Any], d: Design, solid: dict | None) -> None:
    """``hub.min_wall_mm`` as measured on the solid, with the features it lies between, and
    the plan's own figure (``hub.plan_min_wall_mm``) beside it."""
    least = d.walls[0] if d.walls else None
    if least is not None:
        record["hub"]["plan_min_wall_mm"] = round(least.mm, 3)
        record["hub"]["plan_min_wall_between"] = [least.a, least.b]
    if solid and solid["between"]:
        record["hub"]["min_wall_mm"] = solid["min_wall_mm"]
        record["hub"]["min_wall_between"] = solid["between"]
        record["hub"]["min_wall_method"] = ("OCCT BRepExtrema distance between the faces of the cut"
                                            " solid, each face assigned to its cut")


def _add_tap_depths(record: dict[str, Any], d: Design) -> None:
    """``tap_depth_mm`` (threaded length) and ``tap_to_mm`` (how far from the face the thread
    ends, the tap step's depth) on every tapped hole of the manifest, as the tap steps cut it."""
    from generators.plan.operations import tap_depth_mm

    tapped = {op_hole for op in d.operations if op.operation == "tap" for op_hole in op.holes}
    for h in record.get("holes", []):
        if h.get("id") in tapped:
            hole = d.plan.hole(h["id"])
            length = tap_depth_mm(hole, d.material_class)
            start = hole.tapped.start_mm if hole.tapped is not None else 0.0
            h["tap_depth_mm"] = round(length, 6)  # the threaded length
            h["tap_to_mm"] = round(start + length, 6)  # from the face: the tap step's depth
