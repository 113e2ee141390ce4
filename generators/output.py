"""Output folders written complete or not at all.

A build writes into a hidden temporary folder beside the target and swaps it into
place only when every file is written; an interrupted build leaves the previous
output intact, and the next build clears the leftovers.
"""

from __future__ import annotations

import contextlib
import os
import shutil
import signal
import tempfile
from collections.abc import Iterator
from pathlib import Path

from generators.errors import UserError

TMP_PREFIX = ".hubwright-tmp-"
OLD_PREFIX = ".hubwright-old-"


def _clear_leftovers(parent: Path, name: str) -> None:
    for stale in parent.glob(f"{TMP_PREFIX}{name}-*"):
        shutil.rmtree(stale, ignore_errors=True)
    for stale in parent.glob(f"{OLD_PREFIX}{name}-*"):
        shutil.rmtree(stale, ignore_errors=True)


@contextlib.contextmanager
def _terminate_as_interrupt() -> Iterator[None]:
    """Turn SIGTERM into KeyboardInterrupt so the temporary folder is cleaned up."""

    def handler(signum, frame):
        raise KeyboardInterrupt

    try:
        previous = signal.signal(signal.SIGTERM, handler)
    except ValueError:  # not in the main thread
        yield
        return
    try:
        yield
    finally:
        signal.signal(signal.SIGTERM, previous)


@contextlib.contextmanager
def atomic_folder(target: Path) -> Iterator[Path]:
    """Yield a temporary folder; on success it replaces ``target`` in one move."""
    target = Path(target)
    parent = target.parent
    try:
        parent.mkdir(parents=True, exist_ok=True)
    except OSError as exc:
        raise UserError("--out", f"cannot create {parent} ({exc.strerror})") from None
    if target.exists() and not target.is_dir():
        raise UserError("--out", f"{target} exists and is not a folder")
    _clear_leftovers(parent, target.name)
    try:
        tmp = Path(tempfile.mkdtemp(prefix=f"{TMP_PREFIX}{target.name}-", dir=parent))
    except OSError as exc:
        raise UserError("--out", f"cannot write in {parent} ({exc.strerror})") from None
    try:
        with _terminate_as_interrupt():
            yield tmp
            os.chmod(tmp, 0o755)
            if target.exists():
                old = Path(tempfile.mkdtemp(prefix=f"{OLD_PREFIX}{target.name}-", dir=parent))
                os.replace(target, old / target.name)
                os.replace(tmp, target)
                shutil.rmtree(old, ignore_errors=True)
            else:
                os.replace(tmp, target)
    except OSError as exc:
        shutil.rmtree(tmp, ignore_errors=True)
        raise UserError("--out", f"cannot write {target} ({exc.strerror})") from None
    except BaseException:
        shutil.rmtree(tmp, ignore_errors=True)
        raise
