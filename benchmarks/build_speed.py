"""Whole ``hubwright build`` against a bare-cadquery floor, and where the build's time goes.

The build is an eight-spreader block with set screws, two mast clamp screws and extra holes
(``benchmarks/configs/eight-spreader-block.toml``), every writer on. The floor is this
file's ``--bare`` mode, run in the same session: it imports only cadquery, reads the holes
from the manifest hubwright wrote, makes the body, cuts every hole and exports STEP and STL
with the same mesh tolerances. Both sides run as whole processes (interpreter start,
imports, work, exit), a few times each, alternating; prints the median wall times, the
ratio build/floor (target: at most 1.3) and the ratio of peak memory (each child's
``ru_maxrss`` from ``os.wait4``; target at most 1.2). Then, in a child process, the
breakdown: each library's import, config + design, and one writer after another with the
kernel's own work (booleans, tessellation, STEP export) split from ours. Ratios, not
pass/fail.

    python benchmarks/build_speed.py [--runs N] [--config TOML]
"""

from __future__ import annotations

import argparse
import json
import math
import os
import pathlib
import shutil
import statistics
import subprocess
import sys
import tempfile
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from _installed import as_installed  # noqa: E402

ROOT = pathlib.Path(__file__).resolve().parents[1]
CONFIG = ROOT / "benchmarks" / "configs" / "eight-spreader-block.toml"
TARGET_TIME, TARGET_MEMORY = 1.3, 1.2


# ---- the bare side (runs in a child process; imports cadquery and nothing of hubwright) ---
def bare(manifest_path: str, out_dir: str) -> None:
    import cadquery as cq

    m = json.loads(pathlib.Path(manifest_path).read_text(encoding="utf-8"))
    hub = m["hub"]
    T = hub["thickness_mm"]
    first = m["spreaders"][0]["azimuth_deg"]
    if hub["style"] == "puck":
        body = cq.Workplane("XY").circle(hub["diameter_mm"] / 2).extrude(T)
    else:
        n, a, c = hub["sides"], hub["across_flats_mm"] / 2, hub["corner_chamfer_mm"]
        # across corners = across flats / cos(pi/n); the chamfer cuts each corner square
        # to its bisector, (c/2) tan(pi/n) in
        body = (cq.Workplane("XY").polygon(n, 2 * a / math.cos(math.pi / n)).extrude(T)
                .rotate((0, 0, 0), (0, 0, 1), first + 180 / n))
        if c > 0:
            d = a / math.cos(math.pi / n) - c / 2 * math.tan(math.pi / n)
            for k in range(n):
                az = first + (k + 0.5) * 360 / n
                cutter = (cq.Workplane("XY").box(50, 4 * a, 3 * T).translate((d + 25, 0, T / 2))
                          .rotate((0, 0, 0), (0, 0, 1), az))
                body = body.cut(cutter)
    bore_r = hub["bore_mm"] / 2
    cutters = []
    for h in m["holes"]:
        axis = cq.Vector(*h["axis"]).normalized()
        r = h["diameter_mm"] / 2
        lead = 1.0 + r  # start outside whatever face the hole enters
        end = 1.0 if (h["through"] or h["kind"] == "bore") else 0.0
        bottom = cq.Vector(*h["entry_mm"]) + axis * h["depth_mm"]
        if abs(math.hypot(bottom.x, bottom.y) - bore_r) < 1e-3:
            end = r + 1.0  # ends on the bore wall: run on into the bore
        start = cq.Vector(*h["entry_mm"]) - axis * lead
        cutters.append(cq.Solid.makeCylinder(r, lead + h["depth_mm"] + end, start, axis))
        if h["countersink"]:
            half = math.radians(h["countersink"]["angle_deg"] / 2)
            R = h["countersink"]["diameter_mm"] / 2
            cutters.append(cq.Solid.makeCone(R + lead * math.tan(half), r, lead + (R - r) / math.tan(half),
                                             start, axis))
        if h["counterbore"]:
            cutters.append(cq.Solid.makeCylinder(h["counterbore"]["diameter_mm"] / 2,
                                                 lead + h["counterbore"]["depth_mm"], start, axis))
    solid = body.val().cut(*cutters).clean()
    out = pathlib.Path(out_dir)
    solid.exportStep(str(out / "bare.step"))
    mesh = m.get("mesh", {})
    solid.exportStl(str(out / "bare.stl"), tolerance=mesh.get("tolerance_mm", 0.05),
                    angularTolerance=math.radians(mesh.get("angular_tolerance_deg", 10.0)))
    print(json.dumps({"volume_mm3": solid.Volume(), "solids": len(solid.Solids())}))


# ---- the breakdown (a child process: its imports are its own) ---------------------------
def breakdown(config: str, out: str) -> None:
    sys.path.insert(0, str(ROOT))
    sys.path.insert(0, str(ROOT / "benchmarks"))
    from _probe import probes, timed_import

    rows: list[tuple[str, float]] = []
    t = time.perf_counter()
    from generators.config import load_config
    from generators.design import design

    rows.append(("import hubwright config + plan", time.perf_counter() - t))
    for lib in ("cadquery", "trimesh", "matplotlib.pyplot", "ezdxf", "pypdfium2", "PIL.Image"):
        rows.append((f"import {lib}", timed_import(lib)))
    t = time.perf_counter()
    d = design(load_config(config), ())
    rows.append(("config + design (plan, rules)", time.perf_counter() - t))
    import generators.build as gb

    os.environ["HUBWRIGHT_SERIAL"] = "1"  # one writer after another, to time each
    with probes() as spent:
        t = time.perf_counter()
        gb.build_design(d, out)
        total = time.perf_counter() - t
    rows += sorted(spent.items(), key=lambda kv: not kv[0].startswith("writer"))
    rows.append(("render (all writers + manifest), serial", total))
    print(json.dumps(rows))


# ---- the harness --------------------------------------------------------------------------
CPU: dict[str, list[float]] = {}  # user + system seconds of each child (its reaped children included)


def run_child(cmd: list[str], side: str = "") -> tuple[float, int, str]:
    """Wall time (s), peak RSS (KiB, this one child and its waited children) and stdout."""
    t = time.perf_counter()
    with tempfile.TemporaryFile("w+") as out, tempfile.TemporaryFile("w+") as err:
        p = subprocess.Popen(cmd, cwd=ROOT, stdout=out, stderr=err, text=True)
        _pid, status, usage = os.wait4(p.pid, 0)
        wall = time.perf_counter() - t
        if side:
            CPU.setdefault(side, []).append(usage.ru_utime + usage.ru_stime)
        p.returncode = os.waitstatus_to_exitcode(status)
        out.seek(0)
        err.seek(0)
        if p.returncode != 0:
            raise SystemExit(f"{' '.join(cmd)} failed ({p.returncode}): {err.read().strip()}")
        return wall, usage.ru_maxrss, out.read()


def hubwright_cmd(config: pathlib.Path, out: pathlib.Path) -> list[str]:
    exe = pathlib.Path(sys.executable).with_name("hubwright")
    head = [str(exe)] if exe.exists() else [sys.executable, "-m", "generators"]
    return head + ["build", str(config), "--out", str(out)]


def main() -> None:
    as_installed()
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--config", default=str(CONFIG))
    ap.add_argument("--bare", nargs=2, metavar=("MANIFEST", "OUT"), help=argparse.SUPPRESS)
    ap.add_argument("--breakdown", nargs=2, metavar=("CONFIG", "OUT"), help=argparse.SUPPRESS)
    args = ap.parse_args()
    if args.bare:
        return bare(*args.bare)
    if args.breakdown:
        return breakdown(*args.breakdown)
    config = pathlib.Path(args.config).resolve()
    me = str(pathlib.Path(__file__).resolve())
    work = pathlib.Path(tempfile.mkdtemp(prefix="hubwright-bench-"))
    try:
        hub_out = work / "hubwright"
        run_child(hubwright_cmd(config, hub_out))  # warm the file cache; gives the manifest
        folder = next(p for p in hub_out.iterdir() if p.is_dir())
        keep = work / "manifest.json"
        shutil.copy(folder / "manifest.json", keep)
        bare_out = work / "bare"
        bare_out.mkdir()
        hub_t, bare_t, hub_mem, bare_mem = [], [], [], []
        result = {}
        for _ in range(args.runs):
            w, mem, _ = run_child(hubwright_cmd(config, hub_out), "build")
            hub_t.append(w)
            hub_mem.append(mem)
            w, mem, text = run_child([sys.executable, me, "--bare", str(keep), str(bare_out)], "floor")
            bare_t.append(w)
            bare_mem.append(mem)
            result = json.loads(text.strip().splitlines()[-1])
        m = json.loads(keep.read_text(encoding="utf-8"))
        v_hub = m["hub"]["volume_mm3"]
        hub_s, bare_s = statistics.median(hub_t), statistics.median(bare_t)
        hub_m, bare_m = statistics.median(hub_mem) / 1024, statistics.median(bare_mem) / 1024
        print(f"{config.name}: {len(m['holes'])} holes, {args.runs} runs each, whole processes, median (min):")
        print(f"  hubwright build   {hub_s:6.2f} s ({min(hub_t):.2f})   peak RSS {hub_m:6.0f} MiB"
              f"   {len(m['files'])} files")
        print(f"  bare cadquery     {bare_s:6.2f} s ({min(bare_t):.2f})   peak RSS {bare_m:6.0f} MiB"
              "   bare.step, bare.stl")
        print(f"  same solid        volume {result['volume_mm3']:.0f} vs {v_hub:.0f} mm3"
              f" ({(result['volume_mm3'] - v_hub) / v_hub * 100:+.3f} %), {result['solids']} solid(s)")
        print(f"  ratio build/floor {hub_s / bare_s:6.2f}   (target <= {TARGET_TIME})")
        print(f"  ratio memory      {hub_m / bare_m:6.2f}   (target <= {TARGET_MEMORY}; the largest of the build's"
              " processes, its drawing children included, not their sum)")
        cpu_b, cpu_f = statistics.median(CPU["build"]), statistics.median(CPU["floor"])
        print(f"  CPU user+system   build {cpu_b:.2f} s, floor {cpu_f:.2f} s, ratio {cpu_b / cpu_f:.2f}"
              " (steadier than wall time on a loaded machine; the build's counts the drawing children)")
        print(f"  machine: {os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} (noisy when > 0.5)")
        _, _, text = run_child([sys.executable, me, "--breakdown", str(config), str(work / "inproc")])
        print("where a build's time goes (in one process, writers one after another):")
        for what, s in json.loads(text.strip().splitlines()[-1]):
            print(f"  {what:42s} {s:6.2f} s")
    finally:
        shutil.rmtree(work, ignore_errors=True)


if __name__ == "__main__":
    main()
