"""Built demos read back: the manifest's screws and tap depths, the printed report's steps,
where a nut slot is shown, the sleeve wrap strip, and the clearance before a clamp thread in
the solid that ships."""

from __future__ import annotations

import json
import math
import re

import numpy as np
import pytest

from .helpers import ENGAGE_D, LEAD_PITCHES, ROOT, thread_d_p

pytestmark = pytest.mark.slow

NAMES = ("five-spreader-aluminium", "six-spreader-printed", "six-spreader-sleeves")


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    from generators.build import build_config
    from generators.config import load_config

    out = tmp_path_factory.mktemp("shop")
    cache = {}

    def get(name):
        if name not in cache:
            cfg = load_config(ROOT / "configs" / f"{name}.toml")
            r = build_config(cfg, out)
            cache[name] = (cfg, r.folder, json.loads((r.folder / "manifest.json").read_text()))
        return cache[name]

    return get


@pytest.mark.parametrize("name", NAMES)
def test_manifest_lists_every_screw_and_tap_depth(built, name):
    from generators.standards.materials import get_material

    cfg, _, m = built(name)
    mclass = get_material(cfg.hub.material).material_class
    holes = {h["id"]: h for h in m["holes"]}
    screwed = {h["id"] for h in m["holes"] if h["kind"] in ("set_screw", "clamp", "pin")
               or (h["kind"] == "extra" and (h["thread"] or any(p.get("serves") == h["id"] for p in m["holes"])))}
    listed = {f["hole"]: f for f in m["fasteners"]}
    assert set(listed) == screwed
    for f in listed.values():
        assert {"hole", "designation", "length_mm", "counterbore_depth_mm"} <= set(f)
        cb = holes[f["hole"]]["counterbore"]
        assert f["counterbore_depth_mm"] == (None if cb is None else cb["depth_mm"])
    for h in m["holes"]:
        if h["thread"] and h["kind"] not in ("nut_pocket", "insert_pocket"):
            D, P = thread_d_p(h["thread"])  # ISO 261 / ASME B1.1
            assert 0 < h["tap_depth_mm"] <= ENGAGE_D[mclass] * D + LEAD_PITCHES * P + 1e-6, h["id"]


def test_printed_report_has_no_machining_steps(built):
    _, folder, _ = built("six-spreader-printed")
    text = (folder / "report.md").read_text().lower()
    schedule = text.split("## print and finish")[1].split("## fasteners")[0]
    for word in ("punch", "ream", "template", "tap "):
        assert word not in schedule, word


def test_nut_slot_is_placed_where_it_leaves_its_face(built):
    """Hand calculation: the exit is the nut's centre moved along the slot until it meets the
    face plane (top z = T; a flat at the apothem, a chamfer at Rc - c/2 tan(pi/n) along its
    normal); the report's u, v are that point in the face frame (u to the right seen from
    outside, v up), not the screw axis."""
    cfg, folder, m = built("six-spreader-printed")
    report = (folder / "report.md").read_text()
    hub, sp = cfg.hub, cfg.spreaders
    T, n = hub.thickness, hub.sides or sp.count
    apothem = hub.across_flats / 2
    Rc = apothem / math.cos(math.pi / n)
    pockets = [h for h in m["holes"] if h["kind"] == "nut_pocket"]
    assert pockets
    off_axis = 0
    for h in pockets:
        c, s, p = (np.array(h[k]) for k in ("center_mm", "slot_dir", "slot_exit_mm"))
        kind, _, k = h["face"].partition("-")
        if kind == "top":
            normal, dist, u_ax, v_ax = np.array([0, 0, 1.0]), T, np.array([1.0, 0, 0]), np.array([0, 1.0, 0])
        elif kind in ("flat", "chamfer"):
            az = math.radians(sp.first_azimuth + (int(k) - (1 if kind == "flat" else 0.5)) * 360 / n)
            normal = np.array([math.cos(az), math.sin(az), 0.0])
            dist = apothem if kind == "flat" else Rc - hub.corner_chamfer / 2 * math.tan(math.pi / n)
            u_ax, v_ax = np.array([-math.sin(az), math.cos(az), 0.0]), np.array([0, 0, 1.0])
        else:
            pytest.fail(f"unexpected slot face {h['face']}")
        t = (dist - c @ normal) / (s @ normal)
        assert p == pytest.approx(c + t * s, abs=1e-4), h["id"]
        row = next(line for line in report.splitlines() if line.startswith(f"| {h['id']} |"))
        cells = [x.strip() for x in row.split("|")]
        u, v = (float(cells[i].split()[0]) for i in (3, 4))
        want_u, want_v = (p - dist * normal) @ u_ax, (p - dist * normal) @ v_ax
        if kind == "flat" or kind == "chamfer":
            want_v = p[2]
        assert (u, v) == (pytest.approx(want_u, abs=0.01), pytest.approx(want_v, abs=0.01)), h["id"]
        axis_u = (np.array(h["entry_mm"]) - dist * normal) @ u_ax
        off_axis += abs(want_u - axis_u) > 0.5
    assert off_axis, "some slot leaves its face away from the screw axis"


def test_sleeve_rim_strip_is_pi_times_the_drilled_diameter(built):
    """Wrapped on the sleeve body, the strip is pi x its OD long (within 0.1 mm)."""
    import ezdxf

    from generators.drawings import sheet as S

    _, folder, m = built("six-spreader-sleeves")
    checked = 0
    for rec, sleeve in zip(m["sleeve_templates"], m["reducers"]):
        for s in (s for s in rec["sheets"] if s["face"] == "rim"):
            msp = ezdxf.readfile(folder / s["file"]).modelspace()
            xs = [p[0] for e in msp.query(f'LWPOLYLINE[layer=="{S.OUTLINE}"]') for p in e.get_points()]
            assert (max(xs) - min(xs)) == pytest.approx(math.pi * sleeve["od_mm"], abs=0.1)  # mm config
            checked += 1
    assert checked


def test_clamp_hole_is_clear_before_its_thread_in_the_solid(built):
    """Halfway between the tap-drill and clearance radii: void before the thread, material
    beside the thread (the STEP re-imported with cadquery)."""
    import cadquery as cq

    _, folder, m = built("five-spreader-aluminium")
    solid = cq.importers.importStep(str(folder / "hub.step")).solids().vals()[0]
    for h in (h for h in m["holes"] if h["kind"] == "clamp"):
        e, a = np.array(h["entry_mm"]), np.array(h["axis"])
        up = np.array([0.0, 0.0, 1.0])  # clamp holes are horizontal
        r = (h["diameter_mm"] / 2 + h["clearance"]["diameter_mm"] / 2) / 2
        before = e + a * (h["thread_start_mm"] / 2) + up * r
        beside = e + a * (h["thread_start_mm"] + h["thread_length_mm"] / 2) + up * r
        assert not solid.isInside(cq.Vector(*before)), h["id"]
        assert solid.isInside(cq.Vector(*beside)), h["id"]
