"""Pick the predecessors of one activity from a list, with link type and lag."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import (QComboBox, QDialog, QDialogButtonBox, QDoubleSpinBox, QHeaderView,
                               QLabel, QLineEdit, QTableWidget, QTableWidgetItem, QVBoxLayout)

from workbench.core.model import LINK_TYPES, Link, Plan

TYPE_TEXT = {"FS": "FS  finish → start", "SS": "SS  start → start",
             "FF": "FF  finish → finish", "SF": "SF  start → finish"}


class PredecessorDialog(QDialog):
    """Tick the activities that must come before ``act_id``; set type and lag per link."""

    def __init__(self, plan: Plan, act_id: str, parent=None):
        super().__init__(parent)
        self.act_id = act_id
        self.setWindowTitle(f"Predecessors of {act_id}")
        current = {l.pred: l for l in plan.predecessors(act_id)}
        self.candidates = [a for a in plan.activities if a.id != act_id]
        layout = QVBoxLayout(self)
        layout.addWidget(QLabel(f"Activities that must come before <b>{act_id}</b> "
                                f"({plan.activity(act_id).name or 'no name'}):", self))
        self.find = QLineEdit(self)
        self.find.setPlaceholderText("Find")
        self.find.setAccessibleName("Find activities")
        self.find.textChanged.connect(self._filter)
        layout.addWidget(self.find)
        self.table = self._make_table(current)
        layout.addWidget(self.table)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        layout.addWidget(buttons)
        self.resize(620, 480)

    def _make_table(self, current: dict[str, Link]) -> QTableWidget:
        table = QTableWidget(len(self.candidates), 4, self)
        table.setAccessibleName("Candidate predecessors")
        table.setHorizontalHeaderLabels(["ID", "Activity", "Link", "Lag"])
        table.verticalHeader().hide()
        table.horizontalHeader().setSectionResizeMode(1, QHeaderView.ResizeMode.Stretch)
        for row, act in enumerate(self.candidates):
            link = current.get(act.id)
            item = QTableWidgetItem(act.id)
            item.setFlags(Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsUserCheckable)
            item.setCheckState(Qt.CheckState.Checked if link else Qt.CheckState.Unchecked)
            table.setItem(row, 0, item)
            name = QTableWidgetItem(act.name)
            name.setFlags(Qt.ItemFlag.ItemIsEnabled)
            table.setItem(row, 1, name)
            kind = QComboBox(table)
            kind.setAccessibleName(f"Link type from {act.id}")
            for t in LINK_TYPES:
                kind.addItem(TYPE_TEXT[t], t)
            kind.setCurrentIndex(LINK_TYPES.index(link.type) if link else 0)
            table.setCellWidget(row, 2, kind)
            lag = QDoubleSpinBox(table)
            lag.setAccessibleName(f"Lag after {act.id}")
            lag.setRange(-9999, 9999)
            lag.setDecimals(1)
            lag.setValue(link.lag if link else 0.0)
            table.setCellWidget(row, 3, lag)
        return table

    def _filter(self, text: str) -> None:
        text = text.casefold().strip()
        for row, act in enumerate(self.candidates):
            hit = not text or text in act.id.casefold() or text in act.name.casefold()
            self.table.setRowHidden(row, not hit)

    def set_checked(self, act_id: str, on: bool = True, kind: str = "FS", lag: float = 0.0) -> None:
        row = [a.id for a in self.candidates].index(act_id)
        self.table.item(row, 0).setCheckState(Qt.CheckState.Checked if on else Qt.CheckState.Unchecked)
        self.table.cellWidget(row, 2).setCurrentIndex(LINK_TYPES.index(kind))
        self.table.cellWidget(row, 3).setValue(lag)

    def links(self) -> list[Link]:
        out = []
        for row, act in enumerate(self.candidates):
            if self.table.item(row, 0).checkState() == Qt.CheckState.Checked:
                kind = self.table.cellWidget(row, 2).currentData()
                out.append(Link(act.id, self.act_id, kind, float(self.table.cellWidget(row, 3).value())))
        return out
