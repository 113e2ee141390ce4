"""The one exception type for a user's mistake, carrying the config key path."""

from __future__ import annotations

import difflib
from collections.abc import Iterable


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
        return " ".join(text.split())


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
