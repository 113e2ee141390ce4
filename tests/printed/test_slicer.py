"""The printed hub through a real slicer's command line (PrusaSlicer, as packaged by Debian).

``--info`` reports each model's size and whether its mesh is manifold; ``--export-gcode``
slices it. Supports are left off (PrusaSlicer's default, stated again with
``--no-support-material``): the hub must print without them.
"""

from __future__ import annotations

import re
import shutil
import subprocess

import pytest

pytestmark = [pytest.mark.slow, pytest.mark.slicer]

SLICER = shutil.which("prusa-slicer")
needs_slicer = pytest.mark.skipif(SLICER is None, reason="prusa-slicer is not on PATH (Debian: apt-get install"
                                  " prusa-slicer); .ci/run installs it so CI runs these")


def _run(args, tmp_path, timeout=300):
    # a private settings folder so the user's own profiles cannot change the result
    cmd = [SLICER, "--datadir", str(tmp_path / "slicer-data"), "--loglevel", "1", *args]
    return subprocess.run(cmd, capture_output=True, text=True, timeout=timeout, cwd=tmp_path)


def _info(path, tmp_path) -> dict[str, str]:
    res = _run(["--info", str(path)], tmp_path)
    assert res.returncode == 0, res.stderr[-2000:]
    return dict(re.findall(r"^\s*([a-z_]+)\s*=\s*(.+?)\s*$", res.stdout, flags=re.M))


def _plan_size(plan):
    xs = [p[0] for p in plan.body.outline]
    ys = [p[1] for p in plan.body.outline]
    return max(xs) - min(xs), max(ys) - min(ys), plan.body.thickness_mm


@needs_slicer
@pytest.mark.parametrize("stem", ["hub.3mf", "hub.stl"])
def test_slicer_reads_a_manifold_hub_of_the_planned_size(printed, tmp_path, stem):
    info = _info(printed.folder / stem, tmp_path)
    assert info.get("manifold") == "yes", info
    assert info.get("number_of_parts", "1").strip() == "1"
    for key, want in zip(("size_x", "size_y", "size_z"), _plan_size(printed.plan)):
        assert float(info[key]) == pytest.approx(want, abs=0.01), key
    assert float(info["min_z"]) == pytest.approx(0.0, abs=1e-6)


@needs_slicer
def test_slicer_reads_the_tip_cap(printed, tmp_path):
    cap = printed.manifest["tip_cap"]
    info = _info(printed.folder / "tipcap.3mf", tmp_path)
    assert info.get("manifold") == "yes"
    assert float(info["size_z"]) == pytest.approx(cap["length_mm"], abs=0.01)
    assert float(info["size_x"]) == pytest.approx(cap["outer_diameter_mm"], abs=0.05)


@needs_slicer
def test_hub_slices_without_supports(printed, tmp_path):
    gcode = tmp_path / "hub.gcode"
    res = _run(["--export-gcode", "--no-support-material", "--layer-height", "0.3",
                "--center", "100,100", "-o", str(gcode), str(printed.folder / "hub.3mf")], tmp_path, timeout=600)
    assert res.returncode == 0, (res.stdout[-2000:], res.stderr[-2000:])
    text = gcode.read_text(errors="replace")
    assert re.search(r"^; support_material = 0$", text, flags=re.M)
    assert ";TYPE:Support material" not in text
    layers = [float(z) for z in re.findall(r"^;Z:([0-9.]+)$", text, flags=re.M)]
    assert layers and max(layers) == pytest.approx(printed.plan.body.thickness_mm, abs=0.31)
