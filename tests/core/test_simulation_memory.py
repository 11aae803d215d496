"""The simulation bounds its memory by plan size as well as iterations: the block is chosen
from the memory available, and a run that cannot fit is refused naming the figure needed
(issue 20, item 16)."""

from __future__ import annotations

import datetime as dt

import numpy as np
import pytest

from workbench.core import montecarlo
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Link, Plan, Settings


def _plan(n: int) -> Plan:
    acts = [Activity(f"M{i}", optimistic=1, most_likely=2, pessimistic=4) for i in range(n)]
    return Plan(Settings(title="mem", start=dt.date(2027, 3, 1)), acts,
                [Link(f"M{i}", f"M{i + 1}") for i in range(0, n - 1, 2)])


def test_a_run_that_cannot_fit_is_refused_with_the_figure_needed(monkeypatch):
    # a million activities on a computer with 3 GB free: one chunk of 64 iterations alone
    # needs several GB, so the run is refused before it allocates
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 3 * 2**30)
    with pytest.raises(PlanError) as err:
        montecarlo.memory_plan(1_000_000, 500_000, 100, False)
    assert err.value.culprit == "memory"
    assert "1,000,000 activities" in str(err.value) and "GB of memory" in str(err.value)


def test_the_block_shrinks_with_the_memory_available(monkeypatch):
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 64 * 2**30)
    roomy = montecarlo.memory_plan(2_000, 1_000, 10_000, False)
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 60 * 2**20)
    tight = montecarlo.memory_plan(2_000, 1_000, 10_000, False)
    assert tight < roomy and tight % montecarlo.CHUNK == 0
    assert montecarlo.memory_needed(2_000, tight, 10_000, False) <= 0.8 * 60 * 2**20


def test_simulate_refuses_rather_than_running_out(monkeypatch):
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 4 * 2**20)
    with pytest.raises(PlanError, match="needs about"):
        montecarlo.simulate(_plan(3_000), iterations=100, seed=1)


def test_results_do_not_depend_on_the_memory_available(monkeypatch):
    plan = _plan(300)
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 64 * 2**30)
    a = montecarlo.simulate(plan, iterations=700, seed=9)
    monkeypatch.setattr(montecarlo, "available_memory", lambda: 40 * 2**20)
    b = montecarlo.simulate(plan, iterations=700, seed=9)
    assert np.array_equal(a.finish, b.finish)
    assert np.array_equal(a.sensitivity, b.sensitivity)


def test_the_memory_available_is_read_from_the_system():
    free = montecarlo.available_memory()
    assert free is None or free > 0
