"""Judging several sizing points at once, on every core.

The workers are forked from the sizing process when it first asks for several points, so
after its imports (nothing is loaded again), and judge one point per task with the same
``Space`` code: a result is the same whichever process made it. They ignore SIGINT (the
command's handler stops the pool and ends the run) and die with the parent however it
dies. Where fork is not available, or there is one core, points are judged one after
another.
"""

from __future__ import annotations

import contextlib
import os
import signal
import time
from multiprocessing import get_all_start_methods, get_context

LEAVE_S = 10.0  # how long a worker has to leave a closed pool before it is killed


def cores() -> int:
    try:
        return len(os.sched_getaffinity(0))
    except AttributeError:  # not on every platform
        return os.cpu_count() or 1


def _worker() -> None:
    from threadpoolctl import threadpool_limits

    from generators import signals

    signals.forked_child()
    signal.signal(signal.SIGINT, signal.SIG_IGN)
    # a judge keeps nothing worth cleaning up: SIGTERM (the parent's death, through
    # PR_SET_PDEATHSIG) ends it in the kernel, even while it waits on the task queue's lock,
    # where a Python handler would never run (a worker the pool starts again just as the
    # command is interrupted would otherwise outlive it)
    signal.signal(signal.SIGTERM, signal.SIG_DFL)
    # numpy's BLAS would start a thread per core in every worker: one each is what is free
    threadpool_limits(limits=1)


def _judge(space, point: tuple[int, ...], full: bool):
    return space._evaluate(point, full)


class Judges:
    """Up to ``jobs`` forked workers (default and most: one per core; more would only share
    the cores and hold more memory), as a context manager."""

    def __init__(self, jobs: int | None = None):
        self.jobs = max(1, min(cores(), cores() if jobs is None else jobs))
        if "fork" not in get_all_start_methods():
            self.jobs = 1
        self.pool = None

    def __enter__(self) -> "Judges":
        return self

    def __exit__(self, *exc) -> None:
        self.stop()

    def _kill(self) -> None:
        """On a signal: end the workers at once (no locks taken; they die with us anyway)."""
        handler = getattr(self.pool, "_worker_handler", None)
        if handler is not None:  # the pool would start new workers in place of the killed
            handler._state = "TERMINATE"  # multiprocessing.pool.TERMINATE
        done: set[int] = set()
        for _ in range(3):  # and any it started just before it saw that
            procs = [p for p in list(getattr(self.pool, "_pool", ())) if p.pid not in done]
            for proc in procs:
                with contextlib.suppress(OSError, TypeError):
                    os.kill(proc.pid, signal.SIGKILL)
            for proc in procs:  # reaped here: no zombie is left for init to reap
                with contextlib.suppress(OSError, TypeError):
                    os.waitpid(proc.pid, 0)
                done.add(proc.pid)
            if not procs:
                break
            time.sleep(0.02)

    def stop(self) -> None:
        """Let the workers leave as a pool closes (each takes its end-of-work mark); one that
        has not left after ``LEAVE_S`` is killed. Not ``terminate``: its SIGTERM runs a Python
        handler, which a worker waiting on the task queue's lock may never get to run."""
        from generators import signals

        if self.pool is None:
            return
        signals.unregister(self._kill)
        pool, self.pool = self.pool, None
        workers = list(getattr(pool, "_pool", ()))
        pool.close()
        for proc in workers:
            proc.join(timeout=LEAVE_S)
        for proc in workers:
            if proc.is_alive():
                with contextlib.suppress(OSError):
                    os.kill(proc.pid, signal.SIGKILL)
        pool.join()

    @property
    def width(self) -> int:
        """How many points are worth judging at once."""
        return self.jobs

    def map(self, space, points: list[tuple[int, ...]], full: bool) -> list:
        """``space._evaluate`` of each point, in the workers (the space goes without its cache)."""
        from generators import signals

        if self.pool is None:
            self.pool = get_context("fork").Pool(self.jobs, initializer=_worker)
            signals.register(self._kill)
        return self.pool.starmap(_judge, [(space, p, full) for p in points], chunksize=1)
