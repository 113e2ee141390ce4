"""Words for shop operations, shared by every output that shows them (templates, report).

One sentence per operation for a template's drilling order, one table row per operation for
the report's schedule; both from the same fields, so they cannot say different things.
"""

from __future__ import annotations

from generators.plan.operations import Operation
from generators.units import format_length

VERBS = {
    "mark": "Mark", "centre_punch": "Centre-punch", "wait": "Stop", "pilot": "Pilot", "drill": "Drill", "open_up": "Open up",
    "cut": "Cut", "tap": "Tap", "countersink": "Countersink", "counterbore": "Counterbore", "print": "Print",
    "clear": "Clear", "check": "Check", "fit_nut": "Fit nut", "press_insert": "Press insert",
    "match_drill": "Match-drill",
}


def depth_text(op: Operation, units: str) -> str:
    if op.through:
        return "through"
    if op.depth_mm is None:
        return "-"
    return f"{format_length(op.depth_mm, units, fractions=False)} deep"


def tilt_text(op: Operation) -> str:
    return "" if not op.tilt_deg else f"tilted {op.tilt_deg:.1f} deg (see the tilt note)"


def step_row(op: Operation, units: str) -> list[str]:
    """[step, operation, holes, tool, depth, notes]: one row of the report's schedule."""
    notes = "; ".join(x for x in (op.note, tilt_text(op)) if x)
    return [str(op.step), VERBS[op.operation].lower(), ", ".join(op.holes) or "-", op.tool,
            depth_text(op, units), notes]


def _strip(note: str, *drop: str) -> str:
    parts = [x for x in note.split("; ") if x and x not in drop]
    return "; ".join(parts)


def step_sentence(op: Operation, units: str) -> str:
    """One line of a template's drilling order (without its number)."""
    L = lambda mm: format_length(mm, units, fractions=False)  # noqa: E731
    holes = ", ".join(op.holes)
    depth = depth_text(op, units)
    extra = "; ".join(x for x in (op.note, tilt_text(op)) if x)
    size = L(op.tool_diameter_mm) if op.tool_diameter_mm else ""
    if op.operation in ("mark", "wait"):
        return ("STOP: " if op.operation == "wait" else "") + op.note[:1].upper() + op.note[1:] + "."
    if op.operation == "centre_punch":
        tail = ", with the work already tilted for the tilted holes" if op.note else ""
        return f"Centre-punch every crosshair (or spot each with a centre drill){tail}: {holes}."
    if op.operation in ("pilot", "drill"):
        head = f"{VERBS[op.operation]} {op.tool}: {holes}, {depth}"
    elif op.operation == "open_up":
        head = f"Open up to {size} with {op.tool}: {holes}, {depth}"
        extra = _strip(extra, f"to {size}")
    elif op.operation == "cut":
        head = f"Cut {size} with {op.tool}: {holes}, {depth}"
        extra = _strip(extra, size)
    elif op.operation == "tap":
        head = f"Tap {op.tool.removesuffix(' tap')}: {holes}" + (f", {depth}" if depth != "-" else "")
    elif op.operation == "countersink":
        head = f"Countersink {op.tool.removesuffix(' countersink')} to {size} across: {holes}"
        extra = _strip(extra, f"to {size} across, screw head flush")
    elif op.operation == "counterbore":
        head = f"Counterbore {size} across, {depth}: {holes}"
        extra = _strip(extra, f"{size} across, head below the surface")
    else:
        head = f"{VERBS[op.operation]} with {op.tool}" + (f": {holes}" if holes else "") + \
            (f", {depth}" if depth != "-" else "")
    return head + (f" ({extra})" if extra else "") + "."
