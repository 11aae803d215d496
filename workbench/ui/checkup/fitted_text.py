"""Cells of the Checkup table said shorter when their column is narrow (a small dock):
a figure keeps its number and drops the words in brackets ("85.5 % (53 of 62 links …)"
→ "85.5 % …"), a check keeps its short name ("Critical path length index (CPLI)" →
"CPLI"); anything else is cut at the right with "…". The cell's tooltip has it whole."""

from __future__ import annotations

import re

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QApplication, QStyle, QStyledItemDelegate, QStyleOptionViewItem

ELLIPSIS = "\u2026"
_ABBREVIATION = re.compile(r"\(([A-Z]{2,6})\)\s*$")


def shorter_forms(text: str, column: int) -> list[str]:
    """The wordings of a cell to try, longest first (the caller cuts the last one)."""
    forms = [text]
    head = text.split(" (", 1)[0].strip()
    if column == 1:
        short = _ABBREVIATION.search(text)
        if short:
            forms.append(short.group(1))
    elif column == 2 and head and head != text:
        forms.append(f"{head} {ELLIPSIS}")
    return forms


def fitted(text: str, column: int, width: int, metrics) -> str:
    """The longest wording of ``text`` that fits ``width`` pixels, else the shortest cut
    at the right with an ellipsis."""
    forms = shorter_forms(text, column)
    for form in forms:
        if metrics.horizontalAdvance(form) <= width:
            return form
    return metrics.elidedText(forms[-1], Qt.TextElideMode.ElideRight, width)


class FittedTextDelegate(QStyledItemDelegate):
    """Draws a cell in the wording that fits its column (see module doc); its size hint
    stays that of the whole text, so a wide column still grows to it."""

    def fitted_option(self, option, index) -> QStyleOptionViewItem:
        """The cell's style option with its text in the wording that fits its text area."""
        opt = QStyleOptionViewItem(option)
        self.initStyleOption(opt, index)
        if opt.text:
            style = _style(opt)
            area = style.subElementRect(QStyle.SubElement.SE_ItemViewItemText, opt, opt.widget)
            margin = style.pixelMetric(QStyle.PixelMetric.PM_FocusFrameHMargin, None, opt.widget) + 1
            opt.text = fitted(opt.text, index.column(), area.width() - 2 * margin, opt.fontMetrics)
        return opt

    def paint(self, painter, option, index):
        opt = self.fitted_option(option, index)
        _style(opt).drawControl(QStyle.ControlElement.CE_ItemViewItem, opt, painter, opt.widget)


def _style(option):
    return option.widget.style() if option.widget is not None else QApplication.style()
