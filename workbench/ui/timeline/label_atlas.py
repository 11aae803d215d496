"""Row labels of the Timeline drawn once into one image and stamped from it.

Each label (text, width, weight) gets a slot in a tall image the first time it is shown;
after that every label on screen is copied from its slot in a single call, whatever the
zoom or pan. The image is rebuilt when the type, the column width, the colour or the
pixel ratio change, or when it is full.
"""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QColor, QFont, QPainter, QPixmap

from workbench.ui.timeline.batch import shared_array

MAX_HEIGHT_PX = 4096       # image height (a few screens of labels); when full it starts afresh


class TimelineLabelAtlas:
    def __init__(self):
        self.image: QPixmap | None = None
        self._key = None
        self._slots: dict[tuple, int] = {}
        self._line = 1.0
        self.generation = 0       # counts fresh starts: slots handed out before one are void
        self._fragments = shared_array(QPainter.PixmapFragment, 10)

    def _reset(self, key, width: float, line: float, ratio: float, at_least: int) -> None:
        self._key, self._line, self._slots = key, line, {}
        self.generation += 1
        rows = max(2 * at_least, int(MAX_HEIGHT_PX / (line * ratio)))   # always room for one screen
        self.image = QPixmap(int(np.ceil(width * ratio)) + 1, int(np.ceil(rows * line * ratio)))
        self.image.setDevicePixelRatio(ratio)
        self.image.fill(Qt.GlobalColor.transparent)

    def _capacity(self) -> int:
        return int(self.image.height() / self.image.devicePixelRatio() / self._line)

    @staticmethod
    def key_for(font: QFont, colour: QColor, width: float, line: float, ratio: float) -> tuple:
        """What the image depends on; another key means drawing afresh."""
        return (font.key(), round(width), round(line, 3), colour.rgba(), ratio)

    def holds(self, key: tuple) -> bool:
        """True when the image was drawn for ``key`` (its slots are valid for it)."""
        return self.image is not None and key == self._key

    def slots_for(self, labels, font: QFont, colour: QColor, width: float, line: float, ratio: float) -> np.ndarray:
        """Slot of each ``(text, label width, bold)``, drawing the ones not seen before."""
        key = self.key_for(font, colour, width, line, ratio)
        if key != self._key or len(self._slots) + len(labels) > self._capacity():
            self._reset(key, width, line, ratio, len(labels))
        new = [lab for lab in dict.fromkeys(labels) if lab not in self._slots]
        if new:
            self._draw(new, font, colour)
        return np.fromiter((self._slots[lab] for lab in labels), dtype=float, count=len(labels))

    def _draw(self, labels, font: QFont, colour: QColor) -> None:
        bold = QFont(font)
        bold.setBold(True)
        p = QPainter(self.image)
        p.setRenderHint(QPainter.RenderHint.TextAntialiasing)
        p.setPen(colour)
        for text, width, is_bold in labels:
            slot = len(self._slots)
            self._slots[(text, width, is_bold)] = slot
            p.setFont(bold if is_bold else font)
            p.drawText(QRectF(0, slot * self._line, width, self._line),
                       int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignVCenter), text)
        p.end()

    def stamp(self, p: QPainter, x, top, width, slots) -> bool:
        """Copy the slots to (x, top) (whole pixels) on ``p`` in one call; False when it cannot batch."""
        if self._fragments is None or self.image is None:
            return False
        n = len(slots)
        if not n:
            return True
        r = self.image.devicePixelRatio()
        self._fragments.resize(n)
        m = self._fragments.ndarray()
        m[:, 0] = np.asarray(x) + np.asarray(width) / 2          # centre (whole-pixel corners)
        m[:, 1] = np.asarray(top) + self._line / 2
        m[:, 2] = 0.0                                            # source left, top, width, height
        m[:, 3] = np.asarray(slots) * self._line * r
        m[:, 4] = np.asarray(width) * r
        m[:, 5] = self._line * r
        m[:, 6:8] = 1.0 / r                                      # scale
        m[:, 8], m[:, 9] = 0.0, 1.0                              # rotation, opacity
        p.drawPixmapFragments(*self._fragments.drawargs(), self.image)
        return True
