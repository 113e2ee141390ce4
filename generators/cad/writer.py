"""Build writer for the hub solid: hub.step, hub.stl, hub.3mf."""

from __future__ import annotations

from generators.cad.export import write_solid_files
from generators.cad.solids import hub_solid


def write_hub(ctx) -> None:
    out = ctx.config.output
    solid = hub_solid(ctx.plan)
    vols = write_solid_files(solid, ctx.folder, "hub", out.tolerance, out.angular_tolerance,
                             keep=ctx.meshes)
    v_solid, v_mesh = vols["solid_volume_mm3"], vols["mesh_volume_mm3"]
    ctx.volume_mm3 = v_solid
    ctx.manifest["mesh"] = {"tolerance_mm": out.tolerance, "angular_tolerance_deg": out.angular_tolerance,
                            "stl_volume_mm3": round(v_mesh, 1)}
