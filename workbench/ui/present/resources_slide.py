"""The Resources slide of Present mode (plans with resources): what levelling does to the
finish in one sentence, and the loading of up to four resources — the most over-allocated
first — on the logic-only dates (filled, over-allocation hatched) and the levelled dates
(black line) against the units available (dashed). The approval pack's painter draws it
at projector size; the pack has every resource."""

from __future__ import annotations

from workbench.core.levelling import level
from workbench.core.loading import plan_loading
from workbench.reports import styles
from workbench.reports.text import wrap_words
from workbench.reports.resource_pages import paint_grid, summary_text

from workbench.ui.present.chart_slide import PresentChartSlide

SHOWN = 4


def has_resources(plan) -> bool:
    return bool(plan.resources)


def most_over_first(early, levelled) -> list:
    """(logic-only, levelled) loading pairs, the most over-allocated resource first
    (units over × time over), ties in the plan's order."""
    def excess(loading):
        return sum((b - a) * (used - avail) for a, b, used, avail in loading.over)
    pairs = list(zip(early, levelled))
    order = sorted(range(len(pairs)), key=lambda k: (-excess(pairs[k][0]), k))
    return [pairs[k] for k in order]


class PresentResourcesSlide(PresentChartSlide):
    def __init__(self, session, parent=None):
        super().__init__(session, self._paint_slide, parent)
        self._cache = None              # (analysis, levelling result, pairs)

    def levelled(self):
        """The levelling of the session's current schedule (worked out once per schedule)."""
        analysis = self.session.analysis
        if self._cache is None or self._cache[0] is not analysis:
            result = level(self.session.plan, analysis=analysis)
            pairs = most_over_first(plan_loading(analysis), plan_loading(analysis, result.starts))
            self._cache = (analysis, result, pairs)
        return self._cache[1], self._cache[2]

    def _paint_slide(self, c, ctx, w: float, h: float) -> None:
        result, pairs = self.levelled()
        c.setFillColor(styles.TEXT)
        c.setFont(styles.FONT, 8.5)
        text = summary_text(ctx, result)
        lines = wrap_words(c, text, w, styles.FONT, 8.5)
        for k, line in enumerate(lines):
            c.drawString(0, h - 9 - 11 * k, line)
        top = h - 14 - 11 * len(lines)
        shown = pairs[:SHOWN]
        note = (f"{len(shown)} of {len(pairs)} resources shown, the most over-allocated first; "
                "the approval pack has every one.") if len(pairs) > SHOWN else ""
        bottom = 12 if note else 0
        c.saveState()
        c.translate(0, bottom)
        paint_grid(c, w, top - bottom, shown, result.finish, ctx.analysis.calendar)
        c.restoreState()
        if note:
            c.setFillColor(styles.MUTED)
            c.setFont(styles.FONT, 7.5)
            c.drawString(0, 1, note)

