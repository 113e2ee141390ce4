"""Cantilever bending of a spreader: deflection, root moments and their superposition (SI).

The spreader is a straight prismatic cantilever of length L fixed at the socket mouth,
linear elastic, small deflections (Euler-Bernoulli). Formulas (from memory):
  uniform load w:  tip deflection w L^4 / (8 E I), root moment w L^2 / 2
  tip load P:      tip deflection P L^3 / (3 E I), root moment P L
(Roark's "Formulas for Stress and Strain", table 8.1, cases 1a and 2a; Gere, "Mechanics
of Materials", appendix G, cantilever beams cases 1 and 4.)

Combination (stated model): loads are split into the two bending planes through the
pole axis, a horizontal one (wind) and a vertical one (self weight, ice, the vertical
part of the wire pull). In each plane moments and deflections add linearly
(superposition, valid because the model is linear); for a round tube the section is the
same in every direction, so the two planes combine as a vector: M = sqrt(Mh^2 + Mv^2)
and the peak stress is M c / I. Axial force from a wire pulling along the pole is
reported separately (its stress adds to the bending stress on one side).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

G = 9.80665  # m/s2, standard gravity


def tube_area_m2(od_mm: float, id_mm: float = 0.0) -> float:
    """Cross-section area pi/4 (D^2 - d^2), m^2."""
    return math.pi / 4.0 * (od_mm ** 2 - id_mm ** 2) * 1e-6


def tube_second_moment_m4(od_mm: float, id_mm: float = 0.0) -> float:
    """I = pi (D^4 - d^4) / 64, m^4 (Roark, hollow circle)."""
    return math.pi * (od_mm ** 4 - id_mm ** 4) / 64.0 * 1e-12


def cantilever_uniform_deflection_m(w_n_m: float, length_m: float, e_pa: float, i_m4: float) -> float:
    """Tip deflection under a uniform load w (N/m): w L^4 / (8 E I), m."""
    return w_n_m * length_m ** 4 / (8.0 * e_pa * i_m4)


def cantilever_tip_load_deflection_m(p_n: float, length_m: float, e_pa: float, i_m4: float) -> float:
    """Tip deflection under a tip load P (N): P L^3 / (3 E I), m."""
    return p_n * length_m ** 3 / (3.0 * e_pa * i_m4)


def uniform_root_moment_nm(w_n_m: float, length_m: float) -> float:
    """Root moment of a uniform load: w L^2 / 2, N m."""
    return w_n_m * length_m ** 2 / 2.0


def tip_load_root_moment_nm(p_n: float, length_m: float) -> float:
    """Root moment of a tip load: P L, N m."""
    return p_n * length_m


def wire_tension_components(tension_n: float, angle_deg: float) -> tuple[float, float]:
    """A wire pulling the tip with ``tension_n`` at ``angle_deg`` from the pole axis
    (0 = straight outwards along the pole): (transverse N, axial N) = (T sin a, T cos a)."""
    a = math.radians(angle_deg)
    return tension_n * math.sin(a), tension_n * math.cos(a)


def wire_tension_root_moment_nm(tension_n: float, angle_deg: float, length_m: float) -> float:
    """Root moment from the wire's transverse component at the tip: T sin(a) L, N m.
    (First order: the extra moment of an axial pull on the bowed pole is left out; a pull
    outwards straightens the pole, so leaving it out is conservative.)"""
    return tip_load_root_moment_nm(wire_tension_components(tension_n, angle_deg)[0], length_m)


def self_weight_line_load_n_m(od_mm: float, id_mm: float, density_kg_m3: float,
                              elevation_deg: float = 0.0) -> float:
    """Weight per metre across the pole, rho g A cos(elevation), N/m (elevation above horizontal)."""
    return density_kg_m3 * G * tube_area_m2(od_mm, id_mm) * math.cos(math.radians(elevation_deg))


def self_weight_root_moment_nm(od_mm: float, id_mm: float, density_kg_m3: float, length_m: float,
                               elevation_deg: float = 0.0) -> float:
    """Root moment of the tube's own weight as a uniform load, N m."""
    return uniform_root_moment_nm(self_weight_line_load_n_m(od_mm, id_mm, density_kg_m3, elevation_deg),
                                  length_m)


@dataclass(frozen=True)
class PlaneLoads:
    """Loads in one bending plane: a uniform load and a tip load (each may be 0)."""

    uniform_n_m: float = 0.0
    tip_n: float = 0.0

    def root_moment_nm(self, length_m: float) -> float:
        return uniform_root_moment_nm(self.uniform_n_m, length_m) + tip_load_root_moment_nm(self.tip_n, length_m)

    def tip_deflection_m(self, length_m: float, e_pa: float, i_m4: float) -> float:
        return (cantilever_uniform_deflection_m(self.uniform_n_m, length_m, e_pa, i_m4)
                + cantilever_tip_load_deflection_m(self.tip_n, length_m, e_pa, i_m4))


@dataclass(frozen=True)
class Bending:
    """Superposed result at the root and tip (see the module docstring for the model)."""

    moment_horizontal_nm: float
    moment_vertical_nm: float
    moment_nm: float
    deflection_horizontal_m: float
    deflection_vertical_m: float
    deflection_m: float
    stress_pa: float


def combined_bending(horizontal: PlaneLoads, vertical: PlaneLoads, length_m: float, e_pa: float,
                     od_mm: float, id_mm: float = 0.0) -> Bending:
    """Superpose each plane linearly, then combine the two planes as vectors (round tube)."""
    i = tube_second_moment_m4(od_mm, id_mm)
    mh, mv = horizontal.root_moment_nm(length_m), vertical.root_moment_nm(length_m)
    dh, dv = horizontal.tip_deflection_m(length_m, e_pa, i), vertical.tip_deflection_m(length_m, e_pa, i)
    m = math.hypot(mh, mv)
    return Bending(mh, mv, m, dh, dv, math.hypot(dh, dv), m * (od_mm / 2000.0) / i)
