"""Socket holes of a hub plan, one per spreader with its own size and angles: a mixin of
the hub planner.

Each socket axis lies in the vertical plane through the mast axis at its azimuth, rises
(or, at a negative elevation, falls) outward at its elevation, and passes through
mid-thickness halfway along its horizontal run, so a tilted socket stays centred in the
body. Uses the planner's ``cfg``, ``faces``, ``body``, ``T``, ``N``, ``Rb`` and ``fmt``.
"""

from __future__ import annotations

import math

from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.geometry import polar, segment_distance
from generators.plan.holes import drill_name_for
from generators.plan.model import Hole, Spreader
from generators.plan.socket_specs import SocketSpec, socket_specs


def _ang_gap(a: float, b: float) -> float:
    return abs(((a - b + 180) % 360) - 180)


class SocketHoles:
    def _sockets(self):
        specs = socket_specs(self.cfg)
        self.specs = specs
        r_o = self.body.outer_radius_mm
        geo = [self._socket_geometry(s, r_o) for s in specs]
        self.r_s = max(g["r_s"] for g in geo)
        self._sockets_apart(specs, geo)
        for s, g in zip(specs, geo):
            self._socket_walls(s, g)
        holes, spreaders = [], []
        for s, g in zip(specs, geo):
            hole, spreader = self._socket_hole(s, g, r_o)
            holes.append(hole)
            spreaders.append(spreader)
        return holes, spreaders

    def _socket_geometry(self, s: SocketSpec, r_o: float) -> dict:
        sp = self.cfg.spreaders
        e = math.radians(s.elevation_deg)
        ae = abs(e)
        r_s = s.socket_mm / 2
        if sp.socket_depth == "to-bore":
            r_i = self.Rb
        else:
            r_i = r_o - sp.socket_depth * math.cos(e)
            if r_i < self.Rb + L.MIN_WEB_MM:
                longest = (r_o - self.Rb - L.MIN_WEB_MM) / math.cos(e)
                raise UserError("spreaders.socket_depth", f"{self.fmt(sp.socket_depth)} reaches the bore",
                                f'"to-bore", or at most {self.fmt(max(longest, 0))} to leave a web')
        rho_mid = (r_o + r_i) / 2
        z = lambda rho: self.T / 2 + (rho - rho_mid) * math.tan(e)  # noqa: E731
        return {"e": e, "ae": ae, "r_s": r_s, "r_i": r_i, "z": z}

    def _socket_walls(self, s: SocketSpec, g: dict) -> None:
        """Refuse a socket that breaks out of (or nearly reaches) the top, bottom or its flat."""
        r_o, r_i, r_s, z, e = self.body.outer_radius_mm, g["r_i"], g["r_s"], g["z"], g["e"]
        top = max(z(r_o), z(r_i)) + r_s / math.cos(e)
        bottom = min(z(r_o), z(r_i)) - r_s / math.cos(e)
        if top > self.T - L.MIN_WEB_MM or bottom < L.MIN_WEB_MM:
            side = "top" if top - self.T > -bottom else "bottom"
            if s.elevation_deg == 0:
                need = 2 * r_s + 2 * L.MIN_WEB_MM
                key = s.key("diameter", "hub.thickness") if "diameter" in s.overridden else "hub.thickness"
                raise UserError(key, f"{self.fmt(self.T)} leaves under {self.fmt(L.MIN_WEB_MM)}"
                                f" of wall above and below the {self.fmt(2 * r_s)} sockets",
                                f"at least {self.fmt(need)}, or thinner spreaders")
            raise UserError(s.key("elevation", "spreaders.elevation"),
                            f"sockets tilted {s.elevation_deg:g} deg break out of"
                            f" (or come within {self.fmt(L.MIN_WEB_MM)} of) the {side} face",
                            "less elevation, a thicker hub (hub.thickness) or a shorter socket_depth")
        if self.body.style == "block":
            flat = self._socket_face_for(s)
            half_w = flat.outline[1][0]
            if r_s > half_w - L.MIN_EDGE_MM:
                raise UserError(s.key("diameter", "spreaders.diameter"), f"the socket ({self.fmt(2 * r_s)})"
                                f" is wider than its flat ({self.fmt(2 * half_w)}) allows",
                                "a larger hub.across_flats or fewer hub.sides")

    def _socket_face_for(self, s: SocketSpec):
        if self.body.style == "puck":
            return self.faces[2]
        for f in self.faces:
            if f.kind == "flat" and _ang_gap(f.azimuth_deg, s.azimuth_deg) < 1e-6:
                return f
        step = 360 / self.body.sides
        raise UserError(s.key("azimuth", "spreaders.first_azimuth"),
                        f"no flat of this {self.body.sides}-sided block faces azimuth {s.azimuth_deg % 360:g} deg",
                        f"{self.body.first_flat_azimuth_deg % 360:g} deg plus a multiple of {step:g} deg"
                        ", more hub.sides, or a puck")

    def _sockets_apart(self, specs, geo):
        """Every pair of sockets keeps a web between their cutter paths (to the end point
        each reaches): the closest distance of the two axis segments less both radii."""
        segs = []
        for s, g in zip(specs, geo):
            r_o, r_i = self.body.outer_radius_mm, g["r_i"]
            segs.append((polar(r_o, s.azimuth_deg, g["z"](r_o)), polar(r_i, s.azimuth_deg, g["z"](r_i))))
        what = "bore" if self.cfg.spreaders.socket_depth == "to-bore" else "socket floor circle"
        for i in range(len(specs)):
            for j in range(i + 1, len(specs)):
                a, b = specs[i], specs[j]
                web = segment_distance(*segs[i], *segs[j]) - geo[i]["r_s"] - geo[j]["r_s"]
                if web >= L.MIN_WEB_MM:
                    continue
                told = (f"web {self.fmt(web)}" if web >= 0 else f"they overlap by {self.fmt(-web)}")
                if not self.cfg.sockets:
                    half = math.pi / self.N
                    need = 2 * ((geo[i]["r_s"] + L.MIN_WEB_MM / 2) / math.sin(half))
                    raise UserError("spreaders.diameter", f"{self.N} sockets of {self.fmt(2 * geo[i]['r_s'])}"
                                    f" meet before the {what} ({self.fmt(2 * geo[i]['r_i'])} across): {told}",
                                    f"a {what} of at least {self.fmt(need)} (hub.bore), fewer or thinner spreaders")
                s = b if b.entry is not None else a
                field = next((f for f in ("diameter", "azimuth", "elevation", "fit") if f in s.overridden), "index")
                raise UserError(s.key(field, f"sockets[{s.entry}].index"),
                                f"sockets S{a.index} and S{b.index} meet before the {what}: {told}",
                                f"at least {self.fmt(L.MIN_WEB_MM)} between them: more azimuth apart,"
                                " thinner poles, other elevations or a larger bore")

    def _socket_point(self, diameter: float, drill: str | None, depth: float, extend: float) -> float | None:
        """The drill point below a blind socket's floor when the shop makes it with a twist
        drill (straight, or opened up from an under-size one): the pole seats on the full
        diameter, and the point runs on towards the bore."""
        from generators.plan.hub_extras import DRILL_POINT_DEG
        from generators.plan.shop import cutter_for

        if extend > 0 or self.cfg.hub.process == "printed":
            return None
        c = cutter_for(diameter, drill, depth, False, self._mat_class(), self._series_for(None), self.units)
        return DRILL_POINT_DEG if c.method in ("drill", "open_up") else None

    def _point_fits(self, r_s: float, r_i: float, e: float) -> bool:
        """Whether a drill point under the floor at ``r_i`` keeps the recommended wall to the
        bore (else the floor is squared flat, plan/operations.py says how)."""
        from generators.plan.hub_extras import DRILL_POINT_DEG
        from generators.plan.rules.base import MIN_WALL_MM, RECOMMENDED_OVER_MIN

        tip = r_s / math.tan(math.radians(DRILL_POINT_DEG / 2))
        return r_i - tip * math.cos(e) - self.Rb >= RECOMMENDED_OVER_MIN * MIN_WALL_MM[self._mat_class()]

    def _socket_hole(self, s: SocketSpec, g: dict, r_o: float):
        sp = self.cfg.spreaders
        e, ae, r_s, r_i, z = g["e"], g["ae"], g["r_s"], g["r_i"], g["z"]
        depth = (r_o - r_i) / math.cos(e)
        lead = L.CUT_OVERRUN_MM + r_s * math.tan(ae)
        if self.body.style == "puck":
            lead += r_o - math.sqrt(max(r_o ** 2 - r_s ** 2, 0.0))
        if sp.socket_depth == "to-bore":
            rho_end = math.sqrt(max(self.Rb ** 2 - r_s ** 2, 0.0)) - r_s * math.sin(ae) - 0.2
            extend = (r_i - max(rho_end, 0.0)) / math.cos(e)
            stop_r, stop = self._stop()
        else:
            extend, stop_r, stop = 0.0, r_i, "socket floor"
        az = s.azimuth_deg
        t = math.radians(az)
        axis = (-math.cos(e) * math.cos(t), -math.cos(e) * math.sin(t), -math.sin(e))
        entry = polar(r_o, az, z(r_o))
        face = self._socket_face_for(s)
        i = s.index
        drill = drill_name_for(2 * r_s, self._series_for(None))
        point = self._socket_point(2 * r_s, drill, depth, extend)
        flat = point is not None and not self._point_fits(r_s, r_i, e)
        point = None if flat else point
        hole = Hole(id=f"S{i}", kind="socket", face=face.id, entry_mm=entry, axis=axis,
                    diameter_mm=2 * r_s, depth_mm=depth, extend_mm=extend, lead_mm=lead,
                    drill=drill, spreader=i, note=f"spreader {i}",
                    point_deg=point, flat_bottom=flat)
        spreader = Spreader(id=i, azimuth_deg=az, elevation_deg=s.elevation_deg, socket_hole=hole.id,
                            diameter_mm=s.pole_mm, outward=(-axis[0], -axis[1], -axis[2]), mouth_mm=entry,
                            bottom_mm=hole.bottom_mm, stop_radius_mm=stop_r, stop=stop)
        return hole, spreader
