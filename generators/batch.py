"""Build several configs in parallel worker processes; every result comes back as data.

One failing config never stops the others. The workers are started once per batch and
take the configs from the pool's queue. Where the platform has it, they are forked from
a fork server that has already loaded the CAD, mesh and drawing libraries
(:data:`PRELOAD`), so no worker loads them again; elsewhere they are spawned (never
forked from the caller, which may run a progress-bar thread). They handle SIGINT/SIGTERM
like the command, die with it (PR_SET_PDEATHSIG, through the fork server) and are stopped
by it when it is interrupted.
"""

from __future__ import annotations

import os
from collections.abc import Callable
from concurrent.futures import ProcessPoolExecutor, as_completed
from dataclasses import dataclass, field
from multiprocessing import get_all_start_methods, get_context

from generators import signals

# Loaded once in the fork server, before it forks the workers (names, not imports: this
# module stays light). A name that fails to load is skipped; the worker loads it itself.
PRELOAD = ["cadquery", "trimesh", "numpy", "PIL.Image", "pypdfium2", "generators.build",
           "generators.cad.writer", "generators.cad.extras_writer", "generators.cad.reducer_writer",
           "generators.drawings.writer", "generators.drawings.pdf", "generators.drawings.sleeve",
           "generators.drawings.jig_dxf", "generators.report.writer", "generators.report.preview",
           "generators.report.cutlist_writer", "generators.report.summary"]


@dataclass
class BatchResult:
    config: str
    code: int  # 0 built, 1 a design rule failed, 2 user error, 3 internal error
    name: str = ""
    folder: str = ""
    lines: list[str] = field(default_factory=list)
    error: str = ""


def build_one(config: str, out: str | None, masts: tuple[str, ...], force: bool) -> BatchResult:
    """Build one config; every failure comes back as data, never raised."""
    from generators.errors import UserError

    try:
        from generators.build import build_with_masts
        from generators.report.summary import summary_lines

        result = build_with_masts(config, out, masts=masts, force=force)
        lines = [ln for ln in summary_lines(result) if not ln.startswith("Caution:")]
    except UserError as exc:
        return BatchResult(config, exc.exit_code, error=exc.line())
    except Exception as exc:  # noqa: BLE001 - reported per config, the batch goes on
        return BatchResult(config, 3, error=f"internal error ({type(exc).__name__}: {exc})")
    return BatchResult(config, 0, name=result.name, folder=str(result.folder), lines=lines)


def _worker_start() -> None:
    signals.install(quiet=True)  # the command prints the one line
    signals.die_with_parent()


def unique_configs(configs: list[str]) -> list[str]:
    """The configs in order, each file once (the same file named twice is built once)."""
    seen: set[str] = set()
    out = []
    for path in configs:
        try:
            key = os.path.realpath(path)
        except (OSError, ValueError):
            key = path
        if key not in seen:
            seen.add(key)
            out.append(path)
    return out


def _name_of(path: str) -> str | None:
    from generators.config import load_config
    from generators.errors import UserError

    try:
        return load_config(path).name
    except UserError:
        return None  # the worker reports it
    except Exception:  # noqa: BLE001 - likewise: one config's bug never stops the batch
        return None


def duplicate_names(configs: list[str]) -> dict[str, str]:
    """Configs whose output name an earlier config in the batch already uses, with the problem."""
    first: dict[str, str] = {}
    clashes: dict[str, str] = {}
    for path in configs:
        name = _name_of(path)
        if name is None:
            continue
        if name in first:
            clashes[path] = (f"name: {name!r} is also built by {first[name]} in this batch"
                             " (give each config its own name)")
        else:
            first[name] = path
    return clashes


def workers_for(n_configs: int) -> int:
    return max(1, min(n_configs, os.cpu_count() or 1))


def pool_context():
    """A fork server with the libraries loaded where the platform has one, else spawn."""
    if "forkserver" in get_all_start_methods() and not os.environ.get("HUBWRIGHT_SPAWN"):
        ctx = get_context("forkserver")
        ctx.set_forkserver_preload(PRELOAD)
        return ctx
    return get_context("spawn")


def _helper_pids() -> list[int]:
    """The fork server's and the resource tracker's pids: they would outlive an interrupt."""
    from multiprocessing import forkserver, resource_tracker

    pids = []
    for obj, attr in ((getattr(forkserver, "_forkserver", None), "_forkserver_pid"),
                      (getattr(resource_tracker, "_resource_tracker", None), "_pid")):
        pid = getattr(obj, attr, None)
        if pid:
            pids.append(pid)
    return pids


def build_many(configs: list[str], out: str | None = None, masts: tuple[str, ...] = (), force: bool = False,
               on_result: Callable[[BatchResult], None] | None = None) -> list[BatchResult]:
    """Build each config once, in parallel; the results in the order of ``configs``."""
    configs = unique_configs(configs)
    results: dict[str, BatchResult] = {p: BatchResult(p, 2, error=problem)
                                       for p, problem in duplicate_names(configs).items()}
    for r in results.values():
        if on_result:
            on_result(r)
    todo = [c for c in configs if c not in results]
    if todo:
        pool = ProcessPoolExecutor(max_workers=workers_for(len(todo)), mp_context=pool_context(),
                                   initializer=_worker_start)

        def stop_workers() -> None:
            signals.stop_processes(list(getattr(pool, "_processes", None) or {}))
            signals.stop_processes(_helper_pids(), grace_s=0.0)

        with signals.on_interrupt(stop_workers), pool:
            futures = {pool.submit(build_one, c, out, masts, force): c for c in todo}
            for fut in as_completed(futures):
                path = futures[fut]
                try:
                    results[path] = fut.result()
                except Exception as exc:  # noqa: BLE001 - a worker died (killed, out of memory)
                    results[path] = BatchResult(path, 3, error=f"the worker stopped ({type(exc).__name__})")
                if on_result:
                    on_result(results[path])
    return [results[c] for c in configs]


def exit_status(results: list[BatchResult]) -> int:
    """The worst status of the batch (0 when every config was built)."""
    return max((r.code for r in results), default=0)
