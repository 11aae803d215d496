"""Screen repaints of a text-heavy axis from a cached image.

Drawing many labels is the costly part of repainting the Timeline. An axis using this
mixin draws its ticks and labels straight onto the painter (no intermediate recording)
after a change; once it is painted again unchanged on screen (an image or a widget at
1:1) it keeps an image of itself and blits that until its range, size or content change.
On paper, PDF and SVG it always draws its text as vectors.
"""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QImage, QPainter, QPicture, QPixmap
from PySide6.QtWidgets import QWidget

RASTER = (QImage, QPixmap, QWidget)


class TimelineAxisCache:
    """Mixin for a pyqtgraph AxisItem subclass: put it first among the bases."""

    _image: QImage | None = None
    _image_key = None

    def cache_content(self):
        """What else the picture depends on (override); None means: do not cache."""
        return None

    def drop_cache(self) -> None:
        """Redraw from scratch at the next paint."""
        self.picture = self._image = self._image_key = None
        self.update()

    def draw_now(self, p: QPainter) -> None:
        """Ticks and labels straight onto ``p`` (what pyqtgraph records into a picture)."""
        p.save()
        if self.style["tickFont"]:
            p.setFont(self.style["tickFont"])
        specs = self.generateDrawSpecs(p)
        if specs is not None:
            self.drawPicture(p, *specs)
        p.restore()

    def paint(self, p, opt, widget):
        content = self.cache_content()
        if self.picture is None:          # pyqtgraph's own "something changed" mark
            self._image = self._image_key = None
            self.picture = QPicture()
        if content is None or abs(p.combinedTransform().m11() - 1.0) > 1e-6 \
                or not isinstance(p.device(), RASTER):
            self.draw_now(p)
            return
        rect = self.boundingRect()
        ratio = p.device().devicePixelRatioF()
        key = (tuple(self.range), rect.width(), rect.height(), content, ratio)
        if self._image is not None and key == self._image_key:
            p.drawImage(rect.topLeft(), self._image)
        elif key == self._image_key:       # painted again unchanged: keep an image
            self._image = self._record(rect, ratio)
            p.drawImage(rect.topLeft(), self._image)
        else:                              # just changed: draw, keep nothing yet
            self._image, self._image_key = None, key
            self.draw_now(p)

    def _record(self, rect, ratio: float) -> QImage:
        image = QImage(int(rect.width() * ratio) + 1, int(rect.height() * ratio) + 1,
                       QImage.Format.Format_ARGB32_Premultiplied)
        image.setDevicePixelRatio(ratio)
        image.fill(Qt.GlobalColor.transparent)
        painter = QPainter(image)
        painter.translate(-rect.topLeft())
        self.draw_now(painter)
        painter.end()
        return image
