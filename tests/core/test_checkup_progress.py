"""Checkup's progress metrics (invalid dates, missed tasks, BEI, CPLI from the status date)
through the connection point in core.checkup_progress, on a model stand-in that carries
actual dates and an approved baseline (the living-schedule model is not here yet).
DCMA-EA PAM 200.1 (Oct 2012) §4, thresholds recalled [memory]; counts by hand."""

import dataclasses
import datetime as dt
from types import SimpleNamespace

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.checkup import run_checkup
from workbench.core.checkup_progress import progress_facts

START = dt.date(2027, 1, 4)          # Monday; offset 10 ends on Friday 15 January
STATUS = dt.date(2027, 1, 15)


@dataclasses.dataclass(frozen=True)
class Tracked(Activity):
    actual_start: object = None
    actual_finish: object = None


def tracked_plan(done=20, due=20, late=0, n=40, baseline_done_by=10.0):
    """n one-day activities in parallel from the start; the first ``due`` had their baseline
    finish by the status date (offset 10); ``done`` of the first ones finished (on day 1,
    or on day 11 for the ``late`` ones among them); the rest start after the status date."""
    acts = [Tracked("S", duration=0.0, actual_start=0.0, actual_finish=0.0)]
    for i in range(n):
        kw = {}
        if i < done:
            finish = 11.0 if i < late else 1.0
            kw = {"actual_start": finish - 1.0, "actual_finish": finish}
        else:
            kw = {"start_no_earlier": 12.0}
        acts.append(Tracked(f"T{i}", duration=1.0, **kw))
    acts.append(Tracked("F", duration=0.0))
    links = [Link("S", a.id) for a in acts[1:-1]] + [Link(a.id, "F") for a in acts[1:-1]]
    plan = Plan(Settings(start=START, status_date=STATUS), acts, links)
    finishes = {f"T{i}": (baseline_done_by if i < due else 20.0) for i in range(n)}
    plan.baselines = [SimpleNamespace(approved=False, finishes={}),
                      SimpleNamespace(approved=True, finishes=finishes)]
    return plan


def test_the_connection_point_reads_status_actuals_and_the_approved_baseline():
    plan = tracked_plan(done=3, due=5)
    facts = progress_facts(plan, __import__("workbench.core.calendar", fromlist=["WorkCalendar"]).WorkCalendar(plan.settings))
    assert facts.status_offset == 10.0 and facts.has_progress and facts.has_baseline
    assert int(facts.done.sum()) == 4                    # S and T0..T2
    assert facts.baseline_finish[1] == 10.0 and facts.baseline_finish[10] == 20.0


def test_bei_and_missed_tasks_counted():
    plan = tracked_plan(done=19, due=20)                 # 19 of 20 due finished: BEI 0.95 passes
    checkup = run_checkup(plan)
    assert checkup.get("bei").value == pytest.approx(0.95) and checkup.get("bei").status == "pass"
    missed = checkup.get("missed_activities")
    assert missed.offenders == ["T19"] and missed.value == pytest.approx(5.0) and missed.status == "pass"
    worse = run_checkup(tracked_plan(done=18, due=20))
    assert worse.get("bei").status == "fail" and worse.get("missed_activities").status == "fail"


def test_a_late_finish_is_missed_and_an_actual_after_the_status_date_is_invalid():
    checkup = run_checkup(tracked_plan(done=20, due=20, late=1))      # T0 finished on day 11
    assert checkup.get("missed_activities").offenders == ["T0"]
    assert checkup.get("invalid_dates").offenders == ["T0"] and checkup.get("invalid_dates").status == "fail"


def test_forecast_before_the_status_date_is_invalid():
    plan = tracked_plan(done=20, due=20)
    plan.replace_activity("T30", plan.activity("T30").with_(start_no_earlier=None))   # forecast day 0
    assert run_checkup(plan).get("invalid_dates").offenders == ["T30"]


def test_without_an_approved_baseline_the_baseline_metrics_say_so():
    plan = tracked_plan()
    plan.baselines = [SimpleNamespace(approved=False, finishes={})]
    checkup = run_checkup(plan)
    assert checkup.get("invalid_dates").status == "pass"          # needs only progress
    for cid in ("missed_activities", "bei"):
        assert checkup.get(cid).status == "n/a" and "approved baseline" in checkup.get(cid).note
