"""Each socket's own azimuth, elevation, pole diameter and fit: the spreaders section
with the ``[[sockets]]`` overrides applied. Plain data, no geometry."""

from __future__ import annotations

from dataclasses import dataclass

from generators.config.models import Config


@dataclass(frozen=True)
class SocketSpec:
    index: int  # 1-based, socket S<index>, spreader <index>
    azimuth_deg: float
    elevation_deg: float  # negative: the pole falls outward
    pole_mm: float
    fit_mm: float
    overridden: tuple[str, ...] = ()  # the fields its [[sockets]] table sets
    entry: int | None = None  # position of that table in the config

    @property
    def socket_mm(self) -> float:
        return self.pole_mm + self.fit_mm

    def key(self, field: str, default: str) -> str:
        """The config key to name in a refusal about ``field`` of this socket."""
        if self.entry is not None and field in self.overridden:
            return f"sockets[{self.entry}].{field}"
        return default


def socket_specs(cfg: Config) -> tuple[SocketSpec, ...]:
    sp = cfg.spreaders
    by_index = {o.index: (k, o) for k, o in enumerate(cfg.sockets)}
    out = []
    for i in range(sp.count):
        k, o = by_index.get(i + 1, (None, None))
        values = {"azimuth": sp.first_azimuth + i * 360 / sp.count, "elevation": sp.elevation,
                  "diameter": sp.diameter, "fit": sp.fit}
        set_here = ()
        if o is not None:
            set_here = tuple(f for f in values if getattr(o, f) is not None)
            values.update({f: getattr(o, f) for f in set_here})
        out.append(SocketSpec(index=i + 1, azimuth_deg=values["azimuth"],
                              elevation_deg=values["elevation"], pole_mm=values["diameter"],
                              fit_mm=values["fit"], overridden=set_here, entry=k))
    return tuple(out)


def uniform(cfg: Config) -> bool:
    """True when no override changes anything (every socket as spreaders says)."""
    return not cfg.sockets
