"""Output folders written complete or not at all, and only over hubwright's own.

A build writes into a hidden temporary folder beside the target and swaps it into
place when every file is written. The target is replaced only when it carries the
marker file a build writes last (:data:`MARKER`); any other folder or file of that
name is refused and left alone.

Files a builder put into an output folder (notes, photos) are not lost on a rebuild: the
marker lists every file the build wrote, and any other file in the old folder is moved into
the new one before the swap (a file whose name the new build also writes is refused, and
nothing is touched).

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


def marker_text(name: str, files: list[str] | None = None) -> str:
    """The marker's content: no time stamp, so rebuilds stay byte-identical; ``files`` are
    the paths the build wrote (relative, sorted)."""
    data = {"generator": GENERATOR, "version": __version__, "config_name": name}
    if files is not None:
        data["files"] = sorted(files)
    return json.dumps(data, indent=2, sort_keys=True) + "\n"


def _all_files(folder: Path) -> list[str]:
    """Every file and link under ``folder`` (links not followed), relative, but the marker."""
    out = []
    for root, dirs, names in os.walk(folder):
        base = Path(root)
        for n in names + [d for d in dirs if (base / d).is_symlink()]:
            rel = (base / n).relative_to(folder).as_posix()
            if rel != MARKER:
                out.append(rel)
    return sorted(out)


def _written_before(target: Path) -> set[str] | None:
    """What the build in ``target`` wrote: its marker's list, else (older builds) the
    manifest's files and the build's own records; None when neither says."""
    try:
        data = json.loads((target / MARKER).read_text(encoding="utf-8"))
        if isinstance(data.get("files"), list):
            return {str(x) for x in data["files"]}
        files = json.loads((target / "manifest.json").read_text(encoding="utf-8")).get("files")
    except (OSError, ValueError, AttributeError):
        return None
    if not isinstance(files, dict):
        return None
    return set(files) | {"manifest.json", "changes.json"}


def user_files(target: Path) -> list[str]:
    """Files in an owned output folder that hubwright did not write there."""
    if not target.is_dir() or target.is_symlink():
        return []
    wrote = _written_before(target)
    if wrote is None:
        return []
    return [f for f in _all_files(target) if f not in wrote]


def _empty_dirs(folder: Path) -> list[str]:
    """Empty folders under ``folder`` (a build writes none, so they are the builder's)."""
    out = []
    for root, dirs, names in os.walk(folder):
        if not dirs and not names and Path(root) != folder:
            out.append(Path(root).relative_to(folder).as_posix())
    return sorted(out)


def _blocked(tmp: Path, rel: str) -> bool:
    """Whether the new build already has ``rel``, or a file where one of its folders goes."""
    p = tmp / rel
    if p.exists() or p.is_symlink():
        return True
    return any((q.exists() or q.is_symlink()) and (q.is_symlink() or not q.is_dir())
               for q in list(p.parents)[: len(Path(rel).parts) - 1])


def _carry_over(target: Path, tmp: Path) -> list[str]:
    """Move the builder's own files (and empty folders) from the old output into the new one
    (before the swap); every clash is looked for first, and a failed move puts back what moved."""
    keep = user_files(target)
    dirs = _empty_dirs(target) if keep or _written_before(target) is not None else []
    clash = [f for f in keep + dirs if _blocked(tmp, f)]
    if clash:
        raise UserError("--out", f"{target / clash[0]} was not written by hubwright and the new build writes a"
                        " file or folder of that name; nothing was touched", "move or rename it, then build again")
    moved: list[str] = []
    try:
        for f in keep:
            (tmp / f).parent.mkdir(parents=True, exist_ok=True)
            os.replace(target / f, tmp / f)
            moved.append(f)
        for d in dirs:
            (tmp / d).mkdir(parents=True, exist_ok=True)
    except OSError:
        for f in reversed(moved):
            (target / f).parent.mkdir(parents=True, exist_ok=True)
            os.replace(tmp / f, target / f)
        raise
    return keep


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
            kept = _carry_over(target, tmp)
            old, old_fd = _new_folder(parent, OLD_PREFIX, name)
            try:
                os.replace(target, old / name)
                os.replace(tmp, target)
            except OSError:
                if not target.exists() and (old / name).exists():
                    os.replace(old / name, target)  # put the previous output back
                for f in kept:  # and the builder's files into it
                    if (tmp / f).exists() and not (target / f).exists():
                        os.replace(tmp / f, target / f)
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
                files = _all_files(tmp)
                (tmp / MARKER).write_text(marker_text(name, files), encoding="utf-8")  # last: the folder is whole
                _swap(tmp, target)
            except OSError as exc:
                raise UserError("--out", f"cannot write {target} ({exc.strerror})") from None
    finally:
        if tmp.exists():
            shutil.rmtree(tmp, ignore_errors=True)
        os.close(fd)
