"""An editable list of holiday dates, with a button to add a region's public holidays."""

from __future__ import annotations

import datetime as dt

from PySide6.QtWidgets import (QGridLayout, QHBoxLayout, QLabel, QLineEdit, QListWidget,
                               QListWidgetItem, QPushButton, QSpinBox, QWidget)

from workbench.core.calendar import public_holidays
from workbench.core.date_text import show_date
from workbench.core.holiday_names import holiday_names
from workbench.core.errors import PlanError
from workbench.ui import prompts
from workbench.ui.workspace.date_field import DateField


class HolidayList(QWidget):
    """Holiday dates as a sorted list; dates are stored, never re-derived later."""

    def __init__(self, holidays, region: str, year: int, parent=None):
        super().__init__(parent)
        self._dates: set[dt.date] = set(holidays)
        grid = QGridLayout(self)
        self.list = QListWidget(self)
        self.list.setAccessibleName("Holidays")
        self.list.setSelectionMode(QListWidget.SelectionMode.ExtendedSelection)
        self.day = DateField(dt.date.today(), self)
        self.day.setAccessibleName("Holiday date to add")
        add, remove = QPushButton("Add date", self), QPushButton("Remove selected", self)
        add.clicked.connect(lambda: self.add_dates([self._picked()]))
        remove.clicked.connect(self.remove_selected)
        self.region_edit = QLineEdit(region, self)
        self.region_edit.setPlaceholderText("e.g. DE, FR, US-CA")
        self.region_edit.setAccessibleName("Public holiday region")
        self.region_edit.editingFinished.connect(self._refill)   # names follow the region
        self.first, self.last = QSpinBox(self), QSpinBox(self)
        for box, value, name in ((self.first, year, "First year"), (self.last, year + 2, "Last year")):
            box.setRange(1950, 2150)
            box.setValue(value)
            box.setAccessibleName(name)
        fetch = QPushButton("Add public holidays", self)
        fetch.clicked.connect(self.add_region)
        grid.addWidget(QLabel("Holidays (non-working dates)", self), 0, 0, 1, 4)
        grid.addWidget(self.list, 1, 0, 4, 2)
        grid.addWidget(self.day, 1, 2, 1, 2)
        grid.addWidget(add, 2, 2)
        grid.addWidget(remove, 2, 3)
        grid.addWidget(QLabel("Region", self), 3, 2)
        grid.addWidget(self.region_edit, 3, 3)
        years = QHBoxLayout()
        for text, box in (("From year", self.first), ("to year", self.last)):
            label = QLabel(text, self)
            label.setBuddy(box)
            years.addWidget(label)
            years.addWidget(box)
        grid.addLayout(years, 4, 2, 1, 2)
        grid.addWidget(fetch, 5, 2, 1, 2)
        self._refill()

    def _picked(self) -> dt.date:
        return self.day.day()

    def _refill(self) -> None:
        self.list.clear()
        names = holiday_names(self.region_edit.text().strip(), self._dates)
        for day in sorted(self._dates):
            text = show_date(day) + (f" — {names[day]}" if day in names else "")
            item = QListWidgetItem(text)
            item.setData(256, day.isoformat())
            self.list.addItem(item)

    def add_dates(self, days) -> None:
        self._dates.update(days)
        self._refill()

    def remove_selected(self) -> None:
        for item in self.list.selectedItems():
            self._dates.discard(dt.date.fromisoformat(item.data(256)))
        self._refill()

    def add_region(self) -> None:
        region = self.region_edit.text().strip()
        years = range(min(self.first.value(), self.last.value()), max(self.first.value(), self.last.value()) + 1)
        if not region:
            prompts.show_error(self, "Public holidays", "Type a region code first, for example DE or US-CA.")
            return
        try:
            self.add_dates(public_holidays(region, years))
        except PlanError as exc:
            prompts.show_error(self, "Public holidays", str(exc))

    def dates(self) -> tuple[dt.date, ...]:
        return tuple(sorted(self._dates))

    def region(self) -> str:
        return self.region_edit.text().strip()
