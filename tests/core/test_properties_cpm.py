"""Property tests of the critical-path engine on random networks (hypothesis).

Independent references: networkx.dag_longest_path_length for FS networks, and the link
rules of precedence diagramming (common practice) checked one link at a time.
"""

import datetime as dt
import os

import networkx as nx
import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from benchmarks.random_networks import layered_network, te, to_plan
from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.core.calendar import WorkCalendar

TOL = 1e-7
TYPES = ("FS", "SS", "FF", "SF")
MONDAY = dt.date(2027, 1, 4)
# SLACKLINE_EXAMPLES=2000 runs a deeper search than the default.
EXAMPLES = int(os.environ.get("SLACKLINE_EXAMPLES", "120"))
FAST = settings(max_examples=EXAMPLES, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@st.composite
def plans(draw, link_types=True, lags=True, max_n=12):
    """A random acyclic plan: links only from lower to higher rank, ranks shuffled."""
    n = draw(st.integers(1, max_n))
    rank = draw(st.permutations(range(n)))
    durations = draw(st.lists(st.sampled_from([0, 0.5, 1, 2, 3, 5, 8, 13]), min_size=n, max_size=n))
    acts = [Activity(f"T{i}", duration=d) for i, d in enumerate(durations)]
    pairs = [(i, j) for i in range(n) for j in range(n) if rank[i] < rank[j]]
    chosen = draw(st.lists(st.sampled_from(pairs), unique=True, max_size=3 * n)) if pairs else []
    links = []
    for i, j in chosen:
        kind = draw(st.sampled_from(TYPES)) if link_types else "FS"
        lag = draw(st.integers(-4, 6)) if lags else 0
        links.append(Link(f"T{i}", f"T{j}", kind, float(lag)))
    return Plan(Settings(title="random", start=MONDAY), acts, links)


def _bounds(plan, sched):
    """Per link (succ index, lower bound on the successor's ES, pred index, upper bound on
    the predecessor's LS), from the link rules written out per type."""
    idx = {a: i for i, a in enumerate(sched.ids)}
    d = sched.durations
    es, ls = sched.es, sched.ls
    for link in plan.links:
        i, j, g = idx[link.pred], idx[link.succ], link.lag
        if link.type == "FS":
            yield i, j, es[i] + d[i] + g, ls[j] - g - d[i]        # ES_j >= EF_i + lag
        elif link.type == "SS":
            yield i, j, es[i] + g, ls[j] - g                      # ES_j >= ES_i + lag
        elif link.type == "FF":
            yield i, j, es[i] + d[i] + g - d[j], ls[j] + d[j] - g - d[i]  # EF_j >= EF_i + lag
        else:
            yield i, j, es[i] + g - d[j], ls[j] + d[j] - g        # EF_j >= ES_i + lag


@FAST
@given(plans())
def test_every_link_holds_forward_and_backward(plan):
    s = analyze(plan).schedule
    for i, j, es_low, ls_high in _bounds(plan, s):
        assert s.es[j] >= es_low - TOL, (plan.links, i, j)
        assert s.ls[i] <= ls_high + TOL, (plan.links, i, j)


@FAST
@given(plans())
def test_early_and_late_dates_are_tight(plan):
    """Each ES is the project start or a link's bound; each LS the finish or a link's bound."""
    s = analyze(plan).schedule
    low = {j: [0.0] for j in range(len(s.ids))}
    high = {i: [s.finish - s.durations[i]] for i in range(len(s.ids))}
    for i, j, es_low, ls_high in _bounds(plan, s):
        low[j].append(es_low)
        high[i].append(ls_high)
    for k in range(len(s.ids)):
        assert abs(s.es[k] - max(low[k])) <= TOL
        assert abs(s.ls[k] - min(high[k])) <= TOL


@FAST
@given(plans())
def test_floats_without_deadline(plan):
    s = analyze(plan).schedule
    assert s.finish == max(s.ef)
    assert np.all(s.es >= 0) and np.all(s.lf <= s.finish + TOL)
    assert np.all(s.total_float >= -TOL)
    assert np.all(s.ls >= s.es - TOL)
    assert np.all(s.free_float >= -TOL)
    assert np.all(s.free_float <= s.total_float + TOL)
    np.testing.assert_allclose(s.ef - s.es, s.durations)
    np.testing.assert_allclose(s.lf - s.ls, s.durations)


def _check_paths(plan, s):
    linked = {(l.pred, l.succ) for l in plan.links}
    idx = {a: i for i, a in enumerate(s.ids)}
    assert s.paths, "a non-empty plan has at least one critical path"
    for path in s.paths:
        assert abs(s.es[idx[path[0]]]) <= TOL                     # starts at the project start
        assert abs(s.ef[idx[path[-1]]] - s.finish) <= TOL         # ends at the project finish
        assert all((a, b) in linked for a, b in zip(path, path[1:]))
        assert all(s.critical[idx[a]] for a in path)


@FAST
@given(plans())
def test_critical_paths_chain_from_start_to_finish(plan):
    s = analyze(plan).schedule
    if not s.paths_truncated:
        _check_paths(plan, s)


@FAST
@given(plans(), st.integers(1, 10))
def test_deadline_before_finish_gives_negative_float(plan, miss):
    free = analyze(plan).schedule
    deadline = free.finish - miss
    s = analyze(plan, deadline=deadline).schedule
    np.testing.assert_allclose(s.total_float, free.total_float - miss, atol=TOL)
    idx = {a: i for i, a in enumerate(s.ids)}
    for path in s.paths:
        for a in path:
            assert abs(s.total_float[idx[a]] - (deadline - s.finish)) <= TOL
    np.testing.assert_allclose(s.es, free.es)  # a deadline never moves early dates


@FAST
@given(plans(link_types=False, lags=False, max_n=15))
def test_fs_duration_equals_networkx_longest_path(plan):
    # Reference: networkx.dag_longest_path_length with each activity's te on its out-edges.
    graph = nx.DiGraph()
    graph.add_node("start")
    for act in plan.activities:
        graph.add_edge("start", act.id, weight=0.0)
        graph.add_edge(act.id, "end", weight=act.mean)
    for link in plan.links:
        graph.add_edge(link.pred, link.succ, weight=plan.activity(link.pred).mean)
    assert abs(analyze(plan).schedule.finish - nx.dag_longest_path_length(graph)) <= TOL


@settings(max_examples=max(25, EXAMPLES // 5), deadline=None)
@given(st.integers(0, 10_000), st.integers(20, 400), st.integers(1, 4))
def test_layered_network_matches_networkx(seed, n, preds):
    # Reference: networkx.dag_longest_path_length on te weights, generated FS networks.
    net = layered_network(n, preds=preds, seed=seed)
    durations = te(net)
    graph = nx.DiGraph()
    graph.add_weighted_edges_from((-1, i, 0.0) for i in range(n))
    graph.add_weighted_edges_from((i, n, durations[i]) for i in range(n))
    graph.add_weighted_edges_from(zip(net["src"].tolist(), net["dst"].tolist(), durations[net["src"]].tolist()))
    s = analyze(to_plan(net)).schedule
    assert abs(s.finish - nx.dag_longest_path_length(graph)) <= 1e-6
    _check_paths(to_plan(net), s)


@settings(max_examples=max(15, EXAMPLES // 8), deadline=None)
@given(st.integers(0, 10_000), st.integers(20, 300))
def test_layered_network_with_all_link_types(seed, n):
    net = layered_network(n, seed=seed, link_types=True)
    plan = to_plan(net)
    s = analyze(plan).schedule
    assert set(net["types"].tolist()) <= {0, 1, 2, 3} and (net["lag"] < 0).any() or n < 50
    for i, j, es_low, ls_high in _bounds(plan, s):
        assert s.es[j] >= es_low - TOL and s.ls[i] <= ls_high + TOL
    assert np.all(s.free_float <= s.total_float + TOL) and np.all(s.total_float >= -TOL)
    if not s.paths_truncated:
        _check_paths(plan, s)


@st.composite
def constrained(draw):
    plan = draw(plans())
    acts = []
    for act in plan.activities:
        snet = draw(st.none() | st.integers(0, 30))
        fnlt = draw(st.none() | st.integers(0, 60))
        acts.append(act.with_(start_no_earlier=None if snet is None else float(snet),
                              finish_no_later=None if fnlt is None else float(fnlt)))
    return Plan(plan.settings, acts, plan.links)


@FAST
@given(constrained())
def test_offset_constraints_honoured(plan):
    s = analyze(plan).schedule
    for k, act in enumerate(plan.activities):
        if act.start_no_earlier is not None:
            assert s.es[k] >= act.start_no_earlier - TOL
        if act.finish_no_later is not None:
            assert s.lf[k] <= act.finish_no_later + TOL
    for i, j, es_low, ls_high in _bounds(plan, s):
        assert s.es[j] >= es_low - TOL and s.ls[i] <= ls_high + TOL
    assert np.all(s.lf <= s.finish + TOL)


@FAST
@given(plans(), st.integers(0, 40), st.integers(0, 80), st.data())
def test_date_constraints_honoured(plan, start_day, finish_day, data):
    cal = WorkCalendar(plan.settings)
    k = data.draw(st.integers(0, len(plan) - 1))
    act = plan.activities[k]
    snet = MONDAY + dt.timedelta(days=start_day)
    fnlt = MONDAY + dt.timedelta(days=finish_day)
    plan.replace_activity(act.id, act.with_(start_no_earlier=snet, finish_no_later=fnlt))
    a = analyze(plan)
    s = a.schedule
    if s.durations[k] > 0:                # starts on or after the date (milestones are
        assert a.calendar.start_date(s.es[k]) >= snet   # dated by the day that ends there)
    assert s.es[k] >= cal.offset_before(snet) - TOL
    assert s.lf[k] <= cal.offset_through(fnlt) + TOL
    assert a.dates()["late_finish"][k].astype(dt.date) <= fnlt
