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


class OddsRunner(QObject):
    """Starts one simulation at a time; re-emits the current run's signals only."""

    progress = Signal(int, int)
    finished = Signal(object)
    cancelled = Signal()
    failed = Signal(str)
    running_changed = Signal(bool)

    def __init__(self, parent: QObject | None = None):
        super().__init__(parent)
        self._job: workers.Job | None = None     # the run whose reports come through
        self._last: workers.Job | None = None    # the run started last (for wait)

    @property
    def running(self) -> bool:
        return self._job is not None

    def start(self, plan, iterations: int, seed: int | None) -> None:
        """Simulate a copy of ``plan``; a run still going is abandoned (it stops, and
        nothing it reports comes through)."""
        if self._job is not None:
            self._job.abandon()
        self._job = workers.start(simulate_copy, plan.copy(), int(iterations), seed, cancellable=True,
                                  on_done=self._on_finished, on_failed=self._on_failed,
                                  on_progress=self._on_progress, name="slackline-odds")
        self._last = self._job
        self.running_changed.emit(True)

    def stop(self) -> None:
        """Ask the current run to stop; it reports ``cancelled`` and leaves no result."""
        if self._job is not None:
            self._job.stop()

    def abandon(self) -> None:
        """Stop the current run and drop whatever it still reports (the view is closing)."""
        if self._job is not None:
            self._job.abandon()
            self._job = None
            self.running_changed.emit(False)

    def wait(self, msecs: int = 30_000) -> bool:
        """Wait at most ``msecs`` for the current run to end; True when none runs."""
        return self._last is None or self._last.wait(msecs / 1000)

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
