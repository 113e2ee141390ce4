"""Build the spider-quad case: the solid has its sockets at +/-12 deg, assembly.step holds
each spreader to the cut list's length, frame.png and both files are in the report and the
manifest hashes.

References: the socket axis from the config alone (hub frame of DEVELOPERS.md: the axis
passes mid-thickness halfway along its horizontal run, rises at e outward); a pole on
a blind socket's floor ends at the floor's axis point and runs the cut length outward.
"""

from __future__ import annotations

import csv
import math

import numpy as np
import pytest

from generators.build import build_config
from generators.config.load import parse_config
from tests.frame.helpers import spider_raw

pytestmark = pytest.mark.slow

R_FLAT, T, DEPTH, TIP_R = 85.0, 60.0, 45.0, 2600.0  # from the case: 170 across flats, 60 thick, 45 deep
ELEV = {1: 12.0, 2: -12.0, 3: 12.0, 4: -12.0}


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    out = tmp_path_factory.mktemp("frame")
    return build_config(parse_config(spider_raw()), out)


def _axis(i: int):
    """Entry and outward unit vector of socket i from the config alone."""
    a, e = math.radians(45 + 90 * (i - 1)), math.radians(ELEV[i])
    r_in = R_FLAT - DEPTH * math.cos(e)
    z0 = T / 2 + (R_FLAT - (R_FLAT + r_in) / 2) * math.tan(e)
    out = np.array([math.cos(e) * math.cos(a), math.cos(e) * math.sin(a), math.sin(e)])
    return np.array([R_FLAT * math.cos(a), R_FLAT * math.sin(a), z0]), out


def _ring(centre, axis, radius, n=8):
    ref = np.array([0.0, 0.0, 1.0])
    e1 = ref - axis * np.dot(ref, axis)
    e1 /= np.linalg.norm(e1)
    e2 = np.cross(axis, e1)
    return [centre + radius * (math.cos(2 * math.pi * k / n) * e1 + math.sin(2 * math.pi * k / n) * e2)
            for k in range(n)]


def test_sockets_in_the_solid_at_their_angles(built):
    import cadquery as cq

    hub = cq.importers.importStep(str(built.folder / "hub.step")).val()
    r = 22.5 / 2
    for i in ELEV:
        entry, out = _axis(i)
        for t in (8.0, 38.0):  # along the socket, from the mouth inwards
            c = entry - out * t
            assert not any(hub.isInside(cq.Vector(*p)) for p in _ring(c, out, r - 1.0)), (i, t)
            assert all(hub.isInside(cq.Vector(*p)) for p in _ring(c, out, r + 2.0)), (i, t)


def test_tubes_in_the_assembly_end_at_the_cut_length(built):
    import cadquery as cq

    asm = cq.importers.importStep(str(built.folder / "assembly.step"))
    solids = [s for v in asm.vals() for s in v.Solids()]
    assert len(solids) == 1 + 1 + 4 + 4  # hub, mast stub, four spreaders, four wires
    with (built.folder / "cutlist.csv").open(encoding="utf-8") as f:
        rows = list(csv.DictReader(f))
    cut = {int(r["spreader"]): float(r["cut_length_mm"]) for r in rows}
    assert len(set(round(v, 2) for v in cut.values())) == 1  # +12 and -12 cut alike

    def inside(p):
        return any(s.isInside(cq.Vector(*p)) for s in solids)

    for i, length in cut.items():
        entry, out = _axis(i)
        floor = entry - out * DEPTH  # the pole's end on the socket floor
        # mid-wall of the 22 mm tube with its 2.5 mm wall: 11 - 1.25 = 9.75 mm off the axis
        assert all(inside(p) for p in _ring(floor + out * (length - 1.0), out, 9.75)), i
        assert not any(inside(p) for p in _ring(floor + out * (length + 1.0), out, 9.75)), i
        assert all(inside(p) for p in _ring(floor + out * 1.0, out, 9.75)), i  # and from the floor
        # the tip (wire point) on the axis at the tip radius, horizontally
        tip = floor + out * ((TIP_R - math.hypot(*floor[:2])) / math.cos(math.radians(ELEV[i])))
        rec = next(t for t in built.manifest["frame"]["tips"] if t["spreader"] == i)
        assert rec["tip_mm"] == pytest.approx(list(tip), abs=1e-3)
        assert math.hypot(*rec["tip_mm"][:2]) == pytest.approx(TIP_R, abs=1e-3)


def test_frame_files_listed_and_hashed(built):
    files = built.manifest["files"]
    assert "assembly.step" in files and "frame.png" in files
    report = (built.folder / "report.md").read_text(encoding="utf-8")
    assert "`frame.png`" in report and "`assembly.step`" in report
    from PIL import Image

    with Image.open(built.folder / "frame.png") as im:
        assert im.size[0] > 1000 and im.size[1] > 500
    # wires S1-S2 etc.: tips at +/-(z) give the tip-to-tip chord sqrt(plan^2 + dz^2) (Pythagoras)
    tips = {t["spreader"]: np.array(t["tip_mm"]) for t in built.manifest["frame"]["tips"]}
    for w in built.manifest["frame"]["wires"]:
        assert w["length_mm"] == pytest.approx(float(np.linalg.norm(tips[w["to"]] - tips[w["from"]])), abs=1e-2)
