"""Why the sized design is where it is: the rules that bind each dimension (what fails one
step smaller, and by how much), the mass per step, and the candidates as plain data."""

from __future__ import annotations

from generators.sizing.search import Outcome, SizingResult


def _rule(outcome: Outcome, rid: str) -> dict | None:
    if outcome.design is None:
        return None
    return next((r for r in outcome.design.checks_json["rules"] if r["id"] == rid), None)


def binding(result: SizingResult, o: Outcome) -> list[dict]:
    """Per varied dimension: what one step less does (rules failing there, or the refusal)."""
    space = result.space(o)
    out = []
    for i, d in enumerate(result.dims):
        row = {"key": d.key, "value": o.values[i], "below": None, "rules": [], "refusal": None}
        if o.point[i] <= d.lowest:
            row["refusal"] = "smallest value on the grid"
            out.append(row)
            continue
        below = space.complete(space.step(o.point, i, -1))
        row["below"] = below.values[i]
        row["refusal"] = below.refusal
        for rid in below.failed:
            now, there = _rule(o, rid), _rule(below, rid)
            row["rules"].append({"id": rid, "unit": there["unit"], "now": now["value"] if now else None,
                                 "below": there["value"], "limit": there["limit"], "status": there["status"]})
        out.append(row)
    return out


def binding_rules(rows: list[dict]) -> list[str]:
    """Rule ids that bind, in dimension order; ``hard-limit`` where a refusal binds."""
    ids = []
    for row in rows:
        for r in row["rules"]:
            ids.append(r["id"])
        if row["refusal"] and row["below"] is not None:
            ids.append("hard-limit")
    return list(dict.fromkeys(ids))


def sensitivity(result: SizingResult, o: Outcome) -> list[dict]:
    """Mass (and objective) one step up and one step down in each dimension."""
    space = result.space(o)
    rows = []
    for i, d in enumerate(result.dims):
        up = space.complete(space.step(o.point, i, +1))
        down = space.complete(space.step(o.point, i, -1)) if o.point[i] > d.lowest else None
        rows.append({
            "key": d.key, "value": o.values[i],
            "step": None if up.refusal == "outside the grid" else up.values[i] - o.values[i],
            "mass_up_g": up.mass_g, "mass_down_g": down.mass_g if down else None,
            "grams_per_step": (up.mass_g - o.mass_g) if up.mass_g is not None else None,
            "down_passes": bool(down and down.ok),
            "up_passes": bool(up.ok), "up_refused": up.refusal is not None,
        })
    return rows


def prefetch(result: SizingResult, outcomes: list[Outcome]) -> None:
    """Judge in full, at once, every point that explaining these designs asks for: one step
    down in each dimension, and one step up for the chosen design (the mass per step)."""
    wanted: dict[int, tuple] = {}
    for o in outcomes:
        space = result.space(o)
        pts = wanted.setdefault(id(space), (space, []))[1]
        for i, d in enumerate(result.dims):
            if o.point[i] > d.lowest:
                pts.append(space.step(o.point, i, -1))
            if o is result.best:
                pts.append(space.step(o.point, i, +1))
    for space, pts in wanted.values():
        space.many(pts, full=True)


def record(result: SizingResult, o: Outcome) -> dict:
    """A design as JSON data (values in mm, deg or counts)."""
    rows = binding(result, o)
    return {"material": o.material, "design": {d.key: round(v, 4) for d, v in zip(result.dims, o.values)},
            "mass_g": round(o.mass_g, 1), "objective_value": round(o.objective, 1),
            "lowest_safety_factor": None if o.lowest_sf is None else round(o.lowest_sf, 3),
            "binding_rules": binding_rules(rows), "binding": rows}


def candidates(result: SizingResult, n: int = 5) -> list[Outcome]:
    """The best passing designs seen, best first (the chosen one first)."""
    seen = [x for s in result.spaces.values() for x in s.seen.values() if x.ok]
    seen.sort(key=Outcome.key)
    out = [result.best] + [x for x in seen if x is not result.best]
    return out[:n]
