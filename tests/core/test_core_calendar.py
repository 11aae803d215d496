"""Offsets to dates: weekends and stored holidays skipped, weeks, milestones, constraints.

Dates checked against a printed calendar of January 2027 (4 January 2027 is a Monday).
"""

import datetime as dt

import numpy as np
import pytest

from workbench.core import Activity, Calendar, Link, Plan, PlanError, Settings, analyze
from workbench.core.calendar import WorkCalendar, public_holidays

D = dt.date


def _plan(unit="days", holidays=(), start=D(2027, 1, 4), **acts):
    acts = [Activity(k, duration=v) for k, v in acts.items()]
    links = [Link(a.id, b.id) for a, b in zip(acts, acts[1:])]
    return Plan(Settings(title="cal", start=start, unit=unit, calendar=Calendar(holidays=tuple(holidays))),
                acts, links)


def _dates(analysis, key):
    return [d.astype(dt.date) for d in analysis.dates()[key]]


def test_weekend_is_skipped():
    a = analyze(_plan(A=5, B=3))
    assert _dates(a, "early_start") == [D(2027, 1, 4), D(2027, 1, 11)]   # Mon, next Mon
    assert _dates(a, "early_finish") == [D(2027, 1, 8), D(2027, 1, 13)]  # Fri, Wed
    assert a.finish_date == D(2027, 1, 13)


def test_start_on_a_weekend_rolls_to_monday():
    a = analyze(_plan(start=D(2027, 1, 2), A=1))                          # a Saturday
    assert a.start_date == D(2027, 1, 4)
    assert a.finish_date == D(2027, 1, 4)


def test_stored_holidays_are_skipped():
    a = analyze(_plan(holidays=[D(2027, 1, 12)], A=5, B=3))               # Tuesday off
    assert _dates(a, "early_finish") == [D(2027, 1, 8), D(2027, 1, 14)]
    assert not a.calendar.is_working(D(2027, 1, 12))
    assert not a.calendar.is_working(D(2027, 1, 9))                       # Saturday
    assert a.calendar.is_working(D(2027, 1, 13))


def test_six_day_week():
    plan = _plan(A=6)
    plan.settings.calendar = Calendar(workdays=(0, 1, 2, 3, 4, 5))
    assert analyze(plan).finish_date == D(2027, 1, 9)                     # Saturday worked


def test_weeks_unit():
    a = analyze(_plan(unit="weeks", A=1, B=0.4, C=2))
    assert _dates(a, "early_finish") == [D(2027, 1, 8), D(2027, 1, 12), D(2027, 1, 26)]
    assert a.calendar.offset_before(D(2027, 1, 11)) == 1.0                # one week in
    assert a.calendar.offset_through(D(2027, 1, 12)) == pytest.approx(1.4)


def test_milestones_are_dated_by_the_day_that_ends_there():
    a = analyze(_plan(Kickoff=0, Work=5, Handover=0))
    starts, finishes = _dates(a, "early_start"), _dates(a, "early_finish")
    assert starts[0] == finishes[0] == D(2027, 1, 4)                      # at offset 0
    assert starts[2] == finishes[2] == D(2027, 1, 8)                      # after Friday's work
    assert a.finish_date == D(2027, 1, 8)
    assert _dates(a, "late_finish")[2] == D(2027, 1, 8)


def test_offsets_and_dates_round_trip():
    cal = WorkCalendar(Settings(start=D(2027, 1, 4), calendar=Calendar(holidays=(D(2027, 1, 6),))))
    for day in range(1, 40):
        date = D(2027, 1, 4) + dt.timedelta(days=day)
        if cal.is_working(date):
            assert cal.start_date(cal.offset_before(date)) == date
            assert cal.finish_date(cal.offset_through(date)) == date
    assert cal.resolve(None, finish=True) is None
    assert cal.resolve(3, finish=False) == 3.0


def test_date_constraints_and_deadline():
    plan = _plan(A=5, B=3)
    plan.replace_activity("B", plan.activity("B").with_(start_no_earlier=D(2027, 1, 13)))
    a = analyze(plan, deadline=D(2027, 1, 15))
    assert _dates(a, "early_start")[1] == D(2027, 1, 13)                  # Wednesday
    assert a.schedule.finish == 10.0
    assert a.deadline == 10.0                                             # Friday's end
    assert a.finish_date == D(2027, 1, 15)


def test_public_holidays_are_resolved_to_dates():
    # Reference: the holidays package (python-holidays), Germany 2027: New Year, Christmas.
    days = public_holidays("DE", [2027])
    assert D(2027, 1, 1) in days and D(2027, 12, 25) in days
    assert days == sorted(days) and all(isinstance(d, dt.date) for d in days)
    with pytest.raises(PlanError, match="XX"):
        public_holidays("XX", [2027])


def test_dates_are_vectorised():
    cal = WorkCalendar(Settings(start=D(2027, 1, 4)))
    days = cal.start_dates(np.arange(10))
    assert days.dtype == np.dtype("datetime64[D]")
    assert (np.is_busday(days)).all() and len(set(days.tolist())) == 10


def test_dates_before_the_start_round_trip():
    """A deadline or constraint before the project start keeps its own date (negative offsets)."""
    import datetime as _dt

    from workbench.core import Settings as _Settings
    from workbench.core.calendar import WorkCalendar as _Cal

    cal = _Cal(_Settings(start=_dt.date(2026, 12, 2)))   # a Wednesday
    for day in (_dt.date(2020, 1, 3), _dt.date(2026, 11, 27), _dt.date(2026, 11, 30)):
        off = cal.offset_through(day)
        assert off < 0 and cal.finish_date(off) == day
        assert cal.start_date(cal.offset_before(day)) == day
    assert cal.offset_through(_dt.date(2026, 12, 1)) == 0          # the end of the day before the start
    assert cal.offset_before(_dt.date(2026, 11, 30)) == -2         # Monday: two working days earlier


def test_schedule_beyond_the_calendar_names_the_activity():
    acts = [Activity("A", duration=1e6), Activity("B", duration=1e6)]
    plan = Plan(Settings(start=dt.date(2027, 1, 4)), acts, [Link("A", "B")])
    with pytest.raises(PlanError, match="activity B") as err:
        analyze(plan)
    assert err.value.culprit == "B"
