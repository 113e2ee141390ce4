"""The sizing search: coordinate descent on the shop grid, judged by ``design()``.

A point passes when ``design()`` accepts it (no hard-limit refusal) and no rule fails
(with ``strict``, none warns either) -- exactly what makes ``hubwright check`` exit 0.
From a passing start, each dimension in turn is bisected down to the least value that
still passes with the others held (later passes step down 1, 2, 4 ... from where it is);
passes repeat until none moves, so the end point is locally minimal: one step less in any
dimension fails a rule or is refused. The descent runs once with each dimension leading
(up to three; forwards and backwards beyond) and the lightest (or smallest stock) of the
minimal points wins. A start that fails is grown first; when nothing in the space passes,
the result names the rules that failed at every buildable attempt.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from generators.config.load import parse_config
from generators.errors import UserError
from generators.sizing.space import Dimension, with_values
from generators.sizing.stock import blank_volume_mm3

GROW = (1.25, 1.5, 2.0, 3.0)  # how far a failing start is grown, all dimensions or one at a time
MAX_PASSES = 50


@dataclass(frozen=True)
class Outcome:
    """One evaluated point: passed, or the rules that failed, or the refusal."""

    material: str
    point: tuple[int, ...]
    values: tuple[float, ...]  # mm, deg or counts
    ok: bool
    failed: tuple[str, ...] = ()
    refusal: str | None = None
    mass_g: float | None = None
    objective: float | None = None
    lowest_sf: float | None = None
    design: object = None  # the Design, when design() accepted the point
    partial: bool = False  # failed before its walls were measured: ``failed`` may lack wall rules

    def key(self) -> tuple:
        inf = math.inf
        return (inf if self.objective is None else self.objective, inf if self.mass_g is None else self.mass_g,
                sum(self.values), self.material, self.point)


def lowest_safety_factor(checks_json: dict) -> float | None:
    """The least safety factor among the rules that give one (unit ``SF``)."""
    sfs = [r["value"] for r in checks_json["rules"] if r["unit"] == "SF" and r["value"] is not None]
    return min(sfs) if sfs else None


class Space:
    """Evaluates points of one material's space, once each."""

    def __init__(self, raw: dict, units: str, dims: tuple[Dimension, ...], material: str | None,
                 objective: str, strict: bool):
        self.raw, self.units, self.dims = raw, units, dims
        self.material, self.objective, self.strict = material, objective, strict
        self.seen: dict[tuple[int, ...], Outcome] = {}
        self.ignored: frozenset[str] = frozenset()  # warns --strict cannot lift (see hub_independent)

    def data(self, point: tuple[int, ...]) -> dict:
        extra = {"hub.material": self.material} if self.material else {}
        return with_values(self.raw, self.dims, point, self.units, extra)

    def __call__(self, point: tuple[int, ...]) -> Outcome:
        point = tuple(point)
        if point not in self.seen:
            self.seen[point] = self._evaluate(point)
        return self.seen[point]

    def complete(self, point: tuple[int, ...]) -> Outcome:
        """The outcome with every rule judged (its walls measured too), for explaining it."""
        point = tuple(point)
        if self(point).partial:
            self.seen[point] = self._evaluate(point, full=True)
        return self.seen[point]

    def _evaluate(self, point: tuple[int, ...], full: bool = False) -> Outcome:
        from generators.design import design, failing_before_walls

        from generators.standards.materials import get_material

        mat = get_material(self.material or self.raw.get("hub", {}).get("material", "hdpe")).id
        if any(k < d.lowest or (d.highest is not None and k > d.highest) for d, k in zip(self.dims, point)):
            return Outcome(mat, point, tuple(math.nan for _ in point), False, refusal="outside the grid")
        values = tuple(d.value(k) for d, k in zip(self.dims, point))
        try:
            cfg = parse_config(self.data(point))
            plan, early = failing_before_walls(cfg)
            bad = tuple(i for i, status in early if status == "fail"
                        or (self.strict and status == "warn" and i not in self.ignored))
            if bad and not full:  # fails whatever its walls: not worth measuring them
                return Outcome(plan.material, point, values, False, bad, partial=True)
            d = design(cfg, plan=plan)
        except UserError as exc:
            return Outcome(mat, point, values, False, refusal=exc.line())
        checks = d.checks_json
        failed = tuple(r["id"] for r in checks["rules"] if r["status"] == "fail"
                       or (self.strict and r["status"] == "warn" and r["id"] not in self.ignored))
        mass = d.checks.mass_estimate_g
        obj = blank_volume_mm3(d.plan.body) / 1000.0 if self.objective == "stock" else mass
        return Outcome(d.plan.material, point, values, not failed, failed, None, mass, obj,
                       lowest_safety_factor(checks), d)

    def hub_independent(self, start: tuple[int, ...]) -> frozenset[str]:
        """Rules that warn at the start and still warn with every dimension doubled (grown by
        half, or a quarter, where that is refused): the hub's size does not lift them (a pole's
        own strength, friction against a gust), so ``--strict`` leaves them as warnings instead
        of finding no design."""
        from generators.design import design

        def warns(point) -> set[str] | None:
            try:
                d = design(parse_config(self.data(point)))
            except UserError:
                return None
            return {r["id"] for r in d.checks_json["rules"] if r["status"] == "warn"}

        here = warns(start)
        if here is None:
            return frozenset()
        # a doubled hub may be refused (a stock table's end, a bed, a pin held at its height):
        # smaller growth, then one dimension at a time
        n = len(self.dims)
        tries = [(f, None) for f in (2.0, 1.5, 1.25, 1.1)] + [(f, i) for f in (2.0, 1.25) for i in range(n)]
        for factor, only in tries:
            point = tuple(self._grown(k, d, factor) if only in (None, i) else k
                          for i, (k, d) in enumerate(zip(start, self.dims)))
            there = warns(point) if point != start else None
            if there is not None:
                return frozenset(here & there)
        return frozenset()

    def step(self, point: tuple[int, ...], i: int, by: int) -> tuple[int, ...]:
        p = list(point)
        p[i] += by
        return tuple(p)

    def descend(self, start: tuple[int, ...], order) -> tuple[int, ...]:
        """Bisect each dimension down to its least passing value; repeat until none moves.
        Later passes, where a value has moved little if at all, step down 1, 2, 4 ... until
        one fails and bisect only that bracket (one design when nothing moved)."""
        x = list(start)
        for n_pass in range(MAX_PASSES):
            moved = False
            for i in order:
                hi, lo = x[i], self.dims[i].lowest
                if hi <= lo:
                    continue
                if n_pass:
                    lo, jump = None, 1
                    while lo is None and hi > self.dims[i].lowest:
                        k = max(self.dims[i].lowest, hi - jump)
                        if self(self.step(tuple(x), i, k - x[i])).ok:
                            hi, jump = k, jump * 2
                        else:
                            lo = k
                    lo = hi if lo is None else lo
                if n_pass == 0 and self(self.step(tuple(x), i, lo - hi)).ok:
                    hi = lo
                else:
                    while hi - lo > 1:
                        mid = (hi + lo) // 2
                        if self(self.step(tuple(x), i, mid - x[i])).ok:
                            hi = mid
                        else:
                            lo = mid
                if hi != x[i]:
                    x[i], moved = hi, True
            if not moved:
                break
        return tuple(x)

    def grow(self, start: tuple[int, ...]) -> tuple[int, ...] | None:
        """A passing point at or above ``start``: all dimensions grown together, then one at a time."""
        tries = []
        for f in GROW:
            tries.append(tuple(self._grown(k, d, f) for k, d in zip(start, self.dims)))
        for i in range(len(self.dims)):
            for f in GROW:
                tries.append(self.step(start, i, self._grown(start[i], self.dims[i], f) - start[i]))
        for p in tries:
            if self(p).ok:
                return p
        return None

    @staticmethod
    def _grown(k: int, d: Dimension, f: float) -> int:
        up = max(k + 1, math.ceil(k * f))
        return min(up, d.highest) if d.highest is not None else up

    def minimal(self, point: tuple[int, ...]) -> bool:
        """One step less in every dimension (where the grid has one) does not pass."""
        return all(not self(self.step(point, i, -1)).ok
                   for i, d in enumerate(self.dims) if point[i] > d.lowest)


@dataclass
class SizingResult:
    """What ``size`` found: the best minimal design, or why nothing passed."""

    dims: tuple[Dimension, ...]
    objective: str
    best: Outcome | None
    minimal: list[Outcome] = field(default_factory=list)  # every minimal point found, best first
    spaces: dict = field(default_factory=dict)  # material -> Space
    unmet: tuple[str, ...] = ()  # rules failing at every buildable attempt (nothing passed)
    attempt: Outcome | None = None  # the best attempt when nothing passed
    strict_ignored: tuple[str, ...] = ()  # warns no hub size in the space lifts (--strict)

    def space(self, outcome: Outcome) -> Space:
        return self.spaces[outcome.material]

    @property
    def evaluations(self) -> int:
        return sum(len(s.seen) for s in self.spaces.values())


def size(raw: dict, units: str, dims: tuple[Dimension, ...], materials: list[str] | None = None,
         objective: str = "mass", strict: bool = False) -> SizingResult:
    """Search every material's space (``None``: the config's own material)."""
    result = SizingResult(dims, objective, None)
    n = len(dims)
    # each dimension leads once (up to three), else forwards and backwards
    orders = ([tuple((i + k) % n for i in range(n)) for k in range(n)] if n <= 3
              else [tuple(range(n)), tuple(reversed(range(n)))])
    for mat in materials or [None]:
        space = Space(raw, units, dims, mat, objective, strict)
        start = tuple(d.start for d in dims)
        if strict:
            space.ignored = space.hub_independent(start)
            result.strict_ignored = tuple(sorted(set(result.strict_ignored) | space.ignored))
        if not space(start).ok:
            start = space.grow(start)
        if start is None:
            result.spaces[space(tuple(d.start for d in dims)).material] = space
            continue
        found = {space.descend(start, order) for order in orders}
        result.spaces[space(start).material] = space
        result.minimal += [space(p) for p in found if space.minimal(p)]
    result.minimal.sort(key=Outcome.key)
    if result.minimal:
        result.best = result.minimal[0]
        return result
    for s in result.spaces.values():  # nothing passed: judge the attempts in full to name what fails
        for p in [p for p, o in s.seen.items() if o.partial]:
            s.complete(p)
    tried = [o for s in result.spaces.values() for o in s.seen.values()]
    buildable = [o for o in tried if o.refusal is None]
    if buildable:
        common = set(buildable[0].failed).intersection(*(o.failed for o in buildable[1:]))
        result.unmet = tuple(r for r in buildable[0].failed if r in common)
        result.attempt = min(buildable, key=lambda o: (len(o.failed), o.key()))
    else:
        result.attempt = min(tried, key=Outcome.key)
    return result
