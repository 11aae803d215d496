"""The loading chart's highest unit label is drawn whole, not cut by the chart's top edge."""

import pytest
from PySide6.QtGui import QImage, QPainter

from workbench.core.demo import demo_plan
from workbench.ui.resources.view import ResourcesView
from workbench.ui.session import Session
from support.ui import shown


@pytest.mark.parametrize("size", [(580, 420), (1200, 800)])
def test_the_top_unit_label_is_inside_the_chart(qtbot, size):
    view = shown(qtbot, ResourcesView(Session(demo_plan())), size)
    try:
        qtbot.wait(50)
        axis = view.plot.getAxis("left")
        image = QImage(8, 8, QImage.Format.Format_ARGB32)
        painter = QPainter(image)
        try:
            _, _, texts = axis.generateDrawSpecs(painter)
        finally:
            painter.end()
        top = max((axis.mapRectToScene(rect) for rect, _, text in texts if text), key=lambda r: -r.top())
        assert top.top() >= 0, top                       # the scene is the chart widget
    finally:
        view.odds.stop()
