"""Move the status date: the new date, the rule for out-of-sequence progress, and for every
activity that is in progress, or planned to have started by the new date, its actual
start, actual finish and remaining work. Accepting is one undo step (``MoveStatusDate``)."""

from __future__ import annotations

import datetime as dt

import numpy as np
from PySide6.QtCore import Qt
from PySide6.QtWidgets import (QComboBox, QDialog, QDialogButtonBox, QFormLayout, QLabel, QTableWidget,
                               QTableWidgetItem, QVBoxLayout)

from workbench.core.baseline_commands import MoveStatusDate
from workbench.core.errors import PlanError
from workbench.core.model import PROGRESS_RULES
from workbench.core.progress_fields import DONE
from workbench.ui.activities import columns as C
from workbench.ui.workspace.settings_dialog import _date_edit, from_qdate

HEADINGS = ("ID", "Name", "Actual start", "Actual finish", "Remaining (d or a / m / b)")
KEYS = ("actual_start", "actual_finish", "remaining")


def rows_to_ask(analysis, day: dt.date) -> list[str]:
    """Activities not done that are in progress or were planned to start by the end of ``day``."""
    plan, s = analysis.plan, analysis.schedule
    limit = analysis.calendar.offset_through(day)
    frame = analysis.progress
    state = frame.state if frame is not None else np.zeros(len(s.ids), dtype=np.int8)
    started = np.array([a.progress is not None and a.progress.actual_start is not None for a in plan.activities])
    ask = (state != DONE) & (started | (s.es < limit))
    return [s.ids[i] for i in np.flatnonzero(ask)]


class StatusDateDialog(QDialog):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.setWindowTitle("Move the status date")
        self.session, plan = session, session.plan
        old = plan.settings.status_date
        self.date = _date_edit(self, "New status date", (old or plan.settings.start) + dt.timedelta(days=7))
        self.rule = QComboBox(self)
        self.rule.addItems(PROGRESS_RULES)
        self.rule.setCurrentText(plan.settings.progress_rule)
        self.rule.setAccessibleName("Rule for out-of-sequence progress")
        self.table = QTableWidget(0, len(HEADINGS), self)
        self.table.setHorizontalHeaderLabels(HEADINGS)
        self.table.setAccessibleName("Progress to report")
        self.date.dateChanged.connect(lambda *_: self.fill())
        self._layout(old)
        self.fill()

    def _layout(self, old) -> None:
        form = QFormLayout()
        form.addRow("Status date was", QLabel(old.isoformat() if old else "not set", self))
        form.addRow("New status date", self.date)
        form.addRow("Out-of-sequence work", self.rule)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
        buttons.accepted.connect(self._accept)
        buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addLayout(form)
        layout.addWidget(QLabel("Report what happened by the end of the new status date. Leave the actual start "
                                "empty for work not started; give the remaining work of what is still in progress.",
                                self, wordWrap=True))
        layout.addWidget(self.table)
        layout.addWidget(buttons)
        self.resize(760, 460)

    def new_date(self) -> dt.date:
        return from_qdate(self.date.date())

    def fill(self) -> None:
        analysis = self.session.analysis
        ids = rows_to_ask(analysis, self.new_date()) if analysis is not None else []
        self.table.setRowCount(len(ids))
        for r, act_id in enumerate(ids):
            act = self.session.plan.activity(act_id)
            cells = [act_id, act.name] + [C.edit_text(act, k) for k in KEYS]
            for c, text in enumerate(cells):
                item = QTableWidgetItem(text)
                if c < 2:
                    item.setFlags(item.flags() & ~Qt.ItemFlag.ItemIsEditable)
                self.table.setItem(r, c, item)
        self.table.resizeColumnsToContents()

    def command(self):
        """The one-step command for what the table says (PlanError names a bad cell)."""
        plan, progress = self.session.plan, {}
        for r in range(self.table.rowCount()):
            act = plan.activity(self.table.item(r, 0).text())
            for c, key in enumerate(KEYS, 2):
                text = self.table.item(r, c).text()
                if text != C.edit_text(act, key):
                    act = act.with_(**C.changes_for(act, key, text))
            if act.progress != plan.activity(act.id).progress:
                progress[act.id] = act.progress
        return MoveStatusDate(plan, self.new_date(), progress, self.rule.currentText())

    def _accept(self) -> None:
        try:
            command = self.command()
        except PlanError as exc:
            self.session.refuse(str(exc))
            return
        if self.session.push(command):
            self.accept()


def move_status_date(window) -> None:
    StatusDateDialog(window.session, window).exec()
