"""The odds with and without the crews, shared by the Odds view and the Resources view.

One run per session (:func:`crew_run`): the logic-only column is the Odds view's current
simulation (so the chance quoted there and here is one chance, not two), the crews' column a
resource-aware run at its seed and iterations — the same sampled durations — made in a
worker thread on request. Without a current simulation both runs are made here at
``ITERATIONS`` and ``SEED``. Every panel (:class:`CrewOddsPanel`) shows the one result.
"""

from __future__ import annotations

from PySide6.QtCore import QObject, Signal
from PySide6.QtWidgets import QHBoxLayout, QLabel, QPushButton, QTableWidget, QTableWidgetItem, QVBoxLayout, QWidget

from workbench.ui import workers

ITERATIONS, SEED = 2000, 1
CAUTION = ("Caution: estimates are judgement; PERT assumes one path and independent durations, and the odds "
           "with the crews assume they are worked in the levelled order. Decisions rest with your "
           "organisation's own approval rules.")


def compare_odds(plan, logic, cancel):
    """The worker's job (plain data in, by the rule in :mod:`workbench.ui.workers`): the Odds
    view's current run beside the crews' run at its seed and iterations (the same sampled
    durations); without one, both runs here."""
    from workbench.core.montecarlo import simulate
    from workbench.core.resource_odds import ResourceOdds, compare

    if logic is None:
        return compare(plan, ITERATIONS, SEED, cancel=cancel)
    aware = simulate(plan, logic.iterations, logic.seed, resources=True, cancel=cancel)
    return ResourceOdds(logic, aware)


class CrewOddsRun(QObject):
    """The session's comparison: ``result`` (a ResourceOdds or None), ``message`` (what the
    panels say about it), ``running``; ``changed`` whenever any of them changes."""

    changed = Signal()

    def __init__(self, session):
        super().__init__(session)
        self.session, self.worker, self.result, self.stale = session, None, None, False
        self._busy, self._own_logic = False, False
        self.message = (f"Uses the Odds view's run, or {ITERATIONS:,} iterations at seed {SEED}; the crews' run "
                        "draws the same durations.")
        session.schedule_changed.connect(self._plan_changed)
        session.simulation_changed.connect(self._run_changed)

    @property
    def running(self) -> bool:
        return self._busy

    def run(self) -> None:
        if self.running:
            return
        sim = self.session.simulation          # current: the session drops it on every edit
        logic = sim if sim is not None and not getattr(sim, "resource_aware", False) else None
        self._own_logic = logic is not None
        self._busy = True
        self.worker = workers.start(compare_odds, self.session.plan.copy(), logic, cancellable=True,
                                    on_done=self._done, on_failed=self._failed, name="slackline-crews-odds")
        self.message = "Simulating with the crews\u2026"
        self.changed.emit()

    def stop(self) -> None:
        """Abandon a run still going (its result is dropped); the wait is bounded."""
        if self.worker is not None:
            self.worker.abandon()
            self.worker.wait(workers.CLOSE_WAIT_S)
        if self._busy:
            self._busy = False
            self.message = "Stopped: no crews' run kept."
            self.changed.emit()

    def _done(self, result) -> None:
        self._busy = False
        self.result, self.stale = result, False
        self.message = (f"{result.logic.iterations:,} iterations each, seed {result.logic.seed}, the same sampled "
                        "durations" + (" (logic only: the Odds view's run)." if self._own_logic else "."))
        self.changed.emit()

    def _failed(self, exc) -> None:
        from workbench.core.errors import PlanError
        self._busy = False
        message = str(exc) if isinstance(exc, PlanError) else f"{type(exc).__name__}: {exc}"
        self.message = f"Could not simulate: {message}"
        self.changed.emit()

    def _plan_changed(self) -> None:
        if self.result is not None and not self.stale:
            self.stale = True
            self.message = "Out of date: the plan changed since these odds. Compare again."
            self.changed.emit()

    def _run_changed(self) -> None:
        sim = self.session.simulation
        if self.result is not None and not self.stale and sim is not None and sim is not self.result.logic:
            self.stale = True
            self.message = "The Odds view has a new run: compare again to pair the crews' run with it."
            self.changed.emit()


def crew_run(session) -> CrewOddsRun:
    """The session's one comparison (made on first use; it lives as long as the session)."""
    run = session.findChild(CrewOddsRun)
    return run if run is not None else CrewOddsRun(session)


class CrewOddsPanel(QWidget):
    """A button, then a small table: P50/P80/P90 and the deadline's chance, logic only and
    with the crews, one sentence on the difference, and the caution."""

    def __init__(self, session, parent=None, table: bool = True):
        super().__init__(parent)
        self.session, self.shared, self.with_table = session, crew_run(session), table
        self.run_button = QPushButton("Compare with the &crews", clicked=self.run)
        self.run_button.setToolTip("Simulate again with the crews holding work back, drawing the same durations")
        self.status = QLabel(wordWrap=True)
        self.table = QTableWidget(0, 3)
        self.table.setHorizontalHeaderLabels(["", "Logic only", "With the crews"])
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.hide()
        self.sentence = QLabel(wordWrap=True)
        self.caution = QLabel(CAUTION, wordWrap=True)
        self.caution.setStyleSheet("color: #555555;")
        top = QHBoxLayout()
        top.addWidget(self.run_button)
        top.addStretch(1)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addLayout(top)
        layout.addWidget(self.status)
        layout.addWidget(self.table)
        layout.addWidget(self.sentence)
        layout.addWidget(self.caution)
        self.shared.changed.connect(self._show)
        self._show()

    @property
    def result(self):
        return self.shared.result

    def paired_with(self, logic):
        """The crews' run paired with the logic-only run ``logic`` (same seed, same
        iterations, current), else None."""
        r = self.shared.result
        return r.aware if r is not None and not self.shared.stale and r.logic is logic else None

    @property
    def worker(self):
        return self.shared.worker

    def run(self) -> None:
        self.shared.run()

    def stop(self) -> None:
        self.shared.stop()

    def _show(self) -> None:
        self.run_button.setEnabled(not self.shared.running)
        self.status.setText(self.shared.message)
        result = self.shared.result
        if result is None:
            return
        conf = float(self.session.plan.settings.target_confidence)
        rows = result.rows(conf)
        self.table.setRowCount(len(rows))
        for r, cells in enumerate(rows):
            for c, text in enumerate(cells):
                self.table.setItem(r, c, QTableWidgetItem(text))
        self.table.resizeColumnsToContents()
        self.table.resizeRowsToContents()
        self.table.setFixedHeight(self.table.horizontalHeader().height()
                                  + sum(self.table.rowHeight(r) for r in range(len(rows))) + 6)
        self.table.setEnabled(not self.shared.stale)
        self.table.setVisible(self.with_table)
        self.sentence.setText(result.sentence(conf))
