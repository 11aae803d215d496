"""Run the trade-off off the GUI thread (on a copy of the plan), with progress and cancel."""

from __future__ import annotations

import threading

from PySide6.QtCore import QObject, QRunnable, QThreadPool, Signal


class _Signals(QObject):
    progress = Signal(int, int, int)
    finished = Signal(int, object)
    failed = Signal(int, str)


class _Job(QRunnable):
    def __init__(self, ticket, plan, kwargs, signals, stop):
        super().__init__()
        self.ticket, self.plan, self.kwargs, self.signals, self.stop = ticket, plan, kwargs, signals, stop

    def run(self) -> None:  # noqa: D401 (Qt override)
        from workbench.core.errors import PlanError
        from workbench.core.montecarlo import SimulationCancelled
        from workbench.core.tradeoff import tradeoff
        try:
            result = tradeoff(self.plan, progress=self._progress, cancel=self.stop.is_set, **self.kwargs)
        except SimulationCancelled:
            self._emit("failed", self.ticket, "")
        except (PlanError, ValueError) as exc:
            self._emit("failed", self.ticket, str(exc))
        except Exception as exc:  # an engine bug must not take the window down
            self._emit("failed", self.ticket, f"trade-off failed: {type(exc).__name__}: {exc}")
        else:
            self._emit("finished", self.ticket, result)

    def _emit(self, name: str, *args) -> None:
        """Report back, unless the window went away meanwhile (then nobody is listening)."""
        try:
            getattr(self.signals, name).emit(*args)
        except RuntimeError:
            self.stop.set()

    def _progress(self, done, total) -> None:
        self._emit("progress", self.ticket, int(done), int(total))


class TradeoffRunner(QObject):
    """One run at a time; only the latest run's signals come through. A cancelled run
    reports ``failed("")``."""

    progress = Signal(int, int)
    finished = Signal(object)
    failed = Signal(str)

    def __init__(self, parent=None):
        super().__init__(parent)
        self.pool = QThreadPool(self)
        self.pool.setMaxThreadCount(1)
        self._signals = _Signals()
        self._signals.progress.connect(lambda t, d, n: t == self._ticket and self.progress.emit(d, n))
        self._signals.finished.connect(self._done)
        self._signals.failed.connect(self._fail)
        self._ticket = 0
        self._stop: threading.Event | None = None

    @property
    def running(self) -> bool:
        return self._stop is not None

    def start(self, plan, **kwargs) -> None:
        self.stop()
        self._ticket += 1
        self._stop = threading.Event()
        self.pool.start(_Job(self._ticket, plan.copy(), kwargs, self._signals, self._stop))

    def stop(self) -> None:
        if self._stop is not None:
            self._stop.set()

    def wait(self, msecs: int = -1) -> bool:
        return self.pool.waitForDone(msecs)

    def _done(self, ticket, result) -> None:
        if ticket == self._ticket:
            self._stop = None
            self.finished.emit(result)

    def _fail(self, ticket, message) -> None:
        if ticket == self._ticket:
            self._stop = None
            self.failed.emit(message)
