"""One graphics item that paints the whole Network (batched, culled to the view)."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import QRectF, Qt, Signal

from .network_paint import NetworkPainter

MARGIN = 60.0


class NetworkItem(pg.GraphicsObject):
    """All nodes, links and bands of a layout in one item; emits ``node_clicked(row,
    adding)`` (row −1 for empty space; adding with Ctrl or Shift) and ``hovered(row)``."""

    node_clicked = Signal(int, bool)      # row (−1: empty space), add to the selection
    hovered = Signal(int)

    def __init__(self):
        super().__init__()
        self.painter = NetworkPainter()
        self._bounds = QRectF()

    # --- content ---------------------------------------------------------
    def set_content(self, layout, texts) -> None:
        self.prepareGeometryChange()
        self.painter.set_content(layout, texts)
        left = min([b.x for b in layout.bands], default=0.0)
        top = MARGIN + (60.0 if self.painter.column_labels else 0.0)
        self._bounds = QRectF(left - MARGIN, -top, layout.width - 2 * left + 2 * MARGIN,
                              layout.height + top + MARGIN)
        self.update()

    def set_selected(self, rows) -> None:
        self.painter.selected = set(rows)
        self.update()

    def set_bands_visible(self, on: bool) -> None:
        self.painter.bands_visible = on
        self.update()

    # --- QGraphicsItem / pyqtgraph ----------------------------------------
    def boundingRect(self) -> QRectF:
        return QRectF(self._bounds)

    def dataBounds(self, axis, frac=1.0, orthoRange=None):
        b = self._bounds
        return (b.left(), b.right()) if axis == 0 else (b.top(), b.bottom())

    def paint(self, p, option, widget=None) -> None:
        visible = self.viewRect() or self._bounds
        scale = abs(p.transform().m11()) or 1.0
        self.painter.paint(p, visible, scale)

    def hoverEvent(self, ev) -> None:
        row = -1 if ev.isExit() else self._row_at(ev.pos())
        if row != self.painter.hover:
            self.painter.set_hover(row)
            self.hovered.emit(row)
            self.update()

    def mouseClickEvent(self, ev) -> None:
        if ev.button() != Qt.LeftButton:
            return
        ev.accept()
        adding = bool(ev.modifiers() & (Qt.ControlModifier | Qt.ShiftModifier))
        self.node_clicked.emit(self._row_at(ev.pos()), adding)

    def _row_at(self, pos) -> int:
        layout = self.painter.layout
        return -1 if layout is None else layout.node_at(pos.x(), pos.y())
