"""A CAD-kernel failure is one line naming the feature, with the config kept for a bug report."""

from pathlib import Path

import pytest

from generators.build import build
from generators.errors import KernelError

ROOT = Path(__file__).resolve().parents[2]
DEMO = ROOT / "configs" / "four-spreader-conduit.toml"


@pytest.mark.slow
def test_kernel_failure_names_the_hole_and_saves_the_config(tmp_path, monkeypatch):
    import generators.cad.solids as solids

    real_cutters = solids.hole_cutters

    def broken(hole):
        if hole.id == "S2":
            raise RuntimeError("Standard_Failure")  # what OCP raises when a boolean breaks
        return real_cutters(hole)

    monkeypatch.setattr(solids, "hole_cutters", broken)
    monkeypatch.setenv("HUBWRIGHT_SERIAL", "1")
    out = tmp_path / "out"
    with pytest.raises(KernelError) as exc:
        build(DEMO, out)
    line = exc.value.line()
    assert line.startswith("hole S2:") and "\n" not in line
    saved = out / "quad-emt-125.failed.toml"
    assert saved.read_bytes() == DEMO.read_bytes()
    assert str(saved) in line
    assert sorted(p.name for p in out.iterdir()) == ["quad-emt-125.failed.toml"]  # no half-written output
