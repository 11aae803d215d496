"""The Odds view's date axis: the shared plan-date axis (``ui/date_axis.py``), whose
labels may reach a few pixels past its ends (a short span may hold a single month start,
close to an end) also when the plot draws a grid."""

from __future__ import annotations

from workbench.ui.date_axis import DateAxis


class OddsAxis(DateAxis):
    def boundingRect(self):  # noqa: N802 (Qt override)
        rect = super().boundingRect()
        reach = self.style.get("hideOverlappingLabels")
        if self.grid is not False and not isinstance(reach, bool) and isinstance(reach, int):
            rect = rect.adjusted(-reach, 0, reach, 0)     # the grid's branch ignores the reach
        return rect


__all__ = ["OddsAxis"]
