"""The Timeline's hover text stays while the pointer rests on a bar: the tooltip event Qt
sends once the pointer stops (about 0.7 s later) must not hide it."""

from PySide6.QtCore import QEvent, QPointF
from PySide6.QtGui import QHelpEvent
from PySide6.QtWidgets import QApplication, QToolTip

from support.plans import small_plan
from workbench.ui.session import Session
from workbench.ui.timeline.tooltip import tooltip_text
from workbench.ui.timeline.view import TimelineView
from support.ui import shown


def test_tooltip_survives_the_pointer_coming_to_rest(qtbot):
    session = Session(small_plan())
    view = shown(qtbot, TimelineView(session), (1000, 500))
    qtbot.wait(50)                                            # laid out
    view.fit_all()
    qtbot.wait(50)
    row = view.geometry.row_of["C"]
    s = session.analysis.schedule
    x = (s.es[s.index("C")] + s.ef[s.index("C")]) / 2
    local = view.item.deviceTransform_().map(QPointF(x, row)).toPoint()
    viewport = view.plot.viewport()
    screen = viewport.mapToGlobal(local)
    view._hover(QPointF(x, row), screen)                      # what a hover over bar C does
    view.item.on_hover = None        # the pointer rests: no further hover (offscreen: no real pointer)
    expected = tooltip_text(session.analysis, None, "C")
    assert QToolTip.isVisible() and QToolTip.text() == expected
    # Qt's tooltip event, answered by the scene from the item under the pointer
    QApplication.sendEvent(viewport, QHelpEvent(QEvent.Type.ToolTip, local, screen))
    qtbot.wait(600)                                           # past the 300 ms a hidden tip fades in
    assert QToolTip.isVisible() and QToolTip.text() == expected
