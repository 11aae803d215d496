"""Block passes (activities × iterations, in place) against the one-dimensional engine.

Every column of a block must equal the critical-path engine run on that column's durations,
bit for bit: finish, and criticality counted with the simulation's rule (total float LS − ES
within the finish margin, plus 1e-9).
"""

import datetime as dt

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from benchmarks.random_networks import layered_network, te
from workbench.core import Activity, Link, Plan, Settings
from workbench.core.analysis import moments
from workbench.core.block_passes import EPS, BlockPasses
from workbench.core.calendar import WorkCalendar
from workbench.core.cpm import Analyzer
from workbench.core.demo import demo_plan
from workbench.core.network import compile_network, compile_plan

MONDAY = dt.date(2027, 1, 4)
TYPES = ("FS", "SS", "FF", "SF")
FAST = settings(max_examples=80, deadline=None, suppress_health_check=[HealthCheck.too_slow])


def column_by_column(analyzer: Analyzer, d: np.ndarray, deadline, valid: int):
    """Finish of every column and critical counts over the first ``valid`` columns, one
    column at a time through Analyzer.run (the 1-D engine)."""
    finish, counts = [], np.zeros(d.shape[0], dtype=np.int64)
    for k in range(d.shape[1]):
        s = analyzer.run(d[:, k].copy(), deadline=deadline, paths=False)
        finish.append(s.finish)
        ref = s.finish if deadline is None else deadline
        if k < valid:
            counts += (s.ls - s.es) <= ref - s.finish + EPS
    return np.array(finish), counts


def check_block(analyzer: Analyzer, d: np.ndarray, deadline=None, valid=None, passes=None):
    passes = passes or BlockPasses(analyzer.net, analyzer.floor, analyzer.fnlt)
    valid = d.shape[1] if valid is None else valid
    finish, counts = passes.run(d, deadline, valid)
    want_finish, want_counts = column_by_column(analyzer, d, deadline, valid)
    assert np.array_equal(finish, want_finish)
    assert np.array_equal(counts, want_counts)
    return passes


@st.composite
def blocks(draw, max_n=10):
    """A random acyclic network (all link types, lags, parallel links), start floors,
    finish-no-later bounds, a deadline or none, and a block of random durations."""
    n = draw(st.integers(1, max_n))
    rank = draw(st.permutations(range(n)))
    pairs = [(i, j) for i in range(n) for j in range(n) if rank[i] < rank[j]]
    chosen = draw(st.lists(st.sampled_from(pairs), max_size=3 * n)) if pairs else []   # repeats allowed
    types = [TYPES.index(draw(st.sampled_from(TYPES))) for _ in chosen]
    lags = [float(draw(st.integers(-4, 6))) for _ in chosen]
    src = np.array([i for i, _ in chosen], dtype=np.int64)
    dst = np.array([j for _, j in chosen], dtype=np.int64)
    net = compile_network([f"T{i}" for i in range(n)], src, dst, np.array(lags), np.array(types, dtype=np.int64))
    floor = np.array([draw(st.sampled_from([0.0, 0.0, 0.0, 3.0, 7.5])) for _ in range(n)])
    fnlt = np.array([draw(st.sampled_from([np.inf, np.inf, np.inf, 12.0, 20.5])) for _ in range(n)])
    width = draw(st.integers(1, 9))
    seed = draw(st.integers(0, 2**32 - 1))
    d = np.random.default_rng(seed).choice([0.0, 0.5, 1.0, 2.0, 3.3, 5.0, 8.0], size=(n, width))
    deadline = draw(st.one_of(st.none(), st.sampled_from([4.0, 15.0, 30.0])))
    return Analyzer(net, floor, fnlt), d, deadline, draw(st.integers(0, width))


@FAST
@given(blocks())
def test_every_column_equals_the_one_dimensional_engine(case):
    analyzer, d, deadline, valid = case
    check_block(analyzer, d, deadline, valid)


def test_generated_networks_with_and_without_link_types():
    # benchmarks.random_networks layered DAGs; widths around the chunk size and odd ones.
    for seed, mixed in ((3, False), (4, True), (5, True)):
        net = layered_network(300, seed=seed, link_types=mixed)
        compiled = compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])
        rng = np.random.default_rng(seed)
        floor = np.where(rng.random(300) < 0.1, rng.uniform(0, 40, 300), 0.0)
        fnlt = np.where(rng.random(300) < 0.1, rng.uniform(30, 90, 300), np.inf)
        analyzer = Analyzer(compiled, floor, fnlt)
        for width, deadline in ((1, None), (37, 70.0), (70, None)):
            d = te(net)[:, None] * rng.uniform(0.3, 1.8, size=(300, width))
            check_block(analyzer, d, deadline, valid=width - width // 3)


def test_buffers_are_reused_across_block_widths():
    plan = demo_plan()
    analyzer = Analyzer.for_plan(plan, WorkCalendar(plan.settings))
    rng = np.random.default_rng(9)
    mean = moments(plan)[0]
    passes = None
    for width in (64, 5, 128, 64):        # grows, shrinks, grows again
        d = mean[:, None] * rng.uniform(0.5, 2.0, size=(mean.size, width))
        passes = check_block(analyzer, d, None, passes=passes)


def test_groups_are_prefixes_of_their_level():
    # Each link group updates the first rows of its level, and reads rows already final.
    net = compile_plan(demo_plan())
    passes = BlockPasses(net, np.zeros(net.size), np.full(net.size, np.inf))
    for order, earlier in ((passes.fwd, lambda rows, a, b: rows < a), (passes.bwd, lambda rows, a, b: rows >= b)):
        assert sorted(order.nodes.tolist()) == list(range(net.size))
        for a, b, plain, other in order.levels:
            sizes = [c for c, _, _ in plain + other]
            assert all(c <= b - a for c in sizes)
            assert all(earlier(rows, a, b).all() for _, rows, _ in plain + other)
        links = sum(len(rows) for _, _, plain, other in order.levels for _, rows, _ in plain + other)
        assert links == net.src.size


def test_empty_and_unlinked_plans():
    empty = Analyzer(compile_network([], np.zeros(0), np.zeros(0), np.zeros(0), np.zeros(0)))
    finish, counts = BlockPasses(empty.net, empty.floor, empty.fnlt).run(np.zeros((0, 3)), None)
    assert finish.tolist() == [0.0, 0.0, 0.0] and counts.size == 0
    acts = [Activity("A", duration=4), Activity("B", duration=6, start_no_earlier=1.0)]
    analyzer = Analyzer.for_plan(Plan(Settings(start=MONDAY), acts, []))
    d = np.array([[4.0, 9.0, 2.0], [6.0, 1.0, 1.0]])
    finish, counts = BlockPasses(analyzer.net, analyzer.floor, analyzer.fnlt).run(d, None)
    # B (start 1) finishes last in columns 0 and 2, A in columns 1 and 2 (a tie at 2).
    assert finish.tolist() == [7.0, 9.0, 2.0] and counts.tolist() == [2, 2]
    check_block(analyzer, d, deadline=8.0)


def test_parallel_links_between_two_activities():
    # Start-to-start and finish-to-finish between the same pair (as in the demo plan).
    acts = [Activity("A", duration=10), Activity("B", duration=4)]
    links = [Link("A", "B", "SS", 2), Link("A", "B", "FF", 3)]
    analyzer = Analyzer.for_plan(Plan(Settings(start=MONDAY), acts, links))
    d = np.array([[10.0, 2.0, 10.0], [4.0, 4.0, 20.0]])
    passes = check_block(analyzer, d)
    # B starts at max(2, 10 + 3 − 4) = 9 and ends at 13; then max(2, 2 + 3 − 4) = 2, ends 6;
    # then max(2, 13 − 20) = 2, ends 22 (by hand).
    assert passes.run(d, None)[0].tolist() == [13.0, 6.0, 22.0]
