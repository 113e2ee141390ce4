"""The plate hub as built: the U-bolt holes straddle each pole and the mast at the U-bolt
table's leg spacing (read from the manifest, the solid and plate.dxf), and the solid's
volume is the plate's closed-form volume less its holes."""

from __future__ import annotations

import csv
import json
import math
import pathlib

import pytest

CASE = pathlib.Path(__file__).parent / "cases" / "quad-plate.toml"
TABLE = pathlib.Path(__file__).resolve().parents[2] / "generators" / "standards" / "data" / "u_bolts.csv"
MM_PER_IN = 25.4  # exact by definition (1959 international yard and pound agreement)

# Thread major diameters for the U-bolt rods, read off their designations (ISO 261 metric
# sizes are the major diameter in mm; a Unified fraction is the major diameter in inches).
def major_mm(designation: str) -> float:
    if designation.startswith("M"):
        return float(designation[1:].split("x")[0])
    size = designation.split("-")[0]
    num, den = size.split("/")
    return float(num) / float(den) * MM_PER_IN


def table_rows() -> dict[str, dict]:
    """The U-bolt table read with the csv module (not the project's reader)."""
    with TABLE.open(newline="", encoding="utf-8") as f:
        return {row["size"]: row for row in csv.DictReader(f)}


def leg_spacing_from_table(size: str) -> float:
    """Centre to centre of the legs = inside width + one rod diameter (a U bent round a
    mandrel of the inside width, legs parallel)."""
    row = table_rows()[size]
    width = float(row["inside_width_mm"]) if row["inside_width_mm"] else float(row["inside_width_in"]) * MM_PER_IN
    return width + major_mm(row["thread"])


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    from generators.build import build

    out = tmp_path_factory.mktemp("plate")
    result = build(CASE, out)
    manifest = json.loads((result.folder / "manifest.json").read_text())
    return result.folder, manifest


def _pairs(manifest):
    holes = {h["id"]: h for h in manifest["holes"]}
    for u in manifest["plate"]["u_bolts"]:
        a, b = (holes[i] for i in u["holes"])
        yield u, a, b


def _line_distance(p, az_deg, through=(0.0, 0.0)):
    """Distance of point p from the line through ``through`` at azimuth ``az_deg``."""
    t = math.radians(az_deg)
    return abs(-math.sin(t) * (p[0] - through[0]) + math.cos(t) * (p[1] - through[1]))


@pytest.mark.slow
def test_every_output_is_there(built):
    folder, manifest = built
    for name in ("plate.step", "plate.stl", "plate.3mf", "plate.dxf", "cutlist.csv", "report.md",
                 "templates/templates.pdf", "templates/top.dxf"):
        assert (folder / name).is_file(), name
    assert manifest["hub"]["style"] == "plate"
    assert all(r["status"] != "fail" for r in manifest["checks"]["rules"])


@pytest.mark.slow
def test_u_bolt_holes_straddle_each_pole_at_the_tables_leg_spacing(built):
    """Reference: the U-bolt table (inside width + rod diameter between leg centres)."""
    _, manifest = built
    spreaders = {s["id"]: s for s in manifest["spreaders"]}
    counts: dict[int, int] = {}
    for u, a, b in _pairs(manifest):
        if u["holds"] != "spreader":
            continue
        assert a["kind"] == b["kind"] == "u_bolt" and a["spreader"] == b["spreader"] == u["spreader"]
        counts[u["spreader"]] = counts.get(u["spreader"], 0) + 1
        az = spreaders[u["spreader"]]["azimuth_deg"]
        pa, pb = a["entry_mm"], b["entry_mm"]
        # one leg each side of the pole's axis, at half the leg spacing
        for p in (pa, pb):
            assert _line_distance(p, az) == pytest.approx(leg_spacing_from_table(u["size"]) / 2, abs=1e-6)
        mid = ((pa[0] + pb[0]) / 2, (pa[1] + pb[1]) / 2)
        assert _line_distance(mid, az) == pytest.approx(0.0, abs=1e-6)
        assert math.dist(pa[:2], pb[:2]) == pytest.approx(leg_spacing_from_table(u["size"]), abs=1e-6)
        # the pole (30 mm) fits between the legs with the table's clearance
        row = table_rows()[u["size"]]
        assert float(row["inside_width_mm"]) > 30.0
    assert counts == {1: 2, 2: 2, 3: 2, 4: 2}, "two U-bolts a spreader"


@pytest.mark.slow
def test_mast_u_bolts_straddle_the_mast_line(built):
    """Reference: the U-bolt table for the mast's 48.3 mm OD (DIN 3570 DN40 row, from memory)."""
    _, manifest = built
    az = manifest["plate"]["mast_azimuth_deg"]
    mast = [(u, a, b) for u, a, b in _pairs(manifest) if u["holds"] == "mast"]
    assert len(mast) == 2
    for u, a, b in mast:
        assert a.get("mast") is True and b.get("mast") is True and a["spreader"] is None
        assert float(table_rows()[u["size"]]["inside_width_mm"]) > manifest["mast"]["od_mm"]
        for p in (a["entry_mm"], b["entry_mm"]):
            assert _line_distance(p, az) == pytest.approx(leg_spacing_from_table(u["size"]) / 2, abs=1e-6)
    # the two mast U-bolts lie along the mast line, the configured-or-default spacing apart
    c1, c2 = (u["centre_mm"] for u, _, _ in mast)
    assert _line_distance(c1, az) == pytest.approx(0, abs=1e-6) and _line_distance(c2, az) == pytest.approx(0, abs=1e-6)
    assert math.dist(c1, c2) == pytest.approx(manifest["plate"]["mast_u_bolt_spacing_mm"], abs=1e-6)


@pytest.mark.slow
def test_the_solid_has_each_hole_where_the_manifest_says(built):
    """Point-in-solid along each hole axis: empty at the axis, material just outside the rim."""
    import cadquery as cq

    folder, manifest = built
    solid = cq.importers.importStep(str(folder / "plate.step")).val()
    T = manifest["hub"]["thickness_mm"]
    for h in manifest["holes"]:
        x, y, _ = h["entry_mm"]
        r = h["diameter_mm"] / 2
        for z in (0.5, T / 2, T - 0.5):
            assert not solid.isInside(cq.Vector(x, y, z)), f"{h['id']} axis at z={z}"
        for ang in (0.0, 90.0, 180.0, 270.0):
            t = math.radians(ang)
            p = cq.Vector(x + (r + 0.6) * math.cos(t), y + (r + 0.6) * math.sin(t), T / 2)
            assert solid.isInside(p), f"{h['id']} rim at {ang} deg"


@pytest.mark.slow
def test_volume_is_the_square_less_its_holes(built):
    """Closed form: a square of side a (across flats), thickness t, less n cylinders pi r^2 t."""
    import cadquery as cq

    folder, manifest = built
    solid = cq.importers.importStep(str(folder / "plate.step")).val()
    a, t = manifest["hub"]["across_flats_mm"], manifest["hub"]["thickness_mm"]
    expect = a * a * t - sum(math.pi * (h["diameter_mm"] / 2) ** 2 * t for h in manifest["holes"])
    assert solid.Volume() == pytest.approx(expect, rel=1e-6)


@pytest.mark.slow
def test_plate_dxf_has_the_outline_and_every_hole(built):
    """Read back with ezdxf: the CUT outline is the 320 mm square, a DRILL circle per hole."""
    import ezdxf

    folder, manifest = built
    doc = ezdxf.readfile(folder / "plate.dxf")
    msp = doc.modelspace()
    outline = [e for e in msp.query("LWPOLYLINE") if e.dxf.layer == "CUT"]
    assert len(outline) == 1 and outline[0].closed
    xs = [p[0] for p in outline[0].get_points("xy")]
    ys = [p[1] for p in outline[0].get_points("xy")]
    a = manifest["hub"]["across_flats_mm"]
    assert max(xs) - min(xs) == pytest.approx(a, abs=1e-6) and max(ys) - min(ys) == pytest.approx(a, abs=1e-6)
    circles = [e for e in msp.query("CIRCLE") if e.dxf.layer == "DRILL"]
    assert len(circles) == len(manifest["holes"])
    for h in manifest["holes"]:
        x, y, _ = h["entry_mm"]
        near = [c for c in circles if math.hypot(c.dxf.center.x - x, c.dxf.center.y - y) < 1e-6]
        assert len(near) == 1 and near[0].dxf.radius == pytest.approx(h["diameter_mm"] / 2, abs=1e-9), h["id"]


@pytest.mark.slow
def test_report_lists_u_bolts_nuts_and_washers(built):
    folder, manifest = built
    text = (folder / "report.md").read_text()
    n_sp = sum(u["holds"] == "spreader" for u in manifest["plate"]["u_bolts"])
    assert f"| {n_sp} | U-bolt for spreader poles" in text
    assert f"| {2 * n_sp} | hex nut | M8x1.25" in text
    assert f"| {2 * n_sp} | plain washer |" in text
    assert "| 2 | U-bolt for the mast" in text and "| 4 | hex nut | M12x1.75" in text


@pytest.mark.slow
def test_template_marks_each_stop_line_at_the_cut_lists_stop(built):
    """The top template (read with ezdxf) draws every hole of the face and, across each pole,
    a stop line at the radius the cut list measures from (hand geometry: a line square to
    the pole's azimuth at that radius)."""
    import ezdxf

    folder, manifest = built
    rec = next(t for t in manifest["templates"] if t["face"] == "top")
    msp = ezdxf.readfile(folder / rec["file"]).modelspace()
    circles = [e for e in msp.query("CIRCLE") if e.dxf.layer == "HOLES"]
    assert len(circles) == len(manifest["holes"])
    lines = [e for e in msp.query("LINE") if e.dxf.layer == "NOTES"]
    for s in manifest["spreaders"]:
        az = math.radians(s["azimuth_deg"])
        r = s["stop_radius_mm"]
        assert s["cut_stop"] == "stop line on the plate"
        found = [ln for ln in lines
                 if all(abs(p.x * math.cos(az) + p.y * math.sin(az) - r) < 1e-6 for p in (ln.dxf.start, ln.dxf.end))
                 and math.hypot(ln.dxf.end.x - ln.dxf.start.x, ln.dxf.end.y - ln.dxf.start.y) > s["diameter_mm"]]
        assert len(found) == 1, s["id"]


@pytest.mark.slow
def test_holes_found_in_the_solid_straddle_each_pole_at_the_tables_spacing(built):
    """From the STEP alone: every cylindrical wall (a hole) is found by its centre; around each
    pole's axis there are two pairs of holes, each pair one table leg spacing apart, square to
    the pole and centred on its axis (reference: the U-bolt table, read with csv)."""
    import cadquery as cq

    folder, manifest = built
    solid = cq.importers.importStep(str(folder / "plate.step")).val()
    found = []
    for f in solid.Faces():
        if f.geomType() == "CYLINDER":
            c = f.Center()
            found.append((c.x, c.y, f.Area() / (2 * math.pi * manifest["hub"]["thickness_mm"])))
    assert len(found) == len(manifest["holes"])
    sizes = {u["spreader"]: u["size"] for u in manifest["plate"]["u_bolts"] if u["holds"] == "spreader"}
    for s in manifest["spreaders"]:
        az = s["azimuth_deg"]
        half = leg_spacing_from_table(sizes[s["id"]]) / 2
        t = math.radians(az)
        along = [(x * math.cos(t) + y * math.sin(t), -x * math.sin(t) + y * math.cos(t))
                 for x, y, _ in found]
        beside = [(a, c) for a, c in along if a > 0 and abs(abs(c) - half) < 1e-4]
        # two U-bolts: two radii along the pole, each with one hole either side
        radii = sorted({round(a, 3) for a, _ in beside})
        assert len(radii) == 2, s["id"]
        for r in radii:
            sides = sorted(c for a, c in beside if abs(a - r) < 1e-3)
            assert sides == pytest.approx([-half, half], abs=1e-4)
