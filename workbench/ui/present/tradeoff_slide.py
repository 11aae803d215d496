"""The Trade-off slide of Present mode (plans with cost data and a deadline): the board's
"what would it take?" — the cost of finishing by each date, the extra cost of each chance of
the deadline, one line per option, and the caution. The approval pack's page painter draws
it at projector size; the trade-off is worked out off the window thread the first time the
slide is shown (and again after an edit), as the pack works it out."""

from __future__ import annotations

from workbench.core.calendar import WorkCalendar
from workbench.core.crash_problem import has_cost_data
from workbench.core.formatting import format_whole_percent
from workbench.figures import tradeoff as ftr
from workbench.reports import styles
from workbench.reports.text import wrap_words
from workbench.reports.tradeoff_pages import CAUTION, ITERATIONS, TARGETS, paint_tradeoff

from workbench.ui.present.chart_slide import PresentChartSlide
from workbench.ui.tradeoff.runner import TradeoffRunner

def has_tradeoff(plan) -> bool:
    """Whether the plan gets a Trade-off slide (cost data and a deadline, as the pack's page)."""
    return has_cost_data(plan) and plan.settings.deadline is not None


def option_lines(result) -> list[str]:
    """One line per option, as a board reads them: what it costs and what it buys."""
    lines = []
    for p in ftr.chance_points(result):
        what = "crash the mean schedule to the deadline" if p.textbook else p.label
        lines.append(f"{what}: {p.extra_cost:,.0f} extra, chance {format_whole_percent(p.chance)}")
    return lines


class PresentTradeoffSlide(PresentChartSlide):
    def __init__(self, session, parent=None):
        super().__init__(session, self._paint_slide, parent)
        self.result, self.message = None, "Working out what each chance of the deadline costs…"
        self._stale = True
        self.runner = TradeoffRunner(self)
        self.runner.finished.connect(self._on_result)
        self.runner.failed.connect(self._on_failed)
        session.schedule_changed.connect(self._mark_stale)

    def _mark_stale(self, *_) -> None:
        self._stale = True
        if self.isVisible():
            self._start()

    def showEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().showEvent(event)
        if self._stale:
            self._start()

    def _start(self) -> None:
        self._stale = False
        plan = self.session.plan
        if not has_tradeoff(plan) or self.session.analysis is None:
            self.result, self.message = None, "This plan has no cost data or no deadline: no trade-off to show."
            self.update()
            return
        sim = self.session.simulation
        targets = sorted({*TARGETS, round(plan.settings.target_confidence, 4)})
        self.runner.start(plan, targets=targets, iterations=ITERATIONS, seed=sim.seed if sim is not None else 1)

    def _on_result(self, result) -> None:
        self.result = result
        self.update()

    def _on_failed(self, message: str) -> None:
        if message:
            self.result, self.message = None, f"The trade-off could not be worked out: {message}"
            self.update()

    def finish_work(self) -> None:
        """Wait for the trade-off (screenshots and tests)."""
        if self.runner.running:
            self.runner.wait(120_000)

    def stop_work(self) -> None:
        """Present mode is left: a run still going is abandoned (its result dropped)."""
        self.runner.abandon()

    def _paint_slide(self, c, ctx, w: float, h: float) -> None:
        if self.result is None:
            c.setFont(styles.FONT, 11)
            c.drawCentredString(w / 2, h / 2, self.message)
            return
        lines = option_lines(self.result)
        caution = wrap_words(c, CAUTION, w, styles.FONT, 7.5)
        chart_h = h - 22 - 13 * len(lines) - 9.5 * len(caution)
        c.saveState()
        c.translate(0, h - 4 - chart_h)
        paint_tradeoff(c, w, chart_h, self.result, WorkCalendar(ctx.settings))
        c.restoreState()
        c.setFillColor(styles.TEXT)
        c.setFont(styles.FONT, 10)
        y = h - 20 - chart_h
        for line in lines:
            c.drawString(0, y, line)
            y -= 13
        c.setFillColor(styles.MUTED)
        c.setFont(styles.FONT, 7.5)
        for k, part in enumerate(caution):
            c.drawString(0, 2 + 9.5 * (len(caution) - 1 - k), part)
