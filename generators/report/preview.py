"""Isometric preview PNG of the hub from its STL, flat-shaded, drawn with Pillow.

The mesh is projected orthographically, back faces are dropped and the rest painted far
to near; good enough for a picture of a convex-ish block with holes. Pillow (already
there for the drawings) keeps the plotting library out of the CAD process.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np

# Seen from azimuth -60 deg (between +X and -Y), 30 deg above the horizon.
VIEW_AZIMUTH_DEG = -60.0
VIEW_ELEVATION_DEG = 30.0
LIGHT = (0.3, -0.5, 0.8)
BASE_RGB = (0.62, 0.68, 0.74)


def read_stl(path: Path) -> np.ndarray:
    """Triangles (n, 3, 3) from a binary STL."""
    data = path.read_bytes()
    n = int(np.frombuffer(data, dtype="<u4", count=1, offset=80)[0])
    rec = np.dtype([("normal", "<f4", 3), ("v", "<f4", (3, 3)), ("attr", "<u2")])
    return np.frombuffer(data, dtype=rec, count=n, offset=84)["v"].astype(np.float64)


def stl_triangles(mesh) -> np.ndarray:
    """The triangles of an in-memory mesh exactly as its binary STL stores them (float32)."""
    return np.asarray(mesh.triangles, dtype=np.float32).astype(np.float64)


def _split_long(tris: np.ndarray, parts: float = 12.0) -> np.ndarray:
    """Split long triangles (the fans of the flat faces) so far-to-near painting by centroid
    does not let a long triangle cover a nearer one."""
    import trimesh

    size = float(np.ptp(tris.reshape(-1, 3), axis=0).max())
    verts = tris.reshape(-1, 3)
    faces = np.arange(len(verts)).reshape(-1, 3)
    v, f = trimesh.remesh.subdivide_to_size(verts, faces, max_edge=size / parts, max_iter=8)
    return v[f]


def _frame():
    az, el = np.radians(VIEW_AZIMUTH_DEG), np.radians(VIEW_ELEVATION_DEG)
    view = np.array([np.cos(el) * np.cos(az), np.cos(el) * np.sin(az), np.sin(el)])  # towards the eye
    right = np.array([-np.sin(az), np.cos(az), 0.0])
    up = np.cross(view, right)
    return view, right, up


def render_preview(stl: Path | np.ndarray, png: Path, title: str, labels: dict[str, tuple] | None = None,
                   size_in: tuple[float, float] = (6.0, 4.5), dpi: int = 110) -> None:
    """Write ``png``: the hub seen from above and to the side, hole labels where visible.

    ``stl`` is the STL file or its triangles already in memory (:func:`stl_triangles`)."""
    from PIL import Image, ImageDraw, ImageFont

    tris = _split_long(stl if isinstance(stl, np.ndarray) else read_stl(stl))
    view, right, up = _frame()
    normals = np.cross(tris[:, 1] - tris[:, 0], tris[:, 2] - tris[:, 0])
    lengths = np.linalg.norm(normals, axis=1)
    keep = lengths > 1e-12
    tris, normals = tris[keep], normals[keep] / lengths[keep, None]
    facing = normals @ view > 0
    tris, normals = tris[facing], normals[facing]
    depth = (tris.mean(axis=1) @ view)
    order = np.argsort(depth, kind="stable")
    tris, normals = tris[order], normals[order]
    xy = np.stack([tris @ right, tris @ up], axis=-1)
    light = np.array(LIGHT) / np.linalg.norm(LIGHT)
    shade = 0.35 + 0.65 * np.clip(normals @ light, 0.0, 1.0)
    colors = (np.clip(np.array(BASE_RGB)[None, :] * shade[:, None], 0, 1) * 255).round().astype(int)

    W, H = int(size_in[0] * dpi), int(size_in[1] * dpi)
    top, margin = int(0.1 * H), int(0.04 * W)
    lo, hi = xy.reshape(-1, 2).min(axis=0), xy.reshape(-1, 2).max(axis=0)
    k = min((W - 2 * margin) / (hi[0] - lo[0]), (H - top - margin) / (hi[1] - lo[1]))
    off = np.array([(W - k * (hi[0] - lo[0])) / 2, top + (H - top - margin - k * (hi[1] - lo[1])) / 2])

    def px(p):  # model (right, up) -> pixel (x right, y down)
        return off[0] + k * (p[..., 0] - lo[0]), off[1] + k * (hi[1] - p[..., 1])

    img = Image.new("RGB", (W, H), "white")
    draw = ImageDraw.Draw(img)
    X, Y = px(xy)
    for x, y, c in zip(X.tolist(), Y.tolist(), colors.tolist()):
        col = tuple(c)
        draw.polygon(list(zip(x, y)), fill=col, outline=col)
    font = ImageFont.load_default(size=max(9, dpi // 9))
    small = ImageFont.load_default(size=max(9, dpi // 10))
    draw.text((W / 2, top / 2), title, fill="black", font=font, anchor="mm")
    for text, p in (labels or {}).items():
        q = np.asarray(p, dtype=float)
        x, y = px(np.array([q @ right, q @ up]))
        draw.line([(x, y), (x + 7, y - 7)], fill=(139, 0, 0), width=1)
        box = draw.textbbox((x + 8, y - 8), text, font=small, anchor="lb")
        draw.rectangle(box, fill="white")
        draw.text((x + 8, y - 8), text, fill=(139, 0, 0), font=small, anchor="lb")
    img.save(png, format="PNG")


def visible(point, outward) -> bool:
    """Whether a point on a face with this outward normal faces the viewer."""
    view, _, _ = _frame()
    return float(np.dot(outward, view)) > 0.05
