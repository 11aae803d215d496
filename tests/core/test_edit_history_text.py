"""An edit's history line names the fields that changed, not every field the gesture set."""

from workbench.core.commands import EditActivity
from workbench.core.model import Activity, Plan


def test_only_changed_fields_are_named():
    plan = Plan(activities=[Activity("A4", "Appoint", optimistic=10, most_likely=15, pessimistic=25)])
    edit = EditActivity("A4", most_likely=16, duration=None, optimistic=10)
    edit.do(plan)
    assert edit.text == "Edit A4: most likely"
    edit.undo(plan)
    assert plan.activity("A4").most_likely == 15


def test_a_rename_is_named():
    plan = Plan(activities=[Activity("A", "Dig", duration=2)])
    edit = EditActivity("A", name="Dig deeper", duration=2)
    edit.do(plan)
    assert edit.text == "Edit A: name"
