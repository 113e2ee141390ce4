"""Screws through clearance holes (feed-point terminals with a nut under the hub): the least
length reaches through the hub, a plain washer and the hex nut with two threads past it
(common practice), and the stock length named is the first at or over it.

Hand figures from the tables' sources (from memory): ASME B18.6.3 hex machine screw nut #10
1/8 in high; ASME B18.21.1 type A narrow washer #10 0.049 in thick; ISO 4032 M5 nut 4.7 mm
(m max); ISO 7089 M5 washer 1 mm. Stock lengths: the cap-screw series (ISO 4762 / ASME B18.3,
from memory).
"""

from __future__ import annotations

import copy
import tomllib

import pytest

from generators.config import load_config, parse_config
from generators.design import design
from generators.plan.screws import clearance_screw
from tests.sizing.helpers import ROOT

IN = 25.4


def _fmt(mm):
    return f"{mm:.3f} mm"


def test_conduit_demo_countersunk_terminal_screw_length():
    plan = design(load_config(ROOT / "configs" / "four-spreader-conduit.toml")).plan
    h = plan.hole("FP1")
    need_in = 2.25 + 0.049 + 0.125 + 2 / 24  # hub + washer + nut + two pitches
    assert h.screw is not None and h.screw.designation == "#10-24 UNC x 2-3/4 in flat head screw"
    assert f"at least {need_in:.3f} in" in h.screw.note
    assert h.screw.length_mm == pytest.approx(2.75 * IN)  # 2.5 in is short by 0.007 in
    assert f"leaves {2.75 - need_in:.3f} in for them" in h.screw.note  # room for the lugs
    assert "head included" in h.screw.note


@pytest.mark.parametrize("head, cb, grip", [("flat", 0.0, 30.0), ("socket", 6.0, 24.0), ("pan", 0.0, 30.0)])
def test_metric_lengths_by_head(head, cb, grip):
    s = clearance_screw("M5", 30.0, head, cb, "mm", _fmt)
    need = grip + 1.0 + 4.7 + 2 * 0.8
    assert f"at least {need:.3f} mm" in s.note
    stock = [x for x in (5, 6, 8, 10, 12, 16, 20, 25, 30, 35, 40, 45, 50) if x >= need][0]
    assert s.length_mm == stock and s.designation.startswith(f"M5x0.8 x {stock} mm")
    assert f"leaves {stock - need:.3f} mm for them" in s.note


def test_blind_clearance_hole_names_no_length():
    raw = tomllib.loads((ROOT / "configs" / "six-spreader-portable.toml").read_text(encoding="utf-8"))
    data = copy.deepcopy(raw)
    data["holes"] = [{"id": "X1", "face": "top", "at": [45.0, -30.0], "clearance": "M5", "depth": 10}]
    h = design(parse_config(data)).plan.hole("X1")
    assert h.screw is None


@pytest.mark.parametrize("thread", ["M14", "M2", "#12-24"])
def test_a_size_without_stock_lengths_is_still_a_hole(thread):
    # no cap-screw lengths tabulated for these: the hole stands, the note gives the least length
    s = clearance_screw(thread, 40.0, "flat", 0.0, "mm", _fmt)
    assert s.length_mm is None and "at least" in s.note and "no stock length" in s.note
