"""Simulation from the status date: actuals are fixed, only remaining work is uncertain."""

import datetime as dt

import numpy as np
import pytest
from scipy import stats

from workbench.core import Activity, Link, Plan, Risk, Settings, analyze
from workbench.core.block_passes import BlockPasses
from workbench.core.montecarlo import MonteCarlo, simulate
from workbench.core.progress_fields import Progress

MONDAY = dt.date(2027, 1, 4)


def half_done_chain(n=10, done=5):
    """A chain of n (2, 3, 7) activities; the first ``done`` finished back to back in 3 d each."""
    acts = []
    for i in range(n):
        p = Progress(actual_start=3.0 * i, actual_finish=3.0 * i + 3) if i < done else None
        acts.append(Activity(f"A{i}", optimistic=2, most_likely=3, pessimistic=7, progress=p))
    links = [Link(f"A{i}", f"A{i + 1}") for i in range(n - 1)]
    status = MONDAY + dt.timedelta(days=18)        # Friday 22 Jan: its end is offset 15
    return Plan(Settings(title="chain", start=MONDAY, status_date=status), acts, links)


def test_a_chain_half_done_finishes_like_its_remaining_half():
    # The finish is 15 + the sum of five independent beta-PERT(2, 3, 7) durations:
    # alpha = 1 + 4(3-2)/5 = 1.8, beta = 1 + 4(7-3)/5 = 4.2 on [2, 7]; moments from scipy.stats.beta.
    one = stats.beta(1.8, 4.2, loc=2, scale=5)
    mean, sd = 15 + 5 * one.mean(), np.sqrt(5 * one.var())
    run = simulate(half_done_chain(), 40_000, seed=11)
    se = sd / np.sqrt(run.iterations)
    assert abs(run.finish.mean() - mean) < 4 * se
    assert run.finish.std() == pytest.approx(sd, rel=0.03)
    assert run.finish.min() >= 15 + 5 * 2 - 1e-9          # never before the optimistic remainder
    assert run.criticality[:5].tolist() == [0] * 5 and run.criticality[5:].tolist() == [1] * 5
    assert run.sensitivity[:5].tolist() == [0] * 5          # fixed actuals drive nothing


def test_pert_from_the_status_date_matches_the_remaining_half():
    a = analyze(half_done_chain())
    # te = (2 + 12 + 7)/6 = 3.5 per activity; variance (5/6)^2 each, five remaining.
    assert a.pert.mean == pytest.approx(15 + 5 * 3.5)
    assert a.pert.variance == pytest.approx(5 * (5 / 6) ** 2)


def test_without_progress_a_status_date_changes_no_simulated_figure():
    plan = half_done_chain(done=0)
    before = simulate(plan, 2_000, seed=5).finish
    plan.settings.status_date = MONDAY + dt.timedelta(days=30)
    assert np.array_equal(before, simulate(plan, 2_000, seed=5).finish)


def test_risk_events_no_longer_strike_done_work():
    plan = half_done_chain()
    plan.risks = [Risk("R1", "late permit", 1.0, 5.0, 5.0, 5.0, ("A0", "A1"))]
    run = simulate(plan, 1_000, seed=2)
    assert run.finish.mean() == pytest.approx(simulate(half_done_chain(), 1_000, seed=2).finish.mean())


def test_block_columns_equal_the_schedule_with_progress():
    """A block of identical columns at the means reproduces the analysis, finish floors
    (SF from started work) and cut links included."""
    acts = [Activity("A", optimistic=4, most_likely=8, pessimistic=9, progress=Progress(actual_start=0.0, remaining=6)),
            Activity("B", duration=1), Activity("C", optimistic=1, most_likely=2, pessimistic=3),
            Activity("D", duration=2, progress=Progress(actual_start=1.0, actual_finish=2.0))]
    links = [Link("A", "B", "SS", 2.0), Link("A", "C", "SF", 10.0), Link("D", "C", "FS", 3.0), Link("A", "D")]
    plan = Plan(Settings(start=MONDAY, status_date=dt.date(2027, 1, 6)), acts, links)
    mc = MonteCarlo(plan)
    passes = BlockPasses(mc.net, mc.analyzer.floor, mc.analyzer.fnlt, mc.analyzer.finish_floor, mc.analyzer.done)
    finish, counts = passes.run(np.repeat(mc.means[:, None], 3, axis=1), None)
    assert finish.tolist() == [mc.schedule.finish] * 3 == [10.0] * 3
    assert counts.tolist() == [3 * int(c) for c in mc.schedule.critical]
    assert counts[3] == 0
