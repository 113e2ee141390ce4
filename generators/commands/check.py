"""``hubwright check [CONFIG] [--json]``: design rules and wind loads, without solids."""

from __future__ import annotations

import argparse


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("config", nargs="?", metavar="CONFIG", help="config file (default: the metric demo)")
    p.add_argument("--json", action="store_true", help="print the results as JSON")


def run(args: argparse.Namespace) -> int:
    from generators.errors import UserError

    raise UserError("check", "the design-rule checks are not built yet")
