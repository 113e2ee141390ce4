"""The printed hub, jig and tip cap as built: probed solids, meshes as the bed sees them."""

from __future__ import annotations

import math
import re
import zipfile

import numpy as np
import pytest

from generators.plan.printed import BRIDGE_LIMIT_MM, min_wall_mm

pytestmark = pytest.mark.slow

# ISO 4032 hex nuts: e min across corners, m max height, mm (from memory: ISO 4032 table 1)
ISO4032 = {"M4": (7.66, 3.2), "M5": (8.79, 4.7), "M6": (11.05, 5.2)}


def _inside(solid, p) -> bool:
    import cadquery as cq

    return solid.isInside(cq.Vector(*map(float, p)), 1e-4)


def _add(*vs):
    return tuple(sum(v[i] for v in vs) for i in range(3))


def _mul(v, k):
    return tuple(c * k for c in v)


def _cross(a, b):
    return (a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0])


def test_nut_pockets_hold_the_nut_at_every_set_screw_and_clamp(printed, printed_solid):
    allow = printed.config.print.nut_allowance
    wall = min_wall_mm(printed.config)
    pockets = [h for h in printed.plan.holes if h.kind == "nut_pocket"]
    served = {printed.plan.hole(p.serves).kind for p in pockets}
    assert served >= {"set_screw", "clamp"}
    for pk in pockets:
        e, m = ISO4032[pk.thread.split("x")[0]]
        a, s = pk.axis, pk.slot_dir
        w = _cross(a, s)
        c = pk.point_at(pk.depth_mm / 2)
        # the nut's corners (aligned with the pocket's) and faces are all void
        for k in range(6):
            ang = math.radians(60 * k)
            radial = _add(_mul(s, math.cos(ang)), _mul(w, math.sin(ang)))
            for along in (-(m + allow) / 2 + 0.05, 0.0, (m + allow) / 2 - 0.05):
                p = _add(c, _mul(radial, (e + allow) / 2 - 0.02), _mul(a, along))
                assert not _inside(printed_solid, p), (pk.id, k, along)
        # on the entry side the nut bears on material (it is captive)
        flat_dir = _add(_mul(s, -0.5), _mul(w, math.sqrt(3) / 2))  # towards a flat away from the slot
        p = _add(c, _mul(flat_dir, pk.across_flats_mm / 2 - 0.6), _mul(a, -(pk.depth_mm / 2 + wall / 2)))
        assert _inside(printed_solid, p), pk.id


def test_measured_diameters_are_the_compensated_ones(printed, printed_solid):
    plan = printed.plan
    for h in plan.holes:
        if h.kind not in ("socket", "set_screw", "bore"):
            continue
        t = h.depth_mm / 2 if h.kind != "set_screw" else min_wall_mm(printed.config) / 2
        down = _mul(h.roof_up, -1) if h.roof_up else None
        if down is None:  # a vertical hole: a horizontal direction into plain material
            c = h.point_at(t)
            rho = math.hypot(c[0], c[1])
            # the bore: towards azimuth 90, between sockets S2/S3 and away from the clamps
            down = (c[0] / rho, c[1] / rho, 0.0) if rho > 1e-6 else (0.0, 1.0, 0.0)
        c = h.point_at(t)
        assert not _inside(printed_solid, _add(c, _mul(down, h.radius_mm - 0.03))), h.id
        assert _inside(printed_solid, _add(c, _mul(down, h.radius_mm + 0.08))), h.id


def _facets(path):
    from stl import mesh as stl_mesh  # numpy-stl: an independent STL reader

    m = stl_mesh.Mesh.from_file(str(path))
    return m.vectors, m.normals / np.linalg.norm(m.normals, axis=1)[:, None]


def test_stl_and_3mf_sit_on_the_bed_in_millimetres(printed):
    for stem in ("hub", "tipcap"):
        tri, _ = _facets(printed.folder / f"{stem}.stl")
        assert tri[:, :, 2].min() == pytest.approx(0.0, abs=1e-6)
        with zipfile.ZipFile(printed.folder / f"{stem}.3mf") as z:
            xml = z.read("3D/3dmodel.model").decode()
        # 3MF core specification: <model unit="millimeter">
        assert re.search(r'<model[^>]*unit="millimeter"', xml)
        zs = [float(v) for v in re.findall(r'<vertex[^>]*z="([-0-9.eE+]+)"', xml)]
        assert zs and min(zs) == pytest.approx(0.0, abs=1e-6)


def test_no_unsupported_roof_over_the_documented_limit(printed):
    import trimesh

    tri, n = _facets(printed.folder / "hub.stl")
    # overhang rule of thumb: surfaces flatter than 45 deg from horizontal need support
    # (common practice); allow 5 deg of tessellation either way
    down = (n[:, 2] < -math.cos(math.radians(40))) & (tri[:, :, 2].mean(axis=1) > 1e-3)
    assert down.any()  # the nut slots have flat roofs
    assert (n[down, 2] < -0.999).all(), "a sloped overhang flatter than 45 deg"
    mesh = trimesh.Trimesh(vertices=tri.reshape(-1, 3), faces=np.arange(len(tri) * 3).reshape(-1, 3))
    mesh.merge_vertices()
    sel = np.nonzero(down)[0]
    adj = mesh.face_adjacency
    keep = np.isin(adj[:, 0], sel) & np.isin(adj[:, 1], sel)
    for group in trimesh.graph.connected_components(adj[keep], nodes=sel):
        pts = mesh.vertices[mesh.faces[np.asarray(group)].ravel()][:, :2]
        _, extents = trimesh.bounds.oriented_bounds_2D(pts)
        assert min(extents) <= BRIDGE_LIMIT_MM + 1e-6


def test_jig_top_face_is_tilted_by_the_elevation(tilted):
    import cadquery as cq

    elevation = tilted.config.spreaders.elevation
    solid = cq.importers.importStep(str(tilted.folder / "jig.step")).solids().vals()[0]
    faces = [f for f in solid.Faces() if f.geomType() == "PLANE"]
    up = [f for f in faces if f.normalAt().z > 0.5]
    top = max(up, key=lambda f: f.Area())
    tilt = math.degrees(math.acos(top.normalAt().z))
    assert tilt == pytest.approx(elevation, abs=1e-6)
    assert solid.BoundingBox().zmin == pytest.approx(0.0, abs=1e-6)
    jig = tilted.manifest["jig"]
    assert jig["made"] and jig["wedge_angle_deg"] == pytest.approx(elevation)
    assert {"jig.step", "jig.stl", "jig.dxf"} <= {p.name for p in tilted.folder.iterdir()}


def test_hub_on_the_jig_holds_the_socket_vertical(tilted):
    """Rotate the hub as the jig sets it up and the socket axis must point straight up."""
    plan, jig = tilted.plan, tilted.manifest["jig"]
    e = math.radians(jig["wedge_angle_deg"])
    for hole_id, face_id in jig["rests_on"].items():
        sock, rest = plan.hole(hole_id), plan.face(face_id)
        # jig frame: slope normal (0, -sin e, cos e); up the slope (0, cos e, sin e), away from the fence
        normal, uphill = np.array([0, -math.sin(e), math.cos(e)]), np.array([0, math.cos(e), math.sin(e)])
        # hub frame -> jig frame: the resting flat's outward normal onto -normal (it lies on the
        # slope), hub -Z (bottom face, against the fence) downhill, so hub +Z uphill
        n_h, z_h = np.array(rest.normal), np.array([0.0, 0.0, 1.0])
        A = np.stack([n_h, z_h, np.cross(n_h, z_h)])  # rows: hub basis
        B = np.stack([-normal, uphill, np.cross(-normal, uphill)])
        R = B.T @ A
        assert abs(np.linalg.det(R) - 1) < 1e-9
        assert R @ n_h == pytest.approx(-normal, abs=1e-12)
        outward = -np.array(sock.axis)
        assert R @ outward == pytest.approx([0, 0, 1], abs=1e-9), hole_id


def test_jig_drawing_carries_its_dimensions(tilted):
    import ezdxf

    jig = tilted.manifest["jig"]
    doc = ezdxf.readfile(tilted.folder / "jig.dxf")
    dims = list(doc.modelspace().query("DIMENSION"))
    measured = [d.get_measurement() for d in dims]
    for key in ("base_length_mm", "high_height_mm", "low_height_mm", "slope_length_mm", "width_mm",
                "fence_height_mm", "fence_thickness_mm"):
        assert any(abs(m - jig[key]) < 1e-3 for m in measured if isinstance(m, float)), key
    angular = [d.get_measurement() for d in dims if d.dimtype & 7 in (2, 5)]
    assert angular and angular[0] == pytest.approx(jig["wedge_angle_deg"])


def test_tip_cap_bore_is_tip_od_plus_fit(printed, cap_solid):
    tc = printed.config.tip_cap
    cap = printed.manifest["tip_cap"]
    assert cap["bore_mm"] == pytest.approx(tc.tip_diameter + tc.fit)
    assert cap["depth_mm"] == pytest.approx(tc.depth)
    modelled = cap["bore_mm"] + printed.config.print.hole_compensation
    z = cap["end_thickness_mm"] + cap["depth_mm"] / 2
    for k in range(8):
        ang = 2 * math.pi * k / 8
        r_in, r_out = modelled / 2 - 0.03, modelled / 2 + 0.08
        assert not _inside(cap_solid, (r_in * math.cos(ang), r_in * math.sin(ang), z))
        assert _inside(cap_solid, (r_out * math.cos(ang), r_out * math.sin(ang), z))
    # the closed end is solid under the bore except for the cord eye, which runs across it
    assert _inside(cap_solid, (0, 0, cap["end_thickness_mm"] - 0.5))
    assert not _inside(cap_solid, (0, 0, cap["cord_hole_z_mm"]))
    bb = cap_solid.BoundingBox()
    assert bb.zmin == pytest.approx(0, abs=1e-6)
    assert bb.zlen == pytest.approx(cap["end_thickness_mm"] + cap["depth_mm"], abs=1e-3)


def test_jig_drawing_repeats_byte_for_byte(tilted, tmp_path):
    from generators.drawings.jig_dxf import write_jig_dxf
    from generators.plan.jig import jig_plan

    jig = jig_plan(tilted.plan, tilted.config)
    write_jig_dxf(jig, tmp_path / "again.dxf", tilted.config.units)
    assert (tmp_path / "again.dxf").read_bytes() == (tilted.folder / "jig.dxf").read_bytes()
