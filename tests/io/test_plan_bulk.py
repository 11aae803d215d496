"""The fast plan file routes (bulk reading, line writing) give exactly what the careful
ones give: the same plan, the same text, and for a bad file the same message."""

import json
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from test_planfile_props import plans

from workbench.io import plan_bulk
from workbench.io.errors import PlanFileError
from workbench.io.plan_codec import plan_from_dict, plan_to_dict
from workbench.io.plan_lines import fast_dumps
from workbench.io.planfile import VERSION, _careful_json, _layout, dumps, loads

DATA = Path(__file__).resolve().parents[1] / "data"
KIOSK = (DATA / "harbour_kiosk_v3.slw").read_text(encoding="utf-8")


def careful(text: str):
    """The plan, or the message, by the careful reader alone."""
    try:
        return plan_to_dict(plan_from_dict(_careful_json(text, "x")))
    except PlanFileError as exc:
        return str(exc).removeprefix("x: ")


def either(text: str):
    try:
        return plan_to_dict(loads(text, "x"))
    except PlanFileError as exc:
        return str(exc).removeprefix("x: ")


def bulk_taken(text: str) -> bool:
    return plan_bulk.bulk_plan_data(text.encode("utf-8"), VERSION) is not None


def test_stored_sample_goes_the_bulk_route_to_the_same_plan():
    assert bulk_taken(KIOSK)
    assert either(KIOSK) == careful(KIOSK)


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(plans())
def test_random_plans_read_and_written_the_same_by_both_routes(plan):
    text = dumps(plan)
    assert text == _layout(plan_to_dict(plan)) + "\n"      # the line writer, byte for byte
    assert bulk_taken(text)
    assert either(text) == careful(text) == plan_to_dict(plan)


def _first_activity_line(text: str) -> str:
    return next(line for line in text.splitlines() if line.startswith('  {"id": '))


def _edit_first_activity(old: str, new: str) -> str:
    line = _first_activity_line(KIOSK)
    assert old in line
    return KIOSK.replace(line, line.replace(old, new, 1), 1)


def _edit_first_link(old: str, new: str) -> str:
    line = next(line for line in KIOSK.splitlines() if line.startswith('  {"pred": '))
    assert old in line
    return KIOSK.replace(line, line.replace(old, new, 1), 1)


DOUBTFUL = [
    # a field given twice: only the careful reader can tell, so the bulk route steps aside
    ("repeated field", _edit_first_activity('"group": ', '"notes": "again", "group": '), False),
    ("repeated link field", _edit_first_link('"type": ', '"lag": 2, "type": '), False),
    ("unknown field", _edit_first_activity('"group": ', '"colour": "red", "group": '), False),
    ("missing field", _edit_first_activity('"notes": "", ', ''), False),
    ("escaped colon", _edit_first_activity('"name": "', '"name": "a\\u003a '), False),
    ("boolean estimate", _edit_first_activity('"optimistic": 1.0', '"optimistic": true'), False),
    ("text estimate", _edit_first_activity('"optimistic": 1.0', '"optimistic": "one"'), False),
    # rows the bulk checks doubt: rebuilt one by one by the careful reader
    ("estimates out of order", _edit_first_activity('"optimistic": 1.0', '"optimistic": 3.0'), True),
    ("no estimate nor duration", _edit_first_activity('"optimistic": 1.0, "most_likely": 2.0, "pessimistic": 4.0',
                                               '"optimistic": null, "most_likely": null, "pessimistic": null'), True),
    ("bad id", _edit_first_activity('"id": "SURV"', '"id": "SU RV"'), True),
    ("empty id", _edit_first_activity('"id": "SURV"', '"id": ""'), True),
    ("long id", _edit_first_activity('"id": "SURV"', '"id": "' + "S" * 41 + '"'), True),
    ("unknown distribution", _edit_first_activity('"distribution": null', '"distribution": "lognormal"'), True),
    ("huge estimate", _edit_first_activity('"pessimistic": 4.0', '"pessimistic": 4e7'), True),
    ("lower-case link type", _edit_first_link('"type": "FS"', '"type": "fs"'), True),
    ("unknown link type", _edit_first_link('"type": "FS"', '"type": "XX"'), True),
    ("self link", _edit_first_link('"succ": "PERM"', '"succ": "SURV"'), True),
    ("unknown link end", _edit_first_link('"succ": "PERM"', '"succ": "NOPE"'), True),
    ("colon in a name", _edit_first_activity('"name": "', '"name": "Phase 1: '), True),
]


@pytest.mark.parametrize("label, text, bulk", DOUBTFUL, ids=[d[0] for d in DOUBTFUL])
def test_doubtful_files_get_the_careful_answer(label, text, bulk):
    assert bulk_taken(text) is bulk
    assert either(text) == careful(text)


def test_duplicate_ids_named_as_before():
    acts = [line for line in KIOSK.splitlines() if line.startswith('  {"id": ')]
    text = KIOSK.replace(acts[1], acts[1].replace('"id": "PERM"', '"id": "SURV"'), 1)
    assert bulk_taken(text)
    assert either(text) == careful(text)
    assert "duplicate id" in either(text)


def test_line_writer_steps_aside_for_values_it_does_not_write():
    plan = loads(KIOSK)
    plan._activities[0] = plan._activities[0].with_(optimistic=float("nan"))
    assert fast_dumps(plan, _layout) is None
    with pytest.raises(ValueError):
        dumps(plan)                       # refused by the plain writer, as before


def test_whole_file_checks_still_apply_on_the_bulk_route():
    data = json.loads(KIOSK)
    data["format"] = "something-else"
    text = json.dumps(data)
    assert either(text) == careful(text)
    assert "not a Slackline plan file" in either(text)
