"""Config strings made safe to copy into reports: no control characters, Markdown escaped."""

from __future__ import annotations

import re
from typing import Any

# C0 controls except tab and newline, DEL and the C1 controls (ESC sequences, NUL...).
_CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f-\x9f]")
# Characters that start Markdown or inline HTML (CommonMark "ASCII punctuation" escapes).
_MARKDOWN = re.compile(r"([\\`*_{}\[\]()<>#+\-!|~&])")


def strip_controls(text: str) -> str:
    """``text`` without control characters (a carriage return of a CRLF line end included)."""
    return _CONTROL.sub("", text)


def clean_strings(data: Any) -> Any:
    """The parsed TOML with control characters removed from every string, keys included."""
    if isinstance(data, str):
        return strip_controls(data)
    if isinstance(data, dict):
        return {clean_strings(k): clean_strings(v) for k, v in data.items()}
    if isinstance(data, list):
        return [clean_strings(v) for v in data]
    return data


def markdown_text(text: str) -> str:
    """Plain text shown literally by any CommonMark renderer (one paragraph, escaped)."""
    lines = [line.strip() for line in strip_controls(text).splitlines()]
    return _MARKDOWN.sub(r"\\\1", " ".join(line for line in lines if line))
