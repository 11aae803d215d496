"""A QPainter behind the small part of the reportlab canvas interface the approval pack's
chart painters use, so Present mode shows the very same drawings as the printed pack,
scaled up for a projector. Coordinates are y-up points, as on paper."""

from __future__ import annotations

from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QBrush, QColor, QFont, QFontMetricsF, QPainter, QPainterPath, QPen
from reportlab.pdfbase.pdfmetrics import stringWidth

TEXT_SCALE = 10.0   # fonts are set at 10× pixel size and drawn scaled down: fractional sizes


def qcolor(colour) -> QColor:
    """A reportlab colour (or a QColor) as a QColor."""
    if isinstance(colour, QColor):
        return colour
    return QColor.fromRgbF(float(colour.red), float(colour.green), float(colour.blue),
                           float(getattr(colour, "alpha", 1.0)))


class PresentPath:
    """The path-building calls the painters make, collected into a QPainterPath."""

    def __init__(self):
        self.path = QPainterPath()

    def moveTo(self, x, y):  # noqa: N802 (reportlab's names)
        self.path.moveTo(float(x), float(y))

    def lineTo(self, x, y):  # noqa: N802
        self.path.lineTo(float(x), float(y))

    def rect(self, x, y, w, h):
        self.path.addRect(QRectF(float(x), float(y), float(w), float(h)))

    def close(self):
        self.path.closeSubpath()


class PresentCanvas:
    """Draws on ``painter``, whose transform already maps y-up points to the widget."""

    def __init__(self, painter: QPainter):
        self.p = painter
        self.p.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        self._fill = QColor("black")
        self._font = ("Helvetica", 10.0)
        self._stack = []
        self._pen = QPen(QColor("black"), 1.0)
        self._pen.setCapStyle(Qt.PenCapStyle.FlatCap)
        self._dash = None

    # --- state -------------------------------------------------------------------
    def saveState(self):  # noqa: N802
        self._stack.append((QColor(self._fill), self._font, QPen(self._pen), self._dash))
        self.p.save()

    def restoreState(self):  # noqa: N802
        self._fill, self._font, self._pen, self._dash = self._stack.pop()
        self.p.restore()

    def setFillColor(self, colour):  # noqa: N802
        self._fill = qcolor(colour)

    def setStrokeColor(self, colour):  # noqa: N802
        self._pen.setColor(qcolor(colour))

    def setLineWidth(self, width):  # noqa: N802
        self._pen.setWidthF(float(width))
        self._apply_dash()

    def setDash(self, on=None, off=None):  # noqa: N802
        if on is None or on == [] or on == ():
            self._dash = None
        else:
            self._dash = (float(on), float(off if off is not None else on))
        self._apply_dash()

    def _apply_dash(self):
        if self._dash is None:
            self._pen.setStyle(Qt.PenStyle.SolidLine)
            return
        width = max(self._pen.widthF(), 1e-3)
        self._pen.setDashPattern([max(self._dash[0] / width, 0.1), max(self._dash[1] / width, 0.1)])

    def setFont(self, name, size, leading=None):  # noqa: N802
        self._font = (name, float(size))

    def translate(self, dx, dy):
        self.p.translate(float(dx), float(dy))

    # --- shapes ------------------------------------------------------------------
    def _draw(self, path: QPainterPath, stroke, fill):
        self.p.setPen(self._pen if stroke else Qt.PenStyle.NoPen)
        self.p.setBrush(QBrush(self._fill) if fill else Qt.BrushStyle.NoBrush)
        self.p.drawPath(path)

    def rect(self, x, y, w, h, stroke=1, fill=0):
        path = QPainterPath()
        path.addRect(QRectF(float(x), float(y), float(w), float(h)))
        self._draw(path, stroke, fill)

    def circle(self, x, y, r, stroke=1, fill=0):
        path = QPainterPath()
        path.addEllipse(QPointF(float(x), float(y)), float(r), float(r))
        self._draw(path, stroke, fill)

    def line(self, x1, y1, x2, y2):
        self.p.setPen(self._pen)
        self.p.drawLine(QPointF(float(x1), float(y1)), QPointF(float(x2), float(y2)))

    def beginPath(self):  # noqa: N802
        return PresentPath()

    def drawPath(self, path: PresentPath, stroke=1, fill=0, **_):  # noqa: N802
        self._draw(path.path, stroke, fill)

    def clipPath(self, path: PresentPath, stroke=0, fill=0, **_):  # noqa: N802
        self.p.setClipPath(path.path, Qt.ClipOperation.IntersectClip)

    # --- text --------------------------------------------------------------------
    def stringWidth(self, text, font=None, size=None):  # noqa: N802
        name, default = self._font
        return stringWidth(str(text), font or name, size or default)

    def _qfont(self) -> QFont:
        name, size = self._font
        font = QFont("Helvetica")
        font.setPixelSize(max(1, round(size * TEXT_SCALE)))
        font.setBold("Bold" in name)
        return font

    def _text(self, x, y, text, anchor: float):
        """Draw text with its baseline at y; anchor 0 = left, 0.5 = centre, 1 = right.
        The text is squeezed to the width the paper fonts give it, so layouts match."""
        text = str(text)
        font = self._qfont()
        qt_w = QFontMetricsF(font).horizontalAdvance(text) / TEXT_SCALE
        rl_w = self.stringWidth(text)
        squeeze = min(1.0, rl_w / qt_w) if qt_w > 0 else 1.0
        self.p.save()
        self.p.translate(float(x) - anchor * rl_w, float(y))
        self.p.scale(squeeze / TEXT_SCALE, -1.0 / TEXT_SCALE)
        self.p.setFont(font)
        self.p.setPen(QPen(self._fill))
        self.p.drawText(QPointF(0.0, 0.0), text)
        self.p.restore()

    def drawString(self, x, y, text, *_, **__):  # noqa: N802
        self._text(x, y, text, 0.0)

    def drawRightString(self, x, y, text, *_, **__):  # noqa: N802
        self._text(x, y, text, 1.0)

    def drawCentredString(self, x, y, text, *_, **__):  # noqa: N802
        self._text(x, y, text, 0.5)
