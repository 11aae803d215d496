"""Paragraph styles, page sizes and reportlab colours for the approval pack."""

from __future__ import annotations

from reportlab.lib import colors
from reportlab.lib.enums import TA_LEFT
from reportlab.lib.pagesizes import A4, landscape, letter
from reportlab.lib.styles import ParagraphStyle

from workbench.figures import style

from . import fonts

PAPERS = {"a4": A4, "letter": letter}
MARGIN = 42.0          # page margin in points (~15 mm)
FOOTER_SPACE = 30.0    # room kept free for the footer at the bottom of every page

fonts.register()
FONT = fonts.FONT          # DejaVu Sans, embedded, with a fallback for CJK (see fonts.py)
BOLD = fonts.BOLD


def colour(hex_colour: str) -> colors.Color:
    return colors.Color(*style.rgb01(hex_colour))


CRITICAL = colour(style.CRITICAL)
WORK = colour(style.WORK)
FLOAT = colour(style.FLOAT)
# the simulated finishes behind the shaded answer: a light tint, so the orange answer stays
# clearly darker in a grayscale copy (full sky blue and orange print as the same grey)
FLOAT_TINT = colors.Color(*(0.3 * v + 0.7 for v in style.rgb01(style.FLOAT)))
PROBABILITY = colour(style.PROBABILITY)
DEADLINE = colour(style.DEADLINE)
STATUS = colour(style.STATUS)
TEXT = colour(style.TEXT)
MUTED = colour(style.MUTED_TEXT)
GRID = colour(style.GRID)
NONWORKING = colour(style.NONWORKING)
WORK_EDGE = colour(style.WORK_EDGE)
SUMMARY = colour(style.SUMMARY)
LIGHT_ROW = colors.Color(0.95, 0.95, 0.95)


def page_size(paper: str) -> tuple[float, float]:
    try:
        return PAPERS[paper]
    except KeyError:
        from workbench.core.errors import PlanError
        raise PlanError(f"paper must be 'a4' or 'letter', not {paper!r}", "paper") from None


def landscape_size(paper: str) -> tuple[float, float]:
    return landscape(page_size(paper))


def _style(name, size, leading=None, font=FONT, **kw) -> ParagraphStyle:
    return ParagraphStyle(name, fontName=font, fontSize=size, leading=leading or size * 1.25,
                          alignment=TA_LEFT, textColor=TEXT, **kw)


TITLE = _style("title", 26, 32, BOLD, spaceAfter=10)
SUBTITLE = _style("subtitle", 13, 17, spaceAfter=4)
H1 = _style("h1", 16, 20, BOLD, spaceAfter=8)
H2 = _style("h2", 12, 15, BOLD, spaceBefore=8, spaceAfter=4)
BODY = _style("body", 10, 13.5, spaceAfter=5)
SMALL = _style("small", 8.5, 11)
CELL = _style("cell", 8, 9.6)
CELL_BOLD = _style("cellbold", 8, 9.6, BOLD)
BIG_NUMBER = _style("big", 15, 19, BOLD)
BULLET = _style("bullet", 10, 13.5, leftIndent=12, bulletIndent=0, spaceAfter=4)
