"""Checkup's own checks (common practice, no published source), each on a plan built to
trigger it, and one plan built to trigger none."""

import dataclasses
import math

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.checkup import run_checkup
from workbench.core.montecarlo import simulate

from test_checkup_metrics import START


def three_point_chain(n=8, estimate=(4.0, 5.0, 7.0), **kw):
    acts = [Activity(f"A{i}", optimistic=estimate[0], most_likely=estimate[1], pessimistic=estimate[2])
            for i in range(1, n + 1)]
    links = [Link(f"A{i}", f"A{i + 1}") for i in range(1, n)]
    return Plan(Settings(start=START, **kw), acts, links)


def set_estimate(plan, act_id, a, m, b):
    plan.replace_activity(act_id, plan.activity(act_id).with_(optimistic=a, most_likely=m, pessimistic=b))


def test_false_certainty_finds_critical_work_without_a_real_range():
    plan = three_point_chain()
    set_estimate(plan, "A2", 5.0, 5.0, 5.0)                      # no range at all
    set_estimate(plan, "A3", 10.0, 10.2, 10.4)                   # ± 2 %: narrower than ± 5 %
    set_estimate(plan, "A4", 9.5, 10.0, 10.5)                    # exactly ± 5 %: not narrower
    plan.replace_activity("A5", Activity("A5", duration=5.0))    # one number
    plan.replace_activity("A6", Activity("A6", duration=5.0, distribution="fixed"))   # declared fixed
    c = run_checkup(plan).get("false_certainty")
    assert c.offenders == ["A2", "A3", "A5"] and c.status == "fail" and c.value == 3


def test_false_certainty_leaves_work_with_plenty_of_float_alone():
    plan = three_point_chain()
    plan.insert_activity(0, Activity("SIDE", duration=3.0))      # float ≈ 38 days: not near-critical
    plan.set_links(plan.links + [Link("SIDE", "A8")])
    assert run_checkup(plan).get("false_certainty").offenders == []


def test_suspicious_ranges_wide_pessimistic():
    plan = three_point_chain()
    set_estimate(plan, "A2", 2.0, 3.0, 10.0)                     # 3.3 × the most likely
    set_estimate(plan, "A3", 2.0, 3.0, 9.0)                      # exactly 3 ×: not above
    c = run_checkup(plan).get("suspicious_ranges")
    assert c.offenders == ["A2"] and c.status == "fail"


@pytest.mark.parametrize("at_end, status", [(2, "pass"), (3, "fail")])
def test_suspicious_ranges_most_likely_at_an_end(at_end, status):
    plan = three_point_chain(8)                                  # 2 of 8 = 25 % passes, 3 fails
    for i in range(1, at_end + 1):
        set_estimate(plan, f"A{i}", 4.0, 4.0, 7.0 if i % 2 else 4.0 + 3.0)
    c = run_checkup(plan).get("suspicious_ranges")
    assert c.status == status
    assert c.offenders == ([f"A{i}" for i in range(1, at_end + 1)] if status == "fail" else [])


def parallel_plan(branches, deadline=None):
    """S → B1..Bk → M → F with identical normal branches (4, 10, 16): te 10, sd 2."""
    acts = [Activity("S", duration=0.0)]
    acts += [Activity(f"B{k}", optimistic=4.0, most_likely=10.0, pessimistic=16.0) for k in range(1, branches + 1)]
    acts += [Activity("M", duration=1.0), Activity("F", duration=0.0)]
    links = [Link("S", f"B{k}") for k in range(1, branches + 1)] + [Link(f"B{k}", "M") for k in range(1, branches + 1)]
    links.append(Link("M", "F"))
    return Plan(Settings(start=START, distribution="normal", deadline=deadline), acts, links)


def test_merge_hot_spot_on_two_equal_paths_with_its_merge_bias():
    plan = parallel_plan(2)
    result = simulate(plan, 20_000, seed=11)
    c = run_checkup(plan, simulation=result).get("merge_hot_spots")
    assert c.status == "fail" and c.offenders == ["M"]
    assert "S-B1" in c.note and "S-B2" in c.note
    # Clark 1961 (Operations Research 9(2)): max of two iid N(μ, σ²) has mean μ + σ/√π,
    # so the merge adds 2/√π ≈ 1.128 days; sampling error over 20,000 runs is about 0.012
    from workbench.core.checkup_odds import hot_spots_for
    from workbench.core.checkup import frame_for
    spot = hot_spots_for(frame_for(plan), result)[0]
    assert spot.bias == pytest.approx(2 / math.sqrt(math.pi), abs=0.05)
    assert sorted(b[0] for b in spot.branches) == ["B1", "B2"]          # most often critical first
    assert all(0.4 < b[1] < 0.6 for b in spot.branches)


def test_odds_disagreement_on_six_merging_paths_names_merge_bias():
    # PERT: one branch, P(T ≤ te + σ) = Φ(1) = 0.841 (R4); the simulation: 0.841^6 ≈ 0.35
    plan = parallel_plan(6, deadline=13.0)                      # te 10 + 1 + σ 2 = 13
    result = simulate(plan, 10_000, seed=5)
    c = run_checkup(plan, simulation=result).get("odds_disagreement")
    assert c.status == "fail" and c.value == pytest.approx(100 * (0.8413 - 0.8413 ** 6), abs=3)
    assert "merge bias" in c.note and "at M" in c.note


def test_a_plan_built_to_trigger_none_of_our_checks():
    plan = three_point_chain(8, deadline=45.0)                   # te 41.3, PERT sd 1.41
    result = simulate(plan, 5_000, seed=3)
    checkup = run_checkup(plan, simulation=result)
    for cid in ("false_certainty", "suspicious_ranges", "merge_hot_spots", "odds_disagreement"):
        assert checkup.get(cid).status == "pass", (cid, checkup.get(cid).note)


def test_simulation_checks_without_a_run_or_after_a_structural_edit():
    plan = parallel_plan(2, deadline=14.0)
    checkup = run_checkup(plan)
    assert {checkup.get(c).status for c in ("merge_hot_spots", "odds_disagreement")} == {"n/a"}
    assert "Needs a simulation" in checkup.get("merge_hot_spots").note
    result = simulate(plan, 2_000, seed=1)
    plan.insert_activity(0, Activity("NEW", duration=1.0))
    after = run_checkup(plan, simulation=result, simulation_stale=True)
    assert after.get("merge_hot_spots").status == "n/a" and "run it again" in after.get("merge_hot_spots").note


def test_a_stale_run_is_used_and_says_so():
    plan = parallel_plan(2, deadline=14.0)
    result = simulate(plan, 2_000, seed=1)
    set_estimate(plan, "B1", 4.0, 10.0, 17.0)
    c = run_checkup(plan, simulation=result, simulation_stale=True).get("merge_hot_spots")
    assert c.status == "fail" and "before the latest edit" in c.note


def test_kept_durations_and_a_replay_agree():
    plan = parallel_plan(3)
    kept = simulate(plan, 3_000, seed=9, keep_durations=True)
    plain = dataclasses.replace(kept, durations=None)
    a = run_checkup(plan, simulation=kept).get("merge_hot_spots")
    b = run_checkup(plan, simulation=plain).get("merge_hot_spots")
    assert a.offenders == b.offenders == ["M"] and a.note == b.note


def test_earlier_odds_checks_are_reused_and_marked_stale():
    from workbench.core.checkup import frame_for, odds_checks
    plan = parallel_plan(2, deadline=14.0)
    result = simulate(plan, 2_000, seed=1)
    earlier = odds_checks(frame_for(plan), result)
    set_estimate(plan, "B1", 4.0, 10.0, 18.0)
    after = run_checkup(plan, earlier_odds=earlier, simulation_stale=True)
    assert after.get("merge_hot_spots").offenders == ["M"]
    assert after.get("merge_hot_spots").note.endswith("run it again to bring it up to date.")
    assert after.get("merge_hot_spots").note.count("latest edit") == 1
    fresh = run_checkup(plan, earlier_odds=earlier)
    assert "latest edit" not in fresh.get("merge_hot_spots").note


def test_false_certainty_measures_near_critical_from_the_critical_paths_own_float():
    # a deadline 30 days after the finish gives the whole chain 30 days of float: still critical
    plan = three_point_chain(deadline=71.0)                      # finish 41.3 (8 × 5.17)
    plan.replace_activity("A5", Activity("A5", duration=5.0))
    assert run_checkup(plan).get("false_certainty").offenders == ["A5"]


def test_a_changed_duration_limit_marks_its_check_changed():
    plan = three_point_chain()
    plan.set_checkup_thresholds({"long_duration_days": 4.0})
    c = run_checkup(plan).get("long_durations")
    assert c.changed and c.status == "fail" and len(c.offenders) == 8
