"""A strip above the table that says why an edit was not applied, until dismissed or
until the next edit goes through. Not colour alone: it starts with the word 'Not applied'."""

from __future__ import annotations

import html

from PySide6.QtWidgets import QFrame, QHBoxLayout, QLabel, QToolButton


class NoticeBar(QFrame):
    def __init__(self, parent=None):
        super().__init__(parent)
        self.setObjectName("noticeBar")
        self.setAccessibleName("Edit problem")
        self.setFrameShape(QFrame.Shape.StyledPanel)
        self.setStyleSheet("#noticeBar { border: 2px solid #D55E00; border-radius: 3px; }")
        self.label = QLabel(self)
        self.label.setWordWrap(True)
        close = QToolButton(self)
        close.setText("✕")
        close.setAccessibleName("Dismiss")
        close.setToolTip("Dismiss")
        close.clicked.connect(self.hide)
        layout = QHBoxLayout(self)
        layout.setContentsMargins(8, 4, 4, 4)
        layout.addWidget(self.label, 1)
        layout.addWidget(close)
        self.message = ""
        self.hide()

    def show_problem(self, message: str) -> None:
        self.message = message
        self.label.setText(f"<b>Not applied:</b> {html.escape(message, quote=False)}")
        self.show()

    def text(self) -> str:
        return "" if self.isHidden() else f"Not applied: {self.message}"
