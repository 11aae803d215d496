"""Start the window: ``run_app(argv)`` (the ``slackline`` command with no verb)."""

from __future__ import annotations

import os
import sys
from pathlib import Path

from PySide6.QtCore import QEvent, QSettings, Signal
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QApplication

from workbench.core.model import Plan
from workbench.resources import demo_path
from workbench.ui.icons import app_icon

ORGANISATION = "Slackline"
APPLICATION = "Slackline"
DESKTOP_FILE = "org.slackline.Slackline"   # the installed .desktop entry, without ".desktop"


class SlacklineApp(QApplication):
    """The application object. On macOS a plan double-clicked in the Finder (or dropped on
    the Dock icon) while Slackline runs arrives as a QFileOpenEvent: it is handed to
    ``open_requested``, or kept until a window asks for it with :meth:`deliver_opens`."""

    open_requested = Signal(str)

    def __init__(self, argv: list[str]):
        super().__init__(argv)
        self.pending_opens: list[str] = []
        self._delivering = False

    def event(self, event) -> bool:  # noqa: A003 (Qt override)
        if event.type() == QEvent.Type.FileOpen:
            path = event.file() or event.url().toLocalFile()
            if path:
                self._request(path)
            return True
        return super().event(event)

    def _request(self, path: str) -> None:
        if self._delivering:
            self.open_requested.emit(path)
        else:
            self.pending_opens.append(path)

    def deliver_opens(self, open_path) -> None:
        """From now on send file-open requests to ``open_path``, starting with those that
        came before there was a window."""
        self.open_requested.connect(open_path)
        self._delivering = True
        pending, self.pending_opens = self.pending_opens, []
        for path in pending:
            self.open_requested.emit(path)


def application(argv: list[str] | None = None) -> QApplication:
    """The QApplication, with the names QSettings and the data folder use."""
    from workbench.ui.workspace.start_guard import started
    app = QApplication.instance() or started(
        lambda: SlacklineApp([sys.argv[0] if sys.argv else "slackline", *(argv or [])]))
    app.setOrganizationName(ORGANISATION)
    app.setApplicationName(APPLICATION)
    app.setApplicationDisplayName(APPLICATION)
    QGuiApplication.setDesktopFileName(DESKTOP_FILE)
    app.setWindowIcon(app_icon())
    from workbench.ui.workspace.wheel_guard import install_wheel_guard
    install_wheel_guard(app)
    from workbench.ui.collector import collect_on_window_thread
    collect_on_window_thread(app)      # reference cycles freed on this thread, never a worker's
    return app


def demo_plan() -> Plan:
    """The demo plan shown on first run: resources/demo.slw, else the core's demo."""
    if demo_path().exists():
        from workbench.io.planfile import load_plan
        return load_plan(demo_path())
    try:
        from workbench.core.demo import demo_plan as core_demo
    except ImportError:
        return Plan()
    return core_demo()


def first_plan(window, argv_paths: list[str]) -> None:
    """Open what the window starts with: recovered work if the planner wants it back, else
    the file argument, else the last plan, else the demo."""
    if window.files.offer_recovery():
        return
    if argv_paths and window.files.open_path(argv_paths[0], ask=False):
        return
    last = QSettings().value("files/last")
    if isinstance(last, str) and last and Path(last).exists() and window.files.open_path(last, ask=False):
        return
    window.session.load(demo_plan())
    window.update_title()


def run_app(argv: list[str]) -> int:
    """Open the window. ``argv``: optional plan/table path. Returns the exit code."""
    paths = [a for a in argv if not a.startswith("-")]
    app = application()
    from workbench.ui.workspace.single_instance import SingleInstance
    instance = SingleInstance()
    if not os.environ.get("SLACKLINE_MULTI_INSTANCE"):
        if instance.hand_over(str(Path(paths[0]).resolve()) if paths else ""):
            return 0
        instance.listen()
    from workbench.ui.workspace.window import MainWindow
    window = MainWindow()
    instance.path_received.connect(lambda p: window.open_path(p) if p else (window.raise_(), window.activateWindow()))
    window.show()
    first_plan(window, paths)
    if isinstance(app, SlacklineApp):
        app.deliver_opens(window.open_path)
    code = app.exec()
    instance.close()
    from workbench.ui import workers
    workers.settle(workers.CLOSE_WAIT_S)   # no worker reports to a window being torn down
    _dispose(window)
    return code


def _dispose(window) -> None:
    """Delete the window while Python is still fully alive (a Qt object torn down during
    interpreter shutdown can crash on its way out)."""
    import gc

    import shiboken6
    window.hide()
    if shiboken6.isValid(window):
        shiboken6.delete(window)
    gc.collect()
