"""Moving the status date and managing baselines in the window: one undo step each,
refusals named, the compared baseline chosen."""

import datetime as dt
from pathlib import Path

import pytest

from support.ui import ui_env, window  # noqa: F401 (fixtures)
from workbench.core.montecarlo import simulate
from workbench.io.planfile import load_plan
from workbench.ui.session import Session
from workbench.ui.workspace import baselines_dialog as bd
from workbench.ui.workspace.status_dialog import StatusDateDialog, rows_to_ask
from workbench.ui.workspace.settings_dialog import to_qdate

SAMPLE = Path(__file__).resolve().parents[2] / "data" / "harbour_kiosk_progress_v3.slw"


@pytest.fixture
def session(qapp):
    return Session(load_plan(SAMPLE))


def _set(dialog, act_id, column, text):
    for r in range(dialog.table.rowCount()):
        if dialog.table.item(r, 0).text() == act_id:
            dialog.table.item(r, column).setText(text)
            return
    raise AssertionError(f"{act_id} is not asked for")


def test_the_dialog_asks_for_work_in_progress_and_work_due_to_start(session):
    ids = rows_to_ask(session.analysis, dt.date(2026, 3, 20))
    assert "SURV" not in ids and {"PERM", "STRIP"} <= set(ids)
    assert "ELEC" in ids          # planned to start before the end of 20 March


def test_moving_the_status_date_with_remaining_work_is_one_undo_step(session):
    dialog = StatusDateDialog(session)
    dialog.date.setDate(to_qdate(dt.date(2026, 3, 20)))
    _set(dialog, "STRIP", 3, "2026-03-17")          # actual finish
    _set(dialog, "PERM", 4, "1 / 2 / 4")            # remaining
    _set(dialog, "ELEC", 2, "2026-03-18")           # actual start
    _set(dialog, "ELEC", 4, "3")
    before = session.undo_stack.count()
    dialog._accept()
    plan = session.plan
    assert plan.settings.status_date == dt.date(2026, 3, 20) and session.undo_stack.count() == before + 1
    assert plan.activity("STRIP").progress.actual_finish == dt.date(2026, 3, 17)
    assert plan.activity("PERM").progress.remaining_pessimistic == 4 and plan.activity("ELEC").progress.remaining == 3
    session.undo_stack.undo()
    assert plan.settings.status_date == dt.date(2026, 3, 13) and plan.activity("ELEC").progress is None


def test_a_bad_row_is_refused_and_nothing_changes(session):
    dialog = StatusDateDialog(session)
    dialog.date.setDate(to_qdate(dt.date(2026, 3, 20)))
    _set(dialog, "ELEC", 2, "2026-03-25")           # after the new status date
    before = session.undo_stack.count()
    dialog._accept()
    words = "activity ELEC: actual start Wed 25 Mar 2026 is after the status date Fri 20 Mar 2026"
    assert words in dialog.message.text()
    assert session.undo_stack.count() == before and session.plan.settings.status_date == dt.date(2026, 3, 13)


def test_baselines_are_recorded_renamed_approved_and_deleted_as_undo_steps(session, monkeypatch):
    dialog = bd.BaselinesDialog(session)
    monkeypatch.setattr(bd.QInputDialog, "getText", lambda *a, **k: ("March update", True))
    dialog.record()
    assert [b.name for b in session.plan.baselines] == ["Board approval rev B", "March update"]
    assert dialog.table.rowCount() == 2 and dialog.table.item(0, 5).text() == bd.APPROVED_MARK
    dialog.table.selectRow(1)
    dialog.approve()
    assert bd.bl.approved(session.plan.baselines).name == "March update"
    monkeypatch.setattr(bd.QInputDialog, "getText", lambda *a, **k: ("March, week 2", True))
    dialog.rename()
    dialog.table.selectRow(0)
    dialog.delete()
    assert [(b.name, b.approved) for b in session.plan.baselines] == [("March, week 2", True)]
    for _ in range(4):
        session.undo_stack.undo()
    assert [(b.name, b.approved) for b in session.plan.baselines] == [("Board approval rev B", True)]


def test_the_compared_baseline_is_chosen_in_the_dialog(session):
    assert bd.record_current(session, "Now")
    dialog = bd.BaselinesDialog(session)
    dialog.compare.setCurrentText("Now")
    dialog._compare_chosen()
    assert session.compare_baseline == "Now" and session.variance().finish_variance == 0
    dialog.compare.setCurrentText(bd.AUTO)
    dialog._compare_chosen()
    assert session.variance().baseline.name == "Board approval rev B"


def test_a_duplicate_name_is_refused(session):
    assert not bd.record_current(session, "Board approval rev B")
    assert "exists already" in session.last_refusal


def test_the_exported_pack_becomes_the_approved_baseline(window, ui_env, tmp_path):
    from workbench.io.planfile import plan_hash
    from workbench.ui.workspace.living_menu import record_last_pack
    from workbench.ui.workspace.pack_export import export_pack

    assert not record_last_pack(window, "Too early")
    assert "no approval pack" in window.session.last_refusal
    ui_env.replies.update({"ask_save_path": str(tmp_path / "p.pdf"), "open_externally": True})
    window.session.set_simulation(simulate(window.session.plan, 300, seed=5))
    export_pack(window)
    assert "Record the Last Pack as the Baseline" in window.statusBar().currentMessage()
    assert record_last_pack(window, "Board, March")
    (base,) = window.session.plan.baselines
    assert base.approved and base.plan_hash == plan_hash(window.session.plan) == window.last_pack.hash
    assert base.simulation.seed == 5
    window.session.undo_stack.undo()
    assert window.session.plan.baselines == []


def test_the_progress_demo_opens_as_a_new_plan(window, ui_env):
    from workbench.ui.workspace.living_menu import open_progress_demo

    assert open_progress_demo(window)
    plan = window.session.plan
    assert plan.odds_trend and any(b.approved for b in plan.baselines)
    assert window.files.path is None and window.session.variance() is not None


def test_the_settings_dialog_keeps_the_progress_rule(session):
    from workbench.ui.workspace.settings_dialog import SettingsDialog

    assert session.plan.settings.progress_rule == "progress override"
    assert SettingsDialog(session.plan.settings).result_settings().progress_rule == "progress override"
