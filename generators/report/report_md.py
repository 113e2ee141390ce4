"""report.md: the build report a builder prints and takes to the shop.

Sections: what was built, the picture, the drill schedule per face in drilling order,
fasteners, cut list and sleeves (when the build made them), mass, checks, wind, cautions.
Sizes are in the config's units; drills by their shop names.
"""

from __future__ import annotations

from typing import Any

from generators.config.text import markdown_text

from generators.plan.model import Hole, HubPlan
from generators.units import format_both, format_length

CAUTIONS = (
    "**Power lines**: keep the mast and antenna far enough from overhead lines that nothing can"
    " touch them if the mast falls or the antenna swings. Look up before you raise anything.",
    "**Raising and climbing**: raise the mast with a helper and guy it as the mast maker rates it;"
    " never climb a mast or tower without fall protection and training.",
    "**Wind and ice**: the wind figures here are an estimate, not a structural certification. Ice is"
    " included only as thick as `[loads] ice_thickness` says; the site's ice and wind maps decide."
    " Lower the antenna before storms.",
    "**Drilling and tapping**: wear eye protection, clamp the work (never hold it by hand), keep"
    " hands and loose sleeves clear of the drill, and clear chips with a brush, not fingers.",
    "**RF exposure**: observe the RF exposure limits of your licence and local rules around the"
    " antenna and the feed line.",
    "**Local codes**: follow local building codes, the mast maker's ratings and licensed"
    " engineering practice for anything permanent or near people or property.",
)

SECTIONS = ("What was built", "Picture", "Drill schedule", "Fasteners", "Spreader cut list",
            "Reducer sleeves", "Mass", "Checks", "Wind-load estimate", "Cautions")


class _Md:
    def __init__(self, units: str):
        self.units = units
        self.lines: list[str] = []

    def L(self, mm: float) -> str:
        return format_length(mm, self.units, fractions=False)

    def both(self, mm: float) -> str:
        return format_both(mm, self.units)

    def add(self, *lines: str) -> None:
        self.lines.extend(lines)

    def table(self, head: list[str], rows: list[list[str]]) -> None:
        self.add("| " + " | ".join(head) + " |", "|" + "|".join("---" for _ in head) + "|")
        for r in rows:
            self.add("| " + " | ".join(str(c).replace("|", "/") for c in r) + " |")
        self.add("")


def frame_section(md: _Md, manifest: dict) -> None:
    """The whole frame: frame.png and assembly.step, each tip's point and height."""
    frame, assembly = manifest.get("frame"), manifest.get("assembly")
    if not frame and not assembly:
        return
    md.add("## The frame", "")
    files = [f"`{x['file']}`" for x in (frame, assembly) if x]
    md.add("The hub with a mast stub, each spreader from its stop to its cut end and the wires between"
           f" the tips: {' and '.join(files)}.", "")
    if frame:
        md.add(f"![the frame, top and side view]({frame['file']})", "")
        rows = [[f"S{t['spreader']}", md.both(t["tip_mm"][0]), md.both(t["tip_mm"][1]), md.both(t["height_mm"]),
                 md.both(t["cut_length_mm"])] for t in frame["tips"]]
        md.table(["tip", "x", "y", "height above the bottom face", "cut length"], rows)
        for w in frame.get("wires") or []:
            md.add(f"- wire S{w['from']} to S{w['to']}: {md.both(w['length_mm'])} tip to tip (straight)")
        if frame.get("wires"):
            md.add("")


def schedule_sections(d) -> list[tuple[int, str, list]]:
    """(stage, face id, operations) in working order: every face's marking and bore first,
    then the sockets, then the holes that break into them; step numbers as on the templates."""
    from generators.plan.operations import STAGE_MARK

    face_order = {f.id: i for i, f in enumerate(d.plan.faces)}
    groups: dict[tuple[int, str], list] = {}
    for op in d.operations:
        groups.setdefault((op.stage, op.face), []).append(op)
    faces_stage = {}
    for (stage, face) in groups:
        if stage != STAGE_MARK:
            faces_stage[face] = min(faces_stage.get(face, 9), stage)
    out = []
    for (stage, face), ops in groups.items():
        if stage == STAGE_MARK:  # marking goes with the face's first cutting stage
            stage = faces_stage.get(face, stage)
        out.append((stage, face, ops))
    merged: dict[tuple[int, str], list] = {}
    for stage, face, ops in out:
        merged.setdefault((stage, face), []).extend(ops)
    keys = sorted(merged, key=lambda k: (k[0], face_order.get(k[1], 99)))
    return [(k[0], k[1], sorted(merged[k], key=lambda op: op.step)) for k in keys]


def _positions(holes: list[Hole], plan: HubPlan, md: _Md) -> list[list[str]]:
    rows = []
    for h in holes:
        face = plan.face(h.face)
        # a nut slot is found where it leaves its face, not on the screw axis
        at = h.slot_exit_mm if h.slot_exit_mm is not None else h.entry_mm
        u, v = (round(c, 6) + 0.0 for c in face.to_face(at))
        thread = h.thread or ""
        # the designed size; a printed hole is modelled larger by its compensation
        size = md.L(h.diameter_mm - h.compensation_mm)
        if h.compensation_mm:
            size += f" (modelled {md.L(h.diameter_mm)})"
        rows.append([h.id, h.kind.replace("_", " "), md.L(u), md.L(v), size, thread, h.note or ""])
    return rows


def _face_name(plan: HubPlan, face_id: str) -> str:
    f = plan.face(face_id)
    return f"{face_id} ({f.label})" if f.label else face_id


def render_report(d, manifest: dict[str, Any], preview: str | None) -> str:
    """The whole report as markdown text, rendered from the design."""
    from generators.plan.operation_text import step_row
    from generators.plan.operations import STAGE_NAMES
    from generators.plan.tilt_notes import tilt_notes

    cfg, plan, checks = d.config, d.plan, d.checks
    md = _Md(cfg.units)
    units = cfg.units
    hub = manifest.get("hub", {})
    body = plan.body
    from generators.report import plate_md

    size = plate_md.size_text(body, md)
    from generators.standards.materials import get_material

    mat = get_material(plan.material)
    md.add(f"# Hub report: {plan.name}", "")
    if cfg.description:
        md.add(markdown_text(cfg.description), "")
    md.add("## What was built", "")
    sockets = [h for h in plan.holes if h.kind == "socket"]
    sp = cfg.spreaders
    rows = [
        ["mast", f"{plan.mast_designation}, OD {md.both(plan.mast_od_mm)}"],
        ["hub", f"{body.style}, {size}, {md.both(body.thickness_mm)} thick, {mat.name}" + ("" if plan.process in mat.name else f" ({plan.process})")],
        plate_md.mast_row(d, md),
        ["spreaders", f"{sp.count} x {md.both(sp.diameter)} poles at {sp.elevation:g} deg elevation"
                      + (f" ({len(cfg.sockets)} set apart in [[sockets]], below)," if cfg.sockets else ",")
                      +
                      f" first at {sp.first_azimuth:g} deg azimuth"],
    ]
    if sockets:
        stop = plan.spreaders[0].stop
        rows.append(["sockets", f"{len(sockets)} x {md.both(sockets[0].diameter_mm)},"
                                f" {md.L(sockets[0].depth_mm)} deep; the pole stops at the {stop}"])
        for o in cfg.sockets:  # [[sockets]] overrides: each such socket as planned
            s, h = plan.spreaders[o.index - 1], plan.hole(f"S{o.index}")
            rows.append([f"socket {h.id}", f"{md.both(h.diameter_mm)} for a {md.L(s.diameter_mm)} pole,"
                                           f" azimuth {s.azimuth_deg % 360:g} deg, elevation {s.elevation_deg:g} deg"])
    files = sorted((manifest.get("files") or {}).keys())
    if files:
        rows.append(["files", ", ".join(files) + ", manifest.json"])
    md.table(["", ""], rows)
    for note in plan.notes:
        md.add(f"- note: {note}")
    if plan.notes:
        md.add("")

    md.add("## Picture", "")
    if preview:
        md.add(f"![isometric view of the hub]({preview})", "",
               "Seen from above, between the +X and -Y sides; socket and hole labels are the ids used"
               + (" in the print checks below." if plan.process == "printed" else " in the drill schedule."), "")
    else:
        md.add("(no picture: the hub's STL was not there to render)", "")

    if plan.process == "printed":
        md.add("## Print and finish", "",
               "Print the hub bottom face down as modelled; then per face, in this order (sizes in "
               + ("inches" if units == "in" else "millimetres") + "; check the designed sizes with a caliper).", "")
    else:
        order = ("every U-bolt hole straight through from the top face" if d.plate is not None else
                 "the bore first, then the sockets, then the holes that break into them")
        md.add("## Drill schedule", "",
               "Mark every hole from the 1:1 templates (or the positions below: u to the right and v up"
               f" looking at the face from outside), then work in this order: {order}. Step numbers are"
               " those of each face's template. Sizes in " + ("inches" if units == "in" else "millimetres") + ".", "")
    templates = {t.get("face"): t.get("file") for t in (manifest.get("templates") or []) if isinstance(t, dict)}
    for k, (stage, face_id, ops) in enumerate(schedule_sections(d)):
        md.add(f"### {k + 1}. {_face_name(plan, face_id)}: {STAGE_NAMES[stage]}", "")
        if templates.get(face_id):
            md.add(f"Template: `{templates[face_id]}`", "")
        md.table(["step", "operation", "holes", "tool", "depth", "notes"], [step_row(op, units) for op in ops])
        ids = {h for op in ops for h in op.holes}
        for note in (tilt_notes(plan, cfg, face_id) if plan.process != "printed" else []):
            if any(i in ids for i in note.removeprefix("Tilt for ").split(":")[0].split(", ")):
                md.add(f"- {note}")
        if any(op.tilt_deg for op in ops):
            md.add("")
        holes = [h for h in plan.holes_on(face_id) if h.id in ids]
        if holes:
            md.table(["hole", "kind", "u", "v", "diameter", "thread", "note"], _positions(holes, plan, md))

    md.add("## Fasteners", "")
    rows = fastener_rows(cfg, plan, checks, md)
    if d.plate is not None:
        rows = plate_md.u_bolt_rows(d, md) + rows
    md.table(["qty", "item", "size", "notes"], rows)
    from generators.report.split_md import split_section

    split_section(d, manifest, md)
    if d.plate is not None:
        md.add("## Assembly", "")
        for line in plate_md.assembly_lines(d, md):
            md.add(f"- {line}")
        md.add("")

    cut = manifest.get("cutlist")
    md.add("## Spreader cut list", "")
    spreaders = manifest.get("spreaders") or []
    if cut and any("cut_length_mm" in s for s in spreaders):
        rows = [[str(s["id"]), f"{s['azimuth_deg']:g} deg", f"{s['elevation_deg']:g} deg",
                 md.both(s["cut_length_mm"]), s.get("cut_stop", s.get("stop", ""))] for s in spreaders]
        md.table(["spreader", "azimuth", "elevation", "cut length", "measured from"], rows)
        if cut.get("tip_allowance_mm") is not None:
            md.add(f"Lengths include {md.L(cut['tip_allowance_mm'])} tip allowance; tips at"
                   f" {md.both(cut['tip_radius_mm'])} from the mast axis. File: `{cut.get('file', '')}`.", "")
        for c in (cut.get("cases") or [])[1:]:
            md.add(f"- on the {c['stop']}: {md.both(c['cut_length_mm'])}")
        if len(cut.get("cases") or []) > 1:
            md.add("")
    else:
        md.add("No cut list in this build (it needs spreaders.tip_radius or spreaders.tip_spacing).", "")
    frame_section(md, manifest)

    md.add("## Reducer sleeves", "")
    reducers = manifest.get("reducers") or []
    if reducers:
        rows = [[r.get("mast", ""), md.L(r.get("mast_od_mm", 0)), md.L(r.get("od_mm", 0)), md.L(r.get("id_mm", 0)),
                 md.L(r.get("wall_mm", 0)), md.L(r.get("length_mm", 0)), ", ".join(r.get("files", []))]
                for r in reducers]
        md.table(["mast", "mast OD", "sleeve OD", "sleeve ID", "wall", "length", "files"], rows)
        for r in reducers:
            for note in r.get("notes", []):
                md.add(f"- {r.get('mast', '')}: {note}")
        md.add("")
    else:
        md.add("No reducer sleeves in this build.", "")

    md.add("## Mass", "")
    if "mass_g" in hub:
        md.add(f"- from the solid: **{hub['mass_g']:.0f} g** ({hub['volume_mm3'] / 1000:.1f} cm3 of {mat.name}"
               f" at {mat.density_g_cm3:g} g/cm3; {mat.source})")
    md.add(f"- estimate from the plan without solids (what `hubwright check` uses): {checks.mass_estimate_g:.0f} g")
    if cfg.hub.max_mass:
        md.add(f"- limit set in the config (hub.max_mass): {cfg.hub.max_mass:g} g")
    md.add("")

    md.add("## Checks", "",
           "Design rules run on the plan before anything was written (`hubwright check` prints the"
           " same table). pass = on the safe side of the recommended figure (at or above it for a wall,"
           " an engagement or a safety factor; at or under it for a screw length or an angle); warn ="
           " past it but within the minimum; fail = past the minimum (the build stops unless --force);"
           " a rule that cannot apply, or has nothing to estimate, passes with a dash.", "")
    from generators.report.figures import figure

    rows = [[r.id, r.status.upper() if r.status != "pass" else r.status, figure(r.value, r.unit, units),
             figure(r.limit, r.unit, units), r.message, r.source] for r in checks.rules]
    md.table(["rule", "status", "figure", "limit", "finding / what to change", "source"], rows)

    md.add("## Wind-load estimate", "")
    (plate_md.wind_section if d.plate is not None else wind_section)(md, cfg, checks)

    md.add("## Cautions", "")
    for c in CAUTIONS:
        md.add(f"- {c}")
    md.add("", f"Made by hubwright {manifest.get('generator', {}).get('version', '')}: check every"
           " dimension against your parts before cutting.", "")
    return "\n".join(md.lines)


def fastener_rows(cfg, plan: HubPlan, checks, md: _Md) -> list[list[str]]:
    """One row per kind of screw the plan chose, then the screws of the clearance holes."""
    rows = []
    by: dict[tuple, list[str]] = {}
    for h in plan.holes:
        s = h.screw
        if s is None or s.kind == "screw":
            continue
        cb = f"; counterbore {md.L(h.counterbore.diameter_mm)} across, {md.L(h.counterbore.depth_mm)} deep" \
            if h.counterbore is not None and h.kind == "clamp" else ""
        what = {"clamp": "mast clamp: ", "pin": "mast through bolt: "}.get(h.kind, "")
        item = what + (f"{s.kind} ({s.standard})" if h.kind == "pin" else s.standard)
        by.setdefault((item, s.designation, s.note + cb), []).append(h.id)
    for (item, size, note), ids in by.items():
        rows.append([str(len(ids)), item, size, f"{note} ({', '.join(ids)})"])
        if "+ hex nut" in size:
            rows.append([str(len(ids)), "hex nut (captive, in its pocket)", size.split(" x ")[0],
                         "ISO 4032 / ASME B18.2.2"])
    if any(h.kind == "clamp" for h in plan.holes) and plan.bore_mm > plan.mast_od_mm + 1e-6 and cfg.reducers:
        rows.append(["-", "mast clamp with a sleeve", "-", "a sleeve in the bore changes the length (see the sleeves)"])
    extras: dict[tuple, list[str]] = {}
    specs = {x.id: x for x in cfg.holes}
    for h in plan.holes:
        if h.kind != "extra":
            continue
        spec = specs.get(h.id)
        clear = spec.clearance.designation if spec is not None and spec.clearance is not None else None
        if clear and h.screw is not None:  # through a clearance hole: its length from the plan
            key = (h.screw.standard.split(";")[0] + " + washer + hex nut", h.screw.designation, h.screw.note)
        elif h.screw is not None:
            key = ("screw into a tapped hole" if h.thread else "screw + captive nut or insert", h.screw.designation,
                   h.screw.note)
        elif clear and h.countersink:
            key = ("flat head screw + nut", clear, f"countersunk; through {md.L(h.depth_mm)} of hub + what it holds")
        elif clear and h.counterbore:
            key = ("socket head cap screw + nut", clear, f"head in the counterbore; {md.L(h.depth_mm)} of hub")
        elif clear:
            key = ("screw + nut", clear, f"through {md.L(h.depth_mm)} of hub + what it holds")
        else:
            continue
        extras.setdefault(key, []).append(h.id)
    for (item, size, note), ids in extras.items():
        rows.append([str(len(ids)), item, size, f"{note} ({', '.join(ids)})"])
    by_od: dict[float, int] = {}
    for s in plan.spreaders:
        by_od[s.diameter_mm] = by_od.get(s.diameter_mm, 0) + 1
    for od, n in by_od.items():
        rows.append([str(n), "spreader pole", f"{md.L(od)} OD at the hub", "see the cut list"])
    return rows


def wind_section(md: _Md, cfg, checks) -> None:
    w = checks.wind
    ld = cfg.loads
    from generators.plan.rules import speed_text

    md.add(f"Gust {speed_text(w.speed_m_s, md.units)}, air {ld.air_density:g} kg/m3, drag coefficient"
           f" {ld.drag_coefficient:g}; wire share {md.L(ld.wire_diameter)} x {md.L(ld.wire_length_per_spreader)}"
           f" per spreader; spreader material {ld.spreader_material}.", "")
    if w.skipped:
        md.add(f"Not estimated: {w.skipped}.", "")
        return
    from generators.units import format_force as F
    from generators.units import format_moment as M
    from generators.units import format_pressure as P
    from generators.units import format_stress as S

    u = md.units
    rows = [
        [f"design pressure ({w.pressure_basis})", P(w.pressure_pa, u)],
        ["exposed spreader length L (socket mouth to tip)", f"{md.both(w.exposed_length_m * 1000)}"],
        ["force on the worst spreader (pole + wire share)", F(w.force_per_spreader_n, u, 1)],
        ["bending moment at the socket mouth (q Cd d L^2/2 + F_wire L)", M(w.moment_at_hub_nm, u)],
        ["moment at the socket mouth with wire pull, weight and ice", M(w.root_moment_nm, u)],
        ["spreader stress sigma = M c / I (+ axial pull)",
         f"{S(w.spreader_stress_mpa, u)} (allowable {S(w.spreader_allowable_mpa, u)})"],
        ["peak bearing on the socket wall",
         f"{S(w.bearing_pressure_mpa, u, 1)} (allowable {S(w.hub_bearing_allowable_mpa, u, 1)})"],
        ["axial pull the set screws hold", F(w.set_screw_pull_n, u)
         + (f" (they hold about {F(w.set_screw_capacity_n, u)})" if w.set_screw_capacity_n else "")],
        ["lowest safety factor", f"{w.safety_factor:.2f}" if w.safety_factor is not None else "-"],
    ]
    md.table(["figure", "value"], rows)
    from generators.report.mast_figures import ADVICE, mast_rows

    md.add("What the antenna puts on the mast:", "")
    md.table(["figure", "value"], mast_rows(w.as_json(), md.units))
    md.add(ADVICE, "")
    md.add(f"Worst case: wind across spreader {w.worst_spreader} (from azimuth sweep). The pole is taken"
           " at its hub-end diameter all the way out and the wire broadside to the wind, both on the safe"
           f" side; wire pre-tension ({F(ld.wire_tension, u)} at {ld.wire_angle:g} deg), radial ice"
           f" ({md.L(ld.ice_thickness)}) and the pole's own weight are included (plan/beam.py). Dynamic pressure,"
           " cylinder drag (Cd 1.2, Hoerner \"Fluid-Dynamic Drag\"; White \"Fluid Mechanics\") and the tube"
           " section (I = pi (D^4 - d^4)/64, Roark \"Formulas for Stress and Strain\") are textbook"
           " formulas; the socket bearing model is common practice. This is an estimate, not a"
           " structural certification.", "")
