"""The footer on every page of the pack (page X of Y and the traceability line).

The total page count is only known at the end, so the canvas keeps each finished page
and draws the footers when the document is saved.
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass

from reportlab.pdfgen.canvas import Canvas

from . import styles
from .text import clean


@dataclass(frozen=True)
class FooterInfo:
    file_name: str
    plan_hash: str
    generated_at: dt.datetime
    version: str
    seed: int | None

    def line(self) -> str:
        seed = "no simulation" if self.seed is None else f"seed {self.seed}"
        when = self.generated_at.strftime("%Y-%m-%d %H:%M %Z").strip()
        return clean(f"{self.file_name}  \u00b7  plan hash {self.plan_hash}  \u00b7  generated {when}"
                     f"  \u00b7  Slackline {self.version}  \u00b7  {seed}")


def draw_footer(canvas: Canvas, info: FooterInfo, page: int, total: int) -> None:
    width, _ = canvas._pagesize
    y = styles.MARGIN * 0.55
    canvas.saveState()
    canvas.setStrokeColor(styles.MUTED)
    canvas.setLineWidth(0.4)
    canvas.line(styles.MARGIN, y + 10, width - styles.MARGIN, y + 10)
    canvas.setFillColor(styles.MUTED)
    canvas.setFont(styles.FONT, 7.5)
    canvas.drawString(styles.MARGIN, y, info.line())
    canvas.setFont(styles.BOLD, 8)
    canvas.drawRightString(width - styles.MARGIN, y, f"Page {page} of {total}")
    canvas.restoreState()


def footer_canvas(info: FooterInfo) -> type:
    """A Canvas class that stamps ``info`` and 'page X of Y' on every page when saved."""

    class FooterCanvas(Canvas):
        def __init__(self, *args, **kwargs):
            super().__init__(*args, **kwargs)
            self._kept_pages = []

        def showPage(self):
            self._kept_pages.append(dict(self.__dict__))
            self._startPage()

        def save(self):
            total = len(self._kept_pages)
            for number, state in enumerate(self._kept_pages, start=1):
                self.__dict__.update(state)
                draw_footer(self, info, number, total)
                Canvas.showPage(self)
            Canvas.save(self)

    return FooterCanvas
