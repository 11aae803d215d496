"""The Qt part of ``slackline --self-test``: the offscreen platform, fonts and the SVG module."""

from __future__ import annotations

import os


def check_qt() -> str:
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtCore import QByteArray
    from PySide6.QtGui import QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer
    from PySide6.QtWidgets import QApplication

    app = QApplication.instance() or QApplication([])
    image = QImage(64, 64, QImage.Format.Format_ARGB32)
    image.fill(0)
    painter = QPainter(image)
    painter.drawText(4, 30, "Slackline")
    svg = QSvgRenderer(QByteArray(b'<svg xmlns="http://www.w3.org/2000/svg" width="8" height="8">'
                                  b'<rect width="8" height="8" fill="#D55E00"/></svg>'))
    svg.render(painter)
    painter.end()
    if not svg.isValid() or image.pixelColor(2, 2).name().lower() != "#d55e00":
        raise RuntimeError("the SVG renderer drew nothing")
    return f"Qt on {app.platformName()}, SVG rendering works"
