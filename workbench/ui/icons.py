"""Our own SVG glyphs (resources/icons), drawn in the palette's text colour at any size,
so they stay crisp at high DPI and follow a light or dark system palette."""

from __future__ import annotations

from functools import lru_cache
from pathlib import Path

from PySide6.QtCore import QByteArray, QRect, QRectF, QSize, Qt
from PySide6.QtGui import QGuiApplication, QIcon, QIconEngine, QPainter, QPalette, QPixmap
from PySide6.QtSvg import QSvgRenderer

RESOURCES = Path(__file__).resolve().parents[2] / "resources"
ICON_DIR = RESOURCES / "icons"


@lru_cache(maxsize=None)
def _svg_text(name: str) -> str:
    path = ICON_DIR / f"{name}.svg"
    return path.read_text(encoding="utf-8") if path.exists() else ""


class GlyphEngine(QIconEngine):
    """Renders one SVG glyph with ``currentColor`` replaced by the palette text colour."""

    def __init__(self, name: str):
        super().__init__()
        self.name = name

    def _renderer(self, mode) -> QSvgRenderer:
        palette = QGuiApplication.palette()
        group = QPalette.ColorGroup.Disabled if mode == QIcon.Mode.Disabled else QPalette.ColorGroup.Active
        colour = palette.color(group, QPalette.ColorRole.WindowText).name()
        text = _svg_text(self.name).replace("currentColor", colour)
        return QSvgRenderer(QByteArray(text.encode("utf-8")))

    def paint(self, painter: QPainter, rect: QRect, mode, state) -> None:
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        self._renderer(mode).render(painter, QRectF(rect))

    def pixmap(self, size: QSize, mode, state) -> QPixmap:
        pix = QPixmap(size)
        pix.fill(Qt.GlobalColor.transparent)
        painter = QPainter(pix)
        self.paint(painter, QRect(0, 0, size.width(), size.height()), mode, state)
        painter.end()
        return pix

    def scaledPixmap(self, size: QSize, mode, state, scale: float) -> QPixmap:
        pix = self.pixmap(QSize(round(size.width() * scale), round(size.height() * scale)), mode, state)
        pix.setDevicePixelRatio(scale)
        return pix

    def clone(self) -> "GlyphEngine":
        return GlyphEngine(self.name)


def icon(name: str) -> QIcon:
    """The named glyph as a QIcon (an empty icon if the file is missing)."""
    if not _svg_text(name):
        return QIcon()
    if name == "app":
        return QIcon(str(ICON_DIR / "app.svg"))
    return QIcon(GlyphEngine(name))
