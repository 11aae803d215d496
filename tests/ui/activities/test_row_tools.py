"""Ctrl+C copies table rows as tab-separated text; right-click menus on rows and headings;
hidden columns are remembered."""

from PySide6.QtCore import QItemSelectionModel, Qt
from PySide6.QtGui import QGuiApplication

from workbench.ui.activities import row_tools


def select_rows(panel, rows):
    sel = panel.table.selectionModel()
    sel.clearSelection()
    for r in rows:
        sel.select(panel.proxy.index(r, 0), QItemSelectionModel.SelectionFlag.Select
                   | QItemSelectionModel.SelectionFlag.Rows)


def test_ctrl_c_copies_rows_tab_separated(window, qtbot):
    panel = window.activities
    window.show()
    select_rows(panel, [1, 2])
    panel.table.setFocus()
    qtbot.waitUntil(panel.table.hasFocus)
    qtbot.keyClick(panel.table, Qt.Key.Key_C, Qt.KeyboardModifier.ControlModifier)
    lines = QGuiApplication.clipboard().text().splitlines()
    assert len(lines) == 3
    heading, first = lines[0].split("\t"), lines[1].split("\t")
    assert heading[:2] == ["ID", "Name"] and len(first) == len(heading)
    assert first[:2] == ["R", "Survey rooms"]
    assert lines[2].split("\t")[0] == "D"


def test_row_menu_selects_successors(window):
    panel = window.activities
    select_rows(panel, [1])                      # R → D
    menu = row_tools.row_menu(panel, panel.table.visualRect(panel.proxy.index(1, 1)).center())
    texts = [a.text() for a in menu.actions() if a.text()]
    for wanted in ("Edit Cell", "&Insert Activity", "&Delete Activities", "&Copy Rows",
                   "Select Predecessors", "Select Successors", "Pick P&redecessors…"):
        assert wanted in texts
    next(a for a in menu.actions() if a.text() == "Select Successors").trigger()
    assert window.session.selected() == ["D"]
    next(a for a in menu.actions() if a.text() == "Select Predecessors").trigger()
    assert window.session.selected() == ["R"]


def test_hidden_columns_are_remembered(window, ui_env):
    from support.ui import sample_plan
    from workbench.ui.activities.panel import ActivitiesPanel
    from workbench.ui.session import Session
    panel = window.activities
    notes = panel.column_keys.index("notes")
    menu = row_tools.column_menu(panel)
    action = [a for a in menu.actions() if a.text() == "Notes"][0]
    action.setChecked(False)
    assert panel.table.isColumnHidden(notes)
    again = ActivitiesPanel(Session(sample_plan()))
    assert again.table.isColumnHidden(notes)
    select_rows(again, [0])
    assert "Notes" not in row_tools.rows_as_text(again, [0]).splitlines()[0].split("\t")
    again.deleteLater()


def test_row_menu_adds_a_linked_predecessor(window):
    from workbench.core.model import Link
    panel = window.activities
    select_rows(panel, [2])                      # D (Draw layout)
    menu = row_tools.row_menu(panel, panel.table.visualRect(panel.proxy.index(2, 1)).center())
    next(a for a in menu.actions() if a.text() == "Add Predecessor").trigger()
    plan = window.session.plan
    new = window.session.selected()[0]
    assert new not in ("R", "D") and Link(new, "D") in plan.links
    assert plan.ids().index(new) == plan.ids().index("D") - 1      # placed just before D
