"""Checkup screenshots for people to look at: ``python -m workbench.ui.checkup_shots OUTDIR``.

The demo plan with a simulation at a fixed seed: the window at 1024×768 (a projector) and
at 1920×1080 with the Checkup dock in front, a check clicked so its offenders are selected
(checkup_window_1024.png, checkup_window.png), and the dock alone at a typical dock size
(checkup.png). Settings and recovery copies go to a temporary folder."""

from __future__ import annotations

import os
import sys
import tempfile
from pathlib import Path

SEED = 20270301


def _settle(app, rounds: int = 8) -> None:
    for _ in range(rounds):
        app.processEvents()


def _window_shot(app, window, size, path: Path) -> Path:
    """The window at ``size`` with the Checkup in front and the Leads check clicked (O1
    selected in the table, Timeline and Network)."""
    window.resize(*size)
    window.show()
    window.show_checkup()
    _settle(app)
    view = window.view("Checkup")
    view.pick(1)
    view.table.selectRow(1)
    _settle(app)
    window.grab().save(str(path))
    return path


def render(outdir: Path) -> list[Path]:
    from PySide6.QtCore import QSettings
    from workbench.core.montecarlo import simulate
    from workbench.ui.checkup.keeper import checkup_keeper
    from workbench.ui.workspace.app import _dispose, application, demo_plan
    from workbench.ui.workspace.window import MainWindow

    app = application()
    QSettings.setDefaultFormat(QSettings.Format.IniFormat)
    QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, tempfile.mkdtemp())
    outdir.mkdir(parents=True, exist_ok=True)
    window = MainWindow()
    checkup_keeper(window.session, threaded=False)
    window.session.load(demo_plan())
    window.session.set_simulation(simulate(window.session.plan, 10_000, seed=SEED))
    written = [_window_shot(app, window, size, outdir / name)
               for size, name in (((1024, 768), "checkup_window_1024.png"), ((1920, 1080), "checkup_window.png"))]
    view = window.view("Checkup")
    dock = window.docks["Checkup"]
    dock.setFloating(True)
    dock.resize(900, 640)
    view.pick(16)
    view.table.selectRow(16)             # merge hot spots
    _settle(app)
    written.append(outdir / "checkup.png")
    view.grab().save(str(written[-1]))
    window.files.close()
    _dispose(window)
    return written


def main(argv: list[str] | None = None) -> int:
    argv = sys.argv[1:] if argv is None else argv
    if not argv:
        print("usage: python -m workbench.ui.checkup_shots OUTDIR", file=sys.stderr)
        return 2
    from workbench.ui.shot_screen import use_shot_screen
    use_shot_screen()
    os.environ.setdefault("SLACKLINE_DATA_DIR", tempfile.mkdtemp(prefix="slackline-shots-"))
    for path in render(Path(argv[0])):
        print(path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
