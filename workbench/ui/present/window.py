"""Present mode: one chart per screen for a projector, large type, stepped with a clicker.

PageDown / Right / Down / Space / Return step forward, PageUp / Left / Up / Backspace step
back, Home and End jump, Esc returns to the window. Open it with ``open_present``."""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, Qt, Signal
from PySide6.QtGui import QColor
from PySide6.QtWidgets import QApplication, QLabel, QStackedWidget, QVBoxLayout, QWidget

from workbench.figures import style

from workbench.ui.present.slides import build_slides

FORWARD = {Qt.Key.Key_PageDown, Qt.Key.Key_Right, Qt.Key.Key_Down, Qt.Key.Key_Space, Qt.Key.Key_Return,
           Qt.Key.Key_Enter}
BACK = {Qt.Key.Key_PageUp, Qt.Key.Key_Left, Qt.Key.Key_Up, Qt.Key.Key_Backspace}
HINT = "PgDn / Space: next  \u00b7  PgUp: back  \u00b7  Esc: return"


class PresentWindow(QWidget):
    """Full-screen slides for one session; ``closed`` fires when it is left."""

    closed = Signal()

    def __init__(self, session, parent_window=None):
        super().__init__(None, Qt.WindowType.Window)
        self.session, self.parent_window = session, parent_window
        self.setWindowTitle("Slackline \u2013 Present")
        self.setAccessibleName("Present mode")
        self.slides = build_slides(session)
        self._build()
        self._filtering = False
        self.go(0)

    def _build(self) -> None:
        self.title = QLabel()
        self.counter = QLabel()
        self.caution = QLabel()
        self.caution.setWordWrap(True)
        self.caution.setAccessibleName("Caution")
        for label, size in ((self.title, 34), (self.caution, 16), (self.counter, 18)):
            label.setStyleSheet(f"color: {style.TEXT}; background: {style.BACKGROUND}; font-size: {size}px;"
                                f" font-weight: {'bold' if label is self.title else 'normal'}; padding: 6px 16px;")
        self.stack = QStackedWidget()
        for _, widget in self.slides:
            self.stack.addWidget(widget)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(0)
        layout.addWidget(self.title)
        layout.addWidget(self.stack, 1)
        layout.addWidget(self.caution)
        layout.addWidget(self.counter)
        pal = self.palette()
        pal.setColor(self.backgroundRole(), QColor(style.BACKGROUND))
        self.setPalette(pal)
        self.setAutoFillBackground(True)

    # --- stepping ------------------------------------------------------------------
    def slide_count(self) -> int:
        return len(self.slides)

    def current_index(self) -> int:
        return self.stack.currentIndex()

    def current_title(self) -> str:
        return self.slides[self.current_index()][0]

    def go(self, index: int) -> None:
        index = max(0, min(index, self.slide_count() - 1))
        self.stack.setCurrentIndex(index)
        title = self.slides[index][0]
        self.title.setText(f"{self.session.plan.settings.title}  \u2013  {title}")
        extra = getattr(self.stack.currentWidget(), "present_hint", "")
        caution = getattr(self.stack.currentWidget(), "present_caution", "")
        self.caution.setText(caution)
        self.caution.setVisible(bool(caution))
        self.counter.setText(f"{index + 1} / {self.slide_count()}    {HINT}" + (f"  \u00b7  {extra}" if extra else ""))
        self.stack.currentWidget().setFocus()

    def next_slide(self) -> None:
        self.go(self.current_index() + 1)

    def previous_slide(self) -> None:
        self.go(self.current_index() - 1)

    def handle_key(self, key) -> bool:
        """Clicker keys; True when the key was used."""
        if key in FORWARD:
            self.next_slide()
        elif key in BACK:
            self.previous_slide()
        elif key == Qt.Key.Key_Home:
            self.go(0)
        elif key == Qt.Key.Key_End:
            self.go(self.slide_count() - 1)
        elif key == Qt.Key.Key_Escape:
            self.close()
        else:
            return False
        return True

    # --- keys reach us whichever slide has the focus -----------------------------------
    def showEvent(self, event):  # noqa: N802 (Qt override)
        if not self._filtering:
            QApplication.instance().installEventFilter(self)
            self._filtering = True
        super().showEvent(event)

    def eventFilter(self, obj: QObject, event: QEvent) -> bool:  # noqa: N802
        if event.type() == QEvent.Type.KeyPress and isinstance(obj, QWidget) and (obj is self or self.isAncestorOf(obj)):
            return self.handle_key(event.key())
        return False

    def closeEvent(self, event):  # noqa: N802
        for k in range(self.stack.count()):        # a slide still working in the background stops
            stop = getattr(self.stack.widget(k), "stop_work", None)
            if callable(stop):
                stop()
        if self._filtering:
            QApplication.instance().removeEventFilter(self)
            self._filtering = False
        super().closeEvent(event)
        if self.parent_window is not None:
            self.parent_window.show()
            self.parent_window.raise_()
            self.parent_window.activateWindow()
        self.closed.emit()


def open_present(session, parent_window=None) -> PresentWindow:
    """Open Present mode full screen for ``session``; Esc returns to ``parent_window``."""
    window = PresentWindow(session, parent_window)
    if parent_window is not None:
        parent_window._present_window = window     # keep it alive while shown
    window.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose, True)
    window.showFullScreen()
    window.activateWindow()
    return window
