"""Baselines: record the plan as it stands, rename, mark approved, delete, and choose the
one the variance columns and the Timeline compare with. Every change is one undo step."""

from __future__ import annotations

from PySide6.QtWidgets import (QAbstractItemView, QComboBox, QDialog, QDialogButtonBox, QHBoxLayout, QInputDialog,
                               QLabel, QPushButton, QTableWidget, QTableWidgetItem, QVBoxLayout)

from workbench.core import baseline as bl
from workbench.core.baseline_commands import ApproveBaseline, DeleteBaseline, RecordBaseline, RenameBaseline
from workbench.core.errors import PlanError
from workbench.core.formatting import format_whole_percent

HEADINGS = ("Name", "Recorded", "Status date", "Finish", "Chance of the deadline", "Approved")
APPROVED_MARK = "\u2714 approved"
AUTO = "the approved baseline"


def chance_text(b) -> str:
    odds = b.simulation or b.pert
    if odds is None or odds.probability is None:
        return "no deadline"
    return f"{format_whole_percent(odds.probability)} ({'simulation' if b.simulation else 'PERT'})"


def record_current(session, name: str, approved: bool = False) -> bool:
    """Record the plan as analysed now (with the simulation on screen, if any) as ``name``."""
    from workbench.io.planfile import plan_hash

    if session.analysis is None:
        return session.refuse("the plan cannot be scheduled, so it cannot be recorded as a baseline")
    try:
        base = bl.make_baseline(name, session.analysis, plan_hash(session.plan), session.simulation, approved=approved)
    except PlanError as exc:
        return session.refuse(str(exc))
    return session.push(RecordBaseline(base))


class BaselinesDialog(QDialog):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.setWindowTitle("Baselines")
        self.session = session
        self.table = QTableWidget(0, len(HEADINGS), self)
        self.table.setHorizontalHeaderLabels(HEADINGS)
        self.table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        self.table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.table.setAccessibleName("Recorded baselines")
        self.compare = QComboBox(self)
        self.compare.setAccessibleName("Compare with")
        self.compare.activated.connect(self._compare_chosen)
        self._layout()
        session.schedule_changed.connect(self.fill)
        self.fill()

    def _layout(self) -> None:
        buttons = QHBoxLayout()
        for text, slot in (("Record current plan…", self.record), ("Rename…", self.rename),
                           ("Mark approved", self.approve), ("Delete", self.delete)):
            button = QPushButton(text, self)
            button.clicked.connect(slot)
            buttons.addWidget(button)
        compare = QHBoxLayout()
        compare.addWidget(QLabel("Variance columns and Timeline compare with:", self))
        compare.addWidget(self.compare, 1)
        close = QDialogButtonBox(QDialogButtonBox.StandardButton.Close, self)
        close.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addWidget(self.table)
        layout.addLayout(buttons)
        layout.addLayout(compare)
        layout.addWidget(close)
        self.resize(760, 360)

    def fill(self) -> None:
        baselines = self.session.plan.baselines
        self.table.setRowCount(len(baselines))
        for r, b in enumerate(baselines):
            cells = (b.name, b.recorded.isoformat(), b.status_date.isoformat() if b.status_date else "",
                     b.finish.isoformat(), chance_text(b), APPROVED_MARK if b.approved else "")
            for c, text in enumerate(cells):
                self.table.setItem(r, c, QTableWidgetItem(text))
        self.table.resizeColumnsToContents()
        self.compare.clear()
        self.compare.addItems([AUTO] + [b.name for b in baselines])
        self.compare.setCurrentText(self.session.compare_baseline or AUTO)

    def selected_name(self) -> str | None:
        row = self.table.currentRow()
        return self.table.item(row, 0).text() if 0 <= row < self.table.rowCount() else None

    def record(self) -> None:
        name, ok = QInputDialog.getText(self, "Record a baseline", "Name of the baseline:")
        if ok:
            record_current(self.session, name)

    def rename(self) -> None:
        old = self.selected_name()
        if old is None:
            return
        new, ok = QInputDialog.getText(self, "Rename the baseline", "New name:", text=old)
        if ok and new.strip() != old:
            self.session.push(RenameBaseline(old, new))

    def approve(self) -> None:
        if self.selected_name() is not None:
            self.session.push(ApproveBaseline(self.selected_name()))

    def delete(self) -> None:
        if self.selected_name() is not None:
            self.session.push(DeleteBaseline(self.selected_name()))

    def _compare_chosen(self, *_) -> None:
        text = self.compare.currentText()
        self.session.compare_with(None if text == AUTO else text)


def manage_baselines(window) -> None:
    BaselinesDialog(window.session, window).exec()
