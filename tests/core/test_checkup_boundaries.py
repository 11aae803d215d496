"""Checkup thresholds exactly at the boundary pass, just over fails; and the critical path
test on a plan with a dangling critical activity fails (DCMA-EA PAM 200.1, Oct 2012, §4,
thresholds recalled [memory]; counts by hand)."""

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.checkup import run_checkup
from workbench.core.checkup_cpt import MAX_VERIFIED as MAX_TESTED

from test_checkup_metrics import START, chain_plan


def with_loose(n_chain, loose):
    """A chain of n_chain activities between S and F, plus ``loose`` unlinked activities."""
    plan = chain_plan(n_chain)
    for k in range(loose):
        plan.insert_activity(1, Activity(f"L{k}", duration=1.0))
    return plan


@pytest.mark.parametrize("n_chain, loose, status", [
    (19, 1, "pass"),      # 1 of 20 assessed = 5.0 %
    (18, 1, "fail"),      # 1 of 19 = 5.26 %
    (38, 2, "pass"),      # 2 of 40 = 5.0 %
    (37, 2, "fail"),      # 2 of 39 = 5.13 %
])
def test_missing_logic_boundary(n_chain, loose, status):
    assert run_checkup(with_loose(n_chain, loose)).get("missing_logic").status == status


def lagged(n_links, lagged_links, kind="FS", lag=1.0):
    plan = chain_plan(n_links - 1)                # n_links links
    links = list(plan.links)
    for k in range(lagged_links):
        links[k + 1] = Link(links[k + 1].pred, links[k + 1].succ, kind, lag)
    plan.set_links(links)
    return run_checkup(plan)


@pytest.mark.parametrize("n_links, count, status", [(20, 1, "pass"), (19, 1, "fail"), (40, 2, "pass"), (39, 2, "fail")])
def test_lags_boundary(n_links, count, status):
    assert lagged(n_links, count).get("lags").status == status


@pytest.mark.parametrize("n_links, count, status", [(20, 2, "pass"), (19, 2, "fail"), (10, 1, "pass"), (10, 2, "fail")])
def test_link_types_boundary(n_links, count, status):
    assert lagged(n_links, count, "SS", 0.0).get("link_types").status == status


def test_leads_boundary_is_zero():
    assert lagged(20, 0).get("leads").status == "pass"
    assert lagged(20, 1, "FS", -0.5).get("leads").status == "fail"


@pytest.mark.parametrize("n_chain, status", [(19, "pass"), (18, "fail")])
def test_long_durations_boundary(n_chain, status):
    plan = chain_plan(n_chain)                   # 1 long of 20 = 5 % passes, of 19 = 5.26 % fails
    plan.insert_activity(1, Activity("LONG", duration=44.5))
    plan.insert_activity(1, Activity("M", duration=0.0))       # a milestone: not counted
    plan.set_links(plan.links + [Link("S", "LONG"), Link("LONG", "F"), Link("S", "M"), Link("M", "F")])
    c = run_checkup(plan).get("long_durations")
    assert c.offenders == ["LONG"] and c.status == status


@pytest.mark.parametrize("deadline, status", [(19.0, "pass"), (18.99, "fail")])
def test_cpli_boundary(deadline, status):
    # length 20; (20 + (19 − 20)) / 20 = 0.95 exactly passes
    assert run_checkup(chain_plan(4, deadline=deadline)).get("cpli").status == status


def test_a_changed_threshold_moves_the_boundary_and_says_so():
    plan = with_loose(18, 1)                      # 5.26 % fails at 5 %
    plan.set_checkup_thresholds({"missing_logic_pct": 6.0})
    c = run_checkup(plan).get("missing_logic")
    assert c.status == "pass" and c.changed and c.threshold == "<= 6 %"
    assert not run_checkup(with_loose(18, 1)).get("missing_logic").changed


def dangling_plan():
    """S → A1 → A2 → X, with X → B SS 5 and B → F; X (12 units) is critical through its start,
    and its finish leads nowhere: its own finish also reaches the project finish."""
    acts = [Activity("S", duration=0.0), Activity("A1", duration=3.0), Activity("A2", duration=4.0),
            Activity("X", duration=12.0), Activity("B", duration=10.0), Activity("F", duration=0.0)]
    links = [Link("S", "A1"), Link("A1", "A2"), Link("A2", "X"), Link("X", "B", "SS", 5.0), Link("B", "F")]
    return Plan(Settings(start=START), acts, links)


def test_critical_path_test_fails_on_a_dangling_critical_activity():
    plan = dangling_plan()
    c = run_checkup(plan).get("critical_path_test")
    # finish 22 (X 7..19, B 12..22); X +600 ends at 619: the finish moves 597, not 600
    assert c.status == "fail" and c.offenders == ["X"]
    assert "597" in c.note


def test_critical_path_test_passes_when_the_dangling_finish_drives_the_finish():
    plan = dangling_plan()
    plan.set_links(plan.links + [Link("X", "B", "FF", 3.0)])     # B cannot end before X + 3
    assert run_checkup(plan).get("critical_path_test").status == "pass"


def test_critical_path_test_a_finish_link_to_the_end_alone_is_not_enough():
    # X → F does not help: the finish (22, from B) is not driven by X's finish (19)
    plan = dangling_plan()
    plan.set_links(plan.links + [Link("X", "F")])
    assert run_checkup(plan).get("critical_path_test").offenders == ["X"]


def test_critical_path_test_on_a_long_path_always_tries_the_open_ended_one():
    plan = chain_plan(MAX_TESTED * 2)
    k = MAX_TESTED + 7
    links = [l for l in plan.links if l.pred != f"A{k}"] + [Link(f"A{k}", f"A{k + 1}", "SS", 5.0)]
    plan.set_links(links)
    plan.replace_activity(f"A{k}", plan.activity(f"A{k}").with_(duration=5.0))
    c = run_checkup(plan).get("critical_path_test")
    assert c.status == "fail" and f"A{k}" in c.offenders
