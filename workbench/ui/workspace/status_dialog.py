"""Move the status date: the new date, the rule for out-of-sequence progress, and for every
activity that is in progress, or planned to have started by the new date, its actual
start, actual finish and remaining work. Accepting is one undo step (``MoveStatusDate``).

What the core refuses is said inside the dialog, on a message line above the buttons; the
cell at fault is marked (tinted, bold, the reason as its tooltip) and given the focus; what
was typed stays, also when the new date changes which activities are asked for."""

from __future__ import annotations

import datetime as dt
import html
import re

import numpy as np
from PySide6.QtCore import QItemSelectionModel, Qt
from PySide6.QtGui import QBrush, QColor, QFont
from PySide6.QtWidgets import (QComboBox, QDialog, QDialogButtonBox, QFormLayout, QLabel, QTableWidget,
                               QTableWidgetItem, QVBoxLayout)

from workbench.core.baseline_commands import MoveStatusDate, refusal_of
from workbench.core.date_text import show_date
from workbench.core.errors import PlanError
from workbench.core.model import PROGRESS_RULES
from workbench.core.progress_fields import DONE
from workbench.ui.activities import columns as C
from workbench.ui.session import as_the_window_says
from workbench.ui.workspace.settings_dialog import _date_edit, from_qdate

HEADINGS = ("ID", "Name", "Actual start", "Actual finish", "Remaining (d or a / m / b)")
KEYS = ("actual_start", "actual_finish", "remaining")
FIRST_KEY_COLUMN = 2
MARK = QColor("#F7D9C4")            # a light tint of the critical vermillion (the bold text and tooltip say it too)
MESSAGE_STYLE = "QLabel { border: 2px solid #D55E00; border-radius: 3px; padding: 4px; }"
NAME_WIDTH = 260                     # wider names are elided (the whole name is the cell's tooltip)
_ISO_DAY = re.compile(r"\b(\d{4})-(\d{2})-(\d{2})\b")


def dates_as_shown(message: str) -> str:
    """``message`` with its ISO dates written as the dialog's cells show dates."""
    def shown(m: re.Match) -> str:
        try:
            return show_date(dt.date(*(int(g) for g in m.groups())))
        except ValueError:
            return m.group(0)
    return _ISO_DAY.sub(shown, message)


def column_of(field: str | None) -> int:
    """The dialog's column for a progress field (every way of giving remaining work is typed
    in the Remaining column); the ID column when no field is named."""
    if field is None:
        return 0
    if field in KEYS[:2]:
        return FIRST_KEY_COLUMN + KEYS.index(field)
    return FIRST_KEY_COLUMN + 2


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
        self.message = QLabel(self, wordWrap=True)
        self.message.setAccessibleName("Why the status date was not moved")
        self.message.setStyleSheet(MESSAGE_STYLE)
        self.message.setTextFormat(Qt.TextFormat.RichText)
        self.message.hide()
        self.marked: tuple[int, int] | None = None
        self.marked_text = ""
        self.table.itemChanged.connect(self._edited)
        self.date.dateChanged.connect(lambda *_: self.fill())
        self._layout(old)
        self.fill()

    def _layout(self, old) -> None:
        form = QFormLayout()
        form.addRow("Status date was", QLabel(show_date(old) if old else "not set", self))
        form.addRow("New status date", self.date)
        form.addRow("Out-of-sequence work", self.rule)
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
        buttons.accepted.connect(self._accept)
        buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addLayout(form)
        layout.addWidget(QLabel("Report what happened by the end of the new status date. Leave the actual start "
                                "empty for work not started; give the remaining work of what is still in progress. "
                                "Dates as 2027-03-12 or 12 Mar 2027.", self, wordWrap=True))
        layout.addWidget(self.table)
        layout.addWidget(self.message)
        layout.addWidget(buttons)
        self.resize(760, 460)

    def new_date(self) -> dt.date:
        return from_qdate(self.date.date())

    def typed(self) -> dict[str, dict[str, str]]:
        """What the planner typed that differs from the plan: {activity id: {field: text}}."""
        out: dict[str, dict[str, str]] = {}
        for r in range(self.table.rowCount()):
            act = self.session.plan.activity(self.table.item(r, 0).text())
            for c, key in enumerate(KEYS, FIRST_KEY_COLUMN):
                text = self.table.item(r, c).text()
                if text != C.edit_text(act, key):
                    out.setdefault(act.id, {})[key] = text
        return out

    def fill(self) -> None:
        """The activities to ask for at the new date, keeping whatever was typed (a row
        typed into stays even when the new date no longer asks for it)."""
        analysis, plan, kept = self.session.analysis, self.session.plan, self.typed()
        asked = set(rows_to_ask(analysis, self.new_date()) if analysis is not None else []) | set(kept)
        ids = [i for i in plan.ids() if i in asked]
        self.clear_refusal()
        self.table.setRowCount(len(ids))
        for r, act_id in enumerate(ids):
            act = plan.activity(act_id)
            cells = [act_id, act.name] + [kept.get(act_id, {}).get(k, C.edit_text(act, k)) for k in KEYS]
            for c, text in enumerate(cells):
                item = QTableWidgetItem(text)
                if c < FIRST_KEY_COLUMN:
                    item.setFlags(item.flags() & ~Qt.ItemFlag.ItemIsEditable)
                    item.setToolTip(text)
                self.table.setItem(r, c, item)
        self.table.resizeColumnsToContents()
        self.table.setColumnWidth(1, min(self.table.columnWidth(1), NAME_WIDTH))

    def command(self):
        """The one-step command for what the table says. A cell that cannot be read raises
        PlanError naming the activity, with ``field`` the cell's field."""
        plan, progress = self.session.plan, {}
        for act_id, texts in self.typed().items():
            act = plan.activity(act_id)
            for key in KEYS:
                if key in texts:
                    act = act.with_(**_read_cell(act, key, texts[key]))
            if act.progress != plan.activity(act_id).progress:
                progress[act_id] = act.progress
        return MoveStatusDate(plan, self.new_date(), progress, self.rule.currentText())

    def _accept(self) -> None:
        try:
            command = self.command()
        except PlanError as exc:
            self.show_refusal(exc)
            return
        problem = refusal_of(self.session.plan, command) if self.session.analysis is not None else None
        if problem is not None:
            self.show_refusal(problem)
        elif self.session.push(command):
            self.accept()
        else:                        # refused after all: say so here too, no cell known
            self.show_refusal(PlanError(self.session.last_refusal or "the status date was not moved"))

    # --- saying why -----------------------------------------------------------
    def show_refusal(self, exc: PlanError) -> None:
        """Say why inside the dialog and mark (and focus) the cell at fault."""
        self.clear_refusal()
        words = dates_as_shown(as_the_window_says(exc))
        self.message.setText(f"<b>Not moved yet:</b> {html.escape(words, quote=False)}")
        self.message.show()
        row = self._row_of(exc.culprit)
        if row is None:
            return
        col = column_of(getattr(exc, "field", None))
        item = self.table.item(row, col)
        item.setBackground(QBrush(MARK))
        font = QFont(item.font())
        font.setBold(True)
        item.setFont(font)
        item.setToolTip(words)
        self.marked, self.marked_text = (row, col), item.text()
        self.table.scrollToItem(item)
        self.table.setCurrentCell(row, col, QItemSelectionModel.SelectionFlag.ClearAndSelect)
        self.table.clearSelection()                # the focus frame stays; the tint is not hidden
        self.table.setFocus(Qt.FocusReason.OtherFocusReason)

    def clear_refusal(self) -> None:
        self.message.hide()
        self.message.clear()
        marked, self.marked = self.marked, None
        if marked is not None and marked[0] < self.table.rowCount():
            item = self.table.item(*marked)
            if item is not None:
                item.setData(Qt.ItemDataRole.BackgroundRole, None)
                item.setData(Qt.ItemDataRole.FontRole, None)
                item.setToolTip(item.text() if marked[1] < FIRST_KEY_COLUMN else "")

    def _edited(self, item: QTableWidgetItem) -> None:
        """Typing into the marked cell takes the mark and the message away (OK judges anew)."""
        if self.marked == (item.row(), item.column()) and item.text() != self.marked_text:
            self.clear_refusal()

    def _row_of(self, act_id: str | None) -> int | None:
        for r in range(self.table.rowCount()):
            if self.table.item(r, 0).text() == act_id:
                return r
        return None


def _read_cell(act, key: str, text: str) -> dict:
    """The changes typing ``text`` makes; a refusal says which field it was."""
    try:
        return C.changes_for(act, key, text)
    except PlanError as exc:
        if getattr(exc, "field", None) is None:
            exc.field = key
        raise


def move_status_date(window) -> None:
    StatusDateDialog(window.session, window).exec()
