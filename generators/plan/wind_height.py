"""Peak velocity pressure at height, EN 1991-1-4:2005 section 4 (pure functions, SI units).

Equation numbers are those of EN 1991-1-4:2005 (from memory of the text; the recommended
values of the national choices are used: c0 = 1, kI = 1, rho = 1.25 kg/m3, z_max = 200 m).

Input is the basic wind velocity ``vb``: the 10-minute mean wind speed at 10 m above
ground in terrain category II (open country), eq. (4.1) with c_dir = c_season = 1. It is
NOT a gust speed. A 3-second gust speed ``vg`` measured or specified at 10 m in open
country corresponds to the peak velocity of this code's model, so
``vb = vg / sqrt(ce(10 m, II))`` = vg / 1.53 (``basic_velocity_from_gust``); a config
that holds a gust speed must convert before calling ``peak_velocity_pressure``.
Estimates only: the national annex and local codes decide the design wind.
"""

from __future__ import annotations

import math

from generators.errors import UserError

RHO_AIR = 1.25     # kg/m3, EN 1991-1-4 4.5(1) note 2 recommended value
C0 = 1.0           # orography factor, flat terrain (4.3.3)
K_I = 1.0          # turbulence factor, recommended (4.4(1) note 2)
Z0_II = 0.05       # m, roughness length of category II (table 4.1)
Z_MAX = 200.0      # m, upper limit of the profile (4.3.2)

# EN 1991-1-4 table 4.1: terrain category -> (z0 m, z_min m)
TERRAIN = {
    "0": (0.003, 1.0),   # sea or coastal area exposed to the open sea
    "I": (0.01, 1.0),    # lakes or flat, horizontal area with negligible vegetation
    "II": (0.05, 2.0),   # low vegetation, isolated obstacles 20 obstacle heights apart
    "III": (0.3, 5.0),   # regular vegetation or buildings, isolated obstacles (villages, suburbs)
    "IV": (1.0, 10.0),   # at least 15 % of the surface covered by buildings over 15 m high
}
DEFAULT_TERRAIN = "II"   # open, flat country


def terrain_params(terrain: str, key: str = "loads.terrain") -> tuple[float, float]:
    """(z0, z_min) in metres for a terrain category of table 4.1."""
    cat = str(terrain).strip().upper()
    if cat not in TERRAIN:
        raise UserError(key, f"unknown terrain category {terrain!r}",
                        "EN 1991-1-4 categories 0, I, II, III, IV")
    return TERRAIN[cat]


def terrain_factor(z0: float) -> float:
    """kr = 0.19 (z0 / z0,II)^0.07, eq. (4.5)."""
    return 0.19 * (z0 / Z0_II) ** 0.07


def _z_eff(z: float, z_min: float, key: str) -> float:
    if not z > 0:
        raise UserError(key, f"height {z} m is not above ground", "a height > 0 m")
    if z > Z_MAX:
        raise UserError(key, f"height {z} m is above the profile's {Z_MAX:g} m", f"0 to {Z_MAX:g} m")
    return max(z, z_min)  # below z_min the value at z_min applies (4.4) and (4.7)


def roughness_factor(z: float, terrain: str = DEFAULT_TERRAIN, key: str = "loads.height") -> float:
    """cr(z) = kr ln(z / z0), eq. (4.4); cr(z_min) below z_min."""
    z0, z_min = terrain_params(terrain)
    return terrain_factor(z0) * math.log(_z_eff(z, z_min, key) / z0)


def turbulence_intensity(z: float, terrain: str = DEFAULT_TERRAIN, key: str = "loads.height") -> float:
    """Iv(z) = kI / (c0 ln(z / z0)), eq. (4.7); Iv(z_min) below z_min."""
    z0, z_min = terrain_params(terrain)
    return K_I / (C0 * math.log(_z_eff(z, z_min, key) / z0))


def mean_velocity(vb: float, z: float, terrain: str = DEFAULT_TERRAIN) -> float:
    """vm(z) = cr(z) c0 vb in m/s, eq. (4.3)."""
    return roughness_factor(z, terrain) * C0 * vb


def peak_velocity_pressure(vb: float, z: float, terrain: str = DEFAULT_TERRAIN,
                           rho: float = RHO_AIR) -> float:
    """qp(z) = (1 + 7 Iv(z)) 1/2 rho vm(z)^2 in Pa, eq. (4.8)."""
    vm = mean_velocity(vb, z, terrain)
    return (1.0 + 7.0 * turbulence_intensity(z, terrain)) * 0.5 * rho * vm * vm


def exposure_factor(z: float, terrain: str = DEFAULT_TERRAIN) -> float:
    """ce(z) = qp(z) / qb with qb = 1/2 rho vb^2, eq. (4.9) (independent of vb and rho)."""
    return peak_velocity_pressure(1.0, z, terrain, rho=2.0)


def peak_velocity(vb: float, z: float, terrain: str = DEFAULT_TERRAIN) -> float:
    """The gust speed whose 1/2 rho v^2 is qp(z): vb sqrt(ce(z)), m/s."""
    return vb * math.sqrt(exposure_factor(z, terrain))


def basic_velocity_from_gust(gust_m_s: float) -> float:
    """vb from a 3 s gust speed at 10 m in open country: vg / sqrt(ce(10 m, II)) (see module doc)."""
    return gust_m_s / math.sqrt(exposure_factor(10.0, "II"))
