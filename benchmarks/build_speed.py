"""``hubwright build`` of the metric demo against bare cadquery calls making the same solid.

Both sides run as whole processes (interpreter start, imports, work, exit), a few times
each, alternating: the hubwright side is ``hubwright build configs/six-spreader-portable.toml``
end to end (every writer: solids, manifest, templates, report, ...); the bare side is this
file's ``--bare`` mode, which imports only cadquery, reads the holes from the manifest
hubwright wrote, makes the body, cuts every hole and exports STEP and STL with the same mesh
tolerances. Prints the median wall times, their ratio (target: at most 1.5), the peak memory
of each child (``os.wait4`` rusage, like ``resource.getrusage(RUSAGE_CHILDREN)`` per child)
and, in-process, where the hubwright build spends its time. A ratio, not a pass/fail.

    python benchmarks/build_speed.py [--runs N]
"""

from __future__ import annotations

import argparse
import json
import math
import os
import pathlib
import resource
import shutil
import statistics
import subprocess
import sys
import tempfile
import time

ROOT = pathlib.Path(__file__).resolve().parents[1]
DEMO = ROOT / "configs" / "six-spreader-portable.toml"
TARGET_RATIO = 1.5


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


# ---- the harness --------------------------------------------------------------------------
def run_child_rusage(cmd: list[str]) -> tuple[float, int, str]:
    """Wall time (s), peak RSS (KiB, this one child, via ``os.wait4``) and stdout."""
    t = time.perf_counter()
    with tempfile.TemporaryFile("w+") as out, tempfile.TemporaryFile("w+") as err:
        p = subprocess.Popen(cmd, cwd=ROOT, stdout=out, stderr=err, text=True)
        _pid, status, usage = os.wait4(p.pid, 0)
        wall = time.perf_counter() - t
        p.returncode = os.waitstatus_to_exitcode(status)
        out.seek(0)
        err.seek(0)
        if p.returncode != 0:
            raise SystemExit(f"{' '.join(cmd)} failed ({p.returncode}): {err.read().strip()}")
        return wall, usage.ru_maxrss, out.read()


def hubwright_cmd(out: pathlib.Path) -> list[str]:
    exe = pathlib.Path(sys.executable).with_name("hubwright")
    head = [str(exe)] if exe.exists() else [sys.executable, "-m", "generators"]
    return head + ["build", str(DEMO), "--out", str(out)]


def writer_times(out: pathlib.Path) -> list[tuple[str, float]]:
    """Where an in-process build spends its time: config + plan, then each writer."""
    sys.path.insert(0, str(ROOT))
    t0 = time.perf_counter()
    import cadquery  # noqa: F401  (paid once by either side; counted separately)

    t_import = time.perf_counter() - t0
    import os

    import generators.build as gb
    import generators.writers as gw

    os.environ["HUBWRIGHT_SERIAL"] = "1"  # one writer after another, to time each
    spent: list[tuple[str, float]] = [("import cadquery", t_import)]
    real_call = gw.call

    def timed(spec, ctx):
        t = time.perf_counter()
        real_call(spec, ctx)
        spent.append((spec.split(":")[1], time.perf_counter() - t))

    gw.call = timed
    try:
        t = time.perf_counter()
        gb.build(DEMO, out)
        total = time.perf_counter() - t
    finally:
        gw.call = real_call
        os.environ.pop("HUBWRIGHT_SERIAL", None)
    spent.append(("config, plan, manifest, rules", total - sum(s for _, s in spent[1:])))
    return spent


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--bare", nargs=2, metavar=("MANIFEST", "OUT"), help=argparse.SUPPRESS)
    args = ap.parse_args()
    if args.bare:
        bare(*args.bare)
        return
    work = pathlib.Path(tempfile.mkdtemp(prefix="hubwright-bench-"))
    try:
        hub_out = work / "hubwright"
        run_child_rusage(hubwright_cmd(hub_out))  # warm the file cache; gives the manifest
        folder = next(p for p in hub_out.iterdir() if p.is_dir())
        manifest = folder / "manifest.json"
        keep = work / "manifest.json"
        shutil.copy(manifest, keep)
        bare_out = work / "bare"
        bare_out.mkdir()
        bare_cmd = [sys.executable, str(pathlib.Path(__file__).resolve()), "--bare", str(keep), str(bare_out)]
        hub_t, bare_t, hub_mem, bare_mem = [], [], [], []
        result = {}
        for _ in range(args.runs):
            w, mem, _ = run_child_rusage(hubwright_cmd(hub_out))
            hub_t.append(w)
            hub_mem.append(mem)
            w, mem, text = run_child_rusage(bare_cmd)
            bare_t.append(w)
            bare_mem.append(mem)
            result = json.loads(text.strip().splitlines()[-1])
        m = json.loads(manifest.read_text(encoding="utf-8"))
        v_hub = m["hub"]["volume_mm3"]
        ratio = statistics.median(hub_t) / statistics.median(bare_t)
        print(f"metric demo ({DEMO.name}), {args.runs} runs each, whole processes, median (min):")
        print(f"  hubwright build   {statistics.median(hub_t):6.2f} s ({min(hub_t):.2f})"
              f"   peak RSS {max(hub_mem) / 1024:6.0f} MiB   files: {', '.join(sorted(m['files']))}")
        print(f"  bare cadquery     {statistics.median(bare_t):6.2f} s ({min(bare_t):.2f})"
              f"   peak RSS {max(bare_mem) / 1024:6.0f} MiB   files: bare.step, bare.stl")
        print(f"  ratio             {ratio:6.2f}   (target <= {TARGET_RATIO})")
        print(f"  same solid        volume {result['volume_mm3']:.0f} vs {v_hub:.0f} mm3"
              f" ({(result['volume_mm3'] - v_hub) / v_hub * 100:+.3f} %), {result['solids']} solid(s)")
        print(f"  all children      peak RSS {resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss / 1024:.0f} MiB"
              " (resource.getrusage(RUSAGE_CHILDREN))")
        print("in-process hubwright build, where the time goes:")
        for what, s in writer_times(work / "inproc"):
            print(f"  {what:34s} {s:6.2f} s")
    finally:
        shutil.rmtree(work, ignore_errors=True)


if __name__ == "__main__":
    main()
