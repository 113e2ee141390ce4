"""Drill reach against DIN 338 (jobber) and DIN 340 (long series) flute lengths (from memory of
the makers' tables that reprint them)."""

import pytest

from generators.standards.drill_lengths import flute_length_mm, series_reaching


@pytest.mark.parametrize("d,flute", [(5.0, 52), (6.0, 57), (8.0, 75), (10.0, 87), (20.0, 140)])
def test_jobber_flute_lengths_din_338(d, flute):
    assert flute_length_mm(d, "jobber") == flute  # DIN 338 (from memory)


@pytest.mark.parametrize("d,flute", [(5.0, 87), (8.0, 109), (10.0, 121)])
def test_long_series_flute_lengths_din_340(d, flute):
    assert flute_length_mm(d, "long") == flute  # DIN 340 (from memory)


def test_shortest_series_that_reaches():
    assert series_reaching(5.2, 40.0) == "jobber"
    assert series_reaching(5.2, 80.0) == "long"  # past 52 mm of jobber flutes, within 87 mm
    assert series_reaching(5.2, 96.5) is None  # a 3.8 in hole: no twist-drill series of these reaches


@pytest.mark.parametrize("d,flute", [(2.5, 30), (3.2, 36), (3.5, 39)])
def test_small_jobber_flute_lengths_din_338(d, flute):
    assert flute_length_mm(d, "jobber") == flute  # DIN 338 (from memory)


@pytest.mark.parametrize("thread,overall_mm", [("M6", 80.0), ("M10", 100.0), ("1/4-20", 2.5 * 25.4),
                                               ("#10-24", 2.375 * 25.4)])
def test_hand_tap_reach_is_its_length_less_the_wrench_square(thread, overall_mm):
    from generators.standards.drill_lengths import TAP_GRIP_MM, hand_tap_reach_mm

    # DIN 371 (metric) and ASME B94.9 (inch) overall lengths, from memory
    assert hand_tap_reach_mm(thread) == pytest.approx(overall_mm - TAP_GRIP_MM)


# ASME B94.11M jobber flute lengths of fractional drills (from memory of the makers' charts that
# reprint it); a number or letter drill takes the fractional size below it (the shorter flute)
@pytest.mark.parametrize("d_in,flute_in", [(1 / 8, 1 + 5 / 8), (1 / 4, 2.75), (3 / 8, 3 + 5 / 8), (1 / 2, 4.5),
                                           (0.201, 2 + 5 / 16), (0.221, 2.5), (0.257, 2.75)])
def test_inch_jobber_flute_lengths_asme_b94_11m(d_in, flute_in):
    assert flute_length_mm(d_in * 25.4, "jobber", inch=True) == pytest.approx(flute_in * 25.4, abs=1e-3)


def test_inch_drills_past_half_an_inch_and_metric_drills_keep_din():
    assert flute_length_mm(0.75 * 25.4, "jobber", inch=True) == flute_length_mm(0.75 * 25.4, "jobber")
    assert flute_length_mm(6.0, "jobber") == 57  # DIN 338, unchanged for a metric drill
    # a #2 drill (0.221 in) 2.25 in deep: a jobber drill reaches by ASME B94.11M, not by DIN 338
    assert series_reaching(0.221 * 25.4, 2.25 * 25.4, inch=True) == "jobber"
    assert series_reaching(0.221 * 25.4, 2.25 * 25.4) == "long"
