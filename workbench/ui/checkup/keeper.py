"""One Checkup per open plan, kept current for the dock, the summary strip and Present.

Edits arrive fast while a planner types: the checks run once the edits pause
(:data:`PAUSE_MS`), on the main thread, where they take a few milliseconds (under 50 ms at
10,000 activities, see benchmarks/bench_checkup.py). The simulation-based checks need a
replay of the run, so they run in a worker thread when a new simulation arrives, on a copy
of the plan (plain data, by the rule in :mod:`workbench.ui.workers`); after an edit they are kept from the last run and say that it is stale.
"""

from __future__ import annotations

from dataclasses import replace

from PySide6.QtCore import QObject, QTimer, Signal

from workbench.core.checkup import frame_for, odds_checks, run_checkup
from workbench.ui import workers

PAUSE_MS = 150
WORKING = "Checking the last simulation run\u2026"


class CheckupKeeper(QObject):
    """``updated`` fires with each new :class:`~workbench.core.checkup_result.Checkup`."""

    updated = Signal(object)

    def __init__(self, session, threaded: bool = True):
        super().__init__(session)
        self.session = session
        self.threaded = threaded
        self.checkup = None
        self._odds = None            # simulation-based checks of the last run
        self._odds_stale = False
        self._pending = False        # a worker is checking a new run
        self._generation = 0
        self._timer = QTimer(self)
        self._timer.setSingleShot(True)
        self._timer.setInterval(PAUSE_MS)
        self._timer.timeout.connect(self.recompute)
        session.schedule_changed.connect(self._on_schedule)
        session.simulation_changed.connect(self._on_simulation)
        self.recompute()
        if session.simulation is not None:
            self._on_simulation()

    def _on_schedule(self) -> None:
        if self._odds is not None and self.session.simulation is None:
            self._odds_stale = True
        self._timer.start()

    def _on_simulation(self) -> None:
        sim = self.session.simulation
        if sim is None:
            self._odds_stale = self._odds is not None
            return
        self._generation += 1
        self._odds_stale = False
        self._pending, self._odds = True, None
        plan, generation = self.session.plan.copy(), self._generation
        if self.threaded:            # plain data in, the result back through the workers' hub
            workers.start(replay_checks, plan, sim, generation, on_done=self._take_odds, name="slackline-checkup")
            self.recompute()             # "checking the last run" meanwhile
        else:
            self._take_odds(replay_checks(plan, sim, generation))

    def _take_odds(self, result) -> None:
        generation, checks = result
        if generation == self._generation:
            self._odds, self._pending = checks, False
            self.recompute()

    def recompute(self) -> None:
        """Run the checks now (the timer calls this after a pause in the edits)."""
        self._timer.stop()
        a = self.session.analysis
        if a is None:
            self.checkup = None
        else:
            self.checkup = run_checkup(self.session.plan, a, with_simulation=False,
                                       earlier_odds=self._odds, simulation_stale=self._odds_stale)
            if self._pending and self._odds is None:
                for i, check in enumerate(self.checkup.checks):
                    if check.uses_simulation:
                        self.checkup.checks[i] = replace(check, note=WORKING)
        self.updated.emit(self.checkup)

    def summary_text(self) -> str:
        return "Checkup: cannot run" if self.checkup is None else self.checkup.summary_text()


def replay_checks(plan, sim, generation: int):
    """The worker's job: the simulation-based checks of ``sim`` on a copy of the plan
    (None when the replay fails: those checks are then not applicable)."""
    try:
        return generation, odds_checks(frame_for(plan), sim)
    except Exception:  # noqa: BLE001
        return generation, None


def checkup_keeper(session, threaded: bool = True) -> CheckupKeeper:
    """The session's keeper (made on first use)."""
    keeper = getattr(session, "_checkup_keeper", None)
    if keeper is None:
        keeper = CheckupKeeper(session, threaded)
        session._checkup_keeper = keeper
    return keeper
