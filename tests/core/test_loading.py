"""Resource loading: use over time against availability, and the over-allocated periods."""

import datetime as dt

import numpy as np
import pytest

from workbench.core import analyze
from workbench.core.levelling import level
from workbench.core.loading import plan_loading
from workbench.core.model import Activity, Availability, Link, Plan, Resource, Settings


def overlap_plan(periods=()):
    # A (0–4) and B (0–3) each need 2 fitters; C (4–6) needs 1; 3 fitters exist
    acts = [Activity("A", duration=4, resources=(("fit", 2.0),)), Activity("B", duration=3, resources=(("fit", 2.0),)),
            Activity("C", duration=2, resources=(("fit", 1.0),))]
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, [Link("A", "C")],
                resources=[Resource("fit", "Fitters", 3.0, periods=periods)])


def test_use_over_time_and_the_over_allocated_period():
    (load,) = plan_loading(analyze(overlap_plan()))
    assert load.times.tolist() == [0, 3, 4, 6]
    assert load.use.tolist() == [4, 2, 1, 0] and load.peak == 4
    assert load.over == [(0.0, 3.0, 4.0, 3.0)]


def test_an_availability_period_shows_in_the_loading():
    (load,) = plan_loading(analyze(overlap_plan(periods=(Availability(3.0, 5.0, 1.0),))))
    assert load.times.tolist() == [0, 3, 4, 5, 6]
    assert load.available.tolist() == [3, 1, 1, 3, 3]
    # over on [0, 3) (4 of 3) and on [3, 4) (2 of 1): one period, its peak and least availability
    assert load.over == [(0.0, 4.0, 4.0, 1.0)]


def test_levelled_dates_are_never_over_allocated():
    plan = overlap_plan()
    result = level(plan)
    (load,) = plan_loading(analyze(plan), result.starts)
    assert load.over == [] and load.peak <= 3
    # the levelled total of unit-days equals the logic-only one (nothing lost or doubled)
    (before,) = plan_loading(analyze(plan))
    area = lambda l: float(np.sum(l.use[:-1] * np.diff(l.times)))
    assert area(load) == pytest.approx(area(before)) == 4 * 2 + 3 * 2 + 2 * 1
