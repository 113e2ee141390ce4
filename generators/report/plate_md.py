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
    from generators.units import format_force as F
    from generators.units import format_moment as M
    from generators.units import format_pressure as P
    from generators.units import format_stress as S

    u = md.units
    md.add(f"Gust {speed_text(w.speed_m_s, u)} across every pole at once, with the poles' own weight, ice and"
           " wire pre-tension as configured, the resultant taken square to the plate (the worst case for the"
           " plate and its U-bolts).", "")
    if w.skipped:
        md.add(f"Not estimated: {w.skipped}.", "")
        return
    md.table(["figure", "value"], [
        [f"design pressure ({w.pressure_basis})", P(w.pressure_pa, u)],
        ["pole beyond its outer U-bolt L", md.both(w.exposed_length_m * 1000)],
        ["force on each pole F (wind, weight, wire pull; resultant)", F(w.force_per_spreader_n, u, 1)],
        ["moment at the outer U-bolt M (resultant)", M(w.moment_at_hub_nm, u)],
        ["pole stress sigma = M c / I + N / A", f"{S(w.spreader_stress_mpa, u)} (allowable"
                                                f" {S(w.spreader_allowable_mpa, u)})"],
        ["U-bolt forces R_A = M/s, R_B = F + M/s", f"{F(w.inner_force_n, u)}, {F(w.outer_force_n, u)}"],
        ["plate bending sigma = 6 M / (b t^2), worse section", S(w.plate_stress_mpa, u)],
        ["tension in each outer U-bolt leg R_B / 2", F(w.leg_tension_n, u)],
    ])
    from generators.report.mast_figures import ADVICE, mast_rows

    rows = mast_rows(w.as_json(), u)
    if rows:
        md.add("What the antenna puts on the mast:", "")
        md.table(["figure", "value"], rows)
        md.add(ADVICE, "")
    md.add("The friction of the U-bolts that keeps a pole from sliding along the plate is not"
           " estimated. The formulas are textbook statics (Gere, \"Mechanics of Materials\"; Roark, \"Formulas"
           " for Stress and Strain\"; from memory); the 45 deg load spread in the plate is common practice."
           " This is an estimate, not a structural certification.", "")
