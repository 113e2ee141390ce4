"""Over the plate config space: a plate is either refused with a key, or every U-bolt hole
is on the plate with its edge margin, straddles its pole or mast at the table's leg spacing,
and every rule result is a plain grade (hypothesis, short profile by default)."""

from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from generators.config.load import parse_config
from generators.errors import UserError
from generators.plan.geometry import edge_distance


@st.composite
def plate_configs(draw):
    n = draw(st.sampled_from([3, 4, 6]))
    hub = {"style": "plate", "thickness": draw(st.sampled_from([3, 5, 6, 8, 10, 12])),
           "material": draw(st.sampled_from(["aluminium-6061", "plywood", "hdpe"]))}
    if draw(st.booleans()):
        hub["diameter"] = draw(st.integers(180, 600))
    else:
        hub["across_flats"] = draw(st.integers(180, 600))
    plate = {}
    if draw(st.booleans()):
        plate["u_bolt_spacing"] = draw(st.integers(40, 220))
    return {
        "name": "prop-plate",
        "mast": {"size": draw(st.sampled_from(["33.7 mm", "42.4 mm", "48.3 mm", "60.3 mm"]))},
        "hub": hub,
        "spreaders": {"count": n, "diameter": draw(st.sampled_from([16, 20, 25, 30, 32, 40])),
                      "first_azimuth": draw(st.sampled_from([0, 15, 45, 90])), "tip_radius": "2500 mm"},
        "plate": plate,
    }


@given(plate_configs())
def test_plate_is_refused_or_holes_straddle_on_the_plate(data):
    from generators.design import design

    try:
        d = design(parse_config(data))
    except UserError as e:
        assert e.key  # a refusal names the key to change
        return
    outline = d.plan.body.outline
    holes = {h.id: h for h in d.plan.holes}
    for u in d.plate.u_bolts:
        a, b = (holes[i].entry_mm for i in u.holes)
        # legs one inside width + one rod diameter apart (the U-bolt table's geometry)
        assert math.dist(a[:2], b[:2]) == pytest.approx(u.size.inside_width_mm + u.size.thread.major_mm)
        mid = ((a[0] + b[0]) / 2, (a[1] + b[1]) / 2)
        # the midpoint lies on the held axis through the U-bolt's centre, along ``along``
        cross = (mid[0] - u.centre[0]) * u.along[1] - (mid[1] - u.centre[1]) * u.along[0]
        assert abs(cross) < 1e-6
        for p in (a, b):
            assert edge_distance(p[:2], outline) >= d.plate.edge_mm - 1e-6 or u.holds == "mast"
            assert edge_distance(p[:2], outline) > u.hole_mm / 2
    assert {r.status for r in d.checks.rules} <= {"pass", "warn", "fail"}
