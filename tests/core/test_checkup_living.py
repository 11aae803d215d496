"""Checkup reads the living-schedule model: actual dates under Activity.progress and the
approved Baseline's finishes (the connection point in core.checkup_progress)."""

import numpy as np

from workbench.core.checkup import run_checkup
from workbench.core.checkup_progress import progress_facts
from workbench.core.calendar import WorkCalendar
from workbench.io.planfile import load_plan
from workbench.resources import demo_update_path


def test_progress_facts_come_from_the_progress_records_and_the_approved_baseline():
    plan = load_plan(demo_update_path())
    cal = WorkCalendar(plan.settings)
    facts = progress_facts(plan, cal)
    assert facts.has_progress and facts.has_baseline
    i = plan.row_of("A2")                     # done 10 March - 16 April 2027
    assert facts.actual_start[i] == cal.offset_before(plan.activity("A2").progress.actual_start)
    assert facts.actual_finish[i] == cal.offset_through(plan.activity("A2").progress.actual_finish)
    assert np.isnan(facts.baseline_finish[plan.row_of("B2A")])     # added after the approval
    base = plan.baselines[0].activity("O3")
    assert facts.baseline_finish[plan.row_of("O3")] == cal.offset_through(base.finish)


def test_the_progress_checks_are_graded_for_the_progress_demo():
    checkup = run_checkup(load_plan(demo_update_path()))
    for cid in ("invalid_dates", "missed_activities", "bei"):
        assert checkup.get(cid).status != "n/a", cid
