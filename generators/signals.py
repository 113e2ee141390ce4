"""SIGINT and SIGTERM end a command at once: one line, exit 130/143, no process left.

The handler does not raise into the code it interrupts: the CAD libraries catch
BaseException while they load, so an exception raised there is lost or turns into an
ImportError. Instead the handler runs the registered clean-ups (remove this build's
temporary folder, stop the drawing child or the batch workers), prints one line and
leaves with ``os._exit``. Code that must not be cut in two (the folder swap) holds the
signals with :func:`held`; they are acted on when it ends.
"""

from __future__ import annotations

import contextlib
import os
import signal
import sys
from collections.abc import Callable, Iterator

EXIT_CODES = {signal.SIGINT: 130, signal.SIGTERM: 143}  # 128 + signal number (POSIX shells)
_SIGNALS = tuple(EXIT_CODES)

_owner: int | None = None  # the pid that installed the handler; a forked child is not it
_quiet = False  # a batch worker leaves the one line to the command
_cleanups: list[Callable[[], None]] = []
_left = "output folders already in place are complete"  # what an interrupted command leaves


def exit_code(signum: int) -> int:
    return EXIT_CODES.get(signum, 128 + signum)


def line(signum: int) -> str:
    return f"error: interrupted by {signal.Signals(signum).name}; {_left}"


def leaves(text: str) -> None:
    """Say what this command leaves behind when interrupted (the end of the one line)."""
    global _left
    _left = text


def install(quiet: bool = False) -> None:
    """Handle SIGINT and SIGTERM in this process (call first thing in the main thread)."""
    global _owner, _quiet
    _owner, _quiet = os.getpid(), quiet
    _cleanups.clear()
    for sig in _SIGNALS:
        signal.signal(sig, _handler)


def installed() -> bool:
    return _owner == os.getpid()


def forked_child() -> None:
    """In a forked child: leave at once on a signal, silently, touching nothing of the parent."""
    global _owner, _quiet
    parent = _owner
    _owner, _quiet = os.getpid(), True
    _cleanups.clear()
    with contextlib.suppress(ValueError, OSError, AttributeError):
        signal.pthread_sigmask(signal.SIG_UNBLOCK, _SIGNALS)  # forked inside held()
    die_with_parent()
    if parent is not None and os.getppid() != parent:  # the parent died before we asked
        os._exit(143)


def die_with_parent() -> None:
    """Ask Linux to send SIGTERM here when the parent dies, however it dies (prctl PR_SET_PDEATHSIG)."""
    try:
        import ctypes

        ctypes.CDLL(None, use_errno=True).prctl(1, int(signal.SIGTERM), 0, 0, 0)
    except (OSError, AttributeError):  # not Linux: the parent's clean-up stops us instead
        pass


def register(cleanup: Callable[[], None]) -> None:
    """Run ``cleanup`` if a signal ends the process before :func:`unregister`."""
    _cleanups.append(cleanup)


def unregister(cleanup: Callable[[], None]) -> None:
    with contextlib.suppress(ValueError):
        _cleanups.remove(cleanup)


@contextlib.contextmanager
def on_interrupt(cleanup: Callable[[], None]) -> Iterator[None]:
    """Run ``cleanup`` if a signal ends the process inside the block."""
    register(cleanup)
    try:
        yield
    finally:
        unregister(cleanup)


def _handler(signum, frame) -> None:
    if _owner != os.getpid():  # a forked child that inherited the handler
        os._exit(exit_code(signum))
    for sig in _SIGNALS:  # a second Ctrl-C must not cut the clean-up short
        signal.signal(sig, signal.SIG_IGN)
    for cleanup in reversed(_cleanups):
        try:
            cleanup()
        except BaseException:  # noqa: BLE001 - leaving anyway; the next build clears leftovers
            pass
    if not _quiet:
        with contextlib.suppress(OSError, ValueError):
            sys.stderr.write(line(signum) + "\n")
            sys.stderr.flush()
    os._exit(exit_code(signum))


@contextlib.contextmanager
def held() -> Iterator[None]:
    """Hold SIGINT/SIGTERM inside the block; one that came meanwhile is acted on at its end."""
    try:
        old = signal.pthread_sigmask(signal.SIG_BLOCK, _SIGNALS)
    except (ValueError, OSError, AttributeError):
        yield
        return
    try:
        yield
    finally:
        signal.pthread_sigmask(signal.SIG_SETMASK, old)


class Stopped(Exception):
    """Raised by a signal inside :func:`raising`."""

    def __init__(self, signum: int):
        super().__init__(signal.Signals(signum).name)
        self.signum = signum


@contextlib.contextmanager
def raising() -> Iterator[None]:
    """Inside the block a SIGINT/SIGTERM raises :class:`Stopped` instead of ending the
    process: only for plain waiting (no CAD code loading, nothing to clean up), such as a
    watch between builds. Main thread only."""
    def _raise(signum, frame):
        raise Stopped(signum)

    old = {sig: signal.signal(sig, _raise) for sig in _SIGNALS}
    try:
        yield
    finally:
        for sig, handler in old.items():
            signal.signal(sig, handler)


def stop_processes(pids: list[int], grace_s: float = 3.0) -> None:
    """SIGTERM each process, wait up to ``grace_s`` for all, then SIGKILL what is left."""
    import time

    for pid in pids:
        with contextlib.suppress(OSError):
            os.kill(pid, signal.SIGTERM)
    deadline = time.monotonic() + grace_s
    alive = list(pids)
    while alive and time.monotonic() < deadline:
        still = []
        for pid in alive:
            try:
                done, _ = os.waitpid(pid, os.WNOHANG)
            except ChildProcessError:
                done = pid
            if not done:
                still.append(pid)
        alive = still
        if alive:
            time.sleep(0.02)
    for pid in alive:
        with contextlib.suppress(OSError):
            os.kill(pid, signal.SIGKILL)
        with contextlib.suppress(OSError):
            os.waitpid(pid, 0)
