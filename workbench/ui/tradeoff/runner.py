"""Run the trade-off off the GUI thread (on a copy of the plan: plain data, by the rule in
:mod:`workbench.ui.workers`), with progress and cancel."""

from __future__ import annotations

from PySide6.QtCore import QObject, Signal

from workbench.ui import workers


def tradeoff_copy(plan, progress, cancel, **kwargs):
    """The worker's whole job (plain data in, a trade-off result out)."""
    from workbench.core.tradeoff import tradeoff
    return tradeoff(plan, progress=progress, cancel=cancel, **kwargs)


class TradeoffRunner(workers.OneJobAtATime, QObject):
    """One run at a time; only the latest run's signals come through. A cancelled run
    reports ``failed("")``."""

    progress = Signal(int, int)
    finished = Signal(object)
    failed = Signal(str)

    def __init__(self, parent=None):
        QObject.__init__(self, parent)

    def start(self, plan, **kwargs) -> None:
        """Trade off a copy of ``plan``; a run still going is abandoned."""
        self.abandon()
        self._begin(workers.start(tradeoff_copy, plan.copy(), cancellable=True, on_done=self._done,
                                  on_failed=self._fail, on_progress=self._progress, name="slackline-tradeoff",
                                  **kwargs))

    def _progress(self, done, total) -> None:
        self.progress.emit(int(done), int(total))

    def _done(self, result) -> None:
        self._job = None
        self.finished.emit(result)

    def _fail(self, exc: Exception) -> None:
        from workbench.core.errors import PlanError
        from workbench.core.montecarlo import SimulationCancelled
        self._job = None
        if isinstance(exc, SimulationCancelled):
            self.failed.emit("")
        elif isinstance(exc, (PlanError, ValueError)):
            self.failed.emit(str(exc))
        else:    # an engine bug must not take the window down
            self.failed.emit(f"trade-off failed: {type(exc).__name__}: {exc}")
