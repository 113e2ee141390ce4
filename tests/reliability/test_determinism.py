"""Two builds of the same config, in two processes with different hash seeds, give the same
bytes (the STEP header time and product name and the 3MF ids are fixed by the writers)."""

import os
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]


def _build(demo: str, out: Path, seed: str) -> Path:
    env = {**os.environ, "PYTHONHASHSEED": seed}
    r = subprocess.run([sys.executable, "-m", "generators", "build", str(ROOT / "configs" / demo),
                        "--out", str(out)], capture_output=True, text=True, env=env, cwd=ROOT)
    assert r.returncode == 0, r.stderr
    (folder,) = [p for p in out.iterdir() if p.is_dir()]
    return folder


@pytest.mark.slow
@pytest.mark.parametrize("demo", ["four-spreader-conduit.toml", "six-spreader-portable.toml"])
def test_two_builds_are_byte_identical(tmp_path, demo):
    a = _build(demo, tmp_path / "a", "1")
    b = _build(demo, tmp_path / "b", "2")
    files_a = sorted(p.relative_to(a).as_posix() for p in a.rglob("*") if p.is_file())
    files_b = sorted(p.relative_to(b).as_posix() for p in b.rglob("*") if p.is_file())
    assert files_a == files_b
    differ = [f for f in files_a if (a / f).read_bytes() != (b / f).read_bytes()]
    assert differ == []
