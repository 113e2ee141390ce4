"""Mast sizes against pipe and conduit tables."""

import pytest

from generators.errors import UserError
from generators.standards.pipes import resolve_mast

IN = 25.4


@pytest.mark.parametrize("text,od_in", [
    ("1 NPS", 1.315), ("1-1/4 NPS", 1.660), ("1-1/2 in sch 40 pipe", 1.900), ("2 in pipe", 2.375),
    ("1/2 NPS", 0.840), ("4 NPS sch 80", 4.500),
])
def test_nps_od(text, od_in):  # ASME B36.10M outside diameters (from memory)
    m = resolve_mast(text)
    assert m.kind == "pipe" and m.od_mm == pytest.approx(od_in * IN)


def test_schedule_changes_wall_only():
    s40, s80 = resolve_mast("1 NPS"), resolve_mast("1 NPS sch 80")
    assert s40.od_mm == s80.od_mm
    assert s40.wall_mm == pytest.approx(0.133 * IN) and s80.wall_mm == pytest.approx(0.179 * IN)
    assert s40.designation == "1 NPS sch 40 pipe"


@pytest.mark.parametrize("text,od_in", [
    ("1/2 in EMT", 0.706), ("3/4 EMT", 0.922), ("1 in EMT", 1.163), ("1-1/4 in EMT", 1.510),
    ("1-1/2 EMT", 1.740), ("2 in EMT", 2.197),
])
def test_emt_od(text, od_in):  # ANSI C80.3 EMT outside diameters (from memory)
    m = resolve_mast(text)
    assert m.kind == "emt" and m.od_mm == pytest.approx(od_in * IN)


def test_plain_diameters():
    assert resolve_mast(38).od_mm == 38 and resolve_mast(38).kind == "tube"
    assert resolve_mast("38 mm").od_mm == 38
    assert resolve_mast("1-1/2 in").od_mm == pytest.approx(38.1)
    assert resolve_mast(1.5, units="in").od_mm == pytest.approx(38.1)


@pytest.mark.parametrize("text", ["1-1/3 NPS", "5 in EMT", "1 NPS sch 10", "banana", "-3 mm"])
def test_bad_masts(text):
    with pytest.raises(UserError) as err:
        resolve_mast(text)
    assert err.value.key == "mast.size"


def test_nps_did_you_mean():
    with pytest.raises(UserError) as err:
        resolve_mast("1-1/3 NPS")
    assert "'1-1/4'" in str(err.value)


def test_a_plain_tube_is_named_in_the_configs_units():
    # 1 in = 25.4 mm exactly (international inch); an inch config's plain tube reads in inches
    assert resolve_mast("1-1/4", units="in").designation == "1-1/4 in tube"
    assert resolve_mast("1-1/4", units="in").od_mm == 31.75
    assert resolve_mast("38 mm").designation == "38 mm tube"
