"""The look of a Network node, shared by screen and paper. No Qt.

Our own node: a filled header strip (id on the left, te on the right), the name on up to
two lines, then a small grid — rows "early" and "late", columns "start" and "finish" —
with the total float in its own cell on the right, spanning both rows. Critical nodes
have a vermillion header and a heavy dark border; links on the critical path are vermillion
and heavy, so the critical path also reads in a grayscale print.
All positions are fractions of the node box, so any box size works.
"""

from __future__ import annotations

from dataclasses import dataclass

from . import style

CRITICAL = style.CRITICAL
WORK = style.WORK
TEXT = style.TEXT
MUTED = style.MUTED_TEXT
NODE_FILL = style.BACKGROUND
WORK_EDGE = style.WORK_EDGE
CRITICAL_EDGE = style.CRITICAL_EDGE   # heavy dark outline: critical also reads in grayscale
LINK = "#4D4D4D"             # ordinary links: dark gray, so the vermillion ones stand out
HEADER_TEXT = "#FFFFFF"
GRID_LINE = "#B8B8B8"
SELECTED = style.SELECTION
HOVER = style.TEXT
NEGATIVE = style.NEGATIVE_FLOAT
BAND_FILLS = ("#F1F3F5", "#FAFAFA")   # alternating group bands
BAND_TEXT = "#6B6B6B"


@dataclass(frozen=True)
class Weights:
    """Line widths and fonts in layout units (a node is 216 × 132 by default)."""

    node_edge: float = 1.2
    critical_edge: float = 4.0
    link: float = 1.4
    critical_link: float = 3.6
    arrow: float = 11.0
    id_font: float = 15.0
    name_font: float = 13.0
    cell_font: float = 13.5
    caption_font: float = 11.0
    compact_id_font: float = 30.0     # zoomed out: id and name only, in larger type
    compact_name_font: float = 24.0
    float_font: float = 17.0
    label_font: float = 12.0
    band_font: float = 22.0


WEIGHTS = Weights()
# Present mode (projector): heavier lines, larger type where the box allows it.
PRESENT = Weights(node_edge=2.4, critical_edge=7.0, link=2.6, critical_link=6.5, arrow=16.0,
                  id_font=17.0, name_font=14.0, cell_font=15.0, caption_font=12.0, float_font=19.0,
                  label_font=16.0, band_font=30.0, compact_id_font=34.0, compact_name_font=26.0)

# Node parts as fractions (x0, y0, x1, y1) of the box.
HEADER = (0.0, 0.0, 1.0, 0.20)
NAME = (0.04, 0.215, 0.96, 0.495)
CAPTIONS = (0.0, 0.505, 1.0, 0.61)
EARLY = (0.0, 0.61, 1.0, 0.78)
LATE = (0.0, 0.78, 1.0, 0.95)
COMPACT_HEADER = (0.0, 0.0, 1.0, 0.34)
COMPACT_NAME = (0.04, 0.38, 0.96, 0.96)
GRID_COLUMNS = (0.04, 0.27, 0.51, 0.75, 0.96)   # edges: label | start | finish | float
GRID_TOP = 0.52


def part(box: tuple[float, float, float, float], frac: tuple[float, float, float, float]):
    """Rectangle (x, y, w, h) of a node part given the node box (x, y, w, h)."""
    x, y, w, h = box
    return (x + frac[0] * w, y + frac[1] * h, (frac[2] - frac[0]) * w, (frac[3] - frac[1]) * h)


def cell(box, row: tuple[float, float, float, float], column: int):
    """Grid cell (x, y, w, h): ``row`` one of CAPTIONS/EARLY/LATE, column 0..3."""
    x, y, w, h = box
    c0, c1 = GRID_COLUMNS[column], GRID_COLUMNS[column + 1]
    return (x + c0 * w, y + row[1] * h, (c1 - c0) * w, (row[3] - row[1]) * h)
