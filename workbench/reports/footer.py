"""The footer on every page of the pack: 'Page X of Y' and the traceability line.

The page count is only known at the end, so each footer places a form (a reusable PDF
drawing) for the total, and the form is written once when the document is saved."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass

from reportlab.pdfgen.canvas import Canvas

from . import fonts, styles
from .text import clean, fit, format_timestamp

TOTAL_FORM = "pack-page-total"
PAGE_LABEL_W = 78.0


@dataclass(frozen=True)
class FooterInfo:
    file_name: str
    plan_hash: str
    generated_at: dt.datetime
    version: str
    seed: int | None
    status_date: dt.date | None = None

    def line(self) -> str:
        seed = "no simulation" if self.seed is None else f"seed {self.seed}"
        when = f"{format_timestamp(self.generated_at)} {self.generated_at:%Z}".strip()
        status = "" if self.status_date is None else f"status date {self.status_date.isoformat()}  \u00b7  "
        return clean(f"{self.file_name}  \u00b7  {status}plan hash {self.plan_hash}  \u00b7  generated {when}"
                     f"  \u00b7  Slackline {self.version}  \u00b7  {seed}")


def footer_drawer(info: FooterInfo):
    """An ``onPage`` hook drawing the footer of the current page."""

    def draw(canvas: Canvas, doc) -> None:
        width, _ = canvas._pagesize
        y = styles.MARGIN * 0.55
        canvas.saveState()
        canvas.setStrokeColor(styles.MUTED)
        canvas.setLineWidth(0.4)
        canvas.line(styles.MARGIN, y + 10, width - styles.MARGIN, y + 10)
        canvas.setFillColor(styles.MUTED)
        x = width - styles.MARGIN - PAGE_LABEL_W
        line = info.line()
        room = x - styles.MARGIN - 8          # the trace line never runs into the page number
        size = min(7.5, 7.4 * room / max(fonts.width(line, styles.FONT, 7.5), 1.0))   # a little under: never cut
        canvas.setFont(styles.FONT, size)          # smaller type before anything is cut off
        fonts.draw(canvas, styles.MARGIN, y, fit(line, room, styles.FONT, size))
        canvas.setFont(styles.BOLD, 8)
        text = f"Page {canvas.getPageNumber()} of "
        canvas.drawString(x, y, text)
        canvas.translate(x + canvas.stringWidth(text, styles.BOLD, 8), y)
        canvas.doForm(TOTAL_FORM)
        canvas.restoreState()

    return draw


class PackCanvas(Canvas):
    """A canvas that writes the page total into the footers' form when saved."""

    def save(self):
        self.beginForm(TOTAL_FORM, lowerx=0, lowery=-2, upperx=40, uppery=10)
        self.setFont(styles.BOLD, 8)
        self.setFillColor(styles.MUTED)
        self.drawString(0, 0, str(self.getPageNumber() - 1))
        self.endForm()
        super().save()
