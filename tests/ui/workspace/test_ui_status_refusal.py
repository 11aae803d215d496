"""Refused progress is told where the planner typed it: inside the status-date dialog (a
message line, the cell marked and focused, the typing kept), and in words that fit the
surface — the window names its column and its menu, the command line its option."""

import dataclasses
import datetime as dt
import shutil
from pathlib import Path

import pytest
from PySide6.QtCore import Qt
from PySide6.QtWidgets import QDialog, QDialogButtonBox, QLabel

from support.ui import ui_env, window  # noqa: F401 (fixtures)
from workbench.cli import main
from workbench.core.date_text import show_date
from workbench.io.planfile import load_plan, save_plan
from workbench.ui.activities import columns as C
from workbench.ui.workspace.settings_dialog import to_qdate
from workbench.ui.workspace.status_dialog import MARK, StatusDateDialog, dates_as_shown

SAMPLE = Path(__file__).resolve().parents[2] / "data" / "harbour_kiosk_progress_v3.slw"
START, FINISH, REMAINING = 2, 3, 4          # the dialog's columns
PC_WINDOW = "activity FIT: % done needs an actual start: give the actual start (the date work began) first"
PC_FILE = "activity FIT: percent complete needs an actual start: give the actual start (the date work began) first"
NO_STATUS = "activity SURV has progress, so the plan needs a status date"


@pytest.fixture
def kiosk_window(window):
    window.session.load(load_plan(SAMPLE))
    return window


def open_dialog(qtbot, win, day=dt.date(2026, 3, 20)):
    dialog = StatusDateDialog(win.session, win)
    qtbot.addWidget(dialog)
    dialog.date.setDate(to_qdate(day))
    dialog.show()
    qtbot.waitExposed(dialog)
    return dialog


def row(dialog, act_id):
    return next(r for r in range(dialog.table.rowCount()) if dialog.table.item(r, 0).text() == act_id)


def type_in(dialog, act_id, column, text):
    dialog.table.item(row(dialog, act_id), column).setText(text)


def text_at(dialog, act_id, column):
    return dialog.table.item(row(dialog, act_id), column).text()


def press_ok(qtbot, dialog):
    ok = dialog.findChild(QDialogButtonBox).button(QDialogButtonBox.StandardButton.Ok)
    qtbot.mouseClick(ok, Qt.MouseButton.LeftButton)


def marked(dialog):
    """(row, column) of every cell tinted as at fault."""
    t = dialog.table
    return [(r, c) for r in range(t.rowCount()) for c in range(t.columnCount())
            if t.item(r, c).background().color() == MARK]


def test_a_finish_before_the_start_is_told_in_the_dialog_and_corrected_there(qtbot, kiosk_window):
    session, plan = kiosk_window.session, kiosk_window.session.plan
    dialog = open_dialog(qtbot, kiosk_window)
    type_in(dialog, "ELEC", START, "2026-03-18")
    type_in(dialog, "ELEC", FINISH, "16 Mar 2026")       # before the start, typed as the window shows dates
    type_in(dialog, "PERM", REMAINING, "1 / 2 / 4")
    before = session.undo_stack.count()
    press_ok(qtbot, dialog)
    assert dialog.isVisible() and dialog.message.isVisible()
    # the dates as the dialog's cells show them
    assert ("activity ELEC: actual finish Mon 16 Mar 2026 is before its actual start Wed 18 Mar 2026"
            in dialog.message.text())
    assert marked(dialog) == [(row(dialog, "ELEC"), FINISH)]
    cell = dialog.table.item(row(dialog, "ELEC"), FINISH)
    assert cell.font().bold() and "actual finish" in cell.toolTip()
    assert (dialog.table.currentRow(), dialog.table.currentColumn()) == (row(dialog, "ELEC"), FINISH)
    assert dialog.focusWidget() is dialog.table
    # nothing changed, nothing said behind the dialog, the typing is all still there
    assert session.undo_stack.count() == before and plan.settings.status_date == dt.date(2026, 3, 13)
    assert session.last_refusal is None and kiosk_window.notice.text() == ""
    assert (text_at(dialog, "ELEC", START), text_at(dialog, "ELEC", FINISH),
            text_at(dialog, "PERM", REMAINING)) == ("2026-03-18", "16 Mar 2026", "1 / 2 / 4")

    type_in(dialog, "ELEC", FINISH, "2026-03-19")             # typing there takes the mark away
    assert marked(dialog) == [] and not dialog.message.isVisible()
    press_ok(qtbot, dialog)
    assert dialog.result() == QDialog.DialogCode.Accepted and not dialog.isVisible()
    assert session.undo_stack.count() == before + 1
    assert plan.activity("ELEC").progress.actual_finish == dt.date(2026, 3, 19)
    assert plan.activity("PERM").progress.remaining_pessimistic == 4
    session.undo_stack.undo()                                 # one step takes all of it back
    assert plan.settings.status_date == dt.date(2026, 3, 13) and plan.activity("ELEC").progress is None
    assert plan.activity("PERM").progress.remaining_pessimistic == 9


def test_a_date_after_the_new_status_date_marks_the_actual_start(qtbot, kiosk_window):
    dialog = open_dialog(qtbot, kiosk_window)
    type_in(dialog, "ELEC", START, "2026-03-25")
    press_ok(qtbot, dialog)
    words = "activity ELEC: actual start Wed 25 Mar 2026 is after the status date Fri 20 Mar 2026"
    assert words in dialog.message.text()
    assert marked(dialog) == [(row(dialog, "ELEC"), START)]
    assert kiosk_window.session.plan.settings.status_date == dt.date(2026, 3, 13)
    type_in(dialog, "ELEC", START, "2026-03-19")              # put right: the mark and the message go
    press_ok(qtbot, dialog)
    assert dialog.result() == QDialog.DialogCode.Accepted
    assert kiosk_window.session.plan.activity("ELEC").progress.actual_start == dt.date(2026, 3, 19)


def test_text_in_the_remaining_cell_is_marked_there(qtbot, kiosk_window):
    dialog = open_dialog(qtbot, kiosk_window)
    type_in(dialog, "PERM", REMAINING, "two weeks")
    press_ok(qtbot, dialog)
    assert "activity PERM: remaining" in dialog.message.text()
    assert marked(dialog) == [(row(dialog, "PERM"), REMAINING)]


def test_moving_the_date_keeps_what_was_typed(qtbot, kiosk_window):
    dialog = open_dialog(qtbot, kiosk_window)
    type_in(dialog, "ELEC", START, "2026-03-25")
    press_ok(qtbot, dialog)
    dialog.date.setDate(to_qdate(dt.date(2026, 3, 27)))      # the other way to put it right
    assert text_at(dialog, "ELEC", START) == "2026-03-25" and not dialog.message.isVisible()
    assert marked(dialog) == []
    dialog.date.setDate(to_qdate(dt.date(2026, 3, 16)))      # ELEC no longer due, but it was typed into
    assert text_at(dialog, "ELEC", START) == "2026-03-25"


def test_the_status_date_was_is_shown_as_the_window_shows_dates(qtbot, kiosk_window):
    dialog = open_dialog(qtbot, kiosk_window)
    labels = [w.text() for w in dialog.findChildren(QLabel)]
    assert show_date(dt.date(2026, 3, 13)) in labels and "2026-03-13" not in labels


def test_only_real_dates_in_a_message_are_rewritten():
    assert dates_as_shown("finish 2026-03-16, not 2026-02-30 nor 12026-03-16") == \
        "finish Mon 16 Mar 2026, not 2026-02-30 nor 12026-03-16"


# --- the words: % done without an actual start -------------------------------------------
def test_percent_done_without_an_actual_start_says_what_to_do_in_the_window(kiosk_window):
    model = kiosk_window.activities.model
    before = kiosk_window.session.plan.activity("FIT")
    index = model.index(kiosk_window.session.plan.row_of("FIT"), C.INDEX["percent_complete"])
    assert not model.setData(index, "30")
    assert kiosk_window.session.last_refusal == PC_WINDOW
    assert kiosk_window.notice.text() == f"Not applied: {PC_WINDOW}"
    assert kiosk_window.session.plan.activity("FIT") == before


def test_percent_complete_without_an_actual_start_in_a_table_file_names_the_file_field(tmp_path, capsys):
    table = tmp_path / "kiosk.csv"
    table.write_text("id,name,duration,actual start,percent complete\n"
                     "SURV,Survey the site,3,2026-03-02,\nFIT,Fit counters,6,,30\n", encoding="utf-8")
    code = main(["import", str(table), "-o", str(tmp_path / "k.slw"), "--start", "2026-03-02",
                 "--status-date", "2026-03-13"])
    err = capsys.readouterr().err
    assert code == 2 and f"row 3, {PC_FILE}" in err and "% done" not in err
    assert not (tmp_path / "k.slw").exists()


# --- the words: a missing status date --------------------------------------------------------
def test_a_missing_status_date_names_the_windows_own_controls(window):
    model = window.activities.model
    index = model.index(window.session.plan.row_of("R"), C.INDEX["actual_start"])
    assert not model.setData(index, "2026-03-03")
    expected = ("activity R has progress, so the plan needs a status date: set one with "
                "Progress \u2192 Move the Status Date\u2026 (or File \u2192 Plan Settings\u2026)")
    assert window.session.last_refusal == expected and "--status-date" not in window.notice.text()
    assert window.session.plan.activity("R").progress is None


@pytest.fixture
def no_status(tmp_path):
    plan = load_plan(SAMPLE)
    plan.settings = dataclasses.replace(plan.settings, status_date=None)
    path = tmp_path / "no_status.slw"
    save_plan(plan, path)
    return path


@pytest.mark.parametrize("verb, way", [
    ("analyze", "give one with --status-date YYYY-MM-DD"),
    ("simulate", "give one with --status-date YYYY-MM-DD"),
    ("check", "this verb reads it from the plan: set one in the window (Progress \u2192 Move the Status Date\u2026) "
              "and save, or give the plan file's settings a status_date"),
])
def test_a_missing_status_date_names_the_command_lines_option_where_the_verb_has_it(capsys, no_status, verb, way):
    code = main([verb, str(no_status)])
    err = capsys.readouterr().err
    assert code == 2 and err.strip() == f"slackline: error: {NO_STATUS}: {way}"


def test_the_option_then_puts_it_right(capsys, no_status, tmp_path):
    copy = tmp_path / "copy.slw"
    shutil.copy(no_status, copy)
    assert main(["analyze", str(copy), "--status-date", "2026-03-13"]) == 0
    capsys.readouterr()
