"""The cost-versus-chance chart keeps both ends of its chance axis labelled, "100" at the
right edge included, from a narrow dock to a large screen; the textbook plan's label stays
clear of the axes."""

import pytest
from PySide6.QtGui import QColor, QImage, QPainter

from workbench.core.demo import demo_plan
from workbench.ui.session import Session
from workbench.ui.tradeoff.charts import label_anchor as _label_anchor
from workbench.ui.tradeoff.view import TradeoffView


@pytest.fixture
def view(qtbot):
    v = TradeoffView(Session(demo_plan()))
    qtbot.addWidget(v)
    v.show()
    qtbot.waitExposed(v)
    qtbot.waitUntil(lambda: v.result is not None, timeout=30000)
    yield v
    v.runner.stop()
    v.runner.wait()


def drawn_labels(axis) -> dict:
    """{text: rect in the axis's coordinates} of the tick labels the axis draws now."""
    image = QImage(8, 8, QImage.Format.Format_ARGB32)
    painter = QPainter(image)
    try:
        _, _, texts = axis.generateDrawSpecs(painter)
    finally:
        painter.end()
    return {text: rect for rect, _, text in texts}


def dark_pixels(image: QImage, rect) -> int:
    count = 0
    for x in range(max(rect.left(), 0), min(rect.right() + 1, image.width())):
        for y in range(max(rect.top(), 0), min(rect.bottom() + 1, image.height())):
            if QColor(image.pixel(x, y)).lightness() < 110:
                count += 1
    return count


@pytest.mark.parametrize("size", [(640, 480), (800, 600), (1024, 768), (1920, 1080)])
def test_both_ends_of_the_chance_axis_are_labelled_on_screen(qtbot, view, size):
    view.resize(*size)
    view.arrangement.show_page("Cost vs chance")         # behind a tab when the view is narrow
    qtbot.waitUntil(lambda: view.chance_plot.isVisible() and view.size().width() == size[0])
    qtbot.wait(20)
    axis, plot = view.chance_axis, view.chance_plot
    labels = drawn_labels(axis)
    assert {"0", "100"} <= set(labels), sorted(labels)
    shown = plot.mapFromScene(axis.mapToScene(labels["100"])).boundingRect()
    assert shown.left() >= 0 and shown.right() <= plot.width() - 1          # inside the widget, not cut
    image = plot.grab().toImage()
    assert dark_pixels(image, shown) >= 10                                   # and really painted there


def test_the_textbook_label_sits_beside_its_point_away_from_the_nearer_side():
    assert _label_anchor(42.0, True)[0] > 1          # right-aligned: to the left of the point
    assert _label_anchor(12.0, True)[0] < 0          # near the left axis: to its right
    assert _label_anchor(42.0, True)[1] == 0.5 and _label_anchor(90.0, False)[1] > 1
