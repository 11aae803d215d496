"""Network layout (workbench.figures.network_layout): geometry facts on small and random plans."""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from workbench.core.analysis import analyze
from workbench.core.errors import CycleError
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.network import compile_network
from workbench.figures.network_layout import LayoutOptions, layout_plan, link_label
from workbench.figures.network_order import count_crossings, expand, naive_positions

EPS = 1e-6


def make_plan(n, pairs, groups=None, durations=None):
    acts = [Activity(id=f"N{i}", name=f"step {i}", group=(groups[i] if groups else ""),
                     duration=float(durations[i] if durations else 1 + i % 4)) for i in range(n)]
    return Plan(Settings(title="t"), acts, [Link(f"N{a}", f"N{b}") for a, b in pairs])


@st.composite
def dags(draw, max_n=18):
    n = draw(st.integers(1, max_n))
    perm = draw(st.permutations(range(n)))        # plan order differs from the logic order
    pairs = draw(st.sets(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=3 * n))
    links = sorted({(perm[a], perm[b]) for a, b in pairs if a < b})
    groups = [draw(st.sampled_from("xyz")) for _ in range(n)]
    return n, links, groups


def boxes_overlap(b):
    x, y, w, h = b[:, 0], b[:, 1], b[:, 2], b[:, 3]
    ox = (x[:, None] < x[None, :] + w[None, :] - EPS) & (x[None, :] < x[:, None] + w[:, None] - EPS)
    oy = (y[:, None] < y[None, :] + h[None, :] - EPS) & (y[None, :] < y[:, None] + h[:, None] - EPS)
    both = ox & oy
    np.fill_diagonal(both, False)
    return both.any()


def segment_enters(p, q, box):
    """True when segment p→q passes through the open interior of box (Liang–Barsky clip)."""
    x, y, w, h = box
    lo, hi = 0.0, 1.0
    d = (q[0] - p[0], q[1] - p[1])
    for delta, start, a, b in ((d[0], p[0], x, x + w), (d[1], p[1], y, y + h)):
        a, b = a + EPS, b - EPS
        if abs(delta) < 1e-12:
            if not a < start < b:
                return False
            continue
        t0, t1 = sorted(((a - start) / delta, (b - start) / delta))
        lo, hi = max(lo, t0), min(hi, t1)
    return hi - lo > 1e-9


def assert_clean(layout):
    assert not boxes_overlap(layout.boxes)
    layer = {n.id: n.layer for n in layout.nodes}
    for link in layout.links:
        assert layer[link.pred] < layer[link.succ]
        pts = link.points
        assert all(b[0] >= a[0] - EPS for a, b in zip(pts, pts[1:]))   # always rightward
        for p, q in zip(pts, pts[1:]):
            for box in layout.boxes:
                assert not segment_enters(p, q, box), (link.pred, link.succ, p, q, box)


@settings(max_examples=60, deadline=None)
@given(dags())
def test_random_plans_draw_cleanly(case):
    n, links, groups = case
    plan = make_plan(n, links, groups)
    assert_clean(layout_plan(plan))
    assert_clean(layout_plan(plan, analyze(plan), LayoutOptions(bands=True)))
    assert_clean(layout_plan(plan, analyze(plan), LayoutOptions(time_scaled=True)))


@settings(max_examples=60, deadline=None)
@given(dags(max_n=30))
def test_reduction_never_worse_than_plan_order(case):
    n, links, _ = case
    layout = layout_plan(make_plan(n, links))
    assert layout.crossings <= layout.naive_crossings


def brute_crossings(graph, pos):
    u, v, lay = graph.seg_u, graph.seg_v, graph.layer[graph.seg_u]
    count = 0
    for i in range(u.size):
        for j in range(i + 1, u.size):
            if lay[i] == lay[j] and (pos[u[i]] - pos[u[j]]) * (pos[v[i]] - pos[v[j]]) < 0:
                count += 1
    return count


@settings(max_examples=60, deadline=None)
@given(dags(max_n=14))
def test_crossing_count_matches_pairwise_count(case):
    n, links, _ = case
    arr = np.array(links, dtype=np.int64).reshape(-1, 2)
    net = compile_network([str(i) for i in range(n)], arr[:, 0], arr[:, 1], np.zeros(len(arr)),
                          np.zeros(len(arr), dtype=np.int64))
    layer = net.level.astype(np.int64)
    graph = expand(layer, arr[:, 0], arr[:, 1], np.zeros(n, dtype=np.int64))
    pos = naive_positions(graph, arr[:, 0])
    assert count_crossings(graph, pos) == brute_crossings(graph, pos)


def test_swapped_pair_is_untangled():
    # plan order puts N0 above N1 and N2 above N3, but N0 → N3 and N1 → N2: one crossing
    layout = layout_plan(make_plan(4, [(0, 3), (1, 2)]))
    assert layout.naive_crossings == 1
    assert layout.crossings == 0


def test_shuffled_tree_reaches_zero_crossings():
    rng = np.random.default_rng(7)
    n = 31
    perm = rng.permutation(n)                            # tree node k is plan row perm[k]
    pairs = [(int(perm[(k - 1) // 2]), int(perm[k])) for k in range(1, n)]
    layout = layout_plan(make_plan(n, pairs))
    assert layout.naive_crossings > 0
    assert layout.crossings == 0


def test_chain_is_straight():
    layout = layout_plan(make_plan(6, [(i, i + 1) for i in range(5)]))
    ys = {n.y for n in layout.nodes}
    xs = [n.x for n in layout.nodes]
    assert len(ys) == 1
    assert xs == sorted(xs) and len(set(xs)) == 6


def test_chain_beside_a_fork_stays_straight():
    # N0 → N1 → N2 → N3 is a chain; N0 also forks to N4 → N5
    layout = layout_plan(make_plan(6, [(0, 1), (1, 2), (2, 3), (0, 4), (4, 5)]))
    y = [n.y for n in layout.nodes]
    assert y[1] == pytest.approx(y[2]) == pytest.approx(y[3])
    assert y[4] == pytest.approx(y[5])


def test_duration_edit_keeps_the_layout():
    plan = make_plan(12, [(0, 2), (1, 2), (2, 5), (3, 5), (0, 7), (5, 9), (7, 9), (4, 11), (9, 11)])
    before = layout_plan(plan, analyze(plan))
    plan.replace_activity("N3", plan.activity("N3").with_(duration=40.0))
    after = layout_plan(plan, analyze(plan))
    assert [n[:7] for n in map(astuple_node, before.nodes)] == [n[:7] for n in map(astuple_node, after.nodes)]
    assert [l.points for l in before.links] == [l.points for l in after.links]
    assert any(b.critical != a.critical for b, a in zip(before.nodes, after.nodes))


def astuple_node(node):
    return (node.id, node.row, node.x, node.y, node.w, node.h, node.layer, node.critical)


def test_time_scaled_columns_follow_early_start():
    plan = make_plan(4, [(0, 1), (2, 3)], durations=[30, 1, 1, 1])
    plain = layout_plan(plan, analyze(plan))
    timed = layout_plan(plan, analyze(plan), LayoutOptions(time_scaled=True))
    assert plain.nodes[1].x == plain.nodes[3].x
    assert timed.nodes[1].x > timed.nodes[3].x


def test_group_bands_hold_their_nodes_and_do_not_overlap():
    groups = ["a", "b", "a", "c", "b", "c", "a", "b"]
    plan = make_plan(8, [(0, 1), (1, 2), (3, 4), (4, 5), (0, 6), (6, 7), (5, 7)], groups)
    layout = layout_plan(plan, None, LayoutOptions(bands=True))
    band = {b.name: b for b in layout.bands}
    assert list(band) == ["a", "b", "c"]
    for node, g in zip(layout.nodes, groups):
        b = band[g]
        assert b.y <= node.y and node.y + node.h <= b.y + b.h
    spans = sorted((b.y, b.y + b.h) for b in layout.bands)
    assert all(top >= bottom for (_, bottom), (top, _) in zip(spans, spans[1:]))


def test_critical_links_on_the_nine_activity_example():
    # Hendrickson, Project Management for Construction, ch. 10 nine-activity example:
    # critical path A-C-F-I (see reference-cases.md R2)
    d = dict(A=4, B=3, C=8, D=7, E=9, F=12, G=2, H=5, I=6)
    preds = dict(C="A", D="A", E="BC", F="BC", G="DE", H="DE", I="FG")
    acts = [Activity(id=k, duration=float(v)) for k, v in d.items()]
    links = [Link(p, s) for s, ps in preds.items() for p in ps]
    plan = Plan(Settings(title="R2"), acts, links)
    layout = layout_plan(plan, analyze(plan))
    crit = {(l.pred, l.succ) for l in layout.links if l.critical}
    assert crit == {("A", "C"), ("C", "F"), ("F", "I")}
    assert {n.id for n in layout.nodes if n.critical} == set("ACFI")


def test_link_labels():
    assert link_label("FS", 0) == ""
    assert link_label("SS", 2) == "SS +2"
    assert link_label("FF", -1.5) == "FF \u22121.5"
    assert link_label("FS", 3) == "FS +3"
    assert link_label("SF", 0) == "SF"


def test_labels_sit_on_the_link_near_its_arrow():
    plan = Plan(Settings(title="t"), [Activity(id="A", duration=2.0), Activity(id="B", duration=3.0)],
                [Link("A", "B", "SS", 2.0)])
    link = layout_plan(plan).links[0]
    assert link.label == "SS +2"
    (x0, _), (x1, _) = link.points[-2], link.points[-1]
    assert x0 < link.label_at[0] < x1


def test_a_loop_is_reported():
    plan = make_plan(3, [(0, 1), (1, 2)])
    plan.links.append(Link("N2", "N0"))
    with pytest.raises(CycleError):
        layout_plan(plan)


def test_empty_plan():
    layout = layout_plan(Plan(Settings(title="empty")))
    assert layout.nodes == [] and layout.links == []


@settings(max_examples=60, deadline=None)
@given(dags(max_n=24))
def test_adjacent_exchange_never_adds_crossings(case):
    from workbench.figures.network_exchange import exchange_pass
    from workbench.figures.network_order import Sweeper

    n, links, groups = case
    arr = np.array(links, dtype=np.int64).reshape(-1, 2)
    net = compile_network([str(i) for i in range(n)], arr[:, 0], arr[:, 1], np.zeros(len(arr)),
                          np.zeros(len(arr), dtype=np.int64))
    band = np.array(["xyz".index(g) for g in groups], dtype=np.int64)
    graph = expand(net.level.astype(np.int64), arr[:, 0], arr[:, 1], band)
    pos = naive_positions(graph, arr[:, 0])
    sweeper = Sweeper(graph)
    before = count_crossings(graph, pos)
    exchange_pass(sweeper.members, [sweeper.down, sweeper.up], graph.band, pos)
    assert count_crossings(graph, pos) <= before
    for items in graph.members():
        assert sorted(pos[items].tolist()) == list(range(items.size))
        ranks = pos[items]
        assert all(graph.band[a] <= graph.band[b] for a, b in zip(items[np.argsort(ranks)], items[np.argsort(ranks)][1:]))


def test_node_texts_and_number_format():
    from workbench.core.model import Settings as S
    from workbench.figures.network_labels import node_texts, number

    assert number(3.0) == "3" and number(12.0) == "12" and number(2.26) == "2.3"
    assert number(-0.0) == "0" and number(-1.5) == "\u22121.5"
    acts = [Activity(id="A", name="Pour slab", optimistic=2.0, most_likely=3.0, pessimistic=10.0),
            Activity(id="B", name="Cure", duration=4.0)]
    plan = Plan(S(title="t", deadline=6.0), acts, [Link("A", "B")])
    texts = node_texts(plan, analyze(plan))
    a, b = texts
    assert (a.id, a.name, a.te, a.es, a.ef) == ("A", "Pour slab", "4", "0", "4")
    assert (b.es, b.ef, b.lf) == ("4", "8", "6")
    assert b.total_float == "\u22122" and b.negative       # deadline 6, finish 8: float −2
    assert node_texts(plan)[0].es == ""                     # without an analysis: no dates


def test_find_nodes_order():
    from workbench.figures.network_labels import find_nodes

    plan = Plan(Settings(title="t"), [Activity(id="W1", name="Wall", duration=1.0),
                                      Activity(id="W10", name="Window", duration=1.0),
                                      Activity(id="R", name="Roof over w1 wall", duration=1.0)])
    assert find_nodes(plan, "w1") == ["W1", "W10", "R"]
    assert find_nodes(plan, "  ") == []
    assert find_nodes(plan, "zzz") == []


def test_arrow_steps_follow_links_and_columns():
    from workbench.figures.network_nav import step

    # N0 → N1, N0 → N2, N1 → N3, N2 → N3
    layout = layout_plan(make_plan(4, [(0, 1), (0, 2), (1, 3), (2, 3)]))
    assert step(layout, 0, "right") in (1, 2)
    assert step(layout, 3, "left") in (1, 2)
    assert step(layout, 3, "right") == 3 and step(layout, 0, "left") == 0
    upper, lower = sorted((1, 2), key=lambda r: layout.nodes[r].y)
    assert step(layout, upper, "down") == lower and step(layout, lower, "up") == upper
    assert step(layout, upper, "up") == upper
    assert step(layout, -1, "down") == 0                    # nothing selected: the first node
    with pytest.raises(ValueError, match="sideways"):
        step(layout, 0, "sideways")


def test_wide_fan_gets_wider_gaps_so_links_are_not_steep():
    # N0 fans out to 30 activities that all feed N31
    pairs = [(0, k) for k in range(1, 31)] + [(k, 31) for k in range(1, 31)]
    layout = layout_plan(make_plan(32, pairs))
    slopes = []
    for link in layout.links:
        for (x0, y0), (x1, y1) in zip(link.points, link.points[1:]):
            if x1 > x0:
                slopes.append(abs(y1 - y0) / (x1 - x0))
    assert max(slopes) <= 1 / 0.45 * 1.15
    assert layout.nodes[1].x - (layout.nodes[0].x + layout.nodes[0].w) > LayoutOptions().column_gap


def test_column_dates_head_time_scaled_columns():
    import datetime as dt

    from workbench.figures.network_labels import column_dates

    acts = [Activity(id="A", duration=5.0), Activity(id="B", duration=2.0), Activity(id="C", duration=1.0)]
    plan = Plan(Settings(title="t", start=dt.date(2027, 3, 1)), acts, [Link("A", "B"), Link("B", "C")])
    analysis = analyze(plan)
    layout = layout_plan(plan, analysis, LayoutOptions(time_scaled=True))
    heads = column_dates(layout, analysis)
    # Early starts 0, 5, 7 over 3 logic columns: 4.5 time columns, one every 7/3.5 = 2
    # working days from Monday 1 March 2027 (Mon–Fri): A in column 0 (1 Mar), B in
    # column 2 (offset 4 = Fri 5 Mar), C in column 3 (offset 6 = Tue 9 Mar)
    assert [n.layer for n in layout.nodes] == [0, 2, 3]
    assert [t for _, t in heads] == ["1 Mar 2027", "5 Mar 2027", "9 Mar 2027"]
    assert [x for x, _ in heads] == sorted(x for x, _ in heads)
    assert column_dates(layout, None) == []
    assert column_dates(layout_plan(plan, analysis), analysis) == []     # logic columns: no dates
