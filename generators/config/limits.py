"""A range refusal worded in the config's own units: "0.5 in is out of range (at most 0.3937 in)"."""

from __future__ import annotations

from generators.units import MM_PER_IN

MPH_PER_M_S = 1 / 0.44704  # 1 mph = 0.44704 m/s exactly (NIST SP 811)

_WORDS = {"gt": "greater than", "ge": "at least", "lt": "less than", "le": "at most"}


def _amount(base: float, kind: str | None, units: str) -> str:
    if kind == "length":
        return f"{base / MM_PER_IN:.4g} in" if units == "in" else f"{base:.4g} mm"
    if kind == "angle":
        return f"{base:.4g} deg"
    if kind == "speed":
        text = f"{base:.4g} m/s"
        return text + (f" ({base * MPH_PER_M_S:.4g} mph)" if units == "in" else "")
    return f"{base:.15g}"


def _given(value, kind: str | None, units: str) -> str:
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        return repr(value)
    unit = {"length": units, "angle": "deg", "speed": "m/s"}.get(kind or "", "")
    return f"{value:.15g} {unit}".strip()


def range_problem(err: dict, kind: str | None, units: str) -> tuple[str, str]:
    """(problem, accepted) for a pydantic greater_than/less_than... error."""
    ctx = err.get("ctx") or {}
    bounds = [f"{_WORDS[op]} {_amount(float(limit), kind, units)}" for op, limit in ctx.items() if op in _WORDS]
    return f"{_given(err.get('input'), kind, units)} is out of range", "must be " + " and ".join(bounds)
