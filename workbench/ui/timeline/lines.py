"""The Timeline's reference lines: project start, deadline, status date and, after a
simulation, the finish P10 / P90 lines over an orange band, each labelled with its date
("P90 29 Sep"), all labels in a band above the first row where they cover no bar."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import QPointF, Qt
from PySide6.QtGui import QColor

from workbench.figures import style

LINE_NAMES = {"start": "Start", "deadline": "Deadline", "status": "Status",
              "p10": "P10", "p90": "P90"}      # finish P10 / P90: the orange band says "finish"
LINE_COLOURS = {"start": style.TEXT, "deadline": style.DEADLINE, "status": style.STATUS,
                "p10": style.PROBABILITY, "p90": style.PROBABILITY}
# (line of the header band above row 0, anchor): start and status right of their lines and
# the deadline left of its own on the first line; the finish P10 / P90 on the second line,
# each left of its line (the finish is near the right edge): labels never cover bars.
LABEL_PLACES = {"deadline": (0, (1.0, 0.0)), "p10": (1, (1.0, 0.0)), "p90": (1, (1.0, 0.0))}


LABEL_MARGIN_PX = 2      # white around a label's text (the header band holds up to five lines)
LINE_Z, LABEL_Z = 5, 8      # every label above every line (a line never crosses a label)


class TimelineLines:
    """Keeps the labelled vertical lines and the P10–P90 band of one plot up to date.

    Each line is two items at the same place: the visible stroke, and an invisible line
    above every stroke that carries the label (a label is a child of its line, so it can
    only rise above the other lines with a line of its own)."""

    def __init__(self, plot):
        self.plot = plot
        self.lines: dict[str, pg.InfiniteLine] = {}     # name → the labelled line
        self.strokes: dict[str, pg.InfiniteLine] = {}   # name → the visible line
        self.band = pg.LinearRegionItem(movable=False, brush=pg.mkBrush(QColor(230, 159, 0, 40)), pen=pg.mkPen(None))
        self.band.setZValue(-10)

    def update(self, geo, calendar, width: float, font) -> None:
        """Lines for ``geo`` (None: none), labelled from ``calendar`` in ``font``."""
        wanted = {} if geo is None else dict(geo.lines)
        if geo is not None and geo.finish_whisker is not None:
            wanted["p10"], wanted["p90"] = geo.finish_whisker
        for name in list(self.lines):
            if name not in wanted:
                self._remove(name)
        for name, offset in wanted.items():
            line = self.lines.get(name) or self._new_line(name, width, font)
            line.setValue(offset)
            self.strokes[name].setValue(offset)
            line.label.setFormat(label_text(calendar, name, offset))
        self._update_band(None if geo is None else geo.finish_whisker)

    def clear(self) -> None:
        """Remove every line (they are made anew, e.g. for other weights)."""
        for name in list(self.lines):
            self._remove(name)

    def _remove(self, name: str) -> None:
        self.plot.removeItem(self.lines.pop(name))
        self.plot.removeItem(self.strokes.pop(name))

    def _new_line(self, name: str, width: float, font) -> pg.InfiniteLine:
        pen = pg.mkPen(LINE_COLOURS[name], width=width,
                       style=Qt.PenStyle.DashLine if name == "status" else Qt.PenStyle.SolidLine)
        stroke = pg.InfiniteLine(angle=90, movable=False, pen=pen)
        stroke.setZValue(LINE_Z)
        band, anchor = LABEL_PLACES.get(name, (0, (0.0, 0.0)))
        line = pg.InfiniteLine(angle=90, movable=False, pen=pg.mkPen(None), label=LINE_NAMES[name],
                               labelOpts={"position": self._position(band, 1.6 * max(font.pixelSize(), 8)),
                                          "color": LINE_COLOURS[name], "fill": pg.mkBrush(255, 255, 255, 230),
                                          "anchors": [anchor, anchor]})
        line.label.setFont(font)
        line.label.textItem.document().setDocumentMargin(LABEL_MARGIN_PX)   # tight lines of labels
        line.setZValue(LABEL_Z)
        for item in (line, line.label):     # labels show dates; clicks and drags reach the bars under them
            item.setAcceptedMouseButtons(Qt.MouseButton.NoButton)
            item.setAcceptHoverEvents(False)
        for item in (stroke, line):
            self.plot.addItem(item, ignoreBounds=True)
        self.lines[name], self.strokes[name] = line, stroke
        return line

    def _position(self, band: int, label_h: float) -> float:
        """Where on the visible line (0 top, 1 bottom) a label ``label_h`` high on header
        line ``band`` sits."""
        height = max(self.plot.getViewBox().height(), 1.0)
        return min(0.5, (1.0 + band * (label_h + 1.0)) / height)

    def place_labels(self, font, first_row: int = 0) -> None:
        """Set each label on a header line and a side of its line where it covers no label
        placed before it (in the order start, status, deadline, P10, P90) and stays inside
        the view: its own place first, then the other side, then the other header lines
        (as many as the band above the first row holds, at least two). A label with no
        free place is hidden until there is room (zoomed far out): never drawn on another.
        ``first_row``: the row the band sits above (a Present page of later rows)."""
        vb = self.plot.getViewBox()
        box = vb.sceneBoundingRect()
        header = vb.mapViewToScene(QPointF(0, first_row - 0.5)).y() - box.top()
        names = self._names()
        xs = [vb.mapViewToScene(QPointF(self.lines[name].value(), 0)).x() for name in names]
        bands = max(2, int(header // (self.label_height() + 1.0)))
        for name, place in zip(names, label_places(self._spans(names, xs), box.left(), box.right(), bands)):
            label = self.lines[name].label
            label.setVisible(place is not None)
            if place is not None:
                label.anchors = [(place[1], 0.0)] * 2
                label.setPosition(self._position(place[0], label.boundingRect().height()))

    def header_lines(self, x_range: tuple[float, float], width_px: float) -> int:
        """How many header lines the labels take, all apart and inside the view, when
        ``x_range`` (plan units) spans ``width_px`` pixels (what a fit is about to show)."""
        names = self._names()
        if not names:
            return 0
        x0, x1 = x_range
        xs = [(self.lines[name].value() - x0) / max(x1 - x0, 1e-9) * width_px for name in names]
        places = label_places(self._spans(names, xs), 0.0, width_px, len(names))
        return 1 + max((place[0] for place in places if place is not None), default=0)

    def label_height(self) -> float:
        """Height in pixels of a line label (all share one type)."""
        return max((line.label.boundingRect().height() for line in self.lines.values()), default=0.0)

    def _names(self) -> list[str]:
        return sorted(self.lines, key=list(LINE_NAMES).index)

    def _spans(self, names, xs) -> list[tuple]:
        """(x, width, header line, side) of each label: where it stands and its own place."""
        return [(x, self.lines[name].label.boundingRect().width(), *_own_place(name)) for name, x in zip(names, xs)]

    def _update_band(self, whisker) -> None:
        if whisker is None:
            if self.band.scene() is not None:
                self.plot.removeItem(self.band)
            return
        self.band.setRegion(whisker)
        if self.band.scene() is None:
            self.plot.addItem(self.band, ignoreBounds=True)


def _own_place(name: str) -> tuple[int, float]:
    band, anchor = LABEL_PLACES.get(name, (0, (0.0, 0.0)))
    return band, anchor[0]


def label_places(labels, left: float, right: float, bands: int) -> list:
    """Header line and side (0: right of its line, 1: left) of each label, or None when it
    has no free place. ``labels``: (x, width, own header line, own side) in pixels, in the
    order they are placed; ``left``/``right``: the view's edges. Each label takes its own
    place when free, else the other side, else another of the ``bands`` lines; the first
    label is always placed."""
    taken: list[tuple[int, float, float]] = []
    places = []
    for x, width, band, side in labels:
        order = [band] + [b for b in range(bands) if b != band]
        tries = [(b, s) for b in order for s in (side, 1.0 - side)]
        spans = [(b, x - s * width, x + (1 - s) * width) for b, s in tries]
        k = min(range(len(spans)), key=lambda j: (_cost(spans[j], taken, left, right), j))
        if _cost(spans[k], taken, left, right) == 0.0 or not taken:
            taken.append(spans[k])
            places.append(tries[k])
        else:
            places.append(None)
    return places


def _cost(span, taken, left: float, right: float) -> float:
    """Pixels of a label span (header line, left, right) over other labels on its line or
    outside the view: 0 for a free place."""
    b, lo, hi = span
    out = max(0.0, left - lo) + max(0.0, hi - right)
    over = sum(max(0.0, min(hi, hi2 + 4) - max(lo, lo2 - 4)) for b2, lo2, hi2 in taken if b2 == b)
    return 10.0 * out + over


def label_text(calendar, name: str, offset: float) -> str:
    day = calendar.start_date(offset) if name == "start" else calendar.finish_date(max(offset, 0.0))
    return f"{LINE_NAMES[name]} {day.day} {day:%b}"
