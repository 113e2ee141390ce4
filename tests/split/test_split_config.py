"""Bad split values: one line naming the key, exit 2, nothing written; the plan's plane,
gap and bolts against hand geometry."""

from __future__ import annotations

import contextlib
import io
import math
import re

import pytest

from generators import cli
from tests.split.conftest import ROOT, SPLIT


def _run(argv):
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        code = cli.main(argv)
    return code, out.getvalue() + err.getvalue()


def _edited(tmp_path, src, edit):
    text = edit(src.read_text())
    p = tmp_path / src.name
    p.write_text(text)
    return p


@pytest.mark.parametrize("src, edit, key", [
    (ROOT / "configs" / "four-spreader-plate.toml",
     lambda s: re.sub(r"(\[hub\]\n)", r"\1split = true\n", s, count=1), "hub.split"),
    (SPLIT, lambda s: s.replace("gap = 1.0", "gap = 4.0"), "split.gap"),  # wider than a saw cut
    (SPLIT, lambda s: s.replace("gap = 1.0", "gap = 0.6"), "split.gap"),  # closes before it grips
    (SPLIT, lambda s: s.replace("split = true\n", ""), "split"),  # [split] without hub.split
    (SPLIT, lambda s: s.replace("gap = 1.0", "gap = 1.0\nazimuth = 10"), "split.azimuth"),  # cuts S1 off its axis
])
def test_bad_split_values_exit_2_with_the_key(tmp_path, src, edit, key):
    cfg = _edited(tmp_path, src, edit)
    out = tmp_path / "out"
    code, text = _run(["build", str(cfg), "--out", str(out)])
    assert code == 2, text
    line = next(ln for ln in text.splitlines() if ln.startswith("error:"))
    assert line.startswith(f"error: {key}:"), line
    assert not out.exists() or not any(out.iterdir())


def test_plane_gap_and_bolts_by_hand(split_design):
    plan = split_design.plan
    sp = plan.split
    # between sockets 1 and 2 of six: 0 + 180 / 6 = 30 deg (the module's default)
    assert sp.azimuth_deg == pytest.approx(30.0)
    assert sp.normal == pytest.approx((-math.sin(math.radians(30)), math.cos(math.radians(30)), 0.0))
    # bore 50 + 0.5 clearance; the 1 mm gap leaves 0.5 mm to close on the mast
    assert sp.clearance_mm == pytest.approx(0.5) and sp.interference_mm == pytest.approx(0.5)
    assert sp.shared == () and sp.dropped == ()
    for b in sp.bolts:
        h = plan.hole(b.hole)
        assert h.axis == pytest.approx(sp.normal)  # perpendicular to the plane
        # the axis runs from half A (behind the plane) to beyond it in half B
        start, end = sp.side_of(h.entry_mm), sp.side_of(h.bottom_mm)
        assert start < -sp.gap_mm / 2 and end > sp.gap_mm / 2
        # on each side of the bore, clear of it
        assert abs(b.offset_mm) - h.radius_mm > plan.bore_mm / 2
        # ISO 4762 M6 stock (5 mm steps to 50, from memory): the shortest past the nut by 2 pitches
        nut = plan.hole(b.nut)
        need = sp.side_of(nut.entry_mm) + 0.3 / 2 + 5.2 + 2 * 1.0 - sp.side_of(b.seat_mm)  # ISO 4032 M6 m = 5.2
        assert b.length_mm >= need and b.length_mm - 5.0 < need
    assert {b.offset_mm > 0 for b in sp.bolts} == {True, False}


def test_each_half_holds_its_own_sockets(split_design):
    plan = split_design.plan
    sp = plan.split
    for half in sp.halves:
        for sid in (h for h in half.holes if h.startswith("S")):
            mouth = plan.hole(sid).entry_mm
            assert math.copysign(1, sp.side_of(mouth)) == half.side
    # six sockets, three each side of a plane between sockets
    assert sorted(len([h for h in half.holes if h.startswith("S")]) for half in sp.halves) == [3, 3]


def test_whole_hub_misses_the_bed_and_each_half_fits(split_design):
    from generators.plan.bed_fit import bed_fit

    plan, bed = split_design.plan, split_design.config.print.bed
    assert not bed_fit("hub", plan.body.outline, plan.body.thickness_mm, bed).fits
    assert [f.part for f in split_design.bed_fits] == ["hub half A", "hub half B"]
    assert all(f.fits for f in split_design.bed_fits)


def _to_outline(p, outline) -> float:
    """Distance from a point to a closed polygon's boundary (hand geometry)."""
    best = math.inf
    for (ax, ay), (bx, by) in zip(outline, outline[1:] + outline[:1]):
        dx, dy = bx - ax, by - ay
        t = max(0.0, min(1.0, ((p[0] - ax) * dx + (p[1] - ay) * dy) / (dx * dx + dy * dy)))
        best = min(best, math.hypot(p[0] - ax - t * dx, p[1] - ay - t * dy))
    return best


def test_saw_line_on_top_and_bottom_runs_through_the_axis_to_the_outline(split_design):
    """The block is drilled whole and sawn apart: the top and bottom templates carry the saw
    line along the plane, from outline to outline through the mast axis, and a tick into half A."""
    plan, sp = split_design.plan, split_design.plan.split
    outline = list(plan.body.outline)
    for face, z in (("top", plan.body.thickness_mm), ("bottom", 0.0)):
        saw = [m for m in plan.marks if m.face == face and m.label.startswith("saw line")]
        assert len(saw) == 1
        a, b = saw[0].a, saw[0].b
        assert a[2] == pytest.approx(z) and b[2] == pytest.approx(z)
        for p in (a, b):
            assert _to_outline(p, outline) < 0.01
            assert p[0] * sp.normal[0] + p[1] * sp.normal[1] == pytest.approx(0.0, abs=1e-6)  # on the plane
        assert (b[0] - a[0]) * sp.along[0] + (b[1] - a[1]) * sp.along[1] > 0
        tick = next(m for m in plan.marks if m.face == face and m.label == "half A")
        into = (tick.b[0] - tick.a[0]) * sp.normal[0] + (tick.b[1] - tick.a[1]) * sp.normal[1]
        assert into < 0  # the normal points from half A into half B


def test_the_mast_pin_crosses_the_split_through_the_bore(split_design):
    """A pin across the mast meets the split plane only inside the bore: it is kept, and it is
    not laid along the plane."""
    plan, sp = split_design.plan, split_design.plan.split
    pin = plan.hole("P1")
    d = [pin.bottom_mm[i] - pin.entry_mm[i] for i in range(2)]
    n = math.hypot(*d)
    sin_angle = abs(d[0] * sp.normal[0] + d[1] * sp.normal[1]) / n
    assert sin_angle > math.sin(math.radians(15))
    # where the pin's cylinder meets the plane: within r / sin(angle) of the axis, inside the bore
    assert pin.radius_mm / sin_angle < plan.bore_mm / 2
