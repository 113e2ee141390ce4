"""The mast pin ([mast_pin]): a through bolt across the hub and the mast, and what it holds.

Sources of the figures typed here (each from memory unless a published table is named):
- tensile stress area A_s: ISO 898-1 table (M8 36.6 mm2, M10 58.0 mm2) and ASME B1.1
  (1/2-13 UNC 0.1419 in2), checked against the formula A_s = pi/4 (d - k P)^2
- ultimate strength: ISO 898-1 property class 8.8, 800 MPa; SAE J429 grade 5, 120 ksi
- shear = 0.6 x f_ub x A_s: EN 1993-1-8 table 3.4, alpha_v = 0.6 for class 8.8
- bearing on the hub: the materials table's allowable (acetal 20 MPa) x d x min(wall, 2 d),
  the effective length being common practice
- turning capacity T = 2 F r_mast (two shear planes at the mast walls), sliding 2 F
- 1 ksi = 6.894757 MPa, 1 lbf = 4.4482216 N, 1 in = 25.4 mm (exact / NIST SP 811)
- 1-1/4 in EMT OD 1.510 in (ANSI C80.3); octagon and chamfered-square geometry by hand
"""

from __future__ import annotations

import math
import pathlib
import subprocess
import sys
import tomllib

import pytest

from generators.config.load import parse_config
from generators.design import design
from generators.errors import UserError
from tests.checks.helpers import rule, toml_text

HERE = pathlib.Path(__file__).parent
ROOT = HERE.parents[1]
METRIC = HERE / "cases" / "pin-metric.toml"  # octagon, acetal, 42 mm mast, M10 bolt
INCH = HERE / "cases" / "pin-inch.toml"  # square with chamfers, acetal, 1-1/4 in EMT, 1/2-13 bolt
KSI = 6.894757293168


def data(path, **sections) -> dict:
    d = tomllib.loads(path.read_text(encoding="utf-8"))
    for section, changes in sections.items():
        if changes is None:
            d.pop(section, None)
        else:
            d[section] = {**d.get(section, {}), **changes}
    return d


def planned(path=METRIC, **sections):
    return design(parse_config(data(path, **sections)))


# ---- the bolt's figures against the published tables ----------------------------------

@pytest.mark.parametrize("size, table_mm2", [("M8", 36.6), ("M10", 58.0), ("1/2-13", 0.1419 * 645.16)])
def test_stress_areas_match_the_tables(size, table_mm2):
    from generators.standards.threads import parse_thread
    from generators.standards.ubolts import stress_area_mm2

    assert stress_area_mm2(parse_thread(size)) == pytest.approx(table_mm2, rel=2e-3)


def test_shear_governs_when_the_hub_bears_hard():
    # M8 class 8.8 with a bearing allowable no hub has: 0.6 x 800 x 36.6 = 17568 N per plane
    from generators.plan.rules.pin_hold import pin_hold
    from generators.standards.threads import parse_thread

    d = planned(mast_pin={"thread": "M8"})
    hold = pin_hold(parse_thread("M8"), d.plan.hole("P1"), d.plan.bore_mm, 1000.0, 21.0)
    assert hold.governs == "bolt shear"
    assert hold.force_n == pytest.approx(0.6 * 800 * 36.6, rel=2e-3)
    assert hold.torque_nm == pytest.approx(2 * 0.6 * 800 * 36.6 * 0.021, rel=2e-3)


# ---- hand calculations: one metric, one inch --------------------------------------------

def test_metric_pin_capacity_by_hand():
    d = planned()
    # octagon 170 mm across the flats: the pin runs flat to opposite flat, 85 mm each side;
    # bore 42 + 1 = 43 mm, so the wall along the pin is 85 - 21.5 = 63.5 mm, over 2 d = 20 mm
    shear = 0.6 * 800 * 58.0                  # 27.84 kN, EN 1993-1-8 table 3.4 / ISO 898-1
    bearing = 20.0 * 10.0 * min(63.5, 20.0)   # 4000 N: acetal 20 MPa (materials table)
    F = min(shear, bearing)
    T = 2 * F * 0.021                         # 168 N m about the 42 mm mast
    m = d.checks.wind.mast
    r = rule(d.checks, "mast-retention")
    assert r.value == pytest.approx(min(2 * F / (m.weight_n + m.ice_weight_n), T / m.mast_torque_nm), rel=1e-3)
    assert T / m.mast_torque_nm > 2 and r.status == "pass"
    assert "bearing on the hub governs" in r.message and "not checked" in r.message
    assert "EN 1993-1-8" in r.source and "ISO 898-1" in r.source and "common practice" in r.source


def test_inch_pin_capacity_by_hand():
    d = planned(INCH)
    # 7.5 in square, 1.75 in corner chamfers: chamfer face at Rc - leg sin 45 deg from the axis,
    # Rc = 3.75 / cos 45, leg = 1.75 / (2 cos 45); bore 1.510 + 0.04 in
    c = math.cos(math.pi / 4)
    d_c = 3.75 / c - 1.75 / (2 * c) * math.sin(math.pi / 4)
    wall = (d_c - 1.55 / 2) * 25.4
    D = 0.5 * 25.4
    shear = 0.6 * 120 * KSI * 0.1419 * 645.16  # 45.4 kN, grade 5 (SAE J429)
    bearing = 20.0 * D * min(wall, 2 * D)      # 6452 N
    F = min(shear, bearing)
    T = 2 * F * (1.510 * 25.4 / 2) / 1000.0
    m = d.checks.wind.mast
    r = rule(d.checks, "mast-retention")
    assert wall > 2 * D
    assert r.value == pytest.approx(T / m.mast_torque_nm, rel=2e-3)
    assert r.status == ("pass" if r.value >= 2 else "warn" if r.value >= 1 else "fail")
    pin = d.plan.hole("P1")
    assert pin.depth_mm == pytest.approx(2 * d_c * 25.4, abs=1e-6)
    # stock bolt: grip + 2 washers (0.095 in, ASME B18.21.1) + nut (7/16 in, ASME B18.2.2) +
    # 2 pitches = 9.64 in, so the 10 in hex bolt; its thread 2D + 1/2 in = 1.5 in (ASME B18.2.1)
    # starts 8.5 in under the head, inside the grip plus washers (9.05 in), so the nut tightens
    need = 2 * d_c + 2 * 0.095 + 0.4375 + 2 / 13
    assert 9.5 < need <= 10 and pin.screw.length_mm == pytest.approx(254.0)
    assert pin.screw.designation == "1/2-13 UNC x 10 in hex bolt" and pin.screw.kind == "hex bolt"


def test_a_long_grip_takes_threaded_rod_cut_to_length():
    # 170 mm grip: 170 + 2 x 2 + 8.4 + 2 x 1.5 = 185.4 mm > 100 mm, the longest M10 in the table,
    # so DIN 976-1 rod: 170 + 2 x 2 + 2 x (8.4 + 3) = 196.8 mm, cut to 197 mm (ISO 7089, ISO 4032)
    s = planned().plan.hole("P1").screw
    assert s.kind == "threaded rod" and s.length_mm == pytest.approx(197.0)
    assert "DIN 976-1" in s.standard and "2 x M10x1.5 hex nut" in s.note


def test_without_a_pin_friction_fails_turning():
    d = planned(mast_pin=None, mast_clamp={"count": 2})
    r = rule(d.checks, "mast-retention")
    m = d.checks.wind.mast
    assert r.status == "fail" and r.value < 1 and r.limit == 1.0
    assert "[mast_pin]" in r.message and m.mast_torque_nm > 0


# ---- the hole ----------------------------------------------------------------------------

def test_pin_crosses_the_body_through_the_axis():
    d = planned()
    pin, plan = d.plan.hole("P1"), d.plan
    ex, ax = pin.entry_mm, pin.axis
    # the axis line passes the mast axis: the entry's horizontal offset is along the axis
    assert math.hypot(ex[0] * ax[1] - ex[1] * ax[0], 0) == pytest.approx(0.0, abs=1e-9)
    assert ax[2] == 0 and ex[2] == pytest.approx(30.0)  # the clamp has no height: mid-thickness
    assert pin.through and pin.exit_face != pin.face
    entry, exit_ = plan.face(pin.face), plan.face(pin.exit_face)
    assert (entry.azimuth_deg - exit_.azimuth_deg) % 360 == pytest.approx(180.0)
    assert pin.depth_mm == pytest.approx(170.0)  # flat to flat across the octagon
    # normal clearance for M10: 11.0 mm (ISO 273 medium series), a stock 11.0 mm drill
    assert pin.diameter_mm == pytest.approx(11.0) and pin.drill
    walls = {(w.a, w.b): w.mm for w in d.walls}
    assert not any("bore" in k and "P1" in k for k in walls)  # it meets the bore by design
    assert f"face:{pin.exit_face}" not in {b for a, b in walls if a == "P1"}
    assert any(a == "P1" and b.startswith("S") or b == "P1" and a.startswith("S") for a, b in walls)


def test_shop_drills_it_then_the_mast_in_place():
    d = planned()
    ops = [op for op in d.operations if "P1" in op.holes]
    kinds = [op.operation for op in ops]
    assert "drill" in kinds and kinds[-1] == "match_drill"
    drill = next(op for op in ops if op.operation == "drill")
    match = ops[-1]
    assert match.tool == drill.tool and match.tool_diameter_mm == drill.tool_diameter_mm
    assert "final height and orientation" in match.note and "through the hub's pin hole" in match.note
    # 170 mm through: past a long-series 11 mm drill's flute (DIN 340), so half from each face
    assert "from each face" in drill.note
    from generators.manifest import plan_record

    rec = plan_record(d.plan)
    assert any(f["hole"] == "P1" and f["kind"] == "threaded rod" for f in rec["fasteners"])
    hole = next(h for h in rec["holes"] if h["id"] == "P1")
    assert hole["kind"] == "pin" and hole["exit_face"] == d.plan.hole("P1").exit_face


def test_a_puck_rim_template_shows_entry_and_exit_half_a_turn_apart():
    from generators.drawings.sheet import build_sheets

    d = planned(hub={"style": "puck", "diameter": 170, "sides": None, "across_flats": None})
    sheets = {s.name: s for s in build_sheets(d.plan, d.config, d.operations)}
    pos = sheets["rim"].positions
    assert "P1" in pos and "P1-exit" in pos
    # unrolled rim: half the circumference apart along u (plane geometry), at the same height
    assert abs(pos["P1"][0] - pos["P1-exit"][0]) == pytest.approx(math.pi * 85, abs=0.05)
    assert pos["P1"][1] == pytest.approx(pos["P1-exit"][1])


def test_printed_pin_is_compensated_and_roofed():
    cfg = tomllib.loads((ROOT / "configs" / "six-spreader-printed.toml").read_text(encoding="utf-8"))
    cfg["mast_clamp"].update(count=2, azimuths=[30, 150])
    cfg["holes"] = []  # the feed-point holes sit in the gaps the pin would take
    cfg["mast_pin"] = {"thread": "M8"}
    d = design(parse_config(cfg))
    pin = d.plan.hole("P1")
    # M8 normal clearance 9.0 mm (ISO 273) + 0.3 mm hole compensation
    assert pin.diameter_mm == pytest.approx(9.3) and pin.compensation_mm == pytest.approx(0.3)
    assert pin.profile == "teardrop" and pin.face.startswith("chamfer")


# ---- refusals ----------------------------------------------------------------------------

@pytest.mark.parametrize("pin, key", [
    ({"thread": "M3"}, "mast_pin.thread"),          # no bolt row for M3
    ({"thread": "M10", "height": 70}, "mast_pin.height"),  # above the 60 mm hub
    ({"thread": "M10", "azimuth": 45}, "mast_pin.azimuth"),  # down socket S1
    ({"thread": "M10", "azimuth": 20}, "mast_pin.azimuth"),  # no flat square to it
    ({"thread": "M10", "bolt": "long"}, "mast_pin.bolt"),  # unknown key
])
def test_bad_pins_are_refused_with_their_key(pin, key):
    with pytest.raises(UserError) as exc:
        planned(mast_pin=pin)
    assert exc.value.key == key


def test_required_thread_is_refused_too():
    with pytest.raises(UserError) as exc:
        parse_config({**data(METRIC), "mast_pin": {}})
    assert exc.value.key == "mast_pin.thread"


def test_no_gap_with_an_opposite_gap_names_the_height():
    # five spreaders: the gap opposite each gap is a socket (odd count), so at mid-height
    # there is no azimuth; the refusal names mast_pin.height as the fix
    cfg = tomllib.loads((ROOT / "configs" / "five-spreader-aluminium.toml").read_text(encoding="utf-8"))
    cfg["mast_pin"] = {"thread": "5/16-18"}
    with pytest.raises(UserError) as exc:
        design(parse_config(cfg))
    assert exc.value.key == "mast_pin.azimuth" and "mast_pin.height" in exc.value.accepted


@pytest.mark.parametrize("given, key", [(False, "mast_pin.height"), (True, "mast_pin.azimuth")])
def test_a_pin_crafted_into_a_socket_is_refused_by_the_measured_walls(given, key):
    import dataclasses

    from generators.plan.hard_limits import check_hard_limits
    from generators.plan.measured_walls import measure_walls

    d = planned(mast_pin={"thread": "M10", **({"azimuth": 0} if given else {})})
    pin = d.plan.hole("P1")
    # turned 30 deg about the mast axis, towards the socket 45 deg from its flat
    c, s = math.cos(math.radians(30)), math.sin(math.radians(30))
    turn = lambda v: (v[0] * c - v[1] * s, v[0] * s + v[1] * c, v[2])  # noqa: E731
    bad = dataclasses.replace(pin, entry_mm=turn(pin.entry_mm), axis=turn(pin.axis))
    plan = dataclasses.replace(d.plan, holes=tuple(bad if h.id == "P1" else h for h in d.plan.holes))
    with pytest.raises(UserError) as exc:
        check_hard_limits(d.config, plan, measure_walls(plan))
    assert exc.value.key == key and "P1" in exc.value.problem


def test_a_plate_takes_no_pin():
    cfg = tomllib.loads((ROOT / "configs" / "four-spreader-plate.toml").read_text(encoding="utf-8"))
    cfg["mast_pin"] = {"thread": "M8"}
    with pytest.raises(UserError) as exc:
        parse_config(cfg)
    assert exc.value.key == "mast_pin"


def test_cli_refusal_is_one_line_exit_2_nothing_written(tmp_path):
    cfg = tmp_path / "bad.toml"
    cfg.write_text(toml_text(data(METRIC, mast_pin={"thread": "M10", "height": 70})), encoding="utf-8")
    out = tmp_path / "out"
    p = subprocess.run([sys.executable, "-m", "generators", "build", str(cfg), "--out", str(out)],
                       capture_output=True, text=True, cwd=ROOT, timeout=300)
    assert p.returncode == 2
    lines = [x for x in p.stderr.splitlines() if x.strip()]
    assert len(lines) == 1 and lines[0].startswith("error: mast_pin.height: ")
    assert not out.exists() or not any(out.iterdir())


@pytest.mark.parametrize("path", sorted((ROOT / "configs").glob("*.toml")), ids=lambda p: p.stem)
def test_every_demo_passes_check(path):
    p = subprocess.run([sys.executable, "-m", "generators", "check", str(path)], capture_output=True, text=True,
                       cwd=ROOT, timeout=300)
    assert p.returncode == 0, p.stdout[-2000:] + p.stderr


# ---- the solid ---------------------------------------------------------------------------

@pytest.mark.slow
def test_the_solid_has_a_void_along_the_pin(tmp_path):
    import cadquery as cq

    from generators.cad.export import write_step
    from generators.cad.solids import hub_solid

    d = planned()
    pin, plan = d.plan.hole("P1"), d.plan
    path = tmp_path / "hub.step"
    write_step(hub_solid(plan), path)
    solid = cq.importers.importStep(str(path)).val()
    r, rb = pin.radius_mm, plan.bore_mm / 2
    up = (0.0, 0.0, r + 2.0)  # 2 mm above the hole's top: material (no other hole there)
    checked = 0
    for t in [x for x in range(2, int(pin.depth_mm) - 1, 4)]:
        p = pin.point_at(t)
        if math.hypot(p[0], p[1]) < rb + 1.0:
            continue  # in the bore: void anyway
        assert not solid.isInside(cq.Vector(*p), 1e-3), f"material on the pin axis {t} mm in"
        q = cq.Vector(p[0] + up[0], p[1] + up[1], p[2] + up[2])
        assert solid.isInside(q, 1e-3), f"no material beside the pin {t} mm in"
        checked += 1
    assert checked > 20


def test_bending_across_a_sleeve_gap_by_hand():
    """A pin through a reducer sleeve spans the sleeve's wall: a cantilever M = F g from the
    mast wall to the bore wall (Gere, elastic section modulus pi d_s^3 / 32 of the stress-area
    diameter; class 8.8 yield 640 MPa, ISO 898-1, from memory)."""
    from generators.plan.rules.pin_hold import pin_hold
    from generators.standards.threads import parse_thread

    d = planned(mast_pin={"thread": "M10"})
    a_s = 58.0                                     # M10, ISO 898-1 table
    d_s = math.sqrt(4 * a_s / math.pi)             # 8.594 mm
    m_y = 640.0 * math.pi * d_s ** 3 / 32 / 1000   # 39.9 N m at first yield
    mast_od = 33.4                                 # NPS 1, ASME B36.10M
    gap = (d.plan.bore_mm - mast_od) / 2
    hold = pin_hold(parse_thread("M10"), d.plan.hole("P1"), d.plan.bore_mm, 1000.0, mast_od / 2, gap)
    assert hold.limits["bolt bending across the gap"] == pytest.approx(m_y * 1000 / gap, rel=3e-3)
    assert hold.governs == "bolt bending across the gap"   # bearing 1000 MPa: the bolt decides
    assert hold.torque_nm == pytest.approx(2 * m_y * 1000 / gap * mast_od / 2 / 1000, rel=3e-3)


def test_a_sleeve_mast_decides_when_it_is_weaker():
    # the sleeves demo: the 1 NPS sleeve's mast (r = 16.7 mm) holds less turning than the hub's own mast
    from generators.config.load import load_config

    root = HERE.parents[1]
    des = design(load_config(root / "configs" / "six-spreader-sleeves.toml"))
    r = next(x for x in des.checks.rules if x.id == "mast-retention")
    assert "1 NPS" in r.message and "r = 16.7 mm" in r.message


def test_a_sleeve_too_short_for_the_pin_is_refused():
    # the sleeves demo's pin runs 34 mm above the bottom face; a 20 mm sleeve would leave the
    # bolt crossing an air gap over it: refused, naming the sleeve's length
    root = HERE.parents[1]
    raw = tomllib.loads((root / "configs" / "six-spreader-sleeves.toml").read_text(encoding="utf-8"))
    raw["reducers"][1]["length"] = 20
    raw.pop("mast_clamp", None)
    with pytest.raises(UserError) as err:
        design(parse_config(raw))
    assert err.value.key == "reducers[1].length" and "pin hole P1" in err.value.problem


def test_sleeve_slit_and_key_flat_keep_off_the_pin():
    root = HERE.parents[1]
    raw = tomllib.loads((root / "configs" / "six-spreader-sleeves.toml").read_text(encoding="utf-8"))
    raw.pop("mast_clamp", None)
    des = design(parse_config(raw))
    pin = des.plan.hole("P1")
    ends = [math.degrees(math.atan2(pin.entry_mm[1], pin.entry_mm[0])) + k * 180 for k in (0, 1)]
    apart = lambda a, b: abs((a - b + 180) % 360 - 180)  # noqa: E731
    for s in des.sleeves:
        for feature in (s.slit, s.key_flat):
            if feature is not None:
                assert min(apart(feature.azimuth_deg, e) for e in ends) > 1.0, (s.mast_designation, feature)


def test_clamps_placed_by_the_planner_leave_a_given_pin_azimuth_free():
    # the metric demo, feed holes left out, an M6 clamp beside an M8 pin given at 30 deg: the
    # planner's first choice for the clamp (30 deg) is the pin's, so the clamp goes elsewhere
    root = HERE.parents[1]
    raw = tomllib.loads((root / "configs" / "six-spreader-portable.toml").read_text(encoding="utf-8"))
    raw.pop("holes")
    raw["mast_clamp"] = {"thread": "M6", "height": 37.5}
    raw["mast_pin"] = {"thread": "M8", "height": 37.5, "azimuth": 30}
    des = design(parse_config(raw))
    (clamp,) = [h for h in des.plan.holes if h.kind == "clamp"]
    az = math.degrees(math.atan2(clamp.entry_mm[1], clamp.entry_mm[0])) % 360
    assert min(abs((az - e + 180) % 360 - 180) for e in (30, 210)) > 1.0
    assert des.plan.hole("P1").note.startswith("through bolt across the hub and the mast at 30 deg")


def test_a_puck_takes_a_pin_at_any_azimuth_it_is_given():
    # a round rim is square to the pin anywhere: 15 deg is neither a gap nor a socket azimuth
    d = planned(hub={"style": "puck", "diameter": 170, "sides": None, "across_flats": None},
                mast_pin={"thread": "M8", "height": 37.5, "azimuth": 15})
    h = d.plan.hole("P1")
    assert h.face == "rim" and h.exit_face == "rim"
    # entry on the 85 mm rim at 15 deg (plane geometry)
    assert h.entry_mm[0] == pytest.approx(85 * math.cos(math.radians(15)), abs=1e-6)
    assert h.entry_mm[1] == pytest.approx(85 * math.sin(math.radians(15)), abs=1e-6)
