"""One paint routine for the Network: screen item, image/SVG export and printing share it.

Everything is drawn in layout units; ``scale`` (device pixels per unit) picks the level of
detail and keeps hairlines visible. Only nodes and links meeting the visible rectangle are
drawn; when most of the drawing is visible, links go out in one batched call per style.
"""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QLineF, QPointF, QRectF, Qt
from PySide6.QtGui import QFontMetricsF, QPainter, QPen, QPolygonF

from workbench.figures import network_style as ns

from workbench.figures.network_labels import date_cells
from workbench.ui.network import detail
from workbench.ui.network.shapes import clip, colour, font, inside, pen

TINY_PX = 40       # far-out picture cache below this node width (see item.py)
COMPACT_PX = 140   # narrower than this: id and name only (see detail.py for the levels)
LABEL_SCALE = 0.2  # link labels from this zoom on
TINY_IDS = 600     # far out, ids are written in at most this many visible boxes
AA_SEGMENTS = 250  # smooth (antialiased) ordinary links only when this few are visible


class NetworkPainter:
    """Caches Qt shapes for one layout and paints any part of it."""

    def __init__(self):
        self.layout = None
        self.texts = []
        self.selected: set[int] = set()
        self.hover = -1
        self.related: set[int] = set()
        self.hover_links: set[int] = set()
        self.bands_visible = True
        self.column_labels: list[tuple[float, str]] = []   # (centre x, text) above the columns
        self.weights = ns.WEIGHTS
        self.min_critical_px = 2.5
        self._rects: list[QRectF] = []
        self._polys: list[QPolygonF] = []
        self._heads: list[QPolygonF] = []
        self._names: list[tuple[str, str]] = []
        self.analysis = None      # for dates in the boxes when zoomed in
        self._dates = None
        self._date_text: dict[int, tuple[str, str, str, str]] = {}
        self._wrapped: dict[tuple[str, float, float], tuple[str, str]] = {}
        self._key = None
        self._seg_link = np.zeros(0, dtype=np.int64)
        self.version = 0          # bumped whenever the base picture would change

    # --- content ---------------------------------------------------------
    def set_content(self, layout, texts, analysis=None) -> None:
        """Take a new layout; Qt shapes are rebuilt only when the geometry changed (a
        duration edit keeps it), flags and texts always."""
        key = (id(layout.geometry), tuple((l.pred, l.succ) for l in layout.links))
        self.layout, self.texts = layout, texts
        if analysis is not self.analysis or analysis is None:
            self.analysis, self._dates, self._date_text = analysis, None, {}
        self.version += 1
        if key != self._key:
            self._key = key
            self._cache_geometry(layout)
        self._crit = np.array([n.critical for n in layout.nodes], dtype=bool)
        self._link_crit = np.array([l.critical for l in layout.links], dtype=bool)
        self._seg_crit = self._link_crit[self._seg_link] if self._seg_link.size else np.zeros(0, dtype=bool)
        self._all_lines = {flag: [self._seg_lines[i] for i in np.flatnonzero(self._seg_crit == flag)]
                           for flag in (False, True)}
        width = float(layout.boxes[0, 2]) if len(layout.boxes) else 0.0
        self._names = [self._wrap(t.name, width, self.weights.name_font) for t in texts]
        self.related = {r for r in self.related if r < len(self._rects)}
        self.selected = {r for r in self.selected if r < len(self._rects)}

    def _cache_geometry(self, layout) -> None:
        boxes = layout.boxes.tolist()
        self._rects = [QRectF(*b) for b in boxes]
        self._polys = [QPolygonF([QPointF(x, y) for x, y in l.points]) for l in layout.links]
        self._heads = [self._arrow_head(l.points) for l in layout.links]
        self._ends = np.array([l.points[-1] for l in layout.links]).reshape(-1, 2)
        self._label_at = np.array([l.label_at for l in layout.links]).reshape(-1, 2)
        self._heads_full = [QRectF(*ns.part(b, ns.HEADER)) for b in boxes]
        rows = [(a[0], a[1], b[0], b[1], k) for k, l in enumerate(layout.links)
                for a, b in zip(l.points, l.points[1:])]
        arr = np.array(rows, dtype=float).reshape(-1, 5)
        self._segs = arr[:, :4]
        self._seg_link = arr[:, 4].astype(np.int64)
        self._seg_lines = [QLineF(x0, y0, x1, y1) for x0, y0, x1, y1 in self._segs.tolist()]

    def set_weights(self, weights, min_critical_px: float) -> None:
        """Switch line weights and type sizes (screen or Present); rebuilds cached shapes."""
        self.weights, self.min_critical_px = weights, min_critical_px
        self._key = None
        self.version += 1
        self._wrapped.clear()
        if self.layout is not None:
            self.set_content(self.layout, self.texts, self.analysis)

    def set_hover(self, row: int) -> None:
        self.hover = row
        if row < 0 or self.layout is None:
            self.related, self.hover_links = set(), set()
            return
        preds, succs = self.layout.neighbours(row)
        self.related = set(preds) | set(succs)
        me = self.layout.nodes[row].id
        self.hover_links = {k for k, l in enumerate(self.layout.links) if me in (l.pred, l.succ)}

    def _arrow_head(self, points) -> QPolygonF:
        (x0, y0), (x1, y1) = points[-2], points[-1]
        d = np.hypot(x1 - x0, y1 - y0) or 1.0
        ux, uy = (x1 - x0) / d, (y1 - y0) / d
        s = self.weights.arrow
        base = (x1 - ux * s, y1 - uy * s)
        return QPolygonF([QPointF(x1, y1), QPointF(base[0] - uy * s * 0.45, base[1] + ux * s * 0.45),
                          QPointF(base[0] + uy * s * 0.45, base[1] - ux * s * 0.45)])

    def date_texts(self, r: int) -> tuple[str, str, str, str]:
        """Early/late start and finish of row ``r`` as dates (formatted once per analysis)."""
        if r not in self._date_text:
            if self._dates is None:
                self._dates = self.analysis.dates()
            self._date_text[r] = date_cells(self._dates, r)
        return self._date_text[r]

    def _wrap(self, name: str, width: float, size: float) -> tuple[str, str]:
        """The name on at most two lines, the second elided when it does not fit (cached)."""
        key = (name, width, size)
        if len(self._wrapped) > 50_000:     # zooming through many sizes: start afresh
            self._wrapped.clear()
        if key not in self._wrapped:
            self._wrapped[key] = self._wrap_now(name, width, size)
        return self._wrapped[key]

    def _wrap_now(self, name: str, width: float, size: float) -> tuple[str, str]:
        fm = QFontMetricsF(font(size))
        room = width * (ns.NAME[2] - ns.NAME[0])
        words, first = name.split(), ""
        while words and fm.horizontalAdvance((first + " " + words[0]).strip()) <= room:
            first = (first + " " + words.pop(0)).strip()
        if not first and words:      # one long word: break it
            return fm.elidedText(name, Qt.ElideRight, room), ""
        return first, fm.elidedText(" ".join(words), Qt.ElideRight, room)

    # --- painting --------------------------------------------------------
    def paint(self, p: QPainter, visible: QRectF, scale: float, base_only: bool = False) -> None:
        """Paint what meets ``visible``; ``base_only`` leaves out hover and selection marks
        (for a cached picture that ``paint_overlay`` completes)."""
        if self.layout is None:
            return
        level = self.level(scale, 96.0 / max(p.device().logicalDpiX(), 1))
        small = level == "tiny"
        p.setRenderHint(QPainter.Antialiasing, not small)
        p.setRenderHint(QPainter.TextAntialiasing, True)
        if self.bands_visible:
            self._paint_bands(p, visible, scale)
        self._paint_links(p, visible, scale)
        if self.column_labels:
            self._paint_column_labels(p, scale)
        rows = self._visible_nodes(visible)
        if not base_only:
            self._paint_hover_links(p, scale)
            if not small:
                self._paint_halos(p, rows, scale, fill=True)
        if small:
            self._paint_tiny(p, rows, scale)
        else:
            self._paint_nodes(p, rows, scale, level)
        if not base_only and small:
            self._paint_halos(p, rows, scale, fill=False)

    def level(self, scale: float, dpi_scale: float = 1.0) -> str:
        """What the boxes say at this scale: "tiny", "compact", "full" or "dated" (detail.py).
        Dates need type readable at the device's resolution (``dpi_scale``: 96 dpi over the
        device's): on paper the grid keeps its larger figures."""
        if self.layout is None or not len(self._rects):
            return "tiny"
        w, h = float(self.layout.boxes[0, 2]), float(self.layout.boxes[0, 3])
        if w * scale >= COMPACT_PX:
            dated = self.analysis is not None and detail.dates_fit(w, scale * dpi_scale, self.weights)
            return "dated" if dated else "full"
        return "compact" if detail.names_fit(w, h, scale, self.weights) else "tiny"

    def paint_overlay(self, p: QPainter, visible: QRectF, scale: float) -> None:
        """Hover and selection marks over a cached base picture (far-out zoom only)."""
        if self.layout is None:
            return
        p.setRenderHint(QPainter.Antialiasing, False)
        self._paint_hover_links(p, scale)
        self._paint_halos(p, self._visible_nodes(visible), scale, fill=False)

    def node_px(self, scale: float) -> float:
        """Width of a node on the device at this scale."""
        return float(self.layout.boxes[0, 2] * scale) if len(self._rects) else 0.0

    def _paint_hover_links(self, p: QPainter, scale: float) -> None:
        if self.hover_links:
            p.setBrush(Qt.NoBrush)
            p.setPen(pen(ns.HOVER, self.weights.critical_link * 0.8, scale))
            for k in self.hover_links:
                p.drawPolyline(self._polys[k])

    def _paint_column_labels(self, p: QPainter, scale: float) -> None:
        """Column headings, skipping any that would run into the one before."""
        size = min(40.0, max(self.weights.label_font, 9.0 / scale))
        f = font(size, bold=True)
        metrics = QFontMetricsF(f)
        p.setPen(colour(ns.MUTED))
        p.setFont(f)
        free_from = -float("inf")
        for centre, text in self.column_labels:
            half = metrics.horizontalAdvance(text) / 2 + size * 0.6
            if centre - half < free_from:
                continue
            p.drawText(QRectF(centre - half, -1.6 * size - 8, 2 * half, 1.5 * size), Qt.AlignCenter, text)
            free_from = centre + half

    def _visible_nodes(self, v: QRectF) -> np.ndarray:
        b = self.layout.boxes
        if not len(b):
            return np.zeros(0, dtype=np.int64)
        keep = (b[:, 0] <= v.right()) & (b[:, 0] + b[:, 2] >= v.left()) & (b[:, 1] <= v.bottom()) & (b[:, 1] + b[:, 3] >= v.top())
        return np.flatnonzero(keep)

    def _paint_bands(self, p: QPainter, v: QRectF, scale: float) -> None:
        w = self.weights
        for i, band in enumerate(self.layout.bands):
            rect = QRectF(band.x, band.y, band.w, band.h)
            if not rect.intersects(v):
                continue
            p.fillRect(rect, colour(ns.BAND_FILLS[i % 2]))
            room = self.layout.band_title         # the strip above the band's first nodes
            size = min(0.62 * room, max(w.band_font, 11.0 / scale))
            p.setPen(colour(ns.BAND_TEXT))
            p.setFont(font(size, bold=True))
            left = max(rect.left(), v.left()) + 8
            p.drawText(QRectF(left, rect.top(), 40 * size, room), Qt.AlignLeft | Qt.AlignVCenter, band.name)

    def _paint_links(self, p: QPainter, v: QRectF, scale: float) -> None:
        w = self.weights
        seg = self._segs
        vis = ((np.minimum(seg[:, 0], seg[:, 2]) <= v.right()) & (np.maximum(seg[:, 0], seg[:, 2]) >= v.left())
               & (np.minimum(seg[:, 1], seg[:, 3]) <= v.bottom()) & (np.maximum(seg[:, 1], seg[:, 3]) >= v.top()))
        p.setBrush(Qt.NoBrush)
        ordinary = np.flatnonzero(vis & ~self._seg_crit)
        p.setRenderHint(QPainter.Antialiasing, 0 < ordinary.size <= AA_SEGMENTS)
        p.setPen(pen(ns.LINK, w.link, scale))
        if ordinary.size > 0.6 * len(self._all_lines[False]):
            p.drawLines(self._all_lines[False])
        elif ordinary.size:     # clipped first: long lines are slow to stroke
            p.drawLines([QLineF(*c) for c in clip(seg[ordinary], v.adjusted(-40, -40, 40, 40)).tolist()])
        p.setRenderHint(QPainter.Antialiasing, True)
        heavy = pen(ns.CRITICAL, w.critical_link, scale)
        heavy.setWidthF(max(self.min_critical_px, heavy.widthF()))
        p.setPen(heavy)
        for k in np.unique(self._seg_link[vis & self._seg_crit]).tolist():
            p.drawPolyline(self._polys[k])
        if w.arrow * scale >= 3:
            self._paint_heads(p, inside(self._ends, v, w.arrow), self._link_crit)
        if scale >= LABEL_SCALE:
            self._paint_labels(p, inside(self._label_at, v, 60.0), scale)

    def _paint_heads(self, p: QPainter, rows: np.ndarray, crit: np.ndarray) -> None:
        p.setPen(Qt.NoPen)
        for flag, hexc in ((False, ns.LINK), (True, ns.CRITICAL)):
            p.setBrush(colour(hexc))
            for k in rows[crit[rows] == flag]:
                p.drawPolygon(self._heads[k])

    def _paint_labels(self, p: QPainter, rows: np.ndarray, scale: float) -> None:
        size = min(2 * self.weights.label_font, max(self.weights.label_font, 8.0 / scale))
        f = font(size, bold=True)
        p.setFont(f)
        metrics, backdrop = QFontMetricsF(f), colour(ns.NODE_FILL, 225)
        for k in rows:
            link = self.layout.links[k]
            if not link.label:
                continue
            x, y = link.label_at
            width = metrics.horizontalAdvance(link.label) + size * 0.5
            rect = QRectF(x - width / 2, y - 1.6 * size, width, 1.3 * size)
            p.fillRect(rect, backdrop)
            p.setPen(colour(ns.CRITICAL if link.critical else ns.TEXT))
            p.drawText(rect, Qt.AlignCenter, link.label)

    def _paint_halos(self, p: QPainter, rows: np.ndarray, scale: float, fill: bool) -> None:
        """Selection (a pale field behind the node, or a heavy frame when drawn on top)
        and hover marks (dashed frames); at least a few pixels clear of the box."""
        show = set(rows.tolist())
        pad = max(10.0, 4.0 / scale)
        p.setBrush(colour(ns.SELECTED) if fill else Qt.NoBrush)
        p.setPen(pen(ns.TEXT, 1.5 if fill else 3.0, scale))
        for r in self.selected & show:
            p.drawRect(self._rects[r].adjusted(-pad, -pad, pad, pad))
        p.setBrush(Qt.NoBrush)
        p.setPen(pen(ns.HOVER, 3.0, scale, Qt.DashLine))
        pad = max(6.0, 2.5 / scale)
        for r in (self.related | ({self.hover} if self.hover >= 0 else set())) & show:
            p.drawRect(self._rects[r].adjusted(-pad, -pad, pad, pad))

    def _paint_tiny(self, p: QPainter, rows: np.ndarray, scale: float) -> None:
        """Far out: coloured boxes, with the id inside while it can still be read."""
        for flag, hexc in ((False, ns.WORK), (True, ns.CRITICAL)):
            p.setPen(pen(ns.CRITICAL_EDGE, 0, 1.0) if flag else Qt.NoPen)
            p.setBrush(colour(hexc))
            p.drawRects([self._rects[r] for r in rows[self._crit[rows] == flag]])
        if not len(rows) or len(rows) > TINY_IDS:
            return
        size = detail.tiny_id_size(self._rects[int(rows[0])], [self.texts[r].id for r in rows.tolist()], scale)
        if size * scale < detail.ID_MIN_PX:
            return
        p.setPen(colour(ns.HEADER_TEXT))
        p.setFont(font(size, bold=True))
        for r in rows.tolist():
            p.drawText(self._rects[r], Qt.AlignCenter, self.texts[r].id)

    def _paint_nodes(self, p: QPainter, rows: np.ndarray, scale: float, level: str) -> None:
        """Bodies, headers and borders in a few batched calls; texts node by node."""
        w, crit = self.weights, self._crit[rows]
        full = level in ("full", "dated")
        small = None if full else detail.compact(float(self.layout.boxes[0, 3]), scale, w)
        heads = ([self._heads_full[r] for r in rows] if full else
                 [QRectF(b.x(), b.y(), b.width(), small.header) for b in (self._rects[r] for r in rows)])
        p.setPen(Qt.NoPen)
        p.setBrush(colour(ns.NODE_FILL))
        p.drawRects([self._rects[r] for r in rows])
        for flag, hexc in ((False, ns.WORK), (True, ns.CRITICAL)):
            p.setBrush(colour(hexc))
            p.drawRects([heads[k] for k in np.flatnonzero(crit == flag)])
        if full:
            self._paint_full_texts(p, rows, heads, level == "dated")
        else:
            detail.paint_compact_texts(self, p, rows, heads, small)
        p.setBrush(Qt.NoBrush)
        edge = pen(ns.CRITICAL_EDGE, w.critical_edge, scale)
        edge.setWidthF(max(self.min_critical_px, edge.widthF()))
        for flag, line in ((False, pen(ns.WORK_EDGE, w.node_edge, scale)), (True, edge)):
            p.setPen(line)
            p.drawRects([self._rects[r] for r in rows[crit == flag]])

    def _paint_full_texts(self, p: QPainter, rows: np.ndarray, heads, dated: bool) -> None:
        w, white = self.weights, colour(ns.HEADER_TEXT)
        id_font, te_font = font(w.id_font, bold=True), font(w.cell_font)
        for r, head in zip(rows.tolist(), heads):
            text, head = self.texts[r], head.adjusted(8, 0, -8, 0)
            p.setPen(white)
            p.setFont(id_font)
            p.drawText(head, Qt.AlignLeft | Qt.AlignVCenter, text.id)
            p.setFont(te_font)
            p.drawText(head, Qt.AlignRight | Qt.AlignVCenter, f"te {text.te}")
            b = self._rects[r]
            self._paint_body(p, r, (b.x(), b.y(), b.width(), b.height()), dated)

    def _paint_body(self, p: QPainter, r: int, box, dated: bool = False) -> None:
        text, w = self.texts[r], self.weights
        first, second = self._names[r]
        name = QRectF(*ns.part(box, ns.NAME))
        p.setPen(colour(ns.TEXT))
        p.setFont(font(w.name_font))
        half = name.height() / 2
        p.drawText(QRectF(name.x(), name.y(), name.width(), half), Qt.AlignLeft | Qt.AlignVCenter, first)
        p.drawText(QRectF(name.x(), name.y() + half, name.width(), half), Qt.AlignLeft | Qt.AlignVCenter, second)
        if dated:
            detail.paint_dated_grid(p, box, self.date_texts(r), text, w)
            return
        x, y, bw, bh = box
        p.setPen(QPen(colour(ns.GRID_LINE), 0))
        top = y + ns.GRID_TOP * bh
        p.drawLine(QPointF(x + 6, top), QPointF(x + bw - 6, top))
        split = x + ns.GRID_COLUMNS[3] * bw
        p.drawLine(QPointF(split, top + 3), QPointF(split, y + ns.LATE[3] * bh))
        p.setPen(colour(ns.MUTED))
        p.setFont(font(w.caption_font))
        for col, word in ((1, "start"), (2, "finish"), (3, "float")):
            p.drawText(QRectF(*ns.cell(box, ns.CAPTIONS, col)), Qt.AlignCenter, word)
        for row, label, a, b in ((ns.EARLY, "early", text.es, text.ef), (ns.LATE, "late", text.ls, text.lf)):
            p.setPen(colour(ns.MUTED))
            p.setFont(font(w.caption_font))
            p.drawText(QRectF(*ns.cell(box, row, 0)), Qt.AlignLeft | Qt.AlignVCenter, label)
            p.setPen(colour(ns.TEXT))
            p.setFont(font(w.cell_font))
            p.drawText(QRectF(*ns.cell(box, row, 1)), Qt.AlignCenter, a)
            p.drawText(QRectF(*ns.cell(box, row, 2)), Qt.AlignCenter, b)
        cx, _, cw, _ = ns.cell(box, ns.EARLY, 3)
        float_rect = QRectF(cx, y + ns.EARLY[1] * bh, cw, (ns.LATE[3] - ns.EARLY[1]) * bh)
        p.setPen(colour(ns.NEGATIVE if text.negative else ns.TEXT))
        p.setFont(font(w.float_font, bold=True))
        p.drawText(float_rect, Qt.AlignCenter, text.total_float)

