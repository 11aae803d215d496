"""Date axis for the Timeline: x is a plan-unit offset, labels are calendar dates.

Day, week, month, quarter or year labels as the zoom changes (``figures.ticks``). Ticks
and labels are placed with numpy and drawn in a few calls; each label is laid out once.
"""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QFont, QFontMetricsF, QPen, QStaticText, QTransform

from workbench.figures.ticks import date_ticks
from workbench.ui.timeline_axis_cache import RASTER, TimelineAxisCache
from workbench.ui.timeline_paint import lines

LABEL_CACHE = 500


class TimelineDateAxis(TimelineAxisCache, pg.AxisItem):
    def __init__(self, orientation: str = "bottom", **kwargs):
        super().__init__(orientation, **kwargs)
        self._calendar = None
        self._labels: dict[float, str] = {}
        self._laid_out: dict[tuple, QStaticText] = {}
        self.setStyle(tickLength=5, autoExpandTextSpace=True, hideOverlappingLabels=False)

    def set_calendar(self, calendar) -> None:
        self._calendar = calendar
        self.picture = None
        self.update()

    def cache_content(self):
        return None if self._calendar is None else id(self._calendar)

    def _font(self) -> QFont:
        return self.style.get("tickFont") or QFont()

    def _label_px(self) -> float:
        return QFontMetricsF(self._font()).horizontalAdvance("Wed 30 Sep") * 1.35

    def tickValues(self, minVal, maxVal, size):
        if self._calendar is None:
            return super().tickValues(minVal, maxVal, size)
        ticks = date_ticks(self._calendar, minVal, maxVal, max(2, int(size / self._label_px())))
        self._labels = {round(o, 6): text for o, text in ticks}
        return [(1.0, [o for o, _ in ticks])]

    def tickStrings(self, values, scale, spacing):
        if self._calendar is None:
            return super().tickStrings(values, scale, spacing)
        return [self._labels.get(round(v, 6), "") for v in values]

    def shown_labels(self) -> list[str]:
        """The date labels as they are drawn now, left to right."""
        specs = self.generateDrawSpecs(None)
        return [] if self._calendar is None or specs is None else [s[3] for s in specs[2]]

    def generateDrawSpecs(self, p):
        """Axis line, tick positions and labels ``(x, top, width, text)`` that fit the axis."""
        if self._calendar is None or self.orientation != "bottom":
            return super().generateDrawSpecs(p)
        bounds = self.mapRectFromParent(self.geometry())
        lo, hi = self.range
        if hi <= lo or bounds.width() <= 0:
            return None
        ticks = date_ticks(self._calendar, lo, hi, max(2, int(bounds.width() / self._label_px())))
        offsets = np.array([o for o, _ in ticks], float)
        xs = bounds.left() + (offsets - lo) / (hi - lo) * bounds.width()
        metrics = QFontMetricsF(self._font())
        need = int(np.ceil(metrics.height()))
        if need > self.textHeight or need < self.textHeight - 10:   # as pyqtgraph: only on a real change,
            self._updateMaxTextSize(need)                          # which also drops the kept image
        top = bounds.top() + max(0, self.style["tickLength"]) + self.style["tickTextOffset"][1]
        texts, room = [], self.boundingRect()        # the axis and a small margin either side
        for x, (_, text) in zip(xs.tolist(), ticks):
            w = metrics.horizontalAdvance(text)
            if room.left() <= x - w / 2 and x + w / 2 <= room.right():   # whole labels only
                texts.append((x - w / 2, top, w, text))
        axis = (QPen(self.pen()), QPointF(bounds.left(), bounds.top()), QPointF(bounds.right(), bounds.top()))
        return axis, (bounds.top(), xs), texts

    def _static(self, text: str) -> QStaticText:
        font = self._font()
        key = (text, font.key())
        found = self._laid_out.get(key)
        if found is None:
            if len(self._laid_out) >= LABEL_CACHE:
                self._laid_out.clear()
            found = self._laid_out[key] = QStaticText(text)
            found.setTextFormat(Qt.TextFormat.PlainText)
            found.prepare(QTransform(), font)
        return found

    def drawPicture(self, p, axisSpec, tickSpecs, textSpecs):
        if self._calendar is None or self.orientation != "bottom":
            return super().drawPicture(p, axisSpec, tickSpecs, textSpecs)
        pen, p1, p2 = axisSpec
        p.setPen(pen)
        p.drawLine(p1, p2)
        top, xs = tickSpecs
        lines(p, xs, top, xs, top + max(0, self.style["tickLength"]))
        p.setPen(self.textPen())
        p.setFont(self._font())
        raster = isinstance(p.device(), RASTER)      # on paper and SVG: plain vector text
        h = QFontMetricsF(self._font()).height()
        for x, y, w, text in textSpecs:
            if raster:
                p.drawStaticText(QPointF(x, y), self._static(text))
            else:
                p.drawText(QRectF(x - 2, y, w + 4, h), int(Qt.AlignmentFlag.AlignCenter), text)
