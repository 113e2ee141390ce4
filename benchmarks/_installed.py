"""Time child processes as they run on a user's machine: with the package's bytecode written.

Some machines (this project's CI among them) set ``PYTHONDONTWRITEBYTECODE``, so every
child would compile the whole package from source again (about 0.1-0.15 s here) where a
user's checkout reuses ``__pycache__`` after its first run. Benchmark support only.
"""

from __future__ import annotations

import compileall
import os
import pathlib

ROOT = pathlib.Path(__file__).resolve().parents[1]


def as_installed() -> None:
    """Write the package's bytecode once and let the children use it."""
    os.environ.pop("PYTHONDONTWRITEBYTECODE", None)
    compileall.compile_dir(ROOT / "generators", quiet=1)
