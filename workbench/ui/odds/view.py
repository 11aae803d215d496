"""The Odds view: what are the chances we finish by the promised date, and which date
can we promise at 90 %? PERT curve and Monte Carlo results on one date axis.

All numbers come from ``workbench.core`` (analysis, simulation) through the geometry in
``workbench.figures.odds``; this file only wires widgets together.
"""

from __future__ import annotations

from PySide6.QtCore import QCoreApplication, Qt
from PySide6.QtWidgets import QHBoxLayout, QLabel, QScrollArea, QSplitter, QVBoxLayout, QWidget

from workbench.core import formatting as fm
from workbench.figures import odds as fo
from workbench.ui.crew_odds import CrewOddsPanel
from workbench.figures import style as fstyle
from workbench.ui.odds.controls import OddsControls
from workbench.ui.odds.panel import OddsPanel
from workbench.ui.odds.plot import OddsPlot
from workbench.ui.odds.plot_labels import shorter
from workbench.ui.odds.living import record_run, show_trend, status_note
from workbench.ui import workers
from workbench.ui.odds.runner import OddsRunner
from workbench.ui.odds.trend_plot import TrendPlot
from workbench.ui.session import WhenShown, take_simulation


EMPTY_PLAN = "No activities yet: add some, or open or import a plan, to see the odds of finishing."
STACK_BELOW_PX = 820        # narrower than this (and tall enough), the panel goes under the curves
STACK_MIN_HEIGHT_PX = 700
NARROW_PANEL_PX = 380       # a side panel narrower than this words its table shorter
KEY = ("<b>&#9473;</b>&nbsp;PERT &nbsp; <span style='color:%s'><b>&#9473;</b></span>&nbsp;Simulation<br>"
       "<span style='color:%s'>&#9632;</span>&nbsp;PERT&nbsp;answer &nbsp; "
       "<span style='color:%s'>&#9632;</span>&nbsp;simulation&nbsp;answer") % (fstyle.WORK, fstyle.PROBABILITY, fstyle.CRITICAL)


class OddsView(QWidget):
    """Finish-time odds for the session's plan (see module doc)."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.mode = "by"
        self.dates: list[float | None] = [None, None]
        self.confidence = float(session.plan.settings.target_confidence)
        self._target_seen = self.confidence
        self.result = None        # the simulation shown (current or stale)
        self.sim_fig = None
        self.stale = False
        self._generation = 0      # counts plan changes, to spot runs overtaken by edits
        self._run_generation = -1
        self._deadline_seen = object()
        self._offset_rows, self._answer_dates = [], []
        self.when_shown = WhenShown(self)   # while hidden, redraws wait until it is shown
        self._build()
        self._connect()
        self.result = session.simulation   # a view opened after a run shows it at once
        self._follow_run()
        self.when_shown.call(self.refresh)

    # --- construction ----------------------------------------------------
    def _build(self) -> None:
        self.plot = OddsPlot(self)
        self.panel = OddsPanel(self)
        self.controls = OddsControls(self)
        self.panel.controls_slot.addWidget(self.controls)
        self.crews = CrewOddsPanel(self.session, table=False)   # the Resources view's run too
        self.crews.caution.setText("With the crews, every iteration works them in the levelled order "
                                   "(a fixed priority policy); the caution below holds for both.")
        self.crews.shared.changed.connect(self.update_question)   # the headline's third column
        self.panel.crews_slot.addWidget(self.crews)
        self.runner = OddsRunner(self)
        side = QScrollArea()
        side.setWidget(self.panel)
        side.setWidgetResizable(True)
        side.setMinimumWidth(220)
        self.trend = TrendPlot(self)
        self._trend_slot = lambda: show_trend(self)     # one slot, so a hidden view draws it once
        self.charts = QSplitter(Qt.Vertical)
        self.charts.addWidget(self._with_key(self.plot))
        self.charts.addWidget(self.trend)
        self.charts.setStretchFactor(0, 3)
        self.charts.setStretchFactor(1, 2)
        self.splitter = QSplitter(Qt.Horizontal)
        self.splitter.addWidget(self.charts)
        self.splitter.addWidget(side)
        self.splitter.setStretchFactor(0, 1)
        self.splitter.setStretchFactor(1, 0)
        self.splitter.setChildrenCollapsible(False)
        self._user_split = False
        self.splitter.splitterMoved.connect(lambda *_: setattr(self, "_user_split", True))
        lay = QHBoxLayout(self)
        lay.setContentsMargins(2, 2, 2, 2)
        lay.addWidget(self.splitter)

    def _with_key(self, plot: OddsPlot) -> QWidget:
        """The curves with a key under them, shown when a plot too small for its legend
        hides it (the key then says which line is which)."""
        box = QWidget()
        lay = QVBoxLayout(box)
        lay.setContentsMargins(0, 0, 0, 0)
        lay.setSpacing(0)
        lay.addWidget(plot, 1)
        self.key = QLabel(KEY)
        self.key.setWordWrap(True)
        self.key.setTextFormat(Qt.RichText)
        self.key.setAccessibleName("Key to the curves")
        self.key.setStyleSheet("font-size: 9pt;")
        self.key.setVisible(False)
        lay.addWidget(self.key)
        plot.legends_shown.connect(lambda shown: self.key.setVisible(not shown))
        return box

    def _connect(self) -> None:
        s = self.session
        s.schedule_changed.connect(self._on_schedule_changed)
        s.simulation_changed.connect(self._on_simulation_changed)
        self.plot.marker_moved.connect(self._on_marker_moved)
        self.plot.marker_released.connect(self._snap_markers)
        self.panel.mode_changed.connect(self.set_mode)
        self.panel.confidence_requested.connect(self.ask_confidence)
        self.controls.run_requested.connect(self.run_simulation)
        self.controls.stop_requested.connect(self.runner.stop)
        app = QCoreApplication.instance()
        if app is not None:  # quitting must not wait for a long run to finish
            app.aboutToQuit.connect(self.runner.stop)
        self.runner.running_changed.connect(self.controls.set_running)
        self.runner.progress.connect(self.controls.set_progress)
        self.runner.finished.connect(self._on_run_finished)
        self.runner.cancelled.connect(self._on_run_cancelled)
        self.runner.failed.connect(self._on_run_failed)

    # --- plan and simulation changes -------------------------------------
    @property
    def analysis(self):
        return self.session.analysis

    def _on_schedule_changed(self) -> None:
        self._generation += 1
        self.when_shown.call(self.refresh)

    def _on_simulation_changed(self) -> None:
        self.when_shown.call(self._trend_slot)
        take_simulation(self)
        self._follow_run()
        self.when_shown.call(self._show_simulation)

    def _follow_run(self) -> None:
        """The run boxes show what produced the result on screen (so Run repeats it)."""
        r = self.session.simulation
        if r is not None:
            self.controls.follow(getattr(r, "iterations", 0), getattr(r, "seed", None))

    def refresh(self) -> None:
        """Redraw everything from the session's analysis."""
        a = self.analysis
        empty = a is not None and len(a.plan) == 0
        self.panel.error.setVisible(a is None or empty)
        self.plot.setEnabled(a is not None and not empty)
        if a is None or empty:
            self.panel.error.setText(EMPTY_PLAN if empty else
                                     f"No odds while the plan cannot be scheduled: {self.session.analysis_error}")
            for label in (self.panel.headline, self.panel.readout, self.panel.sim_readout):
                label.setText("")   # nothing of an earlier plan, and no "Chance 100 %" for nothing
            self.panel.set_table([])
            return
        self.panel.crews_box.setVisible(bool(a.plan.resources))
        self.plot.set_calendar(a.calendar)
        show_trend(self)
        self._follow_target(a)
        self._default_dates(a)
        self._show_simulation()

    def _follow_target(self, a) -> None:
        """The inverse question starts from the plan's target confidence, and follows it
        when the plan's target changes (its settings, or another plan loaded)."""
        target = float(a.plan.settings.target_confidence)
        if target != self._target_seen:
            self._target_seen = self.confidence = target

    def _default_dates(self, a) -> None:
        """Open on the deadline (or the PERT mean); start again when the deadline changes
        or the question's date falls outside the new curve (another plan was loaded)."""
        lo, hi = fo.axis_span(a.pert, None, (a.deadline,))
        d1 = self.dates[0]
        if self._deadline_seen != a.deadline or d1 is None or not lo <= d1 <= hi:
            self._deadline_seen = a.deadline
            self.dates[0] = a.deadline if a.deadline is not None else fo.day_end(a.calendar, a.pert.mean)
            self.dates[1] = self.dates[0] + max(1.0, fo.snap_offset(a.calendar, 1.5 * a.pert.sd))

    def _span(self) -> tuple[float, float]:
        return fo.axis_span(self.analysis.pert, self.result, self.dates)

    def _show_simulation(self) -> None:
        if self.analysis is None:
            return
        a, r = self.analysis, self.result
        span = self._span()
        self.curve = fo.pert_curve(a.pert, *span)
        self.plot.show_pert(self.curve)
        self.plot.set_span(*span)
        self.sim_fig = fo.sim_figure(r) if r is not None else None
        self._offset_rows = fo.offset_rows(a.pert, r) if r is not None else []
        unit = a.plan.settings.unit
        note = fo.merge_bias_note(a.pert, r, unit) if r is not None else "Run a simulation to compare PERT with it."
        if r is not None and getattr(r, "correlation_repaired", False):
            note += f"\nCorrelations adjusted to the nearest consistent set: {r.correlation_note}"
        self.panel.merge_note.setText(note)
        self.plot.show_sim(self.sim_fig, self.stale)
        self.plot.fit_y(self.sim_fig is not None)
        self.panel.compare_box.setEnabled(self.result is not None and not self.stale)
        self._sim_status()
        self.show_confidence()
        self.update_question()

    def _sim_status(self) -> None:
        r = self.result
        if r is None:
            self.controls.set_status("No simulation yet: press Run to compare PERT with a Monte Carlo run.")
            self.controls.set_done(False)
        elif self.stale:
            self.controls.set_status("Stale: the plan changed since this run (shown in grey). Run again.", True)
            self.controls.set_done(False)
        else:
            self.controls.set_status(f"{len(r.finish):,} iterations, seed {getattr(r, 'seed', None)}.")
            self.controls.set_done(True)

    # --- the question ------------------------------------------------------
    def set_mode(self, mode: str) -> None:
        self.mode = fo.Question(mode, 0.0, 0.0).validated().mode
        index = self.panel.mode.findData(mode)
        if self.panel.mode.currentIndex() != index:
            self.panel.mode.setCurrentIndex(index)
        self.update_question()

    def question(self) -> fo.Question:
        return fo.Question(self.mode, self.dates[0], self.dates[1])

    def _read_markers(self) -> None:
        cal = self.analysis.calendar
        for i, line in enumerate(self.plot.markers):
            if line.isVisible() or i == 0:
                self.dates[i] = fo.snap_offset(cal, float(line.value()))

    def _on_marker_moved(self) -> None:
        if self.analysis is not None:
            self._read_markers()
            self.update_question()

    def _snap_markers(self) -> None:
        self._on_marker_moved()

    def update_question(self) -> None:
        """Shade and read out the current question (called on every marker move)."""
        a = self.analysis
        if a is None:
            return
        q = self.question()
        lo, hi = self._span()
        self.plot.set_markers(q.mode, (q.d1, q.d2), self._marker_labels(q))
        self.plot.show_shade(self.plot.pert_shade, fo.pert_shade(a.pert, q, lo, hi))
        live = self.sim_fig is not None and not self.stale
        self.plot.show_shade(self.plot.sim_shade, fo.sim_shade(self.sim_fig, q) if live else None)
        unit = a.plan.settings.unit
        self.panel.readout.setText("<br>".join(fo.readout_lines(a.pert, q, a.calendar, unit)))
        self._sim_readout(q)
        if self.result is not None:
            rows = self._offset_rows + [fo.question_row(a.pert, self.result, q)]
            self.panel.set_table(fo.comparison_cells(rows, a.calendar, unit), unit)
        else:
            self.panel.set_table([])
        self._headline(q)

    def _marker_labels(self, q: fo.Question) -> tuple[str, str]:
        cal = self.analysis.calendar
        first = {"by": "by ", "after": "after ", "between": "after "}[q.mode]
        texts = [first + fo.format_date(fo.date_of(cal, q.d1))]
        texts.append("by " + fo.format_date(fo.date_of(cal, q.d2)) if q.d2 is not None else "")
        if q.mode == "between" and q.d1 > q.d2:
            texts = ["by " + texts[0].split(" ", 1)[1], "after " + texts[1].split(" ", 1)[1]]
        return texts[0], texts[1]

    def _sim_readout(self, q: fo.Question) -> None:
        if self.result is None:
            self.panel.sim_readout.setText("Simulation: not run yet.")
            return
        p, err = fo.sim_answer(self.result, q)
        stale = "  (stale: plan changed)" if self.stale else ""
        self.panel.sim_readout.setText(
            f"Simulation probability: {fo.format_probability(p)} (± {fm.format_number(err * 100)} points){stale}")
        self.panel.sim_readout.setEnabled(not self.stale)

    def _headline(self, q: fo.Question) -> None:
        """The question and both answers as a small table: readable at a glance."""
        a = self.analysis
        rows = [("Chance", fm.format_chance(fo.pert_probability(a.pert, q)), self._sim_percent(q))]
        rows += [(f"{p} date", d_pert, d_sim) for p, d_pert, d_sim in self._answer_dates]
        narrow = self.panel.width() < NARROW_PANEL_PX     # a small dock: dates without weekday and year
        heads = ["", "PERT", "Sim." if narrow else "Simulation"]
        crews = self.crews.paired_with(self.result) if self.result is not None and not self.stale else None
        if crews is not None:           # the same run's durations with the crews holding work back
            heads[2] = "Logic" if narrow else "Logic only"
            heads.append("Crews" if narrow else "With the crews")
            extra = [fm.format_chance(fo.sim_probability(crews, q))]
            extra += [fo.format_date(fo.date_of(a.calendar, fo.sim_offset_at(crews, p)))
                      for p in dict.fromkeys((self.confidence, 0.9))]      # as show_confidence asks
            rows = [row + (x,) for row, x in zip(rows, extra)]
        if narrow:
            rows = [(row[0], *(shorter(c) for c in row[1:])) for row in rows]
        cells = "".join("<tr>" + "".join(f"<td>{c}</td>" for c in row) + "</tr>" for row in rows)
        head = "".join(f"<td><u>{h}</u></td>" if h else "<td></td>" for h in heads)
        self.panel.headline.setText(
            f"{status_note(a)}{fo.question_headline(q, a.calendar, a.deadline)}"
            f"<table cellspacing='0' cellpadding='{2 if narrow else 3}' style='font-size:{10 if narrow else 12}pt'>"
            f"<tr>{head}</tr>{cells}</table>")

    def _sim_percent(self, q) -> str:
        if self.result is None:
            return "not run"
        return "stale" if self.stale else fm.format_chance(fo.sim_probability(self.result, q))

    def _dates_at(self, p: float) -> tuple[str, str, str]:
        """Headline texts for a confidence: (percentage, PERT date, simulation date)."""
        cal = self.analysis.calendar
        d_pert = fo.format_date(fo.date_of(cal, fo.pert_offset_at(self.analysis.pert, p)))
        if self.result is None:
            d_sim = "not run"
        elif self.stale:
            d_sim = "stale"
        else:
            d_sim = fo.format_date(fo.date_of(cal, fo.sim_offset_at(self.result, p)))
        return f"{100 * p:g} %", d_pert, d_sim

    # --- the inverse question -----------------------------------------------
    def ask_confidence(self, text: str) -> None:
        """A preset or typed confidence → the date reached with it, marked on the S-curve."""
        try:
            self.confidence = fo.parse_confidence(text)
        except ValueError as exc:
            self.panel.error.setText(str(exc))
            self.panel.error.setVisible(True)
            return
        self.panel.error.setVisible(False)
        self.show_confidence()
        self.update_question()

    def show_confidence(self) -> None:
        a = self.analysis
        if a is None:
            return
        p = self.confidence
        self.panel.mark_preset(p)
        pert_x = fo.pert_offset_at(a.pert, p)
        live = self.result is not None and not self.stale
        sim_x = fo.sim_offset_at(self.result, p) if live else None
        pct = f"{100 * p:g} %"
        labels = (f"PERT {pct}: {fo.format_date(fo.date_of(a.calendar, pert_x))}",
                  f"Simulation {pct}: {fo.format_date(fo.date_of(a.calendar, sim_x))}" if live else "")
        self.plot.set_answers(p, pert_x, sim_x, labels, fo.curve_height(self.curve, pert_x))
        self._answer_dates = [self._dates_at(q) for q in dict.fromkeys((p, 0.9))]
        lines = [f"<b>{pct}</b> — PERT: {labels[0].split(': ', 1)[1]}"]
        if live:
            lines.append(f"Simulation: {labels[1].split(': ', 1)[1]}")
        self.panel.inverse.setText("<br>".join(lines))

    # --- simulation ---------------------------------------------------------
    def run_simulation(self, iterations: int, seed) -> None:
        if self.analysis is None:
            self.controls.set_status("Cannot simulate: the plan cannot be scheduled.", True)
            return
        self._run_generation = self._generation
        self.runner.start(self.session.plan, iterations, seed)

    def _on_run_finished(self, result) -> None:
        if self._run_generation != self._generation:
            self.result, self.stale = result, True   # overtaken by an edit: show, but stale
            self.when_shown.call(self._show_simulation)
            return
        record_run(self.session, result)        # first: the redraw below shows the new point
        self.session.set_simulation(result)

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        # narrow and tall (a dock at the side): the panel goes under the curves, which then
        # keep the whole width; otherwise beside them
        stacked = self.width() < STACK_BELOW_PX and self.height() >= STACK_MIN_HEIGHT_PX
        orientation = Qt.Orientation.Vertical if stacked else Qt.Orientation.Horizontal
        if self.splitter.orientation() != orientation:
            self.splitter.setOrientation(orientation)
            self._user_split = False
        if not self._user_split:  # the panel takes ~30 % (400–600 px) until the user drags
            length = self.height() if stacked else self.width()
            narrow = self.width() < STACK_BELOW_PX   # a small dock: the panel scrolls, the curves keep half
            least = 300 if stacked else (220 if narrow else 400)
            side = max(least, min(600, int((0.45 if stacked or narrow else 0.3) * length)))
            self.splitter.setSizes([max(1, length - side), side])
        narrow = self.panel.width() < NARROW_PANEL_PX
        if narrow != getattr(self, "_narrow", None) and self.analysis is not None and self.dates[0] is not None:
            self._narrow = narrow
            self.update_question()          # the headline worded for the panel's width

    def _on_run_cancelled(self) -> None:
        self.controls.set_done(False)
        self.controls.set_status("Stopped: no results kept from that run.")

    def _on_run_failed(self, message: str) -> None:
        self.controls.set_done(False)
        self.controls.set_status(f"Simulation failed: {message}", True)

    def closeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        self.crews.stop()
        self.runner.abandon()                       # its result, if any, is dropped
        self.runner.wait(int(workers.CLOSE_WAIT_S * 1000))   # bounded: the run stops at its next block
        super().closeEvent(event)
