"""Write the sized config, ``<name>.sized.toml`` beside the original, ready for ``build``.

The file is the original's TOML data with the varied values (in the config's units) and the
name ``<name>-sized``, so building it never replaces the original's output folder. It is
written only when it is new or carries this writer's first line (never the config itself,
never a file someone else wrote), through a temporary file moved into place. Comments of
the original are not carried over.
"""

from __future__ import annotations

import os
import tempfile
import tomllib
from pathlib import Path

import tomli_w

from generators.config.load import parse_config
from generators.errors import UserError

MARKER = "# hubwright size: a sized copy of "
NAME_LIMIT = 64  # Config.name max_length


def target_for(config: Path) -> Path:
    return config.with_name(config.name.removesuffix(".toml") + ".sized.toml")


def sized_name(name: str) -> str:
    return (name[: NAME_LIMIT - len("-sized")] + "-sized") if not name.endswith("-sized") else name


def check_target(config: Path, target: Path) -> None:
    """Refuse (exit 2) a target that is the config itself or a file this writer did not write."""
    if target.resolve() == config.resolve():
        raise UserError(str(target), "is the config itself", "size never overwrites its input")
    if target.is_dir():
        raise UserError(str(target), "is a folder", "move it away; size writes a file of that name")
    if target.exists():
        try:
            first = target.read_text(encoding="utf-8").split("\n", 1)[0]
        except (OSError, UnicodeDecodeError):
            first = ""
        if not first.startswith(MARKER):
            raise UserError(str(target), "exists and was not written by hubwright size",
                            "move or rename it; a file size wrote before is replaced")


def text(data: dict, config: Path, summary: list[str]) -> str:
    head = [MARKER + config.name, "# Only the varied dimensions differ from the original; its comments are not kept."]
    head += [f"# {line}" for line in summary]
    head.append("# An estimate, not a certification: follow local codes and licensed practice.")
    return "\n".join(head) + "\n\n" + tomli_w.dumps(data)


def write_sized(data: dict, config: Path, summary: list[str]) -> Path:
    """Write the sized config and read it back through the loader; returns its path."""
    target = target_for(config)
    check_target(config, target)
    data = dict(data, name=sized_name(str(data["name"])))
    body = text(data, config, summary)
    parse_config(tomllib.loads(body))  # what was written loads as a config
    from generators import signals

    with signals.held():  # a signal here would end the process with the temporary file left
        fd, tmp = tempfile.mkstemp(prefix=".sized-", suffix=".toml", dir=target.parent)
        try:
            with os.fdopen(fd, "w", encoding="utf-8") as fh:
                fh.write(body)
            os.replace(tmp, target)
        except BaseException:
            Path(tmp).unlink(missing_ok=True)
            raise
    return target
