"""Run the build writers, the plan-only ones in forked children beside the CAD ones.

The drawings need only the plan, so on a machine with two or more cores they are made
while the parent imports the CAD kernel and cuts the solid: the template PDF in one child,
the DXF sheets and the sleeve templates in another (the PDF is the longest job, so the
rest must not wait behind it). The children are joined before the first writer that reads
what they wrote (the report), and what each writer added is merged in the writers' order,
so the manifest is the same as when every writer runs in this process.
"""

from __future__ import annotations

import importlib
import multiprocessing
import os
import threading
import traceback

from generators import signals
from generators.errors import UserError

# Writers that read only the plan and the config (never a file another writer made), in
# the groups that share a forked child.
CHILD_GROUPS = (("generators.drawings.writer:write_template_pdf",
                 "generators.report.frame_png:write_frame_png"),
                ("generators.drawings.writer:write_template_dxf",
                 "generators.drawings.plate_dxf:write_plate_dxf",
                 "generators.drawings.sleeve:write_sleeve_templates"))
BESIDE_CAD = frozenset(spec for group in CHILD_GROUPS for spec in group)


def call(spec: str, ctx) -> None:
    module, func = spec.split(":")
    getattr(importlib.import_module(module), func)(ctx)


def _child_main(specs, ctx, conn) -> None:
    signals.forked_child()  # a signal ends this child at once; the parent cleans up
    try:
        done = {}
        for spec in specs:  # what each writer added, to be merged in the writers' order
            mark_m, mark_s = set(ctx.manifest), len(ctx.summary)
            call(spec, ctx)
            done[spec] = ({k: v for k, v in ctx.manifest.items() if k not in mark_m}, ctx.summary[mark_s:])
        conn.send(("ok", done))
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

    def join_into(self, ctx) -> dict:
        """Wait for the child; what each of its writers added (spec -> (manifest, summary))."""
        try:
            message = self.conn.recv()
        except EOFError:
            message = ("crash", "the drawing worker stopped without a word", "")
        self.proc.join()
        signals.unregister(self._kill)
        if message[0] == "ok":
            return message[1]
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


def _merge(writers, done: dict, ctx) -> None:
    for spec in writers:
        if spec in done:
            manifest, summary = done[spec]
            ctx.manifest.update(manifest)
            ctx.summary.extend(summary)


def run_writers(writers: tuple[str, ...], ctx) -> None:
    """Call every writer in order; the BESIDE_CAD ones may run early in children."""
    early = [s for s in writers if s in BESIDE_CAD]
    children: list[_Child] = []
    try:
        if early and _can_fork():
            for group in CHILD_GROUPS:
                specs = [s for s in early if s in group]
                if specs:
                    children.append(_Child(specs, ctx))
        seen_early = False
        for spec in writers:
            if spec in BESIDE_CAD and children:
                seen_early = True
                continue
            if children and seen_early:
                _join_all(children, writers, ctx)
            call(spec, ctx)
        if children:
            _join_all(children, writers, ctx)
    finally:
        for child in children:
            child.stop()


def _join_all(children: list, writers, ctx) -> None:
    """Join every child (each one's error raised after all have ended) and merge in order."""
    done: dict = {}
    error = None
    while children:
        child = children.pop(0)
        try:
            done.update(child.join_into(ctx))
        except BaseException as exc:  # noqa: BLE001 - the others are stopped in run_writers
            error = error or exc
            for other in children:
                other.stop()
            children.clear()
    if error is not None:
        raise error
    _merge(writers, done, ctx)
