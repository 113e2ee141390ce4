"""What holds a screw's point on a pole or mast: tightening torque, preload, point contact
area, friction per material pair and the pole's transverse strength (CSV tables in data/).

Preload from torque: ``T = K F d`` (the short-form torque-tension relation; Shigley,
"Mechanical Engineering Design", section 8-8, and Machinery's Handbook, "Bolt preload",
from memory) with the nut factor ``K`` = 0.2 for plain, unlubricated steel screws (Shigley
table 8-15, "non-plated, black finish" 0.30 and "zinc-plated" 0.20; Machinery's Handbook
gives 0.2 as the usual dry figure; from memory). A larger K gives a smaller force for the
same torque, so the lower end is the conservative one for crushing and the higher the
conservative one for holding: ``K_HOLD`` = 0.3, ``K_CRUSH`` = 0.2.
"""

from __future__ import annotations

import functools
import math

from generators.errors import UserError
from generators.standards._data import table
from generators.standards.threads import Thread, parse_thread

K_CRUSH = 0.2  # Shigley table 8-15 zinc-plated / Machinery's Handbook dry (from memory)
K_HOLD = 0.3   # Shigley table 8-15 non-plated black finish (from memory)
POINTS = ("cup", "flat", "dog", "soft")
# A cup point bears on the pole with the rim of its cup: a ring of the point diameter whose
# width is taken as 10 % of it (a stated assumption, common practice; the rim is a knife
# edge when new and widens as it bites).
CUP_RIM_FRACTION = 0.10
COMMON_SCALED = "common practice"


def _thread(thread: Thread | str, key: str) -> Thread:
    return thread if isinstance(thread, Thread) else parse_thread(thread, key=key)


@functools.cache
def _by_size(name: str) -> dict[str, dict]:
    return {str(r["size"]): r for r in table(name)}


def _row(name: str, thread: Thread) -> tuple[dict | None, float]:
    """The table row of this size, or the row of the nearest tabulated size with the ratio
    d / d_row of their major diameters (for scaling); (None, 1) for an empty table."""
    rows = _by_size(name)
    if thread.size in rows:
        return rows[thread.size], 1.0
    best = None
    metric = thread.size.startswith("M")
    for size, r in rows.items():
        if size.startswith("M") != metric:  # the nearest size of the same series
            continue
        try:
            d = parse_thread(size if size.startswith("M") else f"{size}-{'32' if size.startswith('#') else '20'}").major_mm
        except UserError:
            continue
        if best is None or abs(math.log(d / thread.major_mm)) < abs(math.log(best[1] / thread.major_mm)):
            best = (r, d)
    return (None, 1.0) if best is None else (best[0], thread.major_mm / best[1])


def default_torque_nm(thread: Thread | str, hub_class: str, key: str = "torque") -> tuple[float, str]:
    """A conservative tightening torque (N m) for a steel set or clamp screw in a hub of
    ``hub_class`` and the table row's source: the catalogue seating torque in metal, a
    third of it in plastic, wood and composite (tightening_torque.csv)."""
    t = _thread(thread, key)
    r, ratio = _row("tightening_torque.csv", t)
    col = "metal_nm" if hub_class == "metal" else "plastic_nm"
    if ratio == 1.0:
        return r[col], r["source"]
    # a size not in the table: the nearest one scaled by (d / d_row)^3, the same stress in
    # the thread (common practice)
    return r[col] * ratio ** 3, f"{t.size} scaled by d^3 from {r['size']} ({COMMON_SCALED}); {r['source']}"


def preload_n(torque_nm: float, thread: Thread | str, k: float = K_CRUSH, key: str = "torque") -> float:
    """Axial force of a screw tightened to ``torque_nm``: F = T / (K d), N."""
    d_m = _thread(thread, key).major_mm / 1000.0
    return torque_nm / (k * d_m)


def point_contact_mm2(thread: Thread | str, point: str, key: str = "set_screws.point") -> tuple[float, str]:
    """Area (mm^2) over which a set-screw point bears on a pole, and its source.

    cup: a ring of the cup diameter (ISO 4029 dz, ASME B18.3 C) and width CUP_RIM_FRACTION
    of it; flat and dog: a disc of the point diameter (ISO 4026 / 4028 dp, ASME B18.3);
    soft (a nylon or brass tip): the tip flattens to a disc of the thread's major diameter
    (common practice)."""
    t = _thread(thread, key)
    if point not in POINTS:
        raise UserError(key, f"unknown set-screw point {point!r}", ", ".join(POINTS))
    if point == "soft":
        return math.pi / 4 * t.major_mm ** 2, "soft tip flattened to the major diameter (common practice)"
    r, ratio = _row("set_screw_points.csv", t)
    d = r[f"{point}_mm"] * ratio  # a size not in the table: the nearest one scaled by d (common practice)
    if point == "cup":
        return math.pi * d * CUP_RIM_FRACTION * d, f"{r['source']}; rim width {CUP_RIM_FRACTION:g} x dz (common practice)"
    return math.pi / 4 * d * d, r["source"]


def friction(hub_class: str) -> tuple[float, str]:
    """Static friction coefficient of a hub of ``hub_class`` (and a steel screw) on a metal mast."""
    r = next(r for r in table("friction.csv") if r["hub_class"] == hub_class)
    return r["mu"], r["source"]


def transverse_strength_mpa(material_id: str) -> tuple[float, str]:
    """Compressive strength across the wall of a pole of this material, MPa, and its source."""
    r = next((r for r in table("transverse_strength.csv") if r["id"] == material_id), None)
    if r is None:
        raise UserError("loads.spreader_material", f"no transverse compressive strength for {material_id}",
                        ", ".join(str(x["id"]) for x in table("transverse_strength.csv")))
    return r["transverse_compressive_mpa"], r["source"]
