"""The Timeline's one chart item: every bar, slack line and mark in a few batched calls.

Draws a :class:`~workbench.figures.timeline.TimelineGeometry` in device pixels (so line
widths and mark sizes stay crisp at any zoom), only the rows on screen. Once the view has
settled the drawing is kept as an image (on screen) and blitted until the geometry, the
options or the view change.
"""

from __future__ import annotations

import time

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QImage, QPainter, QPaintEngine, QPixmap
from PySide6.QtWidgets import QWidget

from workbench.core.calendar import MAX_DAYS
from workbench.figures import style
from workbench.figures.timeline import TimelineGeometry
from workbench.ui.timeline import paint

SHADE_DAY_PX = 7.0      # shade non-working days once a working day is this wide


class _Pixels:
    """Maps data (offset, row) to device pixels for one paint."""

    def __init__(self, transform, scale: float, xs=None, raster: bool = True):
        self.t = transform
        self.raster = raster                    # a raster paint engine (screen, images), not paper or SVG
        self.scale = scale                      # device pixels per screen pixel (print/export)
        self.row_px = abs(transform.m22())      # pixels per row
        self.unit_px = abs(transform.m11())     # pixels per plan unit
        # x = a·offset + shear·row + b and y = shear·offset + a·row + b, asked of Qt once
        self.x_affine = (transform.m11(), transform.m21(), transform.m31())
        self.y_affine = (transform.m12(), transform.m22(), transform.m32())
        ends = sorted(float(v) for v in self.x(xs)) if xs is not None else (-1e6, 1e6)
        self.clip = (ends[0] - 16.0, ends[1] + 16.0)   # marks beyond these pixels are culled

    def x(self, x, row=0.0):
        a, shear, b = self.x_affine
        if shear == 0.0:                 # no rotation or shear: the usual case, cheaper
            return a * np.asarray(x, float) + b
        return a * np.asarray(x, float) + shear * np.asarray(row, float) + b

    def y(self, row, x=0.0):
        shear, a, b = self.y_affine
        if shear == 0.0:
            return a * np.asarray(row, float) + b
        return shear * np.asarray(x, float) + a * np.asarray(row, float) + b


class TimelineItem(pg.GraphicsObject):
    """One GraphicsObject for the whole chart (thousands of bars in one batched paint)."""

    def __init__(self, weights: style.Weights = style.SCREEN):
        super().__init__()
        self._geo: TimelineGeometry | None = None
        self._weights = weights
        self._selected_rows = np.zeros(0, dtype=np.int64)
        self._preview: tuple[int, float, float] | None = None   # row, x0, x1 of a dragged bar
        self._nonworking = None     # callable(lo, hi) -> offsets where a non-working stretch lies
        self.first_row = 0          # rows above it are not drawn (a Present page of later rows)
        self._cache: QImage | None = None    # the settled drawing, for repaints on screen
        self._cache_key = None
        self._cache_at = QPointF()
        self.painted_rows = 0       # rows drawn in the last drawing (for tests and benchmarks)
        self.paint_ms = 0.0         # time of the last paint (for benchmarks)
        self.on_click = self.on_drag = self.on_hover = self.on_menu = None   # set by the view

    # --- gestures (passed to the view, which knows the session) -----------------
    def mouseClickEvent(self, ev) -> None:
        if ev.button() == Qt.MouseButton.LeftButton and self.on_click is not None:
            ev.accept()
            self.on_click(ev.pos(), ev.modifiers())
        elif ev.button() == Qt.MouseButton.RightButton and self.on_menu is not None:
            ev.accept()
            self.on_menu(ev.pos(), ev.screenPos().toPoint())

    def mouseDragEvent(self, ev) -> None:
        if ev.button() != Qt.MouseButton.LeftButton or self.on_drag is None:
            ev.ignore()
            return
        if ev.isStart() and not self.on_drag("start", ev.buttonDownPos()):
            ev.ignore()
            return
        if self.on_drag("finish" if ev.isFinish() else "move", ev.pos()):
            ev.accept()
        else:
            ev.ignore()

    def hoverEvent(self, ev) -> None:
        if self.on_hover is None:
            return
        if ev.isExit():
            self.on_hover(None, None)
        else:
            self.on_hover(ev.pos(), ev.screenPos().toPoint())

    # --- options (each clears the cached picture) --------------------------
    def _changed(self, geometry: bool = False) -> None:
        self._cache = self._cache_key = None
        self.prepareGeometryChange()
        if geometry:
            self.informViewBoundsChanged()
        self.update()

    def drop_cache(self) -> None:
        """Redraw from scratch at the next paint."""
        self._changed()

    def set_geometry(self, geo: TimelineGeometry | None) -> None:
        self._geo = geo
        self._preview = None
        self._changed(geometry=True)

    def set_selection(self, rows) -> None:
        rows = np.asarray(sorted(rows), dtype=np.int64)
        if not np.array_equal(rows, self._selected_rows):
            self._selected_rows = rows
            self._changed()

    def selected_rows(self) -> list[int]:
        return self._selected_rows.tolist()

    def set_preview(self, preview: tuple[int, float, float] | None) -> None:
        self._preview = preview
        self._changed()

    def set_weights(self, weights: style.Weights) -> None:
        self._weights = weights
        self._changed()

    def set_nonworking(self, finder) -> None:
        self._nonworking = finder
        self._changed()

    def geometry_data(self) -> TimelineGeometry | None:
        return self._geo

    # --- bounds --------------------------------------------------------------
    def dataBounds(self, ax, frac=1.0, orthoRange=None):
        if self._geo is None:
            return (None, None)
        if ax == 0:
            return self._geo.x_range
        return (-0.5, max(self._geo.n_rows, 1) - 0.5)

    def boundingRect(self) -> QRectF:
        if self._geo is None:
            return QRectF()
        lo, hi = self._geo.x_range
        pad = 0.02 * (hi - lo) + 1.0
        return QRectF(lo - pad, -1.0, hi - lo + 2 * pad, self._geo.n_rows + 1.0)

    # --- painting --------------------------------------------------------------
    def paint(self, p: QPainter, *args) -> None:
        if self._geo is None:
            return
        started = time.perf_counter()
        self._paint(p)
        self.paint_ms = (time.perf_counter() - started) * 1000.0

    def _paint(self, p: QPainter) -> None:
        t = p.combinedTransform()      # world and window/viewport: exact device pixels
        view = self.viewRect()
        rows = (-1.0, float(self._geo.n_rows)) if view is None else (view.top() - 1, view.bottom() + 1)
        if self.first_row > 0:      # the band above a page's first row holds only the line labels
            rows = (max(rows[0], self.first_row - 0.5), rows[1])
        xs = (self._geo.x_range if view is None else (view.left(), view.right()))
        p.save()
        p.resetTransform()
        key = (t.m11(), t.m12(), t.m21(), t.m22(), t.m31(), t.m32(), rows, xs)
        if view is None or not isinstance(p.device(), (QImage, QPixmap, QWidget)):
            self._draw(p, t, rows, xs)         # paper, PDF, SVG, recordings: vectors, no cache
        elif self._cache is not None and key == self._cache_key:
            p.drawImage(self._cache_at, self._cache)
        elif key == self._cache_key:
            # Painted again with nothing changed: worth keeping an image for the repaints to come.
            self._cache, self._cache_at = self._record(p, t, rows, xs, t.mapRect(view))
            p.drawImage(self._cache_at, self._cache)
        else:
            # Something changed (data, zoom, pan): draw straight away, keep an image only
            # once the view has settled.
            self._cache, self._cache_key = None, key
            self._draw(p, t, rows, xs)
        p.restore()

    def _visible_rows(self, rows) -> int:
        return int(max(0, min(rows[1], self._geo.n_rows) - max(rows[0], 0)))

    def _scale(self, t) -> float:
        screen = self.deviceTransform_()
        if screen is None or screen.m22() == 0:
            return 1.0
        return max(1.0, abs(t.m22() / screen.m22()))

    def _record(self, p: QPainter, t, rows, xs, area: QRectF) -> tuple[QImage, QPointF]:
        """Draw into an image covering ``area`` (device pixels) at the device's pixel ratio."""
        area = area.toAlignedRect()
        ratio = p.device().devicePixelRatioF()
        image = QImage(int(area.width() * ratio) + 1, int(area.height() * ratio) + 1,
                       QImage.Format.Format_ARGB32_Premultiplied)
        image.setDevicePixelRatio(ratio)
        image.fill(Qt.GlobalColor.transparent)
        painter = QPainter(image)
        painter.translate(-area.left(), -area.top())
        self._draw(painter, t, rows, xs)
        painter.end()
        return image, QPointF(area.topLeft())

    def _draw(self, p: QPainter, t, rows, xs) -> None:
        """Draw the rows on screen in device pixels (p has an identity transform)."""
        px = _Pixels(t, self._scale(t), xs, p.paintEngine().type() == QPaintEngine.Type.Raster)
        geo = self._geo
        self.painted_rows = self._visible_rows(rows)
        self._draw_background(p, px, rows, xs)
        marks = {k: m.within(*rows) for k, m in geo.marks.items()}
        paint.draw_all(p, px, marks, geo, self._weights, self._preview, rows)

    def _draw_background(self, p: QPainter, px: _Pixels, rows, xs) -> None:
        if self._nonworking is not None and px.unit_px >= SHADE_DAY_PX:
            self._shade_nonworking(p, px, rows, xs)
        if self._selected_rows.size:
            sel = self._selected_rows[(self._selected_rows >= rows[0]) & (self._selected_rows <= rows[1])]
            x0, x1 = px.x(xs[0]), px.x(xs[1])
            h = px.row_px
            paint.fill(p, style.SELECTION)
            paint.rects(p, x0, px.y(sel) - h / 2, x1 - x0, h)

    def _shade_nonworking(self, p: QPainter, px: _Pixels, rows, xs) -> None:
        offsets = np.asarray(self._nonworking(xs[0], xs[1]), float)
        if not offsets.size:
            return
        width = max(4.0, 0.18 * px.unit_px)
        top, bottom = px.y(max(rows[0], -0.5)), px.y(min(rows[1], self._geo.n_rows - 0.5))
        y0, h = float(min(top, bottom)), float(abs(bottom - top))
        paint.fill(p, style.NONWORKING)
        paint.rects(p, px.x(offsets) - width / 2, y0, width, h)


def nonworking_finder(calendar):
    """A function (lo, hi) → offsets (working time) at which a non-working stretch lies."""
    def find(lo: float, hi: float) -> np.ndarray:
        per = calendar.per_unit
        hi = min(hi, MAX_DAYS / per - 1)        # a view may reach beyond any calendar date
        days = np.arange(max(0, int(np.floor(lo * per))), int(np.ceil(hi * per)) + 1)
        if days.size > 4000:
            return np.zeros(0)
        dates = calendar.start_dates(days / per, strict=False).astype("datetime64[D]")
        gap = np.flatnonzero(np.diff(dates).astype(int) > 1) + 1
        return days[gap] / per
    return find
