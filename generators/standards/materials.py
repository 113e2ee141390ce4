"""Hub and socket materials with typical strengths (sources per row in data/materials.csv)."""

from __future__ import annotations

import functools
from dataclasses import dataclass

from generators.errors import UserError, did_you_mean
from generators.standards._data import table

CLASSES = ("plastic", "wood", "metal", "composite")


@dataclass(frozen=True)
class Material:
    id: str
    name: str
    material_class: str
    density_g_cm3: float
    tensile_mpa: float
    yield_mpa: float
    bearing_mpa: float
    modulus_gpa: float
    source: str


@functools.cache
def _materials() -> tuple[dict[str, Material], dict[str, str]]:
    by_id, aliases = {}, {}
    for r in table("materials.csv"):
        by_id[r["id"]] = Material(
            id=r["id"], name=r["name"], material_class=r["material_class"],
            density_g_cm3=r["density_g_cm3"], tensile_mpa=r["tensile_mpa"], yield_mpa=r["yield_mpa"],
            bearing_mpa=r["bearing_mpa"], modulus_gpa=r["modulus_gpa"],
            source=r["source"])
        for alias in (r["aliases"] or "").split(";"):
            if alias:
                aliases[alias] = r["id"]
    return by_id, aliases


def material_ids() -> list[str]:
    """The canonical material ids."""
    return list(_materials()[0])


def get_material(id: str, key: str = "hub.material") -> Material:
    """A material by id or alias (``"aluminum-6061"``, ``"acetal"``, ``"birch-plywood"``...)."""
    by_id, aliases = _materials()
    text = str(id).strip().lower().replace(" ", "-").replace("_", "-")
    text = aliases.get(text, text)
    if text in by_id:
        return by_id[text]
    hint = did_you_mean(str(id), list(by_id) + list(aliases))
    raise UserError(key, f"unknown material {id!r}", f"{hint} one of {', '.join(by_id)}".strip())
