"""Sorting and filtering of the Activities table: by group, critical only, and text."""

from __future__ import annotations

import datetime as dt

import numpy as np
from PySide6.QtCore import QModelIndex, QPersistentModelIndex, QSortFilterProxyModel

from workbench.ui.activities import columns as C
from workbench.ui.activities.table_model import CRITICAL_ROLE, SORT_ROLE

_TEXT_KEYS = ("id", "name", "group", "notes")


def sort_key(value):
    """Order numbers, dates and text together; empty cells sort last."""
    if value is None or value == "":
        return (2, 0, "")
    if isinstance(value, np.datetime64):
        return (0, float(value.astype("datetime64[D]").astype(np.int64)), "")
    if isinstance(value, dt.date):
        return (0, float(value.toordinal()), "")
    if isinstance(value, (bool, np.bool_)):
        return (0, 0.0 if value else 1.0, "")
    if isinstance(value, (int, float, np.number)):
        return (0, float(value), "")
    return (1, 0, str(value).casefold())


class ActivityFilterModel(QSortFilterProxyModel):
    """A proxy that shows a chosen group, only critical activities, or matching text."""

    def __init__(self, parent=None):
        super().__init__(parent)
        self._group = ""
        self._critical_only = False
        self._text = ""
        self.setSortRole(SORT_ROLE)
        self.setDynamicSortFilter(True)

    # --- filter settings ----------------------------------------------
    def _change(self, name: str, value) -> None:
        if hasattr(self, "beginFilterChange"):  # Qt 6.9 and later
            self.beginFilterChange()
            setattr(self, name, value)
            self.endFilterChange(QSortFilterProxyModel.Direction.Rows)
        else:
            setattr(self, name, value)
            self.invalidateFilter()

    def set_group(self, group: str) -> None:
        self._change("_group", group or "")

    def set_critical_only(self, on: bool) -> None:
        self._change("_critical_only", bool(on))

    def set_text(self, text: str) -> None:
        self._change("_text", (text or "").strip().casefold())

    def is_filtered(self) -> bool:
        return bool(self._group or self._critical_only or self._text)

    # --- Qt overrides ---------------------------------------------------
    def filterAcceptsRow(self, source_row: int, source_parent: QModelIndex | QPersistentModelIndex) -> bool:
        model = self.sourceModel()
        if model is None:
            return True
        act = model.activity_at(source_row)
        if self._group and act.group != self._group:
            return False
        if self._critical_only and not model.index(source_row, 0).data(CRITICAL_ROLE):
            return False
        if self._text:
            return any(self._text in getattr(act, k).casefold() for k in _TEXT_KEYS)
        return True

    def lessThan(self, left, right) -> bool:
        return sort_key(left.data(SORT_ROLE)) < sort_key(right.data(SORT_ROLE))

    def groups(self) -> list[str]:
        model = self.sourceModel()
        return sorted({a.group for a in model.plan.activities if a.group}) if model else []

    def column_of(self, key: str) -> int:
        return C.INDEX[key]
