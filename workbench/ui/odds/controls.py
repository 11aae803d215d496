"""Simulation controls of the Odds view: run/stop, iterations, seed, progress, status."""

from __future__ import annotations

from PySide6.QtCore import Signal
from PySide6.QtWidgets import (QFormLayout, QGroupBox, QHBoxLayout, QLabel, QProgressBar,
                               QPushButton, QSpinBox, QVBoxLayout)

RANDOM_SEED = -1


class OddsControls(QGroupBox):
    """Emits ``run_requested(iterations, seed or None)`` and ``stop_requested()``."""

    run_requested = Signal(int, object)
    stop_requested = Signal()

    def __init__(self, parent=None):
        super().__init__("Monte Carlo simulation", parent)
        self.iterations = QSpinBox()
        self.iterations.setRange(100, 1_000_000)
        self.iterations.setSingleStep(1000)
        self.iterations.setValue(10_000)
        self.iterations.setGroupSeparatorShown(True)
        self.seed = QSpinBox()
        self.seed.setRange(RANDOM_SEED, 2_147_483_647)
        self.seed.setSpecialValueText("random")
        self.seed.setValue(1)
        self.seed.setToolTip("The same seed gives the same results; 'random' draws a new one")
        self.button = QPushButton("Run simulation")
        self.button.clicked.connect(self._clicked)
        self.progress = QProgressBar()
        self.progress.setRange(0, 100)
        self.progress.setValue(0)
        self.progress.setMinimumWidth(40)
        self.status = QLabel("No simulation yet.")
        self.status.setWordWrap(True)
        self._layout()
        self._running = False

    def _layout(self) -> None:
        form = QFormLayout()
        form.setRowWrapPolicy(QFormLayout.RowWrapPolicy.WrapLongRows)   # a narrow panel: box under its name
        form.addRow("Iterations", self.iterations)
        form.addRow("Seed", self.seed)
        row = QHBoxLayout()
        row.addWidget(self.button)
        row.addWidget(self.progress, 1)
        box = QVBoxLayout(self)
        box.addLayout(form)
        box.addLayout(row)
        box.addWidget(self.status)

    def follow(self, iterations: int, seed) -> None:
        """Show the iterations and seed of a result shown from elsewhere (another window's
        run, a file), so Run repeats it; a 'random' seed box stays random."""
        if iterations:
            self.iterations.setValue(int(min(max(iterations, self.iterations.minimum()), self.iterations.maximum())))
        if seed is not None and self.seed_value() is not None:
            self.seed.setValue(int(min(seed, self.seed.maximum())))

    def seed_value(self):
        value = self.seed.value()
        return None if value == RANDOM_SEED else value

    def _clicked(self) -> None:
        if self._running:
            self.stop_requested.emit()
        else:
            self.run_requested.emit(self.iterations.value(), self.seed_value())

    def set_running(self, running: bool) -> None:
        self._running = running
        self.button.setText("Stop" if running else "Run simulation")
        self.iterations.setEnabled(not running)
        self.seed.setEnabled(not running)
        if running:
            self.progress.setValue(0)
            self.status.setText("Simulating…")

    def set_done(self, finished: bool) -> None:
        """A finished run fills the bar; a stopped or failed one empties it."""
        self.progress.setValue(100 if finished else 0)

    def set_progress(self, done: int, total: int) -> None:
        self.progress.setValue(int(round(100.0 * done / max(1, total))))

    def set_status(self, text: str, stale: bool = False) -> None:
        self.status.setText(text)
        self.status.setStyleSheet("color: #8A3B00; font-weight: bold;" if stale else "")
