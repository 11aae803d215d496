"""The first slide of Present mode: the few numbers a review asks for, in large type."""

from __future__ import annotations

from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QColor, QFont, QPainter, QPen
from PySide6.QtWidgets import QWidget

from workbench.figures import style
from workbench.reports.summary import deadline_text, pert_probability, simulated_probability
from workbench.reports.text import format_date

from workbench.ui.present.chart_slide import session_context

PATH_JOIN = " \u2013 "
PATH_NAMED = 6        # critical-path steps shown with their names on the slide


def summary_lines(ctx) -> list[tuple[str, str, str]]:
    """(label, value, role) rows; role picks the colour of the value."""
    a, sim = ctx.analysis, ctx.simulation
    target = ctx.settings.target_confidence
    rows = [("Finish on expected durations", format_date(a.finish_date), "text"),
            ("Deadline", deadline_text(ctx), "deadline"),
            ("Chance of finishing by the deadline (PERT)", pert_probability(ctx), "probability"),
            ("Chance by the deadline (simulation)", _rounded(simulated_probability(ctx)), "probability"),
            (f"Date we reach with {target * 100:.0f} % confidence (PERT)", format_date(a.date_at(target)), "text")]
    if sim is not None:
        rows.append((f"Date at {target * 100:.0f} % (simulation)", format_date(ctx.date_of(sim.percentile(target * 100))), "text"))
    rows.append(("Critical path", critical_path_text(ctx), "critical"))
    return rows


def _rounded(text: str) -> str:
    """A room needs the figure, not the simulation's error margin ("43.7 %", not "43.7 % (± 0.5 points)")."""
    return text.split(" (\u00b1", 1)[0]


def critical_path_text(ctx, named: int = PATH_NAMED) -> str:
    """The critical path as a room reads it: ids with names ("D2 Room layouts"), names
    shortened; on a long path the first ``named`` with names, then the rest by id."""
    path = list(ctx.analysis.pert.path)
    shown = [f"{i} {_short(ctx.name_of(i))}".strip() for i in path[:named]]
    rest = path[named:]
    return PATH_JOIN.join(shown + rest)


def _short(name: str, limit: int = 28) -> str:
    return name if len(name) <= limit else name[: limit - 1].rstrip() + "\u2026"


def draw_wrapped(p: QPainter, box: QRectF, text: str, px: float, bold: bool = False, colour: str = style.TEXT) -> float:
    """Draw wrapped text at the top of box at ``px`` pixels; return the height used (the
    slides' one way of setting text)."""
    font = QFont()
    font.setPixelSize(int(px))
    font.setBold(bold)
    p.setFont(font)
    p.setPen(QPen(QColor(colour)))
    flags = Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop | Qt.TextFlag.TextWordWrap
    used = p.boundingRect(box.adjusted(0, 0, 0, 400), flags, text)
    p.drawText(used, flags, text)
    return used.height()


class PresentSummarySlide(QWidget):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        session.schedule_changed.connect(self.update)
        session.simulation_changed.connect(self.update)

    def paintEvent(self, event):  # noqa: N802 (Qt override)
        p = QPainter(self)
        p.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        p.fillRect(self.rect(), QColor(style.BACKGROUND))
        ctx = session_context(self.session)
        unit = max(1.0, self.height() / 768.0)
        if ctx is None:
            self._text(p, QRectF(self.rect()), f"The plan cannot be scheduled yet: {self.session.analysis_error}", 30 * unit)
            return
        y = 20 * unit
        y += self._text(p, QRectF(40 * unit, y, self.width() - 80 * unit, 60 * unit), ctx.settings.title, 40 * unit, True)
        for label, value, role in summary_lines(ctx):
            y += 10 * unit
            y += self._text(p, QRectF(40 * unit, y, self.width() - 80 * unit, 30 * unit), label, 20 * unit, False, style.MUTED_TEXT)
            colour = {"deadline": style.DEADLINE, "critical": style.CRITICAL}.get(role, style.TEXT)
            size = 22 if role == "critical" else 30       # the path's names wrap: a size smaller
            y += self._text(p, QRectF(40 * unit, y, self.width() - 80 * unit, 80 * unit), value, size * unit, True, colour)
        p.end()

    _text = staticmethod(draw_wrapped)
