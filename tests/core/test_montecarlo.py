"""Monte Carlo engine: published results, reproducibility, exactness on fixed durations."""

import datetime as dt
import json
import math

import numpy as np
import pytest
from scipy import stats

from workbench.core import Activity, Link, Plan, Risk, Settings, analyze
from workbench.core.errors import PlanError
from workbench.core.montecarlo import SimulationCancelled, simulate

MONDAY = dt.date(2027, 1, 4)

# R1 (Hillier & Lieberman, house-building bid; three-point estimates [memory], see reference-cases.md)
R1 = """A - 1 2 3
B A 2 3.5 8
C B 6 9 18
D C 4 5.5 10
E C 1 4.5 5
F E 4 4 10
G D 5 6.5 11
H E,G 5 8 17
I C 3 7.5 9
J F,I 3 9 9
K J 4 4 4
L J 1 5.5 7
M H 1 2 3
N K,L 5 5.5 9"""
R1_PATHS = ["ABCDGHM", "ABCEHM", "ABCEFJKN", "ABCEFJLN", "ABCIJKN", "ABCIJLN"]


def r1_plan(distribution="beta-pert"):
    acts, links = [], []
    for row in R1.splitlines():
        i, preds, a, m, b = row.split()
        acts.append(Activity(i, optimistic=float(a), most_likely=float(m), pessimistic=float(b)))
        links += [Link(p, i) for p in preds.split(",")] if preds != "-" else []
    return Plan(Settings(title="R1", start=MONDAY, unit="weeks", distribution=distribution), acts, links)


def chain_plan(n, a=2, m=5, b=12, family=None):
    acts = [Activity(f"S{i}", optimistic=a, most_likely=m, pessimistic=b, distribution=family) for i in range(n)]
    return Plan(Settings(start=MONDAY), acts, [Link(f"S{i}", f"S{i + 1}") for i in range(n - 1)])


def test_r1_shows_merge_bias():
    # R1: PERT mean 44, P(T ≤ 47) = Φ(1) = 0.8413; a simulation gives a higher mean and lower odds.
    res = simulate(r1_plan(), 20_000, seed=3, deadline=47)
    p, err = res.prob_by(47)
    assert res.pert_mean == pytest.approx(44.0) and res.pert_sd == pytest.approx(3.0)
    assert res.mean > 44 + 3 * res.mean_stderr and res.merge_bias > 0
    assert p + 3 * err < 0.8413
    assert res.to_dict()["probability"] == p


def test_long_chain_mean_is_the_sum_of_te():
    # common practice / R5: the beta-PERT mean is te exactly, so a chain's mean is Σ te.
    res = simulate(chain_plan(60), 8000, seed=9)
    te = 60 * (2 + 4 * 5 + 12) / 6
    assert abs(res.mean - te) < 4 * res.mean_stderr
    # beta-PERT variance (b − a)²αβ/252 per activity (R5), not ((b − a)/6)²
    alpha, beta = 1 + 4 * 3 / 10, 1 + 4 * 7 / 10
    assert res.sd ** 2 == pytest.approx(60 * 100 * alpha * beta / 252, rel=0.06)


def test_two_identical_parallel_chains_follow_clark():
    # Clark 1961 (R5): max of two independent N(μ, σ²) has mean μ + σ/√π, variance σ²(1 − 1/π).
    # Each chain is two normal activities (te = 50, sd = (b − a)/6 = 5; truncation at zero is
    # 10 sd away), so a chain is exactly normal with μ = 100, σ² = 50.
    acts = [Activity(x, optimistic=35, most_likely=50, pessimistic=65, distribution="normal") for x in ("P1", "P2", "Q1", "Q2")]
    acts.append(Activity("End", duration=0))
    links = [Link("P1", "P2"), Link("Q1", "Q2"), Link("P2", "End"), Link("Q2", "End")]
    res = simulate(Plan(Settings(start=MONDAY), acts, links), 40_000, seed=21)
    sigma = math.sqrt(50)
    assert abs(res.mean - (100 + sigma / math.sqrt(math.pi))) < 4 * res.mean_stderr
    assert res.sd ** 2 == pytest.approx(50 * (1 - 1 / math.pi), rel=0.04)
    assert res.criticality[:4] == pytest.approx([0.5] * 4, abs=0.02)
    assert res.merge_bias > 0.9 * sigma / math.sqrt(math.pi)


def test_kleindorfer_bounds_hold_on_r1():
    # Kleindorfer 1971 (R5): Π_paths P(path ≤ t) ≤ P(T ≤ t) ≤ min_paths P(path ≤ t), with
    # independent durations. Normal durations make each path sum normal (truncation at zero
    # is below 1e-5 here).
    plan = r1_plan("normal")
    res = simulate(plan, 20_000, seed=4)
    mean = {a.id: a.mean for a in plan.activities}
    var = {a.id: a.variance for a in plan.activities}
    for t in (41.0, 44.0, 47.0, 50.0):
        probs = [stats.norm.cdf(t, sum(mean[x] for x in p), math.sqrt(sum(var[x] for x in p))) for p in R1_PATHS]
        p, err = res.prob_by(t)
        assert math.prod(probs) - 3 * err <= p <= min(probs) + 3 * err


def test_dominant_path_has_criticality_one():
    acts = [Activity("Long", optimistic=40, most_likely=50, pessimistic=60),
            Activity("Short", optimistic=5, most_likely=8, pessimistic=12), Activity("Done", duration=0)]
    plan = Plan(Settings(start=MONDAY), acts, [Link("Long", "Done"), Link("Short", "Done")])
    res = simulate(plan, 3000, seed=1)
    assert res.criticality.tolist() == [1.0, 0.0, 1.0]
    assert res.sensitivity[0] > 0.99 and res.cruciality[0] > 0.99 and res.sensitivity[1] == pytest.approx(0, abs=0.06)


def test_same_seed_same_result_and_recorded_random_seed():
    plan = r1_plan()
    a, b = simulate(plan, 3000, seed=77), simulate(plan, 3000, seed=77)
    assert np.array_equal(a.finish, b.finish) and np.array_equal(a.sensitivity, b.sensitivity)
    c = simulate(plan, 3000, seed=78)
    assert not np.array_equal(a.finish, c.finish)
    d = simulate(plan, 500)
    assert isinstance(d.seed, int) and np.array_equal(simulate(plan, 500, seed=d.seed).finish, d.finish)


def test_block_size_changes_nothing():
    plan = r1_plan()
    plan.risks.append(Risk("R", "Permit late", 0.3, 1, 2, 4, ("C", "I")))
    runs = [simulate(plan, 1000, seed=5, block_size=bs) for bs in (1, 64, 200, 1000, 5000)]
    for other in runs[1:]:
        for name in ("finish", "criticality", "sensitivity", "cruciality", "ssi"):
            assert np.array_equal(getattr(runs[0], name), getattr(other, name)), name
        assert other.risk_report == runs[0].risk_report


R3_LINKS = [Link("A", "B", "SS", 3), Link("A", "C", "FF", 2), Link("B", "D", "FS", 1),
            Link("C", "D", "SF", 9), Link("C", "E", "FS", 0), Link("D", "E", "FS", 0)]


def test_fixed_durations_reproduce_the_schedule_with_all_link_types():
    # R3 (all four link types with lags, checked by hand): project 17, C has float 2.
    acts = [Activity(x, duration=d) for x, d in zip("ABCDE", (10, 6, 8, 5, 2))]
    plan = Plan(Settings(start=MONDAY), acts, R3_LINKS)
    res = simulate(plan, 700, seed=1)
    assert np.all(res.finish == 17.0)
    assert res.criticality.tolist() == [1, 1, 0, 1, 1]


def test_fixed_estimates_with_constraints_and_deadline_equal_the_cpm_engine():
    acts = [Activity(x, optimistic=d - 1, most_likely=d, pessimistic=d + 2) for x, d in zip("ABCDE", (10, 6, 8, 5, 2))]
    acts[2] = acts[2].with_(start_no_earlier=5.0)
    acts[3] = acts[3].with_(finish_no_later=16.0)
    plan = Plan(Settings(start=MONDAY, distribution="fixed", deadline=18.0), acts, R3_LINKS)
    sched = analyze(plan).schedule
    res = simulate(plan, 300, seed=1)
    assert np.all(res.finish == sched.finish)
    assert res.criticality.tolist() == sched.critical.astype(float).tolist()
    assert np.all(res.sensitivity == 0) and np.all(res.sd == 0)


def test_cancel_raises_and_progress_is_reported():
    calls = []
    with pytest.raises(SimulationCancelled):
        simulate(r1_plan(), 5000, seed=1, block_size=1000, progress=lambda d, t: calls.append((d, t)),
                 cancel=lambda: len(calls) >= 2)
    assert calls == [(1024, 10000), (2048, 10000)]
    # nothing is left behind: a later run is the same as one in a fresh process would be
    assert np.array_equal(simulate(r1_plan(), 300, seed=1).finish, simulate(r1_plan(), 300, seed=1, block_size=64).finish)
    seen = []
    simulate(r1_plan(), 1000, seed=1, block_size=512, progress=lambda d, t: seen.append((d, t)))
    assert seen == [(512, 2000), (1000, 2000), (1512, 2000), (2000, 2000)]


def test_risk_event_fires_at_its_rate_and_explains_its_delay():
    acts = [Activity("Dig", duration=10), Activity("Pour", duration=5)]
    risks = [Risk("R1", "Rock found", 0.3, 4, 4, 4, ("Dig",)), Risk("R2", "Never", 0.0, 1, 2, 3, ("Pour",))]
    plan = Plan(Settings(start=MONDAY), acts, [Link("Dig", "Pour")], risks=risks)
    res = simulate(plan, 10_000, seed=8)
    rock, never = res.risk_report
    # binomial(10000, 0.3): sd 0.0046
    assert rock["fired"] == pytest.approx(0.3, abs=0.02) and rock["finish_impact"] == pytest.approx(4.0)
    assert never["fired"] == 0 and never["finish_impact"] is None
    assert set(np.unique(res.finish)) == {15.0, 19.0}
    assert res.criticality.tolist() == [1.0, 1.0]


def test_sensitivity_cruciality_and_ssi_match_their_definitions():
    plan = r1_plan()
    res = simulate(plan, 4000, seed=12, keep_durations=True)
    d, f = res.durations, res.finish
    for i in range(len(plan)):
        if d[i].std() == 0:
            assert res.sensitivity[i] == 0 and res.cruciality[i] == 0
            continue
        # scipy.stats.spearmanr / numpy.corrcoef on the kept samples
        assert res.sensitivity[i] == pytest.approx(stats.spearmanr(d[i], f).statistic, abs=0.01)
        assert res.cruciality[i] == pytest.approx(np.corrcoef(d[i], f)[0, 1], abs=1e-9)
        assert res.ssi[i] == pytest.approx(res.criticality[i] * d[i].std() / f.std(), rel=1e-9)


def test_percentiles_odds_and_distribution_views_agree():
    res = simulate(r1_plan(), 5000, seed=2, deadline=46)
    s = np.sort(res.finish)
    for key, value in res.percentiles.items():
        p = int(key[1:]) / 100
        assert np.mean(s <= value) >= p and np.mean(s < value) < p
    assert res.prob_between(res.percentile(20), res.percentile(80)) == pytest.approx(0.6, abs=2 / 5000)
    counts, edges = res.histogram(30)
    assert counts.sum() == 5000 and edges[0] == s[0] and edges[-1] == s[-1]
    x, F = res.ecdf()
    assert F[-1] == 1.0 and np.all(np.diff(x) > 0)
    lo, hi = res.percentile_interval(80)
    assert lo <= res.percentile(80) <= hi


def test_percentile_interval_covers_a_known_quantile():
    # One uniform activity on [0, 100]: the true P80 is 80 (order-statistic interval, 95 %).
    plan = Plan(Settings(start=MONDAY), [Activity("U", optimistic=0, most_likely=50, pessimistic=100, distribution="uniform")])
    hits = sum(lo <= 80 <= hi for lo, hi in (simulate(plan, 400, seed=s).percentile_interval(80) for s in range(40)))
    assert hits >= 34  # binomial(40, 0.95): P(hits < 34) < 0.01


def test_deadline_as_a_date_uses_the_plan_calendar():
    plan = r1_plan()                       # weeks, starting Monday 2027-01-04
    by_date = simulate(plan, 2000, seed=6, deadline=dt.date(2027, 11, 26))
    # 2027-11-26 is a Friday: the end of week 47 counted from the start (WorkCalendar.offset_through)
    assert by_date.deadline == pytest.approx(47.0)
    assert by_date.to_dict()["deadline_date"] == "2027-11-26"
    assert by_date.prob_by(47) == simulate(plan, 2000, seed=6, deadline=47).prob_by(47)


def test_to_dict_is_json_with_the_contract_keys():
    data = simulate(r1_plan(), 1000, seed=4, deadline=47).to_dict()
    json.dumps(data)
    for key in ("iterations", "seed", "mean", "sd", "percentiles", "percentile_dates", "probability",
                "criticality", "sensitivity", "merge_bias", "pert_mean", "convergence"):
        assert key in data, key
    assert {"P10", "P50", "P80", "P90"} <= set(data["percentiles"]) and set(data["criticality"]) == set("ABCDEFGHIJKLMN")
    assert data["iterations"] == 1000 and data["seed"] == 4


def test_near_critical_paths_of_r1():
    # R1 (computed values in reference-cases.md): 44/9, 43/8, 42/8.56, 40/11.22; plus
    # A-B-C-I-J-K-N, 2+4+10+7+8+4+6 = 41 with variance 1/9+1+4+1+1+0+4/9 = 7.56 (by hand).
    res = simulate(r1_plan(), 64, seed=1)
    got = [("".join(p["ids"]), p["mean"], round(p["variance"], 2)) for p in res.near_critical(4.0)]
    assert got == [("ABCEFJLN", 44, 9.0), ("ABCEFJKN", 43, 8.0), ("ABCIJLN", 42, 8.56),
                   ("ABCIJKN", 41, 7.56), ("ABCDGHM", 40, 11.22)]
    assert [p["ids"] for p in res.near_critical(1.5)] == [list("ABCEFJLN"), list("ABCEFJKN")]


def test_near_critical_paths_end_at_the_last_activity_they_drive():
    # Demo plan: the opening milestone O3 follows O2; a path is listed once, through O3.
    from workbench.core.demo import demo_plan
    res = simulate(demo_plan(), 64, seed=1)
    paths = res.near_critical(15.0, limit=30)
    ids = [tuple(p["ids"]) for p in paths]
    assert len(set(ids)) == len(ids)
    assert not any(a != b and b[: len(a)] == a for a in ids for b in ids)   # no path stops short of another
    assert all(p[-1] == "O3" or p[-1] == "X1" for p in ids)               # the plan's two activities without successors
    assert ids[0] == tuple(res.schedule.paths[0]) and paths[0]["gap"] == 0.0


def test_a_path_may_end_where_its_own_finish_comes_last():
    # A (10) starts B (2) start-to-start: A's finish drives the project, B's path is 8 shorter.
    acts = [Activity("A", duration=10), Activity("B", duration=2), Activity("M", duration=0)]
    plan = Plan(Settings(start=MONDAY), acts, [Link("A", "B", "SS", 0), Link("B", "M")])
    res = simulate(plan, 1, seed=1)
    assert [(p["ids"], p["mean"]) for p in res.near_critical(9.0)] == [(["A"], 10.0), (["A", "B", "M"], 2.0)]
    assert [p["ids"] for p in res.near_critical(1.0)] == [["A"]]


@pytest.mark.parametrize("limit", [1, 2, 3, 5])
def test_a_limited_list_holds_the_longest_paths(limit):
    # R1: the search stops after ``limit`` paths, and they are the longest ones.
    res = simulate(r1_plan(), 64, seed=1)
    every = res.near_critical(50.0, limit=1000)
    assert [p["ids"] for p in res.near_critical(50.0, limit=limit)] == [p["ids"] for p in every[:limit]]
    assert sorted("".join(p["ids"]) for p in every) == sorted(R1_PATHS)


@pytest.mark.parametrize("kwargs,risk,text", [
    ({"iterations": 0}, None, "iterations"),
    ({"iterations": -3}, None, "iterations"),
    ({"iterations": 2.5}, None, "iterations"),
    ({"iterations": 10, "distribution": "lognormal"}, None, "unknown distribution"),
    ({"iterations": 10, "seed": -1}, None, "seed"),
    ({"iterations": 10, "deadline": "soon"}, None, "deadline"),
    ({"iterations": 10, "deadline": float("inf")}, None, "deadline"),
    ({"iterations": 10}, Risk("Flood", "", 1.5, 1, 2, 3, ("A",)), "probability"),
    ({"iterations": 10}, Risk("Flood", "", 0.5, 1, 2, 3, ("Nowhere",)), "unknown activity 'Nowhere'"),
    ({"iterations": 10}, Risk("Flood", "", 0.5, 3, 2, 1, ("A",)), "estimates must satisfy"),
])
def test_bad_input_raises_plan_error_naming_the_culprit(kwargs, risk, text):
    plan = r1_plan()
    if risk:
        plan.risks.append(risk)
    with pytest.raises(PlanError, match=text) as err:
        simulate(plan, **kwargs)
    if risk:
        assert err.value.culprit == "Flood"
