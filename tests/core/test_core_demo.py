"""The demo plan reads like a real plan and the shipped resources/demo.slw matches it."""

import datetime as dt
from collections import Counter
from pathlib import Path

import pytest

from workbench.core import analyze
from workbench.core.demo import demo_plan

SHIPPED = Path(__file__).resolve().parents[2] / "resources" / "demo.slw"


@pytest.fixture(scope="module")
def plan():
    return demo_plan()


@pytest.fixture(scope="module")
def result(plan):
    return analyze(plan)


def test_size_groups_and_link_types(plan):
    assert 35 <= len(plan) <= 45
    groups = Counter(a.group for a in plan.activities)
    assert len(groups) >= 4 and all(groups.values())
    assert {l.type for l in plan.links} == {"FS", "SS", "FF", "SF"}
    assert any(l.lag < 0 for l in plan.links) and any(l.lag > 0 for l in plan.links)
    assert all(a.name for a in plan.activities)
    assert sum(a.is_milestone for a in plan.activities) >= 2
    ids = set(plan.ids())
    assert plan.risks and all(set(r.activities) <= ids for r in plan.risks)
    assert plan.correlations and all(set(c.activities) <= ids for c in plan.correlations)


def test_settings(plan):
    s = plan.settings
    assert s.start.year == 2027 and s.start.weekday() == 0
    assert s.calendar.region and len(s.calendar.holidays) >= 10
    assert all(isinstance(d, dt.date) for d in s.calendar.holidays)
    assert {d.year for d in s.calendar.holidays} == {2027, 2028}
    assert isinstance(s.deadline, dt.date)
    assert len(s.sign_off) >= 2 and all(x.name and x.role for x in s.sign_off)
    assert s.prepared_by


def test_deadline_a_little_after_the_pert_finish(result):
    gap = (result.plan.settings.deadline - result.finish_date).days
    assert 1 <= gap <= 21
    assert 0.6 < result.probability_by_deadline() < 0.95
    assert result.pert.path[0] == "M0" and result.pert.path[-1] == "O3"


def test_holidays_move_dates(plan, result):
    # Dates never land on a stored holiday or a weekend.
    holidays = set(plan.settings.calendar.holidays)
    for key, dates in result.dates().items():
        for d in dates.astype(dt.date):
            assert d not in holidays and d.weekday() < 5, (key, d)


def test_near_critical_paths_merge_late(result):
    s = result.schedule
    floats = dict(zip(s.ids, s.total_float - s.total_float.min()))
    # the X-ray delivery and the recruitment run beside the building work, within 10 days of it
    assert 0 < floats["E2"] <= 10 and 0 < floats["P1"] <= 10
    assert floats["E5"] == 0 and floats["P2"] == 0


def test_simulation_mean_is_above_the_pert_mean(plan, result):
    montecarlo = pytest.importorskip("workbench.core.montecarlo")
    sim = montecarlo.simulate(plan, iterations=2000, seed=7)
    assert sim.mean > result.pert.mean + 2.0          # merge bias, visibly
    assert sim.prob_by(result.deadline)[0] < result.probability_by_deadline()


def test_shipped_file_matches_demo_plan(plan):
    planfile = pytest.importorskip("workbench.io.planfile")
    shipped = planfile.load_plan(SHIPPED)
    assert planfile.plan_to_dict(shipped) == planfile.plan_to_dict(plan)
    assert shipped.ids() == plan.ids() and shipped.links == plan.links


def test_demo_plan_is_a_fresh_copy():
    first, second = demo_plan(), demo_plan()
    first.remove_activity("B8")
    assert "B8" in second.ids()
