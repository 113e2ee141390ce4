"""How deep a twist drill reaches: flute length by diameter for the jobber series and the long
series (data/drill_lengths.csv, DIN 338 / DIN 340 / DIN 345, from memory); inch drills to 1/2 in
take the ASME B94.11M jobber lengths (series ``jobber_in``, from memory)."""

from __future__ import annotations

from generators.standards._data import table

SERIES_ORDER = ("jobber", "long")
SERIES_WORDS = {"jobber": "jobber-length", "long": "long-series (DIN 340 / extra-length)"}


def flute_length_mm(diameter_mm: float, series: str = "jobber", inch: bool = False) -> float | None:
    """Flute length of a drill of this diameter in the series, or None beyond the table
    (``inch``: an inch drill, whose jobber length is ASME B94.11M's where tabulated)."""
    names = ("jobber_in", "jobber") if inch and series == "jobber" else (series,)
    for name in names:
        for row in table("drill_lengths.csv"):
            if row["series"] == name and row["over_mm"] < diameter_mm <= row["to_mm"] + 1e-9:
                return row["flute_mm"]
    return None


def series_reaching(diameter_mm: float, depth_mm: float, inch: bool = False) -> str | None:
    """The shortest series whose flutes reach ``depth_mm``, or None when none does."""
    for series in SERIES_ORDER:
        flute = flute_length_mm(diameter_mm, series, inch)
        if flute is not None and depth_mm <= flute + 1e-9:
            return series
    return None


# Length of a tap's square end held in the tap wrench: about 12 mm (common practice).
TAP_GRIP_MM = 12.0


def hand_tap_reach_mm(thread) -> float | None:
    """How far below the face a hand tap's point reaches: its overall length (DIN 371 / 376,
    ASME B94.9; data/tap_lengths.csv, from memory) less the square held in the wrench; None
    for a size not in the table."""
    from generators.standards.threads import parse_thread
    from generators.units import MM_PER_IN

    t = parse_thread(thread)
    for row in table("tap_lengths.csv"):
        size = row["size"] if isinstance(row["size"], str) else f"{row['size']:g}"
        if size == t.size:
            overall = row["overall_mm"] if row["overall_mm"] is not None else row["overall_in"] * MM_PER_IN
            return overall - TAP_GRIP_MM
    return None
