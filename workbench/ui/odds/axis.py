"""The Odds view's date axis: the shared plan-date axis (``ui/date_axis.py``), whose
labels may reach a few pixels past its ends (a short span may hold a single month start,
close to an end) also when the plot draws a grid, and keep more air between them on a
narrow chart (a small dock), where fewer dates read better than a crowded row, as long
as at least two are left to give the scale."""

from __future__ import annotations

from PySide6.QtGui import QFont, QFontMetricsF

from workbench.figures.ticks import fitted_date_ticks
from workbench.ui.date_axis import DateAxis

NARROW_AXIS_PX = 300     # an axis shorter than this keeps its labels further apart
NARROW_GAP_PX = 24.0     # the room between two date labels there (16 px elsewhere)


class OddsAxis(DateAxis):
    def boundingRect(self):  # noqa: N802 (Qt override)
        rect = super().boundingRect()
        reach = self.style.get("hideOverlappingLabels")
        if self.grid is not False and not isinstance(reach, bool) and isinstance(reach, int):
            rect = rect.adjusted(-reach, 0, reach, 0)     # the grid's branch ignores the reach
        return rect

    def tickValues(self, minVal, maxVal, size):  # noqa: N802 (Qt override)
        if self.calendar is None or size >= NARROW_AXIS_PX:
            return super().tickValues(minVal, maxVal, size)
        metrics = QFontMetricsF(self.style.get("tickFont") or QFont())
        ticks = fitted_date_ticks(self.calendar, minVal, maxVal, size, metrics.horizontalAdvance, gap=NARROW_GAP_PX)
        if len(ticks) < 2:               # one date alone gives no scale: the usual spacing then
            return super().tickValues(minVal, maxVal, size)
        self._labels = {round(o, 6): text for o, text in ticks}
        return [(1.0, [o for o, _ in ticks])]


__all__ = ["OddsAxis"]
