"""The ``hubwright`` command line: parse, call the library, print, map errors to exit codes.

Exit codes: 0 ok, 1 a design rule failed, 2 bad input or an unbuildable design.
"""

from __future__ import annotations

import argparse
import importlib
import os
import sys

# numpy's BLAS would start a thread per core for the many small products of the wall
# measurer; on a busy machine they wait on each other (several times slower): one will do
os.environ.setdefault("OPENBLAS_NUM_THREADS", "1")

from generators import __version__, signals
from generators.errors import UserError

COMMANDS = {
    "threads": ("generators.commands.threads", "tap drills, clearance holes and nuts for threads"),
    "build": ("generators.commands.build", "make the hub's solids, templates, manifest and report"),
    "check": ("generators.commands.check", "run the design rules and the wind-load estimate"),
    "size": ("generators.commands.size", "find the lightest hub that passes every rule"),
}

CAUTION = ("Masts and antennas can kill: keep clear of power lines, follow local codes and the "
           "mast maker's ratings.")


def parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="hubwright",
        description="Centre hubs for spreader-type wire beams: solids, drill templates, "
                    "tap-drill tables, cut lists and checks from one TOML file.",
        epilog=CAUTION)
    p.add_argument("--version", action="version", version=f"hubwright {__version__}")
    sub = p.add_subparsers(dest="command", metavar="COMMAND")
    for name, (module, help_text) in COMMANDS.items():
        sp = sub.add_parser(name, help=help_text, description=help_text[0].upper() + help_text[1:] + ".")
        sp.set_defaults(_module=module)
        # argument setup is cheap; only ``run`` imports heavy things
        importlib.import_module(module).add_arguments(sp)
    return p


# the end of the interrupted line, for commands that write no output folder
LEAVES = {"check": "nothing was written", "threads": "nothing was written",
          "size": "a sized file is only ever written whole"}


def main(argv: list[str] | None = None) -> int:
    import threading

    if threading.current_thread() is threading.main_thread():
        signals.install()  # SIGINT/SIGTERM: one line, exit 130/143, no process left behind
    p = parser()
    argv = sys.argv[1:] if argv is None else argv
    try:
        args = p.parse_args(argv)
    except SystemExit as exc:  # argparse already printed its one-line usage error
        return 0 if exc.code in (0, None) else 2
    if not getattr(args, "command", None):
        p.print_help()
        return 2
    if args.command in LEAVES:
        signals.leaves(LEAVES[args.command])
    try:
        return importlib.import_module(args._module).run(args)
    except UserError as exc:
        print(f"error: {exc.line()}", file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:  # only where the handler could not be installed
        print(signals.line(2), file=sys.stderr)
        return 130
    except BrokenPipeError:
        return 0
    except Exception as exc:  # noqa: BLE001 - one line for any bug, never a traceback
        print(f"error: internal error ({type(exc).__name__}: {exc}); please report it with the config",
              file=sys.stderr)
        return 3
