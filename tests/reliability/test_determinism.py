"""Two builds of the same config give the same bytes (STEP header time is fixed)."""

from pathlib import Path

import pytest

from generators.build import build

ROOT = Path(__file__).resolve().parents[2]


@pytest.mark.slow
@pytest.mark.parametrize("demo", ["four-spreader-conduit.toml"])
def test_two_builds_are_byte_identical(tmp_path, demo):
    a = build(ROOT / "configs" / demo, tmp_path / "a").folder
    b = build(ROOT / "configs" / demo, tmp_path / "b").folder
    files_a = sorted(p.relative_to(a).as_posix() for p in a.rglob("*") if p.is_file())
    files_b = sorted(p.relative_to(b).as_posix() for p in b.rglob("*") if p.is_file())
    assert files_a == files_b
    differ = [f for f in files_a if (a / f).read_bytes() != (b / f).read_bytes()]
    assert differ == []
