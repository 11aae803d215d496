"""Spin boxes and drop-down lists take the mouse wheel only when they have the focus: a
wheel turned over a panel scrolls the panel instead of changing the seed or the iterations
that happen to pass under the pointer."""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, QPointF
from PySide6.QtGui import QWheelEvent
from PySide6.QtWidgets import QAbstractScrollArea, QAbstractSpinBox, QApplication, QComboBox

GUARDED = (QAbstractSpinBox, QComboBox)


class WheelGuard(QObject):
    """An application-wide event filter: an unfocused field hands the wheel to the scroll
    area around it (or lets it pass by, when there is none)."""

    def eventFilter(self, watched, event) -> bool:  # noqa: N802 (Qt override)
        if event.type() != QEvent.Type.Wheel or not isinstance(watched, GUARDED) or watched.hasFocus():
            return False
        area = watched.parentWidget()
        while area is not None and not isinstance(area, QAbstractScrollArea):
            area = area.parentWidget()
        if area is not None:   # the panel the field sits in scrolls instead
            port = area.viewport()
            where = QPointF(port.mapFromGlobal(event.globalPosition().toPoint()))
            QApplication.sendEvent(port, QWheelEvent(
                where, event.globalPosition(), event.pixelDelta(), event.angleDelta(), event.buttons(),
                event.modifiers(), event.phase(), event.inverted()))
        return True


def install_wheel_guard(app) -> WheelGuard:
    guard = getattr(app, "_wheel_guard", None)
    if guard is None:
        guard = WheelGuard(app)
        app.installEventFilter(guard)
        app._wheel_guard = guard
    return guard
