"""Where the bundled demo configs live."""

from __future__ import annotations

from pathlib import Path

from generators.errors import UserError

METRIC_DEMO = "six-spreader-portable.toml"


def configs_folder() -> Path | None:
    """``configs/`` in the working folder, else beside the package (a source checkout)."""
    for base in (Path.cwd(), Path(__file__).resolve().parents[1]):
        folder = base / "configs"
        if (folder / METRIC_DEMO).is_file():
            return folder
    return None


def default_config() -> Path:
    folder = configs_folder()
    if folder is None:
        raise UserError("CONFIG", "no config given and the bundled demos are not here",
                        f"a config path, or run from the hubwright folder (configs/{METRIC_DEMO})")
    return folder / METRIC_DEMO
