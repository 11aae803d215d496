"""Screen repaints of a text-heavy axis from a cached image.

Drawing many labels is the costly part of repainting the Timeline. On screen (an image or
a widget at 1:1) an axis using this mixin blits an image of itself, redrawn only when its
range, size or content change; on paper, PDF and SVG it draws its text as vectors.
"""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QImage, QPainter
from PySide6.QtWidgets import QWidget


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

    def paint(self, p, opt, widget):
        content = self.cache_content()
        device = p.device()
        if content is None or abs(p.combinedTransform().m11() - 1.0) > 1e-6 \
                or not isinstance(device, (QImage, QWidget)):
            super().paint(p, opt, widget)
            return
        rect = self.boundingRect()
        ratio = device.devicePixelRatioF()
        key = (tuple(self.range), rect.width(), rect.height(), content, ratio)
        if self._image is None or self.picture is None or key != self._image_key:
            image = QImage(int(rect.width() * ratio) + 1, int(rect.height() * ratio) + 1,
                           QImage.Format.Format_ARGB32_Premultiplied)
            image.setDevicePixelRatio(ratio)
            image.fill(Qt.GlobalColor.transparent)
            painter = QPainter(image)
            painter.translate(-rect.topLeft())
            super().paint(painter, opt, widget)
            painter.end()
            self._image, self._image_key = image, key
        p.drawImage(rect.topLeft(), self._image)
