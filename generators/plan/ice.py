"""Radial ice on a cylinder (pure functions, SI units).

Model: a uniform radial ice layer of thickness t on a round member of diameter d
(ISO 12494:2017 "Atmospheric icing of structures", glaze ice on a cylinder, and the same
geometry as ASCE 7-16 chapter 10, eq. 10.4-1 A_i = pi t (D_c + t); both from memory).
Glaze ice density 900 kg/m3 (ISO 12494 table of ice densities; ASCE 7 10.4.1 uses at
least 900 kg/m3 = 56 pcf; from memory). Rime ice is lighter (about 200 to 900 kg/m3) but
builds larger diameters; pass its density where the design ice is rime.
An estimate for checking a build; local codes and the ice map for the site decide.
"""

from __future__ import annotations

import math

GLAZE_DENSITY_KG_M3 = 900.0  # ISO 12494 glaze ice; ASCE 7-16 10.4.1 (from memory)
G = 9.80665                   # m/s2, standard gravity (ISO 80000-3)


def iced_diameter_mm(d_mm: float, thickness_mm: float) -> float:
    """Outer diameter of the iced member, D = d + 2 t (mm)."""
    return d_mm + 2.0 * thickness_mm


def ice_area_mm2(d_mm: float, thickness_mm: float) -> float:
    """Ice cross-section pi t (d + t) (= pi/4 (D^2 - d^2)), mm^2; ASCE 7-16 eq. 10.4-1."""
    return math.pi * thickness_mm * (d_mm + thickness_mm)


def ice_mass_per_m(d_mm: float, thickness_mm: float, density: float = GLAZE_DENSITY_KG_M3) -> float:
    """Ice mass per metre of member, kg/m."""
    return density * ice_area_mm2(d_mm, thickness_mm) * 1e-6


def ice_weight_per_m(d_mm: float, thickness_mm: float, density: float = GLAZE_DENSITY_KG_M3) -> float:
    """Ice weight per metre of member, N/m."""
    return ice_mass_per_m(d_mm, thickness_mm, density) * G


def iced_diameter_from_mass_mm(d_mm: float, mass_kg_m: float,
                               density: float = GLAZE_DENSITY_KG_M3) -> float:
    """ISO 12494 gives ice classes as mass per metre; the iced diameter that mass makes:
    D = sqrt(4 m / (pi rho) + d^2), mm."""
    return math.sqrt(4.0 * mass_kg_m / (math.pi * density) * 1e6 + d_mm * d_mm)
