"""The living-schedule sections of the plan file: progress, baselines, odds trend."""

import copy
import datetime as dt
import json
from pathlib import Path

import pytest

from workbench.core import analyze
from workbench.core.progress_fields import DONE, IN_PROGRESS, NOT_STARTED
from workbench.io.planfile import PlanFileError, dumps, load_plan, loads, plan_hash, plan_to_dict

DATA = Path(__file__).resolve().parent.parent / "data"
V2, V3 = DATA / "harbour_kiosk_v2.slw", DATA / "harbour_kiosk_v3.slw"
SAMPLE = DATA / "harbour_kiosk_progress_v3.slw"


def test_version_2_upgrades_to_empty_living_sections_byte_for_byte():
    plan = load_plan(V2)
    assert plan.baselines == [] and plan.odds_trend == [] and plan.settings.progress_rule == "retained logic"
    assert all(a.progress is None for a in plan.activities)
    text = dumps(plan)
    assert text == V3.read_text(encoding="utf-8")
    data = json.loads(text)
    assert (data["progress_rule"], data["progress"], data["baselines"], data["odds_trend"]) == \
        ("retained logic", [], [], [])


def test_the_stored_progress_sample_reads_and_writes_back_unchanged():
    text = SAMPLE.read_text(encoding="utf-8")
    plan = loads(text)
    assert dumps(plan) == text
    assert plan.settings.status_date == dt.date(2026, 3, 13) and plan.settings.progress_rule == "progress override"
    a = analyze(plan)
    assert a.progress.state[:3].tolist() == [DONE, IN_PROGRESS, IN_PROGRESS]
    assert a.progress.state[3] == NOT_STARTED
    assert plan.activity("STRIP").progress.percent_complete == 50
    (base,) = plan.baselines
    assert base.approved and base.name == "Board approval rev B" and base.simulation.seed == 7
    assert base.activity("SURV").start == dt.date(2026, 3, 2) and len(base.links) == len(plan.links)
    assert [p.status_date for p in plan.odds_trend] == [dt.date(2026, 3, 6), dt.date(2026, 3, 13)]
    assert plan.odds_trend[1].seed == 9 and plan.odds_trend[1].iterations == 2000


def test_absent_sections_read_as_empty():
    data = json.loads(V3.read_text(encoding="utf-8"))
    for key in ("progress_rule", "progress", "baselines", "odds_trend"):
        del data[key]
    plan = loads(json.dumps(data))
    assert plan.baselines == [] and plan.settings.progress_rule == "retained logic"


def test_the_hash_leaves_out_the_history_but_not_progress():
    plan = loads(SAMPLE.read_text(encoding="utf-8"))
    h = plan_hash(plan)
    plan.baselines, plan.odds_trend = [], []
    assert plan_hash(plan) == h
    plan.replace_activity("STRIP", plan.activity("STRIP").with_(progress=None))
    assert plan_hash(plan) != h


def _broken(change) -> str:
    data = json.loads(SAMPLE.read_text(encoding="utf-8"))
    change(data)
    with pytest.raises(PlanFileError) as err:
        loads(json.dumps(data))
    return str(err.value)


@pytest.mark.parametrize("change, words", [
    (lambda d: d["progress"][2].update(percent_complete=120), ["activity STRIP", "percent complete 120"]),
    (lambda d: d["progress"][0].update(remaining=2), ["activity SURV", "is done", "remaining work"]),
    (lambda d: d["progress"][0].update(actual_start=None), ["activity SURV", "actual finish needs an actual start"]),
    (lambda d: d["progress"][1].update(id="NOPE"), ["progress of activity NOPE", "unknown activity 'NOPE'"]),
    (lambda d: d["progress"][1].update(started="yes"), ["unknown field 'started'"]),
    (lambda d: d["progress"].append(dict(d["progress"][1])), ["activity PERM has progress listed twice"]),
    (lambda d: d.update(progress_rule="hopeful"), ["progress_rule", "retained logic"]),
    (lambda d: d["baselines"].append(dict(d["baselines"][0])), ["name 'Board approval rev B' is used twice"]),
    (lambda d: d["baselines"][0].update(approved="yes"), ["baseline Board approval rev B", "'approved'", "true or false"]),
    (lambda d: d["baselines"][0]["activities"][0].update(start="2.3.2026"), ["activity SURV", "'start'", "YYYY-MM-DD"]),
    (lambda d: d["odds_trend"][0].update(simulation_probability=1.5), ["odds trend point 1", "between 0 and 1"]),
    (lambda d: d["odds_trend"][0].update(seed=-1), ["'seed'", "whole number"]),
])
def test_bad_living_sections_are_refused_naming_the_place(change, words):
    message = _broken(change)
    for word in words:
        assert word in message, message


def test_a_second_approved_baseline_is_refused():
    def two(d):
        second = copy.deepcopy(d["baselines"][0])
        second["name"] = "Other"
        d["baselines"].append(second)
    assert "more than one is marked approved" in _broken(two)


def test_an_actual_date_after_the_status_date_is_refused_when_analysed():
    plan = loads(SAMPLE.read_text(encoding="utf-8"))
    plan.settings.status_date = dt.date(2026, 3, 3)
    with pytest.raises(Exception, match="activity SURV: actual finish 2026-03-04 is after the status date 2026-03-03"):
        analyze(plan)
    assert plan_to_dict(plan)["progress"][0]["actual_finish"] == {"date": "2026-03-04"}
