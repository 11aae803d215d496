"""The Drivers view in the bottom-right dock of a 1024×768 projector (about 410×330) and on a
large screen: no sideways scrolling, the placeholder and the legend line wrap at the dock's
width, the charts one at a time with rows that never run into each other."""

import pytest
from PySide6.QtCore import QPointF
from PySide6.QtGui import QFontMetrics

from workbench.core.montecarlo import simulate
from workbench.ui.drivers.view import DriversView
from workbench.ui.session import Session

from support.plans import house_plan
from support.ui import in_dock_frame


@pytest.fixture
def docked(qtbot):
    """A view in a dock's holder and scroller (as the window makes them), in a frame
    resized like the dock."""
    view = DriversView(Session(house_plan()))
    frame, area = in_dock_frame(qtbot, view, (410, 330), holder=True)
    return frame, area, view


def settle(qtbot, frame, size):
    frame.resize(*size)
    qtbot.waitUntil(lambda: frame.size().toTuple() == size)
    qtbot.wait(30)


@pytest.mark.parametrize("size", [(410, 330), (580, 330)])
def test_the_placeholder_wraps_inside_the_dock_and_shows(qtbot, docked, size):
    frame, area, view = docked
    settle(qtbot, frame, size)
    label = view.placeholder
    assert view.stack.currentWidget() is label
    assert view.minimumSizeHint().width() <= area.viewport().width()
    assert not area.horizontalScrollBar().isVisible() and not area.verticalScrollBar().isVisible()
    assert label.width() <= area.viewport().width()
    assert label.height() <= area.viewport().height()               # all of it in sight, none below
    line = QFontMetrics(label.font()).lineSpacing()
    assert label.heightForWidth(label.width()) >= 2 * line        # on more than one line: wrapped


def test_with_a_simulation_the_charts_come_one_at_a_time(qtbot, docked):
    frame, area, view = docked
    view.session.set_simulation(simulate(view.session.plan, 1000, seed=3))
    settle(qtbot, frame, (410, 330))
    assert view.narrow and view.tabs.isVisible()
    assert view.minimumSizeHint().width() <= area.viewport().width()
    assert not area.horizontalScrollBar().isVisible()
    assert view.legend.width() <= area.viewport().width()
    for index, chart in enumerate((view.criticality, view.sensitivity)):
        view.tabs.setCurrentIndex(index)
        qtbot.waitUntil(chart.isVisible)
        other = view.sensitivity if chart is view.criticality else view.criticality
        assert not other.isVisible()
        qtbot.wait(20)
        vb = chart.getPlotItem().vb
        step = abs(vb.mapViewToScene(QPointF(0, 0)).y() - vb.mapViewToScene(QPointF(0, -1)).y())
        assert step >= QFontMetrics(chart._font).height()           # row labels never overlap


def test_on_a_large_screen_both_charts_side_by_side(qtbot, docked):
    frame, area, view = docked
    view.session.set_simulation(simulate(view.session.plan, 1000, seed=3))
    settle(qtbot, frame, (1400, 800))
    assert not view.narrow and not view.tabs.isVisible()
    assert view.criticality.isVisible() and view.sensitivity.isVisible()
    assert view.criticality.geometry().right() < view.sensitivity.geometry().left()
    settle(qtbot, frame, (410, 330))
    assert view.narrow and view.criticality.isVisible() != view.sensitivity.isVisible()
