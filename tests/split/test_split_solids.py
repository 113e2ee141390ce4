"""The split demo as built: the halves read back from their STEP and STL files and probed
with cadquery and trimesh."""

from __future__ import annotations

import math
from dataclasses import replace

import pytest

pytestmark = pytest.mark.slow


def _step(folder, stem):
    import cadquery as cq

    return cq.importers.importStep(str(folder / f"{stem}.step")).solids().vals()[0]


def _inside(solid, p) -> bool:
    import cadquery as cq

    return solid.isInside(cq.Vector(*map(float, p)), 1e-4)


def test_halves_join_to_the_unsplit_body_within_the_bolt_holes_and_gap(split_build, split_design):
    from generators.cad.solids import hub_solid

    folder, manifest = split_build
    plan = split_design.plan
    sp = plan.split
    a, b = _step(folder, "hub-a"), _step(folder, "hub-b")
    bolt_ids = {h.id for h in plan.holes if h.kind in ("split_bolt", "head_pocket")
                or getattr(h, "serves", None) in {x.hole for x in sp.bolts}}
    whole = hub_solid(replace(plan, holes=tuple(h for h in plan.holes if h.id not in bolt_ids), split=None))
    bolted = hub_solid(replace(plan, split=None))
    bolts_mm3 = whole.Volume() - bolted.Volume()
    # the gap by hand: a slab gap thick across the section of the block in the plane: the
    # plane runs from chamfer to opposite chamfer (2 x (R_corner - leg sin 30 deg)), less the
    # bore, over the whole thickness, less the two bolt holes where they cross it
    body = plan.body
    leg = body.corner_chamfer_mm / (2 * math.cos(math.pi / 6))
    across = 2 * (body.corner_radius_mm - leg * math.sin(math.pi / 6))
    bolt = plan.hole(sp.bolts[0].hole)
    teardrop = math.pi * 0.75 * bolt.radius_mm ** 2 + bolt.radius_mm ** 2  # 270 deg arc + the 45 deg roof
    gap_mm3 = sp.gap_mm * ((across - plan.bore_mm) * body.thickness_mm - 2 * teardrop)
    joined = a.Volume() + b.Volume()
    assert whole.Volume() - joined == pytest.approx(bolts_mm3 + gap_mm3, rel=0.01)
    # and exactly (the kernel's own volumes): the halves, the gap slab and the bolt cuts
    assert manifest["parts"][0]["volume_mm3"] + manifest["parts"][1]["volume_mm3"] == \
        pytest.approx(joined, abs=0.2)
    assert manifest["hub"]["volume_mm3"] == pytest.approx(joined, abs=0.5)
    # the halves do not overlap and stand the gap apart (OCCT shape distance)
    assert a.intersect(b).Volume() == pytest.approx(0.0, abs=1e-6)
    assert a.distance(b) == pytest.approx(sp.gap_mm, abs=1e-6)


def test_bolts_cross_the_split(split_build, split_design):
    folder, _ = split_build
    plan = split_design.plan
    sp = plan.split
    a, b = _step(folder, "hub-a"), _step(folder, "hub-b")
    for bolt in sp.bolts:
        h = plan.hole(bolt.hole)
        nut = plan.hole(bolt.nut)
        side = (-h.axis[1], h.axis[0], 0.0)  # horizontal, across the bolt
        for t_plane, solid in ((-sp.gap_mm / 2 - 3.0, a), (sp.gap_mm / 2 + 3.0, b)):
            t = t_plane - sp.side_of(h.entry_mm)  # along the axis from the entry
            on_axis = h.point_at(t)
            assert not _inside(solid, on_axis)  # the hole runs on through both halves
            beside = tuple(on_axis[i] + side[i] * (h.radius_mm + 1.0) for i in range(3))
            assert _inside(solid, beside)  # in material either side of it
        # the head seats in half A, the nut sits in half B, each with material behind it
        assert sp.side_of(bolt.seat_mm) < -sp.gap_mm / 2 and sp.side_of(nut.entry_mm) > sp.gap_mm / 2
        centre = nut.point_at(nut.depth_mm / 2)
        assert not _inside(b, centre)
        behind = tuple(bolt.seat_mm[i] + h.axis[i] * 1.0 + side[i] * (h.radius_mm + 1.0) for i in range(3))
        assert _inside(a, behind)


def test_each_half_mesh_fits_the_bed_and_the_whole_does_not(split_build, split_design):
    import trimesh

    from generators.plan.bed_fit import bed_fit

    folder, manifest = split_build
    bed = split_design.config.print.bed
    whole = trimesh.load(folder / "hub.stl")
    assert not bed_fit("hub", [tuple(v) for v in whole.convex_hull.vertices[:, :2]], 68.0, bed).fits
    for part in manifest["parts"]:
        mesh = trimesh.load(folder / f"{part['name']}.stl")
        assert mesh.is_watertight
        assert mesh.volume == pytest.approx(part["volume_mm3"], rel=0.005)
        assert mesh.bounds[0][2] == pytest.approx(0.0, abs=1e-6)  # on the bed as modelled
        pts = [tuple(v) for v in mesh.convex_hull.vertices[:, :2]]
        fit = bed_fit(part["name"], pts, float(mesh.bounds[1][2] - mesh.bounds[0][2]), bed)
        assert fit.fits, fit


def test_report_and_manifest_agree(split_build, split_design):
    folder, manifest = split_build
    report = (folder / "report.md").read_text()
    assert "## Split" in report and "### Assembly" in report
    for part in manifest["parts"]:
        for f in part["files"]:
            assert f in manifest["files"]  # written and hashed
        assert f"| {part['name']} |" in report and f"{part['mass_g']:.0f} g" in report
    for bolt in manifest["split"]["bolts"]:
        assert f"{bolt['hole']}: {bolt['screw']} socket head cap screw" in report
        assert bolt["nut_pocket"] in {h["id"] for h in manifest["holes"]}
    rules = {r["id"]: r["status"] for r in manifest["checks"]["rules"]}
    assert {"split-bolt-edge", "split-bearing", "split-clamp"} <= set(rules)
    assert "fail" not in rules.values()
