"""Isometric preview PNG of the hub from its STL (matplotlib, Agg), flat-shaded.

The mesh is projected orthographically, back faces are dropped and the rest painted far
to near; good enough for a picture of a convex-ish block with holes.
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


def _frame():
    az, el = np.radians(VIEW_AZIMUTH_DEG), np.radians(VIEW_ELEVATION_DEG)
    view = np.array([np.cos(el) * np.cos(az), np.cos(el) * np.sin(az), np.sin(el)])  # towards the eye
    right = np.array([-np.sin(az), np.cos(az), 0.0])
    up = np.cross(view, right)
    return view, right, up


def render_preview(stl: Path, png: Path, title: str, labels: dict[str, tuple] | None = None,
                   size_in: tuple[float, float] = (6.0, 4.5), dpi: int = 110) -> None:
    """Write ``png``: the hub seen from above and to the side, hole labels where visible."""
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt
    from matplotlib.collections import PolyCollection

    tris = read_stl(stl)
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
    colors = np.clip(np.array(BASE_RGB)[None, :] * shade[:, None], 0, 1)

    fig = plt.figure(figsize=size_in, dpi=dpi)
    ax = fig.add_axes((0.02, 0.02, 0.96, 0.88))
    ax.add_collection(PolyCollection(xy, facecolors=colors, edgecolors=colors, linewidths=0.3))
    for text, p in (labels or {}).items():
        q = np.asarray(p, dtype=float)
        ax.annotate(text, (q @ right, q @ up), xytext=(7, 7), textcoords="offset points", fontsize=7,
                    color="#8b0000", ha="left", va="bottom",
                    bbox={"boxstyle": "round,pad=0.1", "fc": "white", "ec": "none", "alpha": 0.75},
                    arrowprops={"arrowstyle": "-", "color": "#8b0000", "lw": 0.5})
    lo, hi = xy.reshape(-1, 2).min(axis=0), xy.reshape(-1, 2).max(axis=0)
    pad = 0.05 * (hi - lo).max()
    ax.set_xlim(lo[0] - pad, hi[0] + pad)
    ax.set_ylim(lo[1] - pad, hi[1] + pad)
    ax.set_aspect("equal")
    ax.axis("off")
    fig.suptitle(title, fontsize=10)
    fig.savefig(png, dpi=dpi, metadata={"Software": None})
    plt.close(fig)


def visible(point, outward) -> bool:
    """Whether a point on a face with this outward normal faces the viewer."""
    view, _, _ = _frame()
    return float(np.dot(outward, view)) > 0.05
