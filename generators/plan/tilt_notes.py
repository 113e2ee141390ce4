"""How a tilted hole leans on its face, and the words that set the work up for it.

One source for the template's notes and the report's schedule, so both tell the builder the
same tilt, the same way to hold the work, and the same jig.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from generators.plan.geometry import Vec, dot
from generators.plan.model import Face, Hole, HubPlan

# Holes closer to square than this are drilled square (a drill press table reads to about
# half a degree; common practice).
TILT_MIN_DEG = 0.05


@dataclass(frozen=True)
class Tilt:
    deg: float
    du: float  # unit in-plane direction the drill tip moves as it goes in
    dv: float
    towards: str  # "the bottom face", "the top face" or a direction on the sheet


def face_axes(face: Face, p: Vec) -> tuple[Vec, Vec, Vec]:
    """(outward normal, u, v) of the face at ``p``; a rim's u runs counter-clockwise seen from above."""
    if face.kind != "rim":
        return face.normal, face.u_axis, face.v_axis
    t = math.atan2(p[1], p[0])
    return (math.cos(t), math.sin(t), 0.0), (-math.sin(t), math.cos(t), 0.0), (0.0, 0.0, 1.0)


def tilt_of(face: Face, hole: Hole) -> Tilt | None:
    """The lean of ``hole`` off square to ``face`` at its entry; None when it is square."""
    _n, u, v = face_axes(face, hole.entry_mm)
    du, dv = dot(hole.axis, u), dot(hole.axis, v)
    s = math.hypot(du, dv)
    deg = math.degrees(math.asin(min(s, 1.0)))
    if deg < TILT_MIN_DEG:
        return None
    du, dv = du / s, dv / s
    if face.kind in ("flat", "chamfer", "rim") and abs(du) < 1e-6:
        towards = "the bottom face" if dv < 0 else "the top face"
    else:
        towards = f"{math.degrees(math.atan2(dv, du)) % 360:.1f} deg on the sheet (0 = right, 90 = up)"
    return Tilt(deg=deg, du=du, dv=dv, towards=towards)


def face_tilts(plan: HubPlan, face_id: str) -> dict[str, Tilt]:
    face = plan.face(face_id)
    out = {}
    for h in plan.holes_on(face_id):
        t = tilt_of(face, h)
        if t is not None:
            out[h.id] = t
    return out


def _jig_note(plan: HubPlan, cfg, face: Face) -> str:
    from generators.plan.jig import jig_reason

    if face.kind != "flat" or jig_reason(plan, cfg) is not None:
        return ""
    falls = any(h.kind == "socket" and h.axis[2] > 1e-9 for h in plan.holes_on(face.id))
    against = "top face against the fence (this socket falls outward)" if falls else "bottom face against the fence"
    return (" The angle jig of this build (jig.dxf, jig.step, jig.stl) is that wedge: the hub on the flat"
            f" opposite this one, {against}.")


def tilt_notes(plan: HubPlan, cfg, face_id: str) -> list[str]:
    """One sentence per group of holes tilted alike on this face: how far, which way, how to hold it."""
    face = plan.face(face_id)
    by_tilt: dict[tuple, list[str]] = {}
    for hid, t in face_tilts(plan, face_id).items():
        by_tilt.setdefault((round(t.deg, 2), t.towards), []).append(hid)
    notes = []
    for (deg, towards), ids in by_tilt.items():
        names = ", ".join(ids)
        if "face" in towards:
            high, low = (("top-face", "bottom face") if towards == "the bottom face"
                         else ("bottom-face", "top face"))
            notes.append(f"Tilt for {names}: the drill runs {deg:g} deg off square to the face, towards"
                         f" {towards}. With this face up, tilt the drill-press table {deg:g} deg so the {high}"
                         f" edge is higher, or lay the part on a {deg:g} deg wedge with its {low} towards the low"
                         f" end (against the fence), or use a drill guide set to {deg:g} deg. Spot and drill on the"
                         " crosshair with the work tilted. The arrow on the template shows where the tip goes; the"
                         " section beside the face is at the true angle, to set a bevel from."
                         + _jig_note(plan, cfg, face))
        else:
            notes.append(f"Tilt for {names}: the drill runs {deg:g} deg off square to the face, towards"
                         f" {towards}; use a drill guide or an angle plate set to {deg:g} deg.")
    return notes
