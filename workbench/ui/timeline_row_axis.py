"""The Timeline's label column: activity ids and names, left-aligned and elided.

Replaces the numeric left axis: one label per visible row (thinned out when the rows
are shorter than the text), group rows marked with an open/closed triangle and their
members indented.
"""

from __future__ import annotations

import heapq
import math

import pyqtgraph as pg
import numpy as np
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QFont, QFontMetricsF, QPen

from workbench.ui.timeline_axis_cache import RASTER, TimelineAxisCache
from workbench.ui.timeline_label_atlas import TimelineLabelAtlas
from workbench.ui.timeline_paint import lines

INDENT = 14.0
PADDING = 6.0
LABEL_CACHE = 4000     # cut labels kept (a few screens' worth)


class TimelineRowAxis(TimelineAxisCache, pg.AxisItem):
    def __init__(self, width: float = 300.0, **kwargs):
        super().__init__("left", **kwargs)
        self._geo = None
        self._cut: dict[tuple, str] = {}          # (text, width, bold) → text cut to the width
        self._atlas = TimelineLabelAtlas()
        self.setWidth(int(width))
        self.setStyle(tickLength=0, autoExpandTextSpace=False)

    def set_geometry(self, geo) -> None:
        self._geo = geo
        self.picture = None
        self.update()

    def set_font(self, font: QFont) -> None:
        self.setStyle(tickFont=font)
        self._cut.clear()
        self.picture = None
        self.update()

    def label_text(self, row: int) -> str:
        """The text shown for a row (before eliding)."""
        geo = self._geo
        if geo.kinds[row] == "group":
            return ("\u25b8 " if geo.keys[row] in geo.collapsed else "\u25be ") + geo.labels[row]
        return geo.labels[row]

    def _rows_to_local(self, bounds: QRectF, rows: np.ndarray) -> np.ndarray:
        r0, r1 = self.range          # reversed by pyqtgraph when the view's y is inverted
        frac = (rows - r0) / (r1 - r0) if r1 != r0 else np.zeros(len(rows))
        return bounds.bottom() - frac * bounds.height()

    def visible_rows(self, bounds: QRectF, font_px: float) -> range:
        lo, hi = sorted(self.range)
        row_px = bounds.height() / max(hi - lo, 1e-9)
        step = max(1, math.ceil(font_px * 1.05 / max(row_px, 1e-9)))
        first = max(0, math.ceil(lo - 0.5))
        first = first + (-first) % step
        return range(first, min(self._geo.n_rows, math.floor(hi + 0.5) + 1), step)

    def generateDrawSpecs(self, p):
        """Axis line, tick heights and labels ``(x, top, width, height, text, laid out, bold)``."""
        if self._geo is None:
            return super().generateDrawSpecs(p)
        font = self.style.get("tickFont") or QFont()
        h = QFontMetricsF(font).height()
        bounds = self.mapRectFromParent(self.geometry())
        axis = (QPen(self.pen()), QPointF(bounds.right(), bounds.top()), QPointF(bounds.right(), bounds.bottom()))
        shown = self.visible_rows(bounds, h)
        rows = np.arange(shown.start, shown.stop, shown.step)
        ys = self._rows_to_local(bounds, rows)
        keep = (ys >= bounds.top() - h / 2) & (ys <= bounds.bottom() + h / 2)
        rows, ys = rows[keep], ys[keep]
        texts, line = [], math.ceil(h)
        for row, y in zip(rows.tolist(), ys.tolist()):
            indent = INDENT * int(self._geo.depth[row])
            width = int(bounds.width() - 2 * PADDING - indent)
            bold = self._geo.kinds[row] == "group"
            text = self._label(self.label_text(row), width, bold)
            texts.append((round(bounds.left() + PADDING + indent), round(y - line / 2), width, line, text, bold))
        return axis, (bounds.right(), ys), texts

    def shown_labels(self) -> list[str]:
        """The label texts as they are drawn now (cut to the column), top to bottom."""
        return [] if self._geo is None else [spec[4] for spec in self.generateDrawSpecs(None)[2]]

    def _label(self, text: str, width: int, bold: bool) -> str:
        """The label cut to ``width`` (kept across repaints and zooms)."""
        key = (text, width, bold)
        cut = self._cut.get(key)
        if cut is None:
            if len(self._cut) >= LABEL_CACHE:
                self._cut.clear()
            font = QFont(self.style.get("tickFont") or QFont())
            font.setBold(bold)
            cut = self._cut[key] = QFontMetricsF(font).elidedText(text, Qt.TextElideMode.ElideRight, width)
        return cut

    def _stamp(self, p, font: QFont, specs) -> bool:
        """Labels copied from the atlas in one call (each drawn there once)."""
        if not specs:
            return True
        ratio = p.device().devicePixelRatioF()
        width = self.boundingRect().width()
        slots = self._atlas.slots_for([(t, w, b) for _, _, w, _, t, b in specs], font,
                                      self.textPen().color(), width, specs[0][3], ratio)
        x, top, w = (np.array([s[k] for s in specs], float) for k in (0, 1, 2))
        return self._atlas.stamp(p, x, top, w, slots)

    def preferred_width(self, font: QFont, limit: float) -> int:
        """Width that fits the longest labels (the 40 longest by length), at most ``limit``."""
        if self._geo is None or not self._geo.labels:
            return int(min(limit, 120))
        bold = QFont(font)
        bold.setBold(True)
        plain, heavy = QFontMetricsF(font), QFontMetricsF(bold)     # group rows are bold
        longest = heapq.nlargest(40, range(self._geo.n_rows), key=lambda r: len(self._geo.labels[r]))
        need = max((heavy if self._geo.kinds[r] == "group" else plain).horizontalAdvance(self.label_text(r))
                   + INDENT * int(self._geo.depth[r]) for r in longest)
        return int(min(limit, need + 2 * PADDING + 2))

    def cache_content(self):
        return None if self._geo is None else id(self._geo)

    def drawPicture(self, p, axisSpec, tickSpecs, textSpecs):
        """Like the base class, with group rows in bold; on screen the labels are copied
        from an atlas where each is drawn once."""
        if self._geo is None:
            return super().drawPicture(p, axisSpec, tickSpecs, textSpecs)
        pen, p1, p2 = axisSpec
        p.setPen(pen)
        p.drawLine(p1, p2)
        right, ys = tickSpecs
        lines(p, right - 4, ys, right, ys)
        p.setPen(self.textPen())
        p.setClipRect(self.boundingRect().toAlignedRect())
        font = QFont(self.style.get("tickFont") or QFont())
        if isinstance(p.device(), RASTER) and self._stamp(p, font, textSpecs):
            return
        bold = QFont(font)                  # paper, PDF and SVG: plain vector text
        bold.setBold(True)
        flags = int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignVCenter)
        for x, top, width, h, text, is_bold in textSpecs:
            p.setFont(bold if is_bold else font)
            p.drawText(QRectF(x, top, width, h), flags, text)
