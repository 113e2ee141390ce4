"""Sleeve plans: sizes from the mast standards, fits, refusals, flange, slit and flat."""

from __future__ import annotations

import math

import pytest

from generators.errors import UserError
from generators.plan.hub import build_plan
from generators.plan.reducer import (MIN_SLEEVE_WALL_MM, SLEEVE_FIT_MM, plan_sleeves, sleeve_stem)
from generators.units import MM_PER_IN

from .helpers import config


def _sleeves(masts, **sections):
    cfg = config(**sections)
    return plan_sleeves(cfg, build_plan(cfg), masts)


def test_trade_sizes_give_the_published_ods():
    # ANSI C80.3: 1-1/4 EMT is 1.510 in OD; ASME B36.10M: NPS 1 is 1.315 in OD (from memory)
    emt, nps = _sleeves(["1-1/4 in EMT", "1 NPS"])
    assert emt.mast_od_mm / MM_PER_IN == pytest.approx(1.510, abs=1e-9)
    assert nps.mast_od_mm / MM_PER_IN == pytest.approx(1.315, abs=1e-9)
    for s in (emt, nps):
        assert s.id_mm == pytest.approx(s.mast_od_mm + 1.0)  # mast.clearance
        assert s.od_mm == pytest.approx(51.0 - SLEEVE_FIT_MM["machined"])  # bore = 50 + 1
        assert s.length_mm == 46.0  # hub thickness
    assert (emt.stem, nps.stem) == ("sleeve-38.35mm", "sleeve-33.4mm")


def test_printed_sleeve_takes_the_printed_fit():
    (s,) = _sleeves(["30 mm"], hub={"process": "printed"})
    assert s.fit_mm == SLEEVE_FIT_MM["printed"] > SLEEVE_FIT_MM["machined"]
    assert s.id_mm == pytest.approx(30 + 1.0 + 0.3)  # print.hole_compensation default


def test_too_large_mast_names_the_largest_that_fits():
    # bore 51, fit 0.1, clearance 1, two walls of 1.5 -> 51 - 0.1 - 1 - 3 = 46.9 mm
    with pytest.raises(UserError) as err:
        _sleeves(["1-1/2 NPS"])  # 1.900 in = 48.26 mm (ASME B36.10M, from memory)
    assert err.value.key == "--mast"
    assert "46.9 mm" in err.value.line() and "\n" not in err.value.line()
    # exactly the largest is accepted, a hair more is not
    (s,) = _sleeves(["46.9 mm"])
    assert s.wall_mm == pytest.approx(MIN_SLEEVE_WALL_MM)
    with pytest.raises(UserError):
        _sleeves(["46.95 mm"])


def test_reducer_entries_use_their_key():
    with pytest.raises(UserError) as err:
        _sleeves([], reducers=[{"mast": "30 mm"}, {"mast": "49 mm"}])
    assert err.value.key == "reducers[1].mast"


def test_same_mast_twice_is_one_sleeve():
    assert len(_sleeves(["1-1/4 in EMT", "38.354 mm"], reducers=[{"mast": "1-1/4 EMT"}])) == 1


def test_flange_stays_clear_of_top_holes():
    # a set screw on the top face 3 mm outside the bore edge leaves no room for a flange
    cfg = config(set_screws={"thread": "M6", "position": 10}, reducers=[{"mast": "30 mm", "flange": True}])
    plan = build_plan(cfg)
    (s,) = plan_sleeves(cfg, plan)
    tops = [h for h in plan.holes if h.face == "top" and h.kind != "bore"]
    nearest = min(math.hypot(h.entry_mm[0], h.entry_mm[1]) - h.radius_mm for h in tops)
    assert s.flange.od_mm / 2 <= nearest - 1.0 + 1e-9
    assert s.flange.od_mm > s.od_mm


def test_slit_and_flat_face_the_clamp_screw():
    cfg = config(mast_clamp={"thread": "M5"}, spreaders={"elevation": 10}, reducers=[
        {"mast": "30 mm", "slit": True, "key": True}, {"mast": "35 mm"}])
    plan = build_plan(cfg)
    slit, holed = plan_sleeves(cfg, plan)
    (clamp,) = [h for h in plan.holes if h.kind == "clamp"]
    clamp_az = math.degrees(math.atan2(clamp.entry_mm[1], clamp.entry_mm[0]))
    assert slit.holes == ()  # the screw bears on the slit sleeve
    assert abs((slit.slit.azimuth_deg - clamp_az) % 360 - 180) < 1e-6  # opposite the screw
    assert slit.key_flat.azimuth_deg == pytest.approx(clamp_az)
    assert slit.slit.width_mm > math.pi * 1.0  # can close the 1 mm diametral clearance
    (h,) = holed.holes  # lined up with the hub's clamp hole
    assert h.entry_mm[2] == pytest.approx(clamp.entry_mm[2])
    assert math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) == pytest.approx(clamp_az)
    assert h.depth_mm == pytest.approx(holed.wall_mm)


def test_stem_is_named_after_the_mast_od():
    assert sleeve_stem(38.354) == "sleeve-38.35mm" and sleeve_stem(30.0) == "sleeve-30mm"


def test_a_clamp_screw_through_the_sleeve_is_a_stock_length_that_reaches_the_mast():
    """Hub wall + sleeve wall + both clearances + the 1 mm pass (common practice), head on the
    counterbore floor: the shortest ISO 4762 stock length (from memory) that covers it."""
    from generators.plan.screws import CLAMP_PASS_MM
    from generators.standards.fasteners import cap_screw_lengths

    cfg = config(mast_clamp={"thread": "M5", "count": 1, "height": 36})
    plan = build_plan(cfg)
    clamps = [h for h in plan.holes if h.kind == "clamp"]
    assert clamps, "the helper config has a clamp screw"
    (s,) = plan_sleeves(cfg, plan, ["1 NPS"])
    hub, sl = clamps[0], s.holes[0]
    cbore = hub.counterbore.depth_mm if hub.counterbore is not None else 0.0
    need = hub.depth_mm + sl.depth_mm + (plan.bore_mm - s.od_mm) + (s.id_mm - s.mast_od_mm) + CLAMP_PASS_MM - cbore
    stock = [x for x in cap_screw_lengths(hub.thread) if x >= need - 1e-9]
    note = next(n for n in s.notes if "passes through the sleeve" in n)
    if stock:
        assert f"x {min(stock):g} mm socket head cap screw" in note, note
    else:
        assert "no stock" in note, note
