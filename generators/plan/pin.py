"""The mast pin ([mast_pin]): one straight through hole across the whole hub and its mast.

A through bolt (or threaded rod) in a normal clearance hole (ISO 273 / ASME B18.2.8) runs
square to the mast axis through it: it enters one outer face (a flat, a chamfer or the
rim), crosses the bore on both sides by design and leaves the opposite face. The mast is
drilled in place through the hub's hole (generators/plan/pin_ops.py). Its azimuth, unless
the config gives one, is the first gap between sockets whose opposite end is a gap too,
clear of the sockets and the clamp holes at the pin's height.
"""

from __future__ import annotations

import math

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.cutters import Cutter
from generators.plan.model import Hole, Screw

PIN_ID = "P1"


def _apart(a: float, b: float) -> float:
    return abs(((a - b + 180) % 360) - 180)


def pin_holes(p, sockets: list[Hole], holes: list[Hole]) -> list[Hole]:
    """The pin hole of hub planner ``p`` (its cfg, faces, body, T, Rb, fmt, _series_for), or none."""
    from generators.plan.holes import clearance_drill
    from generators.standards.fasteners import clearance_hole

    mp = p.cfg.mast_pin
    if mp is None:
        return []
    drill, dia = clearance_drill(clearance_hole(mp.thread, "normal"), p._series_for(mp.thread))
    r = dia / 2
    z = _height(p, mp, r, drill)
    others = [h for h in holes if h.kind not in ("bore", "socket")] + _extras_ahead(p)
    places = _places(p)
    if mp.azimuth is not None:
        az = mp.azimuth % 360
        if p.body.style == "puck":  # a round rim is square to a pin at any azimuth
            places.update({az: ("rim", p.body.outer_radius_mm), (az + 180) % 360: ("rim", p.body.outer_radius_mm)})
        hit = _clash(p, az, z, r, places, sockets, others)
        if hit:
            raise UserError("mast_pin.azimuth", f"{mp.azimuth:g} deg {hit}", _fix(p, places))
    else:
        first = (p.cfg.spreaders.first_azimuth + 180 / p.N) % 360
        order = sorted(places, key=lambda a: (round((a - first) % 360, 6), a))
        if p.cfg.hub.split:  # never along the split plane (plan/split.py)
            sec = p.cfg.split
            sa = sec.azimuth if sec is not None and sec.azimuth is not None else first
            order = [a for a in order if abs((a - sa + 90) % 180 - 90) > 15] or order
        why = {}
        for a in order:
            why[a] = _clash(p, a, z, r, places, sockets, others)
            if not why[a]:
                az = a
                break
        else:
            raise UserError("mast_pin.azimuth", f"no azimuth between sockets at {p.fmt(z)} above the bottom"
                            " face has its opposite end between sockets too, clear of the sockets and clamp"
                            f" holes ({_tried(order, why)})", _fix(p, places))
    return [_hole(p, mp, az, z, r, drill, dia, places)]


def _tried(order: list[float], why: dict, shown: int = 3) -> str:
    """Why each azimuth tried is blocked: the first few, then how many more."""
    text = "; ".join(f"{a:g} deg {why[a]}" for a in order[:shown])
    more = len(order) - shown
    return text + (f"; and {more} more azimuth{'s' if more > 1 else ''}, each blocked" if more > 0 else "")


def _extras_ahead(p) -> list[Hole]:
    """The config's extra holes roughly as they will be planned (after the pin): their
    widest radius down their depth, so the pin's azimuth keeps clear of them."""
    from generators.standards.fasteners import clearance_hole, counterbore, countersink

    out = []
    for spec in p.cfg.holes:
        if spec.diameter is not None:
            r = spec.diameter / 2
        elif spec.thread is not None:
            r = spec.thread.major_mm / 2
        else:
            r = clearance_hole(spec.clearance, spec.fit) / 2
            if spec.countersink:
                r = max(r, countersink(spec.clearance).head_diameter_mm / 2)
            if spec.counterbore:
                r = max(r, counterbore(spec.clearance).diameter_mm / 2)
        top = spec.face == "top"
        out.append(Hole(id=spec.id, kind="extra", face=spec.face, entry_mm=(spec.at[0], spec.at[1], p.T if top else 0.0),
                        axis=(0.0, 0.0, -1.0 if top else 1.0), diameter_mm=2 * r,
                        depth_mm=spec.depth if spec.depth is not None else p.T, lead_mm=0.0))
    return out


def _fix(p, places) -> str:
    faces = ", ".join(f"{a:g}" for a in sorted(places)) if p.body.style == "block" else "any"
    wider = ", a wider hub.corner_chamfer" if p.body.style == "block" else ""
    return (f"a mast_pin.height above or below the sockets (as [mast_clamp] height allows for clamp holes),"
            f" a mast_pin.azimuth between sockets at both ends (faces at {faces} deg){wider}, or a smaller thread")


def _height(p, mp, r: float, drill) -> float:
    mc = p.cfg.mast_clamp
    z = mp.height if mp.height is not None else (mc.height if mc is not None and mc.height is not None else p.T / 2)
    from generators.plan.hard_limits import wall_limit_mm

    # the hard limits the finished plan is held to: the rim half a diameter from a face's
    # edge (plan/hard_limits.py) and the web minimum to the top and bottom faces
    margin = max(L.EDGE_FACTOR * 2 * r, L.MIN_EDGE_MM, wall_limit_mm(p.cfg))
    lo, hi = r + margin, p.T - r - margin
    if not (lo - 1e-9 <= z <= hi + 1e-9):
        raise UserError("mast_pin.height", f"{p.fmt(z)} puts the {drill or p.fmt(2 * r)} pin hole through or too"
                        " near the top or bottom face", f"{p.fmt(lo)} to {p.fmt(hi)} above the bottom face")
    return z


def _places(p) -> dict:
    """Azimuth -> (face id, distance of the face from the mast axis) where a pin can enter
    square to the face; on a puck every gap and socket azimuth of the rim (and any azimuth
    the config gives)."""
    if p.body.style == "puck":
        R = p.body.outer_radius_mm
        step = 180 / p.N
        return {(p.cfg.spreaders.first_azimuth + k * step) % 360: ("rim", R) for k in range(2 * p.N)}
    return {f.azimuth_deg % 360: (f.id, math.hypot(f.origin[0], f.origin[1]))
            for f in p.faces if f.kind in ("flat", "chamfer")}


def _place(places, az):
    return next((v for a, v in places.items() if _apart(a, az) < 1e-6), None)


def _ends(p, places, az, z):
    """Entry, exit and the faces, or None when there is no face square to the pin at an end."""
    a, b = _place(places, az), _place(places, az + 180)
    if a is None or b is None:
        return None
    t = math.radians(az)
    c, s = math.cos(t), math.sin(t)
    return (a[1] * c, a[1] * s, z), (-b[1] * c, -b[1] * s, z), a, b


def _clash(p, az, z, r, places, sockets, others) -> str:
    """Why a pin at ``az`` cannot go (empty when it can)."""
    ends = _ends(p, places, az, z)
    if ends is None:
        return "has no flat or chamfer square to the pin at both ends"
    entry, exit_, a, b = ends
    for fid in sorted({a[0], b[0]} - {"rim"}):  # sorted: the same message every run
        face = next(f for f in p.faces if f.id == fid)
        half_w = face.outline[1][0]
        if half_w - r < L.MIN_EDGE_MM:
            return f"enters the {fid} face ({p.fmt(2 * half_w)} wide), too narrow for the pin hole"
    pts = _surface(p, entry, exit_, r)
    for h in list(sockets) + list(others):
        # a quick look on the true cut shapes (plan/cutters.py); the measured walls decide
        gap = float(Cutter(h).sdf(pts).min()) if len(pts) else math.inf
        if gap < L.MIN_WEB_MM:
            what = f"socket {h.id}" if h.kind == "socket" else f"{h.kind.replace('_', ' ')} hole {h.id}"
            return f"runs into {what} (web {p.fmt(max(gap, 0))})"
    return ""


def _surface(p, entry, exit_, r):
    """Points on the pin's side outside the bore, about a millimetre apart."""
    import numpy as np

    d = math.dist(entry, exit_)
    axis = tuple((b - a) / d for a, b in zip(entry, exit_))
    pts = Cutter(Hole(id="?", kind="pin", face="?", entry_mm=entry, axis=axis, diameter_mm=2 * r, depth_mm=d,
                      lead_mm=0.0)).surface(1.0)
    return pts[np.hypot(pts[:, 0], pts[:, 1]) >= p.Rb]


def _hole(p, mp, az, z, r, drill, dia, places) -> Hole:
    from generators.standards.bolts import through_bolt

    entry, exit_, a, b = _ends(p, places, az, z)
    sag = lambda R: R - math.sqrt(R * R - r * r) if a[0] == "rim" else 0.0  # noqa: E731  the rim curves away
    t = math.radians(az)
    width = a[1] + b[1]
    bolt = through_bolt(mp.thread, width)
    return Hole(id=PIN_ID, kind="pin", face=a[0], exit_face=b[0], entry_mm=entry,
                axis=(-math.cos(t), -math.sin(t), 0.0), diameter_mm=dia, depth_mm=width, through=True,
                drill=drill, lead_mm=L.CUT_OVERRUN_MM + sag(a[1]), extend_mm=L.CUT_OVERRUN_MM + sag(b[1]),
                screw=pin_screw(bolt, width, p.fmt, p.cfg.hub.material, p.units),
                note=f"through bolt across the hub and the mast at {az % 360:g} deg, out at {(az + 180) % 360:g} deg")


def pin_torque_nm(bolt, hub_material: str, units: str = "mm") -> tuple[float, str]:
    """The nut's tightening torque: the torque table's figure for the thread in this hub
    material, or less where the washers would bear on the hub past half its bearing
    strength (F = T / (K d), K = 0.2; a safety factor of 2, common practice)."""
    from generators.standards.holding import K_CRUSH, default_torque_nm
    from generators.standards.materials import get_material
    from generators.standards.ubolts import plain_washer
    from generators.units import format_length, format_stress

    mat = get_material(hub_material)
    table, _ = default_torque_nm(bolt.thread, mat.material_class)
    w = plain_washer(bolt.thread)
    area = math.pi / 4 * (w.outside_mm ** 2 - w.inside_mm ** 2)
    bearing = K_CRUSH * (mat.bearing_mpa * area / 2) * bolt.thread.major_mm / 1000
    if bearing < table:
        return bearing, (f"the {format_length(w.outside_mm, units, fractions=False)} washer on the {mat.name}"
                         f" at half its {format_stress(mat.bearing_mpa, units)} bearing strength")
    return table, "the torque table's figure for the thread"


def pin_screw(bolt, width_mm: float, fmt, hub_material: str, units: str) -> Screw:
    """The fastener list's entry for the through bolt or rod."""
    from generators.plan.screws import torque_text
    from generators.units import format_length

    t = bolt.thread
    length = format_length(bolt.length_mm, "in" if t.inch else "mm")
    if bolt.kind == "hex bolt":
        designation = f"{t.designation} x {length} hex bolt"
        how = (f"a washer under the head and under the nut; {fmt(width_mm)} of hub, the bolt"
               f" {fmt(bolt.length_mm - bolt.needed_mm)} longer than the least {fmt(bolt.needed_mm)}")
    else:
        designation = f"{t.designation} threaded rod, cut to {length}"
        how = (f"a washer and a nut at each end, two pitches past each nut; {fmt(width_mm)} of hub"
               " (no stock hex bolt that long)")
    torque, why = pin_torque_nm(bolt, hub_material, units)
    note = (f"{bolt.grade}, zinc-plated or galvanised (or A2-70 stainless: bearing on the hub governs,"
            f" not the bolt) outdoors; with {' and '.join(bolt.with_parts)}; {how}; through the hub and the"
            f" mast drilled in place; tighten the nut to {torque_text(torque, units)} ({why}), then lock it"
            " with thread-locking compound (common practice)")
    return Screw(designation=designation, kind=bolt.kind, thread=t.designation, length_mm=bolt.length_mm,
                 standard=f"{bolt.standard}; nuts {bolt.nut_standard}; washers {bolt.washer_standard}", note=note)


def pin_of(plan) -> Hole | None:
    """The plan's pin hole, if it has one."""
    return next((h for h in plan.holes if h.kind == "pin"), None)


def exit_point(h: Hole):
    """Where the pin's axis leaves the body (its exit face)."""
    return h.point_at(h.depth_mm)


def exits_on(plan, face_id: str) -> list[Hole]:
    """The pins leaving by ``face_id``, each as a hole entering there (id ``<id>-exit``), so a
    template of that face marks where the pin comes out."""
    from dataclasses import replace

    return [replace(h, id=f"{h.id}-exit", face=face_id, entry_mm=h.bottom_mm, axis=tuple(-c for c in h.axis),
                    note=f"where {h.id} comes out (drilled from the {h.face} face)", exit_face=h.face)
            for h in plan.holes if h.kind == "pin" and h.exit_face == face_id]
