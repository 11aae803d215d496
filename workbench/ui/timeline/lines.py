"""The Timeline's reference lines: project start, deadline, status date and, after a
simulation, the Finish P10 / P90 lines over an orange band, each labelled with its date."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtGui import QColor

from workbench.figures import style

LINE_NAMES = {"start": "Start", "deadline": "Deadline", "status": "Status",
              "p10": "Finish P10", "p90": "Finish P90"}
LINE_COLOURS = {"start": style.TEXT, "deadline": style.DEADLINE, "status": style.STATUS,
                "p10": style.PROBABILITY, "p90": style.PROBABILITY}
LABEL_PLACES = {"deadline": (0.01, (1.0, 0.0)), "p10": (0.99, (1.0, 1.0)), "p90": (0.99, (1.0, 1.0))}


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
        position, anchor = LABEL_PLACES.get(name, (0.01, (0.0, 0.0)))
        line = pg.InfiniteLine(angle=90, movable=False, pen=pg.mkPen(None), label=LINE_NAMES[name],
                               labelOpts={"position": position,
                                          "color": LINE_COLOURS[name], "fill": pg.mkBrush(255, 255, 255, 230),
                                          "anchors": [anchor, anchor]})
        line.label.setFont(font)
        line.setZValue(LABEL_Z)
        for item in (stroke, line):
            self.plot.addItem(item, ignoreBounds=True)
        self.lines[name], self.strokes[name] = line, stroke
        return line

    def _update_band(self, whisker) -> None:
        if whisker is None:
            if self.band.scene() is not None:
                self.plot.removeItem(self.band)
            return
        self.band.setRegion(whisker)
        if self.band.scene() is None:
            self.plot.addItem(self.band, ignoreBounds=True)


def label_text(calendar, name: str, offset: float) -> str:
    day = calendar.start_date(offset) if name == "start" else calendar.finish_date(max(offset, 0.0))
    return f"{LINE_NAMES[name]} {day.day} {day:%b}"
