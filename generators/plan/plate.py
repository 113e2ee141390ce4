"""Config -> plate hub: a flat plate, each spreader held on its top face by two U-bolts,
the mast held against its bottom face by two U-bolts through it.

Frame (as for the other hubs, with the plate's centre for the mast axis): origin at the
plate's centre on the bottom face, +Z through the top face; azimuth from +X
counter-clockwise seen from the top face. The poles lie flat on the top face (elevation 0),
their axes ``d/2`` above it; the mast lies against the bottom face along ``mast_azimuth``,
its axis ``OD/2`` below it. A spreader's U-bolts go over its pole with their nuts under
the plate; the mast's go round the mast with their nuts on the top face. Each U-bolt's legs
stand one leg spacing (table inside width + rod) apart, straddling the pole or mast axis.
A polygon plate has a corner on each spreader (its flats between them).
The pole's inner end sits on a marked stop line one pole diameter inboard of its inner
U-bolt's bar (common practice: the bar never bears on the cut end).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.config.models import Config
from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import Pt, edge_distance
from generators.plan.holes import clearance_drill
from generators.plan.model import Body, Face, Hole, HubPlan, Mark, Spreader
from generators.units import format_length

OUTLINE_SEGMENTS = 180
# Hole centre to plate edge: 1.5 x the rod diameter and at least the washer's radius plus
# 1 mm (common practice; AISC 360 table J3.4 asks about 1.5 d at a sheared edge, from memory).
EDGE_OVER_ROD = 1.5
# Default spacing of a spreader's two U-bolts: 4 pole diameters (common practice: the pair
# must resist the pole's moment as a couple, so wider is stronger).
SPACING_OVER_POLE = 4.0
# Without a configured spacing, the planner steps the spreaders' spacing down from that to
# 1.5 pole diameters, and the mast's from the widest the plate allows, until nothing meets.
SEARCH_MIN_OVER_POLE, SEARCH_STEP_MM = 1.5, 5.0


@dataclass(frozen=True)
class UBolt:
    """One U-bolt on the plate: where it sits, what it holds and its two leg holes."""

    id: str
    holds: str  # "spreader" | "mast"
    spreader: int | None
    size: object  # standards.ubolts.UBoltSize
    centre: Pt  # on the held axis, in plate x, y
    along: Pt  # unit vector along the held pole or mast
    holes: tuple[str, str]
    hole_mm: float
    drill: str | None
    washer: object  # standards.ubolts.Washer
    nut: object  # standards.fasteners.HexNut
    nut_face: str  # the face the nuts bear on: bottom for spreaders, top for the mast
    od_mm: float  # of what it holds
    leg_needed_mm: float  # inside of the bend to the leg end, with the nut on and 2 pitches out

    @property
    def leg_spacing_mm(self) -> float:
        return self.size.leg_spacing_mm

    @property
    def leg_points(self) -> tuple[Pt, Pt]:
        h = self.leg_spacing_mm / 2
        px, py = -self.along[1], self.along[0]
        c = self.centre
        return (c[0] + px * h, c[1] + py * h), (c[0] - px * h, c[1] - py * h)


@dataclass(frozen=True)
class PlateLayout:
    """What the plate hub adds to its HubPlan: the U-bolts, the stops, the chosen spacings."""

    family: str
    mast_azimuth_deg: float
    edge_mm: float  # hole centre to the plate edge, spreaders' outer U-bolts
    spacing_mm: float  # between a spreader's two U-bolts
    mast_spacing_mm: float  # between the mast's two U-bolts
    u_bolts: tuple[UBolt, ...]
    stops: tuple[tuple[int, float], ...]  # (spreader, radius of the pole's inner end)

    def for_spreader(self, sid: int) -> list[UBolt]:
        return [u for u in self.u_bolts if u.spreader == sid]

    @property
    def mast_u_bolts(self) -> list[UBolt]:
        return [u for u in self.u_bolts if u.holds == "mast"]


def plate_plan(cfg: Config) -> tuple[HubPlan, PlateLayout]:
    """The plate's HubPlan (body, faces, every U-bolt hole) and its layout, or a UserError."""
    return _PlatePlanner(cfg).plan()


def _unit(az_deg: float) -> Pt:
    t = math.radians(az_deg)
    return math.cos(t), math.sin(t)


class _PlatePlanner:
    def __init__(self, cfg: Config):
        from generators.config.models import Plate

        self.cfg, self.units = cfg, cfg.units
        self.opt = cfg.plate or Plate()
        self.T, self.N = cfg.hub.thickness, cfg.spreaders.count
        self.family = self.opt.u_bolts or ("inch" if cfg.units == "in" else "metric")

    def fmt(self, mm: float) -> str:
        return format_length(mm, self.units, fractions=False)

    def plan(self) -> tuple[HubPlan, PlateLayout]:
        cfg = self.cfg
        self._refusals()
        self.body = self._body()
        faces = self._faces()
        sp = cfg.spreaders
        self.mast_az = (self.opt.mast_azimuth if self.opt.mast_azimuth is not None
                        else sp.first_azimuth + 180.0 / self.N)
        self.u_sp = self._size(sp.diameter, "spreaders.diameter")
        self.u_m = self._size(cfg.mast.size.od_mm, "mast.size")
        layout, spreaders = self._search()
        u_bolts, s_m = layout.u_bolts, layout.mast_spacing_mm
        holes = [h for u in u_bolts for h in self._holes(u)]
        notes = (f"mast along azimuth {self.mast_az % 360:g} deg on the bottom face, held by {len(layout.mast_u_bolts)}"
                 f" U-bolts {self.fmt(s_m)} apart",
                 "each pole butts on its stop line, marked on the template and plate.dxf")
        plan = HubPlan(name=cfg.name, units=cfg.units, material=cfg.hub.material, process="machined",
                       mast_designation=cfg.mast.size.designation, mast_od_mm=cfg.mast.size.od_mm, bore_mm=0.0,
                       body=self.body, faces=tuple(faces), holes=tuple(holes), spreaders=tuple(spreaders),
                       notes=notes, marks=self._marks(layout))
        return plan, layout

    # ---- layout ----------------------------------------------------------------------------
    def _search(self):
        """The layout with the widest spacings that fit: the configured ones, else the
        defaults stepped down until nothing meets (the first refusal if none fits)."""
        from generators.plan.plate_fit import check_fit

        sp, u_sp, u_m = self.cfg.spreaders, self.u_sp, self.u_m
        self.edge = self._edge(u_sp)
        t_max = min(self._reach(self.mast_az + k, u_m.leg_spacing_mm / 2, self._edge(u_m), "plate.mast_u_bolt_spacing")
                    for k in (0.0, 180.0))
        self.t_max = t_max
        self.r_out = {i: self._reach(sp.first_azimuth + i * 360.0 / self.N, u_sp.leg_spacing_mm / 2, self.edge,
                                     "plate.edge_margin") for i in range(self.N)}
        if self.opt.u_bolt_spacing:
            spacings = [self.opt.u_bolt_spacing]
        else:
            top, low = SPACING_OVER_POLE * sp.diameter, SEARCH_MIN_OVER_POLE * sp.diameter
            spacings = [top - SEARCH_STEP_MM * k for k in range(int((top - low) / SEARCH_STEP_MM) + 1)]
        if self.opt.mast_u_bolt_spacing:
            mast = [self.opt.mast_u_bolt_spacing]
        else:
            low = u_m.leg_spacing_mm
            mast = [2 * t_max - 2 * SEARCH_STEP_MM * k for k in range(int((2 * t_max - low) / (2 * SEARCH_STEP_MM)) + 1)]
        first = None
        for spacing in spacings:
            for s_m in mast:
                try:
                    layout, spreaders = self._layout(spacing, s_m)
                    check_fit(self.cfg, self.body, layout, self.fmt)
                    return layout, spreaders
                except UserError as e:
                    first = first or e
        raise first

    def _layout(self, spacing: float, s_m: float):
        cfg, sp, u_sp, u_m, edge = self.cfg, self.cfg.spreaders, self.u_sp, self.u_m, self.edge
        u_bolts, stops, spreaders = [], [], []
        for i in range(self.N):
            sid, az = i + 1, sp.first_azimuth + i * 360.0 / self.N
            r_out = self.r_out[i]
            r_in = r_out - spacing
            r_end = r_in - u_sp.rod_mm / 2 - sp.diameter
            if r_end <= 0:
                raise UserError("plate.u_bolt_spacing", f"spreader {sid}'s U-bolts {self.fmt(spacing)} apart"
                                f" leave no room for the pole's end inside the plate",
                                f"at most {self.fmt(r_out - u_sp.rod_mm / 2 - sp.diameter)}, or a larger plate")
            d = _unit(az)
            for tag, r in (("A", r_in), ("B", r_out)):
                u_bolts.append(self._u_bolt(f"U{sid}{tag}", "spreader", sid, u_sp, (r * d[0], r * d[1]), d,
                                            sp.diameter, "bottom"))
            stops.append((sid, r_end))
            mouth = (r_out * d[0], r_out * d[1], self.T + sp.diameter / 2)
            spreaders.append(Spreader(id=sid, azimuth_deg=az, elevation_deg=0.0, socket_hole="",
                                      diameter_mm=sp.diameter, outward=(d[0], d[1], 0.0), mouth_mm=mouth,
                                      bottom_mm=(r_end * d[0], r_end * d[1], self.T + sp.diameter / 2),
                                      stop_radius_mm=r_end, stop="stop line on the plate"))
        m = _unit(self.mast_az)
        t_max = self.t_max
        if s_m / 2 > t_max + 1e-6:
            raise UserError("plate.mast_u_bolt_spacing", f"{self.fmt(s_m)} puts the mast U-bolts off the plate"
                            " or too near its edge", f"at most {self.fmt(2 * t_max)}")
        for k, sign in ((1, -1.0), (2, 1.0)):
            c = (sign * s_m / 2 * m[0], sign * s_m / 2 * m[1])
            u_bolts.append(self._u_bolt(f"UM{k}", "mast", None, u_m, c, m, cfg.mast.size.od_mm, "top"))
        layout = PlateLayout(family=self.family, mast_azimuth_deg=self.mast_az, edge_mm=edge, spacing_mm=spacing,
                             mast_spacing_mm=s_m, u_bolts=tuple(u_bolts), stops=tuple(stops))
        return layout, spreaders

    # ---- what a plate cannot do ---------------------------------------------------------
    def _refusals(self):
        cfg, hub = self.cfg, self.cfg.hub
        why = "a plate hub holds its poles with U-bolts"
        if cfg.spreaders.elevation != 0:
            raise UserError("spreaders.elevation", f"{cfg.spreaders.elevation:g} deg: a plate holds its poles"
                            " flat on its face (no tilt blocks yet)", '0, or hub.style = "block" or "puck" for'
                            " tilted sockets")
        refused = (("hub.process", hub.process == "printed", "a plate is cut from sheet", '"machined"'),
                   ("hub.bore", hub.bore is not None, "the mast is clamped beside the plate, not through it",
                    "leave hub.bore out"),
                   ("hub.corner_chamfer", hub.corner_chamfer > 0, "a plate's corners are not chamfered here", "0"),
                   ("set_screws", cfg.set_screws is not None, why, "leave [set_screws] out"),
                   ("mast_clamp", cfg.mast_clamp is not None, "the mast U-bolts clamp the mast",
                    "leave [mast_clamp] out"),
                   ("holes", bool(cfg.holes), "extra holes are not placed on a plate yet", "leave [[holes]] out"),
                   ("reducers", bool(cfg.reducers), "a plate has no bore for a sleeve", "leave [[reducers]] out"),
                   ("sockets", bool(cfg.sockets), "a plate's poles lie in U-bolts, not sockets: per-socket"
                    " sizes and angles are not planned on a plate yet", "leave [[sockets]] out"))
        for key, bad, problem, accepted in refused:
            if bad:
                raise UserError(key, problem, accepted)
        for key, v in (("hub.thickness", hub.thickness), ("hub.across_flats", hub.across_flats),
                       ("hub.diameter", hub.diameter)):
            lo = 2.0 if key == "hub.thickness" else L.MIN_BODY_MM
            if v is not None and not (lo <= v <= L.MAX_BODY_MM):
                raise UserError(key, f"{self.fmt(v)} is outside what hubwright builds",
                                f"{self.fmt(lo)} to {self.fmt(L.MAX_BODY_MM)}")

    # ---- body and faces -------------------------------------------------------------------
    def _body(self) -> Body:
        hub, first = self.cfg.hub, self.cfg.spreaders.first_azimuth
        if hub.diameter is not None:
            R = hub.diameter / 2
            outline = tuple((R * math.cos(2 * math.pi * k / OUTLINE_SEGMENTS),
                             R * math.sin(2 * math.pi * k / OUTLINE_SEGMENTS)) for k in range(OUTLINE_SEGMENTS))
            return Body(style="plate", thickness_mm=self.T, diameter_mm=hub.diameter,
                        first_flat_azimuth_deg=first, outline=outline)
        n = hub.sides or self.N
        if n % self.N:
            raise UserError("hub.sides", f"{n} sides is not a multiple of spreaders.count = {self.N}",
                            f"one flat faces each spreader: {', '.join(str(self.N * k) for k in (1, 2, 3))}, ...")
        # corners on the spreaders: the longest run for their U-bolts (a square quad plate
        # with the poles along its diagonals)
        Rc = hub.across_flats / 2 / math.cos(math.pi / n)
        outline = tuple((Rc * math.cos(math.radians(first + k * 360 / n)),
                         Rc * math.sin(math.radians(first + k * 360 / n))) for k in range(n))
        return Body(style="plate", thickness_mm=self.T, sides=n, across_flats_mm=hub.across_flats,
                    first_flat_azimuth_deg=first + 180.0 / n, outline=outline)

    def _faces(self) -> list[Face]:
        T, body = self.T, self.body
        top = Face(id="top", kind="top", origin=(0.0, 0.0, T), normal=(0.0, 0.0, 1.0), u_axis=(1.0, 0.0, 0.0),
                   v_axis=(0.0, 1.0, 0.0), outline=body.outline, label="top face (the poles' side), seen from above")
        bottom = Face(id="bottom", kind="bottom", origin=(0.0, 0.0, 0.0), normal=(0.0, 0.0, -1.0),
                      u_axis=(1.0, 0.0, 0.0), v_axis=(0.0, -1.0, 0.0),
                      outline=tuple((x, -y) for x, y in reversed(body.outline)),
                      label="bottom face (the mast's side), seen from below")
        return [top, bottom]

    # ---- U-bolts ---------------------------------------------------------------------------
    def _size(self, od: float, key: str):
        from generators.standards.ubolts import select_u_bolt

        return select_u_bolt(od, self.family, key)

    def _edge(self, size) -> float:
        from generators.standards.ubolts import plain_washer

        if self.opt.edge_margin is not None:
            return self.opt.edge_margin
        return max(EDGE_OVER_ROD * size.rod_mm, plain_washer(size.thread).outside_mm / 2 + 1.0)

    def _reach(self, az: float, half: float, edge: float, key: str) -> float:
        """The largest radius along ``az`` where both legs ``half`` either side stay ``edge``
        from the plate edge (bisection on the outline)."""
        d = _unit(az)
        p = (-d[1], d[0])

        def ok(r: float) -> bool:
            pts = [(r * d[0] + s * half * p[0], r * d[1] + s * half * p[1]) for s in (-1, 1)]
            return all(edge_distance(q, self.body.outline) >= edge for q in pts)

        lo, hi = 0.0, self.body.corner_radius_mm
        if not ok(lo):
            raise UserError(key, f"the plate is too small for U-bolts {self.fmt(2 * half)} across with"
                            f" {self.fmt(edge)} to the edge", "a larger hub.diameter or hub.across_flats")
        for _ in range(60):
            mid = (lo + hi) / 2
            lo, hi = (mid, hi) if ok(mid) else (lo, mid)
        return lo

    def _u_bolt(self, uid, holds, sid, size, centre, along, od, nut_face) -> UBolt:
        from generators.plan.shop import drill_series
        from generators.standards.fasteners import clearance_hole, hex_nut
        from generators.standards.ubolts import plain_washer

        drill, dia = clearance_drill(clearance_hole(size.thread, "normal"), drill_series(self.cfg))
        washer, nut = plain_washer(size.thread), hex_nut(size.thread)
        need = od + self.T + washer.thickness_mm + nut.height_mm + 2 * size.thread.pitch_mm
        return UBolt(id=uid, holds=holds, spreader=sid, size=size, centre=centre, along=along,
                     holes=(f"{uid}-1", f"{uid}-2"), hole_mm=dia, drill=drill, washer=washer, nut=nut,
                     nut_face=nut_face, od_mm=od, leg_needed_mm=need)

    def _marks(self, layout: PlateLayout) -> tuple[Mark, ...]:
        """On the top face: each pole's stop line and footprint edges, and the mast's line,
        each clipped to the plate."""
        T, half = self.T, self.cfg.spreaders.diameter / 2
        out = []
        for sid, r_end in layout.stops:
            d = _unit(self.cfg.spreaders.first_azimuth + (sid - 1) * 360.0 / self.N)
            p = (-d[1], d[0])
            at = lambda r, s: (r * d[0] + s * p[0], r * d[1] + s * p[1], T)  # noqa: E731
            out.append(Mark("top", at(r_end, -half - 4), at(r_end, half + 4), f"S{sid} stop: pole end here"))
            for s in (-1, 1):
                start = (r_end * d[0] + s * half * p[0], r_end * d[1] + s * half * p[1])
                reach = self._to_edge(start, d)
                out.append(Mark("top", at(r_end, s * half), at(r_end + reach, s * half), dashed=True))
        m = _unit(layout.mast_azimuth_deg)
        a, b = self._to_edge((0.0, 0.0), (-m[0], -m[1])), self._to_edge((0.0, 0.0), m)
        out.append(Mark("top", (-a * m[0], -a * m[1], T), (b * m[0], b * m[1], T), "mast axis (under the plate)", True))
        return tuple(out)

    def _to_edge(self, start: Pt, d: Pt) -> float:
        """How far from ``start`` along ``d`` the plate's edge is (bisection; start inside)."""
        from generators.plan.geometry import inside_polygon

        lo, hi = 0.0, 2 * self.body.corner_radius_mm
        for _ in range(50):
            mid = (lo + hi) / 2
            lo, hi = (mid, hi) if inside_polygon((start[0] + d[0] * mid, start[1] + d[1] * mid), self.body.outline) \
                else (lo, mid)
        return lo

    def _holes(self, u: UBolt) -> list[Hole]:
        what = f"spreader {u.spreader}" if u.spreader is not None else "the mast"
        return [Hole(id=hid, kind="u_bolt", face="top", entry_mm=(p[0], p[1], self.T), axis=(0.0, 0.0, -1.0),
                     diameter_mm=u.hole_mm, depth_mm=self.T, through=True, drill=u.drill,
                     extend_mm=L.CUT_OVERRUN_MM, spreader=u.spreader, u_bolt=u.id,
                     note=f"U-bolt {u.id} ({u.size.size}, {u.size.thread.designation}) round {what}")
                for hid, p in zip(u.holes, u.leg_points)]
