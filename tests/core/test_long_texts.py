"""Text past the entry limits: refused when typed, kept whole and named when it arrives in
a plan (a file from before the limits, another tool's spreadsheet)."""

import pytest

from workbench.core.commands import AddActivities, EditActivity, SetSettings, settings_with
from workbench.core.errors import PlanError
from workbench.core.long_texts import describe, long_texts
from workbench.core.model import TEXT_LIMITS, Activity, Link, Plan, Settings, SignOff

LONG_NAME = "Excavate the north trench " * 40          # 1,040 characters, over the 500 limit


def plan_with_long_texts() -> Plan:
    acts = [Activity("A", "Survey", duration=2), Activity("B", LONG_NAME, duration=3),
            Activity("C", "Pour", group="G" * 250, notes="n" * 20_001, duration=1)]
    settings = Settings(title="T" * 301, sign_off=[SignOff("Site lead", "R" * 201)])
    return Plan(settings, acts, [Link("A", "B"), Link("B", "C")])


def test_a_plan_holds_long_texts_whole_and_says_which():
    plan = plan_with_long_texts()
    assert plan.activity("B").name == LONG_NAME
    found = [(f.owner, f.field, f.length) for f in long_texts(plan)]
    assert found == [("settings", "title", 301), ("settings: sign-off row 1", "sign-off role", 201),
                     ("activity B", "name", len(LONG_NAME)), ("activity C", "group", 250),
                     ("activity C", "notes", 20_001)]
    text = describe(long_texts(plan), shown=3)
    assert text.splitlines()[:2] == ["5 texts are longer than Slackline lets you type:",
                                     "- settings: title (301 characters; limit 300)"]
    assert "\n- activity B: name (1,040 characters; limit 500)\n- and 2 more\n" in text
    assert "Every character is kept" in text and "asks you to shorten it" in text
    assert describe(long_texts(Plan(Settings(), [Activity("A", "ok", duration=1)]))) == ""


def test_editing_another_field_keeps_the_long_text():
    plan = plan_with_long_texts()
    EditActivity("B", duration=5.0).do(plan)
    assert plan.activity("B").name == LONG_NAME and plan.activity("B").duration == 5.0
    SetSettings(settings_with(plan.settings, revision="B")).do(plan)
    assert plan.settings.title == "T" * 301


def test_editing_the_long_text_itself_asks_for_it_within_the_limit():
    plan = plan_with_long_texts()
    with pytest.raises(PlanError, match="activity B: name is 1,041 characters long; use at most 500") as err:
        EditActivity("B", name=LONG_NAME + "!").do(plan)
    assert err.value.culprit == "B" and plan.activity("B").name == LONG_NAME   # unchanged
    EditActivity("B", name=LONG_NAME[:TEXT_LIMITS["name"]]).do(plan)
    assert len(plan.activity("B").name) == 500
    with pytest.raises(PlanError, match="settings: title is 302 characters long; use at most 300"):
        SetSettings(settings_with(plan.settings, title="T" * 302)).do(plan)


def test_a_paste_is_entry():
    plan = plan_with_long_texts()
    with pytest.raises(PlanError, match="activity D: notes is 20,001 characters long"):
        AddActivities([Activity("D", "Fine", notes="x" * 20_001, duration=1)]).do(plan)
    assert "D" not in plan.ids()
