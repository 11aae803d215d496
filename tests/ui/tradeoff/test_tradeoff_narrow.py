"""The Trade-off view in a dock of a 1024×768 projector (about 580×330 bottom left, 410×330
bottom right): its least width fits the dock's scroller, so nothing scrolls sideways; the
charts are shown one at a time and every page can be brought forward; on a large screen the
view is laid out side by side as before; switching keeps what was found."""

import pytest

from workbench.core.demo import demo_plan
from workbench.ui.session import Session
from workbench.ui.tradeoff.arrangement import PAGES
from workbench.ui.tradeoff.view import TradeoffView

from support.ui import in_dock_frame


@pytest.fixture
def docked(qtbot):
    """A view in a dock's holder and scroller (as the window makes them), in a frame that is
    resized like the dock."""
    view = TradeoffView(Session(demo_plan()))
    frame, area = in_dock_frame(qtbot, view, (1600, 900), holder=True)
    qtbot.waitUntil(lambda: view.result is not None, timeout=30000)
    yield frame, area, view
    view.runner.stop()
    view.runner.wait()


def resize_to(qtbot, frame, view, size, narrow: bool) -> None:
    frame.resize(*size)
    qtbot.waitUntil(lambda: view.arrangement.narrow == narrow and frame.size().toTuple() == size)
    qtbot.wait(20)          # the scroller settles its bars after the layout


@pytest.mark.parametrize("size", [(580, 330), (410, 330)])
def test_in_a_projector_dock_nothing_scrolls_sideways_and_every_page_is_reachable(qtbot, docked, size):
    frame, area, view = docked
    resize_to(qtbot, frame, view, size, narrow=True)
    assert view.minimumSizeHint().width() <= area.viewport().width()
    assert not area.horizontalScrollBar().isVisible()
    assert view.width() <= area.viewport().width()
    tabs = view.arrangement.tabs
    assert tabs.isVisible() and [tabs.tabText(i) for i in range(tabs.count())] == list(PAGES)
    for name, chart in (("Cost by date", view.curve_plot), ("Cost vs chance", view.chance_plot)):
        view.arrangement.show_page(name)
        qtbot.waitUntil(chart.isVisible)
        others = [c for c in (view.curve_plot, view.chance_plot) if c is not chart]
        assert not any(c.isVisible() for c in others)        # one chart at a time, the whole width
        assert chart.width() >= area.viewport().width() - 40
        title = chart.getPlotItem().titleLabel
        assert title.item.boundingRect().width() <= chart.width()          # the title whole
    view.arrangement.show_page("What to buy")
    qtbot.waitUntil(view.table.isVisible)
    assert view.option.isVisible() and view.apply.isVisible() and not view.curve_plot.isVisible()


def test_on_a_large_screen_the_charts_sit_side_by_side(qtbot, docked):
    frame, area, view = docked
    resize_to(qtbot, frame, view, (1600, 900), narrow=False)
    assert not view.arrangement.tabs.isVisible()
    curve, chance = view.curve_plot, view.chance_plot
    assert curve.isVisible() and chance.isVisible() and view.table.isVisible()
    left, right = (w.geometry().translated(w.parentWidget().mapTo(view, w.pos() * 0)) for w in (curve, chance))
    assert left.right() < right.left() and left.top() == right.top()
    status, find = (w.geometry().translated(w.parentWidget().mapTo(view, w.pos() * 0)) for w in (view.status, view.find))
    assert status.left() > find.right() and status.top() < find.bottom()          # beside the controls


def test_a_short_view_shows_one_page_at_a_time_too(qtbot, docked):
    frame, area, view = docked
    resize_to(qtbot, frame, view, (1200, 400), narrow=True)
    assert not area.horizontalScrollBar().isVisible()


def test_switching_back_and_forth_keeps_the_results_and_the_option(qtbot, docked, monkeypatch):
    frame, area, view = docked
    view.iterations.setValue(300)
    view.search()
    qtbot.waitUntil(lambda: not view.runner.running and bool(view.result.confidence), timeout=60000)
    view.option.setCurrentIndex(view.option.count() - 2)      # the last confidence plan
    chosen, result, rows = view.option.currentText(), view.result, view.table.rowCount()
    starts = []
    monkeypatch.setattr(view.runner, "start", lambda *a, **k: starts.append(a))
    view.arrangement.show_page("Cost vs chance")
    for size, narrow in (((580, 330), True), ((1600, 900), False), ((410, 330), True), ((1600, 900), False)):
        resize_to(qtbot, frame, view, size, narrow)
        assert view.result is result and view.option.currentText() == chosen and view.table.rowCount() == rows
    assert starts == []                                        # nothing was computed again
    resize_to(qtbot, frame, view, (580, 330), True)
    assert view.arrangement.page_visible("Cost vs chance")     # the page shown before stays in front


def test_the_curve_legend_sits_under_a_short_chart_and_in_it_on_a_tall_one(qtbot, docked):
    frame, area, view = docked
    legend, strip = view.curve_plot.getPlotItem().legend, view.arrangement.strip
    assert legend.isVisible() and not strip.isVisible()
    resize_to(qtbot, frame, view, (580, 330), narrow=True)
    qtbot.waitUntil(strip.isVisible)
    assert not legend.isVisible()
    assert [label.text for _, label in strip.items] == ["direct", "indirect", "total", "least total cost"]
    box, row = view.curve_plot.getPlotItem().vb.sceneBoundingRect(), strip.sceneBoundingRect()
    assert row.top() >= box.bottom()                           # under the plot, over no curve


def test_labels_keep_room_on_a_short_chart():
    from workbench.ui.tradeoff.charts import room_range

    bottom, top = room_range(0.0, 100.0, (95.0, 30.0), (0.0, 10.0), 100.0)
    span = top - bottom
    assert (top - 95.0) / span * 100.0 == pytest.approx(30.0)   # 30 px above the label's point
    assert (0.0 - bottom) / span * 100.0 == pytest.approx(10.0)  # 10 px under the lowest marker
    assert room_range(0.0, 100.0, (50.0, 10.0), (40.0, 10.0), 400.0) == (0.0, 100.0)   # room enough already


def test_one_page_at_a_time_the_search_cancels_and_an_option_applies_by_its_buttons(qtbot, docked):
    from PySide6.QtCore import Qt

    frame, area, view = docked
    resize_to(qtbot, frame, view, (580, 330), narrow=True)
    view.arrangement.show_page("Cost vs chance")
    qtbot.waitUntil(view.find.isVisible)                       # the controls sit above the chance chart
    view.iterations.setValue(20000)
    qtbot.mouseClick(view.find, Qt.MouseButton.LeftButton)
    qtbot.waitUntil(lambda: view.cancel.isVisible() and view.cancel.isEnabled())
    qtbot.mouseClick(view.cancel, Qt.MouseButton.LeftButton)
    qtbot.waitUntil(lambda: not view.runner.running, timeout=60000)
    assert "cancelled" in view.status.text()
    view.iterations.setValue(300)
    qtbot.mouseClick(view.find, Qt.MouseButton.LeftButton)
    qtbot.waitUntil(lambda: not view.runner.running and bool(view.result.confidence), timeout=60000)
    view.arrangement.show_page("What to buy")
    qtbot.waitUntil(view.apply.isVisible)
    labels = [view.option.itemText(i) for i in range(view.option.count())]
    view.option.setCurrentIndex(labels.index("90 % chance of the deadline"))
    steps = view.session.undo_stack.count()
    qtbot.mouseClick(view.apply, Qt.MouseButton.LeftButton)
    assert view.session.undo_stack.count() == steps + 1
    assert view.session.plan.settings.bought.label == "90 % chance of the deadline"
