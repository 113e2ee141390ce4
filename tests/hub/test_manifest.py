"""manifest.json against issue 3 item 5 (fields) and item 3 (frame and geometry rules),
checked against the config it was built from."""

from __future__ import annotations

import hashlib
import json
import math

import numpy as np
import pytest

from .conftest import CASES

pytestmark = pytest.mark.slow

NAMES = sorted(CASES)
HOLE_KEYS = {"id", "kind", "face", "entry_mm", "axis", "diameter_mm", "depth_mm", "drill", "thread",
             "countersink", "counterbore"}


@pytest.mark.parametrize("name", NAMES)
def test_manifest_has_every_field_of_item_5(build_case, name):
    b = build_case(name)
    m = json.loads((b.folder / "manifest.json").read_text(encoding="utf-8"))
    assert m == json.loads(json.dumps(b.manifest)), "manifest.json differs from the build result"
    cfg = b.config
    assert m["name"] == cfg.name
    assert m["units_in_config"] == cfg.units
    assert set(m["mast"]) >= {"designation", "od_mm"}
    assert m["mast"]["od_mm"] == pytest.approx(cfg.mast.size.od_mm)
    hub = m["hub"]
    assert set(hub) >= {"style", "sides", "thickness_mm", "bore_mm", "volume_mm3", "mass_g"}
    assert hub["style"] == cfg.hub.style
    assert hub["thickness_mm"] == pytest.approx(cfg.hub.thickness)
    if cfg.hub.style == "block":
        assert hub["across_flats_mm"] == pytest.approx(cfg.hub.across_flats)
        assert hub["sides"] == (cfg.hub.sides or cfg.spreaders.count)
    else:
        assert hub["diameter_mm"] == pytest.approx(cfg.hub.diameter)
    bore = cfg.hub.bore if cfg.hub.bore is not None else cfg.mast.size.od_mm + cfg.mast.clearance
    assert hub["bore_mm"] == pytest.approx(bore)
    # mass = volume x density (g/cm3 -> g per 1000 mm3)
    from generators.standards.materials import get_material

    density = get_material(cfg.hub.material).density_g_cm3
    assert hub["mass_g"] == pytest.approx(hub["volume_mm3"] / 1000 * density, abs=0.1)
    for h in m["holes"]:
        assert set(h) >= HOLE_KEYS, f"{h['id']} lacks {HOLE_KEYS - set(h)}"
        assert h["kind"] in {"bore", "socket", "set_screw", "clamp", "pin", "extra"}
        assert math.isclose(np.linalg.norm(h["axis"]), 1.0, abs_tol=1e-6), f"{h['id']} axis not unit"
        assert h["diameter_mm"] > 0 and h["depth_mm"] > 0
        for key, fields in (("countersink", {"diameter_mm", "angle_deg"}), ("counterbore", {"diameter_mm", "depth_mm"})):
            assert h[key] is None or set(h[key]) >= fields
    ids = [h["id"] for h in m["holes"]]
    assert len(ids) == len(set(ids))
    # a through bolt is drawn exactly when the config asks for one
    assert any(h["kind"] == "pin" for h in m["holes"]) == (cfg.mast_pin is not None)
    for s in m["spreaders"]:
        assert set(s) >= {"id", "azimuth_deg", "elevation_deg", "socket_hole"}
        assert s["socket_hole"] in ids
    # files: name -> sha256 of what is on disk (FIPS 180-4 via hashlib)
    skip = ("manifest.json", ".hubwright-build.json", "changes.json")  # written after the manifest
    on_disk = sorted(p.name for p in b.folder.rglob("*") if p.is_file() and p.name not in skip)
    assert {"hub.step", "hub.stl", "hub.3mf"} <= set(m["files"])
    assert sorted(m["files"]) == sorted(p.relative_to(b.folder).as_posix() for p in b.folder.rglob("*")
                                        if p.is_file() and p.name not in skip), on_disk
    for rel, digest in m["files"].items():
        assert hashlib.sha256((b.folder / rel).read_bytes()).hexdigest() == digest, rel


@pytest.mark.parametrize("name", NAMES)
def test_holes_follow_the_frame_and_rules_of_item_3(build_case, name):
    b = build_case(name)
    cfg, m = b.config, b.manifest
    holes = {h["id"]: h for h in m["holes"]}
    T, N, sp = cfg.hub.thickness, cfg.spreaders.count, cfg.spreaders
    kinds = [h["kind"] for h in m["holes"]]
    assert kinds.count("bore") == 1 and kinds.count("socket") == N
    # bore: on the mast axis, through the full thickness
    bore = holes["bore"]
    assert bore["entry_mm"][:2] == pytest.approx([0, 0], abs=1e-9) and bore["depth_mm"] == pytest.approx(T)
    # spreader 1 at first_azimuth, the rest evenly spaced counter-clockwise, except where a
    # [[sockets]] table of the config gives a socket its own azimuth, elevation, pole or fit
    over = {o.index: o for o in cfg.sockets}
    for i, s in enumerate(m["spreaders"]):
        assert s["id"] == i + 1 and s["socket_hole"] == f"S{i + 1}"
        o = over.get(i + 1)
        own = (lambda f, default: default if o is None or getattr(o, f) is None else getattr(o, f))  # noqa: E731
        want = own("azimuth", (sp.first_azimuth + i * 360 / N) % 360)
        e = math.radians(own("elevation", sp.elevation))
        assert (s["azimuth_deg"] - want + 180) % 360 - 180 == pytest.approx(0, abs=1e-6)
        assert s["elevation_deg"] == pytest.approx(math.degrees(e))
        h = holes[s["socket_hole"]]
        az = math.radians(want)
        # axis in the vertical plane through the mast axis at the azimuth, pointing in and
        # down (the pole rises outward at the elevation)
        assert h["axis"] == pytest.approx([-math.cos(e) * math.cos(az), -math.cos(e) * math.sin(az),
                                           -math.sin(e)], abs=1e-6)
        assert h["diameter_mm"] == pytest.approx(own("diameter", sp.diameter) + own("fit", sp.fit))
        entry, bottom = np.array(h["entry_mm"]), np.array(h["entry_mm"]) + np.array(h["axis"]) * h["depth_mm"]
        # halfway along the horizontal run the axis is at mid-thickness
        assert (entry[2] + bottom[2]) / 2 == pytest.approx(T / 2, abs=1e-4)
        if sp.socket_depth != "to-bore":
            assert h["depth_mm"] == pytest.approx(sp.socket_depth)
    for h in m["holes"]:
        if h["kind"] == "set_screw":
            ss = cfg.set_screws
            assert h["face"] == ss.face
            assert h["entry_mm"][2] == pytest.approx(T if ss.face == "top" else 0.0)
            assert h["axis"] == pytest.approx([0, 0, -1] if ss.face == "top" else [0, 0, 1])
            assert h["thread"] is not None and h["drill"] is not None
        elif h["kind"] == "clamp":
            # radial, at mid-thickness, between two sockets, tapped
            assert h["entry_mm"][2] == pytest.approx(T / 2)
            az = math.degrees(math.atan2(h["entry_mm"][1], h["entry_mm"][0]))
            rel = ((az - sp.first_azimuth) % (360 / N)) / (360 / N)
            assert rel == pytest.approx(0.5, abs=1e-6), f"{h['id']} is not midway between sockets"
            assert h["axis"][2] == 0 and h["thread"] == cfg.mast_clamp.thread.designation
            face = h["face"]
            if cfg.hub.style == "puck":
                assert face == "rim"
            elif (cfg.hub.sides or N) == 2 * N:
                assert face.startswith("flat-")
            else:
                assert face.startswith("chamfer-")
        elif h["kind"] == "extra":
            spec = next(x for x in cfg.holes if x.id == h["id"])
            assert h["entry_mm"] == pytest.approx([spec.at[0], spec.at[1], T if spec.face == "top" else 0.0])
            assert h["depth_mm"] == pytest.approx(spec.depth if spec.depth is not None else T)
            assert (h["countersink"] is not None) == spec.countersink
            assert (h["counterbore"] is not None) == spec.counterbore
    if cfg.set_screws is not None:
        assert kinds.count("set_screw") == N * cfg.set_screws.per_spreader
    assert kinds.count("clamp") == (cfg.mast_clamp.count if cfg.mast_clamp else 0)
