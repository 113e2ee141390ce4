"""Build writer for frame.png: the whole frame seen from above and from the side, with
the tip radius, the tip spacing, the tip heights and each spreader's cut length written
on it. It draws the design's FramePlan only (no planning here)."""

from __future__ import annotations

import math

from generators.units import format_length

FRAME_PNG = "frame.png"
_RC = {"font.family": "DejaVu Sans", "savefig.bbox": "standard", "savefig.facecolor": "white",
       "axes.unicode_minus": False, "svg.hashsalt": "hubwright"}
POLE, WIRE, HUB, DIM = "#1f5fa8", "#b5651d", "#444444", "#c00000"


def write_frame_png(ctx) -> None:
    """frame.png; ctx.manifest["frame"] (tip points, spacing, heights, cut lengths)."""
    frame = ctx.design.frame
    if frame is None:
        ctx.manifest["frame"] = None
        return
    units = ctx.config.units
    fmt = lambda mm: format_length(mm, units, fractions=False)  # noqa: E731
    _draw(frame, ctx.plan, ctx.folder / FRAME_PNG, fmt, ctx.config.name)
    ctx.manifest["frame"] = {
        "file": FRAME_PNG,
        "tip_radius_mm": round(frame.tip_radius_mm, 3),
        "tips": [{"spreader": t.spreader, "tip_mm": [round(v, 3) for v in t.tip_mm],
                  "height_mm": round(t.tip_mm[2], 3), "cut_length_mm": round(t.cut_length_mm, 3)}
                 for t in frame.tubes],
        "wires": [{"from": w.a, "to": w.b, "length_mm": round(w.length_mm, 3)} for w in frame.wires],
    }
    ctx.summary.append(f"  frame  {FRAME_PNG}: top and side view, tips and lengths dimensioned")


def _draw(frame, plan, path, fmt, name: str) -> None:
    import matplotlib

    matplotlib.rcdefaults()
    from matplotlib.figure import Figure

    with matplotlib.rc_context(_RC):
        fig = Figure(figsize=(13, 6.5), dpi=110)
        top, side = fig.add_subplot(1, 2, 1), fig.add_subplot(1, 2, 2)
        _top(top, frame, plan, fmt)
        _side(side, frame, plan, fmt)
        fig.suptitle(f"{name}: the frame (tip radius {fmt(frame.tip_radius_mm)}, poles from the {frame.stop})",
                     fontsize=12)
        fig.subplots_adjust(left=0.05, right=0.98, bottom=0.08, top=0.9, wspace=0.18)
        fig.savefig(path, format="png", metadata={"Software": None})


def _top(ax, frame, plan, fmt) -> None:
    ax.set_title("top view (from above, +X right)", fontsize=10)
    outline = list(plan.body.outline) + [plan.body.outline[0]]
    ax.fill([p[0] for p in outline], [p[1] for p in outline], color=HUB, alpha=0.6)
    R = frame.tip_radius_mm
    a = [2 * math.pi * k / 180 for k in range(181)]
    ax.plot([R * math.cos(t) for t in a], [R * math.sin(t) for t in a], color="#999999", lw=0.6, ls=":")
    for t in frame.tubes:
        ax.plot([t.start_mm[0], t.end_mm[0]], [t.start_mm[1], t.end_mm[1]], color=POLE, lw=3,
                solid_capstyle="butt")
        ax.plot([t.tip_mm[0]], [t.tip_mm[1]], "o", color="black", ms=4)
        az = math.radians(t.azimuth_deg)
        mid = 0.58 * R
        ax.text(mid * math.cos(az), mid * math.sin(az), f"S{t.spreader} cut {fmt(t.cut_length_mm)}",
                rotation=_upright(t.azimuth_deg), rotation_mode="anchor", ha="center", va="bottom",
                fontsize=8, color=POLE)
    for w in frame.wires:
        ax.plot([w.start_mm[0], w.end_mm[0]], [w.start_mm[1], w.end_mm[1]], color=WIRE, lw=1.2)
    # tip radius: centre to the first tip
    t0 = frame.tubes[0]
    ax.annotate("", xy=t0.tip_mm[:2], xytext=(0, 0), arrowprops={"arrowstyle": "<->", "color": DIM, "lw": 1})
    a0 = math.radians(t0.azimuth_deg)
    ax.text(0.3 * R * math.cos(a0) + 0.1 * R * math.sin(a0), 0.3 * R * math.sin(a0) - 0.1 * R * math.cos(a0),
            f"tip radius {fmt(R)}", color=DIM, fontsize=9, ha="center", va="center",
            rotation=_upright(t0.azimuth_deg), rotation_mode="anchor")
    # tip spacing: the first wire's chord, dimensioned outside it
    if frame.wires:
        w = frame.wires[0]
        mx, my = (w.start_mm[0] + w.end_mm[0]) / 2, (w.start_mm[1] + w.end_mm[1]) / 2
        k = 1.0 + 0.12 * R / max(math.hypot(mx, my), 1e-9)
        ax.annotate("", xy=(w.end_mm[0] * k, w.end_mm[1] * k), xytext=(w.start_mm[0] * k, w.start_mm[1] * k),
                    arrowprops={"arrowstyle": "<->", "color": DIM, "lw": 1})
        ang = math.degrees(math.atan2(w.end_mm[1] - w.start_mm[1], w.end_mm[0] - w.start_mm[0]))
        plan_chord = math.hypot(w.end_mm[0] - w.start_mm[0], w.end_mm[1] - w.start_mm[1])
        text = f"tip spacing {fmt(plan_chord)}"
        if abs(w.length_mm - plan_chord) > 0.05:  # tips at different heights: the true wire chord too
            text += f" (tip to tip {fmt(w.length_mm)})"
        ax.text(mx * k * 1.04, my * k * 1.04, text, color=DIM, fontsize=9,
                ha="center", va="center", rotation=_upright(ang), rotation_mode="anchor")
    lim = 1.3 * (R + frame.tip_allowance_mm)
    ax.set_xlim(-lim, lim)
    ax.set_ylim(-lim, lim)
    ax.set_aspect("equal")
    ax.tick_params(labelsize=7)


def _side(ax, frame, plan, fmt) -> None:
    ax.set_title("side view (from -Y, looking along +Y; +Z up)", fontsize=10)
    T = frame.hub_thickness_mm
    r_hub = plan.body.corner_radius_mm
    m = frame.mast_od_mm / 2
    ax.fill([-m, m, m, -m], [frame.mast_bottom_mm, frame.mast_bottom_mm, frame.mast_top_mm, frame.mast_top_mm],
            color="#bbbbbb")
    ax.fill([-r_hub, r_hub, r_hub, -r_hub], [0, 0, T, T], color=HUB, alpha=0.6)
    R = frame.tip_radius_mm
    heights = []
    for t in frame.tubes:
        ax.plot([t.start_mm[0], t.end_mm[0]], [t.start_mm[2], t.end_mm[2]], color=POLE, lw=2.5,
                solid_capstyle="butt")
        ax.plot([t.tip_mm[0]], [t.tip_mm[2]], "o", color="black", ms=4)
        heights.append(t)
    for w in frame.wires:
        ax.plot([w.start_mm[0], w.end_mm[0]], [w.start_mm[2], w.end_mm[2]], color=WIRE, lw=1.0)
    # tip heights above the hub's bottom face, one line per distinct height
    done: list[float] = []
    for t in sorted(heights, key=lambda t: t.tip_mm[2]):
        z = t.tip_mm[2]
        same = [u.spreader for u in heights if abs(u.tip_mm[2] - z) < 0.05]
        if any(abs(z - d) < 0.05 for d in done):
            continue
        done.append(z)
        ax.axhline(z, color=DIM, lw=0.5, ls="--")
        ax.text(-1.25 * R, z, f"tips {', '.join(f'S{i}' for i in same)}: z {fmt(z)}"
                f" ({'+' if t.elevation_deg >= 0 else ''}{t.elevation_deg:g} deg)",
                color=DIM, fontsize=8, va="bottom", ha="left")
    ax.axhline(0.0, color="#777777", lw=0.5)
    ax.text(1.25 * R, 0, "hub bottom face z 0", fontsize=7, ha="right", va="top", color="#555555")
    zs = [t.end_mm[2] for t in frame.tubes] + [frame.mast_bottom_mm, frame.mast_top_mm]
    span = max(max(zs) - min(zs), 0.25 * R)
    ax.set_xlim(-1.3 * (R + frame.tip_allowance_mm), 1.3 * (R + frame.tip_allowance_mm))
    ax.set_ylim(min(zs) - 0.15 * span, max(zs) + 0.15 * span)
    ax.set_aspect("equal", adjustable="box")
    ax.tick_params(labelsize=7)


def _upright(angle_deg: float) -> float:
    """A text angle that keeps the text readable (never upside down)."""
    a = (angle_deg + 180) % 360 - 180
    if a > 90:
        a -= 180
    elif a < -90:
        a += 180
    return a
