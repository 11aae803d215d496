"""The engine's edges: long chains, loops, bad links, ties, zero variance, re-runs."""

import datetime as dt
import json
import math

import numpy as np
import pytest

from benchmarks.random_networks import chain, layered_network, te
from workbench.core import (Activity, Analyzer, CycleError, Link, Plan, PlanError, Settings, analyze,
                            compile_network)

MONDAY = dt.date(2027, 1, 4)


def _plan(acts, links, **settings):
    return Plan(Settings(title="t", start=MONDAY, **settings), acts, links)


def test_hundred_thousand_chain_without_recursion():
    net = chain(100_000)
    compiled = compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])
    s = Analyzer(compiled).run(te(net))
    assert s.finish == 100_000.0
    assert s.es[-1] == 99_999.0 and s.critical.all()
    assert s.paths == [net["ids"]]


def test_loop_is_reported_in_order():
    acts = [Activity(x, duration=1) for x in "PQRS"]
    links = [Link("S", "P"), Link("P", "Q"), Link("Q", "R"), Link("R", "P")]
    with pytest.raises(CycleError) as err:
        analyze(_plan(acts, links))
    loop = err.value.loop
    assert loop[0] == loop[-1] and sorted(loop[:-1]) == ["P", "Q", "R"]
    assert "the links form a loop" in str(err.value) and " \u2192 ".join(loop) in str(err.value)


def test_self_link_and_unknown_activity_are_named():
    with pytest.raises(PlanError, match="X is linked to itself"):
        compile_network(["X"], np.array([0]), np.array([0]), np.zeros(1), np.zeros(1, dtype=int))
    with pytest.raises(PlanError, match="unknown activity 'Z'"):
        _plan([Activity("A", duration=1)], [Link("A", "Z")])


def _diamond(var_b, var_c):
    """A -> B -> D and A -> C -> D with B and C of equal mean 10 but different spread."""
    def est(v):
        half = 3 * math.sqrt(v)
        return dict(optimistic=10 - half, most_likely=10, pessimistic=10 + half)
    acts = [Activity("A", duration=2), Activity("B", **est(var_b)), Activity("C", **est(var_c)),
            Activity("D", duration=1)]
    return _plan(acts, [Link("A", "B"), Link("A", "C"), Link("B", "D"), Link("C", "D")])


@pytest.mark.parametrize("var_b, var_c, path", [(1.0, 4.0, "ACD"), (4.0, 1.0, "ABD")])
def test_tied_paths_use_the_largest_variance_and_say_so(var_b, var_c, path):
    a = analyze(_diamond(var_b, var_c))
    assert a.schedule.finish == pytest.approx(13.0)
    assert sorted("".join(p) for p in a.schedule.paths) == ["ABD", "ACD"]
    assert "".join(a.pert.path) == path
    assert a.pert.variance == pytest.approx(max(var_b, var_c))
    assert a.pert.tied == 2 and "2 critical paths tie" in a.pert.note and "-".join(path) in a.pert.note
    assert a.to_dict()["pert"]["note"] == a.pert.note


def test_many_ties_are_capped_but_the_best_path_is_found():
    # 2**12 tied paths: a ladder of parallel pairs; one rung has a larger variance.
    acts, links, prev = [Activity("S", duration=0)], [], ["S"]
    for k in range(12):
        spread = 3.0 if k == 7 else 1.0
        pair = [Activity(f"U{k}", duration=5), Activity(f"V{k}", optimistic=5 - spread, most_likely=5,
                                                       pessimistic=5 + spread)]
        acts += pair
        links += [Link(p, q.id) for p in prev for q in pair]
        prev = [q.id for q in pair]
    a = analyze(_plan(acts, links))
    assert a.schedule.paths_truncated and len(a.schedule.paths) == 64
    assert "V7" in a.pert.path and a.pert.variance == pytest.approx(1.0 + 11 / 9)
    assert "+ critical paths tie" in a.pert.note


def test_zero_variance_gives_steps_never_nan():
    acts = [Activity("A", duration=3), Activity("B", duration=4)]
    a = analyze(_plan(acts, [Link("A", "B")], deadline=7.0))
    p = a.pert
    assert (p.variance, p.sd) == (0.0, 0.0)
    assert p.prob_by(7.0) == 1.0 and p.prob_by(6.99) == 0.0 and p.prob_after(7.0) == 0.0
    assert p.z(7.0) == 0.0 and p.z(8.0) == math.inf and p.z(6.0) == -math.inf
    assert p.duration_at(0.5) == 7.0 and p.prob_between(6.0, 8.0) == 1.0
    text = json.dumps(a.to_dict(), allow_nan=False)   # raises on NaN/inf
    assert json.loads(text)["pert"]["probability"] == 1.0


def test_duration_at_rejects_impossible_probabilities():
    p = analyze(_diamond(1.0, 1.0)).pert
    for bad in (0.0, 1.0, -0.1, 1.5):
        with pytest.raises(ValueError, match="strictly between 0 and 1"):
            p.duration_at(bad)


def test_rerun_after_duration_change_matches_a_fresh_compile():
    net = layered_network(2_000, seed=3, link_types=True)
    compiled = compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])
    analyzer = Analyzer(compiled)
    analyzer.run(te(net))
    d = te(net)
    d[::7] *= 1.5
    again = analyzer.run(d)
    fresh = Analyzer(compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])).run(d)
    for field in ("es", "ls", "total_float", "free_float", "critical"):
        np.testing.assert_array_equal(getattr(again, field), getattr(fresh, field))
    assert again.paths == fresh.paths and again.finish == fresh.finish
    from workbench.core.pert import pert_odds
    variances = ((net["pessimistic"] - net["optimistic"]) / 6.0) ** 2
    for _ in range(2):   # the second call is answered from the remembered path
        assert pert_odds(again, variances) == pert_odds(fresh, variances)
    assert pert_odds(again, variances * 0 + 1).path == pert_odds(fresh, variances * 0 + 1).path


def test_two_dimensional_durations_match_column_by_column():
    net = layered_network(300, seed=5, link_types=True)
    compiled = compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])
    rng = np.random.default_rng(1)
    block = te(net)[:, None] * rng.uniform(0.5, 1.5, size=(300, 6))
    from workbench.core.cpm import forward
    es = forward(compiled, compiled.link_offsets(block), np.zeros((300, 6)))
    analyzer = Analyzer(compiled)
    for k in range(6):
        np.testing.assert_allclose(es[:, k], analyzer.run(block[:, k], paths=False).es)


def test_empty_plan():
    a = analyze(_plan([], []))
    assert a.schedule.finish == 0.0 and a.pert.path == ()
    assert a.finish_date == MONDAY


def test_reanalysis_of_an_edited_plan_matches_a_fresh_one():
    from benchmarks.random_networks import to_plan
    from workbench.core import Link
    plan = to_plan(layered_network(400, seed=11, link_types=True))
    first = analyze(plan)
    edits = [
        lambda p: p.replace_activity("A17", p.activity("A17").with_(most_likely=40.0, pessimistic=60.0)),
        lambda p: p.replace_activity("A200", p.activity("A200").with_(start_no_earlier=30.0)),
        lambda p: p.set_links(p.links[:-5]),
        lambda p: p.links.append(Link("A0", "A399", "FS", 500.0)),     # changed in place
        lambda p: p.replace_activity("A3", p.activity("A3").with_(id="A3x")),
    ]
    for edit in edits:
        edit(plan)
        again, fresh = analyze(plan), analyze(plan.copy())
        assert again.schedule.finish == fresh.schedule.finish
        np.testing.assert_array_equal(again.schedule.total_float, fresh.schedule.total_float)
        assert again.schedule.paths == fresh.schedule.paths and again.pert == fresh.pert
    assert analyze(plan).schedule.finish >= 500.0 > first.schedule.finish
