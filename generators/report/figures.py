"""A rule's figure as the shop reads it, for the check table and the report."""

from __future__ import annotations


def figure(value, unit: str, units: str) -> str:
    """A rule's figure as the shop reads it: lengths in the config's units."""
    from generators.units import format_length

    if value is None:
        return "-"
    if unit == "mm":
        return format_length(value, units, fractions=False)
    if unit == "x D":
        return f"{value:.2f} x D"
    if unit == "deg":
        return f"{value:.1f} deg"
    if unit == "g":
        return f"{value:.0f} g"
    if unit == "SF":
        return f"SF {value:.2f}"
    if unit == "MPa":
        from generators.units import format_stress

        return format_stress(value, units, 1)
    return f"{value:g} {unit}".strip()
