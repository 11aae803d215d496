"""One horizontal bar chart of the Drivers view (criticality index or sensitivity tornado).

Rows come from ``workbench.figures.drivers`` geometry; a click on a bar emits its id."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import Qt, Signal
from PySide6.QtGui import QBrush, QColor, QCursor, QFont, QFontMetrics
from PySide6.QtWidgets import QToolTip

from workbench.figures import drivers as fdr
from workbench.figures import style

STALE = "#A0A0A0"
ROW = 18        # px: the least height of a row, so row labels never run into each other
CHROME = 90     # px: the title, the value axis and its label


class DriversChart(pg.PlotWidget):
    """Horizontal bars, top row first; ``signed`` charts are tornados centred on zero."""

    activity_clicked = Signal(str)

    def __init__(self, title: str, xlabel: str, signed: bool, parent=None):
        super().__init__(parent, background=style.BACKGROUND)
        self.signed = signed
        self.chart_title = title
        self.bars: list[fdr.DriverBar] = []
        self.rects: list[fdr.BarRect] = []
        self.selected: set[str] = set()
        self.stale = False
        item = self.getPlotItem()
        item.setTitle(title, size="13pt", color=style.TEXT)
        item.setLabel("bottom", xlabel)
        item.setMouseEnabled(x=False, y=False)
        item.hideButtons()
        item.showGrid(x=True, y=False, alpha=0.3)
        font = QFont()
        font.setPointSizeF(style.SCREEN.label_font_size + 1)
        for name in ("left", "bottom"):
            item.getAxis(name).setTickFont(font)
            item.getAxis(name).setTextPen(pg.mkPen(style.TEXT))
            item.getAxis(name).enableAutoSIPrefix(False)
        self._font = font
        self.critical: set[str] = set()     # ids on the PERT critical path: vermillion, heavy edge
        self.graph = pg.BarGraphItem(x0=[], x1=[], y=[], height=0.7)
        self.critical_graph = pg.BarGraphItem(x0=[], x1=[], y=[], height=0.7)
        self.folded = pg.BarGraphItem(x0=[], x1=[], y=[], height=0.7)
        self.outline = pg.BarGraphItem(x0=[], x1=[], y=[], height=0.78)
        for g in (self.outline, self.graph, self.critical_graph, self.folded):
            item.addItem(g)
        if signed:
            item.addItem(pg.InfiniteLine(0.0, angle=90, pen=pg.mkPen(style.TEXT, width=1.5)))
        self.texts: list[pg.TextItem] = []
        item.vb.sigResized.connect(lambda *_: self._fit_value_room() if self.__dict__.get("rects") else None)
        self.scene().sigMouseClicked.connect(self._clicked)
        self.scene().sigMouseMoved.connect(self._hovered)

    def set_bars(self, bars: list[fdr.DriverBar], stale: bool = False, critical=frozenset()) -> None:
        """Show the ranked rows (an empty list clears the chart); ``critical``: ids on the
        PERT critical path, drawn in the critical style."""
        self.bars, self.stale, self.critical = bars, stale, set(critical)
        self.rects = fdr.bar_rects(bars)
        self._draw_bars()
        self._draw_labels()
        item = self.getPlotItem()
        item.setYRange(-max(1, len(bars)) + 0.4, 0.6, padding=0.02)
        self._set_row_labels()
        self._fit_value_room()          # after the row labels: they set the plot's width
        self.setMinimumHeight(CHROME + ROW * max(1, len(bars)))   # rows never overlap: a short dock scrolls

    def _fit_value_room(self) -> None:
        """The x range, widened until the value printed beyond the longest bar fits inside
        the plot at its present width (a narrow dock needs more than the usual margin)."""
        item = self.getPlotItem()
        if item is None:                   # torn down
            return
        lo, hi = fdr.value_span(self.bars, self.signed)
        width = item.vb.width()
        metrics = QFontMetrics(self._font)
        for r, text in zip(self.rects, self.texts):
            label = min(metrics.horizontalAdvance(text.textItem.toPlainText()) + 10.0, 0.6 * width)
            if width <= 0:
                break
            if r.bar.value >= 0 and hi > 0:   # (hi - x1) of (hi - lo) must hold ``label`` pixels
                hi = max(hi, (r.x1 * width - lo * label) / (width - label))
            elif r.bar.value < 0 and lo < 0:
                lo = min(lo, (r.x0 * width - hi * label) / (width - label))
        item.setXRange(lo, hi, padding=0.0)

    def _set_row_labels(self) -> None:
        """Row labels elided to fit about 35 % of the chart's width, so the bars keep room."""
        metrics = QFontMetrics(self._font)
        room = max(6, int(0.35 * self.width() / max(1, metrics.averageCharWidth())))
        ticks = [(r.y, _elide(r.bar.label, min(42, room))) for r in self.rects]
        left = self.getPlotItem().getAxis("left")
        left.setTicks([ticks, []])
        left.setWidth(24 + max((metrics.horizontalAdvance(t) for _, t in ticks), default=40))

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        if getattr(self, "_font", None) is not None and self.__dict__.get("rects") and self.getPlotItem() is not None:
            self._set_row_labels()
            self._fit_value_room()

    def _split(self, kind: str):
        """Rows of one kind: 'folded', 'critical' or 'other'."""
        def kind_of(bar):
            return "folded" if bar.is_folded else "critical" if bar.act_id in self.critical else "other"
        rs = [r for r in self.rects if kind_of(r.bar) == kind]
        return dict(x0=[r.x0 for r in rs], x1=[r.x1 for r in rs], y=[r.y for r in rs])

    def _draw_bars(self) -> None:
        main = STALE if self.stale else style.WORK
        edge = "#555555" if self.stale else style.WORK_EDGE
        self.graph.setOpts(**self._split("other"), height=0.7, brush=QColor(main), pen=pg.mkPen(edge, width=1))
        self.critical_graph.setOpts(**self._split("critical"), height=0.7,
                                    brush=QColor(STALE if self.stale else style.CRITICAL),
                                    pen=pg.mkPen(style.CRITICAL_EDGE, width=style.SCREEN.critical_outline))
        hatch = QBrush(QColor(STALE if self.stale else style.SUMMARY), Qt.BDiagPattern)
        self.folded.setOpts(**self._split("folded"), height=0.7, brush=hatch, pen=pg.mkPen(style.SUMMARY, width=1))
        self.set_selected(self.selected)

    def set_selected(self, ids) -> None:
        """Outline the rows of the selected activities (heavy black frame)."""
        self.selected = set(ids)
        rs = [r for r in self.rects if r.bar.act_id in self.selected]
        self.outline.setOpts(x0=[r.x0 for r in rs], x1=[r.x1 for r in rs], y=[r.y for r in rs],
                             height=0.86, brush=QColor(style.SELECTION),
                             pen=pg.mkPen(style.TEXT, width=style.SCREEN.critical_outline))

    def _draw_labels(self) -> None:
        item = self.getPlotItem()
        for text in self.texts:
            item.removeItem(text)
        self.texts = []
        colour = STALE if self.stale else style.TEXT
        for r in self.rects:
            value = r.bar.value
            shown = f"{value:+.2f}" if self.signed else f"{value:.2f}"
            if r.bar.is_folded:  # the folded row carries the largest value among the rest
                shown = f"each ≤ {abs(value):.2f}" if not self.signed else f"each |r| ≤ {abs(value):.2f}"
            text = pg.TextItem(shown, color=colour,
                               anchor=(0.0, 0.5) if value >= 0 else (1.0, 0.5))
            text.setFont(self._font)           # as large as the row labels (read from the back)
            text.setPos(r.x1 if value >= 0 else r.x0, r.y)
            item.addItem(text)
            self.texts.append(text)

    def row_at_scene(self, pos) -> int | None:
        point = self.getPlotItem().vb.mapSceneToView(pos)
        return fdr.row_at(self.bars, point.y())

    def tooltip_at(self, scene_pos) -> str:
        """The full text of the row under ``scene_pos`` (labels on the axis may be cut)."""
        row = self.row_at_scene(scene_pos)
        if row is None:
            return ""
        bar = self.bars[row]
        if bar.is_folded:
            measure = "|correlation|" if self.signed else "criticality"
            return f"{bar.folded} other activities, {measure} {abs(bar.value):.2f} or less each"
        what = "correlation with the finish" if self.signed else "share of iterations critical"
        value = f"{bar.value:+.2f}" if self.signed else f"{bar.value:.2f}"
        return f"{bar.label}\n{what}: {value}\nClick to select it in every view."

    def _hovered(self, scene_pos) -> None:
        text = self.tooltip_at(scene_pos)
        if text:
            QToolTip.showText(QCursor.pos(), text, self)
        else:
            QToolTip.hideText()

    def _clicked(self, event) -> None:
        row = self.row_at_scene(event.scenePos())
        if row is not None and not self.bars[row].is_folded:
            self.activity_clicked.emit(self.bars[row].act_id)


def _elide(label: str, most: int = 42) -> str:
    """Long activity names shortened so the axis never drops a label for lack of room."""
    return label if len(label) <= most else label[: most - 1].rstrip() + "…"
