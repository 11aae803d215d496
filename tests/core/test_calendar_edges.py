"""Dates at the edges: a finish at offset 0, start and finish milestones, constrained gates.

Dates checked against a printed calendar of January 2027: Friday 1 January, Monday 4
January, Wednesday 13 January 2027.
"""

import datetime as dt

import numpy as np
from hypothesis import given
from hypothesis import strategies as st

from workbench.core import Activity, Calendar, Link, Plan, Settings, analyze
from workbench.core.calendar import WorkCalendar

D = dt.date
MONDAY = D(2027, 1, 4)


def _dates(analysis, act_id):
    i = analysis.schedule.index(act_id)
    return {k: v[i].astype(dt.date) for k, v in analysis.dates().items()}


def _plan(acts, links=()):
    return Plan(Settings(title="edges", start=MONDAY), list(acts), [Link(*l) for l in links])


def test_a_finish_at_offset_zero_is_the_working_day_before_the_start():
    cal = WorkCalendar(Settings(start=MONDAY))
    assert cal.finish_date(0.0) == D(2027, 1, 1)                  # Friday, not Monday
    assert cal.finish_date(cal.offset_through(D(2027, 1, 1))) == D(2027, 1, 1)
    with_holiday = WorkCalendar(Settings(start=MONDAY, calendar=Calendar(holidays=(D(2027, 1, 1),))))
    assert with_holiday.finish_date(0.0) == D(2026, 12, 31)       # New Year off: Thursday


def test_a_deadline_on_the_friday_before_a_monday_start_is_echoed_as_that_friday():
    a = analyze(_plan([Activity("A", duration=3)]), deadline=D(2027, 1, 1))
    assert a.deadline == 0.0
    assert a.date_of_duration(a.deadline) == D(2027, 1, 1)


def test_a_two_day_activity_finishing_no_later_than_offset_zero_spans_two_days():
    a = analyze(_plan([Activity("A", duration=2, finish_no_later=D(2027, 1, 1))]))
    late = _dates(a, "A")
    assert (late["late_start"], late["late_finish"]) == (D(2026, 12, 31), D(2027, 1, 1))


def test_a_start_milestone_is_dated_the_morning_it_opens():
    a = analyze(_plan([Activity("Go", duration=0), Activity("A", duration=5)], [("Go", "A")]))
    go = _dates(a, "Go")
    assert go["early_start"] == go["early_finish"] == go["late_finish"] == MONDAY
    only = analyze(_plan([Activity("Go", duration=0)]))
    assert only.finish_date == MONDAY                              # a plan of one gate ends at the start


def test_a_gate_held_by_its_start_constraint_is_dated_on_that_day_like_its_successor():
    acts = [Activity("A", duration=5), Activity("Gate", duration=0, start_no_earlier=D(2027, 1, 13)),
            Activity("B", duration=2)]
    a = analyze(_plan(acts, [("A", "Gate"), ("Gate", "B")]))
    gate, b = _dates(a, "Gate"), _dates(a, "B")
    assert gate["early_start"] == gate["early_finish"] == D(2027, 1, 13)   # Wednesday, not Tuesday
    assert b["early_start"] == D(2027, 1, 13)
    tail = analyze(_plan(acts[:2], [("A", "Gate")]))
    assert tail.finish_date == D(2027, 1, 13)


def test_a_gate_pushed_past_its_constraint_by_work_is_a_finish_milestone():
    acts = [Activity("A", duration=8), Activity("Gate", duration=0, start_no_earlier=D(2027, 1, 6))]
    gate = _dates(analyze(_plan(acts, [("A", "Gate")])), "Gate")
    assert gate["early_start"] == gate["early_finish"] == D(2027, 1, 13)   # after Wednesday's work


def test_a_hand_over_is_dated_the_evening_it_happens():
    acts = [Activity("A", duration=5), Activity("Handover", duration=0)]
    a = analyze(_plan(acts, [("A", "Handover")]))
    assert _dates(a, "Handover")["early_finish"] == D(2027, 1, 8)          # Friday, not Monday
    assert a.finish_date == D(2027, 1, 8)


@given(st.integers(-30, 30), st.integers(1, 12))
def test_an_activity_of_d_working_days_spans_d_working_days_wherever_it_lies(start, duration):
    cal = WorkCalendar(Settings(start=MONDAY))
    first = np.datetime64(cal.start_date(start), "D")
    last = np.datetime64(cal.finish_date(start + duration), "D")
    assert np.busday_count(first, last + 1) == duration


def test_a_gate_whose_finish_limit_meets_its_start_limit_is_read_by_the_finish_limit():
    # Start no earlier than Tuesday and finish no later than Monday meet at Monday's end.
    acts = [Activity("Gate", duration=0, start_no_earlier=D(2027, 1, 5), finish_no_later=MONDAY)]
    gate = _dates(analyze(_plan(acts)), "Gate")
    assert gate["early_start"] == gate["late_finish"] == MONDAY


def test_a_gate_with_float_is_read_by_what_holds_its_late_date():
    monday_gate = Activity("Gate", duration=0, finish_no_later=D(2027, 1, 8))
    by_limit = _dates(analyze(_plan([monday_gate, Activity("Long", duration=10)])), "Gate")
    assert (by_limit["early_start"], by_limit["late_finish"]) == (MONDAY, D(2027, 1, 8))  # Friday's limit
    acts = [Activity("Gate", duration=0), Activity("A", duration=2), Activity("B", duration=5)]
    held = _dates(analyze(_plan(acts, [("Gate", "A")])), "Gate")
    assert held["late_start"] == D(2027, 1, 7)              # the morning A must start, Thursday
