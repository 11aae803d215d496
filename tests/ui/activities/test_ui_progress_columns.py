"""The Activities table's progress columns (editable, one undo step each, refusals named)
and the baseline columns (shown while a baseline is compared)."""

from pathlib import Path

import pytest

from workbench.io.planfile import load_plan
from workbench.ui.activities import columns as C
from workbench.ui.activities.table_model import ActivityTableModel
from workbench.ui.session import Session

SAMPLE = Path(__file__).resolve().parents[2] / "data" / "harbour_kiosk_progress_v3.slw"


@pytest.fixture
def model(qapp):
    return ActivityTableModel(Session(load_plan(SAMPLE)))


def cell(model, act_id, key):
    return model.index(model.plan.row_of(act_id), C.INDEX[key])


def test_the_model_passes_qts_checks_with_the_new_columns(qtmodeltester, model):
    qtmodeltester.check(model)


def test_progress_and_state_are_shown(model):
    assert cell(model, "SURV", "state").data() == "done"
    assert cell(model, "SURV", "actual_finish").data() == "Wed 4 Mar 2026"      # the one date format
    assert cell(model, "PERM", "remaining").data() == "3 / 5 / 9"
    assert cell(model, "STRIP", "percent_complete").data() == "50"
    assert cell(model, "FIT", "state").data() == "not started" and cell(model, "FIT", "actual_start").data() == ""


def test_each_progress_edit_is_one_undo_step(model):
    session, plan = model.session, model.plan
    before = session.undo_stack.count()
    assert model.setData(cell(model, "PERM", "remaining"), "2/3/6")
    assert plan.activity("PERM").progress.remaining_pessimistic == 6
    assert model.setData(cell(model, "PERM", "percent_complete"), "80%")
    p = plan.activity("PERM").progress
    assert p.percent_complete == 80 and p.remaining_optimistic is None      # one way of giving what remains
    assert model.setData(cell(model, "ELEC", "actual_start"), "2026-03-12")
    assert cell(model, "ELEC", "state").data() == "in progress"
    assert session.undo_stack.count() == before + 3
    session.undo_stack.undo()
    assert plan.activity("ELEC").progress is None and cell(model, "ELEC", "state").data() == "not started"


@pytest.mark.parametrize("key, text, words", [
    ("actual_start", "2026-03-20", "activity FIT: actual start 2026-03-20 is after the status date 2026-03-13"),
    ("percent_complete", "140", "activity STRIP: % done 140 lies outside 0\u2013100"),    # named as the column
    ("remaining", "1 2", "remaining: write one number, or three"),
    ("actual_finish", "2026-03-11", "activity OPEN: an actual finish needs an actual start"),
])
def test_bad_progress_is_refused_naming_the_activity(model, key, text, words):
    act = {"actual_start": "FIT", "percent_complete": "STRIP", "remaining": "PERM", "actual_finish": "OPEN"}[key]
    before = model.plan.activity(act)
    assert not model.setData(cell(model, act, key), text)
    assert words in model.session.last_refusal and model.plan.activity(act) == before


def test_baseline_columns_follow_the_compared_baseline(model):
    assert cell(model, "OPEN", "baseline_finish").data() == "Thu 19 Mar 2026"     # the one date format
    assert cell(model, "OPEN", "finish_variance").data() == "3"
    model.session.compare_with("nonexistent")          # falls back to the approved one
    assert cell(model, "OPEN", "finish_variance").data() == "3"
    model.plan.baselines = []
    model.session.recalculate()
    assert cell(model, "OPEN", "finish_variance").data() == "" and model.session.variance() is None
