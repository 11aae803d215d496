"""The Timeline's label column: activity ids and names, left-aligned and elided.

Replaces the numeric left axis: one label per visible row, group rows marked with an
open/closed triangle and their members indented. Rows shorter than the label type get
smaller type (down to ``floor_px``: ``FLOOR_PX`` in the window, the full label type in
Present mode) so that every row in view keeps its label; only rows shorter than even that
share labels with their neighbours. A note at the top of the column says when labels are
shared, or which rows a Present page shows.
"""

from __future__ import annotations

import heapq
import math

import pyqtgraph as pg
import numpy as np
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QFont, QFontMetricsF, QPen

from workbench.ui.timeline.axis_cache import RASTER, TimelineAxisCache
from workbench.ui.timeline.label_atlas import TimelineLabelAtlas
from workbench.ui.timeline.batch import axis_and_ticks

INDENT = 14.0
PADDING = 6.0
LABEL_CACHE = 4000     # cut labels kept (a few screens' worth)
LINE_SHARE = 1.05      # a row shorter than this many text lines shares a label with its neighbours
LEGIBLE_GAP_PX = 3.0   # air between labels at the legible row pitch
FLOOR_PX = 8           # rows shorter than the label type get smaller type, down to this size


def legible_pitch(font: QFont) -> float:
    """Smallest row pitch (pixels) at which every row carries its own label."""
    return math.ceil(QFontMetricsF(font).height() * LINE_SHARE + LEGIBLE_GAP_PX)


class TimelineRowAxis(TimelineAxisCache, pg.AxisItem):
    def __init__(self, width: float = 300.0, **kwargs):
        super().__init__("left", **kwargs)
        self._geo = None
        self._cut: dict[tuple, str] = {}          # (text, width, bold) → text cut to the width
        self._metrics_of: dict[bool, QFontMetricsF] = {}
        self._atlas = TimelineLabelAtlas()
        self._slot_of_row = np.zeros(0)            # per row: its label's atlas slot, -1 if unknown
        self._slot_key = None
        self.floor_px = FLOOR_PX          # labels never get smaller type than this
        self.page_note = ""               # Present: which rows are on the page, keys for the others
        self.first_row = 0                # rows above it get no label (a Present page of later rows)
        self.setWidth(int(width))
        self.setStyle(tickLength=0, autoExpandTextSpace=False)

    def set_geometry(self, geo) -> None:
        self._geo = geo
        self._slot_key = None
        self.picture = None
        self.update()

    def set_font(self, font: QFont) -> None:
        self.setStyle(tickFont=font)
        self._cut.clear()
        self._metrics_of.clear()
        self.picture = None
        self.update()

    def set_page(self, first_row: int, note: str) -> None:
        """A Present page: rows from ``first_row`` on, ``note`` at the top of the column."""
        if (first_row, note) != (self.first_row, self.page_note):
            self.first_row, self.page_note = first_row, note
            self.picture = None
            self.update()

    def label_text(self, row: int) -> str:
        """The text shown for a row (before eliding)."""
        geo = self._geo
        if geo.kinds[row] == "group":
            return ("\u25b8 " if geo.keys[row] in geo.collapsed else "\u25be ") + geo.labels[row]
        return geo.labels[row]

    def _rows_to_local(self, bounds: QRectF, rows: np.ndarray) -> np.ndarray:
        r0, r1 = self.range          # reversed by pyqtgraph when the view's y is inverted
        frac = (rows - r0) / (r1 - r0) if r1 != r0 else np.zeros(len(rows))
        return bounds.bottom() - frac * bounds.height()

    def row_font(self, bounds: QRectF) -> QFont:
        """The label type for the rows in view: the axis's own when rows are tall enough
        for it, else smaller, in whole pixels, but not below ``floor_px``."""
        font = QFont(self.style.get("tickFont") or QFont())
        lo, hi = sorted(self.range)
        row_px = bounds.height() / max(hi - lo, 1e-9)
        line = QFontMetricsF(font).height() * LINE_SHARE
        if row_px >= line:
            return font
        size = font.pixelSize() if font.pixelSize() > 0 else font.pointSizeF() * 96.0 / 72.0
        font.setPixelSize(max(self.floor_px, int(size * row_px / line)))
        return font

    def visible_rows(self, bounds: QRectF, font_px: float) -> range:
        lo, hi = sorted(self.range)
        row_px = bounds.height() / max(hi - lo, 1e-9)
        step = max(1, math.ceil(font_px * LINE_SHARE / max(row_px, 1e-9)))
        first = max(self.first_row, math.ceil(lo - 0.5))
        first = first + (-first) % step
        return range(first, min(self._geo.n_rows, math.floor(hi + 0.5) + 1), step)

    def generateDrawSpecs(self, p):
        """Axis line, tick heights and the labels on screen (a :class:`RowLabels`)."""
        if self._geo is None:
            return super().generateDrawSpecs(p)
        bounds = self.mapRectFromParent(self.geometry())
        font = self.row_font(bounds)
        h = QFontMetricsF(font).height()
        axis = (QPen(self.pen()), QPointF(bounds.right(), bounds.top()), QPointF(bounds.right(), bounds.bottom()))
        shown = self.visible_rows(bounds, h)
        rows = np.arange(shown.start, shown.stop, shown.step)
        ys = self._rows_to_local(bounds, rows)
        keep = (ys >= bounds.top() - h / 2) & (ys <= bounds.bottom() + h / 2)
        rows, ys = rows[keep], ys[keep]
        labels = RowLabels(self, bounds, rows, ys, math.ceil(h), font)
        labels.step = shown.step
        return axis, (bounds.right(), ys), labels

    def thinning_note(self, step: int) -> str:
        """Said at the top of the column when rows share labels (never dropped silently)."""
        return "" if step <= 1 else f"Rows too short: 1 label in {step} rows (zoom in)"

    def _draw_note(self, p, labels: "RowLabels") -> None:
        note = self.page_note or self.thinning_note(labels.step)
        if not note:
            return
        font = QFont(labels.font)
        font.setItalic(True)
        p.setFont(font)
        room = labels.bounds.adjusted(PADDING, 2, -PADDING, 0)
        p.drawText(QRectF(room.left(), room.top(), room.width(), labels.line * 4.4),
                   int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop | Qt.TextFlag.TextWordWrap), note)

    def shown_labels(self) -> list[str]:
        """The label texts as they are drawn now (cut to the column), top to bottom."""
        return [] if self._geo is None else [spec[4] for spec in self.generateDrawSpecs(None)[2].specs()]

    def _label(self, text: str, width: int, bold: bool, font: QFont | None = None) -> str:
        """The label cut to ``width`` in ``font`` (kept across repaints and zooms)."""
        size = None if font is None else font.pixelSize()
        key = (text, width, bold, size)
        cut = self._cut.get(key)
        if cut is None:
            if len(self._cut) >= LABEL_CACHE:
                self._cut.clear()
            cut = self._cut[key] = self._metrics(bold, font).elidedText(text, Qt.TextElideMode.ElideRight, width)
        return cut

    def _metrics(self, bold: bool, font: QFont | None = None) -> QFontMetricsF:
        """Metrics of the label type, plain or bold (made once per type and size)."""
        key = (bold, None if font is None else font.pixelSize())
        found = self._metrics_of.get(key)
        if found is None:
            font = QFont(font or self.style.get("tickFont") or QFont())
            font.setBold(bold)
            found = self._metrics_of[key] = QFontMetricsF(font)
        return found

    def _stamp(self, p, font: QFont, labels: "RowLabels", colour: QColor, column: float) -> bool:
        """Labels copied from the atlas in one call (each drawn there once); no Python per
        row once the rows' slots are known."""
        if not labels.rows.size:
            return True
        indent = INDENT * self._geo.depth[labels.rows]
        slots = self._row_slots(font, labels, p.device().devicePixelRatioF(), colour, column)
        x = np.round(labels.bounds.left() + PADDING + indent)
        width = np.trunc(labels.bounds.width() - 2 * PADDING - indent)
        return self._atlas.stamp(p, x, np.round(labels.ys - labels.line / 2), width, slots)

    def _row_slots(self, font: QFont, labels: "RowLabels", ratio: float, colour: QColor, column: float) -> np.ndarray:
        """Atlas slot of each row in ``labels``: kept per row until the geometry, the column,
        the type or the atlas change; rows not seen yet are looked up (and drawn) once."""
        want = self._atlas.key_for(font, colour, column, labels.line, ratio)
        key = (id(self._geo), labels.bounds.width(), want, self._atlas.generation)
        if key != self._slot_key or not self._atlas.holds(want):
            self._slot_of_row = np.full(self._geo.n_rows, -1.0)
        slots = self._slot_of_row[labels.rows]
        if (slots < 0).any():
            generation = self._atlas.generation
            texts = [(t, w, b) for _, _, w, _, t, b in labels.specs()]
            slots = self._atlas.slots_for(texts, font, colour, column, labels.line, ratio)
            if self._atlas.generation != generation:     # started afresh: earlier slots are void
                self._slot_of_row = np.full(self._geo.n_rows, -1.0)
            self._slot_of_row[labels.rows] = slots
            key = (id(self._geo), labels.bounds.width(), want, self._atlas.generation)
        self._slot_key = key
        return slots

    def preferred_width(self, font: QFont, limit: float) -> int:
        """Width that fits the longest labels (the 40 longest by length), at most ``limit``."""
        if self._geo is None or not self._geo.labels:
            return int(min(limit, 120))
        geo, memo = self._geo, getattr(self, "_width_memo", None)
        key = (font.key(), float(limit), geo.collapsed)
        if memo is not None and memo[0] == key and memo[1] == geo.labels and memo[2] == geo.kinds \
                and np.array_equal(memo[3], geo.depth):
            return memo[4]     # the same rows (an estimate edit): measured already
        bold = QFont(font)
        bold.setBold(True)
        plain, heavy = QFontMetricsF(font), QFontMetricsF(bold)     # group rows are bold
        longest = heapq.nlargest(40, range(geo.n_rows), key=lambda r: len(geo.labels[r]))
        need = max((heavy if geo.kinds[r] == "group" else plain).horizontalAdvance(self.label_text(r))
                   + INDENT * int(geo.depth[r]) for r in longest)
        width = int(min(limit, need + 2 * PADDING + 2))
        self._width_memo = (key, geo.labels, geo.kinds, geo.depth, width)
        return width

    def cache_content(self):
        return None if self._geo is None else (id(self._geo), self.first_row, self.page_note)

    def drawPicture(self, p, axisSpec, tickSpecs, textSpecs):
        """Like the base class, with group rows in bold; on screen the labels are copied
        from an atlas where each is drawn once."""
        if self._geo is None:
            return super().drawPicture(p, axisSpec, tickSpecs, textSpecs)
        pen, p1, p2 = axisSpec
        p.setPen(pen)
        right, ys = tickSpecs
        axis_and_ticks(p, p1, p2, right - 4, ys, right, ys)
        text_pen, room = self.textPen(), self.boundingRect()
        p.setPen(text_pen)
        p.setClipRect(room.toAlignedRect())
        font = QFont(textSpecs.font)
        self._draw_note(p, textSpecs)
        if isinstance(p.device(), RASTER) and self._stamp(p, font, textSpecs, text_pen.color(), room.width()):
            return
        bold = QFont(font)                  # paper, PDF and SVG: plain vector text
        bold.setBold(True)
        flags = int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignVCenter)
        for x, top, width, h, text, is_bold in textSpecs.specs():
            p.setFont(bold if is_bold else font)
            p.drawText(QRectF(x, top, width, h), flags, text)


class RowLabels:
    """The labels of the rows on screen: ``rows`` and their centres ``ys`` (axis
    coordinates); ``specs()`` lays each out as ``(x, top, width, height, text, bold)``."""

    def __init__(self, axis: TimelineRowAxis, bounds: QRectF, rows: np.ndarray, ys: np.ndarray, line: int,
                 font: QFont):
        self.axis, self.bounds, self.rows, self.ys, self.line, self.font = axis, bounds, rows, ys, line, font
        self.step = 1        # 1: every row in view has its label; n: one in n (rows too short)

    def specs(self) -> list[tuple]:
        geo, texts = self.axis._geo, []
        for row, y in zip(self.rows.tolist(), self.ys.tolist()):
            indent = INDENT * int(geo.depth[row])
            width = int(self.bounds.width() - 2 * PADDING - indent)
            bold = geo.kinds[row] == "group"
            text = self.axis._label(self.axis.label_text(row), width, bold, self.font)
            texts.append((round(self.bounds.left() + PADDING + indent), round(y - self.line / 2),
                          width, self.line, text, bold))
        return texts
