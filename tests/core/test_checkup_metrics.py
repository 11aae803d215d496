"""Checkup: each DCMA 14-point metric on a hand-built plan whose count is known.

Standard: DCMA 14-point schedule assessment, DCMA-EA PAM 200.1 (EVMS Program Analysis
Pamphlet, Defense Contract Management Agency, October 2012), section 4; thresholds recalled
[memory]. The counts below are worked out by hand from each plan's links and durations.
"""

import datetime as dt

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.checkup import OWN_IDS, STANDARD_IDS, run_checkup

START = dt.date(2027, 1, 4)   # a Monday


def chain_plan(n=20, unit="days", **kw):
    """S (milestone) → A1 → … → An → F (milestone), every activity 5 units, FS links."""
    acts = [Activity("S", duration=0.0)] + [Activity(f"A{i}", duration=5.0) for i in range(1, n + 1)]
    acts.append(Activity("F", duration=0.0))
    ids = [a.id for a in acts]
    links = [Link(p, s) for p, s in zip(ids, ids[1:])]
    return Plan(Settings(start=START, unit=unit, **kw), acts, links)


def check(plan, check_id, **kw):
    return run_checkup(plan, **kw).get(check_id)


def test_every_standard_metric_and_our_own_are_listed():
    checkup = run_checkup(chain_plan())
    assert [c.id for c in checkup][:14] == list(STANDARD_IDS)
    assert [c.id for c in checkup][14:] == list(OWN_IDS)


def test_clean_chain_passes_all_it_can():
    checkup = run_checkup(chain_plan())
    statuses = {c.id: c.status for c in checkup}
    for cid in ("missing_logic", "leads", "lags", "link_types", "hard_constraints", "high_float",
                "negative_float", "long_durations", "critical_path_test"):
        assert statuses[cid] == "pass", cid
    for cid in ("invalid_dates", "resources", "missed_activities", "bei", "cpli"):
        assert statuses[cid] == "n/a", cid       # no progress, baseline, resources or deadline


def test_missing_logic_counts_dangling_activities_but_not_the_plan_ends():
    plan = chain_plan(20)
    plan.insert_activity(5, Activity("LOOSE1", duration=2.0))      # no links at all: 1 offender
    plan.insert_activity(6, Activity("LOOSE2", duration=2.0))
    plan.set_links(plan.links + [Link("A3", "LOOSE2")])            # no successor: 1 offender
    c = check(plan, "missing_logic")
    # assessed: 24 activities minus the plan's first (S) and last (F) = 22; offenders 2
    assert c.offenders == ["LOOSE1", "LOOSE2"]
    assert c.value == pytest.approx(100 * 2 / 22)
    assert c.status == "fail"
    assert "S, F" in c.note


def test_leads_lags_and_link_types_count_links():
    plan = chain_plan(19)            # 20 links
    links = list(plan.links)
    links[3] = Link(links[3].pred, links[3].succ, "FS", -1.0)      # one lead
    links[5] = Link(links[5].pred, links[5].succ, "SS", 2.0)       # one lag, one non-FS
    links[7] = Link(links[7].pred, links[7].succ, "FF", 0.0)       # one non-FS
    plan.set_links(links)
    checkup = run_checkup(plan)
    assert checkup.get("leads").offenders == [links[3].succ] and checkup.get("leads").status == "fail"
    lags = checkup.get("lags")
    assert lags.value == pytest.approx(5.0) and lags.offenders == [links[5].succ]   # 1 of 20 links
    assert lags.status == "pass"
    types = checkup.get("link_types")
    assert types.value == pytest.approx(90.0) and types.status == "pass"             # 18 of 20 FS
    assert types.offenders == [links[5].succ, links[7].succ]


def test_hard_constraints_count_finish_no_later_only():
    plan = chain_plan(20)
    plan.replace_activity("A2", plan.activity("A2").with_(finish_no_later=200.0))
    plan.replace_activity("A4", plan.activity("A4").with_(start_no_earlier=3.0))    # soft: not counted
    c = check(plan, "hard_constraints")
    assert c.offenders == ["A2"] and c.value == pytest.approx(100 / 22)


def test_high_float_counts_float_above_44_working_days():
    plan = chain_plan(20)                                      # finish 100
    plan.insert_activity(1, Activity("SIDE", duration=5.0))    # S → SIDE → F: float 95
    plan.insert_activity(2, Activity("NEAR", duration=56.0))   # S → NEAR → F: float exactly 44
    plan.set_links(plan.links + [Link("S", "SIDE"), Link("SIDE", "F"), Link("S", "NEAR"), Link("NEAR", "F")])
    c = check(plan, "high_float")
    assert c.offenders == ["SIDE"]                             # 44 is not above 44
    assert c.value == pytest.approx(100 / 24) and c.status == "pass"


def test_high_float_in_weeks_converts_44_working_days():
    plan = chain_plan(20, unit="weeks")                        # finish 100 weeks
    plan.insert_activity(1, Activity("SIDE", duration=91.0))   # float 9 weeks = 45 working days
    plan.insert_activity(2, Activity("NEAR", duration=91.2))   # float 8.8 weeks = 44 working days
    plan.set_links(plan.links + [Link("S", "SIDE"), Link("SIDE", "F"), Link("S", "NEAR"), Link("NEAR", "F")])
    assert check(plan, "high_float").offenders == ["SIDE"]


def test_negative_float_from_a_deadline_before_the_finish():
    plan = chain_plan(4, deadline=15.0)                       # finish 20: every chain activity −5
    c = check(plan, "negative_float")
    assert c.offenders == ["S", "A1", "A2", "A3", "A4", "F"] and c.status == "fail" and c.value == 6


def test_long_durations_count_above_44_working_days_milestones_aside():
    plan = chain_plan(20)
    plan.replace_activity("A1", plan.activity("A1").with_(duration=45.0))
    plan.replace_activity("A2", plan.activity("A2").with_(duration=44.0))            # not above
    c = check(plan, "long_durations")
    assert c.offenders == ["A1"] and c.value == pytest.approx(5.0) and c.status == "pass"   # 1 of 20


def test_cpli_from_the_deadline():
    plan = chain_plan(4, deadline=22.0)                       # length 20, float to the deadline 2
    c = check(plan, "cpli")
    assert c.value == pytest.approx(22 / 20) and c.status == "pass"
    late = check(chain_plan(4, deadline=18.0), "cpli")
    assert late.value == pytest.approx(18 / 20) and late.status == "fail"
    assert late.offenders == ["S", "A1", "A2", "A3", "A4", "F"]


def test_progress_metrics_say_what_they_need():
    checkup = run_checkup(chain_plan(status_date=dt.date(2027, 2, 1)))
    for cid in ("invalid_dates", "missed_activities", "bei"):
        assert checkup.get(cid).status == "n/a"
        assert "needs a status date and an approved baseline" in checkup.get(cid).note.lower()


def test_resources_is_informational_until_the_plan_has_them():
    c = check(chain_plan(), "resources")
    assert c.status == "n/a" and "no resources or costs" in c.note


def test_an_empty_plan_and_a_plan_without_links_read_sensibly():
    empty = run_checkup(Plan(Settings(start=START)))
    assert empty.get("link_types").status == "pass" and empty.get("link_types").value_text == "none to count (0 links)"
    assert empty.get("critical_path_test").status == "n/a"
    lone = run_checkup(Plan(Settings(start=START, deadline=3.0), [Activity("A", duration=5.0)]))
    assert lone.get("negative_float").offenders == ["A"] and lone.get("cpli").value == pytest.approx(0.6)
