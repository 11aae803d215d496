"""The Checkup's checks as a table: mark, check, figure, threshold, source."""

from __future__ import annotations

from PySide6.QtCore import QAbstractTableModel, QModelIndex, Qt
from PySide6.QtGui import QBrush, QColor, QFont

from workbench.core.checkup_limits import COMMON_PRACTICE

HEADERS = ("Mark", "Check", "Figure", "Threshold")
FAIL_TINT = "#FBE3D6"        # a light vermillion tint; the mark's word and weight carry the meaning
NA_TEXT = "#5A5A5A"
CHANGED = "This plan's own threshold: it differs from the default (the standard's figure for its checks)."


class CheckupTableModel(QAbstractTableModel):
    def __init__(self, parent=None):
        super().__init__(parent)
        self.checks: list = []
        self._bold = QFont()
        self._bold.setBold(True)

    def set_checkup(self, checkup) -> None:
        self.beginResetModel()
        self.checks = list(checkup) if checkup is not None else []
        self.endResetModel()

    def rowCount(self, parent=QModelIndex()) -> int:  # noqa: N802 (Qt override)
        return 0 if parent.isValid() else len(self.checks)

    def columnCount(self, parent=QModelIndex()) -> int:  # noqa: N802 (Qt override)
        return 0 if parent.isValid() else len(HEADERS)

    def headerData(self, section, orientation, role=Qt.ItemDataRole.DisplayRole):  # noqa: N802 (Qt override)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.ToolTipRole) \
                and orientation == Qt.Orientation.Horizontal:
            return HEADERS[section]
        return None

    def data(self, index, role=Qt.ItemDataRole.DisplayRole):
        if not index.isValid() or not 0 <= index.row() < len(self.checks):
            return None
        c, col = self.checks[index.row()], index.column()
        if role == Qt.ItemDataRole.DisplayRole:
            return self._text(c, col)
        if role == Qt.ItemDataRole.ToolTipRole:
            return self._tip(c, col)
        if role == Qt.ItemDataRole.FontRole and c.status == "fail" and col in (0, 1):
            return self._bold
        if role == Qt.ItemDataRole.BackgroundRole and c.status == "fail":
            return QBrush(QColor(FAIL_TINT))
        if role == Qt.ItemDataRole.ForegroundRole and c.status == "n/a":
            return QBrush(QColor(NA_TEXT))
        if role == Qt.ItemDataRole.AccessibleTextRole:
            return f"{c.name}: {c.status}. {c.value_text}"
        return None

    @staticmethod
    def _text(c, col: int) -> str:
        if col == 0:
            return c.mark
        if col == 1:
            return c.name
        if col == 2:
            return c.value_text
        return c.threshold + (" *" if c.changed else "")

    @staticmethod
    def _tip(c, col: int) -> str:
        """The cell whole (a narrow column says it shorter), then what stands behind it."""
        whole = {1: c.name, 2: c.value_text, 3: f"Threshold: {c.threshold}"}.get(col, f"{c.mark}: {c.name}")
        if col == 3 and c.changed:
            return f"{whole}\n{CHANGED}"
        source = "Source: " + ("common practice (no published source)" if c.source == COMMON_PRACTICE else c.source)
        lines = [whole] + ([c.value_text] if col != 2 else []) + [source] + ([c.note] if c.note else [])
        return "\n".join(lines)

    def check_at(self, row: int):
        return self.checks[row] if 0 <= row < len(self.checks) else None
