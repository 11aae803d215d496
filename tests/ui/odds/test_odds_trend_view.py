"""The odds trend in the Odds view: shown under the curves for a plan with a trend or an
approved baseline; a run from a new status date adds that date's point as one undo step."""

import datetime as dt

import numpy as np
import pytest

from workbench.core.commands import SetSettings, settings_with
from workbench.core.montecarlo import simulate
from workbench.figures import odds_trend as ot
from workbench.io.planfile import load_plan
from workbench.resources import demo_update_path
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session

from support.plans import house_plan


@pytest.fixture
def view(qtbot):
    v = OddsView(Session(load_plan(demo_update_path())))
    qtbot.addWidget(v)
    v.resize(1400, 900)
    v.show()
    yield v
    v.runner.stop()
    v.runner.wait(10_000)


def test_the_trend_is_shown_with_its_headline_and_status_note(view):
    plan = view.session.plan
    assert view.trend.isVisible()
    assert view.trend.headline.text() == ot.headline(plan.odds_trend, plan.baselines[0])
    assert np.allclose(view.trend.figure.simulation, [p.simulation_probability for p in plan.odds_trend])
    assert "From the status date Fri 28 May 2027" in view.panel.headline.text()   # the one date format


def test_a_run_from_a_new_status_date_records_one_point(view):
    session = view.session
    session.push(SetSettings(settings_with(session.plan.settings, status_date=dt.date(2027, 6, 4))))
    before = session.undo_stack.count()
    view._run_generation = view._generation
    view._on_run_finished(simulate(session.plan, 300, seed=6))
    points = session.plan.odds_trend
    assert points[-1].status_date == dt.date(2027, 6, 4) and points[-1].seed == 6
    assert session.simulation is not None and session.undo_stack.count() == before + 1
    assert len(view.trend.figure.x) == 4
    session.undo_stack.undo()
    assert [p.status_date for p in session.plan.odds_trend][-1] == dt.date(2027, 5, 28)


def test_a_plan_without_trend_or_baseline_hides_the_chart(qtbot):
    v = OddsView(Session(house_plan()))
    qtbot.addWidget(v)
    v.show()
    assert not v.trend.isVisible()
    v._run_generation = v._generation
    v._on_run_finished(simulate(v.session.plan, 200, seed=1))
    assert v.session.plan.odds_trend == []         # no progress: no status date to record against
