"""Timing probes for the benchmarks: wrap the kernel calls and the writers of an in-process
build and add up where the time goes. Benchmark support only, never imported by the package.

Kernel work is what the bare-cadquery floor also does: the booleans that make each solid,
the tessellation and the STEP export. Everything else (merging and checking the mesh,
STL/3MF bytes, drawings, report, manifest) is ours.
"""

from __future__ import annotations

import contextlib
import time
from collections import defaultdict
from collections.abc import Iterator

KERNEL = ("booleans", "tessellate", "STEP export")


def _wrap(owner, name: str, bucket: str, spent: dict[str, float]) -> tuple:
    real = getattr(owner, name)

    def timed(*a, **kw):
        t = time.perf_counter()
        try:
            return real(*a, **kw)
        finally:
            spent[bucket] += time.perf_counter() - t

    setattr(owner, name, timed)
    return owner, name, real


@contextlib.contextmanager
def probes(writers: bool = True) -> Iterator[dict[str, float]]:
    """Seconds by bucket while the block runs: the kernel buckets, the mesh steps and (with
    ``writers``) each writer called through generators.writers.call in this process."""
    import cadquery as cq

    import generators.cad.export as ex
    import generators.cad.extras_writer as xw
    import generators.cad.jig as jig
    import generators.cad.reducer_writer as rw
    import generators.cad.tipcap as tc
    import generators.cad.writer as hw
    import generators.writers as gw

    spent: dict[str, float] = defaultdict(float)
    undo = [
        _wrap(hw, "hub_solid", "booleans", spent),
        _wrap(jig, "jig_solid", "booleans", spent),
        _wrap(rw, "sleeve_solid", "booleans", spent),
        _wrap(tc, "tip_cap_solid", "booleans", spent),
        _wrap(gw._Child, "join_into", "wait for the drawing children", spent),
        _wrap(cq.Shape, "tessellate", "tessellate", spent),
        _wrap(cq.Shape, "exportStep", "STEP export", spent),
        _wrap(ex, "mesh_of", "mesh (incl. tessellate)", spent),
        _wrap(xw, "mesh_of", "mesh (incl. tessellate)", spent),
        _wrap(ex, "write_stl", "STL bytes", spent),
        _wrap(xw, "write_stl", "STL bytes", spent),
        _wrap(ex, "write_3mf", "3MF bytes", spent),
        _wrap(xw, "write_3mf", "3MF bytes", spent),
    ]
    if writers:
        real_call = gw.call

        def call(spec, ctx):
            t = time.perf_counter()
            try:
                real_call(spec, ctx)
            finally:
                spent["writer " + spec.split(":")[1]] += time.perf_counter() - t

        gw.call = call
        undo.append((gw, "call", real_call))
    try:
        yield spent
    finally:
        for owner, name, real in reversed(undo):
            setattr(owner, name, real)
        # the STEP export inside write_step is counted twice otherwise: keep it as kernel
        if "mesh (incl. tessellate)" in spent:
            spent["mesh merge + checks"] = spent.pop("mesh (incl. tessellate)") - spent.get("tessellate", 0.0)


def kernel_s(spent: dict[str, float]) -> float:
    return sum(spent.get(k, 0.0) for k in KERNEL)


def timed_import(name: str) -> float:
    import importlib
    import sys

    if name in sys.modules:
        return 0.0
    t = time.perf_counter()
    importlib.import_module(name)
    return time.perf_counter() - t
