"""The Checkup view: every check with its figure, threshold and a mark that reads without
colour; clicking a check selects its offending activities in every view."""

from __future__ import annotations

from PySide6.QtCore import QEvent, Qt
from PySide6.QtWidgets import (QAbstractItemView, QHBoxLayout, QHeaderView, QLabel, QPushButton, QVBoxLayout,
                               QWidget)

from workbench.core.checkup_limits import STANDARD_NAME, STANDARD_SOURCE
from workbench.ui.checkup.checks_table import ChecksTable
from workbench.ui.checkup.fitted_text import FittedTextDelegate, shorter_forms
from workbench.ui.checkup.keeper import checkup_keeper
from workbench.ui.checkup.table_model import CheckupTableModel

HINT = "Click a check to select its offenders in every view."
SHORT_THRESHOLD_CHARS = 8     # "<= 5 %", ">= 0.95": shown whole in the narrowest dock
STANDARD_EDITION = "DCMA-EA PAM 200.1, October 2012"
CAUTION = ("Odds checks rest on estimates, which are judgement; PERT assumes one path and independent "
           "durations. The decision rests with your organisation's own approval rules.")


class CheckupView(QWidget):
    """The session's Checkup, refreshed when the edits pause."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.keeper = checkup_keeper(session)
        self.model = CheckupTableModel(self)
        self._build()
        self.keeper.updated.connect(self.show_checkup)
        self.show_checkup(self.keeper.checkup)

    def _build(self) -> None:
        self.headline = QLabel()
        font = self.headline.font()
        font.setPointSizeF(font.pointSizeF() * 1.35)
        font.setBold(True)
        self.headline.setFont(font)
        self.headline.setWordWrap(True)          # a very narrow dock: two lines, never cut
        self.standard = QLabel(f"{STANDARD_NAME} ({STANDARD_EDITION}) and our own checks (common practice). {HINT}")
        self.standard.setToolTip(f"Standard: {STANDARD_SOURCE}")
        self.standard.setWordWrap(True)
        self.thresholds = QPushButton("Thresholds\u2026")
        self.thresholds.setToolTip("This plan's thresholds (an organisation sets its own)")
        self.thresholds.clicked.connect(self.edit_thresholds)
        self.table = self._table()
        self.detail = QLabel()
        self.detail.setWordWrap(True)
        self.detail.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.detail.setAccessibleName("Check details")
        self.caution = QLabel(CAUTION)
        self.caution.setWordWrap(True)
        self.caution.setStyleSheet("color: #444444; font-size: 8pt;")
        self._lay_out()

    def _lay_out(self) -> None:
        """One above the other: the headline's row, the description's, the table, the
        details and the caution (``_arrange_head`` puts the button in one of the rows)."""
        self._top, self._below = QHBoxLayout(), QHBoxLayout()
        self._top.addWidget(self.headline, 1)
        self._below.addWidget(self.standard, 1)
        self._narrow_head = None
        lay = QVBoxLayout(self)
        lay.addLayout(self._top)
        lay.addLayout(self._below)
        lay.addWidget(self.table, 1)
        lay.addWidget(self.detail)
        lay.addWidget(self.caution)
        self._arrange_head()

    def _arrange_head(self) -> None:
        """Wide: the headline with *Thresholds…* at its right, the description under both.
        Narrow (the headline and the button do not fit side by side): the headline has the
        whole width and the button goes beside the description, which wraps."""
        margins = self.layout().contentsMargins()
        room = self.width() - margins.left() - margins.right()
        one_line = self.headline.fontMetrics().horizontalAdvance(self.headline.text()) + 4
        narrow = one_line + self._top.spacing() + self.thresholds.sizeHint().width() > room
        if narrow == self._narrow_head:
            return
        self._narrow_head = narrow
        for row in (self._top, self._below):
            row.removeWidget(self.thresholds)
        if narrow:
            self._below.addWidget(self.thresholds, 0, Qt.AlignmentFlag.AlignTop)
        else:
            self._top.addWidget(self.thresholds)

    def _table(self) -> ChecksTable:
        table = ChecksTable(self)         # a few rows' height asked; the rest by stretch
        table.setModel(self.model)
        table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        table.setSelectionMode(QAbstractItemView.SelectionMode.SingleSelection)
        table.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        table.verticalHeader().hide()
        table.setWordWrap(False)
        table.setItemDelegate(FittedTextDelegate(table))     # narrow columns: shorter wordings
        header = table.horizontalHeader()
        header.setSectionResizeMode(QHeaderView.ResizeMode.Interactive)
        header.setSectionResizeMode(0, QHeaderView.ResizeMode.ResizeToContents)
        header.setSectionResizeMode(2, QHeaderView.ResizeMode.Stretch)
        header.setMinimumSectionSize(40)
        header.setTextElideMode(Qt.TextElideMode.ElideRight)     # a narrow column's title: "Thresh…"
        em = table.fontMetrics().horizontalAdvance("M")
        header.resizeSection(1, 14 * em)       # long names elide; the tooltip and details have them whole
        header.resizeSection(3, 8 * em)
        table.setTextElideMode(Qt.TextElideMode.ElideRight)
        table.setAccessibleName("Checkup checks")
        table.clicked.connect(lambda index: self.pick(index.row()))
        table.activated.connect(lambda index: self.pick(index.row()))
        self._viewport = table.viewport()
        self._viewport.installEventFilter(self)      # its width also changes with its scroll bar
        return table

    def resizeEvent(self, event):  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        self._arrange_head()
        self._fit_columns()

    def eventFilter(self, watched, event):  # noqa: N802 (Qt override)
        if watched is self._viewport and event.type() == QEvent.Type.Resize:
            self._fit_columns()
        return super().eventFilter(watched, event)

    def _fit_columns(self) -> None:
        """The columns share the table's width, so it never scrolls sideways: the threshold
        as wide as its longest entry up to a fifth of the room beside the marks (never so
        narrow that a short one such as "<= 5 %" is cut), the figure at least wide enough
        for its number ("85.5 % …"), the check's name up to 14 letters' width from what is
        left; the figure takes the rest. Cells that do not fit say it shorter; their
        tooltips have it whole."""
        header = self.table.horizontalHeader()
        least = header.minimumSectionSize()
        room = self.table.viewport().width() - header.sectionSize(0)
        want = max(self.table.sizeHintForColumn(3), header.sectionSizeHint(3))
        threshold = max(least, min(want, max(room // 5, self._needed(3, SHORT_THRESHOLD_CHARS))))
        em = self.table.fontMetrics().horizontalAdvance("M")
        name = max(least, min(14 * em, room - threshold - self._needed(2)))
        header.resizeSection(3, threshold)
        header.resizeSection(1, name)

    def _needed(self, column: int, longest: int | None = None) -> int:
        """The width a column's short wordings need with the cell's margins: the figures'
        numbers ("85.5 % …"), or the entries of at most ``longest`` characters."""
        metrics = self.table.fontMetrics()
        texts = [self.model.index(r, column).data() or "" for r in range(self.model.rowCount())]
        if longest is None:
            texts = [shorter_forms(t, column)[-1] for t in texts if " (" in t]
        else:
            texts = [t for t in texts if len(t) <= longest]
        return max((metrics.horizontalAdvance(t) for t in texts), default=0) + 2 * metrics.horizontalAdvance("m")

    def show_checkup(self, checkup) -> None:
        current = self.table.currentIndex().row()
        self.model.set_checkup(checkup)
        self._fit_columns()
        if checkup is None:
            self.headline.setText("Checkup: the plan cannot be scheduled yet")
            self._arrange_head()
            self.detail.setText(self.session.analysis_error or "")
            return
        self.headline.setText(f"{checkup.summary_text()}  \u00b7  {checkup.count('n/a')} not applicable")
        self._arrange_head()
        if 0 <= current < len(checkup):
            self.table.selectRow(current)
            self._describe(checkup.checks[current])

    def pick(self, row: int) -> None:
        """Select a check: describe it, and select its offenders in every view."""
        check = self.model.check_at(row)
        if check is None:
            return
        self._describe(check)
        self.session.select(check.offenders)

    def _describe(self, check) -> None:
        shown = ", ".join(check.offenders[:20]) + (f" and {len(check.offenders) - 20} more"
                                                   if len(check.offenders) > 20 else "")
        parts = [f"<b>{_escape(check.mark)} \u2014 {_escape(check.name)}</b>: {_escape(check.value_text)} "
                 f"(threshold {_escape(check.threshold)})"]
        if shown:
            parts.append(f"Offenders: {shown}")
        parts.append("Source: " + ("common practice (no published source)" if check.source == "common practice"
                                   else check.source))
        if check.changed:
            parts.append("This plan's own threshold: it differs from the default (the standard's figure "
                         "for the standard's checks).")
        if check.note:
            parts.append(check.note)
        self.detail.setText("<br>".join(_escape(p) if i else p for i, p in enumerate(parts)))

    def edit_thresholds(self) -> None:
        from workbench.ui.checkup.thresholds_dialog import ThresholdsDialog
        ThresholdsDialog(self.session, self).exec()


def _escape(text: str) -> str:
    return text.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")
