"""Scheduling from the status date, hand-checked; and every refused progress input.

The rules follow GAO-16-89G (2015), best practice 9 ("updating the schedule using actual
progress and logic"): actual dates are fixed, remaining work is forecast from the status
date, and out-of-sequence progress is handled by retained logic or progress override (the
two trade rules; AACE terms). Every expected number below is worked out by hand in the
comments; the calendar is Monday to Friday from Monday 4 January 2027.
"""

import datetime as dt

import numpy as np
import pytest

from workbench.core import Activity, Link, Plan, PlanError, Settings, analyze
from workbench.core.errors import StatusDateMissing
from workbench.core.progress_fields import DONE, IN_PROGRESS, NOT_STARTED, Progress

MONDAY = dt.date(2027, 1, 4)
WEDNESDAY = dt.date(2027, 1, 6)      # end of Wednesday = offset 3


def plan_of(acts, links=(), status=WEDNESDAY, rule="retained logic", **more):
    return Plan(Settings(title="hand", start=MONDAY, status_date=status, progress_rule=rule, **more), acts, links)


def out_of_sequence(rule):
    """A (5 d) → B (4 d) → C (3 d), all FS. A started Monday (4 d remain), B started Tuesday
    (2 d remain) although A has not finished: out-of-sequence progress."""
    acts = [Activity("A", duration=5, progress=Progress(actual_start=MONDAY, remaining=4)),
            Activity("B", duration=4, progress=Progress(actual_start=dt.date(2027, 1, 5), remaining=2)),
            Activity("C", duration=3)]
    return plan_of(acts, [Link("A", "B"), Link("B", "C")], rule=rule)


def test_retained_logic_makes_the_out_of_sequence_remainder_wait_for_its_predecessor():
    a = analyze(out_of_sequence("retained logic"))
    s = a.schedule
    # T = 3; A's remaining 4 d run 3..7; B's remaining 2 d wait for A: 7..9; C 9..12.
    assert a.progress.status_offset == 3
    assert s.es.tolist() == [3, 7, 9] and s.ef.tolist() == [7, 9, 12]
    assert s.critical.tolist() == [True, True, True]
    assert a.finish_date == dt.date(2027, 1, 19)          # working day 11 (0-based)
    assert a.progress.actual_start[:2].tolist() == [0, 1] and np.isnan(a.progress.actual_start[2])


def test_progress_override_lets_the_started_activity_ignore_its_unfinished_predecessor():
    a = analyze(out_of_sequence("progress override"))
    s = a.schedule
    # B's remainder runs from the status offset: 3..5; C 5..8; A still ends at 7 (1 d of float).
    assert s.es.tolist() == [3, 3, 5] and s.ef.tolist() == [7, 5, 8]
    assert s.total_float.tolist() == [1, 0, 0] and s.critical.tolist() == [False, True, True]
    assert a.finish_date == dt.date(2027, 1, 13)          # working day 7


@pytest.mark.parametrize("rule", ["retained logic", "progress override"])
def test_out_of_sequence_progress_is_accepted_with_a_warning_naming_both(rule):
    notes = analyze(out_of_sequence(rule)).progress.warnings
    assert len(notes) == 1
    assert "B" in notes[0] and "predecessor A" in notes[0] and rule in notes[0]


def test_the_status_offset_is_the_start_of_the_next_working_day():
    acts = [Activity("A", duration=10, progress=Progress(actual_start=0.0, remaining=2))]
    for day in (dt.date(2027, 1, 8), dt.date(2027, 1, 9), dt.date(2027, 1, 10)):   # Fri, Sat, Sun
        a = analyze(plan_of(acts, status=day))
        assert a.progress.status_offset == 5                 # Monday 11 January begins at 5
        assert a.schedule.es[0] == 5 and a.finish_date == dt.date(2027, 1, 12)


def test_links_leaving_a_started_activity_from_its_start_read_its_actual_start():
    # A started at 0 with 6 d left; SS lag 2 to B: B may start at 2, so the status offset 3
    # holds it (not A's remaining start 3 + 2). SF lag 10 to C (2 d): C must finish by... no
    # earlier than 10, so it starts at 8.
    acts = [Activity("A", duration=8, progress=Progress(actual_start=0.0, remaining=6)),
            Activity("B", duration=1), Activity("C", duration=2)]
    a = analyze(plan_of(acts, [Link("A", "B", "SS", 2.0), Link("A", "C", "SF", 10.0)]))
    assert a.schedule.es.tolist() == [3, 3, 8] and a.schedule.ef.tolist() == [9, 4, 10]
    a = analyze(plan_of(acts, [Link("A", "B", "SS", 4.0), Link("A", "C", "SF", 10.0)]))
    assert a.schedule.es[1] == 4


def test_a_lag_after_done_work_can_reach_past_the_status_date():
    # A done 0..2, then 4 d of curing (FS lag 4): B starts at 6, later than the status offset 3.
    acts = [Activity("A", duration=2, progress=Progress(actual_start=0.0, actual_finish=2.0)),
            Activity("B", duration=3)]
    a = analyze(plan_of(acts, [Link("A", "B", "FS", 4.0)]))
    assert a.schedule.es.tolist() == [0, 6] and a.progress.state.tolist() == [DONE, NOT_STARTED]
    assert a.schedule.total_float[0] == 0 and not a.schedule.critical[0] and a.schedule.critical[1]


def test_done_work_out_of_sequence_stays_on_its_actuals():
    # B finished Tuesday (1..2) while A is still running: B is not moved; C follows both.
    acts = [Activity("A", duration=5, progress=Progress(actual_start=0.0, remaining=3)),
            Activity("B", duration=1, progress=Progress(actual_start=1.0, actual_finish=2.0)),
            Activity("C", duration=2)]
    a = analyze(plan_of(acts, [Link("A", "B"), Link("B", "C"), Link("A", "C")]))
    assert a.schedule.es.tolist() == [3, 1, 6] and a.schedule.ef.tolist() == [6, 2, 8]
    assert [w.split(" (")[0] for w in a.progress.warnings] == [
        "out-of-sequence progress: B started before its predecessor A allows it"]


def test_pert_uses_the_remaining_path_variance():
    # A done; B in progress with (1, 2, 4) remaining; C not started (2, 3, 10).
    acts = [Activity("A", optimistic=1, most_likely=2, pessimistic=9,
                     progress=Progress(actual_start=0.0, actual_finish=2.0)),
            Activity("B", optimistic=2, most_likely=4, pessimistic=8,
                     progress=Progress(actual_start=2.0, remaining_optimistic=1, remaining_most_likely=2,
                                       remaining_pessimistic=4)),
            Activity("C", optimistic=2, most_likely=3, pessimistic=10)]
    a = analyze(plan_of(acts, [Link("A", "B"), Link("B", "C")]))
    # B's remaining te = (1 + 8 + 4)/6 = 13/6 from 3; C te = (2 + 12 + 10)/6 = 4.
    assert a.pert.mean == pytest.approx(3 + 13 / 6 + 4)
    assert a.pert.variance == pytest.approx((3 / 6) ** 2 + (8 / 6) ** 2)
    assert a.pert.path == ("B", "C")


def test_percent_complete_scales_the_estimate():
    # 25 % complete of (4, 6, 10): remaining (3, 4.5, 7.5), te = (3 + 18 + 7.5)/6 = 4.75.
    acts = [Activity("A", optimistic=4, most_likely=6, pessimistic=10,
                     progress=Progress(actual_start=0.0, percent_complete=25))]
    a = analyze(plan_of(acts))
    assert a.means[0] == pytest.approx(4.75) and a.variances[0] == pytest.approx((4.5 / 6) ** 2)
    assert a.schedule.ef[0] == pytest.approx(3 + 4.75)


def test_in_progress_without_remaining_work_keeps_its_estimate_and_warns():
    acts = [Activity("A", duration=5, progress=Progress(actual_start=0.0))]
    a = analyze(plan_of(acts))
    assert a.schedule.ef[0] == 8 and a.progress.state[0] == IN_PROGRESS
    assert "activity A is in progress with no remaining estimate" in a.progress.warnings[0]


def test_status_date_argument_overrides_the_plans():
    acts = [Activity("A", duration=5, progress=Progress(actual_start=0.0, remaining=2))]
    a = analyze(plan_of(acts), status_date=dt.date(2027, 1, 8))
    assert a.progress.status_offset == 5 and a.schedule.ef[0] == 7


# --- refusals, each naming the activity -----------------------------------------------
def refused(acts, match, status=WEDNESDAY):
    with pytest.raises(PlanError, match=match) as err:
        analyze(plan_of(acts, status=status))
    return err.value


@pytest.mark.parametrize("progress, match", [
    (Progress(actual_start=dt.date(2027, 1, 7)), "actual start 2027-01-07 is after the status date 2027-01-06"),
    (Progress(actual_start=4.0), "actual start at offset 4 is after the status date"),
    (Progress(actual_start=0.0, actual_finish=dt.date(2027, 1, 8)), "actual finish 2027-01-08 is after the status date"),
    (Progress(actual_start=MONDAY, actual_finish=-1.0), "actual finish offset -1 is before its actual start 2027-01-04"),
])
def test_actual_dates_against_the_status_date_and_each_other_are_refused(progress, match):
    err = refused([Activity("K1", duration=3, progress=progress)], match)
    assert err.culprit == "K1" and "activity K1" in str(err)


@pytest.mark.parametrize("progress, match", [
    (dict(actual_finish=2.0), "an actual finish needs an actual start"),
    (dict(actual_start=2.0, actual_finish=1.0), "actual finish 1 is before its actual start 2"),
    (dict(actual_start=0.0, actual_finish=2.0, remaining=1.0), "is done .* but remaining work is given"),
    (dict(actual_start=0.0, actual_finish=2.0, percent_complete=50), "is done .* but remaining work is given"),
    (dict(actual_start=0.0, percent_complete=101), "percent complete 101 lies outside 0\u2013100"),
    (dict(actual_start=0.0, percent_complete=-5), "percent complete -5 lies outside 0\u2013100"),
    (dict(percent_complete=40), r"percent complete needs an actual start: give the actual start \(the date work "
                                r"began\) first"),
    (dict(remaining=2.0), "remaining duration needs an actual start"),
    (dict(remaining_optimistic=1.0, remaining_most_likely=2.0, remaining_pessimistic=3.0),
     "remaining estimate needs an actual start"),
    (dict(actual_start=0.0, remaining=2.0, percent_complete=40), "give the remaining work one way only"),
    (dict(actual_start=0.0, remaining_optimistic=1.0), "needs remaining optimistic, most likely and pessimistic"),
    (dict(actual_start=0.0, remaining_optimistic=3.0, remaining_most_likely=2.0, remaining_pessimistic=4.0),
     "remaining estimates must satisfy"),
    (dict(actual_start=0.0, remaining=-1.0), "remaining duration must not be negative"),
    (dict(actual_start="Monday"), "actual start must be a number"),
])
def test_inconsistent_progress_is_refused_when_the_activity_is_made(progress, match):
    with pytest.raises(PlanError, match=match) as err:
        Activity("K2", duration=3, progress=Progress(**progress)).validated()
    assert err.value.culprit == "K2" and "activity K2" in str(err.value)


@pytest.mark.parametrize("progress, field", [
    (dict(actual_finish=2.0), "actual_finish"),
    (dict(actual_start=2.0, actual_finish=1.0), "actual_finish"),
    (dict(percent_complete=40), "percent_complete"),
    (dict(remaining=2.0), "remaining"),
    (dict(actual_start=0.0, remaining=-1.0), "remaining"),
    (dict(actual_start="Monday"), "actual_start"),
])
def test_a_refusal_names_the_field_at_fault(progress, field):
    with pytest.raises(PlanError) as err:
        Progress(**progress).validated("K5")
    assert err.value.field == field and err.value.culprit == "K5"


def test_a_late_actual_date_names_its_field():
    err = refused([Activity("K6", duration=3, progress=Progress(actual_start=0.0, actual_finish=dt.date(2030, 1, 7)))],
                  "actual finish 2030-01-07 is after the status date")
    assert err.field == "actual_finish"


def test_a_done_activity_may_say_it_is_100_percent_complete():
    act = Activity("K3", duration=3, progress=Progress(actual_start=0.0, actual_finish=3.0, percent_complete=100))
    assert act.validated() is act


def test_progress_needs_a_status_date():
    acts = [Activity("Z", duration=1), Activity("K4", duration=3, progress=Progress(actual_start=0.0))]
    err = refused(acts, "activity K4 has progress, so the plan needs a status date", status=None)
    assert err.culprit == "K4" and isinstance(err, StatusDateMissing)
    assert str(err) == "activity K4 has progress, so the plan needs a status date"    # each surface adds its way
    assert err.with_way("give one here") == "activity K4 has progress, so the plan needs a status date: give one here"


def test_an_unknown_progress_rule_is_refused():
    with pytest.raises(PlanError, match="progress rule must be"):
        Settings(start=MONDAY, progress_rule="optimism").validated()


def test_a_milestones_actual_date_reads_like_its_planned_date():
    # Go-ahead (nothing leads to it) on Monday: the morning it opens (offset 0); the
    # hand-over after A on Wednesday: the evening it happens (offset 3).
    acts = [Activity("GO", duration=0, progress=Progress(actual_start=MONDAY, actual_finish=MONDAY)),
            Activity("A", duration=3, progress=Progress(actual_start=MONDAY, actual_finish=WEDNESDAY)),
            Activity("HAND", duration=0, progress=Progress(actual_start=WEDNESDAY, actual_finish=WEDNESDAY))]
    a = analyze(plan_of(acts, [Link("GO", "A"), Link("A", "HAND")]))
    assert a.progress.actual_start.tolist() == [0, 0, 3] and a.progress.actual_finish.tolist() == [0, 3, 3]
    assert a.progress.warnings == []      # starting A the morning of the go-ahead is in sequence
