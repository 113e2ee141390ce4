"""Reducer sleeves: plain-data plans of the tubes that adapt a hub's bore to smaller masts.

A sleeve sits in the hub's bore, bottom flush with the hub's bottom face, in the hub's
frame (mast axis = Z, azimuth from +X counter-clockwise). Its outside slips into the
bore (``od = bore - fit``), its inside slides over the mast (``id = mast OD + clearance``).

Decisions, so the solid, the template and the cut list agree:

- **Clamp screws.** Without a slit, the sleeve gets a clearance hole lined up with each of
  the hub's clamp holes (same azimuth and height): the screw, a wall thickness longer,
  passes through and bears on the mast, and also stops the sleeve turning. With a slit,
  the sleeve has no holes: the screw bears on the sleeve and closes it onto the mast,
  and the slit sits in the gap between sockets farthest from every clamp screw.
- **Key.** ``key = true`` leaves a flat inside the sleeve (a "D" bore) facing the first
  clamp screw (or the first gap between sockets when there is none); the mast needs a
  matching flat filed ``KEY_FLAT_DEPTH_MM`` deep. The hub itself is never changed.
- **Flange.** A ring on top of the hub's top face so the sleeve cannot drop through; it is
  kept clear of every hole on the top face.
- **Pole stop.** The sleeve is a plain tube (not slotted for the poles), so in to-bore
  sockets the spreaders butt against the sleeve's outside, ``od/2`` from the axis.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from generators.config.models import Config, Reducer
from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.model import Hole, HubPlan
from generators.units import format_length

# Diametral allowance between the sleeve's outside and the bore, by process: 0.1 mm is a
# sliding fit for a turned sleeve in a bored hole; FDM prints come out a few tenths
# oversize on the outside, so 0.3 mm (both common practice).
SLEEVE_FIT_MM = {"machined": 0.1, "printed": 0.3}
# Thinnest sleeve wall made: 1.5 mm, the hub's own web limit (plan/limits.MIN_WEB_MM;
# common practice: thinner walls tear when slit or printed with few perimeters).
MIN_SLEEVE_WALL_MM = L.MIN_WEB_MM
# Flange: 5 mm radial overhang onto the hub's top face, 3 mm thick (common practice);
# narrowed to stay 1 mm clear of the nearest hole on the top face, refused under 1.5 mm.
FLANGE_OVERHANG_MM = 5.0
FLANGE_THICKNESS_MM = 3.0
FLANGE_HOLE_MARGIN_MM = 1.0
MIN_FLANGE_OVERHANG_MM = 1.5
# Slit width: closing the diametral clearance c takes pi * c of circumference, plus 1 mm
# left open so the slit never closes solid; never under 1.5 mm (a saw kerf). Derived.
SLIT_EXTRA_MM = 1.0
MIN_SLIT_MM = 1.5
# Depth of the flat filed on the mast for a keyed sleeve: 1 mm (common practice for a
# set-screw flat).
KEY_FLAT_DEPTH_MM = 1.0


@dataclass(frozen=True)
class Flange:
    od_mm: float
    thickness_mm: float


@dataclass(frozen=True)
class Slit:
    azimuth_deg: float
    width_mm: float


@dataclass(frozen=True)
class KeyFlat:
    """A flat inside the sleeve, ``distance_mm`` from the axis, facing ``azimuth_deg``."""

    azimuth_deg: float
    distance_mm: float
    mast_flat_depth_mm: float


@dataclass(frozen=True)
class SleevePlan:
    key: str  # config key or command-line option it came from, for messages
    mast_designation: str
    mast_od_mm: float
    od_mm: float
    id_mm: float
    length_mm: float  # the part inside the bore; a flange sits on top of it
    fit_mm: float
    clearance_mm: float
    process: str
    bore_mm: float
    flange: Flange | None = None
    slit: Slit | None = None
    key_flat: KeyFlat | None = None
    holes: tuple[Hole, ...] = ()
    notes: tuple[str, ...] = field(default=())

    @property
    def wall_mm(self) -> float:
        return (self.od_mm - self.id_mm) / 2.0

    @property
    def height_mm(self) -> float:
        return self.length_mm + (self.flange.thickness_mm if self.flange else 0.0)

    def record(self) -> dict:
        """The sleeve as plain data (mm): which mast, its sizes and what holds it."""
        return {"key": self.key, "mast": self.mast_designation, "mast_od_mm": self.mast_od_mm,
                "od_mm": self.od_mm, "id_mm": self.id_mm, "wall_mm": self.wall_mm, "length_mm": self.length_mm,
                "flange": self.flange is not None, "slit": self.slit is not None, "holes": [h.id for h in self.holes]}

    @property
    def stem(self) -> str:
        return sleeve_stem(self.mast_od_mm)

    @property
    def stop_radius_mm(self) -> float:
        """Where a pole in a to-bore socket butts against this sleeve (its outside)."""
        return self.od_mm / 2.0


def sleeve_stem(mast_od_mm: float) -> str:
    """File stem named after the mast OD in mm: ``sleeve-38.35mm``."""
    text = f"{mast_od_mm:.2f}".rstrip("0").rstrip(".")
    return f"sleeve-{text}mm"


def sleeve_specs(cfg: Config, masts: tuple[str, ...] | list[str] = ()) -> list[tuple[str, Reducer]]:
    """(key, Reducer) for every ``[[reducers]]`` entry, then every ``--mast`` size."""
    from generators.standards.pipes import resolve_mast

    specs = [(f"reducers[{i}].mast", r) for i, r in enumerate(cfg.reducers)]
    for text in masts:
        size = resolve_mast(text, key="--mast", units=cfg.units)
        specs.append(("--mast", Reducer(mast=size)))
    return specs


def plan_sleeves(cfg: Config, plan: HubPlan, masts: tuple[str, ...] | list[str] = ()) -> list[SleevePlan]:
    """Sleeve plans for the config's reducers and the extra masts; one per mast OD.

    Raises ``UserError`` for a mast that cannot fit; a mast OD asked for twice is made once.
    """
    out: list[SleevePlan] = []
    seen: set[str] = set()
    for key, spec in sleeve_specs(cfg, masts):
        sleeve = plan_sleeve(cfg, plan, spec, key)
        if sleeve.stem in seen:
            continue
        seen.add(sleeve.stem)
        out.append(sleeve)
    return out


def largest_mast_mm(bore_mm: float, fit_mm: float, clearance_mm: float) -> float:
    """The largest mast OD a sleeve of at least the minimum wall can carry in this bore."""
    return bore_mm - fit_mm - clearance_mm - 2 * MIN_SLEEVE_WALL_MM


def plan_sleeve(cfg: Config, plan: HubPlan, spec: Reducer, key: str = "reducers[0].mast") -> SleevePlan:
    units = cfg.units
    fmt = lambda mm: format_length(mm, units, fractions=False)  # noqa: E731
    base = key.rsplit(".", 1)[0] if key.startswith("reducers[") else key
    process = spec.process or cfg.hub.process
    fit = spec.fit if spec.fit is not None else SLEEVE_FIT_MM[process]
    clearance = spec.clearance if spec.clearance is not None else cfg.mast.clearance
    mast = spec.mast
    bore = plan.bore_mm
    od = bore - fit
    id_ = mast.od_mm + clearance
    if process == "printed":
        # printed holes come out small by about the line width's squeeze (print.hole_compensation)
        id_ += cfg.print.hole_compensation
    wall = (od - id_) / 2
    if abs(mast.od_mm - plan.mast_od_mm) < 1e-6:
        raise UserError(key, f"the {fmt(mast.od_mm)} mast ({mast.designation}) is this hub's own mast:"
                        " it goes in the bore with no sleeve", "a smaller mast than the config's [mast] size")
    if wall < MIN_SLEEVE_WALL_MM - 1e-9:
        largest = largest_mast_mm(bore, fit, id_ - mast.od_mm)
        raise UserError(key, f"the {fmt(mast.od_mm)} mast ({mast.designation}) cannot take a sleeve in"
                        f" the {fmt(bore)} bore", f"the largest mast this bore accepts is {fmt(largest)}"
                        f" OD: a sleeve wall of at least {fmt(MIN_SLEEVE_WALL_MM)}, {fmt(fit)} fit and"
                        f" {fmt(id_ - mast.od_mm)} clearance")
    length = spec.length if spec.length is not None else plan.body.thickness_mm
    if length > plan.body.thickness_mm + 1e-9:
        raise UserError(f"{base}.length", f"{fmt(length)} is longer than the hub is thick",
                        f"at most {fmt(plan.body.thickness_mm)} (the default)")
    clamps = [h for h in plan.holes if h.kind == "clamp"]
    pins = [h for h in plan.holes if h.kind == "pin"]  # drilled through the sleeve in place
    for h in clamps + pins:
        if h.entry_mm[2] + h.radius_mm + L.MIN_EDGE_MM > length:
            what = "pin" if h.kind == "pin" else "clamp"
            raise UserError(f"{base}.length", f"a {fmt(length)} sleeve stops below the hub's {what} hole"
                            f" {h.id}", f"at least {fmt(h.entry_mm[2] + h.radius_mm + L.MIN_EDGE_MM)}")
    clamp_az = [math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) for h in clamps]
    pin_az = [math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) + k * 180.0 for h in pins for k in (0, 1)]
    notes: list[str] = []

    # the flat faces the first clamp screw, or the first gap between sockets clear of the pin
    gaps = [cfg.spreaders.first_azimuth + (k + 0.5) * 360.0 / cfg.spreaders.count for k in range(cfg.spreaders.count)]
    clear = [g for g in gaps if all(_angle_between(g, a) > 1.0 for a in pin_az)] or gaps
    face_az = clamp_az[0] if clamp_az else clear[0]
    flange = _flange(plan, od, base, fmt) if spec.flange else None
    slit = None
    if spec.slit:
        width = max(MIN_SLIT_MM, math.pi * clearance + SLIT_EXTRA_MM)
        slit = Slit(azimuth_deg=_slit_azimuth(cfg, (clamp_az or [face_az]) + pin_az, base), width_mm=width)
    key_flat = None
    if spec.key:
        az = face_az
        dist = mast.od_mm / 2 - KEY_FLAT_DEPTH_MM + clearance / 2
        key_flat = KeyFlat(azimuth_deg=az, distance_mm=dist, mast_flat_depth_mm=KEY_FLAT_DEPTH_MM)
        notes.append(f"file a flat {fmt(KEY_FLAT_DEPTH_MM)} deep on the mast facing the sleeve's flat")
    holes = () if slit else tuple(_clamp_holes(cfg, clamps, od, id_, key_flat))
    if slit and clamps:
        notes.append("the clamp screw bears on the slit sleeve and closes it onto the mast")
    elif clamps:
        notes.append(_through_sleeve_screw(clamps[0], holes[0], bore - od + id_ - mast.od_mm, fmt))
    return SleevePlan(key=key, mast_designation=mast.designation, mast_od_mm=mast.od_mm, od_mm=od,
                      id_mm=id_, length_mm=length, fit_mm=fit, clearance_mm=clearance, process=process,
                      bore_mm=bore, flange=flange, slit=slit, key_flat=key_flat, holes=holes,
                      notes=tuple(notes))


def _through_sleeve_screw(hub_hole: Hole, sleeve_hole: Hole, gap_mm: float, fmt) -> str:
    """The clamp screw that passes the sleeve wall and still bites the mast: the hub's wall,
    the sleeve's, both clearances (sleeve and mast pushed to the far side) and the pass of
    ``CLAMP_PASS_MM`` (generators/plan/screws.py)."""
    from generators.plan.screws import CLAMP_PASS_MM, sleeve_clamp_length

    # a printed clamp hole holds its screw in a captive nut: the screw's own thread
    thread = hub_hole.thread or (hub_hole.screw.thread if hub_hole.screw is not None else None)
    if not thread:
        return "the clamp screw passes through the sleeve to the mast: a screw long enough to reach it"
    cbore = hub_hole.counterbore.depth_mm if hub_hole.counterbore is not None else 0.0
    reach = hub_hole.depth_mm + sleeve_hole.depth_mm + gap_mm + CLAMP_PASS_MM
    length, words = sleeve_clamp_length(thread, reach, cbore, fmt)
    if length is None:
        return f"the clamp screw passes through the sleeve to the mast: {words}"
    return (f"the clamp screw passes through the sleeve ({fmt(sleeve_hole.depth_mm)} of wall there) to the"
            f" mast: use a {words} socket head cap screw with this sleeve (its point passes the mast surface"
            f" by at least {fmt(CLAMP_PASS_MM)} with the head down)")


def _flange(plan: HubPlan, od: float, base: str, fmt) -> Flange:
    """A ring on the top face, narrowed so it covers no hole there."""
    Rb = plan.bore_mm / 2
    limit = Rb + FLANGE_OVERHANG_MM
    limit = min(limit, plan.body.outer_radius_mm)
    for h in plan.holes:
        if h.face != "top" or h.kind == "bore":
            continue
        r = max(h.radius_mm, h.countersink.diameter_mm / 2 if h.countersink else 0.0,
                h.counterbore.diameter_mm / 2 if h.counterbore else 0.0)
        rim = math.hypot(h.entry_mm[0], h.entry_mm[1]) - r - FLANGE_HOLE_MARGIN_MM
        limit = min(limit, rim)
    if limit - Rb < MIN_FLANGE_OVERHANG_MM:
        raise UserError(f"{base}.flange", f"a flange would cover holes on the top face (only"
                        f" {fmt(max(limit - Rb, 0.0))} of overhang is clear)",
                        "flange = false, or move the top-face holes outward")
    return Flange(od_mm=2 * limit, thickness_mm=FLANGE_THICKNESS_MM)


def _angle_between(a: float, b: float) -> float:
    return abs(((a - b + 180.0) % 360.0) - 180.0)


def _slit_azimuth(cfg: Config, clamp_az: list[float], base: str) -> float:
    """Midway between two sockets, as far as possible from every clamp screw (or the flat)."""
    n = cfg.spreaders.count
    gaps = [cfg.spreaders.first_azimuth + (k + 0.5) * 360.0 / n for k in range(n)]
    free = [g for g in gaps if all(_angle_between(g, c) > 1e-6 for c in clamp_az)]
    if not free:
        raise UserError(f"{base}.slit", "every gap between sockets has a clamp screw or an end of the"
                        " through bolt, so the slit has nowhere to go", "slit = false, or fewer mast_clamp.count")
    return max(free, key=lambda g: min(_angle_between(g, c) for c in clamp_az))


def _clamp_holes(cfg: Config, clamps: list[Hole], od: float, id_: float, key_flat: KeyFlat | None) -> list[Hole]:
    """A clearance hole through the sleeve wall at each hub clamp hole."""
    from generators.plan.holes import clearance_drill
    from generators.standards.drills import default_series
    from generators.standards.fasteners import clearance_hole

    if not clamps:
        return []
    thread = cfg.mast_clamp.thread
    series = tuple(cfg.shop.drills) if cfg.shop.drills else default_series(thread)
    drill, dia = clearance_drill(clearance_hole(thread, "normal"), series)
    r_o, r_i = od / 2, id_ / 2
    if key_flat is not None:
        r_i = min(r_i, key_flat.distance_mm)
    holes = []
    for h in clamps:
        az = math.atan2(h.entry_mm[1], h.entry_mm[0])
        c, s = math.cos(az), math.sin(az)
        z = h.entry_mm[2]
        lead = L.CUT_OVERRUN_MM + r_o - math.sqrt(max(r_o ** 2 - (dia / 2) ** 2, 0.0))
        holes.append(Hole(id=h.id, kind="clamp", face="outside", entry_mm=(r_o * c, r_o * s, z),
                          axis=(-c, -s, 0.0), diameter_mm=dia, depth_mm=r_o - r_i, through=True,
                          drill=drill, extend_mm=L.CUT_OVERRUN_MM, lead_mm=lead,
                          note=f"clearance for the {thread.designation} clamp screw in hub hole {h.id}"))
    return holes
