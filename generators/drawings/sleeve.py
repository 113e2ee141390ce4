"""Top-view templates of the reducer sleeves, drawn by the same sheet builder as the hub.

Each sleeve becomes a small round plan of its own: its outline (the flange, or the
sleeve's outside), its inside diameter as the through bore, and its clamp holes on the
rim. The sheets land in ``templates/sleeve-<mast OD>-<face>.dxf`` and a PDF a sleeve,
``templates/sleeve-<mast OD>.pdf``, with a PNG preview a page.
"""

from __future__ import annotations

import math

from generators.drawings import pages as P
from generators.drawings.sheet import build_sheets
from generators.drawings.writer import FOLDER, paper_for
from generators.plan.model import Body, Face, Hole, HubPlan

SEGMENTS = 180


def sleeve_as_plan(hub: HubPlan, sleeve) -> HubPlan:
    """A round plan of one sleeve, in its own frame (bottom at Z = 0, seen like the hub)."""
    outer = sleeve.flange.od_mm if sleeve.flange else sleeve.od_mm
    T = sleeve.height_mm
    R = outer / 2
    outline = tuple((R * math.cos(2 * math.pi * k / SEGMENTS), R * math.sin(2 * math.pi * k / SEGMENTS))
                    for k in range(SEGMENTS))
    body = Body(style="puck", thickness_mm=T, diameter_mm=outer, outline=outline)
    C = math.pi * sleeve.od_mm
    faces = (
        Face(id="top", kind="top", origin=(0.0, 0.0, T), normal=(0.0, 0.0, 1.0), u_axis=(1.0, 0.0, 0.0),
             v_axis=(0.0, 1.0, 0.0), outline=outline,
             label=f"sleeve for {sleeve.mast_designation}, top seen from above"),
        Face(id="rim", kind="rim", origin=(0.0, 0.0, 0.0), normal=(1.0, 0.0, 0.0), u_axis=(0.0, 1.0, 0.0),
             v_axis=(0.0, 0.0, 1.0), outline=((0.0, 0.0), (C, 0.0), (C, sleeve.length_mm), (0.0, sleeve.length_mm)),
             label="sleeve outside, unrolled from azimuth 0 counter-clockwise seen from above"),
    )
    inside = Hole(id="ID", kind="bore", face="top", entry_mm=(0.0, 0.0, T), axis=(0.0, 0.0, -1.0),
                  diameter_mm=sleeve.id_mm, depth_mm=T, through=True, note="sleeve inside (bored or turned)")
    holes = (inside,) + tuple(h for h in sleeve.holes if h.face in ("outside", "rim"))
    holes = tuple(h if h.face != "outside" else _on_rim(h) for h in holes)
    notes = list(sleeve.notes)
    if sleeve.slit:
        notes.append(f"slit {sleeve.slit.width_mm:.1f} mm wide at azimuth {sleeve.slit.azimuth_deg:g} deg")
    if sleeve.key_flat:
        notes.append(f"flat inside at azimuth {sleeve.key_flat.azimuth_deg:g} deg")
    return HubPlan(name=f"{hub.name}-{sleeve.stem}", units=hub.units, material=hub.material,
                   process="machined", mast_designation=sleeve.mast_designation,
                   mast_od_mm=sleeve.mast_od_mm, bore_mm=sleeve.id_mm, body=body, faces=faces,
                   holes=holes, spreaders=(), notes=tuple(notes))


def _on_rim(h: Hole) -> Hole:
    from dataclasses import replace

    return replace(h, face="rim")


def write_sleeve_templates(ctx) -> None:
    from generators.drawings.dxf import write_sheet_dxf
    from generators.drawings.pdf import write_pdf
    from generators.report.cutlist_writer import sleeves_for

    sleeves = sleeves_for(ctx)
    if not sleeves:
        return
    folder = ctx.folder / FOLDER
    folder.mkdir(exist_ok=True)
    cfg = ctx.config
    records = []
    for s in sleeves:
        plan = sleeve_as_plan(ctx.plan, s)
        sheets = build_sheets(plan, cfg)
        dxfs = []
        for sheet in sheets:
            dxf = folder / f"{s.stem}-{sheet.name}.dxf"
            write_sheet_dxf(sheet, dxf, f"{plan.name}: sleeve {sheet.name} template, 1:1 in {cfg.units}")
            dxfs.append({"face": sheet.face.id, "file": f"{FOLDER}/{dxf.name}",
                         "holes": {hid: [round(u, 6), round(v, 6)] for hid, (u, v) in sheet.positions.items()}})
        pages = P.layout(sheets, paper_for(cfg))
        title = f"{ctx.plan.name} sleeve for {s.mast_designation} ({s.stem})"
        previews = write_pdf(pages, folder / f"{s.stem}.pdf", folder / f"{s.stem}-page-", title)
        records.append({"mast": s.mast_designation, "mast_od_mm": round(s.mast_od_mm, 6),
                        "pdf": f"{FOLDER}/{s.stem}.pdf", "pages": len(pages), "sheets": dxfs,
                        "previews": [f"{FOLDER}/{p.name}" for p in previews]})
    ctx.manifest["sleeve_templates"] = records
    ctx.summary.append(f"  sleeve templates {', '.join(r['pdf'] for r in records)} at 1:1")
