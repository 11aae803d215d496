"""Resources in the .slw plan file (version 3): round trip of a stored sample, the upgrade
from version 2, and bad entries refused naming the resource, activity and field."""

import copy
import datetime as dt
import json
from pathlib import Path

import pytest

from workbench.io.planfile import PlanFileError, dumps, load_plan, plan_from_dict, plan_to_dict

DATA = Path(__file__).resolve().parents[1] / "data"
SAMPLE = DATA / "boathouse_crews_v3.slw"


@pytest.fixture
def data():
    return json.loads(SAMPLE.read_text(encoding="utf-8"))


def test_sample_round_trips_byte_for_byte():
    plan = load_plan(SAMPLE)
    assert dumps(plan) == SAMPLE.read_text(encoding="utf-8")
    carp = plan.resource("carp")
    assert (carp.name, carp.units, carp.cost) == ("Carpenters", 4.0, 310.0)
    assert carp.periods[0].start == dt.date(2027, 5, 3) and carp.periods[0].units == 2.0
    assert plan.resource("sparks").periods[0].end == 3.0
    assert plan.activity("ROOF").resources == (("carp", 2.0), ("crane", 1.0))


def test_a_version_2_plan_has_no_resources():
    plan = load_plan(DATA / "harbour_kiosk_v2.slw")
    assert plan.resources == [] and all(a.resources == () for a in plan.activities)
    assert plan_to_dict(plan)["resources"] == []


@pytest.mark.parametrize("change, words", [
    (lambda d: d["activities"][0]["resources"].update(drill=1), ["activity FRAME", "unknown resource 'drill'"]),
    (lambda d: d["activities"][0]["resources"].update(carp=9), ["activity FRAME", "needs 9 units of carp", "never be scheduled"]),
    (lambda d: d["activities"][0].update(resources={"carp": "three"}), ["activity FRAME", "resources", "must be a number"]),
    (lambda d: d["activities"][0].update(resources=["carp"]), ["activity FRAME", "resources", "must be an object"]),
    (lambda d: d["resources"][0].update(units=-1), ["resource carp", "must not be negative"]),
    (lambda d: d["resources"][0].update(colour="red"), ["resource carp", "colour"]),
    (lambda d: d["resources"][0]["periods"][0].pop("end"), ["resource carp", "needs a start and an end"]),
    (lambda d: d["resources"].append(copy.deepcopy(d["resources"][0])), ["duplicate resource id 'carp'"]),
])
def test_bad_resource_entries_are_refused_by_name(data, change, words):
    change(data)
    with pytest.raises(PlanFileError) as info:
        plan_from_dict(data)
    for w in words:
        assert w in str(info.value)
