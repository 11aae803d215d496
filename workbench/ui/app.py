"""Start the window: ``run_app(argv)`` (the ``slackline`` command with no verb)."""

from __future__ import annotations

import os
import sys
from pathlib import Path

from PySide6.QtCore import QSettings
from PySide6.QtWidgets import QApplication

from workbench.core.model import Plan
from workbench.ui.icons import RESOURCES, icon

ORGANISATION = "Slackline"
APPLICATION = "Slackline"
DEMO_PATH = RESOURCES / "demo.slw"


def application(argv: list[str] | None = None) -> QApplication:
    """The QApplication, with the names QSettings and the data folder use."""
    app = QApplication.instance() or QApplication([sys.argv[0] if sys.argv else "slackline", *(argv or [])])
    app.setOrganizationName(ORGANISATION)
    app.setApplicationName(APPLICATION)
    app.setApplicationDisplayName(APPLICATION)
    app.setWindowIcon(icon("app"))
    return app


def demo_plan() -> Plan:
    """The demo plan shown on first run: resources/demo.slw, else the core's demo."""
    if DEMO_PATH.exists():
        from workbench.io.planfile import load_plan
        return load_plan(DEMO_PATH)
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
    from workbench.ui.single_instance import SingleInstance
    instance = SingleInstance()
    if not os.environ.get("SLACKLINE_MULTI_INSTANCE"):
        if instance.hand_over(str(Path(paths[0]).resolve()) if paths else ""):
            return 0
        instance.listen()
    from workbench.ui.main_window import MainWindow
    window = MainWindow()
    instance.path_received.connect(lambda p: window.open_path(p) if p else (window.raise_(), window.activateWindow()))
    window.show()
    first_plan(window, paths)
    code = app.exec()
    instance.close()
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
