"""Run a Monte Carlo simulation off the GUI thread, with progress and cancel.

The worker simulates a *copy* of the plan (plain data, by the rule in
:mod:`workbench.ui.workers`), so edits made while it runs cannot reach it; the view
decides whether the plan changed meanwhile. A cancelled or failed run delivers no result
at all, and neither does a run the view abandoned by closing.
"""

from __future__ import annotations

from PySide6.QtCore import QObject, Signal

from workbench.ui import workers


def simulate_copy(plan, iterations: int, seed, progress, cancel):
    """The worker's whole job (plain data in, a SimulationResult out)."""
    from workbench.core.montecarlo import simulate
    return simulate(plan, iterations=iterations, seed=seed, progress=progress, cancel=cancel)


class OddsRunner(workers.OneJobAtATime, QObject):
    """Starts one simulation at a time; re-emits the current run's signals only."""

    progress = Signal(int, int)
    finished = Signal(object)
    cancelled = Signal()
    failed = Signal(str)
    running_changed = Signal(bool)

    def __init__(self, parent: QObject | None = None):
        QObject.__init__(self, parent)

    def start(self, plan, iterations: int, seed: int | None) -> None:
        """Simulate a copy of ``plan``; a run still going is abandoned (it stops, and
        nothing it reports comes through)."""
        if self._job is not None:
            self._job.abandon()
        self._begin(workers.start(simulate_copy, plan.copy(), int(iterations), seed, cancellable=True,
                                  on_done=self._on_finished, on_failed=self._on_failed,
                                  on_progress=self._on_progress, name="slackline-odds"))
        self.running_changed.emit(True)

    def abandon(self) -> bool:
        """Stop the current run and drop whatever it still reports (the view is closing)."""
        if not super().abandon():
            return False
        self.running_changed.emit(False)
        return True

    def _end(self) -> bool:
        """The current run has ended; True when it was asked to stop."""
        stopping, self._job = self._job.stopping, None
        self.running_changed.emit(False)
        return stopping

    def _on_progress(self, done: int, total: int) -> None:
        if self._job is not None and not self._job.stopping:
            self.progress.emit(int(done), int(total))

    def _on_finished(self, result) -> None:
        if self._end():      # stop was pressed as the last block finished: honour it
            self.cancelled.emit()
        else:
            self.finished.emit(result)

    def _on_failed(self, exc: Exception) -> None:
        from workbench.core.errors import PlanError
        from workbench.core.montecarlo import SimulationCancelled
        self._end()
        if isinstance(exc, SimulationCancelled):
            self.cancelled.emit()
        elif isinstance(exc, (PlanError, ValueError)):
            self.failed.emit(str(exc))
        else:                # an engine bug must not take the window down
            self.failed.emit(f"simulation failed: {type(exc).__name__}: {exc}")
