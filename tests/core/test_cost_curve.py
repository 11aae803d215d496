"""The exact time–cost curve: a hand-worked case, brute force on small random networks,
convexity and piecewise linearity, its end points, re-analysis of each breakpoint, and LP
duality on one case."""

import datetime as dt
import itertools

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st
from scipy import sparse
from scipy.optimize import linprog

from workbench.core.block_passes import BlockPasses
from workbench.core.cost_curve import cost_curve
from workbench.core.cpm import Analyzer
from workbench.core.crash_lp import solve
from workbench.core.crash_problem import CrashProblem
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Link, Plan, Settings

START = dt.date(2027, 1, 4)


def hand_plan() -> Plan:
    """A → C, B → C. A: 10 days, 4 can be bought at 100 a day; B: 8, 3 at 50; C: 5, 1 at 300."""
    acts = [Activity("A", duration=10, cost=1000, crash_cost=1400, crash_duration=6),
            Activity("B", duration=8, cost=500, crash_cost=650, crash_duration=5),
            Activity("C", duration=5, cost=800, crash_cost=1100, crash_duration=4)]
    return Plan(Settings(start=START), acts, [Link("A", "C"), Link("B", "C")])


def test_hand_worked_curve():
    # Worked by hand: normal 15 days for 2300. Buy A at 100/day until it ties with B (13 days,
    # 2500); then A and B together at 150/day (cheaper than C at 300) until A is fully crashed
    # (11 days, 2800); then C at 300 for its one day (10 days, 3100).
    curve = cost_curve(hand_plan())
    got = [(p.duration, p.direct_cost, curve.crashed(p)) for p in curve.points]
    assert [(round(t, 9), round(c, 6)) for t, c, _ in got] == [(10, 3100), (11, 2800), (13, 2500), (15, 2300)]
    assert got[0][2] == {"A": 4, "B": 2, "C": 1}
    assert got[1][2] == {"A": 4, "B": 2}
    assert got[2][2] == {"A": 2}
    assert got[3][2] == {}
    assert curve.at(12).direct_cost == pytest.approx(2650)       # on the 150-a-day segment


def give_back_plan() -> Plan:
    """A → C, A → E → D, B → D: E (4 days, 2 to buy at 10 a day) sits on the one longest
    path; A and D (4 days, 3 at 30 each) each hold two paths; B and C (6 days, 1 at 100)."""
    def act(name, d, days, slope):
        return Activity(name, duration=d, cost=1000, crash_cost=1000 + slope * days, crash_duration=d - days)
    acts = [act("A", 4, 3, 30), act("B", 6, 1, 100), act("C", 6, 1, 100), act("D", 4, 3, 30), act("E", 4, 2, 10)]
    return Plan(Settings(start=START), acts, [Link("A", "C"), Link("A", "E"), Link("E", "D"), Link("B", "D")])


def test_hand_worked_curve_that_gives_days_back():
    # Worked by hand: A-E-D is 12 days, A-C and B-D 10. Buy E (10 a day) to 10 days: 20.
    # Below 10 all three paths hold. Cutting A and D shortens A-E-D twice, so E can be given
    # its 2 days back: 30 + 30 - 10 = 50 a day, cheaper than A+B or C+D (130); at 8 days E is
    # uncrashed again (120). Then A and D alone at 60 a day to 7 (180); then B and C at 200
    # to 6 (380), where C and A are both used up. A rule that never gives days back pays 140 at 8.
    curve = cost_curve(give_back_plan())
    got = [(round(p.duration, 9), round(p.direct_cost - 5000, 6), curve.crashed(p)) for p in curve.points]
    assert got == [(6, 380, {"A": 3, "B": 1, "C": 1, "D": 3}), (7, 180, {"A": 3, "D": 3}),
                   (8, 120, {"A": 2, "D": 2}), (10, 20, {"E": 2}), (12, 0, {})]
    assert curve.at(9).direct_cost == pytest.approx(5070)
    assert curve.at(9).days[list(curve.problem.ids).index("E")] == pytest.approx(1.0)


def test_no_cost_data_is_refused():
    plan = Plan(Settings(start=START), [Activity("A", duration=3)])
    with pytest.raises(PlanError, match="no cost data"):
        cost_curve(plan)


# --- random small networks ----------------------------------------------------------------
@st.composite
def small_plans(draw, types=("FS", "SS", "FF", "SF")):
    n = draw(st.integers(2, 5))
    acts = []
    for i in range(n):
        d = draw(st.integers(1, 6))
        span = draw(st.integers(0, min(2, d)))
        cost = draw(st.integers(0, 50))
        floor = draw(st.none() | st.integers(0, 4))          # a start-no-earlier constraint
        if span:
            acts.append(Activity(f"T{i}", duration=d, cost=cost, crash_cost=cost + span * draw(st.integers(1, 9)),
                                 crash_duration=d - span, start_no_earlier=floor))
        else:
            acts.append(Activity(f"T{i}", duration=d, cost=cost, start_no_earlier=floor))
    links = []
    for j in range(1, n):
        for i in draw(st.sets(st.integers(0, j - 1), min_size=0, max_size=2)):
            links.append(Link(f"T{i}", f"T{j}", draw(st.sampled_from(types)), float(draw(st.integers(-1, 2)))))
    return Plan(Settings(start=START), acts, links)


def brute_force(plan):
    """Every crash on a whole-day grid: (finish, extra cost) of each (integer data make the
    linear programme's optimum integral, so the grid holds an optimum at every whole T)."""
    problem = CrashProblem(plan)
    ranges = [np.arange(0, s + 0.5, 1.0) for s in problem.span]
    grid = np.array(list(itertools.product(*ranges))).T          # activities × combinations
    d = problem.te[:, None] - grid
    finish, _ = BlockPasses(problem.net, problem.floor, problem.fnlt).run(np.ascontiguousarray(d), None)
    return finish, problem.slope @ grid + problem.base_cost


@settings(max_examples=40, deadline=None)
@given(small_plans())
def test_curve_matches_brute_force_on_a_grid(plan):
    curve = cost_curve(plan)
    finish, cost = brute_force(plan)
    assert curve.shortest == pytest.approx(finish.min(), abs=1e-7)
    for T in np.arange(np.ceil(curve.shortest - 1e-9), curve.normal + 1.0):
        best = cost[finish <= T + 1e-9].min()
        assert curve.at(T).direct_cost == pytest.approx(best, abs=1e-6), T


@settings(max_examples=40, deadline=None)
@given(small_plans())
def test_curve_is_convex_and_piecewise_linear(plan):
    curve = cost_curve(plan)
    pts = curve.points
    slopes = [(b.direct_cost - a.direct_cost) / (b.duration - a.duration) for a, b in zip(pts, pts[1:])]
    assert all(s <= 1e-9 for s in slopes)                              # more time never costs more
    assert all(s1 <= s2 + 1e-7 for s1, s2 in zip(slopes, slopes[1:]))   # convex
    problem = curve.problem
    for a, b in zip(pts, pts[1:]):                                      # linear between breakpoints
        for w in (0.25, 0.5, 0.8):
            T = a.duration + w * (b.duration - a.duration)
            assert problem.base_cost + problem.at(T).cost == pytest.approx(curve.at(T).direct_cost, abs=1e-6)


@settings(max_examples=40, deadline=None)
@given(small_plans())
def test_each_breakpoint_gives_its_duration_when_analysed(plan):
    curve = cost_curve(plan)
    problem = curve.problem
    analyzer = Analyzer(problem.net, problem.floor, problem.fnlt)
    for p in curve.points:
        assert analyzer.run(problem.te - p.days, paths=False).finish == pytest.approx(p.duration, abs=1e-6)
        assert problem.direct_cost(p.days) == pytest.approx(p.direct_cost, abs=1e-6)


@settings(max_examples=30, deadline=None)
@given(small_plans(types=("FS",)))
def test_end_points_are_all_normal_and_fully_crashed(plan):
    curve = cost_curve(plan)
    problem = curve.problem
    analyzer = Analyzer(problem.net, problem.floor, problem.fnlt)
    normal = curve.points[-1]
    assert normal.duration == pytest.approx(analyzer.run(problem.te, paths=False).finish)
    assert normal.direct_cost == pytest.approx(problem.base_cost) and not normal.days.any()
    fully = analyzer.run(problem.te - problem.span, paths=False).finish
    assert curve.shortest == pytest.approx(fully)        # finish-to-start: crashing never lengthens
    assert curve.points[0].direct_cost <= problem.direct_cost(problem.span) + 1e-6


def random_plan(rng) -> Plan:
    """A small network, denser than the hypothesis plans (more merging paths, so more
    cases where days are given back), integer data."""
    n = int(rng.integers(4, 7))
    acts = []
    for i in range(n):
        d, span = int(rng.integers(1, 7)), int(rng.integers(0, 3))
        span, cost = min(span, d), int(rng.integers(0, 40))
        extra = {} if not span else {"crash_cost": cost + span * int(rng.integers(1, 12)), "crash_duration": d - span}
        acts.append(Activity(f"T{i}", duration=d, cost=cost, **extra))
    types = ("FS", "FS", "SS", "FF", "SF")
    links = [Link(f"T{i}", f"T{j}", types[int(rng.integers(len(types)))], float(rng.integers(-1, 2)))
             for j in range(1, n) for i in range(j) if rng.random() < 0.5]
    return Plan(Settings(start=START), acts, links)


def test_curve_matches_brute_force_on_many_seeded_networks():
    """Brute force on 200 fixed random networks, at every whole duration from the shortest to
    the normal one and at the midpoints between (where the curve must be the straight blend)."""
    rng = np.random.default_rng(1)        # holds cases where tangents meet at an earlier probe
    for k in range(200):
        plan = random_plan(rng)
        curve = cost_curve(plan)
        finish, cost = brute_force(plan)
        assert curve.shortest == pytest.approx(finish.min(), abs=1e-7), k
        whole = np.arange(np.ceil(curve.shortest - 1e-9), curve.normal + 1.0)
        best = np.array([cost[finish <= T + 1e-9].min() for T in whole])
        for T, c in zip(whole, best):
            assert curve.at(T).direct_cost == pytest.approx(c, abs=1e-6), (k, T)
        for T, c0, c1 in zip(whole[:-1] + 0.5, best[:-1], best[1:]):    # convexity bounds the midpoint
            assert curve.at(T).direct_cost <= 0.5 * (c0 + c1) + 1e-6, (k, T)


@settings(max_examples=30, deadline=None)
@given(small_plans(), st.lists(st.floats(-0.2, 1.2), min_size=1, max_size=8))
def test_kept_model_answers_as_a_fresh_solve_in_any_order(plan, where):
    """The kept HiGHS model re-solved from its last basis, at durations in any order (some
    out of reach), gives the optimum of a linprog built from scratch."""
    problem = CrashProblem(plan)
    _, _, ncol = problem.columns()
    lo, hi = problem.shortest(), problem.normal_finish
    for w in where:
        T = lo + w * (hi - lo) if hi > lo else hi + w
        kept, fresh = problem.at(T), solve(problem.rows(), ncol, problem.objective(), problem.bounds(), T)
        assert (kept is None) == (fresh is None), T
        if kept is not None:
            assert kept.cost == pytest.approx(fresh.cost, abs=1e-6)
            assert problem.direct_cost(problem.days(kept.values)) == pytest.approx(
                problem.base_cost + fresh.cost, abs=1e-5)


def test_lp_duality_and_complementary_slackness():
    """One case checked against LP theory: strong duality, complementary slackness, and the
    duals of the rows holding T giving the curve's slope (150 a day at 12 days)."""
    problem = CrashProblem(hand_plan())
    rows = problem.rows()
    _, _, ncol = problem.columns()
    A = sparse.csr_matrix((rows.val, (rows.row, rows.col)), shape=(rows.b.size, ncol)).toarray()
    b = rows.b + 12.0 * rows.t
    bounds = problem.bounds()
    res = linprog(problem.objective(), A_ub=A, b_ub=b, bounds=bounds, method="highs")
    y, lo, up = res.ineqlin.marginals, res.lower.marginals, res.upper.marginals
    lower, upper = bounds[:, 0], bounds[:, 1]
    dual = y @ b + lo @ lower + np.where(np.isfinite(upper), up * np.nan_to_num(upper, posinf=0), 0).sum()
    assert res.fun == pytest.approx(350.0) and dual == pytest.approx(res.fun, abs=1e-7)
    assert np.abs(y * (b - A @ res.x)).max() < 1e-7                  # complementary slackness
    assert np.all(y <= 1e-12)
    assert y @ rows.t == pytest.approx(-150.0)                      # dC/dT on that segment
    reduced = problem.objective() - A.T @ y - lo - up                 # dual feasibility
    assert np.abs(reduced).max() < 1e-7


def test_free_crash_is_bought_only_where_it_helps():
    """A crash costing nothing extra (crash cost = cost) is still not bought when not needed."""
    from workbench.core.tradeoff import tradeoff

    plan = hand_plan()
    plan.replace_activity("A", plan.activity("A").with_(crash_cost=1000.0))
    result = tradeoff(plan, deadline=40.0, targets=[0.9], iterations=64, seed=1)
    assert result.to_deadline.point.days.sum() == 0 and not result.confidence[0].days.any()
    curve = result.curve
    assert [(round(p.duration, 6), p.direct_cost) for p in curve.points][-2:] == [(13, 2300), (15, 2300)]
    assert curve.crashed(curve.points[-2]) == {"A": 2.0}          # as reported (to a millionth)
