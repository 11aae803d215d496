"""The main window: menus, title, files, settings, layout, drops, locks."""

import datetime as dt
import pytest
from PySide6.QtCore import QMimeData, QPointF, Qt, QUrl
from PySide6.QtGui import QDropEvent
from PySide6.QtWidgets import QLabel

from support.ui import plan_state, sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity, settings_with
from workbench.io.planfile import load_plan, save_plan

SKIP = {"quit", "close"}


def test_every_menu_action_triggers(window, ui_env, tmp_path):
    ui_env.replies.update({
        "ask_open_path": None, "ask_save_path": None, "edit_settings": None, "pick_predecessors": None,
        "show_info": None, "show_error": None, "show_guide": None, "ask_unsaved": "cancel",
        "move_status_date": None, "manage_baselines": None,
        "ask_printer": None,
    })
    window.session.push(EditActivity("R", name="Survey"))
    window.session.select(["D"])
    triggered = 0
    for name, action in window.menu_actions.items():
        if name not in SKIP and action.isEnabled():
            action.trigger()
            triggered += 1
    assert triggered >= 20
    present = getattr(window, "_present_window", None)
    if present is not None:  # Present mode opened full screen; leave it again
        present.close()
    # the unsaved question came up for New Plan (answered Cancel: still the same plan)
    assert ui_env.names()[0] == "ask_unsaved"
    assert "R" in window.session.plan


def test_undo_redo_shortcuts_are_standard(window):
    from PySide6.QtGui import QKeySequence
    assert window.menu_actions["undo"].shortcut() == QKeySequence(QKeySequence.StandardKey.Undo)
    assert window.menu_actions["redo"].shortcut() == QKeySequence(QKeySequence.StandardKey.Redo)
    assert window.menu_actions["save"].shortcut() == QKeySequence(QKeySequence.StandardKey.Save)


def test_title_shows_modified_state_and_save_cleans_it(window, ui_env, tmp_path):
    target = tmp_path / "refit.slw"
    ui_env.replies["ask_save_path"] = str(target)
    assert "[*]" in window.windowTitle() and not window.isWindowModified()
    window.session.push(EditActivity("R", name="Survey"))
    assert window.isWindowModified()
    assert window.save_label.text() == "Not saved to a file yet"
    assert window.files.save()
    assert not window.isWindowModified()
    assert window.windowTitle().startswith("refit.slw[*]")
    assert window.save_label.text() == "All changes saved"
    window.session.undo_stack.undo()
    assert window.isWindowModified()


def test_save_and_open_round_trip(window, ui_env, tmp_path, qtbot):
    target = tmp_path / "round.slw"
    ui_env.replies["ask_save_path"] = str(target)
    window.session.push(EditActivity("F", notes="check the lifts", finish_no_later=dt.date(2026, 4, 24)))
    assert window.files.save_as()
    saved = plan_state(window.session.plan)
    assert plan_state(load_plan(target)) == saved
    window.session.push(EditActivity("F", notes="changed"))
    ui_env.replies["ask_unsaved"] = "discard"
    ui_env.replies["ask_open_path"] = str(target)
    assert window.files.open_dialog()
    assert plan_state(window.session.plan) == saved
    assert window.session.undo_stack.count() == 0 and not window.isWindowModified()
    assert window.files.recent_files()[0] == str(target.resolve())


def test_unsaved_prompt_cancel_keeps_window_open(window, ui_env):
    window.show()
    window.session.push(EditActivity("R", name="Survey"))
    ui_env.replies["ask_unsaved"] = "cancel"
    assert not window.close()
    assert window.isVisible()
    assert ui_env.names().count("ask_unsaved") == 1


def test_settings_dialog_change_is_one_undo_step(window, ui_env):
    old = window.session.plan.settings
    new = settings_with(old, title="Office refit, phase 2", unit="weeks",
                        deadline=dt.date(2026, 9, 30), target_confidence=0.8)
    ui_env.replies["edit_settings"] = new
    before_finish = window.summary.texts()["target"]
    window.menu_actions["settings"].trigger()
    assert window.session.plan.settings.title == "Office refit, phase 2"
    assert window.session.undo_stack.count() == 1
    assert window.summary.texts()["target_caption"].startswith("P80")
    assert window.summary.texts()["target"] != before_finish
    window.session.undo_stack.undo()
    assert window.session.plan.settings == old


def test_settings_dialog_reads_back_its_fields(window, qtbot):
    from workbench.ui.workspace.settings_dialog import SettingsDialog
    s = settings_with(window.session.plan.settings, deadline=40.0, revision="B")
    dialog = SettingsDialog(s)
    qtbot.addWidget(dialog)
    dialog.title.setText("Renamed")
    dialog.weekdays[5].setChecked(True)
    dialog.holidays.add_dates([dt.date(2026, 4, 3), dt.date(2026, 4, 6)])
    dialog.confidence.setValue(85)
    dialog.sign_off.insertRow(0)
    from PySide6.QtWidgets import QTableWidgetItem
    dialog.sign_off.setItem(0, 0, QTableWidgetItem("A. Planner"))
    dialog.sign_off.setItem(0, 1, QTableWidgetItem("Sponsor"))
    out = dialog.result_settings()
    assert out.title == "Renamed" and out.calendar.workdays == (0, 1, 2, 3, 4, 5)
    assert out.calendar.holidays == (dt.date(2026, 4, 3), dt.date(2026, 4, 6))
    assert out.deadline == 40.0  # an offset deadline left alone stays an offset
    assert out.target_confidence == pytest.approx(0.85) and out.revision == "B"
    assert [(p.name, p.role) for p in out.sign_off] == [("A. Planner", "Sponsor")]
    assert out.status_date is None and not dialog.status.isEnabled()


def test_the_status_date_is_set_and_cleared_in_the_settings_and_drawn(window, ui_env, qtbot, tmp_path):
    """The status date (progress as of) is set in Plan settings as one undo step; it draws
    the Timeline's status line and reaches the pack's cover; undo clears both."""
    from pypdf import PdfReader
    from workbench.reports.pack import build_pack
    from workbench.ui.workspace.settings_dialog import SettingsDialog, to_qdate
    dialog = SettingsDialog(window.session.plan.settings)
    qtbot.addWidget(dialog)
    dialog.has_status.setChecked(True)
    assert dialog.status.isEnabled()
    dialog.status.setDate(to_qdate(dt.date(2026, 3, 20)))
    ui_env.replies["edit_settings"] = dialog.result_settings()
    window.menu_actions["settings"].trigger()
    assert window.session.plan.settings.status_date == dt.date(2026, 3, 20)
    window.show()
    qtbot.waitExposed(window)
    timeline = window.view("Timeline")
    qtbot.waitUntil(lambda: timeline.geometry is not None)
    assert "status" in timeline.geometry.lines and "status" in timeline.reference.lines
    build_pack(window.session.plan, tmp_path / "p.pdf", iterations=0)
    assert "Fri 20 Mar 2026" in PdfReader(str(tmp_path / "p.pdf")).pages[0].extract_text()
    window.session.undo_stack.undo()
    assert window.session.plan.settings.status_date is None
    assert "status" not in timeline.geometry.lines


def test_region_holidays_are_added_as_dates(window, qtbot):
    from workbench.ui.workspace.settings_dialog import SettingsDialog
    dialog = SettingsDialog(window.session.plan.settings)
    qtbot.addWidget(dialog)
    dialog.holidays.region_edit.setText("DE")
    dialog.holidays.first.setValue(2026)
    dialog.holidays.last.setValue(2026)
    dialog.holidays.add_region()
    days = dialog.result_settings().calendar.holidays
    assert dt.date(2026, 12, 25) in days and dt.date(2026, 10, 3) in days  # holidays package, DE
    assert all(isinstance(d, dt.date) for d in days)


def test_predecessor_picker_builds_links(window, qtbot):
    from workbench.ui.activities.predecessor_dialog import PredecessorDialog
    dialog = PredecessorDialog(window.session.plan, "F")
    qtbot.addWidget(dialog)
    assert {(l.pred, l.type, l.lag) for l in dialog.links()} == {("W", "SS", 2.0), ("P", "FS", 0.0)}
    dialog.set_checked("P", False)
    dialog.set_checked("D", True, "FF", -1.0)
    assert {(l.pred, l.type, l.lag) for l in dialog.links()} == {("W", "SS", 2.0), ("D", "FF", -1.0)}


def test_views_are_real_or_say_what_will_come(window):
    for title, widget in window.views.items():
        if isinstance(widget, QLabel):
            assert title in widget.text() and "will appear here" in widget.text()
        else:
            assert type(widget).__name__ == f"{title.replace('-', '')}View"


def test_dock_layout_and_geometry_persist(ui_env, qtbot):
    from workbench.ui.workspace.window import MainWindow
    from workbench.ui.session import Session
    first = MainWindow(Session(sample_plan()))
    first.show()
    first.resize(1300, 820)
    qtbot.wait(20)
    first.docks["Network"].hide()
    first.docks["Odds"].setFloating(True)
    first.save_layout()
    first.files.close()
    first.hide()
    second = MainWindow(Session(sample_plan()))
    second.show()
    qtbot.wait(20)
    assert second.docks["Network"].isHidden()
    assert second.docks["Odds"].isFloating()
    from PySide6.QtCore import QSettings
    geometry = QSettings().value("window/geometry")
    assert geometry is not None and second.restoreGeometry(geometry)  # (offscreen clamps sizes to its screen)
    second.reset_layout()
    assert not second.docks["Network"].isHidden() and not second.docks["Odds"].isFloating()
    for w in (first, second):
        w.files.close()
        w.deleteLater()


def test_dropping_a_plan_file_opens_it(window, ui_env, tmp_path):
    other = sample_plan()
    other.set_settings(settings_with(other.settings, title="Dropped"))
    path = tmp_path / "dropped.slw"
    save_plan(other, path)
    mime = QMimeData()
    mime.setUrls([QUrl.fromLocalFile(str(path))])
    event = QDropEvent(QPointF(10, 10), Qt.DropAction.CopyAction, mime, Qt.MouseButton.NoButton,
                       Qt.KeyboardModifier.NoModifier)
    window.dropEvent(event)
    assert window.session.plan.settings.title == "Dropped"
    assert window.files.path == str(path.resolve())


def test_plan_held_by_another_window_opens_read_only(window, ui_env, tmp_path):
    from workbench.ui.workspace.lock import PlanLock
    path = tmp_path / "shared.slw"
    save_plan(sample_plan(), path)
    holder = PlanLock(str(path.resolve()))
    assert holder.acquire() and holder.held
    ui_env.replies["ask_locked"] = "readonly"
    assert window.files.open_path(str(path))
    assert window.files.read_only and "(read-only)" in window.windowTitle()
    assert ui_env.names() == ["ask_locked"]
    holder.release()


def test_read_only_location_offers_save_as(window, ui_env, tmp_path, monkeypatch):
    import workbench.io.planfile as planfile
    locked, good = tmp_path / "locked" / "plan.slw", tmp_path / "elsewhere.slw"
    real_save = planfile.save_plan

    def save(plan, path, *args, **kwargs):  # what the OS says for a read-only folder
        if str(path).startswith(str(locked.parent)):
            raise PermissionError(13, "Permission denied", str(path))
        return real_save(plan, path, *args, **kwargs)

    monkeypatch.setattr(planfile, "save_plan", save)
    seen = []
    ui_env.replies["ask_save_as_instead"] = lambda parent, msg: seen.append(msg) or True
    paths = iter([str(locked), str(good)])
    ui_env.replies["ask_save_path"] = lambda *a, **k: next(paths)
    window.session.push(EditActivity("R", name="Survey"))
    assert window.files.save()
    assert "read-only or locked" in seen[0] and str(locked) in seen[0]
    assert window.files.path == str(good.resolve()) and good.exists()
    assert not window.isWindowModified()


def test_import_preview_with_planted_errors_changes_nothing(window, ui_env, tmp_path):
    table = tmp_path / "bad.csv"
    table.write_text("id,name,optimistic,most likely,pessimistic,predecessors\n"
                     "A,Dig,2,3,4,\nB,Pour,5,3,9,A\nC,Cure,1,x,3,B\nD,Paint,1,2,3,ZZ\n", encoding="utf-8")
    before = plan_state(window.session.plan)
    shown = {}
    ui_env.replies["preview_import"] = lambda parent, path, plan, problems, kept="": shown.update(plan=plan, problems=problems) or True
    assert not window.files.open_path(str(table))
    assert plan_state(window.session.plan) == before and window.session.undo_stack.count() == 0
    problems = " | ".join(shown["problems"])
    assert shown["plan"] is None and len(shown["problems"]) == 3
    for row in ("row 3", "row 4", "row 5"):
        assert row in problems
    assert "ZZ" in problems


def test_good_import_is_one_undo_step(window, ui_env, tmp_path):
    table = tmp_path / "good.csv"
    table.write_text("id,name,duration,predecessors\nA,Dig,2,\nB,Pour,3,A\n", encoding="utf-8")
    before = plan_state(window.session.plan)
    ui_env.replies["preview_import"] = "keep"
    assert window.files.open_path(str(table))
    assert window.session.plan.ids() == ["A", "B"]
    assert window.session.plan.settings.title == "Office refit"
    window.session.undo_stack.undo()
    assert plan_state(window.session.plan) == before


def test_export_writes_a_table(window, ui_env, tmp_path):
    out = tmp_path / "out.csv"
    ui_env.replies["ask_save_path"] = str(out)
    window.menu_actions["export"].trigger()
    text = out.read_text(encoding="utf-8-sig")
    assert "Survey rooms" in text and "Move in" in text


def test_controls_have_accessible_names(window):
    from PySide6.QtWidgets import QComboBox, QLineEdit
    panel = window.activities
    for widget in (panel.search, panel.group_box, panel.critical_box, panel.table, window.summary):
        assert widget.accessibleName()
    unnamed = [w for cls in (QLineEdit, QComboBox) for w in panel.findChildren(cls)
               if not w.accessibleName() and w.parent() is panel]
    assert unnamed == []


def test_recent_files_menu_lists_and_opens(window, ui_env, tmp_path):
    from workbench.ui.workspace.menus import fill_recent
    paths = []
    for name in ("one.slw", "two.slw"):
        plan = sample_plan()
        plan.set_settings(settings_with(plan.settings, title=name))
        save_plan(plan, tmp_path / name)
        assert window.files.open_path(str(tmp_path / name))
        paths.append(str((tmp_path / name).resolve()))
    fill_recent(window, window.recent_menu)
    entries = [a for a in window.recent_menu.actions() if a.toolTip() in paths]
    assert [a.text() for a in entries] == ["two.slw", "one.slw"]
    entries[1].trigger()
    assert window.session.plan.settings.title == "one.slw"


def test_predecessor_picker_editors_and_exact_lags(window, qtbot):
    from PySide6.QtWidgets import QStyleOptionViewItem
    from workbench.core.commands import SetPredecessors
    from workbench.core.model import Link
    from workbench.ui.activities.predecessor_dialog import PredecessorDialog
    window.session.push(SetPredecessors("F", [Link("W", "F", "SS", 1 / 3)]))
    dialog = PredecessorDialog(window.session.plan, "F")
    qtbot.addWidget(dialog)
    assert [(l.pred, l.type, l.lag) for l in dialog.links()] == [("W", "SS", 1 / 3)]  # untouched: exact
    row = [a.id for a in dialog.candidates].index("D")
    dialog.table.item(row, 0).setCheckState(Qt.CheckState.Checked)
    for col, set_value in ((2, lambda e: e.setCurrentIndex(2)), (3, lambda e: e.setValue(-1.5))):
        index = dialog.table.model().index(row, col)
        delegate = dialog.table.itemDelegateForColumn(col)
        editor = delegate.createEditor(dialog.table, QStyleOptionViewItem(), index)
        delegate.setEditorData(editor, index)
        set_value(editor)
        delegate.setModelData(editor, dialog.table.model(), index)
    assert ("D", "FF", -1.5) in [(l.pred, l.type, l.lag) for l in dialog.links()]
