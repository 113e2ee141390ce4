"""A standing adversarial suite: one test per failure mode seen when someone tried to break a
build. Each asserts the exit status, the one line on stderr, that nothing was written (or the
user's files were left alone) and that no process outlives the command."""

from __future__ import annotations

import json
import os
import pathlib
import signal
import subprocess
import sys
import time
import tomllib

import pytest

from tests.hub import tomlout

ROOT = pathlib.Path(__file__).resolve().parents[2]
DEMO = ROOT / "configs" / "six-spreader-portable.toml"
NAME = "hex-portable-50"


def run(*args, **kw):
    return subprocess.run([sys.executable, "-m", "generators", *map(str, args)], capture_output=True, text=True,
                          cwd=ROOT, timeout=300, **kw)


def one_line(p) -> str:
    assert p.stderr.count("\n") == 1 and p.stderr.startswith("error: "), p.stderr
    return p.stderr


def alive_in_group(pgid: int) -> list[int]:
    out = []
    for d in pathlib.Path("/proc").iterdir():
        if d.name.isdigit():
            try:
                if os.getpgid(int(d.name)) == pgid:
                    out.append(int(d.name))
            except (ProcessLookupError, PermissionError):
                pass
    return out


def test_a_folder_hubwright_did_not_write_is_never_replaced(tmp_path):
    target = tmp_path / "O" / NAME
    target.mkdir(parents=True)
    (target / "important.txt").write_text("notes")
    p = run("build", DEMO, "--out", tmp_path / "O")
    assert p.returncode == 2 and "not made by hubwright" in one_line(p)
    assert (target / "important.txt").read_text() == "notes" and len(list(target.iterdir())) == 1


@pytest.mark.parametrize("spec", ["M0", "0.0-20", ".0", "0/4-20", "1/4-0"])
def test_absurd_threads_are_refused_not_reinterpreted(spec):
    p = run("threads", spec)
    assert p.returncode == 2 and "thread" in one_line(p) and p.stdout == ""


def demo_toml(tmp_path, section: str, key: str, value) -> pathlib.Path:
    data = tomllib.loads(DEMO.read_text(encoding="utf-8"))
    data[section][key] = value
    path = tmp_path / "case.toml"
    path.write_text(tomlout.dumps(data), encoding="utf-8")
    return path


@pytest.mark.parametrize("angle", ["1e20 deg", "1e17 deg", "721 deg"])
def test_angles_beyond_two_turns_are_refused(tmp_path, angle):
    p = run("check", demo_toml(tmp_path, "spreaders", "first_azimuth", angle))
    assert p.returncode == 2 and "spreaders.first_azimuth" in one_line(p)


def test_a_400_digit_length_is_refused_briefly(tmp_path):
    digits = "9" * 400
    p = run("check", demo_toml(tmp_path, "hub", "thickness", f"{digits} mm"))
    line = one_line(p)
    assert p.returncode == 2 and "hub.thickness" in line and digits[:16] not in line  # at most 15 digits echoed


def test_utf8_byte_order_mark_is_accepted(tmp_path):
    cfg = tmp_path / "bom.toml"
    cfg.write_bytes(b"\xef\xbb\xbf" + DEMO.read_bytes())
    p = run("check", cfg)
    assert p.returncode in (0, 1), p.stderr


def test_empty_out_is_refused(tmp_path):
    p = run("build", DEMO, "--out", "")
    assert p.returncode == 2 and "--out" in one_line(p)


@pytest.mark.slow
def test_script_and_control_characters_never_reach_the_report(tmp_path):
    cfg = tmp_path / "case.toml"
    text = DEMO.read_text(encoding="utf-8")
    cfg.write_text(f'description = "<script>alert(1)</script> \\u0000\\u001b[31m red"\n' +
                   "\n".join(ln for ln in text.splitlines() if not ln.startswith("description")) + "\n",
                   encoding="utf-8")
    p = run("build", cfg, "--out", tmp_path / "o")
    assert p.returncode == 0, p.stderr
    folder = tmp_path / "o" / NAME
    html = (folder / "report.html").read_text(encoding="utf-8")
    md = (folder / "report.md").read_text(encoding="utf-8")
    assert "<script>" not in html and "\x00" not in md and "\x1b" not in md


@pytest.mark.slow
def test_an_odd_previous_manifest_does_not_block_a_rebuild_and_rebuilds_repeat(tmp_path):
    out = tmp_path / "o"
    assert run("build", DEMO, "--out", out).returncode == 0
    first = (out / NAME / "manifest.json").read_bytes()
    (out / NAME / "manifest.json").write_text('{"spreaders": "not a list", "files": 7}')
    p = run("build", DEMO, "--out", out)
    assert p.returncode == 0, p.stderr
    assert (out / NAME / "manifest.json").read_bytes() == first  # comparisons live in changes.json
    assert json.loads((out / NAME / "changes.json").read_text()) == {}


@pytest.mark.slow
@pytest.mark.parametrize("delay_s,sig,code", [(0.3, signal.SIGTERM, 143), (3.0, signal.SIGTERM, 143),
                                              (3.0, signal.SIGINT, 130)])
def test_signals_end_a_build_promptly_and_leave_nothing_running(tmp_path, delay_s, sig, code):
    out = tmp_path / "o"
    proc = subprocess.Popen([sys.executable, "-m", "generators", "build", str(DEMO), "--out", str(out)],
                            cwd=ROOT, stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True,
                            start_new_session=True)
    time.sleep(delay_s)
    proc.send_signal(sig)
    _, err = proc.communicate(timeout=60)
    if proc.returncode == 0:
        pytest.skip("the build finished before the signal")
    assert proc.returncode == code and err.count("\n") == 1 and "Traceback" not in err, err
    time.sleep(1.0)
    assert alive_in_group(proc.pid) == []
    assert not (out / NAME).exists()  # no half-written output


def test_an_interrupted_size_says_what_it_leaves_and_leaves_no_file(tmp_path):
    cfg = tmp_path / DEMO.name
    cfg.write_bytes(DEMO.read_bytes())
    proc = subprocess.Popen([sys.executable, "-m", "generators", "size", str(cfg)], cwd=ROOT,
                            stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True, start_new_session=True)
    time.sleep(1.2)
    proc.send_signal(signal.SIGINT)
    _, err = proc.communicate(timeout=60)
    if proc.returncode == 0:
        pytest.skip("the search finished before the signal")
    assert proc.returncode == 130 and err == "error: interrupted by SIGINT; a sized file is only ever written whole\n"
    time.sleep(1.0)
    assert alive_in_group(proc.pid) == []  # no judge left running
    assert sorted(p.name for p in tmp_path.iterdir()) == [DEMO.name]  # no sized file, no temporary


def _config_with(tmp_path, mutate) -> pathlib.Path:
    data = tomllib.loads(DEMO.read_text(encoding="utf-8"))
    mutate(data)
    path = tmp_path / "c.toml"
    path.write_text(tomlout.dumps(data), encoding="utf-8")
    return path


@pytest.mark.parametrize("mutate", [
    # a clamp screw through a narrow corner chamfer, level with sockets that dip towards the
    # bore: 1.4 mm of acetal between the screw and a socket (under the 1.5 mm web)
    lambda d: (d.__setitem__("mast_clamp", {"thread": "M5", "count": 1}),
               d["hub"].__setitem__("corner_chamfer", 13), d["spreaders"].__setitem__("diameter", 20.3),
               d["spreaders"].__setitem__("elevation", "10 deg"), d["hub"].__setitem__("bore", 51)),
    # a blind hole whose drill point leaves 0.9 mm under it
    lambda d: d.__setitem__("holes", [{"id": "X", "face": "top", "at": [-34.64, 20.0], "diameter": 6,
                                       "depth": d["hub"]["thickness"] - 2.7}]),
])
def test_hard_limits_refuse_check_and_forced_build_alike(tmp_path, mutate):
    cfg = _config_with(tmp_path, mutate)
    out = tmp_path / "out"
    checked = run("check", cfg)
    built = run("build", cfg, "--out", out, "--force")
    assert checked.returncode == 2 and built.returncode == 2
    assert one_line(checked) == one_line(built)
    assert not out.exists() or not any(out.iterdir())
