"""Where a set-screw or clamp hole is threaded, and the stock screw it takes.

Both screws are driven from their face to the pole or the mast, so the hole is threaded only
over the engagement the screw needs (generators/standards/engagement.py: 1.5 D in metals,
2.5 D in plastics and wood, plus 2 pitches of tap lead, common practice), ending at the
socket or bore wall; before the thread the hole is an ISO 273 / ASME B18.2.8 normal
clearance hole, so a screw of stock length reaches the thread.

- A set screw is the shortest stock length that fills the whole thread with its point on
  the pole (the pole pushed onto the far side of its socket), never proud of the face.
- A clamp screw is a socket head cap screw whose point, with the head down, passes the bore
  wall by the bore's diametral clearance plus ``CLAMP_PASS_MM``: with the mast pushed into
  the far wall the gap at the screw equals that clearance, so the point always bites before
  the head bottoms. When no stock length reaches, the head goes down a counterbore.
"""

from __future__ import annotations

from generators.errors import UserError
from generators.plan.holes import clearance_drill
from generators.plan.model import Screw, ThreadRun

# How far past the mast surface a clamp screw's point could travel before its head would
# bottom: 1 mm (common practice: enough to tighten against, little enough to stay short).
CLAMP_PASS_MM = 1.0

SET_SCREW_STD = "socket set screw, cup point (ISO 4029 / ASME B18.3)"
# the set screw to buy for each [set_screws] point
SET_SCREW_BY_POINT = {
    "cup": SET_SCREW_STD,
    "flat": "socket set screw, flat point (ISO 4026 / ASME B18.3)",
    "dog": "socket set screw, dog point (ISO 4028 / ASME B18.3)",
    "soft": "socket set screw with a nylon (soft) tip (common practice; body as ISO 4026 / ASME B18.3)",
}
CAP_SCREW_STD = "socket head cap screw (ISO 4762 / ASME B18.3)"


def thread_run(wall_mm: float, thread, material_class: str, series) -> ThreadRun:
    """The thread ending ``wall_mm`` from the entry, only as long as it needs to be."""
    from generators.standards.engagement import tap_depth_mm
    from generators.standards.fasteners import clearance_hole

    length = min(wall_mm, tap_depth_mm(thread, material_class))
    start = wall_mm - length
    if start <= 1e-6:
        return ThreadRun(0.0, wall_mm)
    drill, dia = clearance_drill(clearance_hole(thread, "normal"), series)
    return ThreadRun(start, length, dia, drill)


def _designation(thread: str, length_mm: float, units: str) -> str:
    from generators.units import format_length

    return f"{thread} x {format_length(length_mm, units)}"


def set_screw(thread: str, gap_mm: float, start_mm: float, end_mm: float, length_mm: float | None,
              units: str, fmt, nut: bool = False, point: str = "cup", torque_nm: float | None = None) -> Screw:
    """A set screw whose point sits ``gap_mm`` from the face on the pole, threaded in
    [start_mm, end_mm] (a tapped run, a captive nut or an insert)."""
    from generators.standards.fasteners import set_screw_lengths

    lengths = set_screw_lengths(thread)
    if length_mm is None:
        fits = [x for x in lengths if x <= gap_mm + 1e-9]
        filling = [x for x in fits if x >= gap_mm - start_mm - 1e-9]
        length_mm = min(filling) if filling else (max(fits) if fits else min(lengths))
    in_thread = min(gap_mm, end_mm) - max(gap_mm - length_mm, start_mm)
    below = gap_mm - length_mm
    where = "through the captive nut" if nut else "in the thread"
    sits = f"{fmt(below)} below the face" if below >= 0 else f"{fmt(-below)} proud of the face"
    through = " through the clearance hole" if start_mm > 1e-6 else ""
    note = (f"tight on the pole it sits {sits}, {fmt(max(in_thread, 0.0))} of it {where};"
            f" tighten with a hex key{through} " + (f"to {torque_text(torque_nm, units)}, the torque the"
                                                   " crush and holding checks assume" if torque_nm else
                                                   "until it bites, then snug"))
    return Screw(designation=_designation(thread, length_mm, units), kind="set screw", thread=thread,
                 length_mm=length_mm, standard=SET_SCREW_BY_POINT.get(point, SET_SCREW_STD), note=note)


def torque_text(nm: float, units: str) -> str:
    """A tightening torque as the config's users say it (1 lbf in = 0.112985 N m, NIST SP 811)."""
    lbf_in = nm / 0.112985
    si = f"{nm:.2f}".rstrip("0").rstrip(".") if nm < 10 else f"{nm:.1f}"  # 0.75 N m stays 0.75
    return f"{lbf_in:.0f} in-lbf ({si} N m)" if units == "in" else f"{si} N m ({lbf_in:.0f} in-lbf)"


def clamp_screw(thread: str, wall_mm: float, gap_mm: float, start_mm: float, end_mm: float,
                units: str, fmt, key: str = "mast_clamp.thread", torque_nm: float | None = None) -> tuple[Screw, float]:
    """The clamp screw for a hole reaching the bore wall at ``wall_mm``, threaded in
    [start_mm, end_mm], and its counterbore depth (0 when the head stays on the face)."""
    from generators.standards.fasteners import cap_screw_lengths, cap_screw_thread_mm

    lengths = cap_screw_lengths(thread, key=key)
    reach = wall_mm + gap_mm + CLAMP_PASS_MM
    longer = [x for x in lengths if x >= reach - 1e-9]
    if longer:
        length, cbore = min(longer), 0.0
    else:
        length = max(lengths)
        cbore = reach - length
        if cbore > start_mm + 1e-9:
            raise UserError(key, f"no stock {thread} cap screw ({fmt(length)} the longest) reaches the mast"
                            f" {fmt(wall_mm)} in, even from a counterbore down to the thread",
                            "a larger thread, or a smaller hub across the flats")
    # with the mast at the far wall the point stops at wall + gap; the screw's thread must
    # span everything from there back to the start of the hole's thread
    need = wall_mm + gap_mm - start_mm
    full = cap_screw_thread_mm(thread, length) < need - 1e-9
    designation = _designation(thread, length, units) + (" fully threaded" if full else "")
    head = (f"the head stands {fmt(length - wall_mm - gap_mm)} to {fmt(length - wall_mm)} proud of the face"
            if cbore == 0 else "the head goes down the counterbore")
    note = (f"its point passes the bore wall by {fmt(length + cbore - wall_mm)} with the head down, so it bites"
            f" the mast first; {head}; thread {fmt(start_mm)} to {fmt(end_mm)} from the face;"
            + (f" tighten with the hex key to {torque_text(torque_nm, units)}, the torque the holding check assumes"
               if torque_nm else " tighten with the hex key until it bites, then a quarter turn (common practice)"))
    return Screw(designation=designation, kind="cap screw", thread=thread, length_mm=length,
                 standard=CAP_SCREW_STD, note=note), cbore


def sleeve_clamp_length(thread: str, reach_mm: float, counterbore_mm: float, fmt) -> tuple[float | None, str]:
    """The stock cap screw that reaches ``reach_mm`` from the face (through a sleeve to its
    mast) with its head on the counterbore floor, and words saying so."""
    from generators.standards.fasteners import cap_screw_lengths

    lengths = cap_screw_lengths(thread)
    need = reach_mm - counterbore_mm
    longer = [x for x in lengths if x >= need - 1e-9]
    if not longer:
        return None, (f"no stock {thread} cap screw reaches ({fmt(need)} under the head wanted, {fmt(max(lengths))}"
                      " the longest): use a slit sleeve, or a length of threaded rod with a jam nut")
    return min(longer), f"{thread} x {fmt(min(longer))}"


def tapped_extra_screw(thread: str, engaged_mm: float, fmt, start_mm: float = 0.0,
                       depth_mm: float | None = None) -> Screw:
    """A screw into a tapped extra hole (or a nut or insert ``start_mm`` down the hole):
    its length depends on what it holds."""
    if start_mm > 1e-6:
        far = f", no more than plus {fmt(depth_mm)} (the hole's depth)" if depth_mm else ""
        note = (f"length: what it holds plus at least {fmt(start_mm + engaged_mm)}, to pass through the"
                f" {fmt(engaged_mm)} of thread {fmt(start_mm)} down the hole{far}")
    else:
        note = f"length: what it holds plus up to {fmt(engaged_mm)} of thread"
    return Screw(designation=f"{thread} screw", kind="screw", thread=thread, length_mm=None,
                 standard="machine or cap screw", note=note)


def clearance_screw(thread: str, depth_mm: float, head: str, counterbore_mm: float, units: str, fmt) -> Screw:
    """A screw through a clearance hole, with a washer and a hex nut under the far face.

    ``head``: ``flat`` (countersunk, its length measured overall, head included, as it sits
    flush), ``socket`` (in a counterbore ``counterbore_mm`` deep) or ``pan`` (on the face). The
    least length reaches through the hub, the washer and the nut with two pitches past it
    (common practice); the stock length named is the first at or over it, and the note says
    what it leaves for the terminal lugs, which go between the washer and the nut."""
    from generators.standards.fasteners import cap_screw_lengths, hex_nut
    from generators.standards.threads import parse_thread
    from generators.standards.ubolts import plain_washer

    t = parse_thread(thread)
    grip = depth_mm - (counterbore_mm if head == "socket" else 0.0)
    try:
        w = plain_washer(t)
        washer, washer_text = w.thickness_mm, f"a {fmt(w.thickness_mm)} plain washer ({w.standard})"
    except UserError:
        washer, washer_text = 0.0, "no washer (none tabulated for this size)"
    try:
        nut = hex_nut(t)
    except UserError:  # no nut tabulated: the builder sizes it from the nut in hand
        return Screw(designation=f"{t.designation} screw", kind="screw", thread=t.designation, length_mm=None,
                     standard="machine screw; hex nut", note=f"length: {fmt(grip)} of hub, a washer, the nut"
                     " and two threads past it, plus the terminal lugs (no nut of this size in the tables)")
    need = grip + washer + nut.height_mm + 2 * t.pitch_mm
    over = {"flat": "overall length, head included (a flat head is measured so)",
            "socket": "length under the head, from the counterbore's floor", "pan": "length under the head"}[head]
    kind = {"flat": "flat head screw", "socket": "socket head cap screw", "pan": "pan or hex head screw"}[head]
    try:
        stock = [x for x in cap_screw_lengths(t) if x >= need - 1e-6]
    except UserError:  # no stock lengths tabulated for this size
        stock = []
    if stock:
        designation = f"{_designation(t.designation, stock[0], units)} {kind}"
        lugs = (f"; the terminal lugs go under the hub between the washer and the nut: {fmt(stock[0])}"
                f" leaves {fmt(stock[0] - need)} for them, a longer stock length for more, and one more"
                f" nut height ({fmt(nut.height_mm)}) for a second nut to lock them")
    else:
        designation = f"{t.designation} {kind}"
        lugs = ("; no stock length in the tables reaches: a screw to order, or (a plain hole) threaded rod"
                " with a nut at each end")
    note = (f"{over}: at least {fmt(need)} ({fmt(grip)} of hub, {washer_text}, a {fmt(nut.height_mm)}"
            f" hex nut and two threads past it){lugs}; stainless or brass outdoors")
    return Screw(designation=designation, kind="screw", thread=t.designation,
                 length_mm=stock[0] if stock else None, standard=f"{kind}; nut {nut.standard}", note=note)
