"""Any chart, one at a time: Ctrl+C in a chart's dock copies it as an image (for slides),
and View → Export Chart Picture… / Print Chart… write or print the chart in focus (the
Odds and Drivers views too, not only Timeline and Network)."""

from __future__ import annotations

from functools import partial

from PySide6.QtCore import QObject, QRectF, Qt
from PySide6.QtGui import QAction, QGuiApplication, QImage, QKeySequence, QPainter
from PySide6.QtWidgets import QApplication

from workbench.ui import prompts

CHARTS = ("Timeline", "Network", "Odds", "Drivers")
PNG_FILTER = "PNG image (*.png)"


def chart_image(window, title: str) -> QImage:
    return window.view(title).grab().toImage()


def current_chart(window) -> str:
    """The chart the planner is working in: the dock holding the focus, else the last one
    that held it, else the first chart on screen."""
    focus = QApplication.focusWidget()
    for title in CHARTS:
        dock = window.docks[title]
        if focus is not None and dock.isAncestorOf(focus):
            return title
    last = getattr(window, "last_chart", None)
    if last:
        return last
    shown = [t for t in CHARTS if window.docks[t].isVisible() and not window.docks[t].visibleRegion().isEmpty()]
    return (shown or ["Odds"])[0]


def copy_chart(window, title: str | None = None) -> QImage:
    title = title or current_chart(window)
    image = chart_image(window, title)
    QGuiApplication.clipboard().setImage(image)
    window.statusBar().showMessage(f"Copied the {title} chart as a picture", 5000)
    return image


def export_chart(window) -> str | None:
    title = current_chart(window)
    path = prompts.ask_save_path(window, f"Export the {title} chart",
                                 window.session.in_folder(f"{title.lower()}.png"), PNG_FILTER)
    if not path:
        return None
    if not path.lower().endswith(".png"):
        path += ".png"
    if not chart_image(window, title).save(path):
        prompts.show_error(window, "Export chart", f"{path}: could not be written")
        return None
    return path


def paint_chart(image: QImage, printer) -> None:
    """The picture on one page, as large as fits, keeping its shape."""
    painter = QPainter(printer)
    page = QRectF(painter.viewport())
    scale = min(page.width() / image.width(), page.height() / image.height())
    target = QRectF(0, 0, image.width() * scale, image.height() * scale)
    painter.drawImage(target, image)
    painter.end()


def print_chart(window) -> bool:
    title = current_chart(window)
    printer = prompts.ask_printer(window, f"{window.session.plan.settings.title} — {title}")
    if printer is not None:
        paint_chart(chart_image(window, title), printer)
    return printer is not None


class _FocusWatch(QObject):
    """Remembers which chart last held the focus (a child of the window: goes with it)."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        QApplication.instance().focusChanged.connect(self.changed)

    def changed(self, _old, new) -> None:
        for title in CHARTS:
            if new is not None and self.window.docks[title].isAncestorOf(new):
                self.window.last_chart = title


def install(window, menu) -> dict[str, QAction]:
    """Ctrl+C in each chart's dock, the View menu's chart entries; returns the actions."""
    for title in CHARTS:
        copy = QAction(f"Copy {title} Chart", window.docks[title])
        copy.setShortcut(QKeySequence(QKeySequence.StandardKey.Copy))
        copy.setShortcutContext(Qt.ShortcutContext.WidgetWithChildrenShortcut)
        copy.triggered.connect(partial(copy_chart, window, title))
        window.docks[title].addAction(copy)
    window.focus_watch = _FocusWatch(window)
    acts = {"copy_chart": QAction("&Copy Chart as Picture", window),
            "export_chart": QAction("E&xport Chart Picture…", window),
            "print_chart": QAction("P&rint Chart…", window)}
    acts["copy_chart"].triggered.connect(lambda: copy_chart(window))
    acts["export_chart"].triggered.connect(lambda: export_chart(window))
    acts["print_chart"].triggered.connect(lambda: print_chart(window))
    menu.addSeparator()
    menu.addActions(list(acts.values()))
    return acts
