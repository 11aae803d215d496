"""Right-click on a Timeline bar or a Network box: the activity's menu, whose actions
change the plan (one undo step) or move the selection like the table's row menu."""

import datetime as dt

import pytest
from PySide6.QtCore import QPoint, QPointF, QRectF, Qt
from PySide6.QtTest import QTest

from workbench.core.model import Link
from support.timeline import bar_of


@pytest.fixture
def shown(window, qtbot):
    window.show()
    qtbot.waitExposed(window)
    return window


def timeline(window, qtbot):
    window.docks["Timeline"].raise_()
    view = window.view("Timeline")
    qtbot.waitUntil(lambda: view.geometry is not None and view.isVisible())
    view.fit_all()
    qtbot.wait(20)
    return view


def network(window, qtbot):
    window.docks["Network"].raise_()
    view = window.view("Network")
    qtbot.waitUntil(lambda: view.layout_result is not None and view.isVisible())
    return view


def bar_point(view, act_id) -> QPoint:
    _, row, x0, x1 = bar_of(view, act_id)
    p = view.item.deviceTransform_().map(QPointF(x0 * 0.7 + x1 * 0.3, row))
    return QPoint(round(p.x()), round(p.y()))


def box_point(view, act_id) -> QPoint:
    x, y, w, h = view.layout_result.boxes[view.layout_result.index_of(act_id)]
    view.viewbox.setRange(QRectF(x - w, y - h, 3 * w, 3 * h), padding=0)
    scene = view.viewbox.mapViewToScene(QPointF(x + w / 2, y + h / 2))
    return view.graphics.mapFromScene(scene)


def right_click(widget, point: QPoint):
    QTest.mouseClick(widget, Qt.MouseButton.RightButton, Qt.KeyboardModifier.NoModifier, point)


def action(window, text: str):
    menu = window.activity_menu
    found = [a for a in menu.actions() if a.text() == text]
    assert found, f"no {text!r} in {[a.text() for a in menu.actions()]}"
    return found[0]


def close_menu(window):
    window.activity_menu.close()


def test_right_click_on_a_bar_selects_it_and_adds_a_successor(shown, qtbot):
    view = timeline(shown, qtbot)
    right_click(view.plot.viewport(), bar_point(view, "D"))
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    assert shown.session.selected() == ["D"]                     # the clicked bar is selected
    texts = [a.text() for a in shown.activity_menu.actions() if a.text()]
    for wanted in ("Edit D in the Table", "Add Successor", "Add Predecessor", "Pick Predecessors\u2026",
                   "Select Predecessors", "Select Successors", "Show in Network", "Delete D"):
        assert wanted in texts
    plan = shown.session.plan
    count, steps = len(plan), shown.session.undo_stack.count()
    action(shown, "Add Successor").trigger()
    close_menu(shown)
    assert len(plan) == count + 1
    new = shown.session.selected()[0]
    assert Link("D", new) in plan.links                            # finish-to-start from D
    assert plan.ids().index(new) == plan.ids().index("D") + 1     # placed right after it
    assert shown.session.undo_stack.count() == steps + 1           # one undo step
    shown.session.undo_stack.undo()
    assert len(plan) == count and new not in plan.ids()


def test_bar_menu_selects_predecessors_and_shows_the_network(shown, qtbot):
    view = timeline(shown, qtbot)
    right_click(view.plot.viewport(), bar_point(view, "F"))      # F follows W (SS 2) and P
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    action(shown, "Select Predecessors").trigger()
    assert sorted(shown.session.selected()) == ["P", "W"]
    close_menu(shown)
    shown.session.select(["F"])
    shown.activity_menu = None
    right_click(view.plot.viewport(), bar_point(view, "F"))
    qtbot.waitUntil(lambda: shown.activity_menu is not None)
    action(shown, "Show in Network").trigger()
    close_menu(shown)
    net = shown.view("Network")
    qtbot.waitUntil(lambda: net.layout_result is not None and net.isVisible())
    assert shown.session.selected() == ["F"]
    row = net.layout_result.index_of("F")
    qtbot.waitUntil(lambda: net.item.painter.selected == {row})
    x, y, w, h = net.layout_result.boxes[row]
    assert net.viewbox.viewRect().contains(QRectF(x, y, w, h))


def test_right_click_on_a_box_holds_and_clears_a_start_date(shown, qtbot):
    view = network(shown, qtbot)
    right_click(view.graphics.viewport(), box_point(view, "W"))
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    assert shown.session.selected() == ["W"]
    holds = [a for a in shown.activity_menu.actions() if a.text().startswith("Start No Earlier Than ")]
    assert len(holds) == 1 and action(shown, "Show in Timeline").isEnabled()
    assert not action(shown, "Clear Date Constraints").isEnabled()   # nothing to clear yet
    holds[0].trigger()
    close_menu(shown)
    analysis = shown.session.analysis
    early = analysis.dates()["early_start"][analysis.schedule.index("W")]
    held = shown.session.plan.activity("W").start_no_earlier
    assert held == early.astype("datetime64[D]").astype(dt.date)
    assert holds[0].text().endswith(f"{held.day} {held:%b} {held.year}")
    shown.activity_menu = None
    right_click(view.graphics.viewport(), box_point(view, "W"))
    qtbot.waitUntil(lambda: shown.activity_menu is not None)
    action(shown, "Clear Date Constraints").trigger()
    close_menu(shown)
    assert shown.session.plan.activity("W").start_no_earlier is None


def test_box_menu_deletes_the_selected_boxes_in_one_step(shown, qtbot):
    view = network(shown, qtbot)
    shown.session.select(["P", "W"])
    right_click(view.graphics.viewport(), box_point(view, "W"))  # W is in the selection: kept
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    assert not action(shown, "Add Successor").isEnabled()          # one activity at a time
    action(shown, "Delete 2 Activities").trigger()
    close_menu(shown)
    ids = shown.session.plan.ids()
    assert "P" not in ids and "W" not in ids
    shown.session.undo_stack.undo()
    assert {"P", "W"} <= set(shown.session.plan.ids())


def test_edit_in_table_opens_the_name_even_when_filtered_out(shown, qtbot):
    view = timeline(shown, qtbot)
    shown.activities.search.setText("Survey")                       # hides D's row in the table
    right_click(view.plot.viewport(), bar_point(view, "D"))
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    action(shown, "Edit D in the Table").trigger()
    close_menu(shown)
    table = shown.activities.table
    assert shown.activities.search.text() == ""
    assert table.currentIndex().data() == "Draw layout"
    assert table.state() == table.State.EditingState


def test_right_click_on_empty_space_opens_no_menu(shown, qtbot):
    view = network(shown, qtbot)
    view.fit()
    right_click(view.graphics.viewport(), QPoint(3, 3))
    qtbot.wait(20)
    assert getattr(shown, "activity_menu", None) is None


@pytest.mark.parametrize("title", ["Timeline", "Network"])
def test_the_menu_key_opens_the_selection_s_menu(shown, qtbot, title):
    view = timeline(shown, qtbot) if title == "Timeline" else network(shown, qtbot)
    shown.session.select(["W"])
    shown.activateWindow()
    target = view.plot if title == "Timeline" else view.graphics
    target.setFocus()
    qtbot.waitUntil(target.hasFocus)
    QTest.keyClick(target, Qt.Key.Key_F10, Qt.KeyboardModifier.ShiftModifier)
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    assert action(shown, "Delete W").isEnabled()
    close_menu(shown)


def test_box_menu_copies_the_activity_as_a_table_row(shown, qtbot):
    from PySide6.QtGui import QGuiApplication
    view = network(shown, qtbot)
    shown.activities.search.setText("Survey")                       # the table hides W
    right_click(view.graphics.viewport(), box_point(view, "W"))
    qtbot.waitUntil(lambda: getattr(shown, "activity_menu", None) is not None)
    action(shown, "Copy as Table Rows").trigger()
    close_menu(shown)
    lines = QGuiApplication.clipboard().text().splitlines()
    assert lines[0].split("\t")[:2] == ["ID", "Name"]
    assert lines[1].split("\t")[:2] == ["W", "Wiring"] and len(lines) == 2
    assert shown.activities.search.text() == "Survey"               # the filter is left alone
