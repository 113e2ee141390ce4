"""Run the build writers, the plan-only ones in a forked child beside the CAD ones.

The drawings need only the plan, so on a machine with two or more cores they are made
while the parent imports the CAD kernel and cuts the solid; the child is joined before
the first writer that reads what it wrote (the report).
"""

from __future__ import annotations

import importlib
import multiprocessing
import os
import threading
import traceback

from generators import signals
from generators.errors import UserError

# Writers that read only the plan and the config (never a file another writer made).
BESIDE_CAD = frozenset({"generators.drawings.writer:write_templates",
                        "generators.drawings.sleeve:write_sleeve_templates",
                        "generators.report.frame_png:write_frame_png"})


def call(spec: str, ctx) -> None:
    module, func = spec.split(":")
    getattr(importlib.import_module(module), func)(ctx)


def _child_main(specs, ctx, conn) -> None:
    signals.forked_child()  # a signal ends this child at once; the parent cleans up
    try:
        mark_m, mark_s = set(ctx.manifest), len(ctx.summary)
        for spec in specs:
            call(spec, ctx)
        delta = {k: v for k, v in ctx.manifest.items() if k not in mark_m}
        conn.send(("ok", delta, ctx.summary[mark_s:]))
    except UserError as exc:
        conn.send(("user", type(exc).__name__, exc.key, exc.problem, exc.accepted))
    except BaseException as exc:  # noqa: BLE001 - reported to the parent as one line
        conn.send(("crash", f"{type(exc).__name__}: {exc}", traceback.format_exc()))
    finally:
        conn.close()


def _can_fork() -> bool:
    return ("fork" in multiprocessing.get_all_start_methods() and (os.cpu_count() or 1) > 1
            and threading.active_count() == 1 and not os.environ.get("HUBWRIGHT_SERIAL"))


class _Child:
    def __init__(self, specs: list[str], ctx):
        mp = multiprocessing.get_context("fork")
        self.conn, child_conn = mp.Pipe(duplex=False)
        self.proc = mp.Process(target=_child_main, args=(specs, ctx, child_conn), daemon=True)
        with signals.held():  # no signal between the fork and the clean-up that stops the child
            self.proc.start()
            signals.register(self._kill)
        child_conn.close()

    def _kill(self) -> None:
        signals.stop_processes([self.proc.pid], grace_s=1.0)

    def join_into(self, ctx) -> None:
        try:
            message = self.conn.recv()
        except EOFError:
            message = ("crash", "the drawing worker stopped without a word", "")
        self.proc.join()
        signals.unregister(self._kill)
        if message[0] == "ok":
            ctx.manifest.update(message[1])
            ctx.summary.extend(message[2])
            return
        if message[0] == "user":
            import generators.errors as errors

            cls = getattr(errors, message[1], UserError)
            raise cls(message[2], message[3], message[4])
        raise RuntimeError(message[1])

    def stop(self) -> None:
        if self.proc.is_alive():
            self.proc.terminate()
            self.proc.join(5)
        if self.proc.is_alive():
            self.proc.kill()
            self.proc.join(5)
        signals.unregister(self._kill)


def run_writers(writers: tuple[str, ...], ctx) -> None:
    """Call every writer in order; the BESIDE_CAD ones may run early in a child."""
    early = [s for s in writers if s in BESIDE_CAD]
    child = _Child(early, ctx) if early and _can_fork() else None
    seen_early = False
    try:
        for spec in writers:
            if spec in BESIDE_CAD and child is not None:
                seen_early = True
                continue
            if child is not None and seen_early:
                child.join_into(ctx)
                child = None
            call(spec, ctx)
        if child is not None:
            child.join_into(ctx)
            child = None
    finally:
        if child is not None:
            child.stop()


