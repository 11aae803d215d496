"""Run something once a widget has been painted for the first time: the window shows the
plan in its table first, and builds the charts (and imports what they need) just after,
instead of staying blank until everything is ready."""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, QTimer

LATEST_MS = 2000    # no paint by then (a covered window): go ahead anyway (a view is built only on screen)


class AfterFirstPaint(QObject):
    """Calls ``then`` once, in the event loop pass after ``widget``'s first paint (or after
    :data:`LATEST_MS`, whichever comes first). Lives as long as ``widget``."""

    def __init__(self, widget, then):
        super().__init__(widget)
        self._then = then
        self._done = False
        widget.installEventFilter(self)
        QTimer.singleShot(LATEST_MS, self, self._fire)

    def eventFilter(self, watched, event) -> bool:  # noqa: N802 (Qt override)
        if event.type() == QEvent.Type.Paint and not self._done:
            QTimer.singleShot(0, self, self._fire)     # after this paint has reached the screen
        return False

    def _fire(self) -> None:
        if not self._done:
            self._done = True
            self.parent().removeEventFilter(self)
            self._then()
