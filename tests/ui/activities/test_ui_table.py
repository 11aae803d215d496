"""The Activities table: models pass Qt's model checks, edits go through commands,
computed columns and the summary follow, refused edits change nothing."""

import pytest
from PySide6.QtCore import Qt
from PySide6.QtGui import QGuiApplication

from support.ui import plan_state, sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.ui.activities import columns as C
from workbench.ui.activities.filter_model import ActivityFilterModel
from workbench.ui.activities.table_model import ActivityTableModel
from workbench.ui.session import Session


def cell(model, act_id, key):
    return model.index(model.plan.row_of(act_id), C.INDEX[key])


def text(model, act_id, key):
    return cell(model, act_id, key).data()


@pytest.fixture
def session(qapp):
    return Session(sample_plan())


def test_qtmodeltester_on_table_and_proxy(qtmodeltester, session):
    model = ActivityTableModel(session)
    qtmodeltester.check(model)
    proxy = ActivityFilterModel()
    proxy.setSourceModel(model)
    proxy.sort(C.INDEX["total_float"])
    qtmodeltester.check(proxy)


def test_models_stay_consistent_through_edits(qtmodeltester, session):
    from workbench.core.commands import AddActivity, MoveActivity, RemoveActivities
    from workbench.core.model import Activity
    model = ActivityTableModel(session)
    proxy = ActivityFilterModel()
    proxy.setSourceModel(model)
    proxy.sort(C.INDEX["early_start"])
    qtmodeltester.check(proxy)  # the tester keeps watching the signals that follow
    session.push(AddActivity(Activity("X", duration=2), 3))
    session.push(MoveActivity(0, 5))
    session.push(RemoveActivities(["X", "P"]))
    assert model.setData(cell(model, "D", "most_likely"), "6")
    session.undo_stack.setIndex(0)
    assert model.rowCount() == len(sample_plan()) == proxy.rowCount()
    qtmodeltester.check(proxy)


def test_edit_updates_computed_columns_and_summary(window):
    model = window.activities.model
    before_ef = text(model, "D", "early_finish")
    before_finish = window.summary.texts()["finish"]
    assert text(model, "D", "te") == "5.33"
    assert model.setData(cell(model, "D", "pessimistic"), "30")
    assert model.setData(cell(model, "D", "most_likely"), "20")
    assert window.session.plan.activity("D").most_likely == 20
    assert text(model, "D", "te") == "18.83"  # (3 + 4*20 + 30) / 6
    assert text(model, "D", "sd") == "4.5"    # (30 - 3) / 6
    assert text(model, "D", "early_finish") != before_ef
    assert window.summary.texts()["finish"] != before_finish
    assert window.isWindowModified()
    assert window.session.undo_stack.count() == 2  # one step per edit


def test_undo_redo_restores_exactly(window):
    model, session = window.activities.model, window.session
    states = [plan_state(session.plan)]
    for key, act_id, value in (("name", "R", "Survey all rooms"), ("optimistic", "W", "3"),
                               ("predecessors", "F", "W SS 1; P; D FF 2"), ("id", "P", "P2"),
                               ("finish_no_later", "E", "2026-05-15"), ("duration", "F", "7")):
        act_id = "P2" if act_id == "P" and "P2" in session.plan else act_id
        assert model.setData(cell(model, act_id, key), value), session.last_refusal
        states.append(plan_state(session.plan))
    assert session.plan.activity("F").has_estimate is False
    assert [l.pred for l in session.plan.predecessors("F")] == ["W", "P2", "D"]
    for i in range(len(states) - 1, 0, -1):
        session.undo_stack.undo()
        assert plan_state(session.plan) == states[i - 1]
    for state in states[1:]:
        session.undo_stack.redo()
        assert plan_state(session.plan) == state
    assert not window.isWindowModified() or session.undo_stack.index() != 0


@pytest.mark.parametrize("key, act_id, value, words", [
    ("predecessors", "S", "E", ["loop", "S", "E"]),
    ("optimistic", "D", "7", ["out of order"]),
    ("most_likely", "D", "ten", ["D", "'ten' is not a number"]),
    ("id", "D", "R", ["duplicate", "'R'"]),
    ("predecessors", "D", "R; NOPE", ["NOPE"]),
    ("predecessors", "D", "R XX 2", ["unknown link type"]),
    ("start_no_earlier", "D", "soon", ["neither a date"]),
    ("distribution", "D", "lumpy", ["lumpy"]),
])
def test_refused_edit_changes_nothing_and_says_why(window, key, act_id, value, words):
    model, session = window.activities.model, window.session
    before = plan_state(session.plan)
    assert not model.setData(cell(model, act_id, key), value)
    assert plan_state(session.plan) == before
    assert session.undo_stack.count() == 0
    shown = window.notice.text()
    for word in words:
        assert word in shown
    assert not window.isWindowModified()


def test_cycle_message_names_the_loop_in_order(window):
    model = window.activities.model
    assert not model.setData(cell(model, "R", "predecessors"), "F")
    # F → R closes R → D → W → F (W SS-links F)
    assert "R \u2192 D \u2192 W \u2192 F \u2192 R" in window.notice.text()


def test_first_estimate_value_fills_three_points_and_clears_fixed(window):
    model, plan = window.activities.model, window.session.plan
    assert model.setData(cell(model, "W", "most_likely"), "5")
    act = plan.activity("W")
    assert (act.optimistic, act.most_likely, act.pessimistic, act.duration) == (5, 5, 5, None)
    assert model.setData(cell(model, "W", "pessimistic"), "9")
    assert text(model, "W", "te") == "5.67"


def test_insert_delete_move_rows(window):
    panel, session = window.activities, window.session
    model = panel.model
    links_before = list(session.plan.links)
    session.select(["D"])
    panel.insert_activity()
    assert session.plan.ids()[3] == "N8" and model.rowCount() == 8
    session.select(["W"])
    panel.delete_selected()
    assert "W" not in session.plan
    assert all("W" not in (l.pred, l.succ) for l in session.plan.links)
    session.undo_stack.undo()   # one step brings back the activity and its links
    assert session.plan.links == links_before + [] or sorted(map(str, session.plan.links)) == sorted(map(str, links_before))
    assert session.plan.ids().index("W") == 5
    session.select(["R"])
    panel.move_selected(1)
    assert session.plan.ids()[1:3] == ["D", "R"]
    assert session.selected() == ["R"]


def test_filters_group_critical_text(window):
    panel = window.activities
    proxy = panel.proxy
    shown = lambda: [proxy.index(r, 0).data() for r in range(proxy.rowCount())]  # noqa: E731
    assert panel.group_box.findText("Design") >= 0
    panel.group_box.setCurrentText("Design")
    assert shown() == ["R", "D"]
    panel.group_box.setCurrentIndex(0)
    panel.critical_box.setChecked(True)
    critical = [a for a, c in zip(window.session.analysis.schedule.ids, window.session.analysis.schedule.critical) if c]
    assert sorted(shown()) == sorted(critical) and 0 < len(critical) < 7
    panel.critical_box.setChecked(False)
    panel.search.setText("permit")
    assert shown() == ["W"]


def test_critical_is_marked_by_text_not_colour_alone(window):
    model = window.activities.model
    marks = {a.id: text(model, a.id, "critical") for a in window.session.plan.activities}
    crit = dict(zip(window.session.analysis.schedule.ids, window.session.analysis.schedule.critical))
    assert all((marks[i] == C.CRITICAL_MARK) == bool(crit[i]) for i in marks)


def test_sorting_by_dates_and_floats(window):
    proxy, table = window.activities.proxy, window.activities.table
    table.sortByColumn(C.INDEX["total_float"], Qt.SortOrder.DescendingOrder)
    floats = [float(proxy.index(r, C.INDEX["total_float"]).data()) for r in range(proxy.rowCount())]
    assert floats == sorted(floats, reverse=True)
    table.sortByColumn(C.INDEX["early_start"], Qt.SortOrder.AscendingOrder)
    starts = [proxy.index(r, C.INDEX["early_start"]).data(Qt.ItemDataRole.UserRole + 1) for r in range(proxy.rowCount())]
    assert starts == sorted(starts)


def test_paste_rows_from_a_spreadsheet(window):
    session = window.session
    QGuiApplication.clipboard().setText("id\tname\tduration\tpredecessors\n"
                                        "Q1\tSnag list\t2\tF\nQ2\tSign-off\t1\tQ1\n")
    session.select(["E"])
    window.activities.paste_rows()
    assert session.plan.ids()[-2:] == ["Q1", "Q2"]
    assert [l.pred for l in session.plan.predecessors("Q2")] == ["Q1"]
    assert session.undo_stack.count() == 1
    session.undo_stack.undo()
    assert "Q1" not in session.plan and "Q2" not in session.plan


def test_paste_with_bad_rows_changes_nothing(window):
    session = window.session
    before = plan_state(session.plan)
    QGuiApplication.clipboard().setText("Q1\tSnag list\t\t3\t2\t1\nR\tDuplicate\t\t\t\t\t4\n")
    window.activities.paste_rows()
    assert plan_state(session.plan) == before
    assert "Nothing pasted" in window.notice.text()


def test_plan_changes_map_one_to_one_onto_model_signals(session, qtbot):
    from workbench.core.commands import AddActivity, MoveActivity, RemoveActivities
    from workbench.core.model import Activity
    model = ActivityTableModel(session)
    seen = []
    model.rowsInserted.connect(lambda parent, first, last: seen.append(("inserted", first, last)))
    model.rowsRemoved.connect(lambda parent, first, last: seen.append(("removed", first, last)))
    model.rowsMoved.connect(lambda p, first, last, d, row: seen.append(("moved", first, row)))
    model.modelReset.connect(lambda: seen.append(("reset",)))
    session.push(AddActivity(Activity("X", duration=1), 2))
    session.push(MoveActivity(2, 5))
    session.push(RemoveActivities(["X"]))
    session.load(sample_plan())
    assert seen == [("inserted", 2, 2), ("moved", 2, 6), ("removed", 5, 5), ("reset",)]
    assert model.index(2, 0).data() == "D"


def test_rename_refreshes_successor_cells(session, qtbot):
    from workbench.core.commands import EditActivity
    model = ActivityTableModel(session)
    pred_col = C.INDEX["predecessors"]
    changed = []
    model.dataChanged.connect(lambda tl, br, roles=(): changed.append((tl.row(), br.row(), tl.column(), br.column())))
    session.push(EditActivity("D", id="D9"))
    w_row = session.plan.row_of("W")
    assert any(r0 <= w_row <= r1 and c0 <= pred_col <= c1 for r0, r1, c0, c1 in changed)
    assert text(model, "W", "predecessors") == "D9"


def test_typing_into_a_cell_edits_through_the_undo_stack(window, qtbot):
    from PySide6.QtTest import QTest
    from PySide6.QtWidgets import QLineEdit
    window.show()
    qtbot.waitExposed(window)
    panel = window.activities
    source = panel.model.index(window.session.plan.row_of("R"), C.INDEX["name"])
    index = panel.proxy.mapFromSource(source)
    panel.table.setCurrentIndex(index)
    panel.table.edit(index)  # what a double-click or F2 does
    editors = panel.table.viewport().findChildren(QLineEdit)
    assert len(editors) == 1 and editors[0].text() == "Survey rooms"
    editors[0].selectAll()
    QTest.keyClicks(editors[0], "Measure rooms")
    QTest.keyClick(editors[0], Qt.Key.Key_Return)
    qtbot.waitUntil(lambda: window.session.undo_stack.count() == 1)  # the delegate commits queued
    assert window.session.plan.activity("R").name == "Measure rooms"
    assert window.session.undo_stack.count() == 1
    assert window.session.selected() == ["R"]
