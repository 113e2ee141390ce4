"""Watch one config file: build it, then rebuild in this process whenever it changes.

The CAD libraries are loaded by the first build and stay loaded, so a rebuild pays only
the design and the kernel's work. Every build goes through :func:`generators.build.build`,
so the output rules are the same as a single ``build`` (written complete or not at all).
Nothing here prints: each build comes back as a :class:`WatchEvent` for the command.
"""

from __future__ import annotations

import contextlib
import hashlib
import importlib
import json
import os
import time
from collections.abc import Callable, Iterator
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

# Check the file this often (seconds); a change is built once it has held still for one
# more check, so an editor that writes in two steps is not built half-written.
POLL_S = 0.25


@dataclass
class WatchEvent:
    """One build of the watched config: a result, or the one line of its error."""

    number: int  # 1 for the first build
    seconds: float
    result: Any = None  # generators.build.BuildResult
    error: str = ""
    code: int = 0  # 0 built, else the exit code the error would give
    changes: dict[str, Any] = field(default_factory=dict)  # changes.json of this build
    rules: list[str] = field(default_factory=list)  # rule status changes since the last good build


def fingerprint(path: Path) -> tuple[int, int, str] | None:
    """(mtime ns, size, sha256) of the file, or None when it cannot be read.

    The hash is always taken (a config is a few kilobytes): an edit that keeps the size
    inside one mtime tick is still seen."""
    try:
        st = os.stat(path)
        data = Path(path).read_bytes()
    except OSError:
        return None
    return st.st_mtime_ns, st.st_size, hashlib.sha256(data).hexdigest()


def _same_content(a, b) -> bool:
    return a is not None and b is not None and a[1:] == b[1:]


def rule_changes(old: dict | None, new: dict) -> list[str]:
    """``id: old -> new`` for every design rule whose status differs between two manifests."""
    def statuses(m):
        rules = ((m or {}).get("checks") or {}).get("rules") or []
        return {r.get("id"): r.get("status") for r in rules if isinstance(r, dict)}

    if old is None:
        return []
    a, b = statuses(old), statuses(new)
    return [f"{k}: {a.get(k, 'absent')} -> {b.get(k, 'absent')}" for k in sorted(set(a) | set(b), key=str)
            if a.get(k) != b.get(k)]


def _read_changes(folder: Path) -> dict[str, Any]:
    from generators.manifest import CHANGES

    try:
        data = json.loads((Path(folder) / CHANGES).read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return {}
    return data if isinstance(data, dict) else {}


def _preload_beside_cad() -> None:
    """Load the drawing writers here, once, so the forked drawing child does not load them
    again on every rebuild."""
    from generators.writers import BESIDE_CAD

    for spec in BESIDE_CAD:
        try:
            importlib.import_module(spec.split(":")[0])
        except ImportError:  # the child will report it when it runs the writer
            pass


def build_once(config: Path, out, masts: tuple[str, ...], force: bool, number: int,
               last_manifest: dict | None) -> WatchEvent:
    """Build the config; any failure comes back as the event's one line."""
    from generators.build import build_with_masts
    from generators.errors import UserError

    t = time.perf_counter()
    try:
        result = build_with_masts(config, out, masts=masts, force=force)
    except UserError as exc:
        return WatchEvent(number, time.perf_counter() - t, error=exc.line(), code=exc.exit_code)
    except Exception as exc:  # noqa: BLE001 - one line, and the watch goes on
        return WatchEvent(number, time.perf_counter() - t, code=3,
                          error=f"internal error ({type(exc).__name__}: {exc}); please report it with the config")
    return WatchEvent(number, time.perf_counter() - t, result=result, changes=_read_changes(result.folder),
                      rules=rule_changes(last_manifest, result.manifest))


def watch(config: str | Path, out=None, masts: tuple[str, ...] = (), force: bool = False,
          poll_s: float = POLL_S, on_wait: Callable[[], None] | None = None,
          waiting: Callable[[], Any] = contextlib.nullcontext) -> Iterator[WatchEvent]:
    """Build ``config`` now and after every change of its content, forever (until the
    caller stops iterating or a signal ends the process). ``on_wait`` is called each
    time the watch starts waiting for the next change; the waiting runs inside the
    context ``waiting()`` (the command makes a signal raise there)."""
    config = Path(config)
    last_manifest: dict | None = None
    seen = fingerprint(config)
    number = 0
    while True:
        number += 1
        event = build_once(config, out, tuple(masts), force, number, last_manifest)
        if event.result is not None:
            last_manifest = event.result.manifest
        if number == 1:
            _preload_beside_cad()
        yield event
        with waiting():  # entered before the waiting is announced: a signal after it is a stop
            if on_wait is not None:
                on_wait()
            seen = _wait_for_change(config, seen, poll_s)


def _wait_for_change(config: Path, seen, poll_s: float):
    """Sleep until the file's content differs from ``seen`` and holds still; its new print."""
    while True:
        time.sleep(poll_s)
        now = fingerprint(config)
        if now is None or _same_content(now, seen):
            continue
        time.sleep(poll_s)  # let a two-step save finish
        again = fingerprint(config)
        if _same_content(now, again):
            return again
