"""Plan settings: title, start, unit, working week, holidays, deadline, status date, odds,
sign-off."""

from __future__ import annotations

import datetime as dt

from PySide6.QtCore import QDate
from PySide6.QtWidgets import (QCheckBox, QComboBox, QDialog, QDialogButtonBox,
                               QFormLayout, QHBoxLayout, QLineEdit, QPushButton,
                               QSpinBox, QTableWidget, QTableWidgetItem, QTabWidget, QVBoxLayout,
                               QWidget)

from workbench.core.calendar import WorkCalendar
from workbench.core.errors import PlanError
from workbench.core.long_texts import check_entered_settings
from workbench.core.model import DISTRIBUTIONS, Calendar, Settings, SignOff
from workbench.ui import prompts
from workbench.ui.workspace.date_field import DateField
from workbench.ui.workspace.holiday_list import HolidayList

WEEKDAYS = ("Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun")


def to_qdate(day: dt.date) -> QDate:
    return QDate(day.year, day.month, day.day)


def from_qdate(q: QDate) -> dt.date:
    return dt.date(q.year(), q.month(), q.day())


def _date_edit(parent, name: str, day: dt.date) -> DateField:
    edit = DateField(day, parent)
    edit.setAccessibleName(name)
    return edit


class SettingsDialog(QDialog):
    """Edits a copy of the settings; ``result_settings()`` returns the new Settings."""

    def __init__(self, settings: Settings, parent=None):
        super().__init__(parent)
        self.setWindowTitle("Plan settings")
        self.original = settings
        tabs = QTabWidget(self)
        tabs.addTab(self._plan_tab(settings), "Plan")
        tabs.addTab(self._calendar_tab(settings), "Working time")
        tabs.addTab(self._approval_tab(settings), "Approval")
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
        buttons.accepted.connect(self._accept)
        buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addWidget(tabs)
        layout.addWidget(buttons)

    # --- tabs --------------------------------------------------------------
    def _plan_tab(self, s: Settings) -> QWidget:
        page = QWidget(self)
        form = QFormLayout(page)
        self.title = QLineEdit(s.title, page)
        self.title.setAccessibleName("Plan title")
        self.start = _date_edit(page, "Project start", s.start)
        self.unit = QComboBox(page)
        self.unit.setAccessibleName("Duration unit")
        self.unit.addItems(["days", "weeks"])
        self.unit.setCurrentText(s.unit)
        self.has_deadline = QCheckBox("Committed finish date", page)
        self.deadline = _date_edit(page, "Deadline", self._deadline_date(s))
        self.has_deadline.setChecked(s.deadline is not None)
        self.deadline.setEnabled(s.deadline is not None)
        self.has_deadline.toggled.connect(self.deadline.setEnabled)
        form.addRow("Title", self.title)
        form.addRow("Start", self.start)
        form.addRow("Unit", self.unit)
        form.addRow(self.has_deadline, self.deadline)
        self.has_status = QCheckBox("Status date (progress as of)", page)
        self.status = _date_edit(page, "Status date", s.status_date or dt.date.today())
        self.has_status.setChecked(s.status_date is not None)
        self.status.setEnabled(s.status_date is not None)
        self.has_status.toggled.connect(self.status.setEnabled)
        form.addRow(self.has_status, self.status)
        self._odds_rows(page, form, s)
        return page

    def _odds_rows(self, page: QWidget, form: QFormLayout, s: Settings) -> None:
        self.confidence = QSpinBox(page)
        self.confidence.setAccessibleName("Target confidence")
        self.confidence.setRange(1, 99)
        self.confidence.setSuffix(" %")
        self.confidence.setValue(round(s.target_confidence * 100))
        self.distribution = QComboBox(page)
        self.distribution.setAccessibleName("Default distribution")
        self.distribution.addItems(list(DISTRIBUTIONS))
        self.distribution.setCurrentText(s.distribution)
        form.addRow("Target confidence", self.confidence)
        form.addRow("Default distribution", self.distribution)

    def _deadline_date(self, s: Settings) -> dt.date:
        if isinstance(s.deadline, dt.date):
            return s.deadline
        if s.deadline is None:
            return s.start
        return WorkCalendar(s).finish_date(float(s.deadline))

    def _calendar_tab(self, s: Settings) -> QWidget:
        page = QWidget(self)
        layout = QVBoxLayout(page)
        days = QHBoxLayout()
        self.weekdays = []
        for i, name in enumerate(WEEKDAYS):
            box = QCheckBox(name, page)
            box.setAccessibleName(f"{name} is a working day")
            box.setChecked(i in s.calendar.workdays)
            self.weekdays.append(box)
            days.addWidget(box)
        layout.addLayout(days)
        self.holidays = HolidayList(s.calendar.holidays, s.calendar.region, s.start.year, page)
        layout.addWidget(self.holidays)
        return page

    def _approval_tab(self, s: Settings) -> QWidget:
        page = QWidget(self)
        form = QFormLayout(page)
        self.revision = QLineEdit(s.revision, page)
        self.revision.setAccessibleName("Revision")
        self.prepared_by = QLineEdit(s.prepared_by, page)
        self.prepared_by.setAccessibleName("Prepared by")
        self.sign_off = QTableWidget(len(s.sign_off), 2, page)
        self.sign_off.setAccessibleName("Sign-off names and roles")
        self.sign_off.setHorizontalHeaderLabels(["Name", "Role"])
        self.sign_off.horizontalHeader().setStretchLastSection(True)
        for row, entry in enumerate(s.sign_off):
            self.sign_off.setItem(row, 0, QTableWidgetItem(entry.name))
            self.sign_off.setItem(row, 1, QTableWidgetItem(entry.role))
        add, remove = QPushButton("Add signatory", page), QPushButton("Remove signatory", page)
        add.clicked.connect(lambda: self.sign_off.insertRow(self.sign_off.rowCount()))
        remove.clicked.connect(lambda: self.sign_off.removeRow(self.sign_off.currentRow()))
        buttons = QHBoxLayout()
        buttons.addWidget(add)
        buttons.addWidget(remove)
        form.addRow("Revision", self.revision)
        form.addRow("Prepared by", self.prepared_by)
        form.addRow("Sign-off", self.sign_off)
        form.addRow("", buttons)
        return page

    # --- result --------------------------------------------------------------
    def _signatories(self) -> list[SignOff]:
        out = []
        for row in range(self.sign_off.rowCount()):
            cells = [self.sign_off.item(row, c) for c in (0, 1)]
            name, role = (c.text().strip() if c else "" for c in cells)
            if name or role:
                out.append(SignOff(name, role))
        return out

    def result_settings(self) -> Settings:
        workdays = tuple(i for i, box in enumerate(self.weekdays) if box.isChecked())
        calendar = Calendar(workdays, self.holidays.dates(), self.holidays.region())
        return Settings(
            title=self.title.text().strip() or "Untitled plan", start=from_qdate(self.start.date()),
            unit=self.unit.currentText(), calendar=calendar,
            deadline=self._deadline_value(),
            status_date=from_qdate(self.status.date()) if self.has_status.isChecked() else None,
            target_confidence=self.confidence.value() / 100.0,
            distribution=self.distribution.currentText(), revision=self.revision.text().strip(),
            prepared_by=self.prepared_by.text().strip(), sign_off=self._signatories(),
            progress_rule=self.original.progress_rule)      # set in Progress ▸ Move the Status Date

    def _deadline_value(self):
        if not self.has_deadline.isChecked():
            return None
        chosen = from_qdate(self.deadline.date())
        old = self.original.deadline
        if old is not None and not isinstance(old, dt.date) and chosen == self._deadline_date(self.original):
            return old  # an offset deadline left as it was stays an offset
        return chosen

    def _accept(self) -> None:
        for field, name in ((self.start, "Start"), (self.deadline, "Committed finish date"),
                            (self.status, "Status date")):
            field.day()   # reads what was typed
            if field.isEnabled() and field.problem():
                prompts.show_error(self, "Plan settings", f"{name}: {field.problem()}")
                field.setFocus()
                return
        try:
            check_entered_settings(self.result_settings().validated(), self.original)
        except PlanError as exc:
            prompts.show_error(self, "Plan settings", str(exc))
            return
        self.accept()


def edit_settings(parent, settings):
    """The plan settings dialog; returns new Settings or None."""
    dialog = SettingsDialog(settings, parent)
    return dialog.result_settings() if dialog.exec() else None
