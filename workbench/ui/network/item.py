"""One graphics item that paints the whole Network (batched, culled to the view)."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import QPoint, QPointF, QRectF, Qt, QTimer, Signal
from PySide6.QtGui import QPainter, QPixmap

from workbench.ui.network.paint import TINY_PX, NetworkPainter

MARGIN = 60.0
CACHE_PIXELS = 4096   # far out, the drawing is cached as a picture up to this size
SETTLE_MS = 150       # redraw the picture sharp this long after zooming stops


class NetworkItem(pg.GraphicsObject):
    """All nodes, links and bands of a layout in one item; emits ``node_clicked(row,
    adding)`` (row −1 for empty space; adding with Ctrl or Shift) and ``hovered(row)``."""

    node_clicked = Signal(int, bool)      # row (−1: empty space), add to the selection
    hovered = Signal(int)
    node_menu = Signal(int, QPoint)       # right-click: row (−1: empty space), screen position

    def __init__(self):
        super().__init__()
        self.painter = NetworkPainter()
        self._bounds = QRectF()
        self._cache: QPixmap | None = None
        self._cache_scale = 0.0
        self._cache_version = -1
        self._settled = False
        self._settle_timer = QTimer(self, singleShot=True, interval=SETTLE_MS)
        self._settle_timer.timeout.connect(self._settle)

    # --- content ---------------------------------------------------------
    def set_content(self, layout, texts, analysis=None) -> None:
        self.prepareGeometryChange()
        self.painter.set_content(layout, texts, analysis)
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
        self.painter.version += 1
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
        dpr = widget.devicePixelRatioF() if widget is not None else 1.0
        if self.painter.node_px(scale) < TINY_PX and self._fits(scale * dpr):
            self._paint_cached(p, scale, dpr)
            self.painter.paint_overlay(p, visible, scale)
        else:
            self.painter.paint(p, visible, scale)

    # --- far-out picture cache ---------------------------------------------
    def _fits(self, px_per_unit: float) -> bool:
        return max(self._bounds.width(), self._bounds.height()) * px_per_unit <= CACHE_PIXELS

    def _paint_cached(self, p, scale: float, dpr: float) -> None:
        """Far out, the whole drawing is one picture: panning only copies it. While the
        zoom changes the picture is stretched; it is redrawn sharp once zooming pauses."""
        stale = self._cache is None or self._cache_version != self.painter.version
        rescaled = not stale and abs(self._cache_scale - scale * dpr) > 1e-9 * scale
        if stale or (rescaled and self._settled):
            self._render_cache(scale, dpr)
        elif rescaled:
            self._settle_timer.start()
        self._settled = False
        if abs(self._cache_scale - scale * dpr) > 1e-9 * scale:    # stretched while zooming
            p.drawPixmap(self._bounds, self._cache, QRectF(self._cache.rect()))
            return
        corner = p.transform().map(self._bounds.topLeft())       # same scale: a plain copy
        p.save()
        p.resetTransform()
        p.drawPixmap(QPointF(round(corner.x()), round(corner.y())), self._cache)
        p.restore()

    def _render_cache(self, scale: float, dpr: float) -> None:
        b = self._bounds
        pixmap = QPixmap(max(1, int(b.width() * scale * dpr) + 1), max(1, int(b.height() * scale * dpr) + 1))
        pixmap.fill(Qt.transparent)
        q = QPainter(pixmap)
        q.scale(scale * dpr, scale * dpr)
        q.translate(-b.left(), -b.top())
        self.painter.paint(q, b, scale, base_only=True)
        q.end()
        pixmap.setDevicePixelRatio(dpr)
        self._cache, self._cache_scale, self._cache_version = pixmap, scale * dpr, self.painter.version

    def _settle(self) -> None:
        self._settled = True
        self.update()

    def hoverEvent(self, ev) -> None:
        row = -1 if ev.isExit() else self._row_at(ev.pos())
        if row != self.painter.hover:
            self.painter.set_hover(row)
            self.hovered.emit(row)
            self.update()

    def mouseClickEvent(self, ev) -> None:
        if ev.button() == Qt.RightButton:
            ev.accept()
            self.node_menu.emit(self._row_at(ev.pos()), ev.screenPos().toPoint())
            return
        if ev.button() != Qt.LeftButton:
            return
        ev.accept()
        adding = bool(ev.modifiers() & (Qt.ControlModifier | Qt.ShiftModifier))
        self.node_clicked.emit(self._row_at(ev.pos()), adding)

    def _row_at(self, pos) -> int:
        layout = self.painter.layout
        return -1 if layout is None else layout.node_at(pos.x(), pos.y())
