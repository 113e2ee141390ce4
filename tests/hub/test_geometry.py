"""Point probes on the re-imported STEP solid against the manifest and the config.

Each probe point is chosen (tests/hub/probes.py) so that an independent model built
from the config's body and the manifest's holes says for certain whether it is
material or void; the CAD kernel's solid classifier (OCP BRepClass3d_SolidClassifier
via cadquery ``Solid.isInside``) then answers for the solid that ships.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from .conftest import CASES
from .probes import Oracle, perpendiculars, unit

pytestmark = pytest.mark.slow

NAMES = sorted(CASES)
PROBE_TOL = 1e-5  # classifier tolerance, well below every probe offset (>= 0.01 mm)
EPS = 0.01  # how far a probe sits off a face it checks (mm): the entry lies on its face within this


class Classifier:
    """OCP BRepClass3d_SolidClassifier loaded once per solid (what cadquery's
    ``Solid.isInside`` builds afresh on every call); ON a face counts as material."""

    def __init__(self, solid):
        from OCP.BRepClass3d import BRepClass3d_SolidClassifier

        self._c = BRepClass3d_SolidClassifier(solid.wrapped)

    def __call__(self, p) -> bool:
        from OCP.gp import gp_Pnt
        from OCP.TopAbs import TopAbs_IN, TopAbs_ON

        self._c.Perform(gp_Pnt(*map(float, p)), PROBE_TOL)
        return self._c.State() in (TopAbs_IN, TopAbs_ON)


class Probe:
    """Collects every disagreement so one failing test lists all of them."""

    def __init__(self, b):
        self.b = b
        self.oracle = Oracle(b.config, b.manifest)
        self.errors: list[str] = []
        self.count = 0
        self.solid_at = Classifier(b.solid)

    def expect(self, p, material: bool, what: str):
        self.count += 1
        got = self.solid_at(p)
        if got != material:
            xyz = ", ".join(f"{c:.3f}" for c in p)
            self.errors.append(f"{what}: expected {'material' if material else 'void'} at ({xyz})")

    def check(self):
        assert not self.errors, f"{self.b.name}: {len(self.errors)} of {self.count} probes disagree:\n" \
            + "\n".join(self.errors)


@pytest.fixture(params=NAMES)
def probe(request, build_case):
    return Probe(build_case(request.param))


def _socket_of(oracle, hole):
    """The socket a set screw runs into: the one whose axis passes through its bottom."""
    sockets = [h for h in oracle.holes if h.kind == "socket"]
    return min(sockets, key=lambda s: np.linalg.norm(np.cross(hole.bottom - s.entry, s.axis)))


def test_void_along_every_hole_axis(probe):
    """Just inside the entry and at mid-depth (and the quarter points of the long
    sockets): void. Void probes are the classifier's slow case, so only these."""
    body = probe.oracle.body
    for h in probe.oracle.holes:
        ts = [0.3, h.depth / 2] + ([h.depth / 4, 3 * h.depth / 4] if h.kind == "socket" else [])
        for t in ts:
            p = h.at(t)
            assert body.depth_inside(p) > 0, f"{h.id} at t={t:.2f} is outside the configured body"
            probe.expect(p, False, f"{h.id} axis at {t:.2f} mm from entry")
    probe.check()


def test_diameter_void_inside_material_just_outside(probe):
    """0.1 mm inside the drilled radius is void, 0.1 mm outside is material, at a depth
    and side where no other hole is (chosen from the manifest)."""
    missing = []
    for h in probe.oracle.holes:
        found = probe.oracle.material_beside(h, gap=0.1)
        if found is None:
            missing.append(h.id)
            continue
        t, u = found
        c = h.at(t)
        probe.expect(c + u * (h.r - 0.1), False, f"{h.id} just inside its radius at {t:.2f} mm")
        probe.expect(c + u * (h.r + 0.1), True, f"{h.id} just outside its radius at {t:.2f} mm")
    assert not missing, f"no clear spot beside {missing} (holes crowd each other)"
    probe.check()


def test_hole_bottoms_are_where_the_manifest_says(probe):
    o, cfg = probe.oracle, probe.b.config
    bore_r = (cfg.hub.bore if cfg.hub.bore is not None else cfg.mast.size.od_mm + cfg.mast.clearance) / 2
    blind_sockets = cfg.spreaders.socket_depth != "to-bore"
    for h in o.holes:
        if h.kind == "bore" or h.through:
            # a through hole's full length ends on the far face
            assert abs(o.body.depth_inside(h.bottom)) < 1e-6, f"{h.id} does not end on the far face"
            probe.expect(h.at(h.depth - 0.2), False, f"{h.id} just before its exit")
        elif h.kind == "extra" or (h.kind == "socket" and blind_sockets):
            probe.expect(h.at(h.depth - 0.2), False, f"{h.id} just before its bottom")
            if h.tip:  # the drill point: void on the axis half way down the cone
                probe.expect(h.at(h.depth + h.tip / 2), False, f"{h.id} inside its drill point")
            after = h.at(h.depth + h.tip + 0.2)
            clear = o.body.depth_inside(after) >= 0.2 and all(
                x.keep_out(after) >= 0.2 for x in o.holes if x.id != h.id)
            assert clear, f"{h.id}: the point past its bottom is not clear of other holes"
            probe.expect(after, True, f"{h.id} just past its bottom")
        elif h.kind in ("socket", "clamp"):
            # runs into the bore: the bottom (on the axis) lies on the bore's wall
            assert math.hypot(h.bottom[0], h.bottom[1]) == pytest.approx(bore_r, abs=1e-4), h.id
            probe.expect(h.at(h.depth - 0.3), False, f"{h.id} just before the bore")
            probe.expect(h.at(h.depth + 0.3), False, f"{h.id} just inside the bore")
        elif h.kind == "set_screw":
            s = _socket_of(o, h)
            off_axis = np.linalg.norm(np.cross(h.bottom - s.entry, s.axis))
            assert off_axis < 1e-3, f"{h.id} ends {off_axis:.3f} mm off the socket axis"
            # a line at angle g to a cylinder's axis crosses it over a half-chord of
            # r / sin(g) (plane section of a cylinder); here g = angle(pilot, socket)
            g = math.acos(min(1.0, abs(float(np.dot(h.axis, s.axis)))))
            half = s.r / math.sin(g)
            probe.expect(h.at(h.depth + half - 0.2), False, f"{h.id} inside socket {s.id} before its far wall")
            probe.expect(h.at(h.depth + half + 0.2), True, f"{h.id} past the far wall of {s.id}")
            probe.expect(h.at(h.depth + half + 1.0), True, f"{h.id} 1 mm past the far wall of {s.id}")
        else:
            pytest.fail(f"unknown hole kind {h.kind}")
    probe.check()


def _face_directions(h):
    n = h.face_normal()
    if h.face == "rim":  # curved face: stay on the cylinder's straight generatrix
        return [np.array([0.0, 0.0, 1.0]), np.array([0.0, 0.0, -1.0])]
    return [unit(d - n * np.dot(d, n)) for d in perpendiculars(n, 12)]


def test_every_entry_lies_on_its_face(probe):
    """Beside the mouth, EPS inside the face's plane is material and EPS outside is not:
    the face the hole is drilled from passes through the manifest's entry point."""
    o = probe.oracle
    missing = []
    for h in o.holes:
        n = h.face_normal()
        # the mouth of a hole at angle to its face is an ellipse with semi-major r / cos
        reach = h.outer_r / abs(float(np.dot(h.axis, n))) + 0.5
        for w in _face_directions(h):
            p = h.entry + w * reach
            deep = p - n * 0.5
            if o.body.depth_inside(deep) >= 0.2 and all(x.keep_out(deep) >= 0.2 for x in o.holes) \
                    and all(x.keep_out(p) >= 0.2 for x in o.holes):
                probe.expect(p - n * EPS, True, f"{h.id}: {EPS} mm inside its face ({h.face})")
                probe.expect(p + n * EPS, False, f"{h.id}: {EPS} mm outside its face ({h.face})")
                break
        else:
            missing.append(h.id)
    assert not missing, f"no clear spot on the face beside {missing}"
    probe.check()


def test_material_between_neighbouring_sockets(probe):
    """On the bisector between two neighbouring sockets, near where they come closest,
    there is material (the web the plan promises)."""
    o = probe.oracle
    sockets = sorted((h for h in o.holes if h.kind == "socket"),
                     key=lambda h: math.atan2(-h.axis[1], -h.axis[0]) % (2 * math.pi))
    for a, b in zip(sockets, sockets[1:] + sockets[:1]):
        inner = min(math.hypot(*a.bottom[:2]), math.hypot(*b.bottom[:2]))
        mid = unit(unit(-a.axis[:2]) + unit(-b.axis[:2]))
        found = None
        for rho in np.arange(inner, inner + 30.0, 0.5):
            z_axis = (a.bottom[2] + (rho - inner) * math.tan(math.asin(-a.axis[2])))
            # wide enough to pass a through bolt on the bisector (the web it crosses)
            for dz in (0.0, 1.0, -1.0, 2.0, -2.0, 4.0, -4.0, 6.0, -6.0, 8.0, -8.0, 10.0, -10.0):
                p = np.array([mid[0] * rho, mid[1] * rho, z_axis + dz])
                if o.surely_material(p, 0.2):
                    found = p
                    break
            if found is not None:
                break
        assert found is not None, f"no web found between {a.id} and {b.id}"
        probe.expect(found, True, f"web between {a.id} and {b.id}")
    probe.check()


def test_countersinks_and_counterbores_have_their_sizes(probe):
    o = probe.oracle
    recessed = [h for h in o.holes if h.cs or h.cb]
    if not recessed:
        pytest.skip("no countersunk or counterbored hole in this config")
    for h in recessed:
        u = next(u for u in perpendiculars(h.axis, 24)
                 if all(x.keep_out(h.entry + u * (h.outer_r + 0.5) + h.axis * 0.3) >= 0.2
                        for x in o.holes if x.id != h.id))
        if h.cb:
            R, d = h.cb["diameter_mm"] / 2, h.cb["depth_mm"]
            probe.expect(h.at(d / 2) + u * (R - 0.1), False, f"{h.id} inside the counterbore")
            probe.expect(h.at(d / 2) + u * (R + 0.1), True, f"{h.id} outside the counterbore")
            mid_r = (R + h.r) / 2
            probe.expect(h.at(d - 0.1) + u * mid_r, False, f"{h.id} just above the counterbore floor")
            probe.expect(h.at(d + 0.1) + u * mid_r, True, f"{h.id} just below the counterbore floor")
        else:
            R = h.cs["diameter_mm"] / 2
            half = math.radians(h.cs["angle_deg"] / 2)
            t = h.recess_depth / 2
            cone_r = R - t * math.tan(half)  # cone radius at depth t (straight-sided cone)
            probe.expect(h.at(t) + u * (cone_r - 0.1), False, f"{h.id} inside the countersink cone")
            probe.expect(h.at(t) + u * (cone_r + 0.1), True, f"{h.id} outside the countersink cone")
            probe.expect(h.at(EPS) + u * (R + 0.1), True, f"{h.id} outside the countersink rim")
    probe.check()


@pytest.mark.parametrize("name", NAMES)
def test_bounding_box_is_the_configured_body(build_case, name):
    """Measured extents of the solid: thickness; across flats along every flat normal
    and across corners for a block; the diameter for a puck."""
    b = build_case(name)
    hub = b.config.hub
    bb = b.solid.BoundingBox()
    assert bb.zmin == pytest.approx(0.0, abs=0.01)
    assert bb.zmax == pytest.approx(hub.thickness, abs=0.01)
    if hub.style == "puck":
        assert bb.xlen == pytest.approx(hub.diameter, abs=0.01)
        assert bb.ylen == pytest.approx(hub.diameter, abs=0.01)
        assert (bb.xmin + bb.xmax) / 2 == pytest.approx(0.0, abs=0.01)
        return
    n = hub.sides or b.config.spreaders.count
    assert n % 2 == 0, "the cases use even-sided blocks so across flats is flat to flat"
    # regular polygon: across corners = across flats / cos(pi/n) (standard plane geometry);
    # a corner chamfer of width c moves each corner in by (c/2) tan(pi/n)
    across_corners = hub.across_flats / math.cos(math.pi / n) - hub.corner_chamfer * math.tan(math.pi / n)
    for k in range(n):
        az = b.config.spreaders.first_azimuth + k * 360 / n
        for angle, expected in ((az, hub.across_flats), (az + 180 / n, across_corners)):
            turned = b.solid.rotate((0, 0, 0), (0, 0, 1), -angle).BoundingBox()
            assert turned.xlen == pytest.approx(expected, abs=0.01), f"{name}: extent at {angle:.1f} deg"
            assert turned.xmax == pytest.approx(expected / 2, abs=0.01), f"{name}: centred at {angle:.1f} deg"
