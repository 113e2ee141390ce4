"""Build writer for reducer sleeves: ``sleeve-<mast OD>mm.step/.stl/.3mf`` per mast."""

from __future__ import annotations

from generators.cad.export import write_solid_files
from generators.cad.reducer import sleeve_solid
from generators.manifest import hole_record, previous_manifest, sha256
from generators.plan.reducer import SleevePlan
from generators.units import format_both, format_length

HUB_FILES = ("hub.step", "hub.stl", "hub.3mf")


def sleeve_record(s: SleevePlan, files: list[str], volume_mm3: float) -> dict:
    r6 = lambda x: round(float(x), 6)  # noqa: E731
    return {
        "mast": s.mast_designation, "mast_od_mm": r6(s.mast_od_mm), "od_mm": r6(s.od_mm),
        "id_mm": r6(s.id_mm), "wall_mm": r6(s.wall_mm), "length_mm": r6(s.length_mm),
        "height_mm": r6(s.height_mm), "fit_mm": r6(s.fit_mm), "clearance_mm": r6(s.clearance_mm),
        "process": s.process, "source": s.key,
        "flange": None if s.flange is None else {"od_mm": r6(s.flange.od_mm),
                                                 "thickness_mm": r6(s.flange.thickness_mm)},
        "slit": None if s.slit is None else {"azimuth_deg": r6(s.slit.azimuth_deg % 360),
                                             "width_mm": r6(s.slit.width_mm)},
        "key_flat": None if s.key_flat is None else {
            "azimuth_deg": r6(s.key_flat.azimuth_deg % 360), "distance_mm": r6(s.key_flat.distance_mm),
            "mast_flat_depth_mm": r6(s.key_flat.mast_flat_depth_mm)},
        "holes": [hole_record(h) for h in s.holes],
        "volume_mm3": round(volume_mm3, 1),
        "notes": list(s.notes),
        "files": files,
    }


def write_reducers(ctx) -> None:
    sleeves = ctx.design.sleeves
    units = ctx.config.units
    out = ctx.config.output
    records = []
    for s in sleeves:
        solid = sleeve_solid(s)
        vols = write_solid_files(solid, ctx.folder, s.stem, out.tolerance, out.angular_tolerance)
        v_solid = vols["solid_volume_mm3"]
        files = [f"{s.stem}.{ext}" for ext in ("step", "stl", "3mf")]
        records.append(sleeve_record(s, files, v_solid))
        extras = [w for w, on in (("flange", s.flange), ("slit", s.slit), ("flat", s.key_flat)) if on]
        if s.holes:
            extras.append(f"{len(s.holes)} clamp hole{'s' if len(s.holes) > 1 else ''}")
        ctx.summary.append(
            f"  sleeve {s.mast_designation}: OD {format_length(s.od_mm, units, False)},"
            f" ID {format_length(s.id_mm, units, False)}, wall {format_length(s.wall_mm, units, False)},"
            f" {format_both(s.length_mm, units)} long" + (f" ({', '.join(extras)})" if extras else "")
            + f" -> {s.stem}.*")
        for note in s.notes:
            ctx.summary.append(f"    {note}")
    ctx.manifest["reducers"] = records
    _compare_hub_files(ctx)


def _compare_hub_files(ctx) -> None:
    """Say whether the hub files are byte-identical to the build this one replaces."""
    prev = previous_manifest(ctx.folder.parent, ctx.config.name)
    if not prev or not all((ctx.folder / f).is_file() for f in HUB_FILES):
        return
    old = prev.get("files")
    if not isinstance(old, dict):
        return  # an old or odd manifest: nothing to compare with
    same = all(old.get(f) == sha256(ctx.folder / f) for f in HUB_FILES)
    ctx.changes["hub_unchanged"] = same
    ctx.summary.append("  hub    files identical to the previous build" if same else
                       "  hub    changed since the previous build: make the hub again")
