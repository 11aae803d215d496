"""This plan's Checkup thresholds: each beside the standard's figure (or our default), one
undo step for the whole change."""

from __future__ import annotations

from PySide6.QtWidgets import (QDialog, QDialogButtonBox, QDoubleSpinBox, QFormLayout, QLabel, QScrollArea,
                               QVBoxLayout, QWidget)

from workbench.core.checkup_command import SetCheckupThresholds
from workbench.core.checkup_limits import LIMITS, thresholds_of

UNITS = {"%": " %", "count": "", "ratio": "", "working days": " working days", "points": " points", "times": "\u00d7"}


class ThresholdsDialog(QDialog):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.setWindowTitle("Checkup thresholds")
        self.boxes: dict[str, QDoubleSpinBox] = {}
        current = thresholds_of(session.plan)
        form_host = QWidget()
        form = QFormLayout(form_host)
        for limit in LIMITS:
            form.addRow(self._label(limit), self._box(limit, current[limit.key]))
        scroll = QScrollArea()
        scroll.setWidget(form_host)
        scroll.setWidgetResizable(True)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel
                                   | QDialogButtonBox.StandardButton.RestoreDefaults)
        buttons.button(QDialogButtonBox.StandardButton.RestoreDefaults).setText("Use the standard and defaults")
        buttons.button(QDialogButtonBox.StandardButton.RestoreDefaults).clicked.connect(self.restore)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        lay = QVBoxLayout(self)
        lay.addWidget(QLabel("An organisation may set its own thresholds; they are stored in the plan file. "
                             "The standard's figures are those of the DCMA 14-point assessment."))
        lay.addWidget(scroll, 1)
        lay.addWidget(buttons)
        self.resize(640, 520)

    @staticmethod
    def _label(limit) -> QLabel:
        origin = "standard" if limit.published else "our default"
        label = QLabel(f"{limit.label} ({origin}: {limit.default:g}{UNITS[limit.unit]})")
        label.setWordWrap(True)
        return label

    def _box(self, limit, value: float) -> QDoubleSpinBox:
        box = QDoubleSpinBox()
        box.setDecimals(2)
        box.setRange(0.0, limit.high)
        box.setSuffix(UNITS[limit.unit])
        box.setValue(value)
        box.setAccessibleName(limit.key)
        self.boxes[limit.key] = box
        return box

    def values(self) -> dict[str, float]:
        return {key: box.value() for key, box in self.boxes.items()}

    def restore(self) -> None:
        for limit in LIMITS:
            self.boxes[limit.key].setValue(limit.default)

    def accept(self) -> None:
        if self.values() != thresholds_of(self.session.plan):
            self.session.push(SetCheckupThresholds(self.values()))
        super().accept()
