"""Logic-only and resource-aware odds side by side, run in a worker thread on request."""

from __future__ import annotations

from PySide6.QtWidgets import QHBoxLayout, QLabel, QPushButton, QTableWidget, QTableWidgetItem, QVBoxLayout, QWidget

from workbench.ui import workers

ITERATIONS, SEED = 2000, 1
CAUTION = ("Caution: estimates are judgement; PERT assumes one path and independent durations, and these odds "
           "assume the crews are worked in the levelled order. Decisions rest with your organisation's own "
           "approval rules.")


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


class ResourceOddsPanel(QWidget):
    """A button, then a small table: P50/P80/P90 and the deadline's chance, logic only and
    with the crews, and one sentence on the difference."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session, self.worker, self.result = session, None, None
        self.run_button = QPushButton("Compare the &odds with and without the crews", clicked=self.run)
        self.status = QLabel(f"The Odds view's run, or {ITERATIONS:,} iterations at seed {SEED}; the crews' run draws "
                             "the same durations.", wordWrap=True)
        self.table = QTableWidget(0, 3)
        self.table.setHorizontalHeaderLabels(["", "Logic only", "With the crews"])
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setStretchLastSection(True)
        self.table.setMaximumHeight(150)
        self.table.hide()
        self.sentence = QLabel(wordWrap=True)
        self.caution = QLabel(CAUTION, wordWrap=True)
        self.caution.setStyleSheet("color: #555555;")
        top = QHBoxLayout()
        top.addWidget(self.run_button)
        top.addWidget(self.status, 1)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addLayout(top)
        layout.addWidget(self.table)
        layout.addWidget(self.sentence)
        layout.addWidget(self.caution)
        session.schedule_changed.connect(self._stale)

    def run(self) -> None:
        if self.worker is not None and self.worker.running:
            return
        self.run_button.setEnabled(False)
        self.status.setText("Simulating both ways…")
        sim = self.session.simulation          # current: the session drops it on every edit
        logic = sim if sim is not None and not getattr(sim, "resource_aware", False) else None
        self._logic_shown = logic is not None
        self.worker = workers.start(compare_odds, self.session.plan.copy(), logic, cancellable=True,
                                    on_done=self._show, on_failed=self._failed, name="slackline-crews-odds")

    def stop(self) -> None:
        """Abandon a run still going (its result is dropped); the wait is bounded."""
        if self.worker is not None:
            self.worker.abandon()
            self.worker.wait(workers.CLOSE_WAIT_S)

    def _show(self, result) -> None:
        self.run_button.setEnabled(True)
        self.result = result
        conf = float(self.session.plan.settings.target_confidence)
        rows = result.rows(conf)
        self.table.setRowCount(len(rows))
        for r, cells in enumerate(rows):
            for c, text in enumerate(cells):
                self.table.setItem(r, c, QTableWidgetItem(text))
        self.table.resizeColumnsToContents()
        self.table.show()
        self.sentence.setText(result.sentence(conf))
        self.status.setText(f"{result.logic.iterations:,} iterations each, seed {result.logic.seed}, the same "
                            "sampled durations" + (" (logic only: the Odds view's run)." if self._logic_shown else "."))

    def _failed(self, exc: Exception) -> None:
        from workbench.core.errors import PlanError
        self.run_button.setEnabled(True)
        message = str(exc) if isinstance(exc, PlanError) else f"{type(exc).__name__}: {exc}"
        self.status.setText(f"Could not simulate: {message}")

    def _stale(self) -> None:
        if self.result is not None:
            self.status.setText("Out of date: the plan changed since these odds. Compare again.")
