"""The model never holds text the plan file cannot store (issue 20, item 3): an edit
carrying a lone surrogate is refused naming the activity and field, and ``clean_text``
turns such text into storable text."""

import datetime as dt

import pytest
from hypothesis import given, strategies as st

from workbench.core import Activity, Plan, PlanError, Settings, SignOff
from workbench.core.text import REPLACEMENT, clean_text, lone_surrogate


def plan() -> Plan:
    return Plan(Settings(title="Depot", start=dt.date(2027, 2, 1)), [Activity("A", "Dig", duration=2)])


@pytest.mark.parametrize("field", ["name", "group", "notes"])
def test_an_edit_with_a_lone_surrogate_is_refused_naming_the_field(field):
    p = plan()
    with pytest.raises(PlanError, match=rf"activity A: {field} holds a broken character \(lone surrogate U\+D83D"):
        p.replace_activity("A", Activity("A", duration=2).with_(**{field: "Dig \ud83d"}))
    assert p.activity("A").name == "Dig"


def test_an_inserted_activity_and_new_settings_are_checked_too():
    p = plan()
    with pytest.raises(PlanError, match="activity B: name"):
        p.insert_activity(1, Activity("B", "\udc00", duration=1))
    with pytest.raises(PlanError, match="settings: prepared by"):
        p.set_settings(Settings(title="Depot", start=dt.date(2027, 2, 1), prepared_by="Ana \udfff"))
    with pytest.raises(PlanError, match="settings: sign-off 1: role"):
        p.set_settings(Settings(title="Depot", start=dt.date(2027, 2, 1), sign_off=[SignOff("Ana", "\ud800")]))
    assert len(p) == 1 and p.settings.prepared_by == ""


def test_a_plan_built_from_an_import_is_checked():
    with pytest.raises(PlanError, match="settings: title"):
        Plan(Settings(title="\ud800"), [])


@given(st.text(alphabet=st.characters(min_codepoint=0, max_codepoint=0x10FFFF)))
def test_clean_text_always_gives_storable_text(text):
    cleaned = clean_text(text)
    cleaned.encode("utf-8")
    assert lone_surrogate(cleaned) is None and len(cleaned) == len(text)
    if lone_surrogate(text) is None:
        assert cleaned == text
    else:
        assert REPLACEMENT in cleaned
