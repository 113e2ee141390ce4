"""Build writers for the extra parts: the drill-press angle jig (machined hubs with tilted
sockets), the spreader tip cap ([tip_cap]) and the print checks of a printed hub."""

from __future__ import annotations

from generators.cad.export import mesh_of, write_3mf, write_step, write_stl
from generators.plan.kinds import is_pocket
from generators.units import format_both


def _r(x: float) -> float:
    return round(float(x), 3)


def write_jig(ctx) -> None:
    """jig.step, jig.stl and jig.dxf (and jig-<angle>deg.* for each further socket angle);
    ctx.manifest["jig"] (the first) and ["jigs"] (all)."""
    plan, cfg = ctx.plan, ctx.config
    jigs = ctx.design.jigs or ((ctx.design.jig,) if ctx.design.jig is not None else ())
    if not jigs:
        reason = ctx.design.jig_reason
        if plan.process == "machined" and any(abs(s.elevation_deg) > 0 for s in plan.spreaders):
            ctx.manifest["jig"] = {"made": False, "reason": reason}
            ctx.summary.append(f"  jig    none: {reason}")
        return
    from generators.cad.jig import jig_solid

    out = cfg.output
    records = []
    for jig in jigs:
        solid = jig_solid(jig)
        write_step(solid, ctx.folder / f"{jig.stem}.step")
        write_stl(mesh_of(solid, out.tolerance, out.angular_tolerance, feature="jig"),
                  ctx.folder / f"{jig.stem}.stl")
        setup = ("lay the hub on the flat opposite the socket to drill, bottom face against the fence;"
                 " the socket axis is then vertical under the drill; clamp the jig to the table")
        if jig.flipped:
            setup += (f"; {', '.join(jig.flipped)} fall outward: drill them with the hub upside down"
                      " (top face against the fence)")
        records.append({
            "made": True,
            "files": [f"{jig.stem}.step", f"{jig.stem}.stl", f"{jig.stem}.dxf"],
            "wedge_angle_deg": _r(jig.wedge_angle_deg),
            "width_mm": _r(jig.width_mm),
            "slope_length_mm": _r(jig.slope_length_mm),
            "base_length_mm": _r(jig.base_length_mm),
            "low_height_mm": _r(jig.low_height_mm),
            "high_height_mm": _r(jig.high_height_mm),
            "fence_height_mm": _r(jig.fence_height_mm),
            "fence_thickness_mm": _r(jig.fence_thickness_mm),
            "rests_on": {hole: face for hole, face in jig.rests_on},
            "upside_down": list(jig.flipped),
            "setup": setup,
            "volume_mm3": round(float(solid.Volume()), 1),
        })
        ctx.summary.append(f"  jig    {jig.wedge_angle_deg:g} deg wedge, {format_both(jig.width_mm, cfg.units)}"
                           f" wide ({jig.stem}.step, .stl, .dxf): drill "
                           f"{', '.join(h for h, _ in jig.rests_on)} with the hub on it")
    ctx.manifest["jig"] = records[0]
    ctx.manifest["jigs"] = records


def write_tip_cap(ctx) -> None:
    """tipcap.stl and tipcap.3mf; ctx.manifest["tip_cap"]."""
    cap = ctx.design.tip_cap
    if cap is None:
        return
    from generators.cad.printed import print_problems, threemf_unit
    from generators.cad.tipcap import tip_cap_solid

    out = ctx.config.output
    solid = tip_cap_solid(cap)
    mesh = mesh_of(solid, out.tolerance, out.angular_tolerance, feature="tip cap")
    write_stl(mesh, ctx.folder / "tipcap.stl")
    write_3mf(mesh, ctx.folder / "tipcap.3mf")
    units = ctx.config.units
    ctx.manifest["tip_cap"] = {
        "files": ["tipcap.stl", "tipcap.3mf"],
        "depth_mm": _r(cap.depth_mm),
        "bore_mm": _r(cap.bore_mm),
        "modelled_bore_mm": _r(cap.modelled_bore_mm),
        "end_thickness_mm": _r(cap.end_thickness_mm),
        "length_mm": _r(cap.length_mm),
        "outer_diameter_mm": _r(cap.outer_diameter_mm),
        "wall_mm": _r(cap.wall_mm),
        "tip_diameter_mm": _r(cap.tip_diameter_mm),
        "fit_mm": _r(cap.fit_mm),
        "cord_hole_mm": _r(cap.cord_hole.diameter_mm),
        "cord_hole_z_mm": _r(cap.cord_hole.entry_mm[2]),
        "unit_3mf": threemf_unit(ctx.folder / "tipcap.3mf"),
        "print_problems": print_problems(mesh),
    }
    ctx.summary.append(f"  cap    tip cap for a {format_both(cap.tip_diameter_mm, units)} tip,"
                       f" {format_both(cap.depth_mm, units)} deep, {format_both(cap.length_mm, units)} long"
                       " (tipcap.stl, tipcap.3mf): print one per spreader, closed end down")


def write_print_checks(ctx) -> None:
    """For a printed hub: the bed, unit and overhang checks of hub.stl / hub.3mf, and the nuts."""
    if ctx.plan.process != "printed":
        return
    import trimesh

    from generators.cad.printed import print_problems, threemf_unit
    from generators.plan.printed import (
        BRIDGE_LIMIT_MM,
        MIN_WALL_LINES,
        OVERHANG_DEG,
        min_wall_mm,
    )

    mesh = ctx.meshes.get("hub")  # the mesh hub.stl was written from, still in memory
    if mesh is None:
        mesh = trimesh.load(ctx.folder / "hub.stl", force="mesh")
    problems = print_problems(mesh)
    nuts: dict[tuple, int] = {}
    for h in ctx.plan.holes:
        if is_pocket(h):
            key = (h.kind, h.thread, h.nut or h.insert)
            nuts[key] = nuts.get(key, 0) + 1
    pr = ctx.config.print
    ctx.manifest["print"] = {
        "orientation": "bottom face on the bed, as modelled",
        "min_z_mm": round(float(mesh.bounds[0][2]), 6),
        "unit_3mf": threemf_unit(ctx.folder / "hub.3mf"),
        "hole_compensation_mm": pr.hole_compensation,
        "nut_allowance_mm": pr.nut_allowance,
        "line_width_mm": pr.line_width,
        "min_wall_lines": MIN_WALL_LINES,
        "min_wall_mm": round(min_wall_mm(ctx.config), 3),
        "overhang_limit_deg": OVERHANG_DEG,
        "bridge_limit_mm": BRIDGE_LIMIT_MM,
        "problems": problems,
        "fasteners": [{"kind": k, "thread": t, "part": d, "count": n} for (k, t, d), n in sorted(nuts.items())],
    }
    for p in problems:
        ctx.summary.append(f"  print  warning: {p}")
