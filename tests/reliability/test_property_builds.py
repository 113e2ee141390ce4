"""Property tests over the config space (hypothesis).

Every config the loader and the plan accept builds one valid solid, a watertight STL
whose volume matches the STEP, and a manifest whose holes the solid agrees with.
Every config they reject fails with one line naming a key and writes nothing.
Short profile in CI; ``HYPOTHESIS_PROFILE=long python -m pytest tests/reliability`` runs long.
"""

from __future__ import annotations

import subprocess
import sys

import pytest
from hypothesis import HealthCheck, assume, given, settings, strategies as st

from generators.build import build_config
from tests.support.operations import operation_mismatches
from generators.config import parse_config
from generators.errors import UserError
from generators.plan.hub import build_plan

from .probe import hole_voids, inside, load

THREADS = ["M4", "M5", "M6", "#10-24", "1/4-20", "#8-32"]


@st.composite
def configs(draw):
    units = draw(st.sampled_from(["mm", "in"]))
    k = 25.4 if units == "in" else 1.0
    count = draw(st.sampled_from([3, 4, 5, 6, 8]))
    style = draw(st.sampled_from(["block", "puck"]))
    size = draw(st.floats(90, 240))
    hub = {"style": style, "thickness": round(draw(st.floats(22, 70)) / k, 4)}
    if style == "block":
        hub["across_flats"] = round(size / k, 4)
        hub["corner_chamfer"] = round(draw(st.sampled_from([0.0, 4.0, 10.0])) / k, 4)
        if draw(st.booleans()):
            hub["sides"] = 2 * count
    else:
        hub["diameter"] = round(size / k, 4)
    spreaders = {
        "count": count,
        "diameter": round(draw(st.floats(8, 28)) / k, 4),
        "elevation": draw(st.sampled_from([0, 5, 10, 20, 30])),
        "first_azimuth": draw(st.sampled_from([0, 15, 90])),
    }
    if draw(st.booleans()):
        spreaders["socket_depth"] = round(draw(st.floats(15, 70)) / k, 4)
    data = {
        "name": "prop", "units": units,
        "mast": {"size": f"{draw(st.floats(20, 60)):.2f} mm"},
        "hub": hub, "spreaders": spreaders,
    }
    if draw(st.booleans()):
        data["set_screws"] = {"thread": draw(st.sampled_from(THREADS)),
                              "per_spreader": draw(st.sampled_from([1, 2]))}
    if draw(st.booleans()):
        data["mast_clamp"] = {"thread": draw(st.sampled_from(THREADS)), "count": 1}
    return data


def drawing_mismatches(folder, manifest) -> list[str]:
    """Holes whose DXF circle is missing, doubled, misplaced or the wrong size (ezdxf read-back)."""
    import ezdxf

    from generators.drawings.sheet import HOLES
    from tests.drawings.test_templates import expected_uv

    bad = []
    # a through pin is marked where it leaves as well (drilled half from each face in line)
    exits = [dict(h, id=f"{h['id']}-exit", face=h["exit_face"],
                  entry_mm=[e + a * h["depth_mm"] for e, a in zip(h["entry_mm"], h["axis"])])
             for h in manifest["holes"] if h["kind"] == "pin" and h.get("exit_face")]
    faces_with_holes = {h["face"] for h in manifest["holes"] + exits}
    drawn = {rec["face"] for rec in manifest.get("templates", [])}
    if manifest["hub"]["process"] == "machined" and drawn != faces_with_holes:
        bad.append(f"faces drawn {sorted(drawn)} != faces with holes {sorted(faces_with_holes)}")
    for rec in manifest.get("templates", []):
        k = 25.4 if rec["dxf_units"] == "in" else 1.0
        circles = [e for e in ezdxf.readfile(folder / rec["file"]).modelspace() if e.dxf.layer == HOLES]
        on_face = [h for h in manifest["holes"] + exits if h["face"] == rec["face"]]
        if len(circles) != len(on_face):
            bad.append(f"{rec['face']}: {len(circles)} circles for {len(on_face)} holes")
        for h in on_face:
            hid = h["id"]
            u, v = expected_uv(rec, h["entry_mm"])  # from the frame and the 3D entry point alone
            hits = [c for c in circles if abs(c.dxf.center.x * k - u) < 0.01 and abs(c.dxf.center.y * k - v) < 0.01
                    and abs(2 * c.dxf.radius * k - h["diameter_mm"]) < 0.01]
            if len(hits) != 1:
                bad.append(f"{rec['face']}:{hid}")
    return bad


def _accepted(data):
    try:
        return build_plan(parse_config(data))
    except UserError as exc:
        line = exc.line()
        assert "\n" not in line and ":" in line
        return None


@pytest.mark.slow
@settings(suppress_health_check=[HealthCheck.too_slow, HealthCheck.filter_too_much])
@given(configs())
def test_accepted_configs_build_valid_parts(tmp_path_factory, data):
    plan = _accepted(data)
    assume(plan is not None)  # rejected configs are the other test's business
    out = tmp_path_factory.mktemp("prop")
    result = build_config(parse_config(data), out, force=True)  # geometry, whatever the design rules say
    manifest, solids, mesh = load(result.folder)
    assert len(solids) == 1 and solids[0].isValid()
    assert mesh.is_watertight
    assert abs(mesh.volume - solids[0].Volume()) <= 0.005 * solids[0].Volume()
    assert hole_voids(solids[0], manifest) == []
    assert drawing_mismatches(result.folder, manifest) == []
    assert operation_mismatches(result.folder, manifest) == []  # templates, report, manifest agree
    # material just inside the body at mid-height on the outer face between sockets 1 and 2
    import math

    az = math.radians(plan.spreaders[0].azimuth_deg + 180.0 / len(plan.spreaders))
    r = plan.body.outer_radius_mm - 0.5
    probe_z = 0.5  # just above the bottom face, clear of mid-height clamp holes
    assert inside(solids[0], (r * math.cos(az), r * math.sin(az), probe_z))


@settings(max_examples=25)
@given(configs(), st.sampled_from(["hub.thickness", "spreaders.count", "spreaders.diameter",
                                    "mast.size", "hub.style"]),
       st.sampled_from([-1, 0, "banana", 10_000, "3 parsec", True]))
def test_rejected_configs_fail_on_one_line(data, key, bad):
    section, field = key.split(".")
    data[section][field] = bad
    try:
        build_plan(parse_config(data))
    except UserError as exc:
        line = exc.line()
        assert "\n" not in line
        assert line.split(":")[0].startswith(section)


def test_rejected_config_via_cli_writes_nothing(tmp_path):
    cfg = tmp_path / "bad.toml"
    cfg.write_text('name = "bad"\n[mast]\nsize = "50 mm"\n[hub]\nacross_flats = 60\nthickness = 40\n'
                   '[spreaders]\ncount = 6\ndiameter = 25\n')
    r = subprocess.run([sys.executable, "-m", "generators", "build", str(cfg), "--out", str(tmp_path / "o")],
                       capture_output=True, text=True)
    assert r.returncode == 2 and r.stderr.startswith("error: ") and r.stderr.count("\n") == 1
    assert not (tmp_path / "o").exists()
