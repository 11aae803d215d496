"""Property tests: with fixed durations every simulated iteration is the critical-path schedule."""

import datetime as dt

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from benchmarks.random_networks import layered_network, to_plan
from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.core.montecarlo import simulate

MONDAY = dt.date(2027, 1, 4)
TYPES = ("FS", "SS", "FF", "SF")
FAST = settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@st.composite
def fixed_plans(draw, max_n=10):
    """Random acyclic plans, all link types and lags, some constraints and a deadline; the
    estimates differ but the plan's distribution is 'fixed' (te), or single durations."""
    n = draw(st.integers(1, max_n))
    rank = draw(st.permutations(range(n)))
    acts = []
    for i in range(n):
        m = draw(st.sampled_from([0, 1, 2, 3, 5, 8]))
        if draw(st.booleans()):
            act = Activity(f"T{i}", optimistic=m, most_likely=m + 1, pessimistic=m + draw(st.integers(1, 6)))
        else:
            act = Activity(f"T{i}", duration=m)
        if draw(st.integers(0, 4)) == 0:
            act = act.with_(start_no_earlier=float(draw(st.integers(0, 10))))
        if draw(st.integers(0, 4)) == 0:
            act = act.with_(finish_no_later=float(draw(st.integers(3, 30))))
        acts.append(act)
    pairs = [(i, j) for i in range(n) for j in range(n) if rank[i] < rank[j]]
    chosen = draw(st.lists(st.sampled_from(pairs), unique=True, max_size=3 * n)) if pairs else []
    links = [Link(f"T{i}", f"T{j}", draw(st.sampled_from(TYPES)), float(draw(st.integers(-4, 6)))) for i, j in chosen]
    deadline = draw(st.one_of(st.none(), st.integers(5, 40).map(float)))
    return Plan(Settings(title="random", start=MONDAY, distribution="fixed", deadline=deadline), acts, links)


@FAST
@given(fixed_plans(), st.integers(1, 300), st.sampled_from([None, 64, 128]))
def test_fixed_simulation_equals_the_cpm_engine(plan, iterations, block):
    sched = analyze(plan).schedule
    res = simulate(plan, iterations, seed=1, block_size=block)
    assert np.all(res.finish == sched.finish)
    assert np.array_equal(res.criticality, sched.critical.astype(float))
    assert abs(res.merge_bias) < 1e-9 and res.sd < 1e-9


@settings(max_examples=8, deadline=None)
@given(st.integers(0, 10_000))
def test_generated_networks_with_all_link_types(seed):
    # benchmarks.random_networks layered DAG with mixed FS/SS/FF/SF links and lags.
    plan = to_plan(layered_network(120, seed=seed, link_types=True))
    plan.settings.distribution = "fixed"
    sched = analyze(plan).schedule
    res = simulate(plan, 130, seed=seed)
    assert np.all(res.finish == sched.finish)
    assert np.array_equal(res.criticality, sched.critical.astype(float))


@settings(max_examples=8, deadline=None)
@given(st.integers(0, 10_000))
def test_uncertain_finish_never_beats_the_optimistic_schedule(seed):
    # Every sampled duration lies in [a, b], and the finish is monotone in the durations
    # for finish-to-start links (common practice), so it lies between the two CPM schedules.
    net = layered_network(80, seed=seed)
    plan = to_plan(net)
    res = simulate(plan, 200, seed=seed)
    lo = [a.with_(optimistic=None, most_likely=None, pessimistic=None, duration=a.optimistic) for a in plan.activities]
    hi = [a.with_(optimistic=None, most_likely=None, pessimistic=None, duration=a.pessimistic) for a in plan.activities]
    f_lo = analyze(Plan(plan.settings, lo, plan.links)).schedule.finish
    f_hi = analyze(Plan(plan.settings, hi, plan.links)).schedule.finish
    assert f_lo - 1e-9 <= res.finish.min() and res.finish.max() <= f_hi + 1e-9
