"""Odds view: dragging dates, modes, the inverse date, simulation runs, cancel and stale."""

import datetime as dt
from dataclasses import replace

import numpy as np
import pytest
from PySide6.QtCore import QPointF
from scipy.stats import norm

from workbench.core.commands import EditActivity, SetPredecessors
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.figures import odds as fo
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session

from support.plans import house_plan


@pytest.fixture
def view(qtbot):
    session = Session(house_plan())
    v = OddsView(session)
    qtbot.addWidget(v)
    v.resize(1400, 900)
    yield v
    v.runner.stop()
    v.runner.wait(10_000)


def _shaded_area(item) -> float:
    x, y = item.getData()
    return 0.0 if x is None or len(x) == 0 else float(np.trapezoid(y, x))


def test_opens_on_the_deadline_with_phi_one(view):
    # P(T ≤ 47) = Φ(1) = 0.8413 (reference R1, published)
    assert view.dates[0] == 47.0
    assert "0.8413 (84.1 %)" in view.panel.readout.text()
    assert "Path: A-B-C-E-F-J-L-N" in view.panel.readout.text()
    assert abs(_shaded_area(view.plot.pert_shade) - 0.841345) < 1e-3


def test_dragging_a_marker_updates_readout_and_shading(view):
    line = view.plot.markers[0]
    line.setValue(46.03)              # what a drag does: set the value, emit the signal
    assert view.dates[0] == 46.0      # snapped to the end of a working day (1/5 week)
    expect = norm.cdf(46.0, 44, 3)
    assert f"{expect:.4f}" in view.panel.readout.text()
    assert abs(_shaded_area(view.plot.pert_shade) - expect) < 1e-3
    assert f"{100 * expect:.1f} %" in view.panel.headline.text()
    line.sigPositionChangeFinished.emit(line)
    assert line.value() == pytest.approx(46.0)


@pytest.mark.parametrize("mode", ["by", "after", "between"])
def test_every_mode_shades_what_it_reports(view, mode):
    view.set_mode(mode)
    view.plot.markers[0].setValue(42.0)
    if mode == "between":
        view.plot.markers[1].setValue(47.0)
    p = fo.pert_probability(view.analysis.pert, view.question())
    assert fo.format_probability(p) in view.panel.readout.text()
    assert abs(_shaded_area(view.plot.pert_shade) - p) < 1e-3
    assert view.plot.markers[1].isVisible() == (mode == "between")


def test_typed_confidence_marks_its_date(view):
    view.panel.typed.setText("95 %")
    view.panel.typed.returnPressed.emit()
    x = view.plot.answers[0].value()
    assert norm.cdf(x, 44, 3) == pytest.approx(0.95, abs=1e-9)
    day = fo.format_date(view.analysis.calendar.finish_date(x))
    assert day in view.panel.inverse.text() and f"<td>95 % date</td><td>{day}</td>" in view.panel.headline.text()
    assert view.plot.level.value() == pytest.approx(0.95)
    (dx,), (dy,) = view.plot.answer_dot.getData()
    assert dx == pytest.approx(x) and dy == pytest.approx(norm.pdf(x, 44, 3), rel=1e-3)
    assert day in view.plot.answer_text.toPlainText()


def test_bad_confidence_is_named_not_raised(view):
    view.panel.typed.setText("lots")
    view.panel.typed.returnPressed.emit()
    assert not view.panel.error.isHidden() and "confidence" in view.panel.error.text()
    assert view.confidence == pytest.approx(0.9)


def _run(view, qtbot, iterations=2000, seed=11):
    with qtbot.waitSignal(view.session.simulation_changed, timeout=60_000):
        view.controls.iterations.setValue(iterations)
        view.controls.seed.setValue(seed)
        view.controls.button.click()


def test_simulation_runs_in_worker_and_fills_the_comparison(view, qtbot):
    _run(view, qtbot)
    result = view.session.simulation
    assert result is not None and len(result.finish) == 2000 and view.result is result
    table = view.panel.table
    assert table.rowCount() == 5 and table.item(4, 0).text() == "P(finish by)"
    sim_p = fo.sim_probability(result, view.question())
    assert table.item(4, 2).text() == fo.format_probability(sim_p)
    assert sim_p < 0.8413  # merge bias: the published network finishes later than PERT says
    assert "later than PERT" in view.panel.merge_note.text()
    x, _ = view.plot.ecdf.getData()
    assert len(x) > 0 and view.plot.answers[1].isVisible()


def test_cancel_leaves_no_partial_result(view, qtbot):
    with qtbot.waitSignal(view.runner.cancelled, timeout=60_000):
        view.runner.progress.connect(lambda *_: view.controls.button.click())  # Stop at first block
        view.controls.iterations.setValue(200_000)
        view.controls.button.click()
    assert view.session.simulation is None and view.result is None
    assert "no results" in view.controls.status.text().lower()
    assert view.controls.button.text() == "Run simulation"


def test_edit_marks_results_stale(view, qtbot):
    _run(view, qtbot)
    view.session.push(EditActivity("C", pessimistic=30.0))
    assert view.session.simulation is None and view.stale
    assert "Stale" in view.controls.status.text() and view.controls.progress.value() == 0
    assert not view.panel.compare_box.isEnabled()
    assert view.plot.hist.opts["pen"].color().name() == "#9a9a9a"
    _run(view, qtbot, seed=12)
    assert not view.stale and view.panel.compare_box.isEnabled()


def test_run_overtaken_by_an_edit_is_not_stored(view, qtbot):
    with qtbot.waitSignal(view.runner.finished, timeout=60_000):
        view.controls.iterations.setValue(3000)
        view.controls.button.click()
        view.session.push(EditActivity("A", name="changed while running"))
    assert view.session.simulation is None
    assert view.stale and view.result is not None and view.controls.progress.value() == 0


def test_zero_variance_plan_shows_a_certain_finish(qtbot):
    acts = [Activity("A", duration=4), Activity("B", duration=6)]
    session = Session(Plan(Settings(start=dt.date(2026, 3, 2), deadline=9.0), acts, [Link("A", "B")]))
    v = OddsView(session)
    qtbot.addWidget(v)
    assert v.plot.certain.isVisible() and v.plot.certain.value() == 10.0
    text = v.panel.readout.text()
    assert "0.0000 (0.0 %)" in text and "nan" not in text.lower()
    v.plot.markers[0].setValue(10.0)
    assert "1.0000 (100.0 %)" in v.panel.readout.text()


def test_unschedulable_plan_names_the_loop_then_recovers(qtbot):
    acts = [Activity("A", optimistic=1, most_likely=2, pessimistic=4), Activity("B", duration=3)]
    plan = Plan(Settings(start=dt.date(2026, 3, 2)), acts, [Link("A", "B"), Link("B", "A")])
    session = Session(plan)
    v = OddsView(session)
    qtbot.addWidget(v)
    assert not v.panel.error.isHidden() and "A → B → A" in v.panel.error.text()
    assert not v.plot.isEnabled()
    assert session.push(SetPredecessors("A", []))
    assert v.panel.error.isHidden() and v.plot.isEnabled()
    x, y = v.plot.pert_curve.getData()
    assert len(x) > 0 and np.all(np.isfinite(y))


def test_a_refused_simulation_names_the_problem(view, qtbot, monkeypatch):
    import workbench.core.montecarlo as mc
    from workbench.core.errors import PlanError

    def refuse(plan, *args, **kwargs):
        raise PlanError("activity C: pessimistic below optimistic", "C")

    monkeypatch.setattr(mc, "simulate", refuse)
    with qtbot.waitSignal(view.runner.failed, timeout=30_000):
        view.controls.button.click()
    assert "activity C" in view.controls.status.text()
    assert view.session.simulation is None and view.controls.button.text() == "Run simulation"


def test_loading_another_plan_opens_on_its_deadline(view):
    view.plot.markers[0].setValue(45.0)
    other = house_plan(deadline=None)
    for act in other.activities:
        other.replace_activity(act.id, act.with_(optimistic=10 * act.optimistic,
                                                 most_likely=10 * act.most_likely,
                                                 pessimistic=10 * act.pessimistic))
    view.session.load(other)
    assert view.dates[0] == pytest.approx(440.0)      # the new PERT mean, ten times longer
    lo, hi = view.plot.density.viewRange()[0]
    assert lo > 300 and hi < 600                      # the axis follows the new curve


def _pixel(view, x, y):
    vb = view.plot.density.getViewBox()
    scene = vb.mapViewToScene(QPointF(x, y))
    point = view.plot.mapFromScene(scene)
    return view.plot.grab().toImage().pixelColor(point.x(), point.y()).name()


def test_shading_is_orange_left_of_the_date_and_clear_right_of_it(view, qtbot):
    view.show()
    qtbot.waitExposed(view)
    view.plot.markers[0].setValue(45.0)
    height = 0.3 * norm.pdf(44, 44, 3)
    assert _pixel(view, 42.5, height) == "#e69f00"        # under the curve, before the date
    assert _pixel(view, 46.5, height) == "#ffffff"        # under the curve, after the date
    view.set_mode("after")
    assert _pixel(view, 42.5, height) == "#ffffff"
    assert _pixel(view, 46.5, height) == "#e69f00"


def test_progress_reaches_the_window_while_the_worker_runs(view, qtbot):
    seen = []
    view.runner.progress.connect(lambda done, total: seen.append((done, total, view.controls.progress.value())))
    _run(view, qtbot, iterations=12_000)
    assert len(seen) >= 2                                   # the event loop ran during the run
    assert [d for d, _, _ in seen] == sorted(d for d, _, _ in seen) and seen[-1][0] == seen[-1][1]
    assert view.controls.progress.value() == 100 and view.controls.button.text() == "Run simulation"


def test_inverse_question_follows_the_plan_target(view):
    assert view.confidence == pytest.approx(0.9)
    other = house_plan()
    other.set_settings(replace(other.settings, target_confidence=0.8))
    view.session.load(other)
    assert view.confidence == pytest.approx(0.8)
    assert view.panel.inverse.text().startswith("<b>80 %</b>")
    view.ask_confidence("95 %")                       # the planner's own choice stays
    view.session.push(EditActivity("A", pessimistic=4))
    assert view.confidence == pytest.approx(0.95)


@pytest.mark.parametrize("width", [1400, 760, 560])
def test_the_answer_text_stays_inside_the_curve_plot(view, qtbot, width):
    """In a narrow dock the PERT answer's text goes to whichever side of its diamond has
    room, or above it, never past the plot's edges (a plot narrower than the text shows
    it from its left edge)."""
    view.resize(width, 700)
    view.show()
    qtbot.waitExposed(view)
    for typed in ("50 %", "80 %", "99 %"):
        view.panel.typed.setText(typed)
        view.panel.typed.returnPressed.emit()
        qtbot.wait(10)
        vb = view.plot.density.vb
        box = vb.mapRectToScene(vb.boundingRect())
        text = view.plot.answer_text.mapRectToScene(view.plot.answer_text.boundingRect())
        if text.width() <= box.width():
            assert box.left() - 4 <= text.left() and text.right() <= box.right() + 4, (typed, text, box)
        else:                                  # wider than the plot: from its left edge
            assert abs(text.left() - box.left()) <= 4, (typed, text, box)   # (the text's own margin)


def test_a_result_shown_from_elsewhere_sets_the_run_boxes(view):
    """The seed and iterations boxes show what produced the result on screen, so Run
    repeats it; a box set to 'random' stays random."""
    from workbench.core.montecarlo import simulate
    view.session.set_simulation(simulate(view.session.plan, 700, seed=4321))
    assert view.controls.iterations.value() == 700 and view.controls.seed_value() == 4321
    view.controls.seed.setValue(view.controls.seed.minimum())          # 'random'
    view.session.set_simulation(simulate(view.session.plan, 900, seed=55))
    assert view.controls.iterations.value() == 900 and view.controls.seed_value() is None


def test_a_view_opened_after_a_run_shows_that_runs_seed(qtbot):
    from workbench.core.montecarlo import simulate
    session = Session(house_plan())
    session.set_simulation(simulate(session.plan, 600, seed=808))
    v = OddsView(session)
    qtbot.addWidget(v)
    assert v.controls.iterations.value() == 600 and v.controls.seed_value() == 808


@pytest.mark.parametrize("size, stacked", [((1400, 900), False), ((600, 900), True), ((600, 400), False)])
def test_a_narrow_tall_view_puts_the_panel_under_the_curves(view, qtbot, size, stacked):
    """In a narrow, tall dock the curves keep the whole width and the panel goes below;
    a short one keeps them side by side (the curves would be too flat otherwise)."""
    from PySide6.QtCore import Qt
    view.resize(*size)
    view.show()
    qtbot.waitExposed(view)
    qtbot.wait(10)
    vertical = view.splitter.orientation() == Qt.Orientation.Vertical
    assert vertical == stacked
    if stacked:
        assert view.plot.width() >= view.width() - 20
        assert view.plot.height() >= 0.4 * view.height()
