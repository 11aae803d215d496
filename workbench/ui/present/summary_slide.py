"""The first slide of Present mode: the few numbers a review asks for, in large type."""

from __future__ import annotations

from dataclasses import replace

from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QColor, QFont, QPainter, QPen
from PySide6.QtWidgets import QWidget

from workbench.figures import style
from workbench.figures.headline import CAUTION, headline
from workbench.reports.summary import deadline_text

from workbench.ui.present.chart_slide import session_context
from workbench.ui.session import take_simulation

PATH_JOIN = " \u2013 "
STALE_COLOUR = "#8A3B00"   # the summary strip's colour for an out-of-date simulation
PATH_NAMED = 6        # critical-path steps shown with their names on the slide


def summary_lines(ctx, stale: bool = False) -> list[tuple[str, str, str]]:
    """(label, value, role) rows; role picks the colour and size of the value.

    Worded by ``workbench.figures.headline`` as the summary strip and the pack cover are:
    a current simulation leads with PERT beside it (role "beside"), a stale one is named
    in the note. ``ctx.simulation`` is the latest run shown, ``stale`` True when the plan
    changed after it ran."""
    head = headline(ctx.analysis, ctx.simulation, stale)
    rows = []
    for figure in head.figures():
        rows.append((figure.caption, figure.value, "probability" if figure is head.odds else "text"))
        if figure.beside:
            rows.append(("", figure.beside, "beside"))
    rows.append(("Deadline", deadline_text(ctx), "deadline"))
    rows.append(("Critical path", critical_path_text(ctx), "critical"))
    rows.append(("", head.note, "stale" if head.stale else "note"))
    return rows


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


# value size in pixels at 768 px height, and colour, per row role
ROLE_LOOK = {"text": (30, style.TEXT), "probability": (30, style.TEXT), "deadline": (30, style.DEADLINE),
             "critical": (22, style.CRITICAL), "beside": (19, style.MUTED_TEXT),
             "note": (17, style.MUTED_TEXT), "stale": (19, STALE_COLOUR)}


class PresentSummarySlide(QWidget):
    """The headline in large type: keeps the last simulation (marked stale after an
    edit) as the summary strip does, so the slide and the strip say the same."""

    present_caution = CAUTION       # odds are on this slide: the window shows the caution under it

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.result, self.stale = session.simulation, False
        self.plan_generation = session.plan_generation
        session.schedule_changed.connect(self.update)
        session.simulation_changed.connect(self._on_simulation_changed)

    def _on_simulation_changed(self) -> None:
        take_simulation(self)
        self.update()

    def context(self):
        """The pack context the slide reads, carrying the run it shows (None while unschedulable)."""
        ctx = session_context(self.session)
        return None if ctx is None else replace(ctx, simulation=self.result)

    def lines(self) -> list[tuple[str, str, str]]:
        ctx = self.context()
        return [] if ctx is None else summary_lines(ctx, self.stale)

    def paintEvent(self, event):  # noqa: N802 (Qt override)
        p = QPainter(self)
        p.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        p.fillRect(self.rect(), QColor(style.BACKGROUND))
        ctx = self.context()
        unit = max(1.0, self.height() / 768.0)
        if ctx is None:
            self._text(p, QRectF(self.rect()), f"The plan cannot be scheduled yet: {self.session.analysis_error}", 30 * unit)
            return
        y = 16 * unit
        width = self.width() - 80 * unit
        y += self._text(p, QRectF(40 * unit, y, width, 60 * unit), ctx.settings.title, 36 * unit, True)
        for label, value, role in summary_lines(ctx, self.stale):
            size, colour = ROLE_LOOK[role]
            y += (2 if role == "beside" else 8) * unit
            if label:
                y += self._text(p, QRectF(40 * unit, y, width, 30 * unit), label, 18 * unit, False, style.MUTED_TEXT)
            bold = role not in ("beside", "note")
            y += self._text(p, QRectF(40 * unit, y, width, 80 * unit), value, size * unit, bold, colour)
        p.end()

    _text = staticmethod(draw_wrapped)
