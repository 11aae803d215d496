"""Property tests of the confidence search on small random plans with uncertain, crashable
activities: what it returns meets the target in sample, costs no more than crashing
everything, and its reported chances are those of its own crash."""

import datetime as dt

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from workbench.core.confidence_crash import crash_to_confidence
from workbench.core.crash_problem import CrashProblem
from workbench.core.crash_scenarios import ScenarioSet
from workbench.core.model import Activity, Link, Plan, Settings


@st.composite
def uncertain_plans(draw):
    n = draw(st.integers(2, 6))
    acts = []
    for i in range(n):
        m = draw(st.integers(2, 10))
        a, b = m - draw(st.integers(0, m - 1)), m + draw(st.integers(0, 8))
        f = draw(st.sampled_from([1.0, 0.8, 0.6]))
        cost = float(draw(st.integers(0, 90)) * 10)
        crash = {} if f == 1.0 else dict(crash_cost=cost + draw(st.integers(1, 50)) * 10, crash_optimistic=a * f,
                                          crash_most_likely=m * f, crash_pessimistic=b * f)
        acts.append(Activity(f"U{i}", optimistic=a, most_likely=m, pessimistic=b, cost=cost, **crash))
    links = [Link(f"U{i}", f"U{j}", draw(st.sampled_from(("FS", "FS", "SS", "FF"))), float(draw(st.integers(0, 2))))
             for j in range(1, n) for i in draw(st.sets(st.integers(0, j - 1), max_size=2))]
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, links)


@settings(max_examples=25, deadline=None)
@given(uncertain_plans(), st.floats(0.3, 0.95), st.floats(0.75, 1.05), st.sampled_from([0.5, 0.8, 0.9]))
def test_confidence_plan_keeps_its_promises(plan, share, stretch, target):
    problem = CrashProblem(plan)
    deadline = problem.normal_finish * stretch if stretch < 1 else problem.shortest() + share * (
        problem.normal_finish - problem.shortest())
    inside = ScenarioSet(problem, 256, 3, deadline)
    outside = ScenarioSet(problem, 256, 4, deadline)
    found = crash_to_confidence(problem, target, inside, outside, [np.zeros(problem.size)])
    full = problem.span
    if not found.reachable:
        assert inside.chance(full) < target
        return
    assert inside.chance(found.days) >= target - 1e-12
    assert found.chance_in_sample == inside.chance(found.days)
    assert found.chance_out_of_sample == outside.chance(found.days)
    assert np.all(found.days >= -1e-12) and np.all(found.days <= full + 1e-9)
    assert found.extra_cost == pytest.approx(float(problem.slope @ found.days))
    assert found.extra_cost <= float(problem.slope @ full) + 1e-6


def test_a_deadline_met_only_exactly_when_fully_crashed_gives_the_full_crash():
    """Fully crashed, every scenario finishes exactly at the deadline: the LP (which aims a
    hair inside the deadline) has no answer, yet full crashing reaches the target, and is
    the answer (this once raised a TypeError instead)."""
    acts = [Activity("A", optimistic=4, most_likely=5, pessimistic=8, cost=100.0, crash_cost=400.0, crash_duration=3),
            Activity("B", optimistic=1, most_likely=2, pessimistic=4, cost=50.0, crash_cost=80.0, crash_duration=1)]
    problem = CrashProblem(Plan(Settings(start=dt.date(2027, 1, 4)), acts, [Link("A", "B")]))
    assert problem.shortest() == pytest.approx(4.0)
    inside, outside = ScenarioSet(problem, 128, 3, 4.0), ScenarioSet(problem, 128, 4, 4.0)
    found = crash_to_confidence(problem, 0.9, inside, outside, [np.zeros(problem.size)])
    assert found.reachable and np.allclose(found.days, problem.span)
    assert found.chance_in_sample == 1.0 and found.extra_cost == pytest.approx(float(problem.slope @ problem.span))
