"""The demos' shop work against the trade figures it must meet (issue: instructions a shop can
carry out): tapped length, drill reach, clamp screws that reach the mast, cutters for the
material. Each figure is written out in tests/shop/helpers.py with its source."""

from __future__ import annotations

import math

import pytest

from generators.config import load_config
from generators.design import design

from .helpers import (DEMOS, ENGAGE_D, HAND_TAP_OVERALL, IN, WRENCH_GRIP_MM, INCH_CAP_LENGTHS, ISO4762_LENGTHS, LEAD_PITCHES, jobber_flute_mm,
                      thread_d_p)

_CACHE: dict = {}


def _design(path):
    if path.name not in _CACHE:
        _CACHE[path.name] = design(load_config(path))
    return _CACHE[path.name]


MACHINED = [p for p in DEMOS if load_config(p).hub.process == "machined"]


def test_there_is_an_inch_6061_demo_with_clamp_screws():
    found = [p for p in DEMOS if (c := load_config(p)).units == "in" and c.hub.material == "aluminium-6061"
             and c.mast_clamp is not None and c.hub.process == "machined"]
    assert found, "issue: a new inch demo with clamp screws into 6061"


@pytest.mark.parametrize("path", MACHINED, ids=lambda p: p.stem)
def test_no_thread_longer_than_its_engagement_plus_lead(path):
    """Common practice: 1.5 D in metals, 2.5 D in plastics, plus 2 pitches of tap lead."""
    d = _design(path)
    mclass = d.material_class
    taps = [op for op in d.operations if op.operation == "tap"]
    if not taps and d.plan.body.style == "plate":
        pytest.skip("a U-bolt plate has no tapped holes")
    assert taps
    for op in taps:
        for hid in op.holes:
            h = d.plan.hole(hid)
            D, P = thread_d_p(h.thread)
            limit = ENGAGE_D[mclass] * D + LEAD_PITCHES * P
            run = h.tapped
            assert run is not None, hid
            assert run.length_mm <= limit + 1e-6, f"{hid}: {run.length_mm:.2f} mm of thread, limit {limit:.2f}"
            if not op.through:  # the tap goes to the end of the thread
                assert op.depth_mm == pytest.approx(run.start_mm + run.length_mm, abs=1e-3), hid


@pytest.mark.parametrize("path", MACHINED, ids=lambda p: p.stem)
def test_the_rest_of_a_part_threaded_hole_is_a_clearance_hole(path):
    """Before the thread the hole is opened wider than the screw's major diameter (ISO 261 /
    ASME B1.1 D), and that drilling step exists, to the thread's start."""
    d = _design(path)
    for h in d.plan.holes:
        run = h.tapped
        if run is None or run.start_mm <= 0:
            continue
        D, _ = thread_d_p(h.thread)
        assert run.clear_mm > D, h.id
        ops = [op for op in d.operations if h.id in op.holes and op.operation == "drill"
               and op.tool_diameter_mm == pytest.approx(run.clear_mm)]
        assert ops and ops[0].depth_mm == pytest.approx(run.start_mm, abs=1e-3), h.id  # records keep 4 decimals
        if h.kind in ("clamp", "set_screw"):  # the thread ends at the bore or socket wall
            assert run.start_mm + run.length_mm <= h.depth_mm + 1e-6


@pytest.mark.parametrize("path", MACHINED, ids=lambda p: p.stem)
def test_no_drill_past_jobber_reach_without_a_longer_series_named(path):
    """DIN 338 jobber flute lengths (ASME B94.11M for an inch config's drills; from memory):
    deeper holes name the longer drill."""
    d = _design(path)
    inch = d.config.units == "in"
    checked = 0
    for op in d.operations:
        if op.operation not in ("pilot", "drill") or op.tool_diameter_mm is None:
            continue
        depth = op.depth_mm
        if op.through:
            depth = max(d.plan.hole(h).depth_mm for h in op.holes)
        flute = jobber_flute_mm(op.tool_diameter_mm, inch)
        if flute is None or depth is None or depth <= flute:
            continue
        checked += 1
        assert any(w in op.note for w in ("long-series", "extension", "from each face")), \
            f"{op.face} step {op.step}: {op.tool} {depth:.1f} mm deep, jobber flute {flute} mm: {op.note}"
    if path.stem == "four-spreader-conduit":
        assert checked, "the 3.8 in clamp holes are past a jobber drill"


@pytest.mark.parametrize("path", MACHINED, ids=lambda p: p.stem)
def test_no_tap_past_a_hand_tap_without_an_extension_named(path):
    d = _design(path)
    for op in (op for op in d.operations if op.operation == "tap"):
        size = op.tool.split()[0].split("-")[0].split("x")[0]
        overall = HAND_TAP_OVERALL.get(size)
        depth = max(d.plan.hole(h).depth_mm for h in op.holes) if op.through else op.depth_mm
        if overall is not None and depth > overall - WRENCH_GRIP_MM:
            assert "tap extension" in op.note, f"{op.face} step {op.step}: {op.tool} {depth:.1f} mm deep"


CLAMPED = [p for p in DEMOS if load_config(p).mast_clamp is not None]


@pytest.mark.parametrize("path", CLAMPED, ids=lambda p: p.stem)
def test_clamp_screws_reach_past_the_bore_wall(path):
    """Hand calculation: the face-to-bore distance along the screw is the entry radius less
    the bore radius (a radial hole); with the head down the point must pass the bore wall by
    the diametral clearance (the gap at the screw with the mast in the far wall) + 1 mm, and
    the length must be a stock one (ISO 4762 / ASME B18.3 lengths, from memory)."""
    d = _design(path)
    cfg, plan = d.config, d.plan
    clamps = [h for h in plan.holes if h.kind == "clamp"]
    assert clamps
    gap = plan.bore_mm - plan.mast_od_mm
    assert gap == pytest.approx(cfg.mast.clearance) or cfg.hub.bore is not None
    for h in clamps:
        wall = math.hypot(h.entry_mm[0], h.entry_mm[1]) - plan.bore_mm / 2
        cb = h.counterbore.depth_mm if h.counterbore else 0.0
        s = h.screw
        assert s is not None and s.kind == "cap screw", h.id
        assert cb + s.length_mm >= wall + gap + 1.0 - 1e-6, f"{h.id}: {s.designation} stops short"
        if cfg.units == "in":
            assert any(abs(s.length_mm - float(x) * IN) < 1e-6 for x in INCH_CAP_LENGTHS), s.designation
        else:
            assert round(s.length_mm, 6) in ISO4762_LENGTHS, s.designation
        D, _ = thread_d_p(cfg.mast_clamp.thread.designation)
        if h.tapped is not None:  # with the mast at the far wall the screw still fills the thread
            point = wall + gap
            assert point - s.length_mm <= h.tapped.start_mm + 1e-6
            assert h.tapped.length_mm >= 1.5 * D - 1e-6  # common practice: 1.5 D at least
            if h.counterbore is not None:
                assert cb <= h.tapped.start_mm + 1e-6


@pytest.mark.parametrize("path", CLAMPED, ids=lambda p: p.stem)
def test_two_clamp_screws_are_as_near_90_deg_apart_as_the_gaps_allow(path):
    """Two screws 90 deg apart push the mast into the opposite wall (common practice); the
    holes enter through gaps between sockets, at (k + 1/2) x 360 / N from the first socket."""
    d = _design(path)
    cfg = d.config
    clamps = [h for h in d.plan.holes if h.kind == "clamp"]
    az = [math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) % 360 for h in clamps]
    N = cfg.spreaders.count
    gaps = [(cfg.spreaders.first_azimuth + (k + 0.5) * 360 / N) % 360 for k in range(N)]
    for a in az:
        assert min(abs((a - g + 180) % 360 - 180) for g in gaps) < 1e-6
    if len(az) == 2:
        best = min(abs(abs((g1 - g2 + 180) % 360 - 180) - 90) for g1 in gaps for g2 in gaps if g1 != g2)
        apart = abs((az[0] - az[1] + 180) % 360 - 180)
        assert abs(apart - 90) == pytest.approx(best)
        assert any("apart" in n for n in d.plan.notes)
    if len(az) == 3:
        steps = sorted(abs((az[i] - az[i - 1] + 180) % 360 - 180) for i in range(3))
        assert steps == pytest.approx([120, 120, 120])


@pytest.mark.parametrize("path", DEMOS, ids=lambda p: p.stem)
def test_no_forstner_or_spade_bit_in_aluminium(path):
    """Forstner and spade bits are wood and plastic cutters (common practice)."""
    d = _design(path)
    if d.material_class != "metal":
        pytest.skip("not a metal hub")
    for op in d.operations:
        text = f"{op.tool} {op.note}".lower()
        assert "forstner" not in text and "spade" not in text, f"{op.face} step {op.step}: {op.tool}"


@pytest.mark.parametrize("path", DEMOS, ids=lambda p: p.stem)
def test_every_demo_passes_its_rules(path):
    d = _design(path)
    assert not d.failed(), [r["id"] for r in d.failed()]
