"""Hard limits on the part as it will be cut: below these a design is refused (exit 2),
with or without ``--force`` (which only overrides design-rule failures).

They read the walls measured between the true cutter shapes (``plan/measured_walls.py``)
and the rim-to-free-edge distances (``plan/edges.py``), so a teardrop roof, a countersink
cone, a counterbore step or a drill point is judged as it will be cut.
"""

from __future__ import annotations

from generators.config.models import Config
from generators.errors import UserError
from generators.plan import limits as L
from generators.plan.kinds import POCKET_KINDS
from generators.plan.model import HubPlan
from generators.units import format_length

# Which feature a refusal names, most movable first.
_ORDER = ("extra", "set_screw", "pin", "clamp", "split_bolt", "nut_pocket", "insert_pocket", "head_pocket",
          "socket", "bore")


def wall_limit_mm(cfg: Config) -> float:
    """The least wall between two cuts or a cut and a face: 1.5 mm, and for a printed hub
    at least its printed wall (``plan/print_profiles.py``)."""
    if cfg.hub.process == "printed":
        from generators.plan.print_profiles import min_wall_mm

        return max(L.MIN_WEB_MM, min_wall_mm(cfg))
    return L.MIN_WEB_MM


def check_hard_limits(cfg: Config, plan: HubPlan, walls, edges: bool = True) -> None:
    """Raise a ``UserError`` for the thinnest wall (or, with ``edges``, rim to edge) under its
    hard limit."""
    fmt = lambda mm: format_length(mm, cfg.units, fractions=False)  # noqa: E731
    web = wall_limit_mm(cfg)
    for w in walls:  # least first
        a = plan.hole(w.a)
        b = None if w.b.startswith("face:") else plan.hole(w.b)
        if b is None and a.kind in POCKET_KINDS:
            continue  # a nut slot opens onto a face by design; the printed rules judge it
        if b is not None and _ORDER.index(_kind(b)) < _ORDER.index(_kind(a)):
            a, b = b, a  # name the cut that can move first
        limit = L.MIN_BORE_WALL_MM if (a.kind == "bore" and b is None) else web
        if w.mm >= limit - 1e-9:
            continue
        other = f"the {w.b[5:]} face" if b is None else f"{b.kind.replace('_', ' ')} {b.id}"
        what = "breaks into" if w.mm <= 1e-6 else f"leaves {fmt(w.mm)} of material to"
        raise UserError(_key(cfg, plan, a, b, w.b), f"{a.kind.replace('_', ' ')} {a.id} {what} {other}"
                        " (measured on the cut shapes)", f"at least {fmt(limit)} of material"
                        f" ({'the bore wall minimum' if limit == L.MIN_BORE_WALL_MM else 'the web minimum'},"
                        " common practice)")
    if edges:
        _edges(cfg, plan, fmt)


def _edges(cfg: Config, plan: HubPlan, fmt) -> None:
    from generators.plan.edges import free_edge_distance

    for h in plan.holes:
        if h.kind in ("bore", "socket") or h.kind in POCKET_KINDS:
            continue
        r = h.face_radius_mm
        ends = [(h.face, h.entry_mm)] + ([(h.exit_face, h.bottom_mm)] if h.exit_face is not None else [])
        for face_id, at in ends:
            face = plan.face(face_id)
            d = free_edge_distance(plan, face, face.to_face(at)) - r
            need = max(L.EDGE_FACTOR * 2 * r, L.MIN_EDGE_MM)
            if d < need - 1e-9:
                if h.kind == "pin" and min(at[2], plan.body.thickness_mm - at[2]) - r < need - 1e-9:
                    lo, hi = r + need, plan.body.thickness_mm - r - need
                    raise UserError("mast_pin.height", f"the rim of pin {h.id} is {fmt(max(d, 0))} from the"
                                    f" {'bottom' if at[2] < plan.body.thickness_mm / 2 else 'top'} edge of the"
                                    f" {face_id} face", f"{fmt(lo)} to {fmt(hi)} above the bottom face")
                raise UserError(_key(cfg, plan, h, None, f"face:{face_id}"), f"the rim of {h.kind.replace('_', ' ')}"
                                f" {h.id} is {fmt(max(d, 0))} from an edge of the {face_id} face",
                                f"at least {fmt(need)} (half the hole diameter, common practice)")


def _key(cfg: Config, plan: HubPlan, a, b, b_ref: str) -> str:
    hole = a if b is None or _ORDER.index(_kind(a)) <= _ORDER.index(_kind(b)) else b
    kind = _kind(hole)
    if hole.kind == "u_bolt":
        if b is None:
            return "plate.edge_margin"
        return "plate.mast_u_bolt_spacing" if hole.spreader is None else "plate.u_bolt_spacing"
    if kind == "extra":
        i = next((k for k, spec in enumerate(cfg.holes) if spec.id == hole.id), None)
        if i is None:
            return "hub"
        floor = b is None and b_ref[5:] in ("top", "bottom") and b_ref[5:] != hole.face and not hole.through
        return f"holes[{i}].depth" if floor else f"holes[{i}].at"
    if kind == "set_screw":
        return "set_screws.position"
    if kind == "clamp":
        return "mast_clamp"
    if kind == "split_bolt" or (kind in POCKET_KINDS and plan.split is not None
                                and any(b.hole == hole.serves for b in plan.split.bolts)):
        return "split.height"
    if kind == "pin":
        if b_ref.startswith("face:"):
            return "mast_pin.height" if b_ref[5:] in ("top", "bottom") else "mast_pin.azimuth"
        return "mast_pin.azimuth" if cfg.mast_pin.azimuth is not None else "mast_pin.height"
    if kind in POCKET_KINDS:
        return "print.nut_allowance"
    if kind == "socket":
        if b is not None and _kind(b) == "socket":
            return "spreaders.diameter"
        if b is not None and _kind(b) == "bore":
            return "spreaders.socket_depth"
        if b_ref[5:] in ("top", "bottom"):
            return "spreaders.elevation" if cfg.spreaders.elevation else "hub.thickness"
        return "hub.diameter" if plan.body.style == "puck" else "hub.across_flats"
    return "hub.bore" if cfg.hub.bore is not None else "mast.size"


def _kind(h) -> str:
    return h.kind if h.kind in _ORDER else "extra"
