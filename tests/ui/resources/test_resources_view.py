"""The Resources view: loading of the demo's crews, levelling shown and kept as one undo
step, and the odds with and without the crews from a worker thread."""

import numpy as np
import pytest

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.core.levelling import level
from workbench.ui.resources.view import NO_RESOURCES, ResourcesView
from workbench.ui.session import Session

from support.plans import small_plan
from support.ui import shown


@pytest.fixture
def view(qtbot):
    session = Session(demo_plan())
    v = shown(qtbot, ResourcesView(session), (1200, 800))
    yield v
    v.odds.stop()


def test_loading_shows_each_crew_and_the_over_allocation(view):
    assert view.resource_box.count() == 4 and view.resource_box.itemText(0) == "Electricians (elec)"
    assert view.peak_units()[0] == 5.0                      # 5 electricians asked for, 4 exist
    assert "Over-allocated" in view.message.text() and "Electricians: 2 periods" in view.message.text()


def test_level_lists_what_moved_and_keeping_it_is_one_undo_step(view):
    session = view.session
    view.run_level()
    expected = level(demo_plan())
    assert view.moves.rowCount() == len(expected.moves) > 0
    assert view.moves.item(0, 4).text() == expected.moves[0].held_by
    assert "later than logic alone" in view.message.text()
    assert view.peak_units()[0] <= 4.0                      # levelled dates fit the crews
    steps = session.undo_stack.count()
    view.keep()
    assert session.undo_stack.count() == steps + 1
    assert session.analysis.schedule.finish == pytest.approx(expected.finish)
    session.undo_stack.undo()
    assert session.analysis.schedule.finish == pytest.approx(analyze(demo_plan()).schedule.finish)


def test_compare_the_odds_with_and_without_the_crews(view, qtbot):
    view.odds.run()
    qtbot.waitUntil(lambda: view.odds.result is not None, timeout=120_000)
    rows = {r[0]: r[1:] for r in view.odds.result.rows(0.8)}
    assert set(rows) >= {"P50", "P80", "P90", "Chance of the deadline"}
    assert view.odds.table.rowCount() == len(rows)
    assert "Waiting for crews adds" in view.odds.sentence.text()
    assert view.odds.result.aware.mean > view.odds.result.logic.mean


def test_a_plan_without_resources_says_how_to_add_them(qtbot):
    v = ResourcesView(Session(small_plan()))
    qtbot.addWidget(v)
    assert v.message.text() == NO_RESOURCES and not v.plot.isVisible()


def test_the_odds_caution_names_pert_and_claims_no_independence_the_run_lacks(view):
    """The demo draws its fit-out durations together (correlation groups), so the
    simulation does not assume independent durations; PERT does, and the caution says so."""
    assert demo_plan().correlations
    text = view.odds.caution.text()
    assert "PERT assumes one path and independent durations" in text
    assert "approval rules" in text and "and durations are independent" not in text


def test_in_a_half_width_dock_the_resource_name_is_not_cut(qtbot):
    """At 1024×768 the Resources dock is about 520 px wide: the crew's name in the chooser
    reads whole ("Electricia" was all that showed) and the view asks for no more width."""
    v = shown(qtbot, ResourcesView(Session(demo_plan())), (520, 430))
    box = v.resource_box
    assert v.minimumSizeHint().width() <= 520
    assert box.width() >= box.fontMetrics().horizontalAdvance(box.currentText()) + 20
    v.odds.stop()


def test_the_logic_only_odds_are_the_odds_views_run_when_there_is_one(view, qtbot):
    """Two chances of the deadline without crews on one screen (the Odds view's run and a
    second one here) would leave a planner asking which is right."""
    from workbench.core.montecarlo import simulate

    run = simulate(view.session.plan, 300, seed=7)
    view.session.set_simulation(run)
    view.odds.run()
    qtbot.waitUntil(lambda: view.odds.result is not None, timeout=120_000)
    both = view.odds.result
    assert both.logic is run and (both.aware.iterations, both.aware.seed) == (300, 7) and both.aware.resource_aware
    assert "300 iterations each, seed 7" in view.odds.status.text() and "Odds view" in view.odds.status.text()
