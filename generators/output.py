"""Output folders written complete or not at all, and only over hubwright's own.

A build writes into a hidden temporary folder beside the target and swaps it into
place when every file is written. The target is replaced only when it carries the
marker file a build writes last (:data:`MARKER`); any other folder or file of that
name is refused and left alone.

Each temporary folder has a unique id and is held with ``flock`` by the build that
owns it; a build clears only leftovers of exactly its own target name whose lock is
free (a killed build's). The few steps that look at or rename folders run under a
short ``flock`` of the parent folder, so two builds into one ``--out`` never remove
each other's work: both end complete, the later one in place.
"""

from __future__ import annotations

import contextlib
import fcntl
import json
import os
import re
import shutil
import uuid
from collections.abc import Iterator
from pathlib import Path

from generators import __version__, signals
from generators.errors import UserError

MARKER = ".hubwright-build.json"
GENERATOR = "hubwright"
TMP_PREFIX = ".hubwright-tmp+"
OLD_PREFIX = ".hubwright-old+"
_LEFTOVER = re.compile(r"^\.hubwright-(?:tmp|old)\+(?P<name>.+)\+(?P<uid>[0-9a-f]{12})$")


def marker_text(name: str) -> str:
    """The marker's content: no time stamp, so rebuilds stay byte-identical."""
    return json.dumps({"generator": GENERATOR, "version": __version__, "config_name": name},
                      indent=2, sort_keys=True) + "\n"


def owned(folder: Path) -> bool:
    """Whether ``folder`` is a hubwright output (its marker names the generator and the folder)."""
    try:
        data = json.loads((folder / MARKER).read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return False
    return isinstance(data, dict) and data.get("generator") == GENERATOR and data.get("config_name") == folder.name


def _refuse_foreign(target: Path) -> None:
    if target.is_symlink() or (target.exists() and not target.is_dir()):
        raise UserError("--out", f"{target} exists and is not a folder hubwright made; nothing was touched",
                        "choose another --out or config name, or move it away")
    if target.exists() and not owned(target):
        raise UserError("--out", f"{target} exists and was not made by hubwright (no {MARKER});"
                        " nothing was touched", "choose another --out or config name, or move it away")


def _try_lock(path: Path) -> int | None:
    """An fd holding an exclusive flock on ``path``, or None when another process holds it."""
    try:
        fd = os.open(path, os.O_RDONLY | os.O_DIRECTORY)
    except OSError:
        return None
    try:
        fcntl.flock(fd, fcntl.LOCK_EX | fcntl.LOCK_NB)
    except OSError:
        os.close(fd)
        return None
    return fd


@contextlib.contextmanager
def _parent_lock(parent: Path) -> Iterator[None]:
    """A short exclusive lock on the output folder itself (blocking; held for renames only)."""
    try:
        fd = os.open(parent, os.O_RDONLY | os.O_DIRECTORY)
    except OSError:
        yield
        return
    try:
        fcntl.flock(fd, fcntl.LOCK_EX)
        yield
    finally:
        os.close(fd)  # closing releases the lock


def _clear_leftovers(parent: Path, name: str) -> None:
    """Remove temporary and old folders of exactly ``name`` that no running build holds."""
    for entry in parent.iterdir():
        m = _LEFTOVER.match(entry.name)
        if not m or m["name"] != name or not entry.is_dir() or entry.is_symlink():
            continue
        fd = _try_lock(entry)
        if fd is None:
            continue  # in use by another build
        try:
            shutil.rmtree(entry, ignore_errors=True)
        finally:
            os.close(fd)


def _new_folder(parent: Path, prefix: str, name: str) -> tuple[Path, int]:
    """A fresh folder with a unique id, already locked by this process."""
    path = parent / f"{prefix}{name}+{uuid.uuid4().hex[:12]}"
    path.mkdir(mode=0o755)
    fd = _try_lock(path)
    if fd is None:  # cannot happen for a folder just made, unless it is not ours
        raise UserError("--out", f"cannot lock {path}")
    return path, fd


def _swap(tmp: Path, target: Path) -> None:
    """Put ``tmp`` in place of ``target``; the previous output is moved aside, then removed."""
    parent, name = target.parent, target.name
    old = None
    with signals.held(), _parent_lock(parent):
        _refuse_foreign(target)  # someone may have put a folder there meanwhile
        if target.exists():
            old, old_fd = _new_folder(parent, OLD_PREFIX, name)
            try:
                os.replace(target, old / name)
                os.replace(tmp, target)
            except OSError:
                if not target.exists() and (old / name).exists():
                    os.replace(old / name, target)  # put the previous output back
                raise
            finally:
                os.close(old_fd)
        else:
            os.replace(tmp, target)
    if old is not None:
        shutil.rmtree(old, ignore_errors=True)


@contextlib.contextmanager
def atomic_folder(target: Path) -> Iterator[Path]:
    """Yield a temporary folder; on success it replaces ``target`` in one move."""
    target = Path(target)
    parent, name = target.parent, target.name
    try:
        parent.mkdir(parents=True, exist_ok=True)
    except OSError as exc:
        raise UserError("--out", f"cannot create {parent} ({exc.strerror})") from None
    _refuse_foreign(target)
    try:
        with signals.held(), _parent_lock(parent):
            _clear_leftovers(parent, name)
            tmp, fd = _new_folder(parent, TMP_PREFIX, name)
    except OSError as exc:
        raise UserError("--out", f"cannot write in {parent} ({exc.strerror})") from None
    try:
        with signals.on_interrupt(lambda: shutil.rmtree(tmp, ignore_errors=True)):
            try:
                yield tmp
                (tmp / MARKER).write_text(marker_text(name), encoding="utf-8")  # last: the folder is whole
                _swap(tmp, target)
            except OSError as exc:
                raise UserError("--out", f"cannot write {target} ({exc.strerror})") from None
    finally:
        if tmp.exists():
            shutil.rmtree(tmp, ignore_errors=True)
        os.close(fd)
