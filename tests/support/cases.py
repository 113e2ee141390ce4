"""Configs the hub tests build, as parsed-TOML dicts (scenarios of our own).

Together with the two demos in configs/ they cover 3, 4, 6 and 8 spreaders, block and
puck bodies, elevations of 0, 10 and 30 deg, mm and inch configs, clamp holes through
flats, chamfers and a puck rim, and extra holes plain, tapped, countersunk and
counterbored, through and blind, on both faces. Set screws have soft points (and a light
torque where the default would crush a fibreglass pole: the set-screw-crush rule).
"""

from __future__ import annotations

import copy
import pathlib
import tomllib

ROOT = pathlib.Path(__file__).resolve().parents[2]  # the project folder
DEMOS = {
    "metric-demo": ROOT / "configs" / "six-spreader-portable.toml",
    "inch-demo": ROOT / "configs" / "four-spreader-conduit.toml",
}


def demo(name: str) -> dict:
    return tomllib.loads(DEMOS[name].read_text(encoding="utf-8"))


# 3 spreaders on a puck, sockets tilted 30 deg, two set screws each from the bottom,
# three clamp holes through the rim, a counterbored through hole on the top face.
TRI_PUCK_30 = {
    "name": "tri-puck-30", "units": "mm",
    "mast": {"size": "32 mm", "clearance": 1.0},
    "hub": {"style": "puck", "diameter": 120, "thickness": 52, "material": "petg", "process": "machined"},
    "spreaders": {"count": 3, "diameter": 16, "elevation": "30 deg", "first_azimuth": 90},
    "set_screws": {"thread": "M5", "per_spreader": 2, "face": "bottom", "point": "soft"},
    "mast_clamp": {"thread": "M6", "count": 3},
    "holes": [
        {"id": "CB1", "face": "top", "at": [-40.0, 0.0], "clearance": "M4", "counterbore": True},
    ],
}

# 8 spreaders, inch, level sockets to the bore, two set screws each, blind and through
# extra holes on the bottom face with a countersink and a counterbore.
OCT_BLOCK_INCH = {
    "name": "oct-block-inch", "units": "in",
    "mast": {"size": "1-1/2 in", "clearance": 0.04},
    "hub": {"style": "block", "across_flats": 6.5, "thickness": 1.25, "bore": 2.0,
            "material": "uhmw"},
    "spreaders": {"count": 8, "diameter": 0.5, "fit": 0.02, "elevation": 0, "first_azimuth": 22.5},
    "set_screws": {"thread": "8-32", "per_spreader": 2, "face": "top", "point": "soft"},
    "holes": [
        {"id": "CS1", "face": "bottom", "at": [1.8, 0.0], "clearance": "#8-32", "countersink": True},
        {"id": "CB2", "face": "bottom", "at": [-1.8, 0.0], "clearance": "#8-32", "counterbore": True},
        {"id": "TAP3", "face": "bottom", "at": [0.0, 1.8], "thread": "1/4-20", "depth": 0.6},
    ],
}

# 6 spreaders on a 12-sided block (a flat between sockets), blind sockets tilted 30 deg,
# six clamp holes through the in-between flats, no set screws, no extra holes.
HEX_DODECA_30 = {
    "name": "hex-dodeca-30", "units": "mm",
    "mast": {"size": "40 mm"},
    "hub": {"style": "block", "sides": 12, "across_flats": 150, "thickness": 56, "material": "nylon"},
    "spreaders": {"count": 6, "diameter": 16, "elevation": 30, "first_azimuth": 15,
                  "socket_depth": 40},
    "mast_clamp": {"thread": "M8", "count": 6},
}

# 4 spreaders on a puck, inch, 10 deg, clamp screws through the rim, a plain blind hole.
QUAD_PUCK_10_INCH = {
    "name": "quad-puck-10", "units": "in",
    "mast": {"size": "1 in EMT"},
    "hub": {"style": "puck", "diameter": 5.0, "thickness": 1.75, "material": "hdpe"},
    "spreaders": {"count": 4, "diameter": 0.625, "elevation": "10 deg", "first_azimuth": 45,
                  "socket_depth": 1.2},  # blind: the clamp screw passes between the socket floors
    "set_screws": {"thread": "1/4-20", "per_spreader": 1, "face": "top", "position": 0.6,
                   "point": "soft", "torque": "18 in-lbf"},
    "mast_clamp": {"thread": "1/4-20", "count": 1},
    "holes": [{"id": "P1", "face": "top", "at": [0.0, 1.7], "diameter": 0.25, "depth": 0.5}],
}

# 4 spreaders on a puck with [[sockets]] overrides: S2 and S4 fall 12 deg while S1 and S3
# rise 12 deg, S4 takes a thicker pole with its own fit, S3 is turned to 190 deg azimuth.
SPIDER_PUCK_MIXED = {
    "name": "spider-puck-mixed", "units": "mm",
    "mast": {"size": "38 mm", "clearance": 1.0},
    "hub": {"style": "puck", "diameter": 150, "thickness": 62, "material": "nylon"},
    "spreaders": {"count": 4, "diameter": 20, "elevation": 12, "first_azimuth": 0,
                  "socket_depth": 40, "tip_radius": "2 m"},
    "sockets": [{"index": 2, "elevation": -12}, {"index": 4, "elevation": "-12 deg", "diameter": 25, "fit": 0.6},
                {"index": 3, "azimuth": 190}],
    "set_screws": {"thread": "M5", "per_spreader": 1, "face": "top", "point": "soft", "torque": 0.8},
}

VARIED = {
    "spider-puck-mixed": SPIDER_PUCK_MIXED,
    "tri-puck-30": TRI_PUCK_30,
    "oct-block-inch": OCT_BLOCK_INCH,
    "hex-dodeca-30": HEX_DODECA_30,
    "quad-puck-10": QUAD_PUCK_10_INCH,
}


def all_cases() -> dict[str, dict]:
    out = {name: demo(name) for name in DEMOS}
    out.update({k: copy.deepcopy(v) for k, v in VARIED.items()})
    return out
