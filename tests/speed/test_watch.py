"""``hubwright build CONFIG --watch`` driven as a user would: a process, a config copy edited
twice and then broken, Ctrl-C. Waits on output lines (generous timeouts), never on time.

The cut-length change is checked by hand calculation: the spreader end stops on the mast,
so a mast 2 mm smaller in diameter moves it 1 mm inward horizontally and the cut grows by
1 mm / cos(elevation) along the tilted socket axis (right-triangle geometry)."""

from __future__ import annotations

import json
import math
import queue
import re
import shutil
import signal
import subprocess
import sys
import threading
from pathlib import Path

import pytest

pytestmark = pytest.mark.slow

ROOT = Path(__file__).resolve().parents[2]
DEMO = ROOT / "configs" / "six-spreader-portable.toml"  # 50 mm mast, 10 deg elevation
TIMEOUT_S = 300  # per wait: a loaded 2-core machine can take long for one build


class Watcher:
    def __init__(self, config: Path, out: Path):
        self.proc = subprocess.Popen([sys.executable, "-m", "generators", "build", str(config), "--out", str(out),
                                      "--watch"], cwd=ROOT, stdout=subprocess.PIPE, stderr=subprocess.STDOUT,
                                     text=True, bufsize=1)
        self.lines: queue.Queue[str | None] = queue.Queue()
        self.seen: list[str] = []
        threading.Thread(target=self._read, daemon=True).start()

    def _read(self) -> None:
        for line in self.proc.stdout:
            self.lines.put(line.rstrip("\n"))
        self.lines.put(None)

    def wait_for(self, pattern: str) -> list[str]:
        """Lines up to and including the first matching ``pattern``; fails on exit or timeout."""
        got = []
        while True:
            try:
                line = self.lines.get(timeout=TIMEOUT_S)
            except queue.Empty:
                raise AssertionError(f"no {pattern!r} within {TIMEOUT_S} s; output so far:\n" + "\n".join(self.seen))
            if line is None:
                raise AssertionError(f"the watch ended before {pattern!r}:\n" + "\n".join(self.seen))
            self.seen.append(line)
            got.append(line)
            if re.search(pattern, line):
                return got

    def stop(self) -> None:
        if self.proc.poll() is None:
            self.proc.kill()
            self.proc.wait(30)


def _set_mast(config: Path, size: str) -> None:
    text = config.read_text(encoding="utf-8")
    config.write_text(re.sub(r'(?m)^size = "[^"]*"', f'size = "{size}"', text, count=1), encoding="utf-8")


def _manifest(out: Path) -> dict:
    return json.loads((out / "hex-portable-50" / "manifest.json").read_text(encoding="utf-8"))


def _changes(out: Path) -> dict:
    return json.loads((out / "hex-portable-50" / "changes.json").read_text(encoding="utf-8"))


def test_watch_rebuilds_on_two_edits_and_survives_a_broken_one(tmp_path):
    config, out = tmp_path / "hub.toml", tmp_path / "out"
    shutil.copy(DEMO, config)
    w = Watcher(config, out)
    try:
        w.wait_for(r"^watch: waiting for ")
        assert _manifest(out)["mast"]["od_mm"] == 50.0
        elevation = math.radians(_manifest(out)["spreaders"][0]["elevation_deg"])

        _set_mast(config, "48 mm")  # edit 1: 2 mm smaller -> every cut longer by 1/cos(e) mm
        lines = w.wait_for(r"^watch: waiting for ")
        assert any(ln.startswith("build 2 ") for ln in lines), lines
        changed = [ln for ln in lines if ln.startswith("changed: ")]
        assert changed and "hub files changed" in changed[0] and "re-cut" in changed[0], lines
        assert _manifest(out)["mast"]["od_mm"] == 48.0
        assert math.isclose(_changes(out)["cut_length_change_mm"], 1.0 / math.cos(elevation), abs_tol=0.005)

        _set_mast(config, "52 mm")  # edit 2: 4 mm larger -> every cut shorter by 2/cos(e) mm
        lines = w.wait_for(r"^watch: waiting for ")
        assert any(ln.startswith("build 3 ") for ln in lines), lines
        assert _manifest(out)["mast"]["od_mm"] == 52.0
        assert math.isclose(_changes(out)["cut_length_change_mm"], -2.0 / math.cos(elevation), abs_tol=0.005)

        _set_mast(config, "a broomstick")  # broken edit: one error line, the watch goes on
        lines = w.wait_for(r"^watch: waiting for ")
        errors = [ln for ln in lines if ln.startswith("error: ")]
        assert len(errors) == 1 and errors[0].startswith("error: mast.size: "), lines
        assert not any("Traceback" in ln for ln in lines), lines
        assert _manifest(out)["mast"]["od_mm"] == 52.0  # the last good build stays in place, whole
        assert sorted(p.name for p in out.iterdir()) == ["hex-portable-50"]  # no temporary folder left

        w.proc.send_signal(signal.SIGINT)
        assert w.proc.wait(60) == 0
        w.wait_for(r"^watch: stopped")
    finally:
        w.stop()
