"""The costs section of the plan file (version 3) and the cost columns of spreadsheets."""

import json
from pathlib import Path

import pytest

from workbench.core.demo import demo_plan
from workbench.io.errors import PlanFileError, TableImportError
from workbench.io.planfile import dumps, load_plan, loads, plan_to_dict
from workbench.io.row_reader import rows_to_plan
from workbench.core.analysis import analyze
from workbench.io.tabular import export_table, load_any

DATA = Path(__file__).resolve().parents[1] / "data"
SAMPLE = DATA / "clinic_costs_v3.slw"


def test_stored_sample_holds_the_section_and_round_trips():
    plan = load_plan(SAMPLE)
    assert plan.settings.indirect_cost == 2400 and plan.settings.late_penalty == 3000
    assert plan.settings.bought.label.startswith("90 %") and plan.settings.bought.crashed
    b3 = plan.activity("B3")
    assert (b3.cost, b3.crash_cost, b3.crash_optimistic) == (64000, 80000, 7.5)
    assert dumps(plan) == SAMPLE.read_text(encoding="utf-8")


def test_version_2_upgrades_to_an_empty_section():
    data = plan_to_dict(load_plan(DATA / "harbour_kiosk_v2.slw"))
    assert data["costs"] == {"indirect_cost": 0.0, "late_penalty": 0.0, "bought": None, "activities": []}


def _edited(change) -> str:
    data = json.loads(dumps(demo_plan()))
    change(data["costs"])
    return json.dumps(data)


@pytest.mark.parametrize("change, message", [
    (lambda c: c.update(colour=1), "unknown field 'colour'"),
    (lambda c: c["activities"].append({"id": "ZZ", "cost": 1.0}), "activity 'ZZ' is not in the plan"),
    (lambda c: c["activities"][3].update(crash_cost=1.0), "activity A3: crash cost 1 is below the normal cost 5000"),
    (lambda c: c.update(indirect_cost=-3), "indirect cost"),
    (lambda c: c["activities"][3].update(crash_most_likely="x"), "crash_most_likely' must be a number"),
])
def test_bad_section_is_refused_naming_the_field(change, message):
    with pytest.raises(PlanFileError, match=message):
        loads(_edited(change))


def test_section_absent_reads_as_empty():
    data = json.loads(dumps(demo_plan()))
    del data["costs"]
    plan = loads(json.dumps(data))
    assert plan.settings.indirect_cost == 0 and all(a.cost is None for a in plan.activities)


def test_spreadsheet_columns_round_trip(tmp_path):
    plan = demo_plan()
    for act in plan.activities:            # crews travel in a sheet of their own, not tested here
        plan.replace_activity(act.id, act.with_(resources=()))
    plan.resources = []
    for name in ("plan.csv", "plan.xlsx"):
        export_table(analyze(plan), tmp_path / name)
        back = load_any(tmp_path / name)
        for a, b in zip(plan.activities, back.activities):
            assert (a.cost, a.crash_cost, a.crash_optimistic, a.crash_pessimistic) == \
                   (b.cost, b.crash_cost, b.crash_optimistic, b.crash_pessimistic)


def test_spreadsheet_row_refusal_names_row_and_activity():
    rows = [{"id": "A", "duration": "5", "cost": "100", "crash cost": "80", "crash duration": "3"}]
    with pytest.raises(TableImportError, match="row 2, activity A: crash cost 80 is below the normal cost 100"):
        rows_to_plan(rows)
    rows = [{"id": "A", "duration": "5", "cost": "100", "crash cost": "180", "crash duration": "7"}]
    with pytest.raises(TableImportError, match="row 2, activity A: the crash estimate .* is longer"):
        rows_to_plan(rows)
