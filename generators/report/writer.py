"""Build writer for the report: report.md, report.html and an isometric preview PNG."""

from __future__ import annotations

from html import escape as html_escape

from generators.manifest import file_hashes, plan_record
from generators.plan.kinds import is_pocket
from generators.report.report_md import render_report

REPORT_MD = "report.md"
REPORT_HTML = "report.html"
PREVIEW = "hub-preview.png"

_HTML_HEAD = ("<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"><title>{title}</title><style>"
              "body{{font-family:sans-serif;max-width:60em;margin:2em auto;font-size:11pt}}"
              "table{{border-collapse:collapse;margin:0.5em 0}}td,th{{border:1px solid #999;padding:2px 6px;"
              "vertical-align:top}}img{{max-width:100%}}@media print{{h3{{page-break-after:avoid}}}}"
              "</style></head><body>\n")


def _labels(plan) -> dict[str, tuple]:
    """Labels for socket mouths and top-face holes that face the viewer."""
    from generators.report.preview import visible

    out = {}
    for h in plan.holes:
        if is_pocket(h):
            continue
        face = plan.face(h.face)
        if h.kind in ("socket", "set_screw", "clamp", "pin", "extra") and visible(h.entry_mm, face.normal):
            out[h.id] = h.entry_mm
        elif h.kind == "pin" and h.exit_face and visible(h.bottom_mm, plan.face(h.exit_face).normal):
            out[h.id] = h.bottom_mm  # the through bolt's far end, where the viewer sees it
    return out


def write_report(ctx) -> None:
    plan = ctx.plan
    preview = None
    stl = ctx.folder / f"{plan.file_stem}.stl"
    if stl.is_file():
        from generators.report.preview import render_preview, stl_triangles

        mesh = getattr(ctx, "meshes", {}).get("hub")
        render_preview(stl if mesh is None else stl_triangles(mesh), ctx.folder / PREVIEW, f"{plan.name}: {plan.mast_designation} mast",
                       labels=_labels(plan))
        preview = PREVIEW
    manifest = plan_record(plan, ctx.volume_mm3)
    manifest.update(ctx.manifest)
    manifest["files"] = {**file_hashes(ctx.folder), REPORT_MD: "", REPORT_HTML: ""}
    text = render_report(ctx.design, manifest, preview)
    (ctx.folder / REPORT_MD).write_text(text, encoding="utf-8")
    html = _html(text, plan.name)
    if html is not None:
        (ctx.folder / REPORT_HTML).write_text(html, encoding="utf-8")
    ctx.manifest["report"] = {"file": REPORT_MD, "html": REPORT_HTML if html is not None else None,
                              "preview": preview}
    ctx.summary.append(f"  report {REPORT_MD}" + (f", {REPORT_HTML}" if html else "")
                       + (f", {PREVIEW}" if preview else ""))


def _html(text: str, title: str) -> str | None:
    """An HTML rendering for printing (markdown-it, installed with rich), or None."""
    try:
        from markdown_it import MarkdownIt
    except ImportError:  # pragma: no cover - rich depends on markdown-it-py
        return None
    # html=False: any raw HTML in the text (a config string) is shown as text, never run
    body = MarkdownIt("commonmark", {"html": False}).enable("table").render(text)
    return _HTML_HEAD.format(title=html_escape(title)) + body + "</body></html>\n"
