"""Drawing a resource loading chart (``figures.loading``) into a pyqtgraph plot, shared by the
Timeline's loading band and the Resources view: units in use as blue steps, the units
available as a dashed black line, the over-allocated steps in vermillion with a hatch so a
grayscale print still shows them. ``base`` and ``height`` place the chart in a lane of a
taller plot (small multiples); the defaults draw it at its own scale."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtGui import QBrush, QColor

from workbench.figures import style

LEGEND = ("Blue: units in use \u2022 dashed: units available \u2022 "
          "hatched vermillion: over-allocated")


def over_brush() -> QBrush:
    return QBrush(QColor(style.CRITICAL), Qt.BrushStyle.BDiagPattern)


def add_loading(plot, fig, base: float = 0.0, height: float | None = None, line: float = 1.5) -> list:
    """Add the items of one loading figure to ``plot`` (a PlotItem or PlotWidget); returns
    them (use, over-allocation, availability) so callers and tests can find them again."""
    scale = 1.0 if height is None else height / fig.top
    use = base + fig.use * scale
    items = [pg.PlotDataItem(fig.edges, use, stepMode="center", fillLevel=base, brush=QColor(style.WORK),
                             pen=pg.mkPen(style.WORK_EDGE, width=line))]
    for a, b in over_runs(fig.over_mask):          # each over-allocated run on its own
        items.append(pg.PlotDataItem(fig.edges[a:b + 1], use[a:b], stepMode="center", fillLevel=base,
                                     brush=over_brush(), pen=pg.mkPen(style.CRITICAL, width=line + 1.0)))
    items.append(pg.PlotDataItem(fig.edges, base + fig.available * scale, stepMode="center",
                                 pen=pg.mkPen(style.TEXT, width=line + 0.5, style=Qt.PenStyle.DashLine)))
    for item in items:
        plot.addItem(item)
    return items


def over_runs(mask) -> list[tuple[int, int]]:
    """(first, past-last) step index of each run of True in ``mask``."""
    padded = np.concatenate(([False], np.asarray(mask, dtype=bool), [False])).astype(np.int8)
    change = np.flatnonzero(np.diff(padded))
    return [(int(a), int(b)) for a, b in zip(change[::2], change[1::2])]
