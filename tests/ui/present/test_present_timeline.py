"""Present mode's Timeline slide on a 1024×768 projector: groups folded so every row fits
large, keys to open them or show the critical path, reference-line labels apart, whole
date labels. Geometry and pixel facts, offscreen Qt."""

from __future__ import annotations

import numpy as np
import pytest
from PySide6.QtCore import Qt

from workbench.core.montecarlo import simulate
from workbench.figures import style
from workbench.ui.present.shots import _plan
from workbench.ui.session import Session

from support.ui import present_at
from workbench.ui.timeline.present import group_names


@pytest.fixture(scope="module")
def demo():
    plan = _plan(None)
    return plan, simulate(plan, iterations=500, seed=3)


@pytest.fixture
def slide(qtbot, demo):
    plan, sim = demo
    session = Session(plan.copy())
    session.set_simulation(sim)
    win = present_at(qtbot, session, 1)
    qtbot.wait(20)
    view = win.stack.currentWidget()
    assert win.current_title() == "Timeline"
    return win, view


def rows_in_view(view):
    (_, _), (top, bottom) = view.view_box.viewRange()
    return top, bottom


def row_px(view) -> float:
    top, bottom = rows_in_view(view)
    return view.view_box.height() / (bottom - top)


def test_opens_with_groups_folded_and_every_row_in_view_at_a_large_size(slide):
    win, view = slide
    geo = view.geometry
    groups = group_names(view.session.plan)
    assert len(groups) >= 2 and geo.n_rows == len(groups)          # one summary row per group
    assert set(geo.kinds) == {"group"}
    top, bottom = rows_in_view(view)
    assert top <= -0.5 and bottom >= geo.n_rows - 0.5                # no row cut off
    assert row_px(view) >= style.PRESENT.row_height                 # at least Present's row size
    assert "G:" in win.counter.text()                               # the keys are on the slide


def test_g_opens_every_group_and_folds_them_again(slide, qtbot):
    win, view = slide
    n_acts = len(view.session.plan.activities)
    qtbot.keyClick(view.plot, Qt.Key.Key_G)
    assert view.geometry.n_rows == n_acts + len(group_names(view.session.plan))
    top, bottom = rows_in_view(view)
    assert top <= -0.5 and bottom >= view.geometry.n_rows - 0.5
    qtbot.keyClick(view.plot, Qt.Key.Key_G)
    assert view.geometry.n_rows == len(group_names(view.session.plan))


def test_c_shows_the_critical_activities_themselves(slide, qtbot):
    win, view = slide
    qtbot.keyClick(view.plot, Qt.Key.Key_C)
    geo = view.geometry
    critical = set(view.session.analysis.pert.path)
    shown = {k for k, kind in zip(geo.keys, geo.kinds) if kind != "group"}
    assert critical <= shown and shown <= set(view.session.plan.ids())
    assert win.current_title() == "Timeline"                        # the key did not step slides
    qtbot.keyClick(view.plot, Qt.Key.Key_C)
    assert not view.critical_only


def test_finish_p10_and_p90_labels_do_not_overlap(slide):
    _, view = slide
    assert {"p10", "p90"} <= set(view._lines)
    a = view._lines["p10"].label.sceneBoundingRect()
    b = view._lines["p90"].label.sceneBoundingRect()
    assert a.height() > 10 and b.height() > 10
    assert not a.intersects(b)


def test_date_labels_are_whole_and_inside_the_slide(slide):
    win, view = slide
    axis = view.date_axis
    labels = axis.shown_labels()
    assert len(labels) >= 2
    _, (_, xs), texts = axis.generateDrawSpecs(None)
    room = axis.boundingRect()
    font_px = axis.style["tickFont"].pixelSize()
    assert font_px >= 16
    for x, top, w, text in texts:
        assert room.left() <= x and x + w <= room.right()
        assert top + font_px <= room.bottom() + 1                   # not cut at the foot
    bottom = axis.mapRectToScene(room).bottom()
    assert bottom <= view.plot.height()


def test_date_labels_are_drawn_below_the_chart(slide):
    win, view = slide
    image = view.plot.grab().toImage()
    axis_rect = view.date_axis.mapRectToScene(view.date_axis.boundingRect()).toRect()
    band = np.array([[image.pixelColor(x, y).lightness() for x in range(axis_rect.left(), axis_rect.right(), 2)]
                     for y in range(axis_rect.top() + 8, min(axis_rect.bottom(), image.height() - 1))])
    assert (band < 100).sum() > 50                                   # dark text pixels under the ticks


def test_the_finish_lines_come_with_the_odds_caution(slide):
    win, view = slide
    assert {"p10", "p90"} <= set(view._lines)                       # simulated finish lines drawn
    assert win.caution.isVisible() and "judgement" in win.caution.text()
