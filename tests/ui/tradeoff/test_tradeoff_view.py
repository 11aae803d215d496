"""Trade-off view: the curve arrives from the worker, the confidence search runs and can be
cancelled, and Apply changes the plan as one undo step."""

import pytest

from workbench.ui.session import Session
from workbench.ui.tradeoff.view import TradeoffView

from support.tradeoff import shown_tradeoff_view


@pytest.fixture
def view(qtbot):
    yield from shown_tradeoff_view(qtbot, (1400, 900))


def test_curve_and_textbook_option_are_shown(view):
    assert view.result.curve.points and view.option.count() == 2
    assert view.result.to_deadline.chance < 0.9
    assert len(view.curve_plot.listDataItems()) == 4       # direct, indirect, total, optimum


def test_confidence_search_then_apply_is_one_undo_step(qtbot, view):
    view.iterations.setValue(400)
    view.search()
    qtbot.waitUntil(lambda: not view.runner.running, timeout=60000)
    labels = [view.option.itemText(i) for i in range(view.option.count())]
    assert "90 % chance of the deadline" in labels
    view.option.setCurrentIndex(labels.index("90 % chance of the deadline"))
    assert view.table.rowCount() > 0
    session = view.session
    before = session.plan.activity(view.table.item(0, 0).text()).mean
    steps = session.undo_stack.count()
    assert view.apply_option()
    assert session.undo_stack.count() == steps + 1
    act = session.plan.activity(view.table.item(0, 0).text())
    assert act.mean < before and "Trade-off (90 % chance" in act.notes
    assert session.plan.settings.bought.label == "90 % chance of the deadline"
    session.undo_stack.undo()
    assert session.plan.activity(act.id).mean == pytest.approx(before) and session.plan.settings.bought is None


def test_cancel_leaves_a_message(qtbot, view):
    view.iterations.setValue(20000)
    view.search()
    view.runner.stop()
    qtbot.waitUntil(lambda: not view.runner.running, timeout=60000)
    assert "cancelled" in view.status.text()


def test_a_deadline_no_crash_can_meet_clears_the_view_and_says_why(qtbot, view):
    from dataclasses import replace

    from workbench.core.commands import SetSettings

    session = view.session
    assert session.push(SetSettings(replace(session.plan.settings, deadline=60.0)))
    qtbot.waitUntil(lambda: view.result is None, timeout=30000)
    assert "cannot be met even with every activity fully crashed" in view.status.text()
    assert view.option.count() == 0 and view.table.rowCount() == 0


def test_half_given_crash_data_is_named_in_the_status(qtbot, view):
    from workbench.core.commands import EditActivity

    act = next(a for a in view.session.plan.activities if a.crash_cost is not None)
    assert view.session.push(EditActivity(act.id, crash_cost=None))
    qtbot.waitUntil(lambda: not view.runner.running and view.result is not None
                    and act.id in view.result.problem.incomplete, timeout=30000)
    assert f"Not shortened, crash data incomplete: {act.id} (no crash cost)." in view.status.text()


def test_plan_without_costs_says_what_to_add(qtbot):
    from support.plans import house_plan

    v = TradeoffView(Session(house_plan()))
    qtbot.addWidget(v)
    v.show()
    assert "No cost data" in v.status.text() and not v.find.isEnabled()
    assert "right-click a heading to show the Cost, Crash cost" in v.status.text()


def test_indirect_cost_is_edited_here_as_one_undo_step(qtbot, view):
    session = view.session
    edit = view.costs.edits["indirect_cost"]
    assert edit.text() == "2,400"
    edit.setText("5,000")
    assert view.costs.commit("indirect_cost")
    assert session.plan.settings.indirect_cost == 5000
    qtbot.waitUntil(lambda: view.result is not None and view.result.indirect_cost == 5000, timeout=30000)
    edit.setText("-3")
    assert not view.costs.commit("indirect_cost") and "at least 0" in session.last_refusal
    assert edit.text() == "5,000"
    session.undo_stack.undo()
    assert session.plan.settings.indirect_cost == 2400


def test_clicking_a_crash_row_selects_the_activity(qtbot, view):
    view.iterations.setValue(300)
    view.search()
    qtbot.waitUntil(lambda: not view.runner.running, timeout=60000)
    view.option.setCurrentIndex(view.option.count() - 2)        # the last confidence plan
    assert view.table.rowCount() > 0
    view.table.selectRow(0)
    assert view.session.selected() == [view.table.item(0, 0).text()]

