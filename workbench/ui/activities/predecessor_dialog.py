"""Pick the predecessors of one activity from a list, with link type and lag."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import (QComboBox, QDialog, QDialogButtonBox, QDoubleSpinBox, QHeaderView,
                               QLabel, QLineEdit, QStyledItemDelegate, QTableWidget, QTableWidgetItem,
                               QVBoxLayout)

from workbench.core.model import LINK_TYPES, Link, Plan
from workbench.ui.activities.links_text import format_number

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
        table.setItemDelegateForColumn(2, _LinkEditor(table))
        table.setItemDelegateForColumn(3, _LagEditor(table))
        fixed = Qt.ItemFlag.ItemIsEnabled
        for row, act in enumerate(self.candidates):
            link = current.get(act.id)
            item = QTableWidgetItem(act.id)
            item.setFlags(fixed | Qt.ItemFlag.ItemIsUserCheckable)
            item.setCheckState(Qt.CheckState.Checked if link else Qt.CheckState.Unchecked)
            table.setItem(row, 0, item)
            name = QTableWidgetItem(act.name)
            name.setFlags(fixed)
            table.setItem(row, 1, name)
            table.setItem(row, 2, QTableWidgetItem(link.type if link else "FS"))
            table.setItem(row, 3, QTableWidgetItem(format_number(link.lag if link else 0.0)))
        return table

    def _filter(self, text: str) -> None:
        text = text.casefold().strip()
        for row, act in enumerate(self.candidates):
            hit = not text or text in act.id.casefold() or text in act.name.casefold()
            self.table.setRowHidden(row, not hit)

    def set_checked(self, act_id: str, on: bool = True, kind: str = "FS", lag: float = 0.0) -> None:
        row = [a.id for a in self.candidates].index(act_id)
        self.table.item(row, 0).setCheckState(Qt.CheckState.Checked if on else Qt.CheckState.Unchecked)
        self.table.item(row, 2).setText(kind)
        self.table.item(row, 3).setText(format_number(lag))

    def links(self) -> list[Link]:
        out = []
        for row, act in enumerate(self.candidates):
            if self.table.item(row, 0).checkState() == Qt.CheckState.Checked:
                kind = self.table.item(row, 2).text().strip().upper()
                kind = kind if kind in LINK_TYPES else "FS"
                try:
                    lag = float(self.table.item(row, 3).text().replace(",", "."))
                except ValueError:
                    lag = 0.0
                out.append(Link(act.id, self.act_id, kind, lag))
        return out


class _LinkEditor(QStyledItemDelegate):
    """Edits a link type cell with a list of the four types."""

    def createEditor(self, parent, option, index):
        box = QComboBox(parent)
        box.setAccessibleName("Link type")
        for t in LINK_TYPES:
            box.addItem(TYPE_TEXT[t], t)
        return box

    def setEditorData(self, editor, index):
        text = str(index.data() or "FS")
        editor.setCurrentIndex(LINK_TYPES.index(text) if text in LINK_TYPES else 0)

    def setModelData(self, editor, model, index):
        model.setData(index, editor.currentData())


class _LagEditor(QStyledItemDelegate):
    """Edits a lag cell with a number box (negative lags allowed)."""

    def createEditor(self, parent, option, index):
        box = QDoubleSpinBox(parent)
        box.setAccessibleName("Lag")
        box.setRange(-9999, 9999)
        box.setDecimals(3)
        return box

    def setEditorData(self, editor, index):
        try:
            editor.setValue(float(index.data() or 0))
        except ValueError:
            editor.setValue(0.0)

    def setModelData(self, editor, model, index):
        model.setData(index, format_number(editor.value()))


def pick_predecessors(parent, plan, act_id: str):
    """The predecessor picker; returns the new list of links into ``act_id`` or None."""
    dialog = PredecessorDialog(plan, act_id, parent)
    return dialog.links() if dialog.exec() else None
