"""The Odds charts' y-axis titles in the dock sizes of a 1024×768 projector (about 410×330
and 580×330) and on a large screen: the density's and the S-curve's titles, one above the
other, never touch (no run-on "ChanceLikelihood"), each sits left of its own plot and
within its height; the view needs no sideways scrolling in the dock's scroller; a low
S-curve marks its chances at halves only; a narrow date axis keeps its labels further
apart (but never down to a single date)."""

import pytest
from PySide6.QtCore import QRectF
from PySide6.QtGui import QFont, QFontMetricsF

from workbench.core.demo import demo_plan
from workbench.ui.odds import chance_axis
from workbench.ui.date_axis import DateAxis
from workbench.ui.odds.axis import NARROW_AXIS_PX, NARROW_GAP_PX, OddsAxis
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session

from support.dock_fit import run_window
from support.ui import in_dock_frame

SIZES = [(410, 330), (580, 330), (1920, 1080)]


@pytest.fixture(params=SIZES, ids=lambda s: f"{s[0]}x{s[1]}")
def docked(request, qtbot):
    """The demo's Odds view in the window's dock frame (a scroller), placed and measured."""
    view = OddsView(Session(demo_plan()))
    host, area = in_dock_frame(qtbot, view, request.param)
    plot = view.plot
    qtbot.waitUntil(lambda: all(hasattr(p, "_y_room") for p in (plot.density, plot.cumulative))
                    and not plot._placing)
    yield view, area, host
    view.runner.stop()
    view.runner.wait(10_000)


def _title(plot):
    axis = plot.getAxis("left")
    return axis, axis.label.mapRectToScene(axis.label.boundingRect())


def test_no_sideways_scrolling_in_the_dock(docked):
    view, area, _ = docked
    assert view.minimumSizeHint().width() <= area.viewport().width()
    assert area.horizontalScrollBar().maximum() == 0


def titles_apart(plot):
    """Both charts titled; each title left of its own plot, in the middle of its height
    (a tenth of the plot free at either end); the two a clear gap (two lines) apart."""
    rects = {}
    for name, chart in (("density", plot.density), ("cumulative", plot.cumulative)):
        axis, rect = _title(chart)
        assert axis.label.isVisible() and axis.labelText, name          # both titled at these sizes
        box = chart.vb.sceneBoundingRect()
        assert rect.right() <= box.left(), name                          # left of its own plot
        free = 0.1 * box.height()
        assert box.top() + free <= rect.top() and rect.bottom() <= box.bottom() - free, (name, rect, box)
        rects[name] = rect
    upper, lower = rects["density"], rects["cumulative"]
    assert not upper.intersects(lower)
    line = QFontMetricsF(plot.density.getAxis("left").label.font()).height()
    assert lower.top() - upper.bottom() >= 2 * line, (upper, lower)      # a clear gap, not a run-on
    assert plot.density.getAxis("left").labelText != plot.cumulative.getAxis("left").labelText


def test_the_two_titles_stay_apart_each_beside_its_own_plot(docked):
    titles_apart(docked[0].plot)


def test_the_titles_in_the_window_at_1024x768(tmp_path):
    seen = run_window(tmp_path, 1024, 768, "Odds")
    assert seen["window"][0] <= 1024 and 380 <= seen["dock"][0] <= 460      # the dock as the planner saw it
    assert not seen["sideways"] and seen["min_width"] <= seen["viewport"][0]
    upper, lower = (QRectF(*seen["titles"][n]["label"]) for n in ("density", "cumulative"))
    for name in ("density", "cumulative"):
        title, box = seen["titles"][name], QRectF(*seen["titles"][name]["plot"])
        rect = QRectF(*title["label"])
        assert title["shown"] and title["text"], name
        assert rect.right() <= box.left() and box.top() <= rect.top() and rect.bottom() <= box.bottom(), name
    assert not upper.intersects(lower) and lower.top() - upper.bottom() >= 2 * seen["line"]


def test_a_low_s_curve_marks_halves_and_a_tall_one_the_usual_ticks(docked):
    view, _, _ = docked
    axis = view.plot.cumulative.getAxis("left")
    low = view.plot.cumulative.vb.height() < chance_axis.LOW_PLOT_PX
    assert axis.low == low
    assert (axis._tickLevels == chance_axis.HALVES) if low else axis._tickLevels is None
    assert low == (view.height() < 400)                 # the docks are low, the large screen is not


def _dates(axis, lo, hi, size):
    return [axis._labels[round(x, 6)] for x in axis.tickValues(lo, hi, size)[0][1]]


def test_a_narrow_date_axis_keeps_its_labels_further_apart_but_never_leaves_one_alone(qtbot):
    calendar = Session(demo_plan()).analysis.calendar
    usual, odds = DateAxis("bottom"), OddsAxis("bottom")
    for axis in (usual, odds):
        axis.set_calendar(calendar)
    metrics = QFontMetricsF(QFont())
    for lo, hi in ((120, 135), (90, 180), (110, 140), (100, 160)):
        for size in range(140, NARROW_AXIS_PX, 20):
            mine, theirs = _dates(odds, lo, hi, size), _dates(usual, lo, hi, size)
            assert len(mine) >= min(2, len(theirs)) and len(mine) <= len(theirs), (lo, hi, size)
            if mine != theirs:                      # further apart: the wider gap holds
                xs = [(o - lo) / (hi - lo) * size for o in odds.tickValues(lo, hi, size)[0][1]]
                for (xa, a), (xb, b) in zip(zip(xs, mine), zip(xs[1:], mine[1:])):
                    assert xb - xa >= (metrics.horizontalAdvance(a) + metrics.horizontalAdvance(b)) / 2 + NARROW_GAP_PX
        assert _dates(odds, lo, hi, 600) == _dates(usual, lo, hi, 600)      # a wide axis as everywhere
    assert _dates(usual, 120, 135, 220) == ["23 Aug", "30 Aug", "6 Sep", "13 Sep"]   # the crowded row
    assert _dates(odds, 120, 135, 220) == ["23 Aug", "6 Sep"]
    assert len(_dates(odds, 110, 140, 200)) == 4                # wider would leave "Sep 2027" alone
