"""What must not meet on a plate hub, checked in plan view (refusals, exit 2).

Top face: the poles (from their stop lines outward), the spreader U-bolts' legs and the
mast U-bolts' washers and nuts. Bottom face: the mast (a strip along its line, one OD
wide), the mast U-bolts' legs and the spreader U-bolts' washers and nuts. A washer needs
``WASHER_GAP_MM`` of free space around it (common practice: room for a socket wrench).
"""

from __future__ import annotations

import math

from generators.errors import UserError
from generators.plan.geometry import point_segment_distance_2d

# Free space between a washer and anything it must clear (common practice: room for a socket).
WASHER_GAP_MM = 2.0


def _dist(a, b) -> float:
    return math.hypot(a[0] - b[0], a[1] - b[1])


def check_fit(cfg, body, layout, fmt) -> None:
    """Refuse a layout whose poles, mast, legs and washers meet."""
    gap = WASHER_GAP_MM
    sp = cfg.spreaders
    n = sp.count
    far = body.corner_radius_mm + sp.diameter
    spread = [u for u in layout.u_bolts if u.holds == "spreader"]
    mast = layout.mast_u_bolts
    for sid, r_end in layout.stops:
        apart = 2 * r_end * math.sin(math.pi / n)
        if apart < sp.diameter + gap:
            raise UserError("plate.u_bolt_spacing", f"the poles' ends ({fmt(r_end)} from the centre) meet their"
                            f" neighbours ({fmt(apart)} between axes, {fmt(sp.diameter)} poles)",
                            "a smaller spacing or a larger plate, so the poles stop further out")
    # top face: mast washers against the poles and the spreader legs
    for m in mast:
        wr = m.washer.outside_mm / 2
        for c in m.leg_points:
            for sid, r_end in layout.stops:
                az = math.radians(sp.first_azimuth + (sid - 1) * 360.0 / n)
                a = (r_end * math.cos(az), r_end * math.sin(az))
                b = (far * math.cos(az), far * math.sin(az))
                free = point_segment_distance_2d(c, a, b) - sp.diameter / 2 - wr
                if free < gap:
                    raise UserError("plate.mast_azimuth", f"mast U-bolt {m.id}'s nut and washer on the top face"
                                    f" come within {fmt(max(free, 0))} of spreader {sid}'s pole",
                                    f"at least {fmt(gap)}: turn the mast line (plate.mast_azimuth) between two"
                                    " spreaders, or change plate.mast_u_bolt_spacing")
            for u in spread:
                for q in u.leg_points:
                    free = _dist(c, q) - wr - u.size.rod_mm / 2
                    if free < gap:
                        raise UserError("plate.mast_u_bolt_spacing", f"mast U-bolt {m.id}'s washer meets U-bolt"
                                        f" {u.id}'s leg ({fmt(max(free, 0))} apart)",
                                        f"at least {fmt(gap)}: another mast U-bolt spacing or mast azimuth")
    # bottom face: spreader washers against the mast, the mast legs and each other
    md = (math.cos(math.radians(layout.mast_azimuth_deg)), math.sin(math.radians(layout.mast_azimuth_deg)))
    for u in spread:
        wr = u.washer.outside_mm / 2
        for c in u.leg_points:
            off = abs(-md[1] * c[0] + md[0] * c[1])
            free = off - cfg.mast.size.od_mm / 2 - wr
            along_mast = abs(u.along[0] * md[1] - u.along[1] * md[0]) < 1e-6
            if free < gap and along_mast:
                raise UserError("plate.mast_azimuth", f"spreader {u.spreader} lies along the mast's line, where its"
                                f" U-bolts' nuts under the plate meet the mast ({fmt(max(free, 0))} apart)",
                                "a mast line between spreaders; with an odd spreader count one pole is always on"
                                " it: an even count, or a block or puck hub")
            if free < gap:
                raise UserError("plate.u_bolt_spacing", f"U-bolt {u.id}'s nut and washer under the plate come within"
                                f" {fmt(max(free, 0))} of the mast", f"at least {fmt(gap)}: move the inner U-bolts"
                                " out (a smaller plate.u_bolt_spacing), a larger plate, or turn plate.mast_azimuth")
            for m in mast:
                for q in m.leg_points:
                    free = _dist(c, q) - wr - m.size.rod_mm / 2
                    if free < gap:
                        raise UserError("plate.u_bolt_spacing", f"U-bolt {u.id}'s washer meets mast U-bolt"
                                        f" {m.id}'s leg ({fmt(max(free, 0))} apart)",
                                        f"at least {fmt(gap)}: another spacing or mast azimuth")
    washers = [(u, c) for u in spread for c in u.leg_points]
    for i, (u, c) in enumerate(washers):
        for v, q in washers[i + 1:]:
            free = _dist(c, q) - (u.washer.outside_mm + v.washer.outside_mm) / 2
            if free < 0:
                raise UserError("plate.u_bolt_spacing", f"the washers of U-bolts {u.id} and {v.id} overlap"
                                f" by {fmt(-free)}", "a larger spacing between a spreader's U-bolts")
