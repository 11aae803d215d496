"""Drivers view: placeholder, ranked bars from a real simulation, click selects, stale."""

import pytest
import pyqtgraph as pg
from PySide6.QtCore import QPointF, Qt

from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.figures import drivers as fdr
from workbench.figures import style
from workbench.ui.drivers.view import DriversView
from workbench.ui.session import Session

from support.plans import house_plan
from support.ui import shown


@pytest.fixture
def drivers(qtbot):
    session = Session(house_plan())
    v = shown(qtbot, DriversView(session), (1400, 800))
    return v


def test_placeholder_until_a_simulation_exists(drivers):
    assert drivers.stack.currentWidget() is drivers.placeholder
    assert "Run a simulation in the Odds view" in drivers.placeholder.text()


def test_bars_follow_the_simulation_top_n_in_order(drivers):
    session = drivers.session
    result = simulate(session.plan, 3000, seed=4)
    drivers.top.setValue(5)
    session.set_simulation(result)
    bars = drivers.criticality.bars
    assert len(bars) == 6 and bars[-1].is_folded and bars[-1].label == "9 others"
    values = [b.value for b in bars[:5]]
    assert values == sorted(values, reverse=True)
    # the published critical path A-B-C-E-F-J-L-N is critical in most iterations
    assert set(b.act_id for b in bars[:5]) <= set("ABCEFJLN")
    sens = drivers.sensitivity.bars
    assert [abs(b.value) for b in sens[:5]] == sorted((abs(b.value) for b in sens[:5]), reverse=True)
    assert sens[0].act_id == "C"  # the widest estimate on the critical path
    axis_labels = [t[1] for t in drivers.criticality.getPlotItem().getAxis("left")._tickLevels[0]]
    assert axis_labels[0].startswith(bars[0].act_id)


def _click_row(qtbot, chart, row):
    rect = chart.rects[row]
    scene = chart.getPlotItem().vb.mapViewToScene(QPointF((rect.x0 + rect.x1) / 2, rect.y))
    pos = chart.mapFromScene(scene)
    qtbot.mouseClick(chart.viewport(), Qt.LeftButton, pos=pos)


def test_click_selects_the_activity_everywhere(drivers, qtbot):
    drivers.session.set_simulation(simulate(drivers.session.plan, 2000, seed=2))
    chart = drivers.criticality
    with qtbot.waitSignal(drivers.session.selection_changed) as sig:
        _click_row(qtbot, chart, 1)
    assert sig.args == [[chart.bars[1].act_id]]
    assert chart.selected == {chart.bars[1].act_id}
    assert drivers.sensitivity.selected == {chart.bars[1].act_id}


def test_edit_marks_drivers_stale(drivers):
    drivers.session.set_simulation(simulate(drivers.session.plan, 1000, seed=3))
    drivers.session.push(EditActivity("B", most_likely=4.0))
    assert drivers.stale and "Stale" in drivers.note.text()
    assert drivers.stack.currentIndex() == 1
    assert pg.mkBrush(drivers.criticality.graph.opts["brush"]).color().name() == "#a0a0a0"


def test_folding_matches_the_geometry(drivers):
    result = simulate(drivers.session.plan, 1000, seed=5)
    drivers.top.setValue(4)
    drivers.session.set_simulation(result)
    expect = fdr.criticality_bars(result, drivers.session.plan, 4)
    assert drivers.criticality.bars == expect


def test_hovering_a_row_shows_its_full_name_and_value(drivers, qtbot):
    """Axis labels are cut to leave the bars room; the tooltip gives the whole name."""
    session = drivers.session
    drivers.resize(700, 500)
    drivers.top.setValue(5)
    session.set_simulation(simulate(session.plan, 2000, seed=5))
    leaders = [chart.bars[0].act_id for chart in (drivers.criticality, drivers.sensitivity)]
    for act_id in set(leaders):       # a rename leaves the durations, so the ranking, alone
        act = session.plan.activity(act_id)
        session.plan.replace_activity(act_id, act.with_(name="A very long activity name " * 4))
    session.set_simulation(simulate(session.plan, 2000, seed=5))
    for chart, act_id in zip((drivers.criticality, drivers.sensitivity), leaders):
        bar, rect = chart.bars[0], chart.rects[0]
        assert bar.act_id == act_id
        scene = chart.getPlotItem().vb.mapViewToScene(QPointF((rect.x0 + rect.x1) / 2, rect.y))
        axis = dict(chart.getPlotItem().getAxis("left")._tickLevels[0])[rect.y]
        assert axis.endswith("…") and len(axis) < len(bar.label)
        text = chart.tooltip_at(scene)
        assert bar.label in text and (f"{bar.value:+.2f}" if chart.signed else f"{bar.value:.2f}") in text
        folded, rect = chart.bars[-1], chart.rects[-1]
        assert folded.is_folded
        scene = chart.getPlotItem().vb.mapViewToScene(QPointF((rect.x0 + rect.x1) / 2, rect.y))
        assert f"{folded.folded} other activities" in chart.tooltip_at(scene)
    below = drivers.criticality.getPlotItem().vb.mapViewToScene(QPointF(0.5, -len(drivers.criticality.bars) - 3))
    assert drivers.criticality.tooltip_at(below) == ""


def test_bars_on_the_pert_critical_path_are_in_the_critical_style(drivers):
    session = drivers.session
    session.set_simulation(simulate(session.plan, 2000, seed=6))
    path = set(session.analysis.pert.path)
    for chart in (drivers.criticality, drivers.sensitivity):
        crit = chart.critical_graph.opts
        other = chart.graph.opts
        shown = {b.act_id for b in chart.bars if not b.is_folded}
        on_path = {r.y for r in chart.rects if r.bar.act_id in path}
        assert set(crit["y"]) == on_path and on_path                       # every one, and only those
        assert not set(other["y"]) & on_path and len(crit["y"]) + len(other["y"]) == len(shown)
        assert pg.mkBrush(crit["brush"]).color().name() == style.CRITICAL.lower()
        assert crit["pen"].widthF() > other["pen"].widthF()                # not by colour alone
