"""Arrays of rectangles or line segments that Qt reads in place, for batched drawing;
many rectangles or lines in one call; pens and colours made once.

A numpy array of 4 floats a row has the memory layout of QRectF / QLineF. Qt is handed a
pointer to its first row and a count; the pointer is made once per allocation (not per
draw call, which costs a few microseconds a time on every paint).
"""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QLineF, QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QPainter, QPen

try:
    from pyqtgraph.Qt.compat import wrapinstance
    from pyqtgraph.Qt.internals import PrimitiveArray
except ImportError:  # pragma: no cover - older pyqtgraph
    PrimitiveArray = None


class TimelineBatch:
    """A growing array of QRectF, QLineF or pixmap fragments (``klass``, ``fields`` floats
    each); the methods of pyqtgraph's PrimitiveArray: ``resize(n)``, ``ndarray()`` (n ×
    fields), ``drawargs()``."""

    def __init__(self, klass, fields: int = 4):
        self.klass, self.array, self.ptr, self.n = klass, np.empty((0, fields)), None, 0

    def resize(self, n: int) -> None:
        if n > self.array.shape[0]:
            self.array = np.empty((max(n, 2 * self.array.shape[0], 64), self.array.shape[1]))
            self.ptr = wrapinstance(self.array.ctypes.data, self.klass)
        self.n = n

    def ndarray(self) -> np.ndarray:
        return self.array[:self.n]

    def drawargs(self) -> tuple:
        return self.ptr, self.n


def shared_array(klass, fields: int = 4):
    """A TimelineBatch where the Qt binding reads arrays through a pointer; otherwise
    pyqtgraph's own PrimitiveArray; None without either (then callers make Qt objects)."""
    if PrimitiveArray is None:
        return None
    plain = PrimitiveArray(klass, fields)
    return TimelineBatch(klass, fields) if plain.use_ptr_to_array else plain


_RECTS = shared_array(QRectF)
_LINES = shared_array(QLineF)
_PENS: dict[tuple, QPen] = {}
_COLOURS: dict[str, QColor] = {}


def pen(colour: str, width: float, dash: bool = False) -> QPen:
    """A flat-capped pen (made once per colour, width and dash; do not modify it)."""
    key = (colour, width, dash)
    found = _PENS.get(key)
    if found is None:
        found = _PENS[key] = QPen(QColor(colour))
        found.setWidthF(max(width, 0.5))
        found.setCapStyle(Qt.PenCapStyle.FlatCap)
        found.setJoinStyle(Qt.PenJoinStyle.MiterJoin)
        if dash:
            found.setStyle(Qt.PenStyle.DashLine)
    return found


def colour_of(name: str) -> QColor:
    """The QColor of a palette colour (made once)."""
    found = _COLOURS.get(name)
    if found is None:
        found = _COLOURS[name] = QColor(name)
    return found


def common_size(*values) -> int:
    """Common length of arrays and scalars (scalars stretch); 0 when an array is empty."""
    n = 1
    for v in values:
        k = v.size if isinstance(v, np.ndarray) else 1 if isinstance(v, (float, int)) else np.size(v)
        if not k:
            return 0
        n = max(n, k)
    return n


def whole_pixels(m, x, y, w, h) -> None:
    """Rectangles rounded to whole pixels (crisp, even lines) into the rows of ``m``."""
    x0 = np.rint(x)
    m[:, 0] = x0
    m[:, 2] = np.rint(x + w) - x0
    hh = np.maximum(np.rint(h), 1.0)
    m[:, 3] = hh
    m[:, 1] = np.rint(y + (h - hh) / 2)


def rects(p: QPainter, x, y, w, h) -> None:
    """Draw many rectangles in one call (numpy-backed when the Qt binding allows it)."""
    rects_of(p, (x, y, w, h))


def rects_of(p: QPainter, *parts) -> None:
    """Several groups of ``(x, y, w, h)`` rectangles in the same pen and brush, one call."""
    sizes = [common_size(*part) for part in parts]
    n = sum(sizes)
    if not n:
        return
    if _RECTS is None:
        m = np.empty((n, 4))
    else:
        _RECTS.resize(n)
        m = _RECTS.ndarray()
    at = 0
    for part, k in zip(parts, sizes):
        if k:
            whole_pixels(m[at:at + k], np.asarray(part[0], float), *part[1:])
            at += k
    if _RECTS is None:
        p.drawRects([QRectF(*v) for v in m.tolist()])
        return
    p.drawRects(*_RECTS.drawargs())


def lines(p: QPainter, x0, y0, x1, y1) -> None:
    """Draw many line segments in one call."""
    n = common_size(x0, y0, x1, y1)
    if not n:
        return
    if _LINES is None:
        x0, y0, x1, y1 = np.broadcast_arrays(*(np.asarray(v, float) for v in (x0, y0, x1, y1)))
        p.drawLines([QLineF(*v) for v in zip(x0.tolist(), y0.tolist(), x1.tolist(), y1.tolist())])
        return
    _LINES.resize(n)
    m = _LINES.ndarray()
    m[:, 0], m[:, 1], m[:, 2], m[:, 3] = x0, y0, x1, y1
    p.drawLines(*_LINES.drawargs())


def axis_and_ticks(p: QPainter, p1: QPointF, p2: QPointF, x0, y0, x1, y1) -> None:
    """An axis line ``p1`` → ``p2`` and its tick segments, in one call."""
    if _LINES is None:
        p.drawLine(p1, p2)
        lines(p, x0, y0, x1, y1)
        return
    _LINES.resize(common_size(x0, y0, x1, y1) + 1)
    m = _LINES.ndarray()
    m[0] = p1.x(), p1.y(), p2.x(), p2.y()
    m[1:, 0], m[1:, 1], m[1:, 2], m[1:, 3] = x0, y0, x1, y1
    p.drawLines(*_LINES.drawargs())
