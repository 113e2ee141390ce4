"""The short summary ``build`` prints: what was made, key sizes in the config's units, where."""

from __future__ import annotations

from generators.units import format_both

CAUTION = ("Caution: keep masts and antennas clear of power lines; wear eye protection when drilling;"
           " follow local codes and the mast maker's ratings.")


def summary_lines(result) -> list[str]:
    m = result.manifest
    units = m["units_in_config"]
    hub = m["hub"]
    size = (f"{format_both(hub['across_flats_mm'], units)} across flats, {hub['sides']} sides"
            if "across_flats_mm" in hub else f"{format_both(hub['diameter_mm'], units)} diameter")
    plate = m.get("plate")
    held = (f"two U-bolts {format_both(plate['mast_u_bolt_spacing_mm'], units)} apart through the plate"
            if plate else f"bore {format_both(hub['bore_mm'], units)}")
    sockets = [h for h in m["holes"] if h["kind"] == "socket"]
    counts: dict[str, int] = {}
    for h in m["holes"]:
        counts[h["kind"]] = counts.get(h["kind"], 0) + 1
    lines = [
        f"built {m['name']}: {hub['style']} hub, {size}, {format_both(hub['thickness_mm'], units)} thick",
        f"  mast   {m['mast']['designation']} -> OD {format_both(m['mast']['od_mm'], units)};"
        f" {held}",
        _sockets_line(sockets, m["spreaders"], units) if sockets else
        f"  poles  {len(m['spreaders'])} x {format_both(m['spreaders'][0]['diameter_mm'], units)} flat on the plate,"
        " two U-bolts each" if plate else "  no sockets",
        "  holes  " + ", ".join(f"{n} {k}" for k, n in counts.items()),
    ]
    if "mass_g" in hub:
        lb = f" ({hub['mass_g'] / 453.59237:.2f} lb)" if units == "in" else ""  # 1 lb = 453.59237 g, exact
        lines.append(f"  mass   {hub['mass_g']:.0f} g{lb} in {hub['material']}")
    lines += list(result.summary)
    for note in m.get("notes", []):
        lines.append(f"  note: {note}")
    lines.append(f"  files  {result.folder}/ ({', '.join(_file_list(m['files']) + ['manifest.json'])})")
    lines.append(CAUTION)
    return lines


def _file_list(files) -> list[str]:
    """Top-level files by name; a subfolder as one entry with its file count."""
    top, folders = [], {}
    for name in sorted(files):
        head, sep, _ = name.partition("/")
        if sep:
            folders[head] = folders.get(head, 0) + 1
        else:
            top.append(name)
    return top + [f"{d}/ ({n} files)" for d, n in sorted(folders.items())]


def _sockets_line(sockets: list[dict], spreaders: list[dict], units: str) -> str:
    """One line for the sockets; each named when [[sockets]] makes them differ."""
    kinds = {(round(h["diameter_mm"], 3), round(s["elevation_deg"], 3)) for h, s in zip(sockets, spreaders)}
    if len(kinds) == 1:
        return (f"  sockets {len(sockets)} x {format_both(sockets[0]['diameter_mm'], units)}"
                f" at {spreaders[0]['elevation_deg']:g} deg elevation")
    return "  sockets " + ", ".join(f"{h['id']} {format_both(h['diameter_mm'], units)} at {s['elevation_deg']:g} deg"
                                     for h, s in zip(sockets, spreaders))
