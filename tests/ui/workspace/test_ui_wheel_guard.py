"""The wheel over an unfocused spin box scrolls the panel; a focused one takes it."""

from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtGui import QWheelEvent
from PySide6.QtWidgets import QApplication, QScrollArea, QSpinBox, QVBoxLayout, QWidget

from workbench.ui.workspace.wheel_guard import install_wheel_guard


def wheel(widget, steps: int = -1) -> None:
    centre = QPointF(widget.rect().center())
    event = QWheelEvent(centre, QPointF(widget.mapToGlobal(widget.rect().center())), QPoint(0, 0),
                        QPoint(0, 120 * steps), Qt.MouseButton.NoButton, Qt.KeyboardModifier.NoModifier,
                        Qt.ScrollPhase.NoScrollPhase, False)
    QApplication.sendEvent(widget, event)


def panel_with_seed(qtbot):
    area = QScrollArea()
    inner = QWidget()
    inner.setMinimumHeight(2000)
    seed = QSpinBox(inner)
    seed.setRange(0, 1000)
    seed.setValue(500)
    QVBoxLayout(inner).addWidget(seed)
    area.setWidget(inner)
    area.setWidgetResizable(True)
    area.resize(300, 200)
    qtbot.addWidget(area)
    area.show()
    qtbot.waitExposed(area)
    return area, seed


def test_unfocused_spin_box_leaves_the_wheel_to_the_panel(qtbot, qapp):
    install_wheel_guard(qapp)
    area, seed = panel_with_seed(qtbot)
    area.setFocus()
    wheel(seed)
    assert seed.value() == 500
    assert area.verticalScrollBar().value() > 0


def test_focused_spin_box_takes_the_wheel(qtbot, qapp):
    install_wheel_guard(qapp)
    area, seed = panel_with_seed(qtbot)
    seed.setFocus()
    qtbot.waitUntil(seed.hasFocus)
    wheel(seed, 1)
    assert seed.value() == 501
