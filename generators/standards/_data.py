"""Read the packaged CSV tables once, turning numeric cells into floats (never eval)."""

from __future__ import annotations

import csv
import functools
import importlib.resources
import re

_NUMBER = re.compile(r"^-?(?:\d+\.?\d*|\.\d+)$")


def _cell(text: str):
    text = text.strip()
    if text == "":
        return None
    if _NUMBER.match(text):
        return float(text)
    return text


@functools.cache
def table(name: str) -> tuple[dict, ...]:
    """Rows of ``data/<name>`` as dicts; numeric cells are floats, empty cells None."""
    text = (importlib.resources.files("generators.standards") / "data" / name).read_text("utf-8")
    reader = csv.DictReader(text.splitlines())
    return tuple({k: _cell(v) for k, v in row.items()} for row in reader)
