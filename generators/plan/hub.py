"""Config → HubPlan: the body and every hole of the hub, and the refusals.

The sockets (each with its own size and angles) are planned in plan/hub_sockets.py,
set-screw and clamp holes in plan/hub_fasteners.py, extra holes in plan/hub_extras.py.
"""

from __future__ import annotations

import math

from generators.config.models import Config
from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import edge_distance
from generators.plan.hub_extras import ExtraHoles
from generators.plan.hub_fasteners import FastenerHoles
from generators.plan.hub_sockets import SocketHoles
from generators.plan.model import Body, Face, Hole, HubPlan
from generators.plan.pin import pin_holes
from generators.plan.holes import drill_name_for, material_class
from generators.units import format_length

PUCK_OUTLINE_SEGMENTS = 180


def build_plan(cfg: Config) -> HubPlan:
    """The complete hub plan, or a ``UserError`` naming what cannot be built."""
    return _Planner(cfg).plan()


class _Planner(SocketHoles, FastenerHoles, ExtraHoles):
    def __init__(self, cfg: Config):
        self.cfg = cfg
        self.units = cfg.units
        self.T = cfg.hub.thickness
        self.N = cfg.spreaders.count
        self.notes: list[str] = []

    def fmt(self, mm: float) -> str:
        return format_length(mm, self.units, fractions=False)

    # ---- body -------------------------------------------------------------------------
    def plan(self) -> HubPlan:
        cfg = self.cfg
        self._check_sizes()
        self.body = self._body()
        self.mast_od = cfg.mast.size.od_mm
        self.bore = cfg.hub.bore if cfg.hub.bore is not None else self.mast_od + cfg.mast.clearance
        self.Rb = self.bore / 2
        self._check_bore()
        self.faces = self._faces()
        holes = [Hole(id="bore", kind="bore", face="top", entry_mm=(0.0, 0.0, self.T),
                      axis=(0.0, 0.0, -1.0), diameter_mm=self.bore, depth_mm=self.T, through=True,
                      drill=drill_name_for(self.bore, self._series_for(None)),
                      extend_mm=L.CUT_OVERRUN_MM)]
        sockets, spreaders = self._sockets()
        self.spreader_of = {sp.id: sp for sp in spreaders}
        holes += sockets
        holes += self._set_screws(sockets)
        holes += self._clamps(sockets)
        holes += pin_holes(self, sockets, holes)
        holes += self._extras(holes, sockets)
        plan = HubPlan(name=cfg.name, units=cfg.units, material=cfg.hub.material,
                       process=cfg.hub.process, mast_designation=cfg.mast.size.designation,
                       mast_od_mm=self.mast_od, bore_mm=self.bore, body=self.body,
                       faces=tuple(self.faces), holes=tuple(holes), spreaders=tuple(spreaders),
                       notes=tuple(self.notes))
        if cfg.hub.process == "printed":
            from generators.plan.printed import printed_plan

            plan = printed_plan(plan, cfg)
        if cfg.hub.split:
            from generators.plan.split import split_plan

            plan = split_plan(plan, cfg)
        return plan

    def _check_sizes(self):
        hub = self.cfg.hub
        for key, v in (("hub.thickness", hub.thickness), ("hub.across_flats", hub.across_flats),
                       ("hub.diameter", hub.diameter)):
            if v is not None and not (L.MIN_BODY_MM <= v <= L.MAX_BODY_MM):
                raise UserError(key, f"{self.fmt(v)} is outside what hubwright builds",
                                f"{self.fmt(L.MIN_BODY_MM)} to {self.fmt(L.MAX_BODY_MM)}")

    def _body(self) -> Body:
        hub, sp = self.cfg.hub, self.cfg.spreaders
        if hub.style == "puck":
            R = hub.diameter / 2
            outline = tuple((R * math.cos(2 * math.pi * k / PUCK_OUTLINE_SEGMENTS),
                             R * math.sin(2 * math.pi * k / PUCK_OUTLINE_SEGMENTS))
                            for k in range(PUCK_OUTLINE_SEGMENTS))
            return Body(style="puck", thickness_mm=self.T, diameter_mm=hub.diameter,
                        first_flat_azimuth_deg=sp.first_azimuth, outline=outline)
        n = hub.sides or self.N
        if n % self.N:
            multiples = ", ".join(str(self.N * k) for k in (1, 2, 3))
            raise UserError("hub.sides", f"{n} sides is not a multiple of spreaders.count = {self.N}",
                            f"one flat faces each socket: {multiples}, ...")
        a = hub.across_flats / 2
        edge = 2 * a * math.tan(math.pi / n)
        leg = hub.corner_chamfer / (2 * math.cos(math.pi / n))
        if 2 * leg >= edge - 1e-6:
            raise UserError("hub.corner_chamfer", f"{self.fmt(hub.corner_chamfer)} is wider than the"
                            " flats allow", f"less than {self.fmt(edge * math.cos(math.pi / n))}")
        Rc = a / math.cos(math.pi / n)
        outline = []
        for k in range(n):
            corner = math.radians(sp.first_azimuth + (k + 0.5) * 360 / n)
            cx, cy = Rc * math.cos(corner), Rc * math.sin(corner)
            if leg <= 0:
                outline.append((cx, cy))
                continue
            # edge directions from the corner towards the previous and the next corner
            for sign in (-1, 1):
                other = math.radians(sp.first_azimuth + (k + 0.5 + sign) * 360 / n)
                ox, oy = Rc * math.cos(other), Rc * math.sin(other)
                dx, dy = ox - cx, oy - cy
                d = math.hypot(dx, dy)
                outline.append((cx + dx / d * leg, cy + dy / d * leg))
        return Body(style="block", thickness_mm=self.T, sides=n, across_flats_mm=hub.across_flats,
                    corner_chamfer_mm=hub.corner_chamfer, first_flat_azimuth_deg=sp.first_azimuth,
                    outline=tuple(outline))

    def _check_bore(self):
        if self.mast_od > self.bore + 1e-9:
            raise UserError("hub.bore", f"the mast ({self.fmt(self.mast_od)} OD) is larger than the bore"
                            f" ({self.fmt(self.bore)})", f"a bore of at least {self.fmt(self.mast_od)}")
        r_in = self.body.outer_radius_mm
        if self.body.style == "block" and self.body.corner_chamfer_mm > 0:
            n = self.body.sides
            r_in = min(r_in, self.body.corner_radius_mm
                       - self.body.corner_chamfer_mm / (2 * math.cos(math.pi / n)) * math.sin(math.pi / n))
        wall = r_in - self.Rb
        if wall < L.MIN_BORE_WALL_MM:
            size_key = "hub.diameter" if self.body.style == "puck" else "hub.across_flats"
            key = "hub.bore" if self.cfg.hub.bore is not None else "mast.size"
            raise UserError(key, f"the bore ({self.fmt(self.bore)}) leaves a wall of"
                            f" {self.fmt(max(wall, 0))} to the outside",
                            f"at least {self.fmt(L.MIN_BORE_WALL_MM)}: a smaller mast or bore, or a larger {size_key}")

    # ---- faces ------------------------------------------------------------------------
    def _faces(self) -> list[Face]:
        T, body = self.T, self.body
        top = Face(id="top", kind="top", origin=(0.0, 0.0, T), normal=(0.0, 0.0, 1.0),
                   u_axis=(1.0, 0.0, 0.0), v_axis=(0.0, 1.0, 0.0), outline=body.outline,
                   label="top face, seen from above")
        bottom = Face(id="bottom", kind="bottom", origin=(0.0, 0.0, 0.0), normal=(0.0, 0.0, -1.0),
                      u_axis=(1.0, 0.0, 0.0), v_axis=(0.0, -1.0, 0.0),
                      outline=tuple((x, -y) for x, y in reversed(body.outline)),
                      label="bottom face, seen from below")
        faces = [top, bottom]
        if body.style == "puck":
            C = math.pi * body.diameter_mm
            faces.append(Face(id="rim", kind="rim", origin=(0.0, 0.0, 0.0), normal=(1.0, 0.0, 0.0),
                              u_axis=(0.0, 1.0, 0.0), v_axis=(0.0, 0.0, 1.0),
                              outline=((0.0, 0.0), (C, 0.0), (C, T), (0.0, T)),
                              label="rim, unrolled from azimuth 0 counter-clockwise seen from above",
                              rim_radius_mm=body.diameter_mm / 2))
            return faces
        n, a = body.sides, body.outer_radius_mm
        leg = body.corner_chamfer_mm / (2 * math.cos(math.pi / n))
        flat_w = 2 * a * math.tan(math.pi / n) - 2 * leg
        for k in range(n):
            az = body.first_flat_azimuth_deg + k * 360 / n
            faces.append(self._side_face(f"flat-{k + 1}", "flat", az, a, flat_w))
        if body.corner_chamfer_mm > 0:
            d_c = body.corner_radius_mm - leg * math.sin(math.pi / n)
            for k in range(n):
                az = body.first_flat_azimuth_deg + (k + 0.5) * 360 / n
                faces.append(self._side_face(f"chamfer-{k + 1}", "chamfer", az, d_c, body.corner_chamfer_mm))
        return faces

    def _side_face(self, fid, kind, az, dist, width) -> Face:
        t = math.radians(az)
        n = (math.cos(t), math.sin(t), 0.0)
        return Face(id=fid, kind=kind, origin=(dist * n[0], dist * n[1], 0.0), normal=n,
                    u_axis=(-math.sin(t), math.cos(t), 0.0), v_axis=(0.0, 0.0, 1.0),
                    outline=((-width / 2, 0.0), (width / 2, 0.0), (width / 2, self.T), (-width / 2, self.T)),
                    azimuth_deg=az, label=f"{kind} face at {az % 360:.1f} deg, seen from outside, top edge up")

    # ---- sockets (generators/plan/hub_sockets.py) -------------------------------------
    def _stop(self) -> tuple[float, str]:
        """What a pole in a to-bore socket butts against, as a horizontal radius."""
        fitted = self.mast_od + self.cfg.mast.clearance
        if self.cfg.reducers or self.bore > fitted + 1e-6:
            return self.Rb, "sleeve in the bore"
        return self.mast_od / 2, "mast"

    # ---- tapped and drilled holes -----------------------------------------------------
    def _series_for(self, thread):
        from generators.standards.drills import default_series

        from generators.plan.shop import drill_series

        if thread is not None and not self.cfg.shop.drills:
            return default_series(thread)
        return drill_series(self.cfg)

    def _mat_class(self) -> str:
        return material_class(self.cfg.hub.material)

    def _edge_check(self, key: str, face: Face, p_face, radius: float, what: str):
        need = max(L.EDGE_FACTOR * 2 * radius, L.MIN_EDGE_MM)
        d = edge_distance(p_face, face.outline) - radius
        if d < need:
            raise UserError(key, f"{what} comes within {self.fmt(max(d, 0))} of the edge of the {face.id} face",
                            f"at least {self.fmt(need)} (half the hole diameter, common practice)")
