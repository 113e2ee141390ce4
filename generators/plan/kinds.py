"""The kinds of cut a hub plan holds, in one enumerated type.

``HoleKind`` is a ``str`` enum, so a kind compares equal to its plain name (``"socket"``)
and lands in JSON as that name.
"""

from __future__ import annotations

from enum import StrEnum


class HoleKind(StrEnum):
    BORE = "bore"
    SOCKET = "socket"
    SET_SCREW = "set_screw"
    CLAMP = "clamp"
    EXTRA = "extra"
    NUT_POCKET = "nut_pocket"
    INSERT_POCKET = "insert_pocket"
    U_BOLT = "u_bolt"  # a plate hub's through hole for one U-bolt leg
    SPLIT_BOLT = "split_bolt"  # a split hub's bolt across the split (plan/split.py)
    HEAD_POCKET = "head_pocket"  # printed: the recess a split bolt's head sits in
    PIN = "pin"  # a through bolt across the hub and the mast (plan/pin.py)


# Pockets for captive nuts and heat-set inserts (printed hubs): they carry a thread for
# the screw through their clearance hole but are not drilled or tapped themselves.
POCKET_KINDS = frozenset({HoleKind.NUT_POCKET, HoleKind.INSERT_POCKET, HoleKind.HEAD_POCKET})


def is_pocket(hole) -> bool:
    """True for a nut or insert pocket (printed hubs)."""
    return hole.kind in POCKET_KINDS
