"""``hubwright build [CONFIG ...] [--out DIR] [--mast SIZE ...] [--force]``."""

from __future__ import annotations

import argparse

from generators.demos import default_config


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("configs", nargs="*", metavar="CONFIG",
                   help="config file(s); with none, the bundled metric demo")
    p.add_argument("--out", metavar="DIR", default=None, help="output folder (default: out/)")
    p.add_argument("--mast", metavar="SIZE", action="append", default=[],
                   help="also make a reducer sleeve for this mast (repeatable)")
    p.add_argument("--force", action="store_true", help="write even when a design rule fails")


def build_checked(config_path, out=None, masts=(), force=False):
    """Plan the hub and every sleeve first (refusals before any file), then build."""
    from generators.build import build_config
    from generators.config import load_config
    from generators.plan.hub import build_plan
    from generators.plan.reducer import plan_sleeves
    from pathlib import Path

    cfg = load_config(config_path)
    plan_sleeves(cfg, build_plan(cfg), tuple(masts))
    return build_config(cfg, out, config_path=Path(config_path), masts=tuple(masts), force=force)


def run(args: argparse.Namespace) -> int:
    from generators.report.summary import summary_lines

    configs = args.configs or [str(default_config())]
    if len(configs) > 1:
        from generators.batch import build_many

        return build_many(configs, args)
    result = build_checked(configs[0], args.out, masts=tuple(args.mast), force=args.force)
    for line in summary_lines(result):
        print(line)
    return 0
