"""The note beside a dragged bar end: new length and finish date, read at a glance.

A boxed label (white card, dark frame, bold type a size above the row labels) placed just
above the dragged end, turned to the left of it near the right edge of the view so it
never leaves the chart. Hidden when the drag ends or is cancelled.
"""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtGui import QFont

from workbench.figures import style

EDGE_FRACTION = 0.7     # past this share of the view's width the note sits left of the end


class DragReadout:
    """One label item on the Timeline's plot; ``show(x, row, lines)`` / ``hide()``."""

    def __init__(self, plot_item):
        self.item = pg.TextItem("", color=style.TEXT, anchor=(0, 1),
                                fill=pg.mkBrush(255, 255, 255, 235), border=pg.mkPen(style.TEXT, width=1.5))
        self.item.setZValue(50)
        self.item.setVisible(False)
        plot_item.addItem(self.item, ignoreBounds=True)
        self.view_box = plot_item.getViewBox()

    def set_font_px(self, px: float) -> None:
        font = QFont()
        font.setPixelSize(max(12, round(px)))
        font.setBold(True)
        self.item.setFont(font)

    def show(self, x: float, row: float, lines: list[str]) -> None:
        (x0, x1), _ = self.view_box.viewRange()
        left = x > x0 + EDGE_FRACTION * (x1 - x0)
        self.item.setAnchor((1.0, 1.0) if left else (0.0, 1.0))
        self.item.setText("\n".join(lines))
        self.item.setPos(x, row - 0.45)
        self.item.setVisible(True)

    def hide(self) -> None:
        self.item.setVisible(False)

    def text(self) -> str:
        """What the note says now ('' when hidden)."""
        return self.item.textItem.toPlainText() if self.item.isVisible() else ""
