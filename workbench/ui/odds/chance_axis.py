"""The S-curve's chance axis (left): on a low chart it marks halves only, 0.5 and 1.0, with
unlabelled tenths; four values stacked in a finger's height read as a smudge. The top
label sits on the plot's upper edge and may reach a few pixels above it, also when the
plot draws a grid (whose branch of the bounding box ignores the reach)."""

from __future__ import annotations

import pyqtgraph as pg

LOW_PLOT_PX = 120        # a plot lower than this marks its chances at halves only
TOP_REACH_PX = 12        # how far a label may reach past the axis's ends
HALVES = [[(0.5, "0.5"), (1.0, "1.0")], [(k / 10, "") for k in range(11)]]


class ChanceAxis(pg.AxisItem):
    def __init__(self, **kwargs):
        super().__init__("left", **kwargs)
        self.low = False

    def fit_height(self, height: float) -> None:
        """Halves only when the plot is lower than :data:`LOW_PLOT_PX`, else the usual ticks."""
        low = height < LOW_PLOT_PX
        if low != self.low:
            self.low = low
            self.setTicks(HALVES if low else None)

    def boundingRect(self):  # noqa: N802 (Qt override)
        rect = super().boundingRect()
        return rect.adjusted(0, -TOP_REACH_PX, 0, TOP_REACH_PX) if self.grid is not False else rect


__all__ = ["ChanceAxis"]
