"""A reducer sleeve seen as a small round plan of its own, so its top and rim get templates
and drilling operations from the same code as the hub.

The sleeve's own frame: bottom at Z = 0, mast axis = Z. Its outline is the flange (or the
sleeve's outside); its inside diameter is the through bore; its clamp holes sit on the rim
of the sleeve's body (where they are drilled), whose circumference sets the wrap strip.
"""

from __future__ import annotations

import math
from dataclasses import replace

from generators.plan.model import Body, Face, Hole, HubPlan

SEGMENTS = 180


def sleeve_as_plan(hub: HubPlan, sleeve) -> HubPlan:
    """A round plan of one sleeve, in its own frame (bottom at Z = 0, seen like the hub)."""
    outer = sleeve.flange.od_mm if sleeve.flange else sleeve.od_mm
    T = sleeve.height_mm
    R = outer / 2
    outline = tuple((R * math.cos(2 * math.pi * k / SEGMENTS), R * math.sin(2 * math.pi * k / SEGMENTS))
                    for k in range(SEGMENTS))
    body = Body(style="puck", thickness_mm=T, diameter_mm=outer, outline=outline)
    C = math.pi * sleeve.od_mm
    faces = (
        Face(id="top", kind="top", origin=(0.0, 0.0, T), normal=(0.0, 0.0, 1.0), u_axis=(1.0, 0.0, 0.0),
             v_axis=(0.0, 1.0, 0.0), outline=outline,
             label=f"sleeve for {sleeve.mast_designation}, top seen from above"),
        Face(id="rim", kind="rim", origin=(0.0, 0.0, 0.0), normal=(1.0, 0.0, 0.0), u_axis=(0.0, 1.0, 0.0),
             v_axis=(0.0, 0.0, 1.0), outline=((0.0, 0.0), (C, 0.0), (C, sleeve.length_mm), (0.0, sleeve.length_mm)),
             label="sleeve outside, unrolled from azimuth 0 counter-clockwise seen from above",
             rim_radius_mm=sleeve.od_mm / 2),
    )
    inside = Hole(id="ID", kind="bore", face="top", entry_mm=(0.0, 0.0, T), axis=(0.0, 0.0, -1.0),
                  diameter_mm=sleeve.id_mm, depth_mm=T, through=True, note="sleeve inside (bored or turned)")
    holes = (inside,) + tuple(h for h in sleeve.holes if h.face in ("outside", "rim"))
    holes = tuple(h if h.face != "outside" else replace(h, face="rim") for h in holes)
    notes = list(sleeve.notes)
    if sleeve.slit:
        notes.append(f"slit {sleeve.slit.width_mm:.1f} mm wide at azimuth {sleeve.slit.azimuth_deg:g} deg")
    if sleeve.key_flat:
        notes.append(f"flat inside at azimuth {sleeve.key_flat.azimuth_deg:g} deg")
    return HubPlan(name=f"{hub.name}-{sleeve.stem}", units=hub.units, material=hub.material,
                   process="machined", mast_designation=sleeve.mast_designation,
                   mast_od_mm=sleeve.mast_od_mm, bore_mm=sleeve.id_mm, body=body, faces=faces,
                   holes=holes, spreaders=(), notes=tuple(notes))
