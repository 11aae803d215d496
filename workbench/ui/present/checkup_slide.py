"""The Checkup slide of Present mode: every check with a large mark that reads without
colour (a word and a symbol; failures also bold on a tint), the count that passes, and the
caution that odds rest on judgement."""

from __future__ import annotations

from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QColor, QFont, QFontMetricsF, QPainter, QPen
from PySide6.QtWidgets import QWidget

from workbench.figures import style
from workbench.ui.checkup.keeper import checkup_keeper
from workbench.ui.present.summary_slide import draw_wrapped

FAIL_TINT = "#FBE3D6"
CAUTION = ("Estimates are judgement; PERT assumes one path and independent durations. "
           "The decision rests with the organisation's own approval rules.")
STANDARD = "DCMA 14-point schedule assessment (DCMA-EA PAM 200.1, October 2012) and our own checks"


class PresentCheckupSlide(QWidget):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.keeper = checkup_keeper(session)
        self.keeper.updated.connect(self._refresh)

    def _refresh(self, _checkup=None) -> None:
        self.update()

    def paintEvent(self, event):  # noqa: N802 (Qt override)
        p = QPainter(self)
        p.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        p.fillRect(self.rect(), QColor(style.BACKGROUND))
        unit = max(1.0, self.height() / 768.0)
        checkup = self.keeper.checkup
        margin = 40 * unit
        if checkup is None:
            self._text(p, QRectF(self.rect()), "The plan cannot be scheduled yet.", 30 * unit)
            p.end()
            return
        y = 16 * unit
        y += self._text(p, QRectF(margin, y, self.width() - 2 * margin, 60 * unit),
                        f"{checkup.summary_text()}  ({checkup.count('n/a')} not applicable)", 36 * unit, True)
        y += self._text(p, QRectF(margin, y, self.width() - 2 * margin, 30 * unit), STANDARD, 15 * unit,
                        colour=style.MUTED_TEXT) + 8 * unit
        bottom = self.height() - 44 * unit
        self._rows(p, checkup, QRectF(margin, y, self.width() - 2 * margin, bottom - y), unit)
        self._text(p, QRectF(margin, bottom + 6 * unit, self.width() - 2 * margin, 40 * unit), CAUTION,
                   14 * unit, colour=style.MUTED_TEXT)
        p.end()

    def _rows(self, p: QPainter, checkup, box: QRectF, unit: float) -> None:
        """The checks in two columns: the standard's on the left, ours below them or right."""
        checks = list(checkup)
        half = (len(checks) + 1) // 2
        width = (box.width() - 20 * unit) / 2
        row_h = min(box.height() / max(half, 1), 52 * unit)
        for k, check in enumerate(checks):
            col, row = divmod(k, half)
            cell = QRectF(box.left() + col * (width + 20 * unit), box.top() + row * row_h, width, row_h - 4 * unit)
            self._row(p, check, cell, unit)

    def _row(self, p: QPainter, check, cell: QRectF, unit: float) -> None:
        failed = check.status == "fail"
        if failed:
            p.fillRect(cell, QColor(FAIL_TINT))
            p.fillRect(QRectF(cell.left(), cell.top(), 6 * unit, cell.height()), QColor(style.TEXT))
        px = min(24 * unit, cell.height() * 0.55)
        colour = style.MUTED_TEXT if check.status == "n/a" else style.TEXT
        mark = QRectF(cell.left() + 12 * unit, cell.top(), 96 * unit, cell.height())
        self._line(p, mark, check.mark, px, True, colour)
        right = QRectF(cell.right() - 120 * unit, cell.top(), 112 * unit, cell.height())
        self._line(p, right, check.figure, px, failed, colour, Qt.AlignmentFlag.AlignRight)
        text = QRectF(mark.right() + 4 * unit, cell.top(), right.left() - mark.right() - 8 * unit, cell.height())
        name, size = self.fitted_name(check.name, text.width(), px, failed)
        self._line(p, text, name, size, failed, colour)

    @staticmethod
    def fitted_name(name: str, width: float, px: float, bold: bool) -> tuple[str, float]:
        """The check's name as the slide shows it: whole, else a little smaller (down to 80 %),
        else its published abbreviation ("CPLI"), else elided by the painter."""
        whole, _, short = name.partition(" (")
        short = short.rstrip(")")
        for text, size in ((whole, px), (whole, px * 0.9), (whole, px * 0.8), (short, px)):
            font = QFont()
            font.setPixelSize(max(8, int(size)))
            font.setBold(bold)
            if text and QFontMetricsF(font).horizontalAdvance(text) <= width:
                return text, size
        return whole, px

    @staticmethod
    def _line(p: QPainter, box: QRectF, text: str, px: float, bold: bool, colour: str,
              align=Qt.AlignmentFlag.AlignLeft) -> None:
        font = QFont()
        font.setPixelSize(max(8, int(px)))
        font.setBold(bold)
        p.setFont(font)
        p.setPen(QPen(QColor(colour)))
        shown = p.fontMetrics().elidedText(text, Qt.TextElideMode.ElideRight, int(box.width()))
        p.drawText(box, align | Qt.AlignmentFlag.AlignVCenter, shown)

    _text = staticmethod(draw_wrapped)
