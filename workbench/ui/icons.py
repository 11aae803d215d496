"""Our own SVG glyphs (resources/icons), drawn in the palette's text colour at any size,
so they stay crisp at high DPI and follow a light or dark system palette."""

from __future__ import annotations

from functools import lru_cache

from PySide6.QtCore import QByteArray, QRect, QRectF, QSize, Qt
from PySide6.QtGui import QGuiApplication, QIcon, QIconEngine, QPainter, QPalette, QPixmap
from PySide6.QtSvg import QSvgRenderer

from workbench.resources import resources_dir

RESOURCES = resources_dir()
ICON_DIR = RESOURCES / "icons"
APP_ICON_DIR = RESOURCES / "icon"      # the installed app icon: slackline.svg and PNG sizes


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
    if name == "app":
        return app_icon()
    if not _svg_text(name):
        return QIcon()
    return QIcon(GlyphEngine(name))


def app_icon() -> QIcon:
    """Slackline's own icon (the one installed for the desktop): the SVG, with the
    rendered PNG sizes beside it for the sizes where a raster is crisper."""
    result = QIcon()
    svg = APP_ICON_DIR / "slackline.svg"
    if svg.exists():
        result.addFile(str(svg))       # first: the scalable engine, which also takes the PNGs
    for png in sorted(APP_ICON_DIR.glob("slackline-*.png")):
        result.addFile(str(png))
    return result
