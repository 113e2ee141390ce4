"""Independent read-back of a build folder: STEP solid, STL mesh and point probes."""

from __future__ import annotations

import json
from pathlib import Path

import cadquery as cq
import trimesh


def load(folder: Path):
    manifest = json.loads((folder / "manifest.json").read_text())
    step = cq.importers.importStep(str(folder / "hub.step"))
    solids = step.solids().vals()
    mesh = trimesh.load(folder / "hub.stl", force="mesh")
    return manifest, solids, mesh


def inside(solid, p) -> bool:
    return solid.isInside(cq.Vector(*p), 1e-4)


def along(hole, t):
    e, a = hole["entry_mm"], hole["axis"]
    return [e[i] + a[i] * t for i in range(3)]


def hole_voids(solid, manifest) -> list[str]:
    """Ids of holes whose axis is not empty just inside the entry and at mid-depth."""
    bad = []
    for h in manifest["holes"]:
        for t in (min(0.3, h["depth_mm"] / 4), h["depth_mm"] / 2):
            if inside(solid, along(h, t)):
                bad.append(f"{h['id']}@{t:.2f}")
    return bad
