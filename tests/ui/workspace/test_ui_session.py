"""Session: edits go through the undo stack, recompute once, refused edits change nothing."""

import datetime as dt

from workbench.core.commands import EditActivity, SetPredecessors
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.ui.session import Session


def chain_plan() -> Plan:
    acts = [Activity("A", duration=2), Activity("B", duration=3), Activity("C", duration=4)]
    return Plan(Settings(start=dt.date(2026, 3, 2)), acts, [Link("A", "B"), Link("B", "C")])


def test_push_recomputes_once_and_undo_restores(qtbot):
    session = Session(chain_plan())
    assert session.analysis.schedule.finish == 9
    calls = []
    session.schedule_changed.connect(lambda: calls.append(1))
    assert session.push(EditActivity("B", duration=5))
    assert calls == [1]
    assert session.analysis.schedule.finish == 11
    session.undo_stack.undo()
    assert session.plan.activity("B").duration == 3
    assert session.analysis.schedule.finish == 9
    session.undo_stack.redo()
    assert session.analysis.schedule.finish == 11
    assert len(calls) == 3


def test_cycle_is_refused_with_the_loop_named(qtbot):
    session = Session(chain_plan())
    before = (session.plan.activities, list(session.plan.links))
    messages = []
    session.edit_refused.connect(messages.append)
    assert not session.push(SetPredecessors("A", [Link("C", "A")]))
    assert (session.plan.activities, session.plan.links) == before
    assert session.undo_stack.count() == 0
    assert len(messages) == 1
    assert "loop" in messages[0]
    for name in "ABC":
        assert name in messages[0]
    assert session.analysis is not None


def test_simulation_marked_stale_on_change(qtbot):
    session = Session(chain_plan())
    session.set_simulation(object())
    with qtbot.waitSignal(session.simulation_changed):
        session.push(EditActivity("A", name="x"))
    assert session.simulation is None


def test_selection_drops_removed_ids(qtbot):
    session = Session(chain_plan())
    with qtbot.waitSignal(session.selection_changed) as sig:
        session.select(["B", "Z", "B"])
    assert sig.args == [["B"]]
    assert session.selected() == ["B"]


def test_engine_fault_refuses_the_edit_without_a_traceback(qtbot, monkeypatch):
    import workbench.ui.session as session_module
    session = Session(chain_plan())

    def broken(plan):
        raise FloatingPointError("overflow in the forward pass")

    monkeypatch.setattr(session_module, "analyze", broken)
    assert not session.push(EditActivity("B", duration=5))
    assert session.plan.activity("B").duration == 3
    assert "could not be computed" in session.last_refusal and "overflow" in session.last_refusal


def test_unschedulable_plan_still_accepts_edits(qtbot):
    plan = chain_plan()
    plan.set_links(plan.links + [Link("C", "A")])  # a loop left in by a script
    session = Session(plan)
    assert session.analysis is None and "loop" in session.analysis_error
    assert session.push(SetPredecessors("A", []))  # the fix is accepted
    assert session.analysis is not None and session.analysis.schedule.finish == 9
