"""How much a Network box says at a given zoom, decided in screen pixels.

- ``tiny``: a coloured box, its id inside while that can be read;
- ``compact``: a coloured strip with the id over the name, from the moment a line of the
  name fits at a readable size (elided when only part of it does; two lines when there
  is room) — so a small plan at dock zoom shows names, not ids only;
- ``full``: the figures grid (early/late start and finish, total float) in working-day
  offsets;
- ``dated``: zoomed in far enough that dates can be read in the grid: early and late
  start and finish as dates in the table's format (``core.formatting.format_date``).

Layout units are converted to pixels with ``scale`` (device pixels per unit).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QFontMetricsF, QPen

from workbench.figures import network_style as ns
from workbench.ui.network.shapes import colour, font

NAME_MIN_PX = 8.0        # the smallest type a name is written in on screen
DATE_MIN_PX = 9.0        # the smallest type dates are written in
ID_MIN_PX = 7.0          # the smallest type a coloured box's id is written in
LINE = 1.2               # line pitch as a multiple of the type size
WIDEST_DATE = "Wed 30 Sep 2027"
DATED_COLUMNS = (0.03, 0.135, 0.465, 0.795, 0.97)   # edges: label | start | finish | float


@dataclass(frozen=True)
class Compact:
    """Sizes (layout units) of a box drawn small: id type, strip height, name type, lines."""

    id_size: float
    header: float
    name_size: float
    lines: int


def tiny_id_size(box: QRectF, ids: list[str], scale: float) -> float:
    """Type size (units) for ids inside coloured boxes: as large as the box's height allows
    (up to 70 % of it) while the widest id on screen still fits its width."""
    widest = max(QFontMetricsF(font(100.0, bold=True)).horizontalAdvance(i) for i in ids) / 100.0
    return min(0.7 * box.height(), (box.width() - 3.0 / scale) / max(widest, 1e-9))


def names_fit(box_w: float, box_h: float, scale: float, weights) -> bool:
    """Can the box hold its id and one line of its name at a readable size?"""
    return box_w * scale >= 3 * NAME_MIN_PX and compact(box_h, scale, weights).lines >= 1


def compact(box_h: float, scale: float, weights) -> Compact:
    """Type sizes for a small box: as the style asks, but never below a readable size in
    pixels, and the name on as many lines (at most two) as the box has room for."""
    h_px = box_h * scale
    id_px = min(max(weights.compact_id_font * scale, NAME_MIN_PX), 0.45 * h_px)
    header_px = max(ns.COMPACT_HEADER[3] * h_px, 1.15 * id_px + 1)
    name_px = min(max(weights.compact_name_font * scale, NAME_MIN_PX), 0.4 * h_px)
    lines = min(2, int((h_px - header_px - 1) // (LINE * name_px)))
    return Compact(round(id_px / scale), header_px / scale, round(name_px / scale), max(lines, 0))


@lru_cache(maxsize=64)
def date_size(box_w: float, cell_font: float) -> int:
    """Type size (units) at which the widest date fits a date cell of a box ``box_w`` wide."""
    room = (DATED_COLUMNS[2] - DATED_COLUMNS[1]) * box_w * 0.94
    per_unit = QFontMetricsF(font(100.0)).horizontalAdvance(WIDEST_DATE) / 100.0
    return max(1, min(int(cell_font), int(room / per_unit)))


def dates_fit(box_w: float, scale: float, weights) -> bool:
    return date_size(box_w, weights.cell_font) * scale >= DATE_MIN_PX


def dated_cell(box, row, column: int) -> QRectF:
    x, y, w, h = box
    c0, c1 = DATED_COLUMNS[column], DATED_COLUMNS[column + 1]
    return QRectF(x + c0 * w, y + row[1] * h, (c1 - c0) * w, (row[3] - row[1]) * h)


def paint_dated_grid(p, box, dates: tuple[str, str, str, str], text, weights) -> None:
    """The grid with dates: rows early and late, columns start and finish, float on the right."""
    x, y, bw, bh = box
    size = date_size(bw, weights.cell_font)
    p.setPen(QPen(colour(ns.GRID_LINE), 0))
    top = y + ns.GRID_TOP * bh
    p.drawLine(QPointF(x + 6, top), QPointF(x + bw - 6, top))
    split = x + DATED_COLUMNS[3] * bw
    p.drawLine(QPointF(split, top + 3), QPointF(split, y + ns.LATE[3] * bh))
    p.setPen(colour(ns.MUTED))
    p.setFont(font(min(weights.caption_font, size + 1)))
    for col, word in ((1, "start"), (2, "finish"), (3, "float")):
        p.drawText(dated_cell(box, ns.CAPTIONS, col), Qt.AlignCenter, word)
    for row, label, pair in ((ns.EARLY, "early", dates[:2]), (ns.LATE, "late", dates[2:])):
        p.setPen(colour(ns.MUTED))
        p.setFont(font(min(weights.caption_font, size + 1)))
        p.drawText(dated_cell(box, row, 0), Qt.AlignLeft | Qt.AlignVCenter, label)
        p.setPen(colour(ns.TEXT))
        p.setFont(font(size))
        p.drawText(dated_cell(box, row, 1), Qt.AlignCenter, pair[0])
        p.drawText(dated_cell(box, row, 2), Qt.AlignCenter, pair[1])
    cell = dated_cell(box, ns.EARLY, 3)
    float_rect = QRectF(cell.x(), y + ns.EARLY[1] * bh, cell.width(), (ns.LATE[3] - ns.EARLY[1]) * bh)
    p.setPen(colour(ns.NEGATIVE if text.negative else ns.TEXT))
    wide = QFontMetricsF(font(100.0, bold=True)).horizontalAdvance(text.total_float) / 100.0
    p.setFont(font(min(weights.float_font, 0.9 * float_rect.width() / max(wide, 1e-9)), bold=True))
    p.drawText(float_rect, Qt.AlignCenter, text.total_float)


def paint_compact_texts(painter, p, rows, heads, small) -> None:
    """The id in the coloured strip, the name below it on one or two lines (elided)."""
    width = float(painter.layout.boxes[0, 2])
    pad, pitch = 0.04 * width, LINE * small.name_size
    id_font, name_font = font(small.id_size, bold=True), font(small.name_size)
    id_metrics = QFontMetricsF(id_font)
    white, black = colour(ns.HEADER_TEXT), colour(ns.TEXT)
    for r, head in zip(rows.tolist(), heads):
        p.setPen(white)
        p.setFont(id_font)
        head = head.adjusted(pad, 0, -pad, 0)
        p.drawText(head, Qt.AlignLeft | Qt.AlignVCenter, id_metrics.elidedText(painter.texts[r].id, Qt.ElideRight, head.width()))
        if small.lines < 1:
            continue
        p.setPen(black)
        p.setFont(name_font)
        top = head.bottom() + 0.5 * (painter._rects[r].bottom() - head.bottom() - small.lines * pitch)
        for k, line in enumerate(name_lines(painter, r, small)):
            p.drawText(QRectF(head.left(), top + k * pitch, head.width(), pitch), Qt.AlignLeft | Qt.AlignVCenter, line)


def name_lines(painter, r: int, small) -> list[str]:
    """The name of row ``r`` as a small box shows it (elided to its lines)."""
    width, name = float(painter.layout.boxes[0, 2]), painter.texts[r].name
    if small.lines >= 2:
        return [line for line in painter._wrap(name, width, small.name_size) if line]
    key = (name, width, small.name_size, 1)
    if key not in painter._wrapped:
        room = width * (ns.NAME[2] - ns.NAME[0])
        painter._wrapped[key] = (QFontMetricsF(font(small.name_size)).elidedText(name, Qt.ElideRight, room),)
    return [line for line in painter._wrapped[key] if line]
