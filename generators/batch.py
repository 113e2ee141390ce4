"""Build several configs in parallel worker processes, with a progress bar on stderr.

One failing config never stops the others; each result gets a summary line and the
exit status is the worst one (0 all built, 2 bad input, 3 an internal error).
"""

from __future__ import annotations

import os
from concurrent.futures import ProcessPoolExecutor, as_completed
from dataclasses import dataclass, field
from multiprocessing import get_context


@dataclass
class BatchResult:
    config: str
    code: int  # 0 built, 2 user error, 3 internal error
    name: str = ""
    folder: str = ""
    lines: list[str] = field(default_factory=list)
    error: str = ""


def build_one(config: str, out: str | None, masts: tuple[str, ...], force: bool) -> BatchResult:
    """Build one config in a worker; every failure comes back as data, never raised."""
    from generators.commands.build import build_checked
    from generators.errors import UserError
    from generators.report.summary import summary_lines

    try:
        result = build_checked(config, out, masts=masts, force=force)
    except UserError as exc:
        return BatchResult(config, exc.exit_code, error=exc.line())
    except Exception as exc:  # noqa: BLE001 - reported per config, the batch goes on
        return BatchResult(config, 3, error=f"internal error ({type(exc).__name__}: {exc})")
    return BatchResult(config, 0, name=result.name, folder=str(result.folder),
                       lines=[ln for ln in summary_lines(result) if not ln.startswith("Caution:")])


def _duplicate_names(configs: list[str]) -> dict[str, str]:
    """Configs whose output name an earlier config in the batch already uses."""
    from generators.config import load_config
    from generators.errors import UserError

    first: dict[str, str] = {}
    clashes: dict[str, str] = {}
    for path in configs:
        try:
            name = load_config(path).name
        except UserError:
            continue  # the worker reports it
        if name in first:
            clashes[path] = (f"name: {name!r} is also built by {first[name]} in this batch"
                             " (give each config its own name)")
        else:
            first[name] = path
    return clashes


def workers_for(n_configs: int) -> int:
    return max(1, min(n_configs, os.cpu_count() or 1))


def build_many(configs: list[str], args) -> int:
    from rich.console import Console
    from rich.progress import BarColumn, MofNCompleteColumn, Progress, TextColumn, TimeElapsedColumn

    from generators.report.summary import CAUTION

    out, masts, force = args.out, tuple(getattr(args, "mast", ()) or ()), bool(getattr(args, "force", False))
    results: dict[str, BatchResult] = {}
    for path, problem in _duplicate_names(configs).items():
        results[path] = BatchResult(path, 2, error=problem)
    todo = [c for c in configs if c not in results]
    console = Console(stderr=True)
    with Progress(TextColumn("building"), BarColumn(), MofNCompleteColumn(), TimeElapsedColumn(),
                  TextColumn("{task.description}"), console=console, transient=True) as bar:
        task = bar.add_task("", total=len(configs), completed=len(results))
        if todo:
            # spawn, not fork: the progress bar runs a thread in this process
            with ProcessPoolExecutor(max_workers=workers_for(len(todo)), mp_context=get_context("spawn")) as pool:
                futures = {pool.submit(build_one, c, out, masts, force): c for c in todo}
                for fut in as_completed(futures):
                    path = futures[fut]
                    try:
                        results[path] = fut.result()
                    except Exception as exc:  # noqa: BLE001 - a worker died (killed, out of memory)
                        results[path] = BatchResult(path, 3, error=f"the worker stopped ({type(exc).__name__})")
                    bar.update(task, advance=1, description=path)
    ok = [results[c] for c in configs if results[c].code == 0]
    failed = [results[c] for c in configs if results[c].code != 0]
    for r in ok:
        print(f"ok     {r.config}")
        for line in r.lines:
            print(f"  {line}")
    for r in failed:
        print(f"failed {r.config}: {r.error}")
    print(f"batch: {len(ok)} built, {len(failed)} failed of {len(configs)}")
    print(CAUTION)
    return max((r.code for r in failed), default=0)
