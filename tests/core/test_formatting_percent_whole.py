"""Whole percentages for people: the space before the sign, and no false certainty near the ends."""

from workbench.core.formatting import NONE, format_whole_percent


def test_whole_percent_has_the_space_and_guards_the_ends():
    assert format_whole_percent(0.434) == "43 %"
    assert format_whole_percent(0.9) == "90 %"
    assert format_whole_percent(0.0) == "0 %" and format_whole_percent(1.0) == "100 %"
    assert format_whole_percent(0.001) == "< 1 %" and format_whole_percent(0.999) == "> 99 %"
    assert format_whole_percent(None) == NONE


def test_a_chance_from_estimates_is_never_said_to_be_certain():
    from workbench.core.formatting import format_chance
    assert [format_chance(p) for p in (0.0, 0.0004, 0.0006, 0.5, 0.855, 0.9994, 0.9996, 1.0)] == [
        "< 0.1 %", "< 0.1 %", "0.1 %", "50.0 %", "85.5 %", "99.9 %", "> 99.9 %", "> 99.9 %"]
