"""The Resources view: who is needed when (loading against availability, over-allocated
periods marked), levelling (what moved and what held it, kept as one undo step), and the
odds with the crews holding work back beside the logic-only odds."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtWidgets import (QComboBox, QFrame, QHBoxLayout, QLabel, QPushButton, QScrollArea, QSizePolicy,
                               QTableWidget, QTableWidgetItem, QTabWidget, QVBoxLayout, QWidget)

from workbench.core.formatting import format_date, format_duration
from workbench.core.levelling import keep_levelled, level
from workbench.core.loading import plan_loading
from workbench.figures import style
from workbench.figures.loading import loading_figure
from workbench.ui.date_axis import DateAxis
from workbench.ui.loading_plot import LEGEND, add_loading
from workbench.ui.crew_odds import CrewOddsPanel
from workbench.ui.session import refresh_when_shown

NO_RESOURCES = ("This plan has no resources. Give activities their crews, machines or rigs in a "
                "'resources' column (for example 'crew 2; crane 1') with a Resources sheet, or "
                "import with a resources file, to see loading and levelling here.")


class ResourcesView(QWidget):
    """Loading of one resource at a time, levelling, resource-aware odds."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.levelled = None           # the LevelResult of the current schedule, once asked for
        self.loads = []
        self._build()
        refresh_when_shown(self, self.refresh, session.schedule_changed)
        self.when_shown.call(self.refresh)

    # --- layout -------------------------------------------------------------
    def _build(self) -> None:
        """One row of controls, one line of what is wrong, then tabs (chart, what moved, odds):
        every part keeps a readable size in a small dock at 1024×768."""
        self.resource_box = QComboBox(accessibleName="Resource shown")
        self.resource_box.setSizeAdjustPolicy(QComboBox.SizeAdjustPolicy.AdjustToContents)
        self.resource_box.setSizePolicy(QSizePolicy.Policy.Minimum, QSizePolicy.Policy.Fixed)  # never cut a name
        self.resource_box.currentIndexChanged.connect(self._draw)
        self.dates_box = QComboBox(accessibleName="Dates shown")
        self.dates_box.addItems(["Logic-only dates", "Levelled dates"])
        self.dates_box.currentIndexChanged.connect(self._dates_changed)
        self.level_button = QPushButton("&Level", clicked=self.run_level)
        self.keep_button = QPushButton("&Keep levelled dates", clicked=self.keep, enabled=False)
        self.keep_button.setToolTip("Start-no-earlier constraints on the activities a resource held: one undo step")
        bar = QHBoxLayout()
        for w in (self.resource_box, self.dates_box):
            bar.addWidget(w)
        bar.addStretch(1)
        self.message = QLabel(wordWrap=True)
        status = QHBoxLayout()          # what is over-allocated, beside what to do about it
        status.addWidget(self.message, 1)
        status.addWidget(self.level_button)
        status.addWidget(self.keep_button)
        self.tabs = QTabWidget(documentMode=True)
        self.tabs.addTab(self._chart_page(), "Loading")
        self.moves = QTableWidget(0, 5)
        self.moves.setHorizontalHeaderLabels(["id", "name", "logic start", "levelled start", "held by"])
        self.moves.horizontalHeader().setStretchLastSection(True)
        self.moves.itemSelectionChanged.connect(self._select_moved)
        self.tabs.addTab(self.moves, "What levelling moved")
        self.odds = CrewOddsPanel(self.session)
        scroller = QScrollArea(widgetResizable=True, frameShape=QFrame.Shape.NoFrame)
        scroller.setWidget(self.odds)
        self.tabs.addTab(scroller, "Odds with the crews")
        layout = QVBoxLayout(self)
        layout.addLayout(bar)
        layout.addLayout(status)
        layout.addWidget(self.tabs, 1)

    def _chart_page(self) -> QWidget:
        self.chart_title = QLabel(wordWrap=True)
        font = self.chart_title.font()
        font.setPointSize(11)
        font.setBold(True)
        self.chart_title.setFont(font)
        self.chart_title.setStyleSheet(f"color: {style.TEXT};")
        self.legend = QLabel(LEGEND, wordWrap=True)
        self.legend.setStyleSheet(f"color: {style.TEXT};")
        self.axis = DateAxis()
        self.plot = pg.PlotWidget(axisItems={"bottom": self.axis}, background=style.BACKGROUND)
        self.plot.setMenuEnabled(False)
        self.plot.hideButtons()
        self.plot.setLabel("left", "units", color=style.TEXT)
        self.plot.setMinimumHeight(120)
        self.plot.getPlotItem().setContentsMargins(0, 8, 0, 0)     # room for the top unit label's upper half
        # no preferred height of its own: a dock's scroll frame would otherwise make the view
        # as tall as the chart would like (its word-wrapped labels ask for height-for-width)
        self.plot.setSizePolicy(QSizePolicy.Policy.Expanding, QSizePolicy.Policy.Ignored)
        font = self.plot.font()
        font.setPointSize(11)
        for side in ("left", "bottom"):
            self.plot.getAxis(side).setTickFont(font)
            self.plot.getAxis(side).setTextPen(pg.mkPen(style.TEXT))
        page = QWidget()
        lay = QVBoxLayout(page)
        lay.setContentsMargins(0, 4, 0, 0)
        lay.addWidget(self.chart_title)
        lay.addWidget(self.plot, 1)
        lay.addWidget(self.legend)
        return page

    # --- refresh -------------------------------------------------------------
    def refresh(self) -> None:
        """The schedule changed: new loading; an earlier levelling no longer applies."""
        self.levelled = None
        self.keep_button.setEnabled(False)
        self.moves.setRowCount(0)
        self.tabs.setTabEnabled(1, False)
        plan, analysis = self.session.plan, self.session.analysis
        has = bool(plan.resources) and analysis is not None
        for w in (self.resource_box, self.dates_box, self.level_button, self.keep_button, self.tabs):
            w.setVisible(has)
        if not has:
            self.message.setText(NO_RESOURCES if not plan.resources else "The plan cannot be scheduled: see the Activities table.")
            return
        names = [f"{r.name or r.id} ({r.id})" for r in plan.resources]
        if [self.resource_box.itemText(i) for i in range(self.resource_box.count())] != names:
            self.resource_box.blockSignals(True)
            self.resource_box.clear()
            self.resource_box.addItems(names)
            self.resource_box.blockSignals(False)
        self.dates_box.setCurrentIndex(0)
        self.axis.set_calendar(analysis.calendar)
        self._compute()
        self.message.setText(self._over_text())

    def _compute(self) -> None:
        analysis = self.session.analysis
        starts = self.levelled.starts if (self.levelled is not None and self.dates_box.currentIndex() == 1) else None
        self.loads = plan_loading(analysis, starts)
        self._draw()

    def _dates_changed(self) -> None:
        if self.dates_box.currentIndex() == 1 and self.levelled is None:
            self.run_level()
        else:
            self._compute()

    def _over_text(self) -> str:
        over = [l for l in self.loads if l.over]
        if not over:
            return "No resource is asked for more units than it has on these dates."
        parts = [f"{l.name or l.resource}: {len(l.over)} period{'s' if len(l.over) > 1 else ''}" for l in over]
        return "Over-allocated on the logic-only dates (shaded): " + "; ".join(parts) + ". Level to resolve."

    # --- drawing -------------------------------------------------------------
    def _draw(self) -> None:
        self.plot.clear()
        k = self.resource_box.currentIndex()
        if not self.loads or not 0 <= k < len(self.loads):
            return
        finish = self.session.analysis.schedule.finish
        if self.levelled is not None and self.dates_box.currentIndex() == 1:
            finish = self.levelled.finish
        fig = loading_figure(self.loads[k], until=finish)
        add_loading(self.plot, fig, line=2.0)
        self.plot.setYRange(0, fig.top, padding=0)
        self.plot.setXRange(float(fig.edges[0]), float(fig.edges[-1]), padding=0.02)
        self.chart_title.setText(fig.title)

    # --- levelling ---------------------------------------------------------------
    def run_level(self) -> None:
        from workbench.core.errors import PlanError

        try:
            self.levelled = level(self.session.plan, analysis=self.session.analysis)
        except PlanError as exc:
            self.message.setText(f"Cannot level: {exc}")
            return
        self.dates_box.blockSignals(True)
        self.dates_box.setCurrentIndex(1)
        self.dates_box.blockSignals(False)
        self._compute()
        self._show_moves()

    def _show_moves(self) -> None:
        r, cal, plan = self.levelled, self.session.analysis.calendar, self.session.plan
        held = sorted({m.held_by for m in r.moves if not m.held_by.startswith("after ")})
        self.message.setText(
            f"Levelled finish {format_date(cal.finish_date(r.finish))}: "
            + (f"{format_duration(r.delay, plan.settings.unit)} later than logic alone "
               f"({format_date(cal.finish_date(r.logic_finish))}). "
               if r.delay > 1e-9 else "no later than logic alone. ")
            + f"{len(r.moves)} activit{'y' if len(r.moves) == 1 else 'ies'} moved"
            + (f"; held by {', '.join(held)}." if held else "."))
        self.moves.setRowCount(len(r.moves))
        for row, m in enumerate(r.moves):
            cells = [m.id, plan.activity(m.id).name, format_date(cal.start_date(m.logic_start)),
                     format_date(cal.start_date(m.start)), m.held_by]
            for col, text in enumerate(cells):
                item = QTableWidgetItem(text)
                item.setFlags(item.flags() & ~Qt.ItemFlag.ItemIsEditable)
                self.moves.setItem(row, col, item)
        self.moves.resizeColumnsToContents()
        self.tabs.setTabEnabled(1, bool(r.moves))
        self.tabs.setTabText(1, f"What levelling moved ({len(r.moves)})")
        self.keep_button.setEnabled(any(not m.held_by.startswith("after ") for m in r.moves))

    def keep(self) -> None:
        """Make the levelled dates the plan's schedule: one undo step."""
        if self.levelled is not None:
            self.session.push(keep_levelled(self.session.plan, self.levelled))

    def _select_moved(self) -> None:
        rows = sorted({i.row() for i in self.moves.selectedItems()})
        if rows and self.levelled is not None:
            self.session.select([self.levelled.moves[r].id for r in rows])

    def peak_units(self) -> np.ndarray:
        return np.array([l.peak for l in self.loads])
