"""End to end: a hub with three sleeves, a re-run with --mast, refusals and a batch."""

from __future__ import annotations

import contextlib
import csv
import io
import json
import math
import shutil
from pathlib import Path

import numpy as np
import pytest

from generators.cli import main
from generators.units import MM_PER_IN

pytestmark = pytest.mark.slow

DEMO = Path(__file__).resolve().parents[2] / "configs" / "six-spreader-sleeves.toml"
NAME = "hex-sleeves-51"


def _run(argv):
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        code = main(argv)
    return code, out.getvalue(), err.getvalue()


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    """The demo built once, its hub bytes kept, then rebuilt with one more mast."""
    base = tmp_path_factory.mktemp("sleeves")
    cfg = base / DEMO.name
    shutil.copy(DEMO, cfg)
    out = base / "out"
    code, text, err = _run(["build", str(cfg), "--out", str(out)])
    assert code == 0, err
    folder = out / NAME
    first = {p.name: p.read_bytes() for p in folder.glob("hub.*")}
    manifest = json.loads((folder / "manifest.json").read_text())
    code2, text2, err2 = _run(["build", str(cfg), "--out", str(out), "--mast", "30 mm"])
    assert code2 == 0, err2
    return {"cfg": cfg, "folder": folder, "first_hub": first, "manifest": manifest,
            "manifest2": json.loads((folder / "manifest.json").read_text()), "text2": text2}


def _step_radii(path: Path) -> list[float]:
    import cadquery as cq

    from generators.cad.reducer import measured_radii

    return measured_radii(cq.importers.importStep(str(path)).val())


def test_three_sleeves_with_published_mast_ods(built):
    recs = {r["mast"]: r for r in built["manifest"]["reducers"]}
    # ANSI C80.3 (1-1/4 EMT 1.510 in), ASME B36.10M (NPS 1 1.315 in, NPS 1-1/4 1.660 in), from memory
    assert recs["1-1/4 in EMT"]["mast_od_mm"] / MM_PER_IN == pytest.approx(1.510, abs=1e-6)
    assert recs["1 NPS sch 40 pipe"]["mast_od_mm"] / MM_PER_IN == pytest.approx(1.315, abs=1e-6)
    assert recs["1-1/4 NPS sch 40 pipe"]["mast_od_mm"] / MM_PER_IN == pytest.approx(1.660, abs=1e-6)
    for r in recs.values():
        assert set(r) >= {"mast", "mast_od_mm", "od_mm", "id_mm", "wall_mm", "length_mm", "files"}
        assert r["files"][0] == f"sleeve-{r['mast_od_mm']:.2f}".rstrip("0").rstrip(".") + "mm.step"
        for f in r["files"]:
            assert (built["folder"] / f).stat().st_size > 0


def test_sleeve_od_and_id_measured_from_the_files(built):
    import trimesh

    for r in built["manifest"]["reducers"]:
        stem = r["files"][0][:-5]
        radii = _step_radii(built["folder"] / f"{stem}.step")
        # the exported STEP has cylinders at exactly the planned radii (within 0.01 mm on diameter)
        assert min(abs(2 * x - r["od_mm"]) for x in radii) < 0.01
        assert min(abs(2 * x - r["id_mm"]) for x in radii) < 0.01
        mesh = trimesh.load(built["folder"] / f"{stem}.stl")
        v = mesh.vertices
        inside = v[np.abs(v[:, 2]) < 1e-6]  # the bottom face's edges (the flange is on top)
        assert len(inside) > 20
        rho = np.hypot(inside[:, 0], inside[:, 1])
        assert 2 * rho.max() == pytest.approx(r["od_mm"], abs=0.01)
        assert 2 * rho.min() == pytest.approx(r["id_mm"], abs=0.01)
        if r["key_flat"] is not None:  # a section: the inside reaches only to the flat that way
            a = math.radians(r["key_flat"]["azimuth_deg"])
            seg = trimesh.intersections.mesh_plane(mesh, [0, 0, 1], [0, 0, 5.0]).reshape(-1, 3)
            inner = seg[np.hypot(seg[:, 0], seg[:, 1]) < r["id_mm"] / 2 + 0.01]
            reach = (inner[:, 0] * math.cos(a) + inner[:, 1] * math.sin(a)).max()
            assert reach == pytest.approx(r["key_flat"]["distance_mm"], abs=0.01)


def test_cut_list_file_matches_the_manifest(built):
    m = built["manifest"]
    rows = list(csv.DictReader(io.StringIO((built["folder"] / "cutlist.csv").read_text())))
    assert [int(r["spreader"]) for r in rows] == [1, 2, 3, 4, 5, 6]
    for row, sp in zip(rows, m["spreaders"]):
        assert float(row["cut_length_mm"]) == pytest.approx(sp["cut_length_mm"], abs=0.005)
        assert float(row["azimuth_deg"]) == pytest.approx(sp["azimuth_deg"])
        assert row["stop"].startswith("sleeve OD")
    # tip_spacing 2.75 m on six spreaders: tip radius 2.75 m (hexagon side = circumradius)
    assert m["cutlist"]["tip_radius_mm"] == pytest.approx(2750.0)


def test_rerun_with_another_mast_keeps_the_hub(built):
    folder = built["folder"]
    for name, data in built["first_hub"].items():
        assert (folder / name).read_bytes() == data, name
    assert (folder / "sleeve-30mm.step").is_file()
    assert len(built["manifest2"]["reducers"]) == 4
    text = built["text2"]
    assert "hub    files identical to the previous build" in text
    assert "recut  no re-cut" in text  # the poles still stop on a sleeve of the same OD
    assert "recut_since_previous" not in built["manifest2"]["cutlist"]  # comparisons stay out of the manifest
    assert json.loads((folder / "changes.json").read_text())["recut_since_previous"] is False


def test_too_large_mast_is_refused_and_nothing_written(built, tmp_path):
    out = tmp_path / "out"
    code, text, err = _run(["build", str(built["cfg"]), "--out", str(out), "--mast", "1-1/2 NPS"])
    assert code == 2 and text == ""
    assert err.count("\n") == 1 and "largest mast this bore accepts is 46.9 mm" in err
    assert not out.exists() or not any(out.iterdir())


def test_batch_builds_the_good_and_reports_the_bad(tmp_path):
    good = tmp_path / "good.toml"
    good.write_text(DEMO.read_text().replace(f'name = "{NAME}"', 'name = "batch-good"')
                    .split("[[reducers]]")[0])
    bad = tmp_path / "bad.toml"
    bad.write_text('name = "batch-bad"\n[mast]\nsize = "50 mm"\n')  # no [hub]: refused
    out = tmp_path / "out"
    code, text, err = _run(["build", str(bad), str(good), "--out", str(out)])
    assert code == 2
    assert (out / "batch-good" / "manifest.json").is_file()
    assert not (out / "batch-bad").exists()
    assert f"ok     {good}" in text and f"failed {bad}: hub: is required" in text
    assert "1 built, 1 failed of 2" in text


def test_a_keyed_sleeve_shows_its_flat_on_the_top_template(built):
    import ezdxf

    for r in built["manifest2"]["reducers"]:
        top = built["folder"] / "templates" / f"{r['files'][0].removesuffix('.step')}-top.dxf"
        msp = ezdxf.readfile(top).modelspace()
        chords = msp.query('LINE[layer=="OUTLINE"]')
        if r["key_flat"] is None:
            assert len(chords) == 0
            continue
        assert len(chords) == 1
        (x0, y0), (x1, y1) = (chords[0].dxf.start.x, chords[0].dxf.start.y), (chords[0].dxf.end.x, chords[0].dxf.end.y)
        a = math.radians(r["key_flat"]["azimuth_deg"])
        # both ends lie on the flat: their distance along the flat's normal is its distance from the axis
        for x, y in ((x0, y0), (x1, y1)):
            assert x * math.cos(a) + y * math.sin(a) == pytest.approx(r["key_flat"]["distance_mm"], abs=0.01)
