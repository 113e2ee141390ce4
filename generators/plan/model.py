"""The plan: plain data describing the part. Every writer builds from this alone.

Frame: origin on the mast axis at the bottom face, +Z up; azimuth from +X
counter-clockwise seen from above. Millimetres and degrees.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from generators.plan.geometry import Pt, Vec


@dataclass(frozen=True)
class Countersink:
    diameter_mm: float
    angle_deg: float


@dataclass(frozen=True)
class Counterbore:
    diameter_mm: float
    depth_mm: float


@dataclass(frozen=True)
class ThreadRun:
    """Where a tapped hole is threaded: ``length_mm`` from ``start_mm`` along the axis.

    Before ``start_mm`` (from the entry, or the counterbore floor) the hole is opened to
    ``clear_mm`` with ``clear_drill`` so the screw passes freely; None when the thread
    starts at the entry.
    """

    start_mm: float
    length_mm: float
    clear_mm: float | None = None
    clear_drill: str | None = None

    @property
    def end_mm(self) -> float:
        return self.start_mm + self.length_mm


@dataclass(frozen=True)
class Screw:
    """The screw a hole takes, chosen once in the plan (generators/plan/screws.py)."""

    designation: str  # e.g. "M6 x 12"
    kind: str  # set screw | cap screw | screw
    thread: str
    length_mm: float | None  # None where it depends on what the screw holds
    standard: str
    note: str = ""  # how it sits and how to tighten it


@dataclass(frozen=True)
class Hole:
    """One drilled, bored or milled hole.

    ``entry_mm`` is the centre of the hole where it enters the part, on the surface of
    ``face``; ``axis`` points into the part; ``depth_mm`` runs along the axis from the
    entry (through holes give their full length). ``extend_mm`` is how far the cutter
    runs on past ``depth_mm`` into a void it breaks into (bore, socket) or out of a far
    face, and ``lead_mm`` how far before the entry it starts, so no cut ends exactly on
    another surface.
    """

    id: str
    kind: str  # a generators.plan.kinds.HoleKind value
    face: str
    entry_mm: Vec
    axis: Vec
    diameter_mm: float
    depth_mm: float
    through: bool = False
    drill: str | None = None
    thread: str | None = None
    thread_percent: float | None = None
    countersink: Countersink | None = None
    counterbore: Counterbore | None = None
    extend_mm: float = 0.0
    lead_mm: float = 1.0
    spreader: int | None = None
    note: str = ""
    # Printed hubs (generators/plan/printed.py); the defaults describe a drilled hole.
    # profile: "round" | "teardrop" (a 45 deg roof towards roof_up, topped at roof_mm
    # from the axis) | "hex" (a nut pocket: diameter_mm across corners, across_flats_mm,
    # corners along slot_dir, running slot_length_mm along slot_dir out of ``face``).
    profile: str = "round"
    roof_up: Vec | None = None
    roof_mm: float | None = None
    across_flats_mm: float | None = None
    slot_dir: Vec | None = None
    slot_length_mm: float = 0.0
    serves: str | None = None  # the hole a nut or insert pocket belongs to
    nut: str | None = None
    insert: str | None = None
    compensation_mm: float = 0.0  # diametral, already included in diameter_mm
    # A blind drilled hole ends in the drill's point cone of this included angle (None: flat).
    point_deg: float | None = None
    # a blind hole drilled with a twist drill whose floor is then squared flat (the point
    # would come too near the bore): an end mill or flat-bottom cutter of the size
    flat_bottom: bool = False
    u_bolt: str | None = None  # plate hubs: the U-bolt whose leg passes here (spreader set, or none: the mast)
    slot_exit_mm: Vec | None = None  # a nut slot: where its centre line leaves the face
    tapped: ThreadRun | None = None  # where a tapped hole is threaded (None: not tapped)
    screw: Screw | None = None
    exit_face: str | None = None  # a through hole leaving by a face other than top or bottom (a pin)

    @property
    def face_radius_mm(self) -> float:
        """Radius of the hole where it opens on its face: the widest of the drilled hole, its
        countersink, its counterbore and the clearance before a thread that starts deeper."""
        run = self.tapped
        clear = run.clear_mm / 2 if run is not None and run.clear_mm is not None and run.start_mm > 0 else 0.0
        return max(self.diameter_mm / 2.0, self.countersink.diameter_mm / 2 if self.countersink else 0.0,
                   self.counterbore.diameter_mm / 2 if self.counterbore else 0.0, clear)

    @property
    def bolt_hole_mm(self) -> float:
        """The hole the fastener passes at the face: the drilled hole, or the clearance before a
        thread that starts deeper (a countersink or counterbore is its seat, not this hole)."""
        run = self.tapped
        clear = run.clear_mm if run is not None and run.clear_mm is not None and run.start_mm > 0 else 0.0
        return max(self.diameter_mm, clear)

    @property
    def radius_mm(self) -> float:
        return self.diameter_mm / 2.0

    def point_at(self, t: float) -> Vec:
        """The point ``t`` mm along the axis from the entry."""
        e, a = self.entry_mm, self.axis
        return (e[0] + a[0] * t, e[1] + a[1] * t, e[2] + a[2] * t)

    @property
    def bottom_mm(self) -> Vec:
        return self.point_at(self.depth_mm)


@dataclass(frozen=True)
class Face:
    """A flat face (or the rim of a puck) with a 2D frame for its template.

    A face point is ``origin + u*U + v*V``; looking at the face from outside, ``U`` runs
    to the right and ``V`` up. ``outline`` is the face boundary in (u, v).
    """

    id: str
    kind: str  # top | bottom | flat | chamfer | rim
    origin: Vec
    normal: Vec
    u_axis: Vec
    v_axis: Vec
    outline: tuple[Pt, ...]
    azimuth_deg: float | None = None
    label: str = ""
    rim_radius_mm: float | None = None  # rim only: radius of the surface its holes are drilled on

    def to_face(self, p: Vec) -> Pt:
        d = (p[0] - self.origin[0], p[1] - self.origin[1], p[2] - self.origin[2])
        return (
            d[0] * self.u_axis[0] + d[1] * self.u_axis[1] + d[2] * self.u_axis[2],
            d[0] * self.v_axis[0] + d[1] * self.v_axis[1] + d[2] * self.v_axis[2],
        )


@dataclass(frozen=True)
class Body:
    """The hub body before any hole: a prism (block) or a cylinder (puck)."""

    style: str  # block | puck | plate (round with diameter_mm, else a polygon)
    thickness_mm: float
    sides: int | None = None
    across_flats_mm: float | None = None
    diameter_mm: float | None = None
    corner_chamfer_mm: float = 0.0
    first_flat_azimuth_deg: float = 0.0
    outline: tuple[Pt, ...] = ()  # top view, counter-clockwise; the puck's is a fine polygon

    @property
    def outer_radius_mm(self) -> float:
        """Apothem of the block or polygon plate, radius of the puck or round plate."""
        if self.style == "puck" or (self.style == "plate" and self.diameter_mm is not None):
            return self.diameter_mm / 2.0
        return self.across_flats_mm / 2.0

    @property
    def corner_radius_mm(self) -> float:
        if self.style == "puck" or (self.style == "plate" and self.diameter_mm is not None):
            return self.diameter_mm / 2.0
        return self.outer_radius_mm / math.cos(math.pi / self.sides)


@dataclass(frozen=True)
class Spreader:
    id: int
    azimuth_deg: float
    elevation_deg: float
    socket_hole: str
    diameter_mm: float
    outward: Vec  # unit vector along the pole, pointing to the tip
    mouth_mm: Vec  # socket axis at the outer face
    bottom_mm: Vec  # socket axis where the socket ends (bore wall or socket floor)
    stop_radius_mm: float  # horizontal radius at which the pole end stops
    stop: str  # what the pole butts against


@dataclass(frozen=True)
class Mark:
    """A line to scribe on a face (a plate's pole stops and footprints), in hub coordinates."""

    face: str
    a: Vec
    b: Vec
    label: str = ""
    dashed: bool = False


@dataclass(frozen=True)
class SplitBolt:
    """One through bolt across the split: its hole, the stock cap screw and what it pulls on."""

    hole: str  # the bolt's hole id (kind split_bolt)
    offset_mm: float  # along the split plane from the mast axis (signed, along ``Split.along``)
    height_mm: float  # above the bottom face
    thread: str
    length_mm: float  # stock cap screw length under the head
    grip_mm: float  # head seat to nut (or to the thread start), across the gap
    seat_mm: Vec  # where the head seats
    nut: str | None  # the captive nut pocket's hole id (printed), None when tapped in half B
    torque_nm: float
    torque_source: str


@dataclass(frozen=True)
class SplitHalf:
    name: str  # hub-a | hub-b
    side: int  # -1: behind the plane (heads), +1: in front (nuts or threads)
    holes: tuple[str, ...]  # the cuts in this half (the bore, the bolts, shared sockets in both)
    footprint: tuple[Pt, ...]  # the half's outline seen from above, counter-clockwise


@dataclass(frozen=True)
class Split:
    """A split hub (generators/plan/split.py): the plane through the mast axis, the gap
    taken out of it and the bolts that close the gap on the mast."""

    azimuth_deg: float  # the plane's line from the mast axis, seen from above
    along: Vec  # unit, in the plane, horizontal (azimuth_deg)
    normal: Vec  # unit, horizontal, from half A into half B; the bolts run along it
    gap_mm: float
    clearance_mm: float  # the bore's diametral clearance round the mast
    interference_mm: float  # gap less clearance: what the bolts still close once the bore grips
    shared: tuple[str, ...]  # sockets the plane runs along (each half holds half the pole)
    dropped: tuple[str, ...]  # set screws left out (their sockets are shared)
    bolts: tuple[SplitBolt, ...]
    halves: tuple[SplitHalf, ...]

    def side_of(self, p: Vec) -> float:
        """Signed distance of a point from the mid-plane (positive towards half B)."""
        return p[0] * self.normal[0] + p[1] * self.normal[1] + p[2] * self.normal[2]


@dataclass(frozen=True)
class HubPlan:
    name: str
    units: str
    material: str
    process: str
    mast_designation: str
    mast_od_mm: float
    bore_mm: float
    body: Body
    faces: tuple[Face, ...]
    holes: tuple[Hole, ...]
    spreaders: tuple[Spreader, ...]
    notes: tuple[str, ...] = field(default=())
    marks: tuple[Mark, ...] = field(default=())
    split: Split | None = None  # hub.split: the halves and their bolts

    @property
    def file_stem(self) -> str:
        """The stem of the hub's solid files: ``plate`` for a plate hub, else ``hub``."""
        return "plate" if self.body.style == "plate" else "hub"

    def hole(self, hole_id: str) -> Hole:
        for h in self.holes:
            if h.id == hole_id:
                return h
        raise KeyError(hole_id)

    def face(self, face_id: str) -> Face:
        for f in self.faces:
            if f.id == face_id:
                return f
        raise KeyError(face_id)

    def holes_on(self, face_id: str) -> list[Hole]:
        return [h for h in self.holes if h.face == face_id]

