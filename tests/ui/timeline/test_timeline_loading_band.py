"""The loading band under the Timeline: it shares the Timeline's date axis (pan and zoom
either one, both follow), marks over-allocation where core.loading finds it, hides for a
plan without resources, and the user's choice to hide it is remembered."""

import numpy as np
import pytest

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.core.loading import plan_loading
from workbench.ui.session import Session
from workbench.ui.timeline.view import TimelineView

from support.plans import small_plan
from support.ui import shown


def _shown(qtbot, plan, size=(1024, 768)):
    v = shown(qtbot, TimelineView(Session(plan)), size)
    v.fit_all()
    return v


def _x(view_box):
    return np.array(view_box.viewRange()[0])


def test_band_follows_the_timeline_zoom_and_pan_both_ways(ui_env, qtbot):
    v = _shown(qtbot, demo_plan())
    assert v.band.isVisible()
    v.zoom(2.0)
    v.pan(0.3)
    assert _x(v.band.view_box) == pytest.approx(_x(v.view_box))
    before = _x(v.view_box)
    v.band.view_box.scaleBy((0.5, 1.0))              # zoom in the band: the Timeline follows
    assert _x(v.view_box) == pytest.approx(_x(v.band.view_box))
    assert np.ptp(_x(v.view_box)) == pytest.approx(0.5 * np.ptp(before), rel=1e-6)


def test_the_same_date_sits_at_the_same_pixel_column(ui_env, qtbot):
    v = _shown(qtbot, demo_plan(), (1920, 1080))
    v.zoom(1.5)
    for x in (20.0, 60.0, 100.0):
        a = v.plot.mapToGlobal(v.plot.mapFromScene(v.view_box.mapViewToScene(_pt(x, 0))))
        b = v.band.plot.mapToGlobal(v.band.plot.mapFromScene(v.band.view_box.mapViewToScene(_pt(x, 0))))
        assert abs(a.x() - b.x()) <= 1


def _pt(x, y):
    from PySide6.QtCore import QPointF
    return QPointF(x, y)


def test_over_allocated_steps_are_drawn_where_core_loading_finds_them(ui_env, qtbot):
    v = _shown(qtbot, demo_plan())
    loads = plan_loading(analyze(demo_plan()))
    assert [f.name for f in v.band.figures] == [l.name or l.resource for l in loads]
    for load, fig, items in zip(loads, v.band.figures, v.band.items):
        marked = items[1:-1]                          # one item per over-allocated run
        spans = [v for i in marked for v in (float(i.xData[0]), float(i.xData[-1]))]
        assert spans == pytest.approx([v for a, b, *_ in load.over for v in (a, b)])
    assert any(len(items) > 2 for items in v.band.items)     # the demo's crews are over-allocated
    ticks = v.band.axis._tickLevels[0]
    assert any(text.startswith("Over: ") for _, text in ticks)


def test_hidden_without_resources_and_the_choice_is_remembered(ui_env, qtbot):
    plain = _shown(qtbot, small_plan())
    assert not plain.band.isVisible() and not plain.actions_by_name["loading"].isVisible()
    v = _shown(qtbot, demo_plan())
    assert v.band.isVisible() and v.actions_by_name["loading"].isChecked()
    v.actions_by_name["loading"].trigger()
    assert not v.band.isVisible()
    again = _shown(qtbot, demo_plan())                # a new window remembers it
    assert not again.band.isVisible() and not again.actions_by_name["loading"].isChecked()
    again.set_loading_band(True)
    assert again.band.isVisible()


def test_present_mode_leaves_the_band_out_and_brings_it_back(ui_env, qtbot):
    v = _shown(qtbot, demo_plan())
    v.set_present(True)
    assert not v.band.isVisible()
    v.set_present(False)
    assert v.band.isVisible()
