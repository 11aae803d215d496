"""Date ticks on a working-time axis (workbench.figures.ticks)."""

import datetime as dt

import numpy as np
from hypothesis import given, settings, strategies as st

from workbench.core import Calendar, Settings, WorkCalendar
from workbench.figures.ticks import date_ticks

# 2 Dec 2026 is a Wednesday (checked with Python's datetime, see below).
START = dt.date(2026, 12, 2)


def cal(unit="days", holidays=()):
    return WorkCalendar(Settings(start=START, unit=unit, calendar=Calendar(holidays=tuple(holidays))))


def test_start_is_a_wednesday():
    assert START.weekday() == 2


def test_short_span_ticks_every_working_day_with_month_on_first():
    ticks = date_ticks(cal(), 0, 6, 12)
    assert [o for o, _ in ticks] == [0, 1, 2, 3, 4, 5, 6]
    assert [t for _, t in ticks] == ["Wed 2 Dec", "Thu 3", "Fri 4", "Mon 7", "Tue 8", "Wed 9", "Thu 10"]


def test_holiday_is_skipped_at_day_level():
    ticks = date_ticks(cal(holidays=[dt.date(2026, 12, 3)]), 0, 3, 12)
    assert [t for _, t in ticks] == ["Wed 2 Dec", "Fri 4", "Mon 7", "Tue 8"]


def test_weeks_start_on_mondays_at_their_offset():
    ticks = date_ticks(cal(), 0, 30, 8)
    assert ticks[0] == (3.0, "7 Dec")   # Mon 7 Dec is the fourth working day
    assert all(b - a == 5 for (a, _), (b, _) in zip(ticks, ticks[1:]))
    assert "4 Jan 2027" in [t for _, t in ticks]


def test_months_and_year_change():
    ticks = date_ticks(cal(), 0, 300, 10)
    labels = [t for _, t in ticks]
    assert labels[0] == "Jan 2027"
    assert "Jan 2028" in labels
    assert len(ticks) <= 10


def test_weeks_unit_scales_offsets():
    days = date_ticks(cal(), 0, 50, 12)
    weeks = date_ticks(cal("weeks"), 0, 10, 12)
    assert [t for _, t in days] == [t for _, t in weeks]
    assert np.allclose([o / 5 for o, _ in days], [o for o, _ in weeks])


def test_degenerate_input():
    assert date_ticks(cal(), 0, 10, 0) == []
    assert date_ticks(cal(), 0, float("nan"), 5) == []
    assert date_ticks(cal(), 10, 0, 20) == date_ticks(cal(), 0, 10, 20)


@settings(max_examples=60, deadline=None)
@given(lo=st.floats(-500, 5000), span=st.floats(0.5, 20000), max_ticks=st.integers(2, 30))
def test_ticks_inside_sorted_and_few(lo, span, max_ticks):
    ticks = date_ticks(cal(), lo, lo + span, max_ticks)
    offsets = [o for o, _ in ticks]
    assert len(ticks) <= max_ticks
    assert all(lo - 1e-9 <= o <= lo + span + 1e-9 for o in offsets)
    assert offsets == sorted(set(offsets))
    assert all(label for _, label in ticks)
    if span >= 10:
        assert len(ticks) >= 1


@settings(max_examples=40, deadline=None)
@given(lo=st.floats(-200, 3000), span=st.floats(400, 40000), max_ticks=st.integers(2, 12))
def test_month_and_year_ticks_are_aligned_to_the_calendar(lo, span, max_ticks):
    """Quarters start in Jan/Apr/Jul/Oct and n-year ticks on years divisible by n (2025,
    2050 for 25 years), whatever the view's first date."""
    ticks = date_ticks(cal(), lo, lo + span, max_ticks)
    dates = [np.datetime64(cal().start_dates([o])[0], "D").astype(dt.date) for o, _ in ticks]
    labels = [t for _, t in ticks]
    if all(t.isdigit() for t in labels) and len(labels) > 1:
        years = [int(t) for t in labels]
        step = years[1] - years[0]
        assert all(y % step == 0 for y in years)
        # a tick on a non-working 1 January sits on the next working day of that year
        assert all(d.year == y and d.month == 1 and d.day <= 7 for d, y in zip(dates, years))
    if all(t.startswith("Q") for t in labels):
        assert all(d.month in (1, 4, 7, 10) and d.day <= 7 for d in dates)


@settings(max_examples=80, deadline=None)
@given(lo=st.floats(-4e6, 4e6), span=st.floats(0.5, 4e6), max_ticks=st.integers(1, 30),
       unit=st.sampled_from(["days", "weeks"]))
def test_a_view_beyond_any_calendar_date_gives_ticks_only_where_dates_exist(lo, span, max_ticks, unit):
    """A Timeline can be panned or zoomed out past year 1 or 9999 (or past the calendar's
    reach): ticks are then given only for real dates, never an error."""
    ticks = date_ticks(cal(unit), lo, lo + span, max_ticks)
    assert len(ticks) <= max_ticks
    assert all(lo - 1e-9 <= o <= lo + span + 1e-9 for o, _ in ticks)


def test_a_thousand_year_view_still_has_ticks():
    ticks = date_ticks(cal(), 0, 1_000_000, 8)
    assert 2 <= len(ticks) <= 8 and all(t.isdigit() for _, t in ticks)


def test_a_span_no_step_fits_still_gets_ticks():
    """Fifty years with room for two labels: 25-year steps give three, 100-year steps none;
    every other 25-year tick is kept rather than none (found by the property test above)."""
    ticks = date_ticks(cal(), -500.0, 12544.0, 2)
    assert [label for _, label in ticks] == ["2025", "2075"]
    assert all(-500.0 <= o <= 12544.0 for o, _ in ticks)
