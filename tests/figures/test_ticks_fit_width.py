"""Date axes go down to weeks and days when there is room for their labels."""

import datetime as dt
import re

import numpy as np
import pytest

from workbench.core import Settings
from workbench.core.calendar import WorkCalendar
from workbench.figures.ticks import fitted_date_ticks

CAL = WorkCalendar(Settings(start=dt.date(2027, 3, 1)))          # a Monday


def chars(text):                 # a label's width at about 7 px a character
    return 7.0 * len(text)


def _spacing(ticks, lo, hi, width):
    xs = (np.array([o for o, _ in ticks]) - lo) / (hi - lo) * width
    return np.diff(xs)


def test_weeks_60_px_wide_get_week_labels():
    lo, hi = 0.0, 100.0                                           # 20 weeks of working days
    width = 20 * 60.0
    ticks = fitted_date_ticks(CAL, lo, hi, width, chars)
    assert len(ticks) >= 18
    assert all(re.fullmatch(r"\d{1,2} [A-Z][a-z]{2}( \d{4})?", t) for _, t in ticks)
    assert np.allclose(_spacing(ticks, lo, hi, width), 60.0)


def test_three_weeks_on_a_wide_screen_get_day_labels():
    ticks = fitted_date_ticks(CAL, 0.0, 15.0, 1400.0, chars)
    assert [t for _, t in ticks][:2] == ["Mon 1 Mar", "Tue 2"]


@pytest.mark.parametrize("width", [120.0, 300.0, 700.0, 1900.0])
@pytest.mark.parametrize("span", [5.0, 40.0, 260.0, 2600.0])
def test_labels_never_overlap(width, span):
    ticks = fitted_date_ticks(CAL, 0.0, span, width, chars)
    assert ticks
    if len(ticks) > 1:
        half = np.array([chars(t) for _, t in ticks]) / 2
        assert np.all(_spacing(ticks, 0.0, span, width) >= half[:-1] + half[1:] + 12 - 1e-9)
