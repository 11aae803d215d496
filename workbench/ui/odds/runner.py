"""Run a Monte Carlo simulation off the GUI thread, with progress and cancel.

The worker simulates a *copy* of the plan, so edits made while it runs cannot reach it;
each run carries a ticket, and the view decides whether the plan changed meanwhile.
A cancelled or failed run delivers no result at all.
"""

from __future__ import annotations

import threading

from PySide6.QtCore import QObject, QRunnable, QThreadPool, Signal


class _Signals(QObject):
    progress = Signal(int, int, int)        # ticket, done, total
    finished = Signal(int, object)          # ticket, SimulationResult
    cancelled = Signal(int)
    failed = Signal(int, str)


class _Job(QRunnable):
    def __init__(self, ticket: int, plan, kwargs: dict, signals: _Signals, stop: threading.Event):
        super().__init__()
        self.setAutoDelete(True)
        self.ticket, self.plan, self.kwargs = ticket, plan, kwargs
        self.signals, self.stop = signals, stop

    def run(self) -> None:  # noqa: D401 (Qt override)
        from workbench.core.errors import PlanError
        from workbench.core.montecarlo import SimulationCancelled, simulate
        try:
            result = simulate(self.plan, progress=self._progress, cancel=self.stop.is_set, **self.kwargs)
        except SimulationCancelled:
            self.signals.cancelled.emit(self.ticket)
        except (PlanError, ValueError) as exc:
            self.signals.failed.emit(self.ticket, str(exc))
        except Exception as exc:  # an engine bug must not take the window down
            self.signals.failed.emit(self.ticket, f"simulation failed: {type(exc).__name__}: {exc}")
        else:
            self.signals.finished.emit(self.ticket, result)

    def _progress(self, done: int, total: int) -> None:
        self.signals.progress.emit(self.ticket, int(done), int(total))


class OddsRunner(QObject):
    """Starts one simulation at a time; re-emits the current run's signals only."""

    progress = Signal(int, int)
    finished = Signal(object)
    cancelled = Signal()
    failed = Signal(str)
    running_changed = Signal(bool)

    def __init__(self, parent: QObject | None = None):
        super().__init__(parent)
        self.pool = QThreadPool(self)
        self.pool.setMaxThreadCount(1)
        # No parent: a job still running when the runner goes away keeps its own reference,
        # and Qt drops the queued connections to the deleted runner.
        self._signals = _Signals()
        self._signals.progress.connect(self._on_progress)
        self._signals.finished.connect(self._on_finished)
        self._signals.cancelled.connect(self._on_cancelled)
        self._signals.failed.connect(self._on_failed)
        self._ticket = 0
        self._stop: threading.Event | None = None

    @property
    def running(self) -> bool:
        return self._stop is not None

    def start(self, plan, iterations: int, seed: int | None) -> None:
        """Simulate a copy of ``plan``; stops any run still going."""
        self.stop()
        self._ticket += 1
        self._stop = threading.Event()
        kwargs = {"iterations": int(iterations), "seed": seed}
        self.pool.start(_Job(self._ticket, plan.copy(), kwargs, self._signals, self._stop))
        self.running_changed.emit(True)

    def stop(self) -> None:
        """Ask the current run to stop; it reports ``cancelled`` and leaves no result."""
        if self._stop is not None:
            self._stop.set()

    def wait(self, msecs: int = -1) -> bool:
        return self.pool.waitForDone(msecs)

    def _current(self, ticket: int) -> bool:
        return ticket == self._ticket and self._stop is not None

    def _end(self) -> None:
        self._stop = None
        self.running_changed.emit(False)

    def _on_progress(self, ticket: int, done: int, total: int) -> None:
        if self._current(ticket) and not self._stop.is_set():
            self.progress.emit(done, total)

    def _on_finished(self, ticket: int, result) -> None:
        if self._current(ticket):
            cancelled = self._stop.is_set()
            self._end()
            if cancelled:  # stop was pressed as the last block finished: honour it
                self.cancelled.emit()
            else:
                self.finished.emit(result)

    def _on_cancelled(self, ticket: int) -> None:
        if self._current(ticket):
            self._end()
            self.cancelled.emit()

    def _on_failed(self, ticket: int, message: str) -> None:
        if self._current(ticket):
            self._end()
            self.failed.emit(message)
