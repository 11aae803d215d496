"""File ▸ Export Approval Pack: the printed pack made from the window, matching the screen.

With a simulation on screen (the plan unchanged since it ran) the pack uses that very
result, so its odds and drivers are the numbers the room has seen; otherwise it runs one
with the Odds view's iterations and seed. A progress dialog can cancel (nothing is written
then, and an earlier pack at that path is kept); the finished PDF opens in the system's
PDF viewer. Letter paper where the system measures in US units, A4 elsewhere.
"""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QLocale, Qt
from PySide6.QtWidgets import QApplication, QProgressDialog

from workbench.core.errors import PlanError
from workbench.ui import prompts

DEFAULT_ITERATIONS = 10_000


class _Cancelled(Exception):
    """Raised from the progress callback when the planner presses Cancel."""


def default_paper() -> str:
    us = QLocale.system().measurementSystem() == QLocale.MeasurementSystem.ImperialUSSystem
    return "letter" if us else "a4"


def run_settings(window) -> tuple[int, int | None]:
    """Iterations and seed for a new simulation: the Odds view's, when it is there."""
    controls = getattr(window.view("Odds"), "controls", None)     # None: a placeholder stands there
    if controls is None:
        return DEFAULT_ITERATIONS, None
    return int(controls.iterations.value()), controls.seed_value()


def export_pack(window) -> str | None:
    """Ask where, write the pack with progress, open it; the path written, or None."""
    session = window.session
    if session.analysis is None:
        prompts.show_error(window, "Export approval pack",
                           f"The plan cannot be scheduled, so there is no pack to make: {session.analysis_error}")
        return None
    title = session.plan.settings.title or "plan"
    path = prompts.ask_save_path(window, "Export approval pack", session.in_folder(f"{title} approval pack.pdf"),
                                 prompts.PDF_FILTER)
    if not path:
        return None
    if Path(path).suffix.lower() != ".pdf":
        path += ".pdf"
    info = _write_with_progress(window, path)
    if info is None:
        return None
    simulated = f", seed {info.seed}" if info.seed is not None else ""
    window.last_pack = info            # Progress ▸ Record the Last Pack as the Baseline can keep it
    window.statusBar().showMessage(f"Approval pack written: {path} ({info.pages} pages{simulated}); "
                                   f"Progress ▸ Record the Last Pack as the Baseline makes it the baseline",
                                   10_000)
    prompts.open_externally(window, path)
    return path


def not_written(path: str, exc: BaseException) -> str:
    """The message for a pack that failed for a reason no check foresaw."""
    reason = "the computer ran out of memory" if isinstance(exc, MemoryError) else f"{type(exc).__name__}: {exc}"
    return (f"The approval pack could not be written ({reason[:300]}). Nothing was written to {path}; "
            "an earlier pack there is kept, and the plan is unchanged. Please report this with the plan file.")


def _write_with_progress(window, path: str):
    from workbench.reports.pack import build_pack
    session = window.session
    dialog = QProgressDialog("Writing the approval pack…", "Cancel", 0, 100, window)
    dialog.setWindowTitle("Export approval pack")
    dialog.setWindowModality(Qt.WindowModality.WindowModal)
    dialog.setMinimumDuration(400)
    dialog.setValue(0)

    def progress(done: int, total: int) -> None:
        dialog.setValue(int(100 * done / max(total, 1)))
        QApplication.processEvents()
        if dialog.wasCanceled():
            raise _Cancelled()

    iterations, seed = run_settings(window)
    try:
        return build_pack(session.plan.copy(), path, paper=default_paper(), iterations=iterations, seed=seed,
                          plan_path=window.files.path, progress=progress, simulation=session.simulation)
    except _Cancelled:
        window.statusBar().showMessage("Approval pack cancelled: nothing was written.", 10_000)
        return None
    except PlanError as exc:
        prompts.show_error(window, "Export approval pack", str(exc))
        return None
    except Exception as exc:     # a fault of ours (MemoryError too): say so; the plan is untouched
        prompts.show_error(window, "Export approval pack", not_written(path, exc))
        return None
    finally:
        dialog.close()
