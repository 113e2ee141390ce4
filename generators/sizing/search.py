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
        self.judges = None  # a parallel.Judges: several points judged at once

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

    def __getstate__(self) -> dict:
        """What a worker needs to judge a point: not the points seen, not the pool."""
        return dict(self.__dict__, seen={}, judges=None)

    @property
    def width(self) -> int:
        """How many points are judged at once (one per core with judges)."""
        return self.judges.width if self.judges is not None else 1

    def many(self, points, full: bool = False) -> list[Outcome]:
        """The outcomes of several points (``full``: as ``complete``), judged in parallel."""
        points = [tuple(p) for p in points]
        todo = [p for p in dict.fromkeys(points) if not self._outside(p)
                and (p not in self.seen or (full and self.seen[p].partial))]
        if len(todo) > 1 and self.width > 1:
            for p, o in zip(todo, self.judges.map(self, todo, full)):
                self.seen[p] = o
        return [self.complete(p) if full else self(p) for p in points]

    def _outside(self, point: tuple[int, ...]) -> bool:
        return any(k < d.lowest or (d.highest is not None and k > d.highest) for d, k in zip(self.dims, point))

    def _evaluate(self, point: tuple[int, ...], full: bool = False) -> Outcome:
        from generators.design import design, failing_before_walls

        from generators.standards.materials import get_material

        mat = get_material(self.material or self.raw.get("hub", {}).get("material", "hdpe")).id
        if self._outside(point):
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

    def descents(self, start: tuple[int, ...], orders) -> list[tuple[int, ...]]:
        """A descent from ``start`` for each order of the dimensions, run side by side: each
        round judges the next points of every descent at once (in parallel with judges)."""
        w = max(1, self.width // len(orders))  # spare judges go to cutting brackets finer
        runs = [self._descent(start, order, w) for order in orders]
        found: list = [None] * len(runs)
        pending = {}
        for k, run in enumerate(runs):
            pending[k] = next(run)
        while pending:
            outcomes = iter(self.many([p for pts in pending.values() for p in pts]))
            ahead = {}
            for k, pts in pending.items():
                try:
                    ahead[k] = runs[k].send([next(outcomes) for _ in pts])
                except StopIteration as done:
                    found[k] = done.value
            pending = ahead
        return found

    def _descent(self, start, order, w: int):
        """Bisect each dimension down to its least passing value; repeat until none moves.
        Later passes, where a value has moved little if at all, step down 1, 2, 4 ... until
        one fails and bisect only that bracket (one design when nothing moved). A generator:
        it yields the points it needs judged (``w`` at a time: the bracket cut in more parts,
        the steps down taken together) and is sent their outcomes."""
        x = list(start)
        for n_pass in range(MAX_PASSES):
            moved = False
            if n_pass and w > 1:  # the points a pass that moves nothing asks for, at once
                yield [self.step(tuple(x), i, -1) for i in order if x[i] > self.dims[i].lowest]
            for i in order:
                hi, low = x[i], self.dims[i].lowest
                if hi <= low:
                    continue
                base = tuple(x)

                def at(k, i=i, base=base):
                    return self.step(base, i, k - base[i])

                if n_pass:
                    hi = yield from self._gallop(at, hi, low, w)
                else:
                    hi = yield from self._least(at, low - 1, hi, w, first=low)
                if hi != x[i]:
                    x[i], moved = hi, True
            if not moved:
                break
        return tuple(x)

    @staticmethod
    def _least(at, a: int, b: int, w: int, first: int | None = None):
        """The least passing value in ``(a, b]``: ``b`` passes, ``a`` fails (or is off the
        grid); ``first`` is judged in the first round (the grid's end, which may pass)."""
        while b - a > 1:
            if first is not None:
                probes, first = [first] + ([(a + b) // 2] if w > 1 else []), None
            else:
                probes = [a + (b - a) * j // (w + 1) for j in range(1, w + 1)]
            probes = sorted({k for k in probes if a < k < b})
            oks = [o.ok for o in (yield [at(k) for k in probes])]
            passing = [k for k, ok in zip(probes, oks) if ok]
            if passing:
                b = min(passing)
            a = max([a] + [k for k, ok in zip(probes, oks) if not ok and k < b])
        return b

    @classmethod
    def _gallop(cls, at, hi: int, low: int, w: int):
        """Step down from a passing ``hi`` by 1, 2, 4 ... (``w`` steps a round) to the first
        failure, then bisect that bracket."""
        jump = 1
        while hi > low:
            probes = sorted({max(low, hi - jump * 2 ** j) for j in range(w)}, reverse=True)
            oks = [o.ok for o in (yield [at(k) for k in probes])]
            fail = next((k for k, ok in zip(probes, oks) if not ok), None)
            passing = [k for k, ok in zip(probes, oks) if ok and (fail is None or k > fail)]
            if passing:
                hi = min(passing)
            if fail is not None:
                return (yield from cls._least(at, fail, hi, w))
            jump *= 2 ** w
        return hi

    def grow(self, start: tuple[int, ...]) -> tuple[int, ...] | None:
        """A passing point at or above ``start``: all dimensions grown together, then one at a time."""
        tries = []
        for f in GROW:
            tries.append(tuple(self._grown(k, d, f) for k, d in zip(start, self.dims)))
        for i in range(len(self.dims)):
            for f in GROW:
                tries.append(self.step(start, i, self._grown(start[i], self.dims[i], f) - start[i]))
        for lo in range(0, len(tries), self.width):  # the first in this order that passes
            chunk = tries[lo:lo + self.width]
            for p, o in zip(chunk, self.many(chunk)):
                if o.ok:
                    return p
        return None

    @staticmethod
    def _grown(k: int, d: Dimension, f: float) -> int:
        up = max(k + 1, math.ceil(k * f))
        return min(up, d.highest) if d.highest is not None else up

    def minimal(self, point: tuple[int, ...]) -> bool:
        """One step less in every dimension (where the grid has one) does not pass."""
        below = [self.step(point, i, -1) for i, d in enumerate(self.dims) if point[i] > d.lowest]
        return not any(o.ok for o in self.many(below))


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
         objective: str = "mass", strict: bool = False, judges=None) -> SizingResult:
    """Search every material's space (``None``: the config's own material); ``judges``
    (a ``parallel.Judges``) judges several points at once."""
    result = SizingResult(dims, objective, None)
    n = len(dims)
    # each dimension leads once (up to three), else forwards and backwards
    orders = ([tuple((i + k) % n for i in range(n)) for k in range(n)] if n <= 3
              else [tuple(range(n)), tuple(reversed(range(n)))])
    for mat in materials or [None]:
        space = Space(raw, units, dims, mat, objective, strict)
        space.judges = judges
        start = tuple(d.start for d in dims)
        if strict:
            space.ignored = space.hub_independent(start)
            result.strict_ignored = tuple(sorted(set(result.strict_ignored) | space.ignored))
        if not space(start).ok:
            start = space.grow(start)
        if start is None:
            result.spaces[space(tuple(d.start for d in dims)).material] = space
            continue
        found = set(space.descents(start, orders))
        result.spaces[space(start).material] = space
        result.minimal += [space(p) for p in found if space.minimal(p)]
    result.minimal.sort(key=Outcome.key)
    if result.minimal:
        result.best = result.minimal[0]
        return result
    for s in result.spaces.values():  # nothing passed: judge the attempts in full to name what fails
        s.many([p for p, o in s.seen.items() if o.partial], full=True)
    tried = [o for s in result.spaces.values() for o in s.seen.values()]
    buildable = [o for o in tried if o.refusal is None]
    if buildable:
        common = set(buildable[0].failed).intersection(*(o.failed for o in buildable[1:]))
        result.unmet = tuple(r for r in buildable[0].failed if r in common)
        result.attempt = min(buildable, key=lambda o: (len(o.failed), o.key()))
    else:
        result.attempt = min(tried, key=Outcome.key)
    return result
