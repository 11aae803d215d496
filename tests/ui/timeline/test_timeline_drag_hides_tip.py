"""While a bar's end is dragged, the hover text (shown while the pointer rested on the
bar) goes away and stays away, so it does not cover the drag note or the bars around it."""

from PySide6.QtCore import QPoint, Qt
from PySide6.QtTest import QTest
from PySide6.QtWidgets import QToolTip

from test_timeline_drag_readout import bar_end, press_move, px, view  # noqa: F401 (fixture)


def _hover_at(view, point: QPoint) -> None:
    """What the chart does when the pointer moves over ``point`` (a hover event)."""
    data = view.item.deviceTransform_().inverted()[0].map(point.toPointF())
    view._hover(data, view.plot.mapToGlobal(point))


def test_the_hover_text_is_gone_while_dragging(view, qtbot):
    row, es, ef = bar_end(view, "C")
    start = px(view, ef, row)
    _hover_at(view, start)                                   # the pointer rests on the bar's end
    assert view.item.toolTip() and QToolTip.isVisible()
    vp = press_move(view, start, start + QPoint(60, 0))
    assert view.bar_drag.active is not None
    _hover_at(view, start + QPoint(60, 0))                   # hovering on while dragging
    assert view.item.toolTip() == ""
    qtbot.waitUntil(lambda: not QToolTip.isVisible(), timeout=2000)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start + QPoint(60, 0))
