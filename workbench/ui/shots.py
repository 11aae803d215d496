"""Screenshots for people to look at: ``python -m workbench.ui.shots OUTDIR [PLAN]``.

Renders offscreen at 1920×1080 the main window (main.png) and each view that exists
(timeline.png, network.png, odds.png, drivers.png). Settings and recovery copies go to
a temporary folder so a real installation is never touched.
"""

from __future__ import annotations

import os
import sys
import tempfile
from pathlib import Path

SIZE = (1920, 1080)
PROJECTOR = (1024, 768)
SEED = 20270301
VIEW_FILES = {"Timeline": "timeline.png", "Network": "network.png", "Odds": "odds.png", "Drivers": "drivers.png",
              "Checkup": "checkup.png", "Resources": "resources.png", "Trade-off": "tradeoff.png"}


def _settle(app, rounds: int = 5) -> None:
    for _ in range(rounds):
        app.processEvents()


def _grab(widget, path: Path, app, size=SIZE) -> None:
    widget.show()
    widget.resize(*size)   # after showing: the window otherwise fits itself to the (offscreen) screen
    _settle(app)
    finish = getattr(widget, "finish_work", None)
    if callable(finish):  # a view computing in a worker shows its result, not its progress bar
        finish()
        _settle(app)
    fit = getattr(widget, "fit_every_row", None) or getattr(widget, "fit_all", None)
    if callable(fit):  # a chart shows the whole plan (every row, when the chart offers it)
        fit()
        _settle(app)
    if not widget.grab().save(str(path)):
        raise OSError(f"could not write {path}")


def _simulate(session, seed: int = SEED, iterations: int = 10_000) -> None:
    """Views are shown with a simulation at a fixed seed, so shots are repeatable."""
    from workbench.core.montecarlo import simulate

    if session.analysis is not None:
        session.set_simulation(simulate(session.plan, iterations, seed=seed))


def render(outdir: Path, plan_path: str | None = None) -> list[Path]:
    from PySide6.QtCore import QSettings
    from workbench.ui.workspace.app import _dispose, application, demo_plan
    from workbench.ui.workspace.window import VIEWS, MainWindow, make_view
    app = application()
    QSettings.setDefaultFormat(QSettings.Format.IniFormat)
    QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, tempfile.mkdtemp())
    outdir.mkdir(parents=True, exist_ok=True)
    window = MainWindow()
    if plan_path:
        if not window.files.open_path(plan_path, ask=False):
            raise SystemExit(f"cannot open {plan_path}")
    else:
        window.session.load(demo_plan())
    written = [outdir / "main.png", outdir / "main-1024x768.png"]
    _grab(window, written[0], app)
    _grab(window, written[1], app, PROJECTOR)   # a projector: every dock still on screen
    window.resize(*SIZE)
    _simulate(window.session)
    for title, module, cls, _promise in VIEWS:
        view = make_view(module, cls, window.session)
        if view is not None:
            written.append(outdir / VIEW_FILES[title])
            _grab(view, written[-1], app)
            _dispose(view)
    window.files.close()
    _dispose(window)
    return written


def main(argv: list[str] | None = None) -> int:
    argv = sys.argv[1:] if argv is None else argv
    if not argv:
        print("usage: python -m workbench.ui.shots OUTDIR [PLAN]", file=sys.stderr)
        return 2
    from workbench.ui.shot_screen import use_shot_screen
    use_shot_screen()
    os.environ.setdefault("SLACKLINE_DATA_DIR", tempfile.mkdtemp(prefix="slackline-shots-"))
    for path in render(Path(argv[0]), argv[1] if len(argv) > 1 else None):
        print(path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
