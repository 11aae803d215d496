"""The odds trend in the Odds view: the chance of the committed date over status dates.
Draws ``workbench.figures.odds_trend`` geometry (as the pack does); no math here.

Simulation: thick blue line with square marks and the value written above; PERT: thin
dashed black line with dots; the approved baseline: a hollow diamond; the target: a dotted
level line. Line styles and marks differ, so it reads in grayscale too."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtGui import QColor, QFont
from PySide6.QtWidgets import QLabel, QVBoxLayout, QWidget

from workbench.figures import odds_trend as ot
from workbench.figures import style
from workbench.core.formatting import format_whole_percent


class _DayAxis(pg.AxisItem):
    """Bottom axis over day numbers, with the figure's own ticks."""

    ticks: list = []

    def tickValues(self, minVal, maxVal, size):  # noqa: N802 (Qt override)
        return [(1.0, [x for x, _ in self.ticks if minVal <= x <= maxVal])]

    def tickStrings(self, values, scale, spacing):  # noqa: N802 (Qt override)
        labels = dict(self.ticks)
        return [labels.get(v, "") for v in values]


class TrendPlot(QWidget):
    def __init__(self, parent=None):
        super().__init__(parent)
        self.headline = QLabel(self, wordWrap=True)
        font = QFont()
        font.setPointSizeF(style.SCREEN.font_size + 1)
        font.setBold(True)
        self.headline.setFont(font)
        self.axis = _DayAxis("bottom")
        self.plot = pg.PlotWidget(self, axisItems={"bottom": self.axis}, background=style.BACKGROUND)
        self.plot.setMouseEnabled(x=False, y=False)
        self.plot.setYRange(-0.02, 1.1, padding=0)
        self.plot.getAxis("left").setTicks([[(k / 10, f"{k * 10} %") for k in range(0, 11, 2)]])
        self.plot.showGrid(x=True, y=True, alpha=0.2)
        self.plot.setLabel("left", "Chance of the deadline")
        for name in ("bottom", "left"):
            self.plot.getAxis(name).setTextPen(pg.mkPen(style.TEXT))
            self.plot.getAxis(name).setTickFont(font)
        lay = QVBoxLayout(self)
        lay.setContentsMargins(4, 4, 4, 4)
        lay.addWidget(self.headline)
        lay.addWidget(self.plot, 1)
        self.figure: ot.TrendFigure | None = None

    def show_trend(self, points, target: float, baseline) -> None:
        fig = self.figure = ot.trend_figure(points, target, baseline)
        self.headline.setText(ot.headline(points, baseline))
        self.axis.ticks = fig.ticks
        p = self.plot
        p.clear()
        if p.plotItem.legend is None:
            p.addLegend(offset=(-10, 10), labelTextSize="10pt", labelTextColor=style.TEXT,
                        brush=pg.mkBrush(255, 255, 255, 220))
        p.plotItem.legend.clear()
        p.setXRange(fig.x_lo, fig.x_hi, padding=0)
        p.addItem(pg.InfiniteLine(fig.target, angle=0, pen=pg.mkPen(style.MUTED_TEXT, width=2, style=Qt.DotLine),
                                  label=f"target {format_whole_percent(fig.target)}", labelOpts={"position": 0.95, "color": style.MUTED_TEXT}))
        self._series(fig.x, fig.pert, pg.mkPen(style.TEXT, width=2, style=Qt.DashLine), "o", 7, style.TEXT,
                     "by PERT (one path)")
        self._series(fig.x, fig.simulation, pg.mkPen(style.WORK, width=5), "s", 13, style.WORK, "by simulation")
        for x, y in zip(fig.x, fig.simulation):
            if np.isfinite(y):
                self._text(f"{format_whole_percent(y)}", x, y, (0.5, 1.3), style.TEXT)
        if fig.baseline is not None:
            x, y, name = fig.baseline
            p.addItem(pg.ScatterPlotItem([x], [y], symbol="d", size=16, pen=pg.mkPen(style.TEXT, width=2),
                                         brush=pg.mkBrush("#FFFFFF")))
            self._text(f"approved: {name} ({format_whole_percent(y)})", x, y, (-0.05, -0.4), style.TEXT)

    def _series(self, x, y, pen, symbol: str, size: int, colour: str, name: str) -> None:
        ok = np.isfinite(y)
        self.plot.addItem(pg.PlotDataItem(x[ok], y[ok], pen=pen, symbol=symbol, symbolSize=size, name=name,
                                          symbolBrush=pg.mkBrush(colour), symbolPen=pg.mkPen(colour)))

    def _text(self, text: str, x: float, y: float, anchor, colour: str) -> None:
        item = pg.TextItem(text, color=QColor(colour), anchor=anchor)
        font = QFont()
        font.setPointSizeF(style.SCREEN.font_size + 1)
        font.setBold(True)
        item.setFont(font)
        item.setPos(x, y)
        self.plot.addItem(item)
