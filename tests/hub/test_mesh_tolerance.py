"""Every accepted mesh tolerance pair meshes watertight and within the volume check.

The deflection is absolute (mm): every point of the mesh lies within it of the true surface,
so the mesh volume can differ from the solid's by at most surface area x deflection (the
bound the build checks, with 0.5 % as its floor).
"""

from __future__ import annotations

import copy

import pytest
import trimesh

from generators.build import build_config
from generators.config.load import parse_config
from tests.support.cases import all_cases


@pytest.mark.slow
@pytest.mark.parametrize("tolerance, angular", [(1.0, 30), (0.005, 1)])
def test_the_extreme_tolerance_pairs_build(tmp_path, tolerance, angular):
    data = copy.deepcopy(all_cases()["tri-puck-30"])
    data["output"] = {"tolerance": tolerance if data.get("units", "mm") == "mm" else tolerance / 25.4,
                      "angular_tolerance": angular}
    result = build_config(parse_config(data), tmp_path, force=True)
    mesh = trimesh.load(result.folder / "hub.stl")
    assert mesh.is_watertight
    v_solid = result.manifest["hub"]["volume_mm3"]
    assert abs(mesh.volume - v_solid) <= max(0.005 * v_solid, mesh.area * tolerance * 1.05)
