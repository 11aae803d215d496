"""The Odds slide of Present mode: the pack's Odds chart, large, with a date marker that
can be dragged with the mouse (or moved with [ and ]) while the probabilities follow."""

from __future__ import annotations

from PySide6.QtCore import QPointF, Qt

from workbench.figures import odds as og
from workbench.reports.odds_pages import question as default_question
from workbench.reports.odds_paint import OddsPainter

from workbench.ui.present.chart_slide import PresentChartSlide, session_context


class PresentOddsSlide(PresentChartSlide):
    """Holds the question's date; a press or drag on the chart moves it there."""

    present_hint = "drag the date line, or [ and ]"
    present_caution = og.CAUTION

    def __init__(self, session, parent=None):
        super().__init__(session, self._paint_odds, parent)
        self.d1: float | None = None
        self._dragging = False
        session.schedule_changed.connect(self._reset)
        self.setCursor(Qt.CursorShape.SizeHorCursor)

    def _reset(self) -> None:
        self.d1 = None

    def question(self, ctx) -> og.Question:
        return default_question(ctx) if self.d1 is None else og.Question("by", self.d1)

    def probability(self) -> float | None:
        """The PERT probability shown for the current marker (None while unschedulable)."""
        ctx = session_context(self.session)
        return None if ctx is None else og.pert_probability(ctx.analysis.pert, self.question(ctx))

    def _paint_odds(self, canvas, ctx, w, h) -> None:
        OddsPainter(ctx, self.question(ctx)).paint(canvas, w, h)

    def move_marker_to(self, x_pixels: float) -> None:
        """Put the marker under a widget x position, snapped to the end of a working day."""
        ctx = session_context(self.session)
        if ctx is None:
            return
        lx, _ = self.to_logical(QPointF(x_pixels, 0.0))
        offset = OddsPainter(ctx, self.question(ctx)).offset_at(lx, self.logical[0])
        self.d1 = max(0.0, og.day_end(ctx.analysis.calendar, offset))
        self.update()

    def step_marker(self, days: int) -> None:
        ctx = session_context(self.session)
        if ctx is None:
            return
        per = ctx.analysis.calendar.per_unit or 1
        self.d1 = max(0.0, self.question(ctx).d1 + days / per)
        self.update()

    def mousePressEvent(self, event):  # noqa: N802 (Qt override)
        if event.button() == Qt.MouseButton.LeftButton:
            self._dragging = True
            self.move_marker_to(event.position().x())

    def mouseMoveEvent(self, event):  # noqa: N802
        if self._dragging:
            self.move_marker_to(event.position().x())

    def mouseReleaseEvent(self, event):  # noqa: N802
        self._dragging = False

    def keyPressEvent(self, event):  # noqa: N802
        steps = {Qt.Key.Key_BracketLeft: -1, Qt.Key.Key_BracketRight: 1}
        if event.key() in steps:
            self.step_marker(steps[event.key()])
        else:
            super().keyPressEvent(event)
