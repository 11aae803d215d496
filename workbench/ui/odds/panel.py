"""The Odds view's side panel: the question, the headline answers, the readout, the
inverse question, the PERT-versus-simulation table and the caution note."""

from __future__ import annotations

from PySide6.QtCore import Qt, Signal
from PySide6.QtWidgets import (QAbstractItemView, QButtonGroup, QComboBox, QGroupBox, QHBoxLayout,
                               QHeaderView, QLabel, QLineEdit, QPushButton, QTableWidget,
                               QTableWidgetItem, QVBoxLayout, QWidget)

from workbench.figures.odds import CAUTION, MODES, PRESETS

BOX_MARGINS = (6, 6, 6, 6)
MODE_TEXT = {"by": "Finish by the date", "after": "Finish after the date", "between": "Finish between two dates"}


def _label(text: str = "", size: float | None = None, bold: bool = False) -> QLabel:
    label = QLabel(text)
    label.setWordWrap(True)
    label.setTextInteractionFlags(Qt.TextSelectableByMouse)
    if size or bold:
        font = label.font()
        if size:
            font.setPointSizeF(size)
        font.setBold(bold)
        label.setFont(font)
    return label


class OddsPanel(QWidget):
    """Widgets only; ``OddsView`` fills them. Signals: ``mode_changed(str)``,
    ``confidence_requested(str)`` (a preset like "90" or typed text)."""

    mode_changed = Signal(str)
    confidence_requested = Signal(str)

    def __init__(self, parent=None):
        super().__init__(parent)
        self.headline = _label(size=12, bold=True)
        self.headline.setTextFormat(Qt.RichText)
        self.mode = QComboBox()
        for key in MODES:
            self.mode.addItem(MODE_TEXT[key], key)
        self.mode.setSizeAdjustPolicy(QComboBox.SizeAdjustPolicy.AdjustToMinimumContentsLengthWithIcon)
        self.mode.setMinimumContentsLength(12)
        self.mode.currentIndexChanged.connect(lambda _: self.mode_changed.emit(self.mode.currentData()))
        self.readout = _label(size=10)
        self.readout.setTextFormat(Qt.RichText)
        self.sim_readout = _label(size=10)
        self.inverse = _label(size=10)
        self.inverse.setTextFormat(Qt.RichText)
        self.error = _label()
        self.error.setStyleSheet("color: #8A3B00;")
        self.table = self._make_table()
        self.merge_note = _label()
        self.caution = _label(CAUTION)
        self.caution.setStyleSheet("color: #555555; font-style: italic;")
        self._layout()

    def _make_table(self) -> QTableWidget:
        table = QTableWidget(0, 3)
        table.setHorizontalHeaderLabels(["", "PERT", "Simulation"])
        table.verticalHeader().setVisible(False)
        table.setEditTriggers(QAbstractItemView.NoEditTriggers)
        table.setSelectionMode(QAbstractItemView.NoSelection)
        header = table.horizontalHeader()
        header.setSectionResizeMode(0, QHeaderView.ResizeToContents)
        for column in (1, 2):           # the two answers share the width and wrap: never cut
            header.setSectionResizeMode(column, QHeaderView.Stretch)
        table.setWordWrap(True)
        table.setHorizontalScrollBarPolicy(Qt.ScrollBarAlwaysOff)
        table.setSizeAdjustPolicy(QAbstractItemView.SizeAdjustPolicy.AdjustIgnored)
        table.setMinimumWidth(120)
        return table

    def resizeEvent(self, event):  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        if self.table.rowCount():
            self._fit_rows()

    def _fit_rows(self) -> None:
        self.table.resizeRowsToContents()
        height = sum(self.table.rowHeight(r) for r in range(self.table.rowCount()))
        self.table.setFixedHeight(self.table.horizontalHeader().height() + height + 6)

    def _question_box(self) -> QGroupBox:
        box = QGroupBox("Question")
        lay = QVBoxLayout(box)
        lay.setContentsMargins(*BOX_MARGINS)
        hint = _label("Drag the purple date lines on the chart.")
        hint.setStyleSheet("color: #555555;")
        lay.addWidget(hint)
        lay.addWidget(self.mode)
        lay.addWidget(self.readout)
        lay.addWidget(self.sim_readout)
        return box

    def _inverse_box(self) -> QGroupBox:
        box = QGroupBox("Date to promise")
        lay = QVBoxLayout(box)
        lay.setContentsMargins(*BOX_MARGINS)
        row = QHBoxLayout()
        self.presets = QButtonGroup(self)
        for p in PRESETS:
            button = QPushButton(f"{round(100 * p)} %")
            button.setCheckable(True)
            button.clicked.connect(lambda _=False, v=p: self.confidence_requested.emit(str(round(100 * v))))
            self.presets.addButton(button)
            row.addWidget(button)
        self.typed = QLineEdit()
        self.typed.setPlaceholderText("other, e.g. 95 %")
        self.typed.returnPressed.connect(lambda: self.confidence_requested.emit(self.typed.text()))
        lay.addLayout(row)
        lay.addWidget(self.typed)        # under the presets: the panel may be narrow (a dock)
        lay.addWidget(self.inverse)
        return box

    def _layout(self) -> None:
        lay = QVBoxLayout(self)
        lay.setContentsMargins(4, 4, 4, 4)       # narrow margins: the panel may share a small dock
        lay.addWidget(self.headline)
        lay.addWidget(self.caution)               # beside the chances, in sight without scrolling
        self.crews_box = QGroupBox("With the crews")    # shown when the plan has resources
        self.crews_slot = QVBoxLayout(self.crews_box)
        self.crews_box.hide()
        lay.addWidget(self.crews_box)
        lay.addWidget(self.error)
        lay.addWidget(self._question_box())
        lay.addWidget(self._inverse_box())
        self.controls_slot = QVBoxLayout()
        lay.addLayout(self.controls_slot)
        self.compare_box = QGroupBox("PERT and simulation")
        inner = QVBoxLayout(self.compare_box)
        inner.addWidget(self.table)
        inner.addWidget(self.merge_note)
        lay.addWidget(self.compare_box)
        lay.addStretch(1)

    def set_table(self, cells, unit: str = "") -> None:
        """Fill the comparison; only texts change when the shape stays the same (drags)."""
        header = ""
        if self.table.horizontalHeaderItem(0) is None or self.table.horizontalHeaderItem(0).text() != header:
            self.table.setHorizontalHeaderLabels([header, "PERT", "Simulation"])
        if self.table.rowCount() != len(cells):
            self._reshape(len(cells))
        for r, row in enumerate(cells):
            for c, text in enumerate(row):
                item = self.table.item(r, c)
                if item.text() != text:
                    item.setText(text)

    def _reshape(self, rows: int) -> None:
        self.table.setRowCount(rows)
        for r in range(rows):
            for c in range(3):
                item = QTableWidgetItem("")
                if c == 0:
                    font = item.font()
                    font.setBold(True)
                    item.setFont(font)
                self.table.setItem(r, c, item)
        self._fit_rows()

    def mark_preset(self, probability: float) -> None:
        for button in self.presets.buttons():
            button.setChecked(button.text() == f"{round(100 * probability)} %")
