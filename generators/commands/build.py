"""``hubwright build [CONFIG ...] [--out DIR] [--mast SIZE ...] [--force]``."""

from __future__ import annotations

import argparse

from generators.demos import default_config
from generators.errors import UserError


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("configs", nargs="*", metavar="CONFIG",
                   help="config file(s); with none, the bundled metric demo")
    p.add_argument("--out", metavar="DIR", default=None, help="output folder (default: out/)")
    p.add_argument("--mast", metavar="SIZE", action="append", default=[],
                   help="also make a reducer sleeve for this mast (repeatable)")
    p.add_argument("--force", action="store_true", help="write even when a design rule fails")
    p.add_argument("--watch", action="store_true",
                   help="one CONFIG: build, then rebuild each time the file changes (Ctrl-C to stop)")


def build_checked(config_path, out=None, masts=(), force=False):
    """Plan the hub and every sleeve first (refusals before any file), then build."""
    from generators.build import build_with_masts

    return build_with_masts(config_path, out, masts=tuple(masts), force=force)


def _check_out(out: str | None) -> None:
    if out is not None and not out.strip():
        raise UserError("--out", "is empty", "a folder path; leave --out out to write into out/")
    if out is not None and "\0" in out:
        raise UserError("--out", "contains a NUL character", "a folder path")


def _print_batch(results) -> None:
    from generators.report.summary import CAUTION

    ok = [r for r in results if r.code == 0]
    failed = [r for r in results if r.code != 0]
    for r in ok:
        print(f"ok     {r.config}")
        for line in r.lines:
            print(f"  {line}")
    for r in failed:
        print(f"failed {r.config}: {r.error}")
    print(f"batch: {len(ok)} built, {len(failed)} failed of {len(results)}")
    print(CAUTION)


def run_batch(configs: list[str], args: argparse.Namespace) -> int:
    from rich.console import Console
    from rich.progress import BarColumn, MofNCompleteColumn, Progress, TextColumn, TimeElapsedColumn

    from generators.batch import build_many, exit_status, unique_configs

    total = len(unique_configs(configs))
    with Progress(TextColumn("building"), BarColumn(), MofNCompleteColumn(), TimeElapsedColumn(),
                  TextColumn("{task.description}"), console=Console(stderr=True), transient=True) as bar:
        task = bar.add_task("", total=total)
        results = build_many(configs, args.out, tuple(args.mast or ()), bool(args.force),
                             on_result=lambda r: bar.update(task, advance=1, description=r.config))
    _print_batch(results)
    return exit_status(results)


def run(args: argparse.Namespace) -> int:
    from generators.report.summary import summary_lines

    _check_out(args.out)
    configs = args.configs or [str(default_config())]
    if getattr(args, "watch", False):
        if len(configs) != 1:
            raise UserError("--watch", f"given {len(configs)} configs", "exactly one CONFIG to watch")
        from generators.commands.watch_view import run_watch

        return run_watch(configs[0], args)
    if len(configs) > 1:
        return run_batch(configs, args)
    result = build_checked(configs[0], args.out, masts=tuple(args.mast), force=args.force)
    for line in summary_lines(result):
        print(line)
    return 0
