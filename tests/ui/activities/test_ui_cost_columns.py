"""The Activities table's cost columns: hidden until shown from the headings' menu, typed
one cell at a time (one undo step each), refused with the activity and field named by the
same core checks as an import."""

import pytest
from PySide6.QtCore import Qt

from support.ui import sample_plan
from workbench.core.crash_problem import CrashProblem
from workbench.io.errors import TableImportError
from workbench.io.row_reader import rows_to_plan
from workbench.ui.activities import columns as C
from workbench.ui.activities import row_tools
from workbench.ui.activities.table_model import SORT_ROLE, ActivityTableModel
from workbench.ui.session import Session

COST_KEYS = ("cost", "crash_cost", "crash_optimistic", "crash_most_likely", "crash_pessimistic", "crash_duration")


@pytest.fixture
def model(qapp):
    plan = sample_plan()
    plan.replace_activity("P", plan.activity("P").with_(cost=12000.0, crash_cost=15000.0, crash_optimistic=6.0,
                                                          crash_most_likely=7.0, crash_pessimistic=14.0))
    return ActivityTableModel(Session(plan))


def cell(model, act_id, key):
    return model.index(model.plan.row_of(act_id), C.INDEX[key])


def test_the_model_passes_qts_checks_with_the_cost_columns(qtmodeltester, model):
    qtmodeltester.check(model)


def test_costs_and_crash_estimates_are_shown(model):
    assert cell(model, "P", "cost").data() == "12000"
    assert cell(model, "P", "crash_cost").data() == "15000"
    assert [cell(model, "P", k).data() for k in COST_KEYS[2:]] == ["6", "7", "14", ""]
    assert cell(model, "P", "crash_pessimistic").data(SORT_ROLE) == 14
    assert cell(model, "W", "cost").data() == "" and cell(model, "W", "crash_duration").data() == ""
    assert model.headerData(C.INDEX["crash_most_likely"], Qt.Orientation.Horizontal) == "Crash most likely"


def test_crash_data_typed_in_either_order_is_one_undo_step_per_cell(model):
    session, plan = model.session, model.plan
    before = session.undo_stack.count()
    assert model.setData(cell(model, "W", "cost"), "2,500")              # a comma groups thousands
    assert model.setData(cell(model, "W", "crash_duration"), "3")       # half the crash data: kept
    assert plan.activity("W").crash_duration == 3 and plan.activity("W").crash_cost is None
    assert model.setData(cell(model, "W", "crash_cost"), "3100.50")
    w = plan.activity("W")
    assert (w.cost, w.crash_cost, w.crash_duration) == (2500, 3100.5, 3)
    assert cell(model, "W", "crash_cost").data() == "3100.5"
    assert model.setData(cell(model, "F", "cost"), "800")
    assert model.setData(cell(model, "F", "crash_cost"), "1 400")          # crash cost first this time
    assert model.setData(cell(model, "F", "crash_most_likely"), "4")       # the first point fills all three
    assert model.setData(cell(model, "F", "crash_optimistic"), "3")
    assert model.setData(cell(model, "F", "crash_pessimistic"), "8")
    f = plan.activity("F")
    assert (f.crash_optimistic, f.crash_most_likely, f.crash_pessimistic, f.crash_duration) == (3, 4, 8, None)
    assert session.undo_stack.count() == before + 8
    session.undo_stack.undo()
    assert plan.activity("F").crash_pessimistic == 4 and plan.activity("F").crash_cost == 1400
    session.undo_stack.redo()
    problem = CrashProblem(plan)                   # the Trade-off sees what was typed
    slope = dict(zip(problem.ids, problem.slope))
    assert slope["W"] == pytest.approx(600.5) and slope["F"] == pytest.approx(600 / (19 / 3 - 4.5))


def test_a_crash_duration_and_crash_points_replace_each_other(model):
    assert model.setData(cell(model, "P", "crash_duration"), "9")
    p = model.plan.activity("P")
    assert (p.crash_optimistic, p.crash_most_likely, p.crash_pessimistic, p.crash_duration) == (None, None, None, 9)
    assert model.setData(cell(model, "P", "crash_most_likely"), "8")
    p = model.plan.activity("P")
    assert (p.crash_optimistic, p.crash_most_likely, p.crash_pessimistic, p.crash_duration) == (8, 8, 8, None)
    assert model.setData(cell(model, "P", "crash_optimistic"), "")          # emptying one clears the estimate
    p = model.plan.activity("P")
    assert (p.crash_optimistic, p.crash_pessimistic, p.crash_duration) == (None, None, None)
    assert p.crash_cost == 15000                  # kept: not shortened until an estimate is back


@pytest.mark.parametrize("key, text, words", [
    ("crash_pessimistic", "21", "activity P: crash pessimistic 21 is longer than the normal pessimistic 20"),
    ("crash_duration", "12", "activity P: the crash estimate (te 12) is longer than the normal one"),
    ("crash_cost", "9000", "activity P: crash cost 9000 is below the normal cost 12000"),
    ("cost", "16000", "activity P: crash cost 15000 is below the normal cost 16000"),
    ("cost", "-5", "activity P: cost must not be negative"),
    ("crash_cost", "-1", "activity P: crash cost must not be negative"),
    ("cost", "lots", "activity P: cost: 'lots' is not a number"),
    ("crash_most_likely", "5", "activity P: crash estimates out of order"),
    ("crash_duration", "soon", "activity P: crash duration: 'soon' is not a number"),
])
def test_bad_costs_are_refused_naming_the_activity_and_field(model, key, text, words):
    before, steps = model.plan.activity("P"), model.session.undo_stack.count()
    assert not model.setData(cell(model, "P", key), text)
    assert words in model.session.last_refusal
    assert model.plan.activity("P") == before and model.session.undo_stack.count() == steps


def test_a_crash_cost_needs_the_normal_cost_first(model):
    assert not model.setData(cell(model, "W", "crash_cost"), "500")
    assert "activity W: a crash cost needs the normal cost too" in model.session.last_refusal


@pytest.mark.parametrize("cells, table_text", [
    ({"crash cost": "80", "crash duration": "3"}, {"crash_cost": "80", "crash_duration": "3"}),
    ({"crash cost": "180", "crash duration": "7"}, {"crash_cost": "180", "crash_duration": "7"}),
    ({"crash cost": "-3", "crash duration": "3"}, {"crash_cost": "-3", "crash_duration": "3"}),
])
def test_the_table_and_an_import_refuse_alike(qapp, cells, table_text):
    """The same core check answers both: the import's message (after its row) is the table's."""
    with pytest.raises(TableImportError) as err:
        rows_to_plan([{"id": "A", "duration": "5", "cost": "100", **cells}])
    plan = rows_to_plan([{"id": "A", "duration": "5", "cost": "100"}])
    model = ActivityTableModel(Session(plan))
    ok = [model.setData(cell(model, "A", key), text) for key, text in sorted(table_text.items(), reverse=True)]
    assert not all(ok)
    assert model.session.last_refusal in str(err.value)


def test_cost_columns_are_hidden_until_shown_and_remembered(window, ui_env):
    from workbench.ui.activities.panel import ActivitiesPanel
    panel = window.activities
    index = {k: panel.column_keys.index(k) for k in COST_KEYS}
    assert all(panel.table.isColumnHidden(i) for i in index.values())
    menu = row_tools.column_menu(panel)
    shown = {a.text(): a.isChecked() for a in menu.actions()}
    assert shown["Cost"] is False and shown["Crash pessimistic"] is False and shown["Name"] is True
    next(a for a in menu.actions() if a.text() == "Crash cost").setChecked(True)
    assert not panel.table.isColumnHidden(index["crash_cost"]) and panel.table.isColumnHidden(index["cost"])
    again = ActivitiesPanel(Session(sample_plan()))
    assert not again.table.isColumnHidden(index["crash_cost"]) and again.table.isColumnHidden(index["cost"])
    row_tools.set_column_shown(again, "crash_cost", False)
    row_tools.set_column_shown(again, "notes", False)
    assert row_tools.hidden_columns() == set(COST_KEYS) | {"notes"}
    again.deleteLater()


def test_rows_copied_with_the_cost_columns_paste_back(window, ui_env):
    """The headings are the spreadsheet columns' names: copy and paste keeps the costs."""
    from workbench.core.model import Plan
    from workbench.ui.activities.paste_rows import paste_command
    panel, plan = window.activities, window.session.plan
    plan.replace_activity("P", plan.activity("P").with_(cost=12000.0, crash_cost=15000.0, crash_optimistic=6.0,
                                                          crash_most_likely=7.0, crash_pessimistic=14.0))
    plan.replace_activity("W", plan.activity("W").with_(cost=900.5, crash_cost=1000.0, crash_duration=3.0))
    for key in COST_KEYS:
        row_tools.set_column_shown(panel, key, True)
    text = row_tools.rows_as_text(panel, list(range(len(plan))))
    target = Plan(plan.settings)
    command = paste_command(text, target, 0)
    command.do(target)
    for act_id in ("P", "W", "F"):
        a, b = plan.activity(act_id), target.activity(act_id)
        assert [getattr(a, k) for k in COST_KEYS] == [getattr(b, k) for k in COST_KEYS]


def test_showing_a_column_keeps_the_baseline_columns_hidden_without_a_baseline(window, ui_env):
    panel = window.activities
    assert window.session.variance() is None
    baseline = panel.column_keys.index("baseline_finish")
    assert panel.table.isColumnHidden(baseline)
    row_tools.set_column_shown(panel, "cost", True)
    assert not panel.table.isColumnHidden(panel.column_keys.index("cost"))
    assert panel.table.isColumnHidden(baseline)
    window.session.recalculate()                    # a fresh schedule keeps the user's choice too
    assert not panel.table.isColumnHidden(panel.column_keys.index("cost")) and panel.table.isColumnHidden(baseline)


@pytest.mark.parametrize("text, amount", [
    ("12500", 12500), ("12,500", 12500), ("1,234,567.5", 1234567.5), ("12 500", 12500),
    ("12\u00a0500", 12500), ("12.500,50", 12500.5), ("99,5", 99.5), ("1,5", 1.5), ("", None),
])
def test_amounts_are_read_with_thousands_separators_or_a_decimal_comma(text, amount):
    from workbench.ui.activities.cost_columns import parse_money
    assert parse_money(text, "K7", "cost", C.parse_number) == amount
