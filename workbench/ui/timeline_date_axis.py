"""Date axis for the Timeline: x is a plan-unit offset, labels are calendar dates.

Day, week, month, quarter or year labels as the zoom changes (``figures.ticks``).
"""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtGui import QFont, QFontMetricsF

from workbench.figures.ticks import date_ticks
from workbench.ui.timeline_axis_cache import TimelineAxisCache


class TimelineDateAxis(TimelineAxisCache, pg.AxisItem):
    def __init__(self, orientation: str = "bottom", **kwargs):
        super().__init__(orientation, **kwargs)
        self._calendar = None
        self._labels: dict[float, str] = {}
        self.setStyle(tickLength=5, autoExpandTextSpace=True)

    def set_calendar(self, calendar) -> None:
        self._calendar = calendar
        self.picture = None
        self.update()

    def cache_content(self):
        return None if self._calendar is None else id(self._calendar)

    def _label_px(self) -> float:
        font = self.style.get("tickFont") or QFont()
        return QFontMetricsF(font).horizontalAdvance("Wed 30 Sep") * 1.35

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
