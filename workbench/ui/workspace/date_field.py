"""A date field that takes a whole typed date: ISO (2027-03-12) or the way dates are shown
(12 Mar 2027), read by ``workbench.core.date_text``; a calendar button picks one instead.

Unlike a sectioned date editor, selecting all and typing a date replaces all of it, year
included. Text that is not a date is marked and named in the tooltip; the field keeps
its last good date until the text is put right."""

from __future__ import annotations

import datetime as dt

from PySide6.QtCore import QDate, Signal
from PySide6.QtWidgets import (QCalendarWidget, QHBoxLayout, QLineEdit, QMenu, QToolButton,
                               QWidget, QWidgetAction)

from workbench.core.date_text import EXAMPLES, read_date, show_date
from workbench.core.errors import PlanError

BAD_STYLE = "QLineEdit { border: 2px solid #D55E00; }"


class DateField(QWidget):
    """``date()``/``setDate()`` with QDate (as QDateEdit), ``day()`` with datetime.date;
    ``dateChanged(QDate)`` on every change to a valid date; ``problem()`` says what is
    wrong with the text, or ''."""

    dateChanged = Signal(QDate)

    def __init__(self, day: dt.date | QDate, parent=None):
        super().__init__(parent)
        self._day = _as_date(day)
        self._problem = ""
        self.edit = QLineEdit(show_date(self._day), self)
        self.edit.setPlaceholderText(EXAMPLES)
        self.edit.setToolTip(f"Type a date as {EXAMPLES}, or pick one with the button")
        self.edit.editingFinished.connect(self._read)
        self.edit.textEdited.connect(lambda _text: self._show_problem(""))   # judged when finished
        self.button = QToolButton(self)
        self.button.setText("▾")
        self.button.setAccessibleName("Pick a date from a calendar")
        self.button.setPopupMode(QToolButton.ToolButtonPopupMode.InstantPopup)
        self.calendar = QCalendarWidget()
        self.calendar.clicked.connect(self._picked)
        menu = QMenu(self.button)
        holder = QWidgetAction(menu)
        holder.setDefaultWidget(self.calendar)
        menu.addAction(holder)
        menu.aboutToShow.connect(lambda: self.calendar.setSelectedDate(_as_qdate(self._day)))
        self.button.setMenu(menu)
        row = QHBoxLayout(self)
        row.setContentsMargins(0, 0, 0, 0)
        row.addWidget(self.edit, 1)
        row.addWidget(self.button)
        self.setFocusProxy(self.edit)

    # --- QDateEdit's face -------------------------------------------------------
    def date(self) -> QDate:
        self._read()
        return _as_qdate(self._day)

    def setDate(self, day) -> None:  # noqa: N802 (QDateEdit's name)
        self._set(_as_date(day))

    def day(self) -> dt.date:
        self._read()
        return self._day

    def setAccessibleName(self, name: str) -> None:  # noqa: N802 (Qt override)
        super().setAccessibleName(name)
        self.edit.setAccessibleName(name)

    def problem(self) -> str:
        """What is wrong with the typed text ('' when it is a date)."""
        return self._problem

    # --- reading --------------------------------------------------------------
    def _read(self) -> None:
        try:
            day = read_date(self.edit.text())
        except PlanError as exc:
            self._show_problem(str(exc))
            return
        self._show_problem("")
        self._set(day)

    def _picked(self, q: QDate) -> None:
        self._set(_as_date(q))
        self.button.menu().hide()

    def _set(self, day: dt.date) -> None:
        changed = day != self._day
        self._day = day
        if self.edit.text() != show_date(day):
            self.edit.setText(show_date(day))
        self._show_problem("")
        if changed:
            self.dateChanged.emit(_as_qdate(day))

    def _show_problem(self, text: str) -> None:
        self._problem = text
        self.edit.setStyleSheet(BAD_STYLE if text else "")
        self.edit.setToolTip(text or f"Type a date as {EXAMPLES}, or pick one with the button")


def _as_date(day) -> dt.date:
    if isinstance(day, QDate):
        return dt.date(day.year(), day.month(), day.day())
    return day


def _as_qdate(day: dt.date) -> QDate:
    return QDate(day.year, day.month, day.day)
