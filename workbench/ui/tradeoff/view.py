"""The Trade-off view: the cost–duration curve on the plan's dates, the confidence plans
as cost against chance, a table of what to crash, and Apply as one undo step."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtWidgets import (QComboBox, QLabel, QProgressBar, QPushButton, QSpinBox, QTableWidget,
                               QTableWidgetItem, QWidget)

from workbench.core.buy_time import BuyTimeCommand
from workbench.core.calendar import WorkCalendar
from workbench.core.crash_problem import has_cost_data
from workbench.core.formatting import format_day_month, format_number, format_percent, format_whole_percent
from workbench.figures import tradeoff as ftr
from workbench.ui.date_axis import DateAxis
from workbench.ui.session import refresh_when_shown
from workbench.ui.tradeoff.arrangement import Arrangement, Parts
from workbench.ui.tradeoff.charts import ChanceAxis, along, font_of, label_anchor, make_plot, room_range
from workbench.ui.tradeoff.cost_settings import CostSettings
from workbench.ui import workers
from workbench.ui.tradeoff.runner import TradeoffRunner

CAUTION = ("Caution: estimates are judgement; crash costs are quotes, not facts. Chances come from a "
           "simulation, not a promise; the decision rests with your organisation's own approval rules.")
FINISH_WAIT_MS = 120_000   # finish_work (screenshots, scripts) waits this long at most
CURVE_TITLE, CHANCE_TITLE = "Cost of finishing by each date", "Extra cost vs chance"
HINT = "Find confidence plans: what a 50, 80 or 90 % chance would cost"
NO_COSTS = ("No cost data in this plan. Give activities a cost, and a crash cost and crash estimate where they can "
            "be shortened: in the Activities table (right-click a heading to show the Cost, Crash cost and crash "
            "estimate columns) or in a spreadsheet.")


def _not_shortened(missing: dict) -> str:
    """A note on the activities given half their crash data (they are not shortened)."""
    if not missing:
        return ""
    names = ", ".join(f"{k} (no {what})" for k, what in list(missing.items())[:5])
    more = f" and {len(missing) - 5} more" if len(missing) > 5 else ""
    return f" Not shortened, crash data incomplete: {names}{more}."


class TradeoffView(QWidget):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session, self.result, self.options = session, None, []
        self.costs = CostSettings(session)
        self.runner = TradeoffRunner(self)
        self.runner.progress.connect(self._on_progress)
        self.runner.finished.connect(self._on_result)
        self.runner.failed.connect(self._on_failed)
        self._build()
        self.when_shown = refresh_when_shown(self, self.refresh, session.schedule_changed)
        self.refresh()

    def _build(self) -> None:
        self.status = QLabel()
        self.status.setWordWrap(True)
        self.iterations = QSpinBox()
        self.iterations.setRange(200, 20000)
        self.iterations.setSingleStep(500)
        self.iterations.setValue(2000)
        self.find = QPushButton("Find confidence plans")
        self.find.clicked.connect(self.search)
        self.cancel = QPushButton("Cancel")
        self.cancel.clicked.connect(self.runner.stop)
        self.progress = QProgressBar()
        self.progress.setVisible(False)
        self.axis = DateAxis()
        self.curve_plot = make_plot(CURVE_TITLE, "cost", "finish", self.axis, legend=(12, -50))
        self.chance_axis = ChanceAxis()
        self.chance_plot = make_plot(CHANCE_TITLE, "extra cost", "chance of the deadline (%)", self.chance_axis)
        self.chance_plot.getPlotItem().vb.sigResized.connect(self._fit_hint)
        for plot in (self.curve_plot, self.chance_plot):
            plot.getPlotItem().vb.sigResized.connect(self._fit_rooms)
        self.hint, self.rooms = None, {}
        caution = QLabel(CAUTION)
        caution.setWordWrap(True)
        parts = Parts(controls=[QLabel("Scenarios"), self.iterations, self.find, self.cancel],
                      progress=self.progress, status=self.status, curve=self.curve_plot, chance=self.chance_plot,
                      costs=self.costs, choice=self._choice(), table=self._table(), caution=caution)
        self.arrangement = Arrangement(self, parts, (CURVE_TITLE, CHANCE_TITLE))
        self._set_running(False)

    def _choice(self) -> list:
        self.option = QComboBox()
        self.option.setMinimumContentsLength(14)      # one page at a time: the list's width follows the page
        self.option.currentIndexChanged.connect(self._fill_table)
        self.apply = QPushButton("Apply as a scenario")
        self.apply.setToolTip("Replace the estimates of the activities listed by their crashed ones "
                              "(one step in the edit history: Undo takes it back)")
        self.apply.clicked.connect(self.apply_option)
        self.summary = QLabel()
        self.summary.setWordWrap(True)
        return [QLabel("Option"), self.option, self.summary, self.apply]

    def _table(self) -> QTableWidget:
        self.table = QTableWidget(0, 4)
        self.table.setHorizontalHeaderLabels(["id", "activity", "shortened by", "extra cost"])
        header = self.table.horizontalHeader()
        header.setSectionResizeMode(1, header.ResizeMode.Stretch)
        for column in (0, 2, 3):     # the figures' columns as wide as their words: the names get the rest
            header.setSectionResizeMode(column, header.ResizeMode.ResizeToContents)
        self.table.setEditTriggers(QTableWidget.EditTrigger.NoEditTriggers)
        self.table.setSelectionBehavior(QTableWidget.SelectionBehavior.SelectRows)
        self.table.itemSelectionChanged.connect(self._select_in_views)
        return self.table

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        self.arrangement.fit(event.size().width(), event.size().height())
        super().resizeEvent(event)

    def hasHeightForWidth(self) -> bool:  # noqa: N802 (Qt override)
        # the wrapped labels keep their own least heights (WrapHeight): a dock's scroller then
        # gives the view the dock's height down to the view's true minimum, then scrolls
        return False

    # --- running -------------------------------------------------------------
    def _kwargs(self, targets=()) -> dict:
        return {"targets": tuple(targets), "iterations": self.iterations.value(), "seed": 1}

    def refresh(self) -> None:
        """The curve and the crash to the deadline (fast); confidence plans on request."""
        self.costs.show_settings()
        if self.session.analysis is None:
            self.status.setText("The plan cannot be scheduled; fix it in the Activities table.")
            return
        if not has_cost_data(self.session.plan):
            self.runner.stop()
            self._on_failed("no cost data")
            return
        self.runner.start(self.session.plan, **self._kwargs())
        self._set_running(True)

    def search(self) -> None:
        target = self.session.plan.settings.target_confidence
        targets = sorted({0.5, 0.8, 0.9, round(target, 4)})
        self.runner.start(self.session.plan, **self._kwargs(targets))
        self._set_running(True)

    def _set_running(self, running: bool) -> None:
        self.find.setEnabled(not running and has_cost_data(self.session.plan))
        self.cancel.setEnabled(running)
        self.progress.setVisible(running)
        self.progress.setRange(0, 0)

    def _on_progress(self, done: int, total: int) -> None:
        self.progress.setRange(0, total)
        self.progress.setValue(done)

    def _on_failed(self, message: str) -> None:
        """A cancelled search keeps what was shown; a refusal clears it and says why."""
        self._set_running(False)
        if not message:
            self.status.setText("Search cancelled; nothing changed.")
            return
        self.status.setText(NO_COSTS if "no cost data" in message else message[:1].upper() + message[1:] + ".")
        self.result = None
        self._draw()

    def _on_result(self, result) -> None:
        self._set_running(False)
        self.result = result
        unit = self.session.plan.settings.unit
        o = result.optimum
        self.status.setText(f"Shortest reachable {result.curve.shortest:.1f} {unit}, all-normal "
                            f"{result.curve.normal:.1f}; total-cost optimum {o.duration:.1f} {unit}."
                            + (f" Confidence plans from {result.iterations:,} scenarios, checked on as many "
                               f"fresh ones (seed {result.seed})." if result.confidence else "")
                            + (" No deadline is set: give the plan one (Plan settings) to see the odds and "
                               "the confidence plans." if result.deadline is None else "")
                            + _not_shortened(result.problem.incomplete))
        self.find.setEnabled(result.deadline is not None)
        self._draw()

    def finish_work(self) -> None:
        """Wait for the worker and take its result (for screenshots and scripts)."""
        from PySide6.QtCore import QCoreApplication

        self.runner.wait(FINISH_WAIT_MS)
        QCoreApplication.processEvents()

    def closeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        self.runner.abandon()                       # its result, if any, is dropped
        self.runner.wait(int(workers.CLOSE_WAIT_S * 1000))   # bounded: the run stops at its next step
        super().closeEvent(event)

    # --- drawing -------------------------------------------------------------
    def _draw(self) -> None:
        for w in (self.curve_plot, self.chance_plot):
            w.clear()
        self.hint, self.rooms = None, {}
        self.options = []
        self.option.clear()
        if self.result is None:
            self.table.setRowCount(0)
            self.arrangement.refill_legend()
            return
        self.axis.set_calendar(WorkCalendar(self.session.plan.settings))
        self._draw_curve(ftr.curve_lines(self.result))
        self.arrangement.refill_legend()
        self._draw_chances(ftr.chance_points(self.result))
        self._list_options()

    def _draw_curve(self, lines) -> None:
        p = self.curve_plot
        for ys, colour, name, width in ((lines.direct, ftr.DIRECT, "direct", 3), (lines.indirect, ftr.INDIRECT, "indirect", 2),
                                        (lines.total, ftr.TOTAL, "total", 4)):
            style = pg.mkPen(colour, width=width)
            p.plot(lines.durations, ys, pen=style, symbol="o", symbolSize=6, symbolBrush=colour, name=name)
        x, y = lines.optimum
        p.plot([x], [y], pen=None, symbol="star", symbolSize=22, symbolBrush=ftr.OPTIMUM, name="least total cost")
        when = format_day_month(self.axis.calendar.finish_date(x))
        label = pg.TextItem(f"optimum {when}", color="#000000", anchor=(along(x, lines), 1.3))
        label.setFont(font_of(11))
        label.setPos(x, y)
        p.addItem(label)
        ys = np.concatenate([lines.direct, lines.indirect, lines.total])
        pad = 0.06 * (float(np.ptp(ys)) or max(abs(float(ys.max())), 1.0))
        self.rooms[p] = (float(ys.min()) - pad, float(ys.max()) + pad, (y, label), (float(ys.min()), 6.0))
        self._fit_rooms()
        if lines.deadline is not None:
            p.addItem(pg.InfiniteLine(lines.deadline, angle=90, pen=pg.mkPen(ftr.DEADLINE, width=3, style=pg.QtCore.Qt.PenStyle.DashLine),
                                      label="deadline", labelOpts={"color": ftr.DEADLINE, "position": 0.95}))

    def _fit_rooms(self, *_) -> None:
        """Each chart's cost range, with room above its topmost label and below its lowest
        marker at the chart's present height."""
        for plot, (lo, hi, (y, label), low) in self.rooms.items():
            vb = plot.getPlotItem().vb
            up = 1.3 * label.textItem.boundingRect().height() + 6
            vb.setYRange(*room_range(lo, hi, (y, up), low, vb.height()), padding=0)

    def _draw_chances(self, points) -> None:
        p = self.chance_plot
        target = self.session.plan.settings.target_confidence
        p.addItem(pg.InfiniteLine(100 * target, angle=90, pen=pg.mkPen(ftr.DEADLINE, width=2, style=pg.QtCore.Qt.PenStyle.DotLine),
                                  label=f"target {format_whole_percent(target)}", labelOpts={"color": ftr.DEADLINE, "position": 0.3}))
        top = None
        for pt in ftr.merged(points):
            symbol, colour = ("s", ftr.DEADLINE) if pt.textbook else ("o", ftr.CHANCE)
            x = 100 * pt.chance
            p.plot([x], [pt.extra_cost], pen=None, symbol=symbol, symbolSize=16,
                   symbolBrush=colour, symbolPen=pg.mkPen("#000000", width=1.5))
            bar = pg.ErrorBarItem(x=np.array([x]), y=np.array([pt.extra_cost]),
                                  width=np.array([200 * pt.standard_error]), pen=pg.mkPen("#000000", width=2))
            bar.setZValue(-1)      # under the marker: only a spread wider than the marker shows
            p.addItem(bar)
            anchor = label_anchor(x, pt.textbook)
            label = pg.TextItem(pt.short_label,
                                color="#000000", anchor=anchor)
            label.setFont(font_of(11))
            label.setPos(x, pt.extra_cost)
            p.addItem(label)
            top = (pt.extra_cost, label) if top is None or pt.extra_cost > top[0] else top
        p.setXRange(0, 100, padding=0.04)
        lo, hi = ftr.cost_span([q.extra_cost for q in points])
        p.setYRange(lo, hi, padding=0)
        if top is not None:
            self.rooms[p] = (lo, hi, top, (min(q.extra_cost for q in points), 12.0))   # half a marker, and a little
            self._fit_rooms()
        if not self.result.confidence:
            self.hint = pg.TextItem(HINT, color="#555555", anchor=(0.5, 0.5))
            self.hint.setFont(font_of(11))
            lo, hi = ftr.cost_span([q.extra_cost for q in points])
            self.hint.setPos(50, lo + 0.6 * (hi - lo))
            p.addItem(self.hint)
            self._fit_hint()

    def _fit_hint(self, *_) -> None:
        """The placeholder wraps inside the chart, whatever its width."""
        if self.hint is not None and self.hint.scene() is not None:
            width = self.chance_plot.getPlotItem().vb.width()
            self.hint.textItem.setTextWidth(max(80.0, 0.8 * width))
            self.hint.updateTextPos()

    # --- options -------------------------------------------------------------
    def _list_options(self) -> None:
        r = self.result
        if r.to_deadline is not None:
            d = r.to_deadline
            self.options.append(("Mean-schedule plan: crash the mean schedule to the deadline", d.point.days,
                                 d.point.direct_cost - r.problem.base_cost, d.chance, d.standard_error))
        for c in r.confidence:
            if c.reachable:
                self.options.append((f"{format_whole_percent(c.target)} chance of the deadline", c.days, c.extra_cost,
                                     c.chance_out_of_sample, c.standard_error))
        o = r.optimum
        self.options.append(("Total-cost optimum", o.days, o.direct_cost - r.problem.base_cost, None, None))
        for label, *_ in self.options:
            self.option.addItem(label)
        self.arrangement.fit(self.width(), self.height())      # the longest option may set where the costs go
        self._fill_table()

    def _fill_table(self) -> None:
        i = self.option.currentIndex()
        if not 0 <= i < len(self.options):
            self.table.setRowCount(0)
            return
        label, days, extra, chance, se = self.options[i]
        crashed = self.result.crashed(days)
        plan, slope = self.session.plan, dict(zip(self.result.problem.ids, self.result.problem.slope))
        self.table.setRowCount(len(crashed))
        for row, (act_id, x) in enumerate(crashed.items()):
            cells = [act_id, plan.activity(act_id).name, f"{x:.2f}", f"{slope[act_id] * x:,.0f}"]
            for col, text in enumerate(cells):
                self.table.setItem(row, col, QTableWidgetItem(text))
        odds = "" if chance is None else (f"; chance {format_percent(chance)} \u00b1 {format_number(se * 100)} points"
                                          " (fresh simulation)")
        nothing = "" if crashed else " Nothing to buy: the mean schedule already meets this."
        self.summary.setText(f"{extra:,.0f} extra{odds}.{nothing}")
        self.apply.setEnabled(bool(crashed))

    def _select_in_views(self) -> None:
        rows = sorted({i.row() for i in self.table.selectedItems()})
        ids = [self.table.item(r, 0).text() for r in rows if self.table.item(r, 0) is not None]
        if ids:
            self.session.select(ids)

    def apply_option(self) -> bool:
        i = self.option.currentIndex()
        if not 0 <= i < len(self.options):
            return False
        label, days, extra, chance, se = self.options[i]
        return self.session.push(BuyTimeCommand(self.result.crashed(days), label, extra, chance, se))
