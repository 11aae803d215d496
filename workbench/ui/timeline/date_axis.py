"""Date axis for the Timeline: x is a plan-unit offset, labels are calendar dates.

Day, week, month, quarter or year labels as the zoom changes (``figures.ticks``). Ticks
and labels are placed with numpy and drawn in a few calls; each label is laid out once.
"""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QFont, QFontMetricsF, QPen, QStaticText, QTransform

from workbench.figures.ticks import fitted_date_ticks
from workbench.ui.timeline.axis_cache import RASTER, TimelineAxisCache
from workbench.ui.timeline.batch import axis_and_ticks

LABEL_CACHE = 500


class TimelineDateAxis(TimelineAxisCache, pg.AxisItem):
    def __init__(self, orientation: str = "bottom", **kwargs):
        super().__init__(orientation, **kwargs)
        self._calendar = None
        self._labels: dict[float, str] = {}
        self._laid_out: dict[str, tuple[float, QStaticText]] = {}
        self._laid_out_key = None
        self._fitted_key, self._fitted = None, []
        self.setStyle(tickLength=5, autoExpandTextSpace=True, hideOverlappingLabels=False)

    def set_calendar(self, calendar) -> None:
        self._calendar = calendar
        self.picture = None
        self.update()

    def _fitted_ticks(self, lo: float, hi: float, width: float, font: QFont, laid_out: dict, metrics) -> list:
        """``fitted_date_ticks`` for this range, width and font, kept while they and the
        calendar's working days stay the same (an edit makes a new calendar of the same
        days: its ticks are those already chosen; a zoom or pan chooses again)."""
        cal = self._calendar
        key = (lo, hi, width, font.key(), str(cal.first_day), cal.weekmask, cal.per_unit,
               cal.holidays.size, cal.holidays.tobytes())
        if key != self._fitted_key:
            self._fitted = fitted_date_ticks(cal, lo, hi, width, self._measure(laid_out, font, metrics))
            self._fitted_key = key
        return self._fitted

    def cache_content(self):
        return None if self._calendar is None else id(self._calendar)

    def _font(self) -> QFont:
        return self.style.get("tickFont") or QFont()

    def tickValues(self, minVal, maxVal, size):
        if self._calendar is None:
            return super().tickValues(minVal, maxVal, size)
        font = self._font()
        laid_out, metrics = self._laid_out_for(font), QFontMetricsF(font)
        ticks = self._fitted_ticks(minVal, maxVal, size, font, laid_out, metrics)
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
        font = self._font()
        metrics, laid_out = QFontMetricsF(font), self._laid_out_for(font)
        ticks = self._fitted_ticks(lo, hi, bounds.width(), font, laid_out, metrics)
        offsets = np.array([o for o, _ in ticks], float)
        xs = bounds.left() + (offsets - lo) / (hi - lo) * bounds.width()
        need = int(np.ceil(metrics.height()))
        if need > self.textHeight or need < self.textHeight - 10:   # as pyqtgraph: only on a real change,
            self._updateMaxTextSize(need)                          # which also drops the kept image
        top = bounds.top() + max(0, self.style["tickLength"]) + self.style["tickTextOffset"][1]
        texts, room = [], self._label_room()
        for x, (_, text) in zip(xs.tolist(), ticks):    # whole labels only, within the axis and a margin
            w = (laid_out.get(text) or self._lay_out(laid_out, text, font, metrics))[0]
            if room.left() <= x - w / 2 and x + w / 2 <= room.right():
                texts.append((x - w / 2, top, w, text))
        axis = (QPen(self.pen()), QPointF(bounds.left(), bounds.top()), QPointF(bounds.right(), bounds.top()))
        return axis, (bounds.top(), xs), texts

    def _label_room(self) -> QRectF:
        """Where labels may go: the axis and a margin beside it, but only as far as the
        chart's widget shows (a label past its edge would be cut, e.g. on a slide)."""
        room = self.boundingRect()
        scene = self.scene()
        views = [] if scene is None else scene.views()
        if views:
            shown = views[0].mapToScene(views[0].viewport().rect()).boundingRect()
            room = room.intersected(self.mapRectFromScene(shown))
        return room

    def _laid_out_for(self, font: QFont) -> dict:
        """Label text → (width, laid-out text) in ``font`` (one font key asked per paint)."""
        key = font.key()
        if self._laid_out_key != key or len(self._laid_out) >= LABEL_CACHE:
            self._laid_out, self._laid_out_key = {}, key
        return self._laid_out

    def _measure(self, laid_out: dict, font: QFont, metrics: QFontMetricsF):
        """A label's width, laid out once and kept (the tick chooser asks for many)."""
        def width(text: str) -> float:
            return (laid_out.get(text) or self._lay_out(laid_out, text, font, metrics))[0]
        return width

    @staticmethod
    def _lay_out(laid_out: dict, text: str, font: QFont, metrics: QFontMetricsF) -> tuple:
        static = QStaticText(text)
        static.setTextFormat(Qt.TextFormat.PlainText)
        static.prepare(QTransform(), font)
        found = laid_out[text] = (metrics.horizontalAdvance(text), static)
        return found

    def drawPicture(self, p, axisSpec, tickSpecs, textSpecs):
        if self._calendar is None or self.orientation != "bottom":
            return super().drawPicture(p, axisSpec, tickSpecs, textSpecs)
        pen, p1, p2 = axisSpec
        p.setPen(pen)
        top, xs = tickSpecs
        axis_and_ticks(p, p1, p2, xs, top, xs, top + max(0, self.style["tickLength"]))
        p.setPen(self.textPen())
        font = self._font()
        p.setFont(font)
        if isinstance(p.device(), RASTER):
            laid_out, metrics = self._laid_out_for(font), QFontMetricsF(font)
            for x, y, _, text in textSpecs:
                p.drawStaticText(QPointF(x, y), (laid_out.get(text) or self._lay_out(laid_out, text, font, metrics))[1])
            return
        h = QFontMetricsF(font).height()           # on paper and SVG: plain vector text
        for x, y, w, text in textSpecs:
            p.drawText(QRectF(x - 2, y, w + 4, h), int(Qt.AlignmentFlag.AlignCenter), text)
