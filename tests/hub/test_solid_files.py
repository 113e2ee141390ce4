"""hub.step, hub.stl and hub.3mf read back by independent readers (issue 3 items 1 and 7)."""

from __future__ import annotations

import struct
import xml.etree.ElementTree as ET
import zipfile
from collections import Counter

import numpy as np
import pytest

from .conftest import CASES

pytestmark = pytest.mark.slow

NAMES = sorted(CASES)
# The mesh may differ from the exact solid by its chordal tolerance only; issue 3 sets
# the agreement at 0.5 % of the volume.
VOLUME_AGREEMENT = 0.005

# 3MF core specification 1.3, section 3 (package) and 4 (model).
REL_3DMODEL = "http://schemas.microsoft.com/3dmanufacturing/2013/01/3dmodel"
NS_CORE = "http://schemas.microsoft.com/3dmanufacturing/core/2015/02"
NS_RELS = "http://schemas.openxmlformats.org/package/2006/relationships"


@pytest.mark.parametrize("name", NAMES)
def test_step_reimports_as_one_valid_solid_in_millimetres(build_case, name):
    import cadquery as cq

    b = build_case(name)
    shape = cq.importers.importStep(str(b.folder / "hub.step"))
    solids = shape.solids().vals()
    assert len(solids) == 1
    assert solids[0].isValid()
    # ISO 10303-41 encodes the millimetre as SI_UNIT(.MILLI.,.METRE.)
    text = (b.folder / "hub.step").read_text(encoding="ascii", errors="replace")
    assert "SI_UNIT(.MILLI.,.METRE.)" in text.replace(" ", "")
    # the manifest's volume is the solid's (GProp volume of the re-read solid)
    assert b.manifest["hub"]["volume_mm3"] == pytest.approx(solids[0].Volume(), rel=1e-6)


@pytest.mark.parametrize("name", NAMES)
def test_stl_is_binary_watertight_and_agrees_with_step_volume(build_case, name):
    import trimesh

    b = build_case(name)
    path = b.folder / "hub.stl"
    data = path.read_bytes()
    # binary STL (3D Systems StereoLithography Interface Specification): 80-byte header,
    # uint32 triangle count, 50 bytes per triangle
    (count,) = struct.unpack_from("<I", data, 80)
    assert len(data) == 84 + 50 * count
    mesh = trimesh.load(path, file_type="stl", force="mesh")
    assert mesh.is_watertight, "STL has open edges (seams)"
    assert mesh.is_winding_consistent
    assert mesh.volume > 0, "STL normals point inwards"
    assert mesh.body_count == 1
    v_step = b.solid.Volume()
    assert abs(mesh.volume - v_step) <= VOLUME_AGREEMENT * v_step


@pytest.mark.parametrize("name", NAMES)
def test_stl_volume_with_numpy_stl(build_case, name):
    stl = pytest.importorskip("stl")
    b = build_case(name)
    m = stl.mesh.Mesh.from_file(str(b.folder / "hub.stl"))
    volume, _cog, _inertia = m.get_mass_properties()
    v_step = b.solid.Volume()
    assert abs(volume - v_step) <= VOLUME_AGREEMENT * v_step


def _read_3mf(path):
    with zipfile.ZipFile(path) as z:
        rels = ET.fromstring(z.read("_rels/.rels"))
        targets = [r.get("Target") for r in rels.iter(f"{{{NS_RELS}}}Relationship")
                   if r.get("Type") == REL_3DMODEL]
        assert len(targets) == 1, "3MF package must name exactly one 3D model start part"
        model = ET.fromstring(z.read(targets[0].lstrip("/")))
    assert model.tag == f"{{{NS_CORE}}}model"
    return model


@pytest.mark.parametrize("name", NAMES)
def test_3mf_is_millimetre_and_a_manifold_mesh_with_shared_vertices(build_case, name):
    b = build_case(name)
    model = _read_3mf(b.folder / "hub.3mf")
    # 3MF core spec 1.3 section 4.1: unit defaults to millimeter when absent
    assert model.get("unit", "millimeter") == "millimeter"
    objects = list(model.iter(f"{{{NS_CORE}}}object"))
    assert len(objects) == 1
    items = list(model.iter(f"{{{NS_CORE}}}item"))
    assert [i.get("objectid") for i in items] == [objects[0].get("id")]
    verts = np.array([[float(v.get(k)) for k in "xyz"] for v in objects[0].iter(f"{{{NS_CORE}}}vertex")])
    tris = np.array([[int(t.get(k)) for k in ("v1", "v2", "v3")]
                     for t in objects[0].iter(f"{{{NS_CORE}}}triangle")])
    assert len(tris) > 0
    # shared vertex indices: each position appears once, and is used by several triangles
    assert len({tuple(np.round(v, 6)) for v in verts}) == len(verts), "vertices are repeated"
    uses = np.bincount(tris.ravel(), minlength=len(verts))
    assert uses.min() >= 3, "a vertex used by fewer than 3 triangles cannot be interior to a closed surface"
    assert 3 * len(tris) / len(verts) > 4, "little vertex reuse: faces carry their own vertices"
    assert (tris[:, 0] != tris[:, 1]).all() and (tris[:, 1] != tris[:, 2]).all() \
        and (tris[:, 0] != tris[:, 2]).all(), "degenerate triangle"
    # manifold (3MF core spec 4.1.4.1): every edge shared by exactly two triangles, once
    # in each direction (consistent winding)
    directed = Counter()
    for a, b_, c in tris:
        directed.update(((a, b_), (b_, c), (c, a)))
    assert max(directed.values()) == 1, "an edge is used twice in the same direction"
    undirected = Counter()
    for (p, q), n in directed.items():
        undirected[(min(p, q), max(p, q))] += n
    bad = [e for e, n in undirected.items() if n != 2]
    assert not bad, f"{len(bad)} edges not shared by exactly two triangles"
    # signed-tetrahedron volume (divergence theorem) is positive: outward winding, as
    # 3MF requires; and it agrees with the STEP solid
    v0, v1, v2 = verts[tris[:, 0]], verts[tris[:, 1]], verts[tris[:, 2]]
    volume = np.einsum("ij,ij->i", v0, np.cross(v1, v2)).sum() / 6.0
    v_step = b.solid.Volume()
    assert volume > 0
    assert abs(volume - v_step) <= VOLUME_AGREEMENT * v_step
