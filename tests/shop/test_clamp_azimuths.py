"""[mast_clamp] azimuths: the clamp holes go where the config says, or the config is refused
with the key and the reason (a hole needs a flat or chamfer, and may not run down a socket)."""

from __future__ import annotations

import copy
import math

import pytest

from generators.config import parse_config
from generators.design import design
from generators.errors import UserError

# our own scenario: 4 sockets at 0, 90, 180, 270 deg on an 8-sided block, so a flat sits in
# every gap (45, 135, 225, 315 deg)
BASE = {
    "name": "clamp-az", "units": "mm",
    "mast": {"size": "40 mm", "clearance": 1.0},
    "hub": {"across_flats": 150, "sides": 8, "thickness": 40, "material": "pom"},
    "spreaders": {"count": 4, "diameter": 16, "socket_depth": 45},
    "mast_clamp": {"thread": "M6", "count": 2},
}


def _cfg(**clamp):
    raw = copy.deepcopy(BASE)
    raw["mast_clamp"] = {"thread": "M6", **clamp}
    return parse_config(raw)


def _azimuths(plan):
    return [round(math.degrees(math.atan2(h.entry_mm[1], h.entry_mm[0])) % 360, 6)
            for h in plan.holes if h.kind == "clamp"]


def test_default_two_go_90_deg_apart():
    assert _azimuths(design(_cfg(count=2)).plan) == [45.0, 135.0]


def test_azimuths_override_and_set_the_count():
    cfg = _cfg(azimuths=[225, "315 deg"])
    assert cfg.mast_clamp.count == 2
    assert _azimuths(design(cfg).plan) == [225.0, 315.0]


def test_an_azimuth_without_a_flat_is_refused_with_its_key():
    with pytest.raises(UserError) as exc:
        design(_cfg(azimuths=[45, 100]))
    assert exc.value.key == "mast_clamp.azimuths"
    assert "100" in exc.value.problem and "flat or chamfer" in exc.value.problem


def test_an_azimuth_on_a_socket_is_refused():
    with pytest.raises(UserError) as exc:
        design(_cfg(azimuths=[90]))  # the socket S2 faces this flat
    assert exc.value.key == "mast_clamp.azimuths" and "S2" in exc.value.problem


def test_an_azimuth_down_a_puck_socket_is_refused():
    raw = copy.deepcopy(BASE)
    raw["hub"] = {"style": "puck", "diameter": 150, "thickness": 40, "material": "pom"}
    raw["mast_clamp"] = {"thread": "M6", "azimuths": [0]}
    with pytest.raises(UserError) as exc:
        design(parse_config(raw))
    assert exc.value.key == "mast_clamp.azimuths" and "S1" in exc.value.problem


def test_count_and_azimuths_must_agree():
    with pytest.raises(UserError) as exc:
        _cfg(count=3, azimuths=[45, 135])
    assert "mast_clamp" in exc.value.key
