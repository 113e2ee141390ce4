"""Read a build's drilling operations back from its report and templates, to compare with the
manifest's ``operations`` (the three must agree step by step)."""

from __future__ import annotations

import re


def report_rows(md: str) -> list[tuple[str, int, tuple[str, ...], str]]:
    """(face, step, holes, tool) for every row of the report's schedule tables."""
    rows, face = [], None
    for line in md.splitlines():
        head = re.match(r"^### \d+\. (\S+)", line)
        if head:
            face = head.group(1)
            continue
        if line.startswith("## "):
            face = None
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if face and line.startswith("| ") and cells and cells[0].isdigit():
            holes = tuple(h for h in cells[2].split(", ") if h and h != "-")
            rows.append((face, int(cells[0]), holes, cells[3]))
    return rows


def manifest_rows(manifest: dict) -> list[tuple[str, int, tuple[str, ...], str]]:
    return sorted((o["face"], o["step"], tuple(o["holes"]), o["tool"].replace("|", "/"))
                  for o in manifest["operations"])


def template_order_problems(text_of_face, manifest: dict) -> list[str]:
    """Steps missing from a face's template text, out of order, or without their holes."""
    problems = []
    for face in sorted({o["face"] for o in manifest["operations"]}):
        text, at = text_of_face(face), -1
        for o in sorted((o for o in manifest["operations"] if o["face"] == face), key=lambda o: o["step"]):
            pos = text.find(f"{o['step']}. ", at + 1)
            if pos <= at:
                problems.append(f"{face} step {o['step']}: missing or out of order")
                continue
            window = text[pos:pos + 400]
            problems += [f"{face} step {o['step']}: {h} not listed" for h in o["holes"] if h not in window]
            at = pos
    return problems


def operation_mismatches(folder, manifest: dict) -> list[str]:
    """Differences between the manifest's operations and the report's and templates' steps."""
    import pymupdf

    out = []
    report = (folder / "report.md").read_text(encoding="utf-8")
    if sorted(report_rows(report)) != manifest_rows(manifest):
        out.append("report schedule differs from manifest operations")
    tp = manifest.get("templates_pdf") or {}
    if tp.get("made"):
        doc = pymupdf.open(folder / tp["file"])

        def text_of(face):
            return " ".join(" ".join(doc[p["page"] - 1].get_text().split()) for p in tp["pages"] if p["face"] == face)

        out += template_order_problems(text_of, manifest)
    return out
