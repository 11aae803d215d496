"""Our SVG glyphs: every one renders, crisp at 2× scale, in the palette's text colour."""

import pytest
from PySide6.QtCore import QSize
from PySide6.QtGui import QColor, QGuiApplication, QIcon, QPalette

from workbench.ui.icons import ICON_DIR, icon

NAMES = sorted(p.stem for p in ICON_DIR.glob("*.svg"))


def opaque_colours(image) -> set[str]:
    return {image.pixelColor(x, y).name() for y in range(image.height()) for x in range(image.width())
            if image.pixelColor(x, y).alpha() == 255}


@pytest.mark.parametrize("name", NAMES)
def test_icon_renders_at_1x_and_2x(qapp, name):
    glyph = icon(name)
    assert not glyph.isNull()
    small = glyph.pixmap(QSize(16, 16), 1.0).toImage()
    large = glyph.pixmap(QSize(16, 16), 2.0).toImage()
    assert (large.width(), large.height()) == (32, 32)  # drawn at device resolution, not scaled up
    assert opaque_colours(small) and len(opaque_colours(large)) >= 1


def test_glyphs_follow_the_palette_text_colour(qapp):
    original = QGuiApplication.palette()
    try:
        for colour in ("#123456", "#e8e8e8"):
            palette = QPalette(original)
            palette.setColor(QPalette.ColorGroup.Active, QPalette.ColorRole.WindowText, QColor(colour))
            QGuiApplication.setPalette(palette)
            image = icon("save").pixmap(QSize(48, 48), QIcon.Mode.Normal).toImage()
            assert colour in opaque_colours(image)
    finally:
        QGuiApplication.setPalette(original)
    assert len(NAMES) >= 15
