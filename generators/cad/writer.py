"""Build writer for the hub solid: hub.step, hub.stl, hub.3mf (a plate hub: plate.*); a
split hub also hub-a.* and hub-b.*, one set per half, with hub.* the two halves in place."""

from __future__ import annotations

from generators.cad.export import write_solid_files
from generators.cad.solids import hub_solid


def write_hub(ctx) -> None:
    out = ctx.config.output
    solid = hub_solid(ctx.plan)
    if ctx.plan.split is not None:
        solid_wall_of = solid
        solid = _write_halves(ctx, solid)
    vols = write_solid_files(solid, ctx.folder, ctx.plan.file_stem, out.tolerance, out.angular_tolerance,
                             keep=ctx.meshes)
    v_solid, v_mesh = vols["solid_volume_mm3"], vols["mesh_volume_mm3"]
    ctx.volume_mm3 = v_solid
    ctx.solid_wall = solid_wall(solid_wall_of if ctx.plan.split is not None else solid, ctx)
    ctx.manifest["mesh"] = {"tolerance_mm": out.tolerance, "angular_tolerance_deg": out.angular_tolerance,
                            "stl_volume_mm3": round(v_mesh, 1)}


def _write_halves(ctx, hub):
    """hub-a.* and hub-b.*, ctx.manifest["parts"]; returns the two halves in place."""
    from generators.cad.split import assembled, half_solids
    from generators.standards.materials import get_material

    out, plan = ctx.config.output, ctx.plan
    density = get_material(plan.material).density_g_cm3
    halves = half_solids(plan, hub)
    parts = []
    for (name, solid), half in zip(halves, plan.split.halves):
        vols = write_solid_files(solid, ctx.folder, name, out.tolerance, out.angular_tolerance, keep=ctx.meshes)
        v = vols["solid_volume_mm3"]
        parts.append({"name": name, "files": [f"{name}.step", f"{name}.stl", f"{name}.3mf"],
                      "volume_mm3": round(v, 1), "mass_g": round(v / 1000.0 * density, 1),
                      "stl_volume_mm3": round(vols["mesh_volume_mm3"], 1), "holes": list(half.holes)})
        ctx.summary.append(f"  half   {name}: {v / 1000.0 * density:.0f} g ({name}.step, .stl, .3mf)")
    ctx.manifest["parts"] = parts
    return assembled(halves)


def solid_wall(solid, ctx) -> dict:
    """The least wall measured on the cut solid; refused (exit 2, the plan's key) when it is
    under a hard limit, whatever the plan said."""
    from generators.cad.walls import measure_solid_wall
    from generators.plan.hard_limits import check_hard_limits
    from generators.plan.measured_walls import Wall

    m = measure_solid_wall(solid, ctx.plan)
    if m["between"]:
        a, b = m["between"]
        if a.startswith("face:"):
            a, b = b, a
        check_hard_limits(ctx.config, ctx.plan, [Wall(a=a, b=b, mm=m["min_wall_mm"], at=(0.0, 0.0, 0.0))],
                          edges=False)
    return m
