"""The Checkup's table of checks, asking for only a few rows' height: in a short dock it
gives up its height first (then scrolls its rows), so the headline, the details and the
caution stay in sight; in a tall one it takes all the room there is (stretch)."""

from __future__ import annotations

from PySide6.QtCore import QSize
from PySide6.QtWidgets import QTableView

MIN_ROWS = 3            # the table's least height, in rows


class ChecksTable(QTableView):
    def rows_height(self) -> int:
        """The header and :data:`MIN_ROWS` rows, with the frame."""
        rows = self.verticalHeader().defaultSectionSize()
        return self.horizontalHeader().sizeHint().height() + MIN_ROWS * rows + 2 * self.frameWidth()

    def sizeHint(self) -> QSize:  # noqa: N802 (Qt override)
        return QSize(super().sizeHint().width(), self.rows_height())

    def minimumSizeHint(self) -> QSize:  # noqa: N802 (Qt override)
        return QSize(super().minimumSizeHint().width(), self.rows_height())
