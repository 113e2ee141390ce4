"""report.md: the build report a builder prints and takes to the shop.

Sections: what was built, the picture, the drill schedule per face in drilling order,
fasteners, cut list and sleeves (when the build made them), mass, checks, wind, cautions.
Sizes are in the config's units; drills by their shop names.
"""

from __future__ import annotations

import math
from typing import Any

from generators.config.text import markdown_text

from generators.plan.model import Hole, HubPlan
from generators.units import format_both, format_length

# Holes over this diameter get a pilot first (common practice: a big drill wanders and
# grabs without one); the pilot is about the size of a big drill's chisel edge.
PILOT_OVER_MM = 10.0
PILOT = {"mm": ("metric", 6.0), "in": ("fractional", 6.35)}

CAUTIONS = (
    "**Power lines**: keep the mast and antenna far enough from overhead lines that nothing can"
    " touch them if the mast falls or the antenna swings. Look up before you raise anything.",
    "**Raising and climbing**: raise the mast with a helper and guy it as the mast maker rates it;"
    " never climb a mast or tower without fall protection and training.",
    "**Wind and ice**: the wind figures here are an estimate, not a structural certification. Ice on"
    " the spreaders and wires adds weight and wind area that are not included. Lower the antenna"
    " before storms.",
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


def drill_text(h: Hole, units: str) -> str:
    """The cutter for a hole by its shop name, in the config's units."""
    from generators.standards.drills import find_drill

    if h.drill:
        try:
            return find_drill(h.drill).label(units)
        except Exception:  # noqa: BLE001 - a name the drill tables do not know: show it as is
            return h.drill
    from generators.standards.drills import drills

    size = format_length(h.diameter_mm, units, fractions=False)
    series = ("fractional", "number", "letter") if units == "in" else ("metric",)
    stock = drills(series)
    under = [d for d in stock if d.diameter_mm < h.diameter_mm]
    if h.diameter_mm > stock[-1].diameter_mm or h.kind == "bore":
        return (f"bore to {size}: hole saw or Forstner bit under size, then bore or turn to size"
                if h.diameter_mm > 30 else f"bore or mill to {size}")
    near = f"; nearest stock drill under it {under[-1].label(units)}" if under else ""
    return f"bore, mill or ream to {size} (no stock twist drill that size{near})"


def pilot_text(units: str) -> str:
    from generators.standards.drills import drills

    series, mm = PILOT[units]
    d = min(drills((series,)), key=lambda x: abs(x.diameter_mm - mm))
    return d.label(units)


def _depth_text(h: Hole, plan: HubPlan, md: _Md) -> str:
    if h.kind == "bore" or h.through:
        return f"through ({md.L(h.depth_mm)})"
    if h.kind == "socket":
        sp = next((s for s in plan.spreaders if s.socket_hole == h.id), None)
        if sp is not None and sp.stop != "socket floor":
            return f"into the bore ({md.L(h.depth_mm)} along the axis)"
        return f"{md.L(h.depth_mm)} deep, flat bottom"
    if h.kind == "set_screw":
        return f"into the socket ({md.L(h.depth_mm)} to the socket axis)"
    if h.kind == "clamp":
        return f"into the bore ({md.L(h.depth_mm)})"
    return f"{md.L(h.depth_mm)} deep"


def _angle_note(h: Hole, face) -> str:
    cosang = -sum(a * n for a, n in zip(h.axis, face.normal))
    ang = math.degrees(math.acos(max(-1.0, min(1.0, cosang))))
    if ang < 0.05:
        return "square to the face"
    lean = "toward the bottom face" if h.axis[2] < 0 else "toward the top face"
    return f"{ang:.1f} deg off square, leaning {lean} as it goes in"


def _pass_of(h: Hole) -> int:
    """Drilling order: the bore first, then the sockets, then holes that break into them."""
    return {"bore": 0, "socket": 1}.get(h.kind, 2)


def drill_passes(plan: HubPlan) -> list[tuple[int, str, list[Hole]]]:
    """(pass, face id, holes) in the order to drill them."""
    face_order = {f.id: i for i, f in enumerate(plan.faces)}
    groups: dict[tuple[int, str], list[Hole]] = {}
    for h in plan.holes:
        groups.setdefault((_pass_of(h), h.face), []).append(h)
    keys = sorted(groups, key=lambda k: (k[0], face_order.get(k[1], 99)))
    return [(k[0], k[1], groups[k]) for k in keys]


def _steps(holes: list[Hole], plan: HubPlan, md: _Md) -> list[list[str]]:
    """Operations on one face: punch, pilot, drill (small to large), tap, sink or bore."""
    ids = lambda hs: ", ".join(h.id for h in hs)  # noqa: E731
    rows = [["centre punch", ids(holes), "punch", "at the template marks", ""]]
    big = [h for h in holes if h.diameter_mm > PILOT_OVER_MM and h.drill]
    if big:
        rows.append(["pilot drill", ids(big), pilot_text(md.units), "same depth as the hole",
                     "steadies the large drill"])
    by_cutter: dict[str, list[Hole]] = {}
    for h in sorted(holes, key=lambda h: (h.diameter_mm, h.id)):
        by_cutter.setdefault(drill_text(h, md.units), []).append(h)
    for cutter, hs in by_cutter.items():
        op = "tap drill" if hs[0].thread and hs[0].kind not in ("nut_pocket", "insert_pocket") else "drill"
        if hs[0].kind in ("nut_pocket", "insert_pocket"):
            op = "pocket (printed)"
        face = plan.face(hs[0].face)
        note = _angle_note(hs[0], face) if hs[0].kind == "socket" else ""
        if hs[0].note and hs[0].kind in ("extra", "clamp", "nut_pocket", "insert_pocket"):
            note = "; ".join(x for x in (note, hs[0].note) if x)
        rows.append([op, ids(hs), cutter, "; ".join(dict.fromkeys(_depth_text(h, plan, md) for h in hs)), note])
    tapped = [h for h in holes if h.thread and h.kind not in ("nut_pocket", "insert_pocket")]
    by_thread: dict[str, list[Hole]] = {}
    for h in tapped:
        by_thread.setdefault(h.thread, []).append(h)
    for thread, hs in by_thread.items():
        pct = f"{hs[0].thread_percent:.0f}% thread" if hs[0].thread_percent else ""
        blind = any(not h.through and h.kind == "extra" for h in hs)
        rows.append(["tap", ids(hs), f"{thread} tap", "full depth" + ("; finish with a bottoming tap" if blind else ""),
                     "; ".join(x for x in (pct, "tap straight, back off every turn to break the chip") if x)])
    sinks: dict[tuple, list[Hole]] = {}
    for h in holes:
        if h.countersink:
            sinks.setdefault(("countersink", f"{h.countersink.angle_deg:g} deg countersink",
                              f"to {md.L(h.countersink.diameter_mm)} across", "screw head flush"), []).append(h)
        if h.counterbore:
            sinks.setdefault(("counterbore", f"{md.L(h.counterbore.diameter_mm)} counterbore",
                              f"{md.L(h.counterbore.depth_mm)} deep", "head below the surface"), []).append(h)
    for (op, tool, depth, note), hs in sinks.items():
        rows.append([op, ids(hs), tool, depth, note])
    return [[str(i + 1)] + r for i, r in enumerate(rows)]


def _positions(holes: list[Hole], plan: HubPlan, md: _Md) -> list[list[str]]:
    rows = []
    for h in holes:
        face = plan.face(h.face)
        u, v = (round(c, 6) + 0.0 for c in face.to_face(h.entry_mm))
        thread = h.thread or ""
        rows.append([h.id, h.kind.replace("_", " "), md.L(u), md.L(v), md.L(h.diameter_mm), thread,
                     h.note or ""])
    return rows


def _face_name(plan: HubPlan, face_id: str) -> str:
    f = plan.face(face_id)
    return f"{face_id} ({f.label})" if f.label else face_id


def render_report(cfg, plan: HubPlan, checks, manifest: dict[str, Any], preview: str | None) -> str:
    """The whole report as markdown text."""
    md = _Md(cfg.units)
    units = cfg.units
    hub = manifest.get("hub", {})
    body = plan.body
    size = (f"{md.both(body.across_flats_mm)} across flats, {body.sides} sides" if body.style == "block"
            else f"{md.both(body.diameter_mm)} diameter")
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
        ["hub", f"{body.style}, {size}, {md.both(body.thickness_mm)} thick, {mat.name} ({plan.process})"],
        ["bore", f"{md.both(plan.bore_mm)} through"],
        ["spreaders", f"{sp.count} x {md.both(sp.diameter)} poles at {sp.elevation:g} deg elevation,"
                      f" first at {sp.first_azimuth:g} deg azimuth"],
    ]
    if sockets:
        stop = plan.spreaders[0].stop
        rows.append(["sockets", f"{len(sockets)} x {md.both(sockets[0].diameter_mm)},"
                                f" {md.L(sockets[0].depth_mm)} deep; the pole stops at the {stop}"])
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
               " in the drill schedule.", "")
    else:
        md.add("(no picture: the hub's STL was not there to render)", "")

    md.add("## Drill schedule", "",
           "Mark every hole from the 1:1 templates (or the positions below: u to the right and v up"
           " looking at the face from outside), then work through the faces in this order: the bore"
           " first, then the sockets, then the holes that break into them, so their burrs are cleaned"
           " up last. Sizes in " + ("inches" if units == "in" else "millimetres") + ".", "")
    templates = {t.get("face"): t.get("file") for t in (manifest.get("templates") or []) if isinstance(t, dict)}
    for k, (pass_no, face_id, holes) in enumerate(drill_passes(plan)):
        what = {0: "bore", 1: "socket", 2: "holes"}[pass_no]
        md.add(f"### {k + 1}. {_face_name(plan, face_id)}: {what}", "")
        if templates.get(face_id):
            md.add(f"Template: `{templates[face_id]}`", "")
        md.table(["step", "operation", "holes", "tool", "depth", "notes"], _steps(holes, plan, md))
        md.table(["hole", "kind", "u", "v", "diameter", "thread", "note"], _positions(holes, plan, md))

    md.add("## Fasteners", "")
    md.table(["qty", "item", "size", "notes"], fastener_rows(cfg, plan, checks, md))

    cut = manifest.get("cutlist")
    md.add("## Spreader cut list", "")
    spreaders = manifest.get("spreaders") or []
    if cut and any("cut_length_mm" in s for s in spreaders):
        rows = [[str(s["id"]), f"{s['azimuth_deg']:g} deg", md.both(s["cut_length_mm"]), s.get("cut_stop", s.get("stop", ""))]
                for s in spreaders]
        md.table(["spreader", "azimuth", "cut length", "measured from"], rows)
        if cut.get("tip_allowance_mm") is not None:
            md.add(f"Lengths include {md.L(cut['tip_allowance_mm'])} tip allowance; tips at"
                   f" {md.both(cut['tip_radius_mm'])} from the mast axis. File: `{cut.get('file', '')}`.", "")
        for c in (cut.get("cases") or [])[1:]:
            md.add(f"- on the {c['stop']}: {md.both(c['cut_length_mm'])}")
        if len(cut.get("cases") or []) > 1:
            md.add("")
    else:
        md.add("No cut list in this build (it needs spreaders.tip_radius or spreaders.tip_spacing).", "")

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
           " same table). pass = at or above the recommended figure; warn = below it but above the"
           " minimum; fail = below the minimum (the build stops unless --force).", "")
    from generators.commands.check import figure

    rows = [[r.id, r.status.upper() if r.status != "pass" else r.status, figure(r.value, r.unit, units),
             figure(r.limit, r.unit, units), r.message, r.source] for r in checks.rules]
    md.table(["rule", "status", "figure", "limit", "finding / what to change", "source"], rows)

    md.add("## Wind-load estimate", "")
    wind_section(md, cfg, checks)

    md.add("## Cautions", "")
    for c in CAUTIONS:
        md.add(f"- {c}")
    md.add("", f"Made by hubwright {manifest.get('generator', {}).get('version', '')}: check every"
           " dimension against your parts before cutting.", "")
    return "\n".join(md.lines)


def fastener_rows(cfg, plan: HubPlan, checks, md: _Md) -> list[list[str]]:
    from generators.standards.fasteners import set_screw_lengths

    rows = []
    ss = checks.set_screws
    if ss:
        by: dict[tuple, int] = {}
        for f in ss:
            by[(f["thread"], f["length_mm"], f.get("captive_nut", False))] = by.get(
                (f["thread"], f["length_mm"], f.get("captive_nut", False)), 0) + 1
        for (thread, length, nut), n in by.items():
            rows.append([str(n), "socket set screw, cup point (ISO 4029 / ASME B18.3)",
                         f"{thread} x {format_length(length, md.units)}",
                         "chosen from stock lengths: reaches the pole, sits below the face"
                         + ("; runs through a captive nut" if nut else "")])
            if nut:
                rows.append([str(n), "hex nut (captive, in its pocket)", thread, "ISO 4032 / ASME B18.2.2"])
    clamps = [h for h in plan.holes if h.kind == "clamp"]
    if clamps:
        thread = clamps[0].thread or (cfg.mast_clamp.thread.designation if cfg.mast_clamp else "")
        gap = clamps[0].depth_mm + (plan.bore_mm - plan.mast_od_mm) / 2
        from generators.standards.threads import parse_thread

        major = parse_thread(thread).major_mm
        try:
            fit = [x for x in set_screw_lengths(thread) if x <= gap + 1e-9]
        except Exception:  # noqa: BLE001 - no stock table for this size
            fit = []
        if fit and max(fit) >= gap - 2 * major:
            item, size = "mast clamp: socket set screw, cup point", f"{thread} x {format_length(max(fit), md.units)}"
        else:
            item, size = "mast clamp: bolt or thumb screw", f"{thread}, at least {md.L(gap)} under the head"
        rows.append([str(len(clamps)), item, size,
                     f"face to mast {md.L(gap)}; a sleeve in the bore changes this (see the sleeves)"])
    extras: dict[tuple, list[str]] = {}
    specs = {x.id: x for x in cfg.holes}
    for h in plan.holes:
        if h.kind != "extra":
            continue
        spec = specs.get(h.id)
        clear = spec.clearance.designation if spec is not None and spec.clearance is not None else None
        if h.thread:
            key = ("screw into a tapped hole", h.thread, f"length: what it clamps + up to {md.L(h.depth_mm)} of thread")
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
    rows.append([str(cfg.spreaders.count), "spreader pole", f"{md.L(cfg.spreaders.diameter)} OD at the hub",
                 "see the cut list"])
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
    rows = [
        ["dynamic pressure q = 1/2 rho V^2", f"{w.pressure_pa:.0f} Pa"],
        ["exposed spreader length L (socket mouth to tip)", f"{md.both(w.exposed_length_m * 1000)}"],
        ["force on the worst spreader (pole + wire share)", f"{w.force_per_spreader_n:.1f} N"],
        ["bending moment at the socket mouth (q Cd d L^2/2 + F_wire L)", f"{w.moment_at_hub_nm:.1f} N m"],
        ["spreader stress sigma = M c / I", f"{w.spreader_stress_mpa:.0f} MPa (allowable {w.spreader_allowable_mpa:.0f} MPa)"],
        ["peak bearing on the socket wall", f"{w.bearing_pressure_mpa:.1f} MPa (allowable {w.hub_bearing_allowable_mpa:g} MPa)"],
        ["axial pull the set screws hold", f"{w.set_screw_pull_n:.0f} N"
         + (f" (they hold about {w.set_screw_capacity_n:.0f} N)" if w.set_screw_capacity_n else "")],
        ["lowest safety factor", f"{w.safety_factor:.2f}" if w.safety_factor is not None else "-"],
    ]
    md.table(["figure", "value"], rows)
    md.add(f"Worst case: wind across spreader {w.worst_spreader} (from azimuth sweep). The pole is taken"
           " at its hub-end diameter all the way out and the wire broadside to the wind, both on the safe"
           " side; wire pre-tension, ice and the pole's own weight are not included. Dynamic pressure,"
           " cylinder drag (Cd 1.2, Hoerner \"Fluid-Dynamic Drag\"; White \"Fluid Mechanics\") and the tube"
           " section (I = pi (D^4 - d^4)/64, Roark \"Formulas for Stress and Strain\") are textbook"
           " formulas; the socket bearing model is common practice. This is an estimate, not a"
           " structural certification.", "")
