"""Small config builders for the reducer and cut-list tests (plain dicts, parsed like TOML)."""

from __future__ import annotations

import copy

from generators.config.load import parse_config

BASE = {
    "name": "sleeve-test",
    "units": "mm",
    "mast": {"size": "50 mm", "clearance": 1.0},
    "hub": {"style": "block", "across_flats": 160, "thickness": 46, "corner_chamfer": 12,
            "material": "pom", "process": "machined"},
    "spreaders": {"count": 6, "diameter": 20, "fit": 0.5, "elevation": 0,
                  "socket_depth": "to-bore", "tip_radius": 2750, "tip_allowance": 30},
}


def config(**sections):
    """BASE with sections replaced or updated: ``config(hub={"bore": 55})``."""
    data = copy.deepcopy(BASE)
    for key, value in sections.items():
        if isinstance(value, dict) and isinstance(data.get(key), dict):
            data[key].update(value)
        else:
            data[key] = value
    return parse_config(data)


def toml_text(data: dict) -> str:
    """A tiny TOML writer for the flat configs above (tables of scalars, arrays of tables)."""
    def scalar(v):
        if isinstance(v, bool):
            return "true" if v else "false"
        if isinstance(v, str):
            return '"' + v.replace('"', '\\"') + '"'
        return repr(v)

    lines = [f"{k} = {scalar(v)}" for k, v in data.items() if not isinstance(v, (dict, list))]
    for k, v in data.items():
        if isinstance(v, dict):
            lines.append(f"[{k}]")
            lines += [f"{kk} = {scalar(vv)}" for kk, vv in v.items()]
        elif isinstance(v, list):
            for item in v:
                lines.append(f"[[{k}]]")
                lines += [f"{kk} = {scalar(vv)}" for kk, vv in item.items()]
    return "\n".join(lines) + "\n"
