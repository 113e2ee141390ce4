"""Build writer for the hub solid: hub.step, hub.stl, hub.3mf (a plate hub: plate.*)."""

from __future__ import annotations

from generators.cad.export import write_solid_files
from generators.cad.solids import hub_solid


def write_hub(ctx) -> None:
    out = ctx.config.output
    solid = hub_solid(ctx.plan)
    vols = write_solid_files(solid, ctx.folder, ctx.plan.file_stem, out.tolerance, out.angular_tolerance,
                             keep=ctx.meshes)
    v_solid, v_mesh = vols["solid_volume_mm3"], vols["mesh_volume_mm3"]
    ctx.volume_mm3 = v_solid
    ctx.solid_wall = solid_wall(solid, ctx)
    ctx.manifest["mesh"] = {"tolerance_mm": out.tolerance, "angular_tolerance_deg": out.angular_tolerance,
                            "stl_volume_mm3": round(v_mesh, 1)}


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
