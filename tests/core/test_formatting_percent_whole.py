"""Whole percentages for people: the space before the sign, and no false certainty near the ends."""

from workbench.core.formatting import NONE, format_whole_percent


def test_whole_percent_has_the_space_and_guards_the_ends():
    assert format_whole_percent(0.434) == "43 %"
    assert format_whole_percent(0.9) == "90 %"
    assert format_whole_percent(0.0) == "0 %" and format_whole_percent(1.0) == "100 %"
    assert format_whole_percent(0.001) == "< 1 %" and format_whole_percent(0.999) == "> 99 %"
    assert format_whole_percent(None) == NONE
