"""Where the Trade-off view's parts sit, by the view's width.

Wide (a large screen, a window of its own): the two charts side by side above the option
panel and the crash table, the status beside the controls. Narrow (a dock on a 1024×768
projector): one page at a time behind tabs — the two charts and what to buy — the status
under the controls, the option panel above the table and the curve's legend under its
chart, so nothing is cut and nothing needs sideways scrolling. The view switches whenever
its width crosses the width the two charts need side by side, or its height the height
they need above the table."""

from __future__ import annotations

from dataclasses import dataclass

import pyqtgraph as pg
from PySide6.QtGui import QFont, QFontMetrics
from PySide6.QtWidgets import (QBoxLayout, QComboBox, QHBoxLayout, QLabel, QTabBar, QVBoxLayout,
                               QWidget)

from workbench.ui.wrap_fit import WrapHeight

PAGES = ("Cost by date", "Cost vs chance", "What to buy")
SHARES = (3, 2)        # the curve's and the chance chart's shares of the width, side by side
TITLE_SIZE = 13        # points: the charts' titles
BESIDE_TITLE = 130     # pixels a chart needs beside its title: the cost axis, its label, margins
CHART_HEIGHT = 170     # the least height a chart reads at (a dock scrolls below it)
TABLE_HEIGHT = 110     # the crash table: its heading and a few rows
WIDE_HEIGHT = 560      # below it, side by side the charts would be too short to read above the table
COMBO_FRAME = 40       # an option list's arrow and frame beside its words
LEGEND_ROOM = 300      # a curve chart less tall has its legend in a row under it, not over the curves


@dataclass
class Parts:
    """The view's widgets that the arrangement places."""

    controls: list
    progress: QWidget
    status: QLabel
    curve: pg.PlotWidget
    chance: pg.PlotWidget
    costs: QWidget
    choice: list
    table: QWidget
    caution: QLabel


def wide_width(titles) -> int:
    """The narrowest width at which both charts, side by side, show their whole titles."""
    font = QFont()
    font.setPointSize(TITLE_SIZE)
    metrics = QFontMetrics(font)
    total = sum(SHARES)
    return max((metrics.horizontalAdvance(t) + BESIDE_TITLE) * total // share for t, share in zip(titles, SHARES))


class Arrangement:
    """Builds the view's layout from its parts and switches it between wide and narrow."""

    def __init__(self, view: QWidget, parts: Parts, titles):
        self.view, self.parts, self.narrow = view, parts, False
        self.threshold = wide_width(titles)
        self.tabs = QTabBar()
        for name in PAGES:
            self.tabs.addTab(name)
        self.tabs.setExpanding(False)
        self.tabs.setVisible(False)
        self.tabs.currentChanged.connect(self._show_page)
        self.strip = pg.LegendItem(colCount=4, labelTextSize="11pt", labelTextColor="#000000", frame=False)
        self.strip.setVisible(False)
        self.strip_placed = False
        self._build()
        parts.curve.getPlotItem().vb.sigResized.connect(self.fit_legend)
        self.wraps = WrapHeight([parts.status, parts.caution] + [w for w in parts.choice if isinstance(w, QLabel)],
                                view)
        self.set_narrow(False)

    def _build(self) -> None:
        p = self.parts
        self.bar = QWidget()
        controls = QHBoxLayout(self.bar)
        controls.setContentsMargins(0, 0, 0, 0)
        for w in p.controls:
            controls.addWidget(w)
        controls.addStretch(1)
        self.head = QBoxLayout(QBoxLayout.Direction.LeftToRight)
        self.head.addWidget(self.bar)
        self.head.addWidget(p.progress)
        self.head.addWidget(p.status, 1)
        self.odds_page = QWidget()       # the chance chart, and the search's controls when one page at a time
        QVBoxLayout(self.odds_page).setContentsMargins(0, 0, 0, 0)
        self.odds_page.layout().addWidget(p.chance)
        charts = QHBoxLayout()
        charts.addWidget(p.curve, SHARES[0])
        charts.addWidget(self.odds_page, SHARES[1])
        self.buy = QWidget()
        self.body = QVBoxLayout()
        self.body.setSpacing(0)
        self.body.addWidget(self.tabs)
        self.body.addLayout(charts, 3)
        self.body.addWidget(self.buy, 2)
        self.outer = QVBoxLayout(self.view)
        self.outer.addLayout(self.head)
        self.outer.addLayout(self.body, 1)
        self.outer.addWidget(p.caution)
        self._build_buy()
        for chart in (p.curve, p.chance):
            chart.setMinimumHeight(CHART_HEIGHT)

    def _build_buy(self) -> None:
        """The option panel and the crash table: side by side when wide, one above the
        other when narrow (the panel then lays the plan's costs beside the option)."""
        p = self.parts
        choice = QVBoxLayout()
        for w in p.choice:
            choice.addWidget(w)
        choice.addStretch(1)
        self.side = QBoxLayout(QBoxLayout.Direction.TopToBottom)
        self.side.addWidget(p.costs)
        self.side.addLayout(choice, 1)
        self.row = QBoxLayout(QBoxLayout.Direction.LeftToRight, self.buy)
        self.row.setContentsMargins(0, 6, 0, 0)
        self.row.addLayout(self.side, 1)
        self.row.addWidget(p.table, 3)
        p.table.setMinimumHeight(TABLE_HEIGHT)

    # --- switching ----------------------------------------------------------------
    def fit(self, width: int, height: int) -> None:
        """One page at a time below the threshold's width or WIDE_HEIGHT, every part at once
        from there on (only a change re-lays the view); one page at a time, the plan's costs
        sit beside the option where the option's words fit whole."""
        narrow = width < self.threshold or height < WIDE_HEIGHT
        if narrow != self.narrow:
            self.set_narrow(narrow)
        combo = self._combo()
        least = 0 if narrow else self._option_words() + COMBO_FRAME     # wide: every option whole
        if combo.minimumWidth() != least:
            combo.setMinimumWidth(least)
        beside = narrow and width >= self._costs_beside_width()
        lr, tb = QBoxLayout.Direction.LeftToRight, QBoxLayout.Direction.TopToBottom
        if self.side.direction() != (lr if beside else tb):
            self.side.setDirection(lr if beside else tb)

    def _combo(self) -> QComboBox:
        return next(w for w in self.parts.choice if isinstance(w, QComboBox))

    def _option_words(self) -> int:
        """The width of the longest option's words in the option list."""
        combo = self._combo()
        texts = [combo.itemText(i) for i in range(combo.count())] or [""]
        return max(combo.fontMetrics().horizontalAdvance(t) for t in texts)

    def _costs_beside_width(self) -> int:
        """The width the option panel needs with the costs beside the option list, so the
        list shows its longest option whole."""
        return self.parts.costs.sizeHint().width() + self._option_words() + COMBO_FRAME + 50

    def set_narrow(self, narrow: bool) -> None:
        self.narrow = narrow
        lr, tb = QBoxLayout.Direction.LeftToRight, QBoxLayout.Direction.TopToBottom
        self.head.setDirection(tb if narrow else lr)
        self._place_controls(narrow)
        self.outer.removeWidget(self.parts.caution)     # narrow: under the status, in sight whatever scrolls
        self.outer.insertWidget(1 if narrow else self.outer.count(), self.parts.caution)
        self.row.setDirection(tb if narrow else lr)
        self.row.setStretch(0, 0 if narrow else 1)
        self.row.setStretch(1, 1 if narrow else 3)
        self.tabs.setVisible(narrow)
        self.fit_legend()
        self._show_page(self.tabs.currentIndex())
        self.wraps.fit_all()

    def _place_controls(self, narrow: bool) -> None:
        """The search's controls: beside the status when wide; one page at a time, above
        the chance chart, beside the hint that asks for them (the curve gets their room)."""
        home = self.odds_page.layout() if narrow else self.head
        if home.indexOf(self.bar) < 0:
            (self.head if narrow else self.odds_page.layout()).removeWidget(self.bar)
            home.insertWidget(0, self.bar)
            self.bar.show()

    def _show_page(self, index: int) -> None:
        """Narrow: only the chosen page; wide: every part."""
        p = self.parts
        for i, w in enumerate((p.curve, self.odds_page, self.buy)):
            w.setVisible(not self.narrow or i == index)
        self.body.setStretch(1, 3 if not self.narrow or index < 2 else 0)
        self.body.setStretch(2, 2 if not self.narrow or index == 2 else 0)

    def show_page(self, name: str) -> None:
        """Bring a page forward (narrow); wide, every page is on screen already."""
        self.tabs.setCurrentIndex(PAGES.index(name))

    def page_visible(self, name: str) -> bool:
        p = self.parts
        return (p.curve, self.odds_page, self.buy)[PAGES.index(name)].isVisible()

    # --- the curve's legend --------------------------------------------------------
    def fit_legend(self, *_) -> None:
        """The curve's legend in the chart's corner where the chart is tall enough for it to
        sit clear of the curves; otherwise (and always one page at a time) in one row under
        the chart. The strip's own height counts, so the choice does not flip back and forth."""
        height = self.parts.curve.getPlotItem().vb.height()
        if self.strip_placed:
            height += self.strip.height()
        self._place_legend(self.narrow or height < LEGEND_ROOM)

    def _place_legend(self, strip: bool) -> None:
        item = self.parts.curve.getPlotItem()
        if strip == self.strip_placed:
            return
        if strip:
            item.layout.addItem(self.strip, 4, 1)
        else:
            item.layout.removeItem(self.strip)
            if self.strip.scene() is not None:
                self.strip.scene().removeItem(self.strip)
        self.strip_placed = strip
        self.strip.setVisible(strip)
        if item.legend is not None:
            item.legend.setVisible(not strip)

    def refill_legend(self) -> None:
        """The strip lists what the chart's own legend lists (call after each drawing)."""
        self.strip.clear()
        legend = self.parts.curve.getPlotItem().legend
        for sample, label in ([] if legend is None else legend.items):
            self.strip.addItem(sample.item, label.text)
