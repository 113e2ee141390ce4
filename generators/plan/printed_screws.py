"""The screws of a printed hub: each runs through a captive nut or into a heat-set insert
instead of a tapped thread, so its length is chosen from where that nut or insert sits
(generators/plan/screws.py makes the choice)."""

from __future__ import annotations

import math
from dataclasses import replace

from generators.plan.kinds import HoleKind
from generators.plan.model import Hole, HubPlan
from generators.plan.screws import clamp_screw, set_screw, tapped_extra_screw


def thread_span(h: Hole, pocket: Hole) -> tuple[float, float]:
    """Where along ``h`` the nut or insert holds the screw's thread: an insert over its
    depth; a nut over its own height (ISO 4032 / ASME B18.2.2), not the pocket's, at the
    pocket's face end, where a tightened screw pulls it."""
    t0 = sum((pocket.entry_mm[i] - h.entry_mm[i]) * h.axis[i] for i in range(3))
    if pocket.kind == HoleKind.NUT_POCKET:
        from generators.standards.fasteners import hex_nut

        return t0, t0 + min(pocket.depth_mm, hex_nut(pocket.thread).height_mm)
    return t0, t0 + pocket.depth_mm


def printed_screws(machined: HubPlan, cfg, holes: list[Hole], pockets: list[Hole], fmt) -> list[Hole]:
    """``holes`` with the screw of every hole a pocket serves."""
    from generators.standards.materials import get_material

    served = {p.serves: p for p in pockets}
    mclass = get_material(cfg.hub.material).material_class
    out = []
    for h in holes:
        pocket = served.get(h.id)
        if pocket is None:
            out.append(h)
            continue
        orig = machined.hole(h.id)
        start, end = thread_span(h, pocket)
        nut = pocket.kind == HoleKind.NUT_POCKET
        if h.kind == HoleKind.SET_SCREW:
            sock = next(s for s in machined.holes if s.kind == HoleKind.SOCKET and s.spreader == h.spreader)
            cos_e = math.cos(math.radians(cfg.spreaders.elevation))
            gap = orig.depth_mm - (cfg.spreaders.diameter - sock.radius_mm) / cos_e
            from generators.standards.holding import default_torque_nm
            from generators.standards.threads import parse_thread

            ss_t = cfg.set_screws.torque
            ss_t = ss_t if ss_t is not None else default_torque_nm(parse_thread(orig.thread), mclass)[0]
            screw = set_screw(orig.thread, gap, start, end, cfg.set_screws.length, cfg.units, fmt, nut=nut,
                               point=cfg.set_screws.point, torque_nm=ss_t)
        elif h.kind == HoleKind.CLAMP:
            from generators.standards.holding import default_torque_nm
            from generators.standards.threads import parse_thread

            mc = cfg.mast_clamp
            torque = mc.torque if mc.torque is not None else default_torque_nm(parse_thread(orig.thread), mclass)[0]
            screw, _ = clamp_screw(orig.thread, orig.depth_mm, machined.bore_mm - machined.mast_od_mm,
                                   start, end, cfg.units, fmt, torque_nm=torque)
        else:
            screw = tapped_extra_screw(orig.thread, end - start, fmt, start, None if orig.through else orig.depth_mm)
        if nut:
            screw = replace(screw, designation=screw.designation + " + hex nut",
                            note=screw.note + "; runs through the captive nut")
        out.append(replace(h, screw=screw))
    return out
