"""A minimal TOML writer for test configs (tables, arrays of tables, scalars, arrays).

Checked on every call by reading the text back with the standard library's tomllib.
"""

from __future__ import annotations

import json
import tomllib


def _value(v) -> str:
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, (int, float)):
        return repr(v)
    if isinstance(v, str):
        return json.dumps(v)  # a JSON string is a valid TOML basic string for these
    if isinstance(v, (list, tuple)):
        return "[" + ", ".join(_value(x) for x in v) + "]"
    raise TypeError(f"cannot write {v!r} as TOML")


def _is_table_list(v) -> bool:
    return isinstance(v, list) and v and all(isinstance(x, dict) for x in v)


def dumps(data: dict) -> str:
    lines = [f"{k} = {_value(v)}" for k, v in data.items()
             if not isinstance(v, dict) and not _is_table_list(v)]
    for k, v in data.items():
        if isinstance(v, dict):
            lines.append(f"\n[{k}]")
            lines += [f"{kk} = {_value(vv)}" for kk, vv in v.items()]
        elif _is_table_list(v):
            for item in v:
                lines.append(f"\n[[{k}]]")
                lines += [f"{kk} = {_value(vv)}" for kk, vv in item.items()]
    text = "\n".join(lines) + "\n"
    assert tomllib.loads(text) == data, "tomlout wrote something tomllib reads differently"
    return text
