"""manifest.json: the plan and the build results as plain data (mm, degrees); and
changes.json, the comparison with the build a rebuild replaces (kept out of the manifest so
a rebuild's manifest equals a fresh build's)."""

from __future__ import annotations

import hashlib
import json
from pathlib import Path
from typing import Any

from generators import __version__
from generators.plan.model import Hole, HubPlan

MANIFEST = "manifest.json"
CHANGES = "changes.json"


def _r(x: float, nd: int = 6) -> float:
    v = round(float(x), nd)
    return 0.0 if v == 0 else v


def hole_record(h: Hole) -> dict[str, Any]:
    return {
        "id": h.id,
        "kind": h.kind,
        "face": h.face,
        "entry_mm": [_r(c) for c in h.entry_mm],
        "axis": [_r(c, 9) for c in h.axis],
        "diameter_mm": _r(h.diameter_mm),
        "depth_mm": _r(h.depth_mm),
        "through": h.through,
        "drill": h.drill,
        "thread": h.thread,
        "thread_percent": None if h.thread_percent is None else _r(h.thread_percent, 1),
        "countersink": None if h.countersink is None else
        {"diameter_mm": _r(h.countersink.diameter_mm), "angle_deg": _r(h.countersink.angle_deg)},
        "counterbore": None if h.counterbore is None else
        {"diameter_mm": _r(h.counterbore.diameter_mm), "depth_mm": _r(h.counterbore.depth_mm)},
        "spreader": h.spreader,
        "note": h.note,
        **({"point_deg": h.point_deg} if h.point_deg is not None else {}),
        **({"flat_bottom": True} if h.flat_bottom else {}),
        **({"exit_face": h.exit_face, "exit_mm": [_r(c) for c in h.bottom_mm]} if h.exit_face is not None else {}),
        **_thread_fields(h),
        **_print_fields(h),
    }


def _thread_fields(h: Hole) -> dict[str, Any]:
    """Where a tapped hole is threaded and the clearance before it, when the plan says."""
    run = h.tapped
    if run is None:
        return {}
    out: dict[str, Any] = {"thread_start_mm": _r(run.start_mm), "thread_length_mm": _r(run.length_mm)}
    if run.clear_mm is not None:
        out["clearance"] = {"diameter_mm": _r(run.clear_mm), "drill": run.clear_drill,
                            "depth_mm": _r(run.start_mm)}
    return out


def fastener_records(plan: HubPlan) -> list[dict[str, Any]]:
    """Every screw the plan chose: set screws, clamp screws and screws into tapped holes."""
    out = []
    for h in plan.holes:
        if h.screw is None:
            continue
        s = h.screw
        out.append({"hole": h.id, "designation": s.designation, "kind": s.kind, "thread": s.thread,
                    "length_mm": None if s.length_mm is None else _r(s.length_mm),
                    "counterbore_depth_mm": None if h.counterbore is None else _r(h.counterbore.depth_mm),
                    "standard": s.standard, "note": s.note})
    return out


def _print_fields(h: Hole) -> dict[str, Any]:
    """The printed-hub fields of a hole, only where they differ from a drilled hole."""
    out: dict[str, Any] = {}
    if h.profile != "round":
        out["profile"] = h.profile
    if h.roof_up is not None:
        out["roof_up"] = [_r(c, 9) for c in h.roof_up]
        out["roof_mm"] = _r(h.roof_mm)
    if h.across_flats_mm is not None:
        out["across_flats_mm"] = _r(h.across_flats_mm)
        out["across_corners_mm"] = _r(h.diameter_mm)
    if h.slot_dir is not None:
        out["slot_dir"] = [_r(c, 9) for c in h.slot_dir]
        out["slot_length_mm"] = _r(h.slot_length_mm)
        out["center_mm"] = [_r(c) for c in h.point_at(h.depth_mm / 2)]
    if h.slot_exit_mm is not None:
        out["slot_exit_mm"] = [_r(c) for c in h.slot_exit_mm]
    for key in ("serves", "nut", "insert"):
        if getattr(h, key) is not None:
            out[key] = getattr(h, key)
    if h.compensation_mm:
        out["compensation_mm"] = _r(h.compensation_mm)
    if h.u_bolt is not None:
        out["u_bolt"] = h.u_bolt
        if h.spreader is None:
            out["mast"] = True
    return out


def plan_record(plan: HubPlan, volume_mm3: float | None = None) -> dict[str, Any]:
    """Everything the manifest says about the hub itself."""
    from generators.standards.materials import get_material

    mat = get_material(plan.material)
    body = plan.body
    hub: dict[str, Any] = {"style": body.style, "sides": body.sides, "thickness_mm": _r(body.thickness_mm)}
    if body.style == "block":
        hub["across_flats_mm"] = _r(body.across_flats_mm)
        hub["corner_chamfer_mm"] = _r(body.corner_chamfer_mm)
    elif body.diameter_mm is None:  # a polygon plate
        hub["across_flats_mm"] = _r(body.across_flats_mm)
    else:
        hub["diameter_mm"] = _r(body.diameter_mm)
    hub.update({
        "bore_mm": _r(plan.bore_mm),
        "material": mat.id,
        "process": plan.process,
        "density_g_cm3": mat.density_g_cm3,
        "density_source": mat.source,
    })
    if volume_mm3 is not None:
        hub["volume_mm3"] = _r(volume_mm3, 1)
        hub["mass_g"] = _r(volume_mm3 / 1000.0 * mat.density_g_cm3, 1)
    return {
        "name": plan.name,
        "units_in_config": plan.units,
        "generator": {"name": "hubwright", "version": __version__},
        "mast": {"designation": plan.mast_designation, "od_mm": _r(plan.mast_od_mm)},
        "hub": hub,
        "holes": [hole_record(h) for h in plan.holes],
        "fasteners": fastener_records(plan),
        "spreaders": [
            {"id": s.id, "azimuth_deg": _r(s.azimuth_deg % 360), "elevation_deg": _r(s.elevation_deg),
             "socket_hole": s.socket_hole, "diameter_mm": _r(s.diameter_mm),
             "stop": s.stop, "stop_radius_mm": _r(s.stop_radius_mm)}
            for s in plan.spreaders
        ],
        "notes": list(plan.notes),
    }


def plate_record(layout) -> dict[str, Any]:
    """A plate hub's U-bolts (with their nuts and washers), spacings and pole stops."""
    return {
        "u_bolt_family": layout.family,
        "mast_azimuth_deg": _r(layout.mast_azimuth_deg % 360),
        "u_bolt_spacing_mm": _r(layout.spacing_mm),
        "mast_u_bolt_spacing_mm": _r(layout.mast_spacing_mm),
        "edge_margin_mm": _r(layout.edge_mm),
        "u_bolts": [{
            "id": u.id, "holds": u.holds, "spreader": u.spreader, "size": u.size.size,
            "thread": u.size.thread.designation, "inside_width_mm": _r(u.size.inside_width_mm),
            "leg_spacing_mm": _r(u.leg_spacing_mm), "leg_length_mm": _r(u.size.leg_length_mm),
            "leg_needed_mm": _r(u.leg_needed_mm), "od_held_mm": _r(u.od_mm),
            "centre_mm": [_r(c) for c in u.centre], "along": [_r(c, 9) for c in u.along],
            "holes": list(u.holes), "hole_mm": _r(u.hole_mm), "drill": u.drill, "nut_face": u.nut_face,
            "nuts": {"count": 2, "thread": u.size.thread.designation, "across_flats_mm": _r(u.nut.across_flats_mm),
                     "height_mm": _r(u.nut.height_mm), "standard": u.nut.standard},
            "washers": {"count": 2, "inside_mm": _r(u.washer.inside_mm), "outside_mm": _r(u.washer.outside_mm),
                        "thickness_mm": _r(u.washer.thickness_mm), "standard": u.washer.standard},
            "source": u.size.source,
        } for u in layout.u_bolts],
        "stops": [{"spreader": sid, "radius_mm": _r(r)} for sid, r in layout.stops],
    }


def split_record(plan) -> dict:
    """The manifest's ``split``: the plane, the gap and the bolts."""
    sp = plan.split
    r = lambda x: round(float(x), 6)  # noqa: E731
    return {
        "azimuth_deg": r(sp.azimuth_deg), "normal": [r(c) for c in sp.normal], "gap_mm": r(sp.gap_mm),
        "bore_clearance_mm": r(sp.clearance_mm), "interference_mm": r(sp.interference_mm),
        "shared_sockets": list(sp.shared), "dropped_set_screws": list(sp.dropped),
        "bolts": [{"hole": b.hole, "thread": b.thread, "screw": plan.hole(b.hole).screw.designation,
                   "length_mm": r(b.length_mm), "grip_mm": r(b.grip_mm), "offset_mm": r(b.offset_mm),
                   "height_mm": r(b.height_mm), "seat_mm": [r(c) for c in b.seat_mm], "nut_pocket": b.nut,
                   "torque_nm": r(b.torque_nm), "torque_source": b.torque_source} for b in sp.bolts],
        "halves": [{"name": h.name, "side": h.side, "holes": list(h.holes),
                    "footprint_mm": [[r(x), r(y)] for x, y in h.footprint]} for h in sp.halves],
    }


def sha256(path: Path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


def file_hashes(folder: Path) -> dict[str, str]:
    """sha256 of every file in the folder but the manifest, by relative path, sorted."""
    out = {}
    for p in sorted(folder.rglob("*")):
        if p.is_file() and p.relative_to(folder).as_posix() not in (MANIFEST, CHANGES):
            out[p.relative_to(folder).as_posix()] = sha256(p)
    return out


def write_manifest(folder: Path, record: dict[str, Any]) -> dict[str, Any]:
    """Write manifest.json with the hash of every other file; returns what was written."""
    record = dict(record)
    record["files"] = file_hashes(folder)
    path = folder / MANIFEST
    path.write_text(json.dumps(record, indent=2, sort_keys=False) + "\n", encoding="utf-8")
    return record


def previous_manifest(folder: Path, name: str) -> dict | None:
    """The manifest of the build in ``folder/name`` that this one replaces, or None when
    there is none or it is not a manifest this version can read."""
    path = folder / name / MANIFEST
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
    except (OSError, ValueError, UnicodeError, RecursionError):  # unreadable, not JSON, absurdly nested
        return None
    return data if isinstance(data, dict) else None


def write_changes(folder: Path, changes: dict[str, Any]) -> None:
    """changes.json: what differs from the previous build (empty when there was none)."""
    (folder / CHANGES).write_text(json.dumps(changes, indent=2) + "\n", encoding="utf-8")
