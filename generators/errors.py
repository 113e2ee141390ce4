"""The one exception type for a user's mistake, carrying the config key path."""

from __future__ import annotations

import difflib
import re
from collections.abc import Iterable

# Numbers echoed back in a message keep at most this many significant digits.
MAX_DIGITS = 15
_LONG_NUMBER = re.compile(r"\d[\d_]*(?:\.\d*)?(?:[eE][+-]?\d+)?")
_CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f-\x9f]")


def _short_number(m: re.Match) -> str:
    text = m.group(0)
    if sum(c.isdigit() for c in text.split("e")[0].split("E")[0]) <= MAX_DIGITS:
        return text
    try:
        value = float(text.replace("_", ""))
    except ValueError:
        value = float("inf")
    if value != float("inf") and len(text.split(".")[0]) <= MAX_DIGITS:
        return f"{value:.{MAX_DIGITS}g}"
    digits = [c for c in text if c.isdigit()]
    return "".join(digits[:MAX_DIGITS]) + f"...({len(digits)} digits)"


def tidy(text: str) -> str:
    """Text safe to echo on one line: no control characters, no endless numbers."""
    return _LONG_NUMBER.sub(_short_number, _CONTROL.sub("?", str(text)))


class UserError(Exception):
    """Bad input or an unbuildable design: the CLI prints one line and exits 2.

    Args:
        key: dotted config key path (``"spreaders.count"``) or a command-line name.
        problem: what is wrong, in a few words.
        accepted: what would be accepted instead (optional).
    """

    exit_code = 2

    def __init__(self, key: str, problem: str, accepted: str | None = None):
        self.key = key
        self.problem = problem
        self.accepted = accepted
        super().__init__(self.line())

    def line(self) -> str:
        text = f"{self.key}: {self.problem}" if self.key else self.problem
        if self.accepted:
            text += f" ({self.accepted})"
        return " ".join(tidy(text).split())


def did_you_mean(word: str, choices: Iterable[str], n: int = 3) -> str:
    """A short ``did you mean 'x'?`` clause, or an empty string."""
    close = difflib.get_close_matches(word, list(choices), n=n, cutoff=0.6)
    if not close:
        return ""
    return "did you mean " + " or ".join(f"'{c}'" for c in close) + "?"


class KernelError(UserError):
    """The CAD kernel failed on a feature of a design the plan accepted (a bug to report)."""


class DesignRuleError(UserError):
    """A design rule of ``hubwright check`` failed, so ``build`` wrote nothing (exit 1)."""

    exit_code = 1
