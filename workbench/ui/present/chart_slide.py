"""A Present-mode slide that draws one of the approval pack's charts, scaled to fill the
screen: the same figures geometry as the window and the printed pack, at projector size."""

from __future__ import annotations

from PySide6.QtCore import QPointF, Qt
from PySide6.QtGui import QColor, QFont, QPainter
from PySide6.QtWidgets import QWidget

from workbench.reports.context import PackContext

from workbench.ui.present.canvas import PresentCanvas

# Logical page (points) the painters lay out in. Small on purpose: scaled up to a
# 1024×768 projector it gives ~2× type and lines — readable from the back of a room.
LOGICAL_W, LOGICAL_H = 500.0, 330.0
MARGIN_PX = 16


def session_context(session) -> PackContext | None:
    """What the pack painters read, taken from the session (None while unschedulable)."""
    if session.analysis is None:
        return None
    return PackContext(session.plan, session.analysis, session.simulation, None, "a4")


class PresentChartSlide(QWidget):
    """Calls ``paint(canvas, ctx, w, h)`` with a y-up canvas of LOGICAL_W × LOGICAL_H points."""

    def __init__(self, session, paint, parent=None, logical=(LOGICAL_W, LOGICAL_H)):
        super().__init__(parent)
        self.session, self._paint, self.logical = session, paint, logical
        self.setAutoFillBackground(True)
        pal = self.palette()
        pal.setColor(self.backgroundRole(), QColor("white"))
        self.setPalette(pal)
        session.schedule_changed.connect(self.update)
        session.simulation_changed.connect(self.update)

    def scale_and_origin(self) -> tuple[float, float, float]:
        """Pixels per logical point and the widget position of the logical origin (bottom left)."""
        lw, lh = self.logical
        k = min((self.width() - 2 * MARGIN_PX) / lw, (self.height() - 2 * MARGIN_PX) / lh)
        k = max(k, 0.1)
        ox = (self.width() - lw * k) / 2
        oy = (self.height() + lh * k) / 2
        return k, ox, oy

    def to_logical(self, pos: QPointF) -> tuple[float, float]:
        k, ox, oy = self.scale_and_origin()
        return (pos.x() - ox) / k, (oy - pos.y()) / k

    def paintEvent(self, event):  # noqa: N802 (Qt override)
        painter = QPainter(self)
        painter.fillRect(self.rect(), QColor("white"))
        ctx = session_context(self.session)
        if ctx is None:
            self._message(painter)
            return
        k, ox, oy = self.scale_and_origin()
        painter.translate(ox, oy)
        painter.scale(k, -k)
        canvas = PresentCanvas(painter)
        self._paint(canvas, ctx, *self.logical)
        painter.end()

    def _message(self, painter: QPainter) -> None:
        font = QFont()
        font.setPixelSize(max(18, self.height() // 24))
        painter.setFont(font)
        painter.setPen(QColor("black"))
        text = f"The plan cannot be scheduled yet:\n{self.session.analysis_error or 'no activities'}"
        painter.drawText(self.rect().adjusted(40, 40, -40, -40), Qt.AlignmentFlag.AlignCenter | Qt.TextFlag.TextWordWrap, text)
        painter.end()
