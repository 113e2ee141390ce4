"""Read a TOML config and turn every problem into one ``UserError`` line."""

from __future__ import annotations

import tomllib
from pathlib import Path
from typing import Any

from pydantic import BaseModel, ValidationError

from generators.config.fields import field_kind
from generators.config.limits import range_problem
from generators.config.models import Config
from generators.config.text import clean_strings
from generators.errors import UserError, did_you_mean


def load_config(path: str | Path) -> Config:
    """Load and validate a config file."""
    path = Path(path)
    if path.is_dir():
        raise UserError(str(path), "is a folder, not a config file", "a .toml file")
    try:
        raw = path.read_bytes()
    except FileNotFoundError:
        raise UserError(str(path), "no such config file") from None
    except OSError as exc:
        raise UserError(str(path), f"cannot read the config ({exc.strerror})") from None
    try:
        text = raw.decode("utf-8").removeprefix("\ufeff")  # a byte-order mark is harmless
    except UnicodeDecodeError as exc:
        line = raw[: exc.start].count(b"\n") + 1
        raise UserError(f"{path.name}:{line}", "the file is not UTF-8 text",
                        "save the config as UTF-8") from None
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise UserError(path.name, f"not valid TOML: {exc}", "see https://toml.io") from None
    return parse_config(data)


def parse_config(data: dict[str, Any]) -> Config:
    """Validate already-parsed TOML data."""
    data = clean_strings(data)
    units = data.get("units", "mm")
    if units not in ("mm", "in"):
        raise UserError("units", f"{units!r} is not a unit system", '"mm" or "in"')
    try:
        return Config.model_validate(data, context={"units": units})
    except ValidationError as exc:
        raise _user_error(exc, units) from None


def _key(loc: tuple) -> str:
    text = ""
    for part in loc:
        if isinstance(part, int):
            text += f"[{part}]"
        else:
            text += ("." if text else "") + str(part)
    return text


def _model_at(loc: tuple) -> type[BaseModel] | None:
    """The model class that owns the last element of ``loc``."""
    model: Any = Config
    for part in loc[:-1]:
        if isinstance(part, int):
            continue
        field = model.model_fields.get(part)
        if field is None:
            return None
        model = _model_in(field.annotation)
        if model is None:
            return None
    return model


def _kind_at(loc: tuple) -> str | None:
    """Whether the field at ``loc`` holds a length, an angle or a speed."""
    owner = _model_at(loc)
    field = owner.model_fields.get(loc[-1]) if owner and loc else None
    return field_kind(field.annotation, field.metadata) if field else None


def _model_in(annotation) -> type[BaseModel] | None:
    if isinstance(annotation, type) and issubclass(annotation, BaseModel):
        return annotation
    for arg in getattr(annotation, "__args__", ()) or ():
        found = _model_in(arg)
        if found is not None:
            return found
    return None


def _user_error(exc: ValidationError, units: str) -> UserError:
    errors = exc.errors(include_url=False)
    # a misspelt key also shows up as a missing one: report the misspelling
    err = next((e for e in errors if e["type"] == "extra_forbidden"), errors[0])
    loc = tuple(p for p in err["loc"] if not (isinstance(p, str) and ("[" in p or p.startswith("function-"))))
    kind = err["type"]
    msg = err["msg"]
    if msg.startswith("Value error, "):
        msg = msg[len("Value error, "):]
    if kind == "extra_forbidden":
        owner = _model_at(loc)
        choices = list(owner.model_fields) if owner else []
        hint = did_you_mean(str(loc[-1]), choices)
        accepted = "known keys: " + ", ".join(choices) if choices else None
        return UserError(_key(loc), "unknown key" + (f"; {hint}" if hint else ""), accepted)
    if kind == "missing":
        return UserError(_key(loc), "is required")
    if kind == "value_error" and ": " in msg and msg.split(": ", 1)[0].isidentifier():
        # a model-level check names its own field first: "field: problem (accepted)"
        field, msg = msg.split(": ", 1)
        loc = loc + (field,)
    accepted = None
    value = err.get("input")
    if isinstance(value, float) and value != value:  # NaN compares unequal to itself
        return UserError(_key(loc), "nan is not a number", "a finite number")
    if isinstance(value, float) and value in (float("inf"), float("-inf")):
        return UserError(_key(loc), f"{value} is not a finite number", "a finite number")
    if kind in ("model_type", "model_attributes_type", "dict_type"):
        owner = _model_at(loc + ("?",))  # the model the table itself should be
        keys = ", ".join(owner.model_fields) if owner else "its keys"
        table = f"a [{_key(loc)}] table" if not (loc and isinstance(loc[-1], int)) else "a table"
        return UserError(_key(loc), f"{value!r} is not a table", f"{table} with keys {keys}")
    if kind in ("tuple_type", "list_type"):
        return UserError(_key(loc), f"{value!r} is not a list", "a TOML list, e.g. [45, 135]")
    if kind == "int_from_float":
        return UserError(_key(loc), f"{value!r} is not a whole number", "a whole number, e.g. 6")
    if kind in ("int_parsing", "float_parsing", "int_type", "float_type"):
        return UserError(_key(loc), f"{value!r} is not a number", "a plain number" + (
            " of grams" if loc and loc[-1] == "max_mass" else ""))
    if kind == "literal_error":
        accepted = msg.replace("Input should be ", "")
        msg = f"{err.get('input')!r} is not accepted"
    elif kind in ("greater_than", "greater_than_equal", "less_than", "less_than_equal"):
        msg, accepted = range_problem(err, _kind_at(loc), units)
    elif msg.endswith(")") and " (" in msg:
        msg, accepted = msg[:-1].split(" (", 1)
    return UserError(_key(loc), msg, accepted)
