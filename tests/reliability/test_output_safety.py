"""A build never leaves a half-written output, and replaces an old one only when complete."""

from __future__ import annotations

import hashlib
import json
import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]
DEMO = ROOT / "configs" / "six-spreader-portable.toml"
NAME = "hex-portable-50"


def run_build(*args, **kw):
    return subprocess.run([sys.executable, "-m", "generators", "build", *map(str, args)],
                          capture_output=True, text=True, cwd=ROOT, **kw)


def files_match_manifest(folder: Path) -> bool:
    m = json.loads((folder / "manifest.json").read_text())
    on_disk = sorted(p.relative_to(folder).as_posix() for p in folder.rglob("*")
                     if p.is_file() and p.name not in ("manifest.json", ".hubwright-build.json", "changes.json"))
    if on_disk != sorted(m["files"]):
        return False
    return all(hashlib.sha256((folder / f).read_bytes()).hexdigest() == h for f, h in m["files"].items())


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    out = tmp_path_factory.mktemp("out")
    r = run_build(DEMO, "--out", out)
    assert r.returncode == 0, r.stderr
    return out


@pytest.mark.slow
def test_complete_output_matches_its_manifest(built):
    assert files_match_manifest(built / NAME)
    assert [p.name for p in built.iterdir()] == [NAME]  # nothing stray beside it


@pytest.mark.slow
def test_interrupted_build_keeps_the_previous_output(built):
    before = {p.relative_to(built).as_posix(): p.read_bytes() for p in (built / NAME).rglob("*") if p.is_file()}
    proc = subprocess.Popen([sys.executable, "-m", "generators", "build", str(DEMO), "--out", str(built)],
                            cwd=ROOT, stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True)
    deadline = time.time() + 120
    hit = False
    while time.time() < deadline and proc.poll() is None:
        tmps = list(built.glob(".hubwright-tmp+*/hub.step"))
        if tmps:  # it is exporting: stop it now
            proc.send_signal(signal.SIGTERM)
            hit = True
            break
        time.sleep(0.02)
    proc.wait(timeout=60)
    if not hit:
        pytest.skip("the build finished before the signal could be sent")
    assert proc.returncode != 0
    after = {p.relative_to(built).as_posix(): p.read_bytes() for p in (built / NAME).rglob("*") if p.is_file()}
    assert after == before
    # the next run clears any leftover and leaves exactly one complete output
    r = run_build(DEMO, "--out", built)
    assert r.returncode == 0, r.stderr
    assert [p.name for p in built.iterdir()] == [NAME]
    assert files_match_manifest(built / NAME)


def test_unwritable_output_is_one_line(tmp_path):
    # /proc refuses new folders even for root, unlike permission bits
    r = run_build(DEMO, "--out", "/proc/hubwright-out")
    assert r.returncode == 2
    assert r.stderr.startswith("error: --out:") and r.stderr.count("\n") == 1
    assert "Traceback" not in r.stderr


@pytest.mark.skipif(os.geteuid() == 0, reason="root ignores permission bits")
def test_read_only_output_folder(tmp_path):
    out = tmp_path / "ro"
    out.mkdir()
    out.chmod(0o555)
    try:
        r = run_build(DEMO, "--out", out)
    finally:
        out.chmod(0o755)
    assert r.returncode == 2 and r.stderr.startswith("error: --out:")
    assert list(out.iterdir()) == []


def test_config_path_is_a_directory(tmp_path):
    r = run_build(tmp_path, "--out", tmp_path / "out")
    assert r.returncode == 2 and "is a folder" in r.stderr and r.stderr.count("\n") == 1
    assert not (tmp_path / "out").exists()


def test_duplicate_and_clashing_hole_ids(tmp_path):
    text = DEMO.read_text().replace('id = "FP2"', 'id = "FP1"')
    cfg = tmp_path / "dup.toml"
    cfg.write_text(text)
    r = run_build(cfg, "--out", tmp_path / "out")
    assert r.returncode == 2 and r.stderr.startswith("error: holes:") and "used twice" in r.stderr
    cfg.write_text(DEMO.read_text().replace('id = "FP2"', 'id = "S1"'))
    r = run_build(cfg, "--out", tmp_path / "out")
    assert r.returncode == 2 and r.stderr.startswith("error: holes[1].id:")
    assert not (tmp_path / "out").exists()


def test_name_cannot_escape_the_output_folder(tmp_path):
    cfg = tmp_path / "esc.toml"
    cfg.write_text(DEMO.read_text().replace('name = "hex-portable-50"', 'name = "../../etc"'))
    r = run_build(cfg, "--out", tmp_path / "out")
    assert r.returncode == 2 and r.stderr.startswith("error: name:")
    assert not (tmp_path / "out").exists() and not (tmp_path / "etc").exists()


def test_a_rebuild_keeps_the_builders_own_files(tmp_path):
    """Notes and photos put into an output folder survive a rebuild; a file whose name the
    build itself writes is refused with nothing touched."""
    r = run_build(DEMO, "--out", tmp_path)
    assert r.returncode == 0, r.stderr
    folder = tmp_path / NAME
    (folder / "my-notes.txt").write_text("drilled S1 too deep, re-do")
    (folder / "photos").mkdir()
    (folder / "photos" / "hub.jpg").write_bytes(b"\xff\xd8 not really a jpeg")
    r = run_build(DEMO, "--out", tmp_path)
    assert r.returncode == 0, r.stderr
    assert (folder / "my-notes.txt").read_text() == "drilled S1 too deep, re-do"
    assert (folder / "photos" / "hub.jpg").read_bytes().startswith(b"\xff\xd8")
    assert "kept   2 file(s) of yours" in r.stdout
    assert not [p for p in tmp_path.iterdir() if p.name.startswith(".hubwright-")]


def test_a_rebuild_does_not_carry_stale_outputs(tmp_path):
    """A file the previous build wrote is the build's, not the builder's: it is not kept."""
    r = run_build(DEMO, "--out", tmp_path)
    assert r.returncode == 0, r.stderr
    marker = json.loads((tmp_path / NAME / ".hubwright-build.json").read_text())
    assert "hub.step" in marker["files"] and "manifest.json" in marker["files"]
    r = run_build(DEMO, "--out", tmp_path)
    assert "kept" not in r.stdout
    assert files_match_manifest(tmp_path / NAME)


def test_a_builders_file_named_like_a_new_output_is_refused(tmp_path):
    from generators.errors import UserError
    from generators.output import MARKER, atomic_folder, marker_text

    target = tmp_path / "part"
    target.mkdir()
    (target / "report.md").write_text("old")
    (target / MARKER).write_text(marker_text("part", ["report.md"]))
    (target / "jig.dxf").write_text("the builder's own sketch")
    with pytest.raises(UserError) as e:
        with atomic_folder(target) as tmp:
            (tmp / "report.md").write_text("new")
            (tmp / "jig.dxf").write_text("a new output")
    assert e.value.key == "--out" and "jig.dxf" in str(e.value)
    assert (target / "jig.dxf").read_text() == "the builder's own sketch"
    assert (target / "report.md").read_text() == "old"


def _owned_part(tmp_path):
    from generators.output import MARKER, marker_text

    target = tmp_path / "part"
    target.mkdir()
    (target / "report.md").write_text("old")
    (target / MARKER).write_text(marker_text("part", ["report.md"]))
    return target


def test_a_builders_folder_where_the_build_writes_a_file_is_refused_untouched(tmp_path):
    """A builder's file under a folder named like a new output file (jig.dxf/readme.txt) is
    a clash found before anything moves: every file of theirs stays where it was."""
    from generators.errors import UserError
    from generators.output import atomic_folder

    target = _owned_part(tmp_path)
    (target / "a-notes.txt").write_text("first")  # sorts before the clash: must not be moved away
    (target / "jig.dxf").mkdir()
    (target / "jig.dxf" / "readme.txt").write_text("mine")
    with pytest.raises(UserError) as e:
        with atomic_folder(target) as tmp:
            (tmp / "report.md").write_text("new")
            (tmp / "jig.dxf").write_text("a new output")
    assert "jig.dxf" in str(e.value)
    assert (target / "a-notes.txt").read_text() == "first"
    assert (target / "jig.dxf" / "readme.txt").read_text() == "mine"
    assert (target / "report.md").read_text() == "old"


def test_a_builders_empty_folder_survives_a_rebuild(tmp_path):
    from generators.output import atomic_folder

    target = _owned_part(tmp_path)
    (target / "photos" / "later").mkdir(parents=True)
    with atomic_folder(target) as tmp:
        (tmp / "report.md").write_text("new")
    assert (target / "photos" / "later").is_dir()
    assert (target / "report.md").read_text() == "new"
