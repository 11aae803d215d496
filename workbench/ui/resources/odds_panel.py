"""Logic-only and resource-aware odds side by side, run in a worker thread on request."""

from __future__ import annotations

from PySide6.QtCore import QThread, Signal
from PySide6.QtWidgets import QHBoxLayout, QLabel, QPushButton, QTableWidget, QTableWidgetItem, QVBoxLayout, QWidget

ITERATIONS, SEED = 2000, 1
CAUTION = ("Caution: estimates are judgement; PERT assumes one path and independent durations, and these odds "
           "assume the crews are worked in the levelled order. Decisions rest with your organisation's own "
           "approval rules.")


class _Worker(QThread):
    done = Signal(object)
    failed = Signal(str)

    def __init__(self, plan, logic=None, parent=None):
        super().__init__(parent)
        self.plan, self.logic, self.cancelled = plan, logic, False

    def _compare(self):
        """The Odds view's current run beside the crews' run at its seed and iterations (the
        same sampled durations); without one, both runs here."""
        from workbench.core.montecarlo import simulate
        from workbench.core.resource_odds import ResourceOdds, compare

        stop = lambda: self.cancelled  # noqa: E731
        if self.logic is None:
            return compare(self.plan, ITERATIONS, SEED, cancel=stop)
        aware = simulate(self.plan, self.logic.iterations, self.logic.seed, resources=True, cancel=stop)
        return ResourceOdds(self.logic, aware)

    def run(self) -> None:
        from workbench.core.errors import PlanError

        try:
            result = self._compare()
        except PlanError as exc:
            self.failed.emit(str(exc))
            return
        except Exception as exc:  # noqa: BLE001 - the cancel path raises the engine's own exception
            if not self.cancelled:
                self.failed.emit(f"{type(exc).__name__}: {exc}")
            return
        self.done.emit(result)


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
        if self.worker is not None and self.worker.isRunning():
            return
        self.run_button.setEnabled(False)
        self.status.setText("Simulating both ways…")
        sim = self.session.simulation          # current: the session drops it on every edit
        logic = sim if sim is not None and not getattr(sim, "resource_aware", False) else None
        self.worker = _Worker(self.session.plan.copy(), logic, self)
        self.worker.done.connect(self._show)
        self.worker.failed.connect(self._failed)
        self.worker.finished.connect(lambda: self.run_button.setEnabled(True))
        self.worker.start()

    def stop(self) -> None:
        if self.worker is not None:
            self.worker.cancelled = True
            self.worker.wait(10_000)

    def _show(self, result) -> None:
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
                            "sampled durations" + (" (logic only: the Odds view's run)." if self.worker.logic else "."))

    def _failed(self, message: str) -> None:
        self.status.setText(f"Could not simulate: {message}")

    def _stale(self) -> None:
        if self.result is not None:
            self.status.setText("Out of date: the plan changed since these odds. Compare again.")
