"""Sizing with several judges (forked workers) finds what one judge finds: the same outcome
for every point, the same sized design, and a locally minimal one when the spare judges cut
the brackets finer (one varied dimension). Judged by ``design()`` in this process and by
loading the edited TOML, not by the search's own verdicts."""

from __future__ import annotations

import tomllib

from generators.config import load_config
from generators.sizing import size
from generators.sizing.parallel import Judges
from generators.sizing.search import Space
from generators.sizing.space import dimensions
from tests.sizing.helpers import ROOT, one_step_smaller, verdict

DEMO = ROOT / "configs" / "five-spreader-aluminium.toml"


def _space():
    cfg = load_config(DEMO)
    raw = tomllib.loads(DEMO.read_text(encoding="utf-8"))
    return cfg, raw, dimensions(cfg, raw, None, "mass")


def test_points_judged_in_workers_match_this_process():
    cfg, raw, dims = _space()
    start = tuple(d.start for d in dims)
    points = [start] + [tuple(k - s if i == j else k for i, k in enumerate(start))
                        for j in range(len(dims)) for s in (1, 8, 40)]
    alone = Space(raw, cfg.units, dims, None, "mass", False)
    with Judges(2) as judges:
        together = Space(raw, cfg.units, dims, None, "mass", False)
        together.judges = judges
        got = together.many(points, full=True)
        assert judges.pool is not None  # the points really went to workers
    for p, o in zip(points, got):
        ref = alone.complete(p)
        assert (o.ok, o.failed, o.refusal) == (ref.ok, ref.failed, ref.refusal), p
        assert o.mass_g == ref.mass_g


def test_same_design_with_one_or_two_judges():
    cfg, raw, dims = _space()
    one = size(raw, cfg.units, dims)
    with Judges(2) as judges:
        two = size(raw, cfg.units, dims, judges=judges)
    assert one.best.values == two.best.values


def test_finer_brackets_give_a_locally_minimal_design():
    cfg, raw, dims = _space()
    dims = dims[:1]  # one descent: both judges cut its brackets (thirds, two steps down a round)
    with Judges(2) as judges:
        result = size(raw, cfg.units, dims, judges=judges)
        data = result.space(result.best).data(result.best.point)
    assert verdict(data) == "pass"
    assert verdict(one_step_smaller(data, dims[0].key)) != "pass"
