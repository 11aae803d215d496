"""Small Qt helpers for painting the Network: colours, fonts, pens, clipping."""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QColor, QFont, QPen


def colour(hex_text: str, alpha: int = 255) -> QColor:
    c = QColor(hex_text)
    c.setAlpha(alpha)
    return c


def font(size: float, bold: bool = False) -> QFont:
    f = QFont()
    f.setPixelSize(max(1, int(round(size))))
    f.setBold(bold)
    return f


def pen(hex_text: str, units: float, scale: float, style=Qt.SolidLine) -> QPen:
    """A cosmetic pen as wide as ``units`` at this scale, never thinner than one pixel."""
    p = QPen(colour(hex_text), max(1.0, units * scale))
    p.setCosmetic(True)
    p.setStyle(style)
    p.setJoinStyle(Qt.MiterJoin)
    return p


def two_lines(rect) -> tuple[QRectF, QRectF]:
    x, y, w, h = rect
    return QRectF(x, y, w, h / 2), QRectF(x, y + h / 2, w, h / 2)


def inside(points: np.ndarray, v: QRectF, pad: float) -> np.ndarray:
    """Indices of points within the visible rectangle grown by ``pad``."""
    if not len(points):
        return np.zeros(0, dtype=np.int64)
    x, y = points[:, 0], points[:, 1]
    return np.flatnonzero((x >= v.left() - pad) & (x <= v.right() + pad) & (y >= v.top() - pad) & (y <= v.bottom() + pad))


def clip(seg: np.ndarray, r: QRectF) -> np.ndarray:
    """Segments (m, 4) clipped to a rectangle (Liang–Barsky, vectorised); misses dropped."""
    x0, y0, x1, y1 = seg.T
    dx, dy = x1 - x0, y1 - y0
    lo, hi = np.zeros(len(seg)), np.ones(len(seg))
    for d, start, a, b in ((dx, x0, r.left(), r.right()), (dy, y0, r.top(), r.bottom())):
        flat = np.abs(d) < 1e-12
        safe = np.where(flat, 1.0, d)
        t0, t1 = (a - start) / safe, (b - start) / safe
        lo = np.where(flat, lo, np.maximum(lo, np.minimum(t0, t1)))
        hi = np.where(flat, hi, np.minimum(hi, np.maximum(t0, t1)))
    keep = lo <= hi
    lo, hi = lo[keep], hi[keep]
    return np.column_stack((x0[keep] + lo * dx[keep], y0[keep] + lo * dy[keep],
                            x0[keep] + hi * dx[keep], y0[keep] + hi * dy[keep]))
