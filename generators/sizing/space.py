"""The design space: which config keys vary, on which steps, and how a point of the space
becomes a config again (the raw TOML data with new values, validated as any config).

A length steps by 1 mm in a millimetre config and 1/16 in in an inch one (shop steps,
common practice), or takes the sizes of a stock table; a count steps by 1, an angle by
1 deg. Values are written back in the config's own units.
"""

from __future__ import annotations

import copy
import math
import typing
from dataclasses import dataclass

from pydantic import BaseModel

from generators.config.fields import field_kind
from generators.config.models import Config
from generators.errors import UserError, did_you_mean
from generators.sizing.stock import stock_series

MM_PER_IN = 25.4
# Shop steps (common practice): whole millimetres, or sixteenths of an inch.
STEP_MM = {"mm": 1.0, "in": MM_PER_IN / 16}
STEP_DEG = 1.0
HELD = ("mast", "loads", "set_screws", "mast_clamp", "mast_pin", "reducers", "holes", "output", "shop", "print")
ACCEPTED = "a numeric hub or spreader key such as hub.thickness, hub.across_flats, spreaders.socket_depth"


@dataclass(frozen=True)
class Dimension:
    """One varied key: ``value(k)`` for grid index ``k`` (in mm, deg or a count)."""

    key: str
    kind: str  # length | angle | count
    step: float  # grid spacing (mm, deg, 1); unused when ``series`` is given
    start: int  # grid index of the config's value (rounded up onto the grid)
    series: tuple[float, ...] | None = None  # stock sizes in mm

    @property
    def lowest(self) -> int:
        return 0

    @property
    def highest(self) -> int | None:
        return len(self.series) - 1 if self.series else None

    def value(self, k: int) -> float:
        if self.series:
            return self.series[k]
        return k * self.step if self.kind != "count" else float(k)

    def raw(self, k: int, units: str):
        """The value as the config file writes it (bare number in the file's units)."""
        v = self.value(k)
        if self.kind == "count":
            return int(v)
        if self.kind == "length" and units == "in":
            v /= MM_PER_IN
        v = round(v, 6)
        return int(v) if v == int(v) else v


def _owner(annotation) -> type[BaseModel] | None:
    if isinstance(annotation, type) and issubclass(annotation, BaseModel):
        return annotation
    for arg in typing.get_args(annotation):
        found = _owner(arg)
        if found is not None:
            return found
    return None


def _is_int(annotation) -> bool:
    if annotation is int:
        return True
    return any(_is_int(a) for a in typing.get_args(annotation) if a is not type(None))


def _kind(key: str) -> str:
    """length, angle or count for a config key; a one-line ``UserError`` for anything else."""
    parts = key.split(".")
    model: type[BaseModel] | None = Config
    field = None
    for i, part in enumerate(parts):
        if model is None or part not in model.model_fields:
            prefix = ".".join(parts[:i] + [""])
            choices = [prefix + c for c in model.model_fields] if model is not None else []
            hint = did_you_mean(prefix + part, choices) if model is not None else ""
            raise UserError("--vary", f"{key!r} is not a config key" + (f"; {hint}" if hint else ""), ACCEPTED)
        field = model.model_fields[part]
        model = _owner(field.annotation) if i < len(parts) - 1 else None
    if parts[0] in HELD:
        raise UserError("--vary", f"{key!r} is held fixed: size keeps the mast, fasteners and loads as given",
                        ACCEPTED)
    if key == "spreaders.socket_depth":
        return "length"
    kind = field_kind(field.annotation, field.metadata)
    if kind in ("length", "angle"):
        return kind
    if _is_int(field.annotation):
        return "count"
    raise UserError("--vary", f"{key!r} is not a dimension (a length, an angle or a count)", ACCEPTED)


def _get(obj, key: str):
    for part in key.split("."):
        obj = obj.get(part) if isinstance(obj, dict) else getattr(obj, part, None)
    return obj


def default_keys(cfg: Config) -> list[str]:
    """hub.thickness, the hub's width, and the socket depth when it is a length (a plate
    has no sockets: its poles sit under U-bolts)."""
    flats = cfg.hub.style == "block" or (cfg.hub.style == "plate" and cfg.hub.across_flats is not None)
    keys = ["hub.thickness", "hub.across_flats" if flats else "hub.diameter"]
    if cfg.hub.style != "plate" and isinstance(cfg.spreaders.socket_depth, float):
        keys.append("spreaders.socket_depth")
    return keys


def dimensions(cfg: Config, raw: dict, keys: list[str] | None, objective: str) -> tuple[Dimension, ...]:
    """The varied dimensions, each starting at the config's value."""
    keys = list(dict.fromkeys(keys or default_keys(cfg)))
    out = []
    for key in keys:
        kind = _kind(key)
        if _get(raw, key) is None:
            raise UserError("--vary", f"{key!r} is not set in this config",
                            "give it a starting value in the config to vary it")
        current = _get(cfg, key)
        if not isinstance(current, (int, float)) or isinstance(current, bool):
            raise UserError("--vary", f"{key!r} is {current!r} here, not a number",
                            "a length in the config to start from")
        series = stock_series(key, cfg.hub.style, cfg.units) if objective == "stock" else None
        if series:
            start = next((i for i, s in enumerate(series) if s >= current - 1e-6), len(series) - 1)
            out.append(Dimension(key, kind, 0.0, start, series))
            continue
        step = {"length": STEP_MM[cfg.units], "angle": STEP_DEG, "count": 1.0}[kind]
        out.append(Dimension(key, kind, step, math.ceil(current / step - 1e-6)))
    return tuple(out)


def with_values(raw: dict, dims: tuple[Dimension, ...], point: tuple[int, ...], units: str,
                extra: dict | None = None) -> dict:
    """A copy of the raw TOML data with the dimensions at ``point`` (and ``extra`` keys set)."""
    data = copy.deepcopy(raw)
    items = [(d.key, d.raw(k, units)) for d, k in zip(dims, point)] + list((extra or {}).items())
    for key, value in items:
        *path, last = key.split(".")
        table = data
        for part in path:
            table = table.setdefault(part, {})
        table[last] = value
    return data
