"""Keeping the window on the screen it is shown on: docks that shrink below their views'
natural size (they scroll instead), a first size that fits a 1024×768 projector, and a
saved position that is brought back onto a screen that is there today."""

from __future__ import annotations

from PySide6.QtCore import QRect, Qt
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QFrame, QScrollArea, QWidget

DEFAULT_SIZE = (1440, 900)
MIN_VISIBLE = 120      # pixels of a restored window's title bar that must lie on a screen


def scroller(content: QWidget, parent: QWidget) -> QScrollArea:
    """A frame for a dock's view: as small as the dock gets, scrolling when the view needs
    more room than the dock has, so no view's minimum size widens the window."""
    area = QScrollArea(parent)
    area.setWidget(content)
    area.setWidgetResizable(True)
    area.setFrameShape(QFrame.Shape.NoFrame)
    area.setHorizontalScrollBarPolicy(Qt.ScrollBarPolicy.ScrollBarAsNeeded)
    area.setMinimumSize(80, 60)
    area.setAccessibleName(content.accessibleName())
    return area


def screen_rect(window: QWidget) -> QRect:
    """The available area of the screen the window is on (or the primary one)."""
    screen = window.screen() or QGuiApplication.primaryScreen()
    return screen.availableGeometry() if screen is not None else QRect(0, 0, *DEFAULT_SIZE)


def first_size(window: QWidget) -> None:
    """The default size, shrunk to the screen and centred on it."""
    area = screen_rect(window)
    width, height = min(DEFAULT_SIZE[0], area.width()), min(DEFAULT_SIZE[1], area.height())
    window.resize(width, height)
    frame = window.frameGeometry()
    extra_w, extra_h = frame.width() - window.width(), frame.height() - window.height()
    window.resize(max(200, width - extra_w), max(200, height - extra_h))
    window.move(area.x() + (area.width() - window.frameGeometry().width()) // 2,
                area.y() + (area.height() - window.frameGeometry().height()) // 2)


def on_some_screen(rect: QRect) -> bool:
    """True when the top strip of ``rect`` (where the title bar is) shows on a screen."""
    strip = QRect(rect.x(), rect.y(), rect.width(), min(rect.height(), 40))
    for screen in QGuiApplication.screens():
        seen = strip.intersected(screen.availableGeometry())
        if seen.width() >= min(MIN_VISIBLE, rect.width()) and seen.height() > 0:
            return True
    return False


def keep_on_screen(window: QWidget) -> None:
    """After restoring a saved geometry: a window that would sit off every screen (a
    projector unplugged, a laptop docked elsewhere) or be larger than its screen is sized
    and placed afresh."""
    frame = window.frameGeometry()
    area = screen_rect(window)
    if window.isMaximized() or window.isFullScreen():
        return
    if not on_some_screen(frame) or frame.width() > area.width() or frame.height() > area.height():
        first_size(window)
