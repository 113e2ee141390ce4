"""Frozen config models, one per TOML section. Lengths in mm, angles in degrees.

Defaults that are shop rules rather than standards are marked common practice.
"""

from __future__ import annotations

from typing import Annotated, Literal

from pydantic import BaseModel, BeforeValidator, ConfigDict, Field, ValidationInfo, field_validator, model_validator

from generators.config.fields import Angle, Azimuth, Force, Length, Mass, Speed, Torque, _units, _wrap
from generators.errors import UserError
from generators.units import length_mm


class Section(BaseModel):
    model_config = ConfigDict(frozen=True, extra="forbid", arbitrary_types_allowed=True)


def _thread(value, info: ValidationInfo):
    from generators.standards.threads import Thread, parse_thread

    if isinstance(value, Thread):
        return value
    if not isinstance(value, str):
        raise UserError("", f"expected a thread designation string, got {value!r}",
                        'e.g. "1/4-20", "#10-24", "M6", "M8x1"')
    return parse_thread(value, key=info.field_name or "thread")


def _mast(value, info: ValidationInfo):
    from generators.standards.pipes import MastSize, resolve_mast

    if isinstance(value, MastSize):
        return value
    return resolve_mast(value, key=info.field_name or "size", units=_units(info))


def _material(value, info: ValidationInfo):
    from generators.standards.materials import get_material

    if not isinstance(value, str):
        raise UserError("", f"expected a material id, got {value!r}")
    return get_material(value, key=info.field_name or "material").id


ThreadSpec = Annotated[object, BeforeValidator(_wrap(_thread))]
MastSpec = Annotated[object, BeforeValidator(_wrap(_mast))]
MaterialId = Annotated[str, BeforeValidator(_wrap(_material))]
PositiveLength = Annotated[Length, Field(gt=0)]

# Diametral clearance of the bore around the mast when none is given: 1.0 mm, enough to
# slide over a painted or slightly out-of-round tube (common practice).
DEFAULT_MAST_CLEARANCE_MM = 1.0
# Diametral fit of a spreader pole in its socket: 0.5 mm (common practice for
# fiberglass poles, whose OD varies a few tenths along the pole).
DEFAULT_SPREADER_FIT_MM = 0.5


class Mast(Section):
    size: MastSpec
    clearance: Annotated[Length, Field(ge=0, le=25)] = DEFAULT_MAST_CLEARANCE_MM


class Hub(Section):
    style: Literal["block", "puck", "plate"] = "block"
    sides: Annotated[int, Field(ge=3, le=48)] | None = None
    across_flats: PositiveLength | None = None
    diameter: PositiveLength | None = None
    thickness: PositiveLength
    bore: PositiveLength | None = None
    corner_chamfer: Annotated[Length, Field(ge=0)] = 0.0
    material: MaterialId = "hdpe"
    process: Literal["machined", "printed"] = "machined"
    max_mass: Annotated[Mass, Field(gt=0)] | None = None  # grams; a limit the user sets
    split: bool = False  # two halves joined by bolts across a plane through the mast axis ([split])

    @model_validator(mode="after")
    def _size_given(self):
        if self.style == "block" and self.across_flats is None:
            raise ValueError("across_flats: a block hub needs across_flats (a length)")
        if self.style == "puck" and self.diameter is None:
            raise ValueError("diameter: a puck hub needs diameter (a length)")
        if self.style == "block" and self.diameter is not None:
            raise ValueError("diameter: only a puck has a diameter (a block uses across_flats)")
        if self.style == "puck" and (self.across_flats is not None or self.sides is not None):
            raise ValueError("across_flats: a puck has no flats (use diameter, or style = \"block\")")
        if self.style == "plate" and (self.diameter is None) == (self.across_flats is None):
            raise ValueError("diameter: a plate needs diameter (round) or across_flats (a polygon), one of them")
        if self.style == "plate" and self.diameter is not None and self.sides is not None:
            raise ValueError("sides: a round plate has no sides (use across_flats for a polygon)")
        return self


# The saw kerf (or printed gap) between the halves of a split hub: 1 mm (common practice
# for split clamps; the bolts close it onto the mast).
DEFAULT_SPLIT_GAP_MM = 1.0


class Split(Section):
    """A split hub's own keys (hub.split = true); the defaults are in generators/plan/split.py."""

    thread: ThreadSpec | None = None  # the through bolts; default M5 (mm configs) or #10-24 (inch)
    gap: Annotated[Length, Field(gt=0, le=20)] = DEFAULT_SPLIT_GAP_MM
    azimuth: Azimuth | None = None  # the split plane's line; default between sockets 1 and 2
    height: Annotated[Length, Field(ge=0)] | None = None  # bolt axes above the bottom face
    offset: PositiveLength | None = None  # bolt axes from the mast axis, along the split plane
    torque: Annotated[Torque, Field(gt=0, le=500)] | None = None  # N m; default: tightening table


class Plate(Section):
    """A plate hub's own keys (hub.style = "plate"); the defaults are in generators/plan/plate.py."""

    u_bolts: Literal["metric", "inch"] | None = None  # U-bolt family; default: the config's units
    mast_azimuth: Azimuth | None = None  # the mast's line on the plate; default between spreaders 1 and 2
    mast_u_bolt_spacing: PositiveLength | None = None  # between the two mast U-bolts, along the mast
    u_bolt_spacing: PositiveLength | None = None  # between a spreader's two U-bolts, along the pole
    edge_margin: PositiveLength | None = None  # plate edge to the outer U-bolt's legs


class Spreaders(Section):
    count: Annotated[int, Field(ge=3, le=12)]
    # a pole under 2 mm is no spreader; the bound keeps the wind stress finite (common practice)
    diameter: Annotated[Length, Field(ge=2)]
    fit: Annotated[Length, Field(ge=0, le=10)] = DEFAULT_SPREADER_FIT_MM
    elevation: Annotated[Angle, Field(ge=0, le=45)] = 0.0
    first_azimuth: Azimuth = 0.0
    socket_depth: Literal["to-bore"] | float = "to-bore"
    tip_radius: PositiveLength | None = None
    tip_spacing: PositiveLength | None = None
    tip_allowance: Annotated[Length, Field(ge=0)] | None = None
    wall: PositiveLength | None = None
    inner_diameter: PositiveLength | None = None

    @field_validator("socket_depth", mode="before")
    @classmethod
    def _depth(cls, value, info: ValidationInfo):
        if value == "to-bore":
            return value
        if isinstance(value, str) and not any(c.isdigit() for c in value):
            raise ValueError(f"{value!r} is not accepted ('to-bore' or a length from the outer face)")
        mm = _wrap(lambda v, i: length_mm(v, "", _units(i)))(value, info)
        if mm <= 0:
            raise ValueError(f"{value!r} is not accepted ('to-bore' or a positive length from the outer face)")
        return mm

    @model_validator(mode="after")
    def _tips(self):
        if self.tip_radius is not None and self.tip_spacing is not None:
            raise ValueError("tip_spacing: give tip_radius or tip_spacing, not both")
        if self.wall is not None and self.inner_diameter is not None:
            raise ValueError("inner_diameter: give wall or inner_diameter, not both")
        if self.inner_diameter is not None and self.inner_diameter >= self.diameter:
            raise ValueError("inner_diameter: the pole's inside diameter must be smaller than"
                             " spreaders.diameter (a tube has a wall)")
        if self.wall is not None and 2 * self.wall >= self.diameter:
            raise ValueError("wall: two walls must be thinner than spreaders.diameter"
                             " (leave wall out for a solid rod)")
        return self


class SocketOverride(Section):
    """One socket made unlike the rest: ``index`` is the spreader number (socket S<index>)."""

    index: Annotated[int, Field(ge=1)]
    diameter: Annotated[Length, Field(ge=2)] | None = None  # the pole OD in this socket
    fit: Annotated[Length, Field(ge=0, le=10)] | None = None
    # -45 to 45 deg: a negative elevation falls outward (alternate spreaders of a spider frame)
    elevation: Annotated[Angle, Field(ge=-45, le=45)] | None = None
    azimuth: Azimuth | None = None


class SetScrews(Section):
    thread: ThreadSpec
    per_spreader: Literal[0, 1, 2] = 1
    face: Literal["top", "bottom"] = "top"
    position: PositiveLength | None = None
    length: PositiveLength | None = None
    point: Literal["cup", "flat", "dog", "soft"] = "cup"  # ISO 4026-4029 / ASME B18.3 point
    torque: Annotated[Torque, Field(gt=0, le=500)] | None = None  # N m; default: tightening table


class MastClamp(Section):
    thread: ThreadSpec
    count: Annotated[int, Field(ge=1, le=12)] = 1
    torque: Annotated[Torque, Field(gt=0, le=500)] | None = None  # N m; default: tightening table
    height: Annotated[Length, Field(ge=0)] | None = None  # clamp axis above the bottom face; default mid-thickness
    # azimuths of the clamp holes; default: 90 deg apart for two, 120 deg for three
    # (generators/plan/clamp_places.py); count defaults to how many are given
    azimuths: tuple[Azimuth, ...] | None = None

    @model_validator(mode="before")
    @classmethod
    def _count_from_azimuths(cls, data):
        if isinstance(data, dict) and isinstance(data.get("azimuths"), (list, tuple)):
            n = len(data["azimuths"])
            if "count" not in data:
                data = {**data, "count": n}
            elif data["count"] != n:
                raise ValueError(f"azimuths: {n} azimuths given for count = {data['count']}"
                                 " (give as many azimuths as clamp screws, or leave count out)")
        return data

    @model_validator(mode="after")
    def _azimuths_apart(self):
        if self.azimuths:
            seen = sorted(a % 360 for a in self.azimuths)
            for a, b in zip(seen, seen[1:] + [seen[0] + 360]):
                if len(seen) > 1 and abs(b - a) < 1e-6:
                    raise ValueError(f"azimuths: {a:g} deg is given twice (one clamp screw per azimuth)")
        return self


def _bolt_thread(value, info: ValidationInfo):
    from generators.standards.bolts import check_bolt_thread

    return check_bolt_thread(_thread(value, info), key=info.field_name or "thread")


class MastPin(Section):
    """A through bolt (or threaded rod) across the hub and the mast (generators/plan/pin.py)."""

    thread: Annotated[object, BeforeValidator(_wrap(_bolt_thread))]
    height: Annotated[Length, Field(ge=0)] | None = None  # axis above the bottom face; default: the clamp height, else mid-thickness
    azimuth: Azimuth | None = None  # default: the first gap between sockets whose opposite end is also one


class ExtraHole(Section):
    id: Annotated[str, Field(min_length=1, max_length=24, pattern=r"^[A-Za-z0-9_.-]+$")]
    face: Literal["top", "bottom"] = "top"
    at: tuple[Length, Length]
    thread: ThreadSpec | None = None
    clearance: ThreadSpec | None = None
    fit: Literal["close", "normal", "loose"] = "normal"
    diameter: PositiveLength | None = None
    depth: PositiveLength | None = None
    through: bool | None = None
    countersink: bool = False
    counterbore: bool = False

    @model_validator(mode="after")
    def _one_kind(self):
        given = [k for k in ("thread", "clearance", "diameter") if getattr(self, k) is not None]
        if len(given) != 1:
            raise ValueError("thread: give exactly one of thread, clearance or diameter"
                             f" (got {', '.join(given) or 'none'})")
        if self.countersink and self.counterbore:
            raise ValueError("counterbore: a hole takes a countersink or a counterbore, not both")
        if (self.countersink or self.counterbore) and self.thread is not None:
            raise ValueError("countersink: a countersink or counterbore goes on a clearance hole,"
                             " not a tapped one (use clearance = \"...\")")
        if self.depth is not None and self.through:
            raise ValueError("depth: give depth or through = true, not both")
        return self


class Shop(Section):
    drills: tuple[Literal["fractional", "number", "letter", "metric"], ...] | None = None


class Output(Section):
    tolerance: Annotated[Length, Field(ge=0.005, le=1.0)] = 0.05
    angular_tolerance: Annotated[Angle, Field(ge=1, le=30)] = 10.0
    paper: Literal["letter", "a4"] | None = None


class Loads(Section):
    wind_speed: Annotated[Speed, Field(gt=0, le=120)] = 40.0
    drag_coefficient: Annotated[float, Field(gt=0, le=3)] = 1.2
    air_density: Annotated[float, Field(gt=0, le=2)] = 1.225
    wire_diameter: Annotated[Length, Field(ge=0)] = 0.0
    wire_length_per_spreader: Annotated[Length, Field(ge=0)] = 0.0
    spreader_material: MaterialId = "fiberglass"
    wire_tension: Annotated[Force, Field(ge=0, le=5000)] = 0.0  # N pre-tension at each tip
    wire_angle: Annotated[Angle, Field(ge=0, le=180)] = 90.0  # wire pull from the pole axis
    ice_thickness: Annotated[Length, Field(ge=0, le=100)] = 0.0  # radial ice (plan/ice.py)
    height: Annotated[Length, Field(ge=1000, le=200000)] | None = None  # 1 to 200 m above ground: EN 1991-1-4 peak pressure (plan/wind_height.py)
    terrain: Literal["0", "I", "II", "III", "IV"] = "II"  # EN 1991-1-4 table 4.1; II open country


class Reducer(Section):
    """A reducer sleeve for another mast; the defaults are in generators/plan/reducer.py."""

    mast: MastSpec
    flange: bool = False
    slit: bool = False
    key: bool = False
    process: Literal["machined", "printed"] | None = None  # default: hub.process
    fit: Annotated[Length, Field(ge=0, le=5)] | None = None  # diametral, sleeve OD to bore
    clearance: Annotated[Length, Field(ge=0, le=25)] | None = None  # diametral, mast to sleeve ID
    length: PositiveLength | None = None  # default: hub.thickness


def _bed(value, info: ValidationInfo):
    from generators.config.bed import parse_bed

    if isinstance(value, tuple):
        return value
    return parse_bed(value, info.field_name or "bed", _units(info))


class Print(Section):
    # the printer's build volume, width x depth x height: "250 x 210 x 210 mm"
    bed: Annotated[tuple[float, float, float], BeforeValidator(_wrap(_bed))] | None = None
    hole_compensation: Annotated[Length, Field(ge=0, le=2)] = 0.3
    line_width: Annotated[Length, Field(gt=0, le=2)] = 0.45
    insert_hole: PositiveLength | None = None
    insert_depth: PositiveLength | None = None
    nut_allowance: Annotated[Length, Field(ge=0, le=2)] = 0.3


class TipCap(Section):
    tip_diameter: PositiveLength
    fit: Annotated[Length, Field(ge=0, le=5)] = 0.4
    depth: PositiveLength = 25.0
    cord_diameter: PositiveLength = 3.0


class Config(Section):
    """A whole hubwright config; every length in mm, every angle in degrees."""

    name: Annotated[str, Field(min_length=1, max_length=64)]
    units: Literal["mm", "in"] = "mm"
    description: str = ""
    mast: Mast
    hub: Hub
    spreaders: Spreaders
    set_screws: SetScrews | None = None
    mast_clamp: MastClamp | None = None
    mast_pin: MastPin | None = None
    holes: tuple[ExtraHole, ...] = ()
    shop: Shop = Shop()
    output: Output = Output()
    loads: Loads = Loads()
    reducers: tuple[Reducer, ...] = ()
    print: Print = Print()
    tip_cap: TipCap | None = None
    plate: Plate | None = None
    split: Split | None = None
    sockets: tuple[SocketOverride, ...] = ()

    @field_validator("name")
    @classmethod
    def _safe_name(cls, value: str) -> str:
        import re

        if not re.fullmatch(r"[A-Za-z0-9][A-Za-z0-9_.-]*", value) or ".." in value:
            raise ValueError(f"{value!r} cannot name an output folder"
                             " (letters, digits, '-', '_' and '.', starting with a letter or digit)")
        return value

    @model_validator(mode="after")
    def _plate_section(self):
        if self.plate is not None and self.hub.style != "plate":
            raise ValueError("plate: [plate] is for hub.style = \"plate\" only")
        if self.mast_pin is not None and self.hub.style == "plate":
            raise ValueError("mast_pin: a plate hub is held by its mast U-bolts (leave [mast_pin] out,"
                             " or use hub.style = \"block\" or \"puck\")")
        return self

    @model_validator(mode="after")
    def _split_section(self):
        if self.hub.split and self.hub.style == "plate":
            raise UserError("hub.split", "a plate hub has no bore to split", "hub.split on a block or puck")
        if self.split is not None and not self.hub.split:
            raise UserError("split", "[split] is for hub.split = true only", "hub.split = true, or no [split]")
        return self

    @model_validator(mode="after")
    def _unique_hole_ids(self):
        seen = set()
        for hole in self.holes:
            if hole.id in seen:
                raise ValueError(f"holes: hole id {hole.id!r} is used twice (each [[holes]] id must be unique)")
            seen.add(hole.id)
        return self

    @model_validator(mode="after")
    def _socket_indexes(self):
        seen = set()
        n = self.spreaders.count
        for k, s in enumerate(self.sockets):
            if s.index > n:
                raise UserError(f"sockets[{k}].index", f"there is no socket S{s.index}",
                                f"1 to {n} (spreaders.count)")
            if s.index in seen:
                raise UserError(f"sockets[{k}].index", f"socket S{s.index} is overridden twice",
                                "one [[sockets]] table per index")
            if s.diameter is not None and self.spreaders.inner_diameter is not None:
                raise UserError(f"sockets[{k}].diameter", "a pole of its own size with one"
                                " spreaders.inner_diameter for all", "give spreaders.wall instead")
            if s.diameter is not None and self.spreaders.wall is not None and 2 * self.spreaders.wall >= s.diameter:
                raise UserError(f"sockets[{k}].diameter", "two spreaders.wall are thicker than this pole",
                                "a larger diameter or a thinner wall")
            seen.add(s.index)
        return self
