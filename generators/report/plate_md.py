"""The plate hub's parts of the report: its size, the U-bolt list with nuts and washers,
the assembly order and the wind figures. Rendered from ``Design.plate`` alone."""

from __future__ import annotations


def size_text(body, md) -> str:
    """How big the hub's body is, for the report's first table."""
    if body.style == "block" or (body.style == "plate" and body.diameter_mm is None):
        return f"{md.both(body.across_flats_mm)} across flats, {body.sides} sides"
    return f"{md.both(body.diameter_mm)} diameter"


def mast_row(d, md) -> list[str]:
    """The row saying how the mast is held (a bore, or the plate's U-bolts)."""
    if d.plate is None:
        return ["bore", f"{md.both(d.plan.bore_mm)} through"]
    lay = d.plate
    return ["mast clamp", f"on the bottom face along azimuth {lay.mast_azimuth_deg % 360:g} deg, two U-bolts"
                    f" {md.L(lay.mast_spacing_mm)} apart through the plate"]


def u_bolt_rows(d, md) -> list[list[str]]:
    """Fastener rows: each U-bolt size with its nuts and plain washers."""
    groups: dict[tuple, list] = {}
    for u in d.plate.u_bolts:
        groups.setdefault((u.size.size, u.holds), []).append(u)
    rows = []
    for (size, holds), us in groups.items():
        u = us[0]
        what = "spreader poles" if holds == "spreader" else "the mast"
        n = len(us)
        rows.append([str(n), f"U-bolt for {what} ({u.size.family} {size})",
                     f"{u.size.thread.designation}, {md.L(u.size.inside_width_mm)} inside,"
                     f" legs {md.L(u.leg_spacing_mm)} apart, {md.L(u.size.leg_length_mm)} long",
                     f"needs {md.L(u.leg_needed_mm)} of leg; {', '.join(x.id for x in us)}; {u.size.source}"])
        rows.append([str(2 * n), "hex nut", u.size.thread.designation,
                     f"{u.nut.standard}; on the {u.nut_face} face"])
        rows.append([str(2 * n), "plain washer", f"{md.L(u.washer.inside_mm)} x {md.L(u.washer.outside_mm)}"
                     f" x {md.L(u.washer.thickness_mm)}", f"{u.washer.standard} ({u.washer.source})"])
    return rows


def assembly_lines(d, md) -> list[str]:
    lay = d.plate
    stops = ", ".join(f"S{sid} at {md.L(r)}" for sid, r in lay.stops)
    return [
        "Cut the plate from `plate.dxf` (layer CUT) and drill every hole from the top face (layer DRILL or the"
        " 1:1 template); deburr both faces. Scribe the stop lines (layer MARKS) on the top face.",
        "Lay the mast against the bottom face on its marked line and fit its two U-bolts from below, nuts and"
        " washers on the top face; snug them.",
        f"Lay each pole on the top face with its cut end on its stop line (from the plate's centre: {stops}),"
        " fit its two U-bolts over it, nuts and washers under the plate, and tighten them evenly, crossing"
        " from leg to leg, until the pole cannot turn. Do not crush a fibreglass tube: a rubber strip or a"
        " short sleeve under each bar spreads the clamp (common practice).",
    ]


def wind_section(md, cfg, checks) -> None:
    from generators.plan.rules import speed_text

    w = checks.wind
    md.add(f"Gust {speed_text(w.speed_m_s, md.units)} square to the plate (the worst case for the plate: every"
           " pole is loaded across at once), air density and drag coefficient as configured.", "")
    if w.skipped:
        md.add(f"Not estimated: {w.skipped}.", "")
        return
    md.table(["figure", "value"], [
        ["dynamic pressure q = 1/2 rho V^2", f"{w.pressure_pa:.0f} Pa"],
        ["pole beyond its outer U-bolt L", md.both(w.exposed_length_m * 1000)],
        ["force on each pole F (pole + wire share)", f"{w.force_per_spreader_n:.1f} N"],
        ["moment at the outer U-bolt M = w L^2/2 + F_wire L", f"{w.moment_at_hub_nm:.1f} N m"],
        ["pole stress sigma = M c / I", f"{w.spreader_stress_mpa:.0f} MPa"],
        ["U-bolt forces R_A = M/s, R_B = F + M/s", f"{w.inner_force_n:.0f} N, {w.outer_force_n:.0f} N"],
        ["plate bending sigma = 6 M / (b t^2), worse section", f"{w.plate_stress_mpa:.0f} MPa"],
        ["tension in each outer U-bolt leg R_B / 2", f"{w.leg_tension_n:.0f} N"],
    ])
    md.add("Wind in the plate's plane bends the poles sideways against their U-bolts' friction and is not"
           " estimated. The formulas are textbook statics (Gere, \"Mechanics of Materials\"; Roark, \"Formulas"
           " for Stress and Strain\"; from memory); the 45 deg load spread in the plate is common practice."
           " This is an estimate, not a structural certification.", "")
