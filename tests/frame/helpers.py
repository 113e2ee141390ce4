"""The frozen spider-quad case and small hand formulas the frame tests compare with."""

from __future__ import annotations

import copy
import math
import pathlib
import tomllib

CASE = pathlib.Path(__file__).resolve().parent / "cases" / "spider-quad.toml"


def spider_raw() -> dict:
    return copy.deepcopy(tomllib.loads(CASE.read_text(encoding="utf-8")))


def blind_cut_mm(r_outer: float, depth: float, elevation_deg: float, tip_radius: float, allowance: float) -> float:
    """Hand calculation: a pole on the floor of a blind socket ``depth`` deep (along its
    axis) from a face ``r_outer`` from the mast axis ends at horizontal radius
    ``r_outer - depth cos e``; to the tip at ``tip_radius`` it is (R - rho) / cos e long,
    plus the allowance. Same for +e and -e (cos is even)."""
    e = math.radians(elevation_deg)
    rho = r_outer - depth * math.cos(e)
    return (tip_radius - rho) / math.cos(e) + allowance
