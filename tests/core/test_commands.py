"""Core undo commands: do then undo restores the plan exactly; refused edits change nothing."""

import datetime as dt

import pytest

from workbench.core.commands import (AddActivities, AddActivity, EditActivity, Group, MoveActivity,
                                     RemoveActivities, RemoveActivity, ReplacePlan, SetLinks,
                                     SetPredecessors, SetSettings, settings_with)
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Link, Plan, Settings


def small_plan() -> Plan:
    acts = [Activity("A", "Survey", optimistic=1, most_likely=2, pessimistic=4),
            Activity("B", "Design", optimistic=2, most_likely=3, pessimistic=7),
            Activity("C", "Build", duration=5),
            Activity("D", "Handover", duration=0)]
    links = [Link("A", "B"), Link("A", "C", "SS", 1), Link("B", "D"), Link("C", "D", "FF", -1)]
    return Plan(Settings(title="T", start=dt.date(2026, 3, 2)), acts, links)


def snapshot(plan: Plan):
    return (plan.activities, tuple(plan.links), plan.settings)


COMMANDS = [
    lambda: EditActivity("B", name="Detailed design", most_likely=4),
    lambda: EditActivity("A", id="A1"),
    lambda: AddActivity(Activity("E", duration=2), 1, [Link("A", "E"), Link("E", "D")]),
    lambda: AddActivities([Activity("E", duration=1), Activity("F", duration=2)], None, [Link("E", "F")]),
    lambda: RemoveActivity("A"),
    lambda: RemoveActivities(["B", "C"]),
    lambda: SetPredecessors("D", [Link("A", "D", "FS", 3)]),
    lambda: SetLinks([]),
    lambda: MoveActivity(0, 3),
    lambda: SetSettings(settings_with(small_plan().settings, title="Other", unit="weeks")),
    lambda: ReplacePlan(Plan(Settings(title="New"), [Activity("X", duration=1)])),
    lambda: Group([EditActivity("A", name="x"), RemoveActivity("C")], "two"),
]


@pytest.mark.parametrize("make", COMMANDS)
def test_do_undo_redo_restores_exactly(make):
    plan = small_plan()
    before = snapshot(plan)
    cmd = make()
    cmd.do(plan)
    after = snapshot(plan)
    assert after != before
    cmd.undo(plan)
    assert snapshot(plan) == before
    cmd.do(plan)
    assert snapshot(plan) == after


def test_remove_takes_links_along():
    plan = small_plan()
    cmd = RemoveActivity("A")
    cmd.do(plan)
    assert all("A" not in (l.pred, l.succ) for l in plan.links)
    assert len(plan.links) == 2


def test_rename_carries_links():
    plan = small_plan()
    EditActivity("A", id="A1").do(plan)
    assert [l.pred for l in plan.successors("A1")] == ["A1", "A1"]


@pytest.mark.parametrize("make, words", [
    (lambda: EditActivity("A", optimistic=5), "out of order"),
    (lambda: EditActivity("A", id="B"), "duplicate"),
    (lambda: EditActivity("A", duration="ten"), "must be a number"),
    (lambda: AddActivity(Activity("A", duration=1)), "duplicate"),
    (lambda: AddActivity(Activity("E", duration=1), None, [Link("Z", "E")]), "unknown activity"),
    (lambda: AddActivities([Activity("E", duration=1), Activity("E", duration=2)]), "duplicate"),
    (lambda: RemoveActivities(["A", "nope"]), "no activity"),
    (lambda: SetPredecessors("B", [Link("B", "B")]), "linked to itself"),
    (lambda: MoveActivity(0, 9), "cannot move"),
    (lambda: SetSettings(settings_with(small_plan().settings, target_confidence=1.5)), "target confidence"),
    (lambda: Group([EditActivity("A", name="x"), EditActivity("B", id="C")], "two"), "duplicate"),
])
def test_refused_command_leaves_plan_unchanged(make, words):
    plan = small_plan()
    before = snapshot(plan)
    with pytest.raises(PlanError) as info:
        make().do(plan)
    assert words in str(info.value)
    assert snapshot(plan) == before


def test_unknown_field_is_named():
    with pytest.raises(PlanError, match="colour"):
        EditActivity("A", colour="red")


def test_events_come_in_pairs():
    plan = small_plan()
    events = []
    plan.subscribe(lambda e, info: events.append((e, info["kind"])))
    cmd = RemoveActivities(["A"])
    cmd.do(plan)
    cmd.undo(plan)
    assert events == [("about_to_change", "activity_removed"), ("changed", "activity_removed"),
                      ("about_to_change", "activity_inserted"), ("changed", "activity_inserted")]
