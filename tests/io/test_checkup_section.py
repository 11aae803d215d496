"""The plan file's checkup section: written always, read leniently about absence and
strictly about content; the version 2 → 3 step adds it."""

import json
from pathlib import Path

import pytest

from workbench.core.checkup import run_checkup
from workbench.core.checkup_command import SetCheckupThresholds
from workbench.core.checkup_limits import LIMITS
from workbench.core.errors import PlanError
from workbench.io.errors import PlanFileError
from workbench.io.plan_migrate import V3_STEPS
from workbench.io.planfile import dumps, load_plan, loads

DATA = Path(__file__).resolve().parents[1] / "data"


def test_the_stored_sample_keeps_its_own_thresholds():
    plan = load_plan(DATA / "harbour_kiosk_checkup_v3.slw")
    assert plan.checkup_thresholds == {"missing_logic_pct": 3.0, "high_float_days": 30.0,
                                       "fs_links_pct": 85.0, "odds_gap_points": 5.0}
    checkup = run_checkup(plan)
    assert checkup.get("link_types").threshold == ">= 85 %" and checkup.get("link_types").changed
    assert not checkup.get("lags").changed
    assert dumps(loads(dumps(plan))) == (DATA / "harbour_kiosk_checkup_v3.slw").read_text(encoding="utf-8")


def test_every_threshold_is_written():
    data = json.loads(dumps(load_plan(DATA / "harbour_kiosk_v2.slw")))
    assert set(data["checkup"]["thresholds"]) == {limit.key for limit in LIMITS}


def test_a_version_2_file_gets_the_empty_section():
    assert any(step.__name__ == "_add_checkup_section" for step in V3_STEPS)
    plan = load_plan(DATA / "harbour_kiosk_v2.slw")
    assert plan.checkup_thresholds == {}


def _edited(change):
    data = json.loads((DATA / "harbour_kiosk_checkup_v3.slw").read_text(encoding="utf-8"))
    change(data)
    return json.dumps(data)


def test_an_absent_section_or_threshold_follows_the_defaults():
    plan = loads(_edited(lambda d: d.pop("checkup")))
    assert plan.checkup_thresholds == {}
    plan = loads(_edited(lambda d: d["checkup"]["thresholds"].pop("missing_logic_pct")))
    assert "missing_logic_pct" not in plan.checkup_thresholds


@pytest.mark.parametrize("change, words", [
    (lambda d: d["checkup"]["thresholds"].update(lazy_pct=3), "unknown threshold 'lazy_pct'"),
    (lambda d: d["checkup"]["thresholds"].update(lags_pct=150), "lags_pct: 150 lies outside"),
    (lambda d: d["checkup"]["thresholds"].update(lags_pct="five"), "lags_pct: must be a number"),
    (lambda d: d["checkup"].update(extra=1), "checkup: unknown field 'extra'"),
    (lambda d: d["checkup"].update(thresholds=[1]), "'thresholds' must be an object"),
])
def test_bad_content_names_the_threshold(change, words):
    with pytest.raises(PlanFileError) as info:
        loads(_edited(change))
    assert words in str(info.value)


def test_the_command_is_one_undo_step_and_refuses_bad_values():
    plan = load_plan(DATA / "harbour_kiosk_v2.slw")
    events = []
    plan.subscribe(lambda event, info: events.append((event, info["kind"])))
    cmd = SetCheckupThresholds({"lags_pct": 10.0})
    cmd.do(plan)
    assert plan.checkup_thresholds == {"lags_pct": 10.0} and ("changed", "settings_changed") in events
    cmd.undo(plan)
    assert plan.checkup_thresholds == {}
    with pytest.raises(PlanError, match="bei_min"):
        SetCheckupThresholds({"bei_min": -1}).do(plan)
    assert plan.checkup_thresholds == {}
    assert plan.copy().checkup_thresholds == {}
