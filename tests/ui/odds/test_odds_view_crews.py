"""The Odds view beside the crews: a plan with resources gets a third headline column, the
crews' run paired with the Odds view's own run (same seed and iterations: one logic-only
chance on screen, not two), shared with the Resources view; a plan without resources shows
none of it; the caution stays."""

import pytest

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.figures import odds as fo
from workbench.ui.odds.view import OddsView
from workbench.ui.resources.view import ResourcesView
from workbench.ui.session import Session

from support.plans import house_plan
from support.ui import shown


def _view(qtbot, session):
    v = shown(qtbot, OddsView(session), (1400, 900))
    return v


def _compared(qtbot, v):
    v.crews.run()
    qtbot.waitUntil(lambda: v.crews.result is not None and not v.crews.shared.running, timeout=120_000)


def test_the_headline_gains_the_crews_column_paired_with_the_views_run(qtbot):
    session = Session(demo_plan())
    v = _view(qtbot, session)
    assert v.panel.crews_box.isVisibleTo(v) and "With the crews" not in v.panel.headline.text()
    run = simulate(session.plan, 400, seed=11)
    session.set_simulation(run)
    _compared(qtbot, v)
    pair = v.crews.result
    assert pair.logic is run                                   # the view's run, not a second one
    assert (pair.aware.iterations, pair.aware.seed) == (400, 11)
    text = v.panel.headline.text()
    assert "Logic only" in text and "With the crews" in text
    q = v.question()
    assert f"{100 * fo.sim_probability(run, q):.1f} %" in text
    assert f"{100 * fo.sim_probability(pair.aware, q):.1f} %" in text
    assert text.count(f"{100 * fo.sim_probability(run, q):.1f} %") == 1    # one logic-only chance
    assert "levelled order" in v.crews.caution.text() and "approval rules" in v.panel.caution.text()
    v.crews.stop()


def test_the_resources_view_shows_the_same_comparison(qtbot):
    session = Session(demo_plan())
    session.set_simulation(simulate(session.plan, 300, seed=2))
    v = _view(qtbot, session)
    dock = ResourcesView(session)
    qtbot.addWidget(dock)
    _compared(qtbot, v)
    assert dock.odds.result is v.crews.result                 # one run, shown twice
    assert dock.odds.table.rowCount() == len(v.crews.result.rows(0.8))


def test_a_new_run_or_an_edit_drops_the_crews_column(qtbot):
    session = Session(demo_plan())
    session.set_simulation(simulate(session.plan, 300, seed=2))
    v = _view(qtbot, session)
    _compared(qtbot, v)
    assert "With the crews" in v.panel.headline.text()
    session.set_simulation(simulate(session.plan, 300, seed=3))
    assert "With the crews" not in v.panel.headline.text()
    assert "compare again" in v.crews.status.text()


def test_a_plan_without_resources_has_no_crews(qtbot):
    v = _view(qtbot, Session(house_plan()))
    assert not v.panel.crews_box.isVisibleTo(v)
