"""The split hub's part of the report: the plane and gap, the bolts and nuts, how tight,
and the assembly order. Rendered from ``plan.split`` and the manifest's ``parts``."""

from __future__ import annotations


def split_section(d, manifest: dict, md) -> None:
    """``## Split`` (nothing for a hub in one piece)."""
    plan = d.plan
    sp = plan.split
    if sp is None:
        return
    from generators.plan.screws import torque_text

    b = sp.bolts[0]
    bolt = plan.hole(b.hole)
    printed = plan.process == "printed"
    md.add("## Split", "",
           f"The hub is cut through the mast axis along azimuth {sp.azimuth_deg:g} deg (and"
           f" {(sp.azimuth_deg + 180) % 360:g} deg) into two halves, with a {md.L(sp.gap_mm)} gap between"
           f" them. The bore has {md.L(sp.clearance_mm)} of clearance round the mast, so tightening the"
           f" bolts first closes that and then presses both halves on the mast, with"
           f" {md.L(sp.interference_mm)} of the gap still open: if the halves ever touch, the mast is not"
           " clamped (a smaller gap needs less clearance).", "")
    rows = []
    for part in manifest.get("parts") or []:
        rows.append([part["name"], ", ".join(part["files"]), f"{part['mass_g']:.0f} g",
                     ", ".join(h for h in part["holes"] if h != "bore")])
    if rows:
        md.table(["half", "files", "mass", "holes"], rows)
    if sp.shared:
        md.add(f"- shared sockets: {', '.join(sp.shared)} lie along the split; each half holds half of the"
               " socket and the bolts clamp the pole" + (f" (set screws {', '.join(sp.dropped)} left out)"
                                                        if sp.dropped else ""))
    seen = "a captive hex nut in half B" if printed else "the thread tapped in half B"
    for x in sp.bolts:
        h = plan.hole(x.hole)
        md.add(f"- {x.hole}: {h.screw.designation} socket head cap screw from the {h.face} face of half A into"
               f" {seen}, {md.L(x.offset_mm if x.offset_mm >= 0 else -x.offset_mm)} from the mast axis and"
               f" {md.L(x.height_mm)} above the bottom face; {md.L(x.grip_mm)} clamped between the head and the"
               f" {'nut' if printed else 'thread'}")
    md.add(f"- tighten each to {torque_text(b.torque_nm, plan.units)} ({b.torque_source}), the two in turns",
           f"- bolt hole {md.L(bolt.diameter_mm)}; head recess {md.L(plan.hole(b.hole + '-head').diameter_mm)}"
           if printed else f"- bolt hole: {bolt.drill} tap drill, opened to clearance in half A; counterbore"
           f" {md.L(bolt.counterbore.diameter_mm)} for the head", "")
    if printed:
        nut = plan.hole(b.nut)
        md.add(f"Nuts: {len(sp.bolts)} x {nut.nut}, one in each slot on the top face of half B.", "")
    md.add("### Assembly", "")
    steps = []
    if printed:
        steps.append("Print each half bottom face down (they are checked against the bed one by one).")
        steps.append("Slide a hex nut down each slot in the top face of half B until it lines up with its hole.")
    else:
        steps.append("Drill, bore and tap the whole block from the templates first; then saw it apart along"
                     f" the split line with a {md.L(sp.gap_mm)} kerf and deburr the cut faces.")
    steps += [
        "Fit the poles into their sockets in each half (set screws loose).",
        "Put the two halves round the mast at the height wanted, split faces facing, and start both bolts"
        " from half A by hand.",
        f"Tighten the bolts in turns, a little each, until both reach {torque_text(b.torque_nm, plan.units)};"
        " check the gap stays open and even on both sides of the mast.",
        "Then tighten the set screws on the poles.",
    ]
    for k, s in enumerate(steps):
        md.add(f"{k + 1}. {s}")
    md.add("")

