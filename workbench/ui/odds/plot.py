"""The Odds view's charts: finish density (top) and cumulative probability (bottom),
on one date axis. Draws geometry from ``workbench.figures.odds``; no math here."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt, QTimer, Signal
from PySide6.QtGui import QColor, QFont

from workbench.figures import style
from workbench.figures import label_place as lp
from workbench.ui.odds import plot_labels as pl
from workbench.ui.odds.axis import OddsAxis
from workbench.ui.odds.chance_axis import ChanceAxis

STALE = "#9A9A9A"
DATE_OVERFLOW_PX = 30    # how far a date label may reach past the end of its axis
SHORT_CHART_PX = 420     # a chart shorter than this gives the dates only under the S-curve
NARROW_PLOT_PX = 300     # a density plot narrower than this shows its title, not its values


def _colour(hex_colour: str, alpha: int = 255) -> QColor:
    c = QColor(hex_colour)
    c.setAlpha(alpha)
    return c


def _pen(hex_colour: str, width: float = 2.0, dash: bool = False):
    return pg.mkPen(_colour(hex_colour), width=width, style=Qt.DashLine if dash else Qt.SolidLine)


class OddsPlot(pg.GraphicsLayoutWidget):
    """Two stacked plots sharing x (plan offsets, labelled with dates)."""

    marker_moved = Signal()       # while dragging
    marker_released = Signal()    # once, when a drag ends
    legends_shown = Signal(bool)  # False when a legend has no free corner (the view shows a key)

    def __init__(self, parent=None):
        super().__init__(parent)
        self._placing = False
        self.setBackground(style.BACKGROUND)
        self.density = self._make_plot(0, "Likelihood of finishing (density per unit)")
        self.cumulative = self._make_plot(1, "P(finish by date)")
        self.cumulative.setXLink(self.density)
        self.cumulative.setYRange(0, 1.0, padding=0.02)
        self.ci.layout.setRowStretchFactor(0, 3)
        self.ci.layout.setRowStretchFactor(1, 2)
        self._make_items()
        self._make_markers()
        for plot in (self.density, self.cumulative):
            plot.vb.sigRangeChanged.connect(lambda *_: self.place_labels())

    def _make_plot(self, row: int, ylabel: str) -> pg.PlotItem:
        axes = {"bottom": OddsAxis("bottom")}
        if row == 1:
            axes["left"] = ChanceAxis()
        plot = self.addPlot(row=row, col=0, axisItems=axes)
        plot.setLabel("left", ylabel)
        if row == 1:  # read dates and probabilities off the S-curve; the density needs no grid
            plot.showGrid(x=True, y=True, alpha=0.25)
        plot.setMouseEnabled(x=True, y=False)
        plot.hideButtons()   # the chart library's own auto-range button: Fit does that here
        plot.getViewBox().setDefaultPadding(0.0)
        font = QFont()
        font.setPointSizeF(style.SCREEN.font_size + 1)
        # a date label near an end may reach a little past it (into the y axis's margin)
        # rather than vanish: a short span may have a single month start, close to the left
        plot.getAxis("bottom").setStyle(hideOverlappingLabels=DATE_OVERFLOW_PX)
        for name in ("bottom", "left"):
            axis = plot.getAxis(name)
            axis.setTickFont(font)
            axis.setTextPen(pg.mkPen(style.TEXT))
            axis.enableAutoSIPrefix(False)
        return plot

    def _make_items(self) -> None:
        d, c = self.density, self.cumulative  # density items here, cumulative ones below
        self.legend = d.addLegend(offset=(-10, 10), labelTextSize="10pt", labelTextColor=style.TEXT,
                                  brush=pg.mkBrush(255, 255, 255, 220), colCount=2)
        self.hist = pg.PlotDataItem(pen=_pen(style.WORK, 2.0), fillLevel=0.0,
                                    brush=_colour(style.FLOAT, 45), name="Simulation")
        # a solid fill with a heavy stepped outline: pattern brushes cost ~3x more to paint
        self.sim_shade = pg.PlotDataItem(pen=_pen(style.CRITICAL, 2.5), fillLevel=0.0,
                                         brush=_colour(style.CRITICAL, 90),
                                         name="Simulation answer")
        self.pert_shade = pg.PlotDataItem(pen=pg.mkPen(None), fillLevel=0.0,
                                          brush=_colour(style.PROBABILITY), name="PERT answer")
        self.pert_curve = pg.PlotDataItem(pen=_pen(style.TEXT, 2.5), name="PERT curve")
        for item in (self.pert_shade, self.hist, self.sim_shade, self.pert_curve):
            d.addItem(item)
        self.certain = pg.InfiniteLine(angle=90, pen=_pen(style.TEXT, 3.0), movable=False,
                                       label="certain finish", labelOpts={"position": 0.9})
        self.certain.setVisible(False)
        d.addItem(self.certain)
        self.answer_dot = pg.ScatterPlotItem(size=14, symbol="d", brush=_colour(style.BACKGROUND),
                                             pen=_pen(style.TEXT, 2.5))
        self.answer_text = pg.TextItem("", color=style.TEXT, anchor=(-0.15, 1.0), fill=(255, 255, 255, 220))
        for item in (self.answer_dot, self.answer_text):
            item.setZValue(15)
            d.addItem(item)
        self._make_cumulative_items(c)

    def _make_cumulative_items(self, c: pg.PlotItem) -> None:
        self.pert_cdf = pg.PlotDataItem(pen=_pen(style.TEXT, 2.5), name="PERT")
        self.ecdf = pg.PlotDataItem(pen=_pen(style.WORK, 2.5), name="Simulation (S-curve)")
        # top left: an S-curve is still near zero there, and the answer labels sit low
        self.cum_legend = c.addLegend(offset=(10, 10), labelTextSize="10pt", labelTextColor=style.TEXT,
                                      brush=pg.mkBrush(255, 255, 255, 220), colCount=2)
        c.addItem(self.pert_cdf)
        c.addItem(self.ecdf)
        self.level = pg.InfiniteLine(angle=0, pen=_pen(style.MUTED_TEXT, 1.5, dash=True), movable=False)
        c.addItem(self.level)
        self.p_points = pg.ScatterPlotItem(size=11, brush=_colour(style.WORK), pen=_pen(style.TEXT, 1.0))
        c.addItem(self.p_points)
        self.p_labels: list[pg.TextItem] = []

    def _make_markers(self) -> None:
        self.markers, self.mirrors, self.answers = [], [], []
        self._texts: dict[int, str] = {}      # label item → its whole text (it may show a shorter one)
        self._answer_at = (0.0, 0.0)
        self.marker_texts: list[pg.TextItem] = []
        self.answer_texts: list[pg.TextItem] = []
        for key in ("D1", "D2"):
            line = pg.InfiniteLine(angle=90, movable=True, pen=_pen(style.DEADLINE, 3.0),
                                   hoverPen=_pen(style.DEADLINE, 5.0))
            line.setZValue(20)
            line.sigPositionChanged.connect(lambda *_: self.marker_moved.emit())
            line.sigPositionChangeFinished.connect(lambda *_: self.marker_released.emit())
            mirror = pg.InfiniteLine(angle=90, movable=False, pen=_pen(style.DEADLINE, 2.0, dash=True))
            self.density.addItem(line)
            self.cumulative.addItem(mirror)
            self.markers.append(line)
            self.mirrors.append(mirror)
            self.marker_texts.append(self._text(self.density, style.TEXT, 220))
        for colour in (style.TEXT, style.WORK):
            line = pg.InfiniteLine(angle=90, movable=False, pen=_pen(colour, 2.0, dash=True))
            self.cumulative.addItem(line)
            self.answers.append(line)
            self.answer_texts.append(self._text(self.cumulative, colour, 230))

    @staticmethod
    def _text(plot: pg.PlotItem, colour: str, alpha: int) -> pg.TextItem:
        """A label placed by ``place_labels`` (hidden until it has a free place)."""
        text = pg.TextItem("", color=colour, anchor=(0, 0), fill=(255, 255, 255, alpha))
        text.setZValue(25)
        text.setVisible(False)
        plot.addItem(text, ignoreBounds=True)
        return text

    # --- setters (all drawing comes in as figures geometry) ---------------------
    def set_calendar(self, calendar) -> None:
        for plot in (self.density, self.cumulative):
            plot.getAxis("bottom").set_calendar(calendar)

    def set_span(self, lo: float, hi: float) -> None:
        self.density.setXRange(lo, hi, padding=0.0)

    def show_pert(self, curve) -> None:
        self.certain.setVisible(curve.step)
        if curve.step:
            self.certain.setValue(curve.mean)
            self.pert_curve.setData([], [])
        else:
            self.pert_curve.setData(curve.x, curve.density)
        self.pert_cdf.setData(curve.x, curve.cumulative)
        top = float(np.max(curve.density)) if not curve.step else 1.0
        self._pert_top = top

    def show_shade(self, item: pg.PlotDataItem, shade) -> None:
        if shade is None or shade.x.size == 0:
            item.setData([], [])
        else:
            item.setData(shade.x, shade.y)

    def show_sim(self, fig, stale: bool) -> None:
        """Histogram, S-curve and P-markers of a simulation (grey when stale); None clears."""
        for label in self.p_labels:
            self.cumulative.removeItem(label)
        self.p_labels = []
        self._legend_for_sim(fig is not None)
        if fig is None:
            self.hist.setData([], [])
            self.ecdf.setData([], [])
            self.p_points.setData([], [])
            self.place_labels()
            return
        colour = STALE if stale else style.WORK
        self.hist.setPen(_pen(colour, 2.0))
        self.hist.setBrush(_colour(STALE if stale else style.FLOAT, 45))
        self.ecdf.setPen(_pen(colour, 2.5))
        self.hist.setData(*fig.step_outline())
        self.ecdf.setData(*_thin(fig.ecdf_x, fig.ecdf_y))
        names = list(fig.markers)
        xs = [fig.markers[n] for n in names]
        ys = [int(n[1:]) / 100.0 for n in names]
        self.p_points.setData(xs, ys, brush=_colour(colour))
        font = QFont()
        font.setPointSizeF(style.SCREEN.label_font_size + 1)
        font.setBold(True)
        for name, x, y in zip(names, xs, ys):
            # a light backing keeps it legible over the grid; place_labels picks its side
            text = pg.TextItem(name, color=colour, anchor=(0, 0), fill=(255, 255, 255, 215))
            text.setFont(font)
            text.point = (x, y)          # placed beside its point by place_labels
            text.setPos(x, y)
            text.setZValue(25)
            self.cumulative.addItem(text, ignoreBounds=True)
            self.p_labels.append(text)
        self._y_top(float(np.max(fig.heights)))
        self.place_labels()

    def _legend_for_sim(self, shown: bool) -> None:
        """List the simulation's items in the legends only when there is a simulation."""
        for legend, item, name in ((self.legend, self.hist, "Simulation"),
                                   (self.legend, self.sim_shade, "Simulation answer"),
                                   (self.cum_legend, self.ecdf, "Simulation (S-curve)")):
            listed = any(sample.item is item for sample, _ in legend.items)
            if shown and not listed:
                legend.addItem(item, name)
            elif not shown and listed:
                legend.removeItem(item)

    def _y_top(self, sim_top: float) -> None:
        self._sim_top = sim_top
        top = max(getattr(self, "_pert_top", 0.0), sim_top)
        self.density.setYRange(0, top * self._headroom() if top > 0 else 1.0, padding=0.0)

    def _headroom(self) -> float:
        """Room above the peak for the legend, so it never sits on the curve (small docks)."""
        height = self.density.vb.height()
        legend = self.legend.boundingRect().height() + 20.0
        if height <= legend * 1.5:
            return 2.0
        return min(2.0, max(1.12, height / (height - legend)))

    def resizeEvent(self, event):  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        if hasattr(self, "_sim_top"):
            self._y_top(self._sim_top)
        self.place_labels()

    def fit_y(self, has_sim: bool) -> None:
        if not has_sim:
            self._y_top(0.0)

    def set_markers(self, mode: str, values: tuple[float, float | None], labels: tuple[str, str]) -> None:
        for i, (line, mirror) in enumerate(zip(self.markers, self.mirrors)):
            show = i == 0 or mode == "between"
            line.setVisible(show)
            mirror.setVisible(show)
            if not show:
                self._texts[id(self.marker_texts[i])] = ""
            if show and values[i] is not None:
                if abs(line.value() - values[i]) > 1e-12:
                    line.blockSignals(True)
                    line.setValue(values[i])
                    line.blockSignals(False)
                mirror.setValue(values[i])
                self._texts[id(self.marker_texts[i])] = labels[i]
                self.marker_texts[i].setText(labels[i])
        self.place_labels()

    def set_answers(self, probability: float, pert_x, sim_x, labels: tuple[str, str],
                    pert_y: float = 0.0) -> None:
        """The inverse question: on the S-curve a level line and the two dates; on the
        density curve a diamond at the PERT date."""
        self.level.setValue(probability)
        self.answer_dot.setData([pert_x], [pert_y])
        self._texts[id(self.answer_text)] = labels[0]
        self.answer_text.setText(labels[0])          # whole until placed (it may then shorten)
        self._answer_at = (pert_x, pert_y)
        for line, label, x, text in zip(self.answers, self.answer_texts, (pert_x, sim_x), labels):
            line.setVisible(x is not None)
            self._texts[id(label)] = text if x is not None else ""
            label.setText(self._texts[id(label)])
            if x is not None:
                line.setValue(x)
        self.place_labels()

    # --- labels where they cover nothing (figures.label_place) --------------------
    def place_labels(self) -> None:
        """Set the labels once the current changes are in (one placement per turn of the
        event loop, however many setters ran: a marker drag moves several items)."""
        if not getattr(self, "_placing", False) and hasattr(self, "answer_texts"):
            self._placing = True
            QTimer.singleShot(0, self, self.place_labels_now)    # dropped with the plot

    def place_labels_now(self) -> None:
        """Set every label and legend of both plots where it covers no line, curve or
        other label; hide what has no room. Also words the y titles to fit."""
        self._placing = False
        if not hasattr(self, "answer_texts"):
            return
        self._fit_titles()
        self._place_density()
        self._place_cumulative()

    def _fit_titles(self) -> None:
        # in a narrow plot the density's values (per unit of time) give their room to the dates
        values = self.density.vb.width() >= NARROW_PLOT_PX
        axis = self.density.getAxis("left")
        if axis.style["showValues"] != values:
            axis.setStyle(showValues=values)
        # a short chart: the dates once, under the S-curve (both plots share them)
        dates = self.height() >= SHORT_CHART_PX
        axis = self.density.getAxis("bottom")
        if axis.style["showValues"] != dates:
            axis.setStyle(showValues=dates)
        self.cumulative.getAxis("left").fit_height(self.cumulative.vb.height())   # halves on a low chart
        for plot, key in ((self.density, "density"), (self.cumulative, "cumulative")):
            pl.fit_y_title(plot, pl.Y_TITLES[key])

    def _obstacles(self, plot, curves, lines) -> lp.Obstacles:
        obstacles = lp.Obstacles()
        pl.curve_obstacles(plot.vb, curves, obstacles)
        pl.line_obstacles(plot.vb, lines, obstacles)
        return obstacles

    def _place_density(self) -> None:
        vb = self.density.vb
        bounds = pl.scene_rect(vb)
        obstacles = self._obstacles(self.density, (self.pert_curve, self.hist, self.sim_shade),
                                    [*self.markers, self.certain])
        entries = []
        for text, line in zip(self.marker_texts, self.markers):
            if line.isVisible() and self._texts.get(id(text)):
                x = vb.mapViewToScene(pg.Point(line.value(), 0)).x()
                entries.append((text, self._texts[id(text)],
                                lambda w, h, x=x: lp.beside_line(x, bounds[1], bounds[3], w, h, left_first=True)))
        if self._texts.get(id(self.answer_text)):
            dot = vb.mapViewToScene(pg.Point(*self._answer_at))     # the diamond the PERT answer belongs to
            obstacles.rects.append((dot.x() - 8, dot.y() - 8, dot.x() + 8, dot.y() + 8))
            entries.append((self.answer_text, self._texts[id(self.answer_text)],
                            lambda w, h: lp.around_point(dot.x(), dot.y(), w, h, pad=10.0)
                            + lp.beside_line(dot.x(), bounds[1], dot.y(), w, h)))
        taken: list = []
        pl.place_items(vb, entries, bounds, obstacles, taken)
        legend = lp.corners(bounds, *pl.legend_size(self.legend))
        pick = lp.place([legend], bounds, obstacles, taken)[0]
        pl.put_legend(vb, self.legend, None if pick is None else legend[pick])

    def _place_cumulative(self) -> None:
        vb = self.cumulative.vb
        bounds = pl.scene_rect(vb)
        obstacles = self._obstacles(self.cumulative, (self.pert_cdf, self.ecdf),
                                    [*self.mirrors, *self.answers, self.level])
        entries = []
        for line, text in zip(self.answers, self.answer_texts):
            if line.isVisible() and self._texts.get(id(text)):
                x = vb.mapViewToScene(pg.Point(line.value(), 0)).x()
                entries.append((text, self._texts[id(text)],
                                lambda w, h, x=x: lp.beside_line(x, bounds[1], bounds[3], w, h)))
        for text in self.p_labels:
            point = vb.mapViewToScene(pg.Point(*text.point))
            obstacles.rects.append((point.x() - 6, point.y() - 6, point.x() + 6, point.y() + 6))
        for text in sorted(self.p_labels, key=lambda t: P_ORDER.get(t.textItem.toPlainText(), 9)):
            point = vb.mapViewToScene(pg.Point(*text.point))
            entries.append((text, text.textItem.toPlainText(),
                            lambda w, h, p=point: lp.around_point(p.x(), p.y(), w, h)))
        taken: list = []
        pl.place_items(vb, entries, bounds, obstacles, taken)
        legend = lp.corners(bounds, *pl.legend_size(self.cum_legend))
        legend = [legend[1], legend[2], legend[0], legend[3]]     # top left first: an S-curve starts low
        pick = lp.place([legend], bounds, obstacles, taken)[0]
        pl.put_legend(vb, self.cum_legend, None if pick is None else legend[pick])
        self.legends_shown.emit(self.legend.isVisible() and self.cum_legend.isVisible())


P_ORDER = {"P80": 0, "P90": 1, "P50": 2, "P10": 3}     # the target first; P10 last


def _thin(x: np.ndarray, y: np.ndarray, most: int = 2000):
    """At most ``most`` points of a step curve (an S-curve of 100k points looks the same)."""
    if x.size <= most:
        return x, y
    idx = np.unique(np.linspace(0, x.size - 1, most).astype(int))
    return x[idx], y[idx]
