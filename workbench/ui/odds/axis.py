"""A pyqtgraph axis that labels plan offsets with calendar dates (ticks from figures)."""

from __future__ import annotations

import pyqtgraph as pg

from workbench.figures.ticks import date_ticks


class OddsAxis(pg.AxisItem):
    """Bottom axis: x values are plan offsets, labels are dates of the plan's calendar."""

    def __init__(self, orientation: str = "bottom", **kwargs):
        super().__init__(orientation, **kwargs)
        self.calendar = None
        self._labels: dict[float, str] = {}

    def set_calendar(self, calendar) -> None:
        self.calendar = calendar
        self.picture = None
        self.update()

    def tickValues(self, minVal, maxVal, size):  # noqa: N802 (Qt override)
        if self.calendar is None:
            return super().tickValues(minVal, maxVal, size)
        room = max(2, int(size // 95))
        ticks = date_ticks(self.calendar, minVal, maxVal, room)
        self._labels = {round(o, 6): text for o, text in ticks}
        return [(1.0, [o for o, _ in ticks])]

    def tickStrings(self, values, scale, spacing):  # noqa: N802 (Qt override)
        if self.calendar is None:
            return super().tickStrings(values, scale, spacing)
        return [self._labels.get(round(v, 6), "") for v in values]
