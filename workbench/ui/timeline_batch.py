"""Arrays of rectangles or line segments that Qt reads in place, for batched drawing.

A numpy array of 4 floats a row has the memory layout of QRectF / QLineF. Qt is handed a
pointer to its first row and a count; the pointer is made once per allocation (not per
draw call, which costs a few microseconds a time on every paint).
"""

from __future__ import annotations

import numpy as np

try:
    from pyqtgraph.Qt.compat import wrapinstance
    from pyqtgraph.Qt.internals import PrimitiveArray
except ImportError:  # pragma: no cover - older pyqtgraph
    PrimitiveArray = None


class TimelineBatch:
    """A growing array of QRectF or QLineF (``klass``); the methods of pyqtgraph's
    PrimitiveArray: ``resize(n)``, ``ndarray()`` (n × 4 floats), ``drawargs()``."""

    def __init__(self, klass):
        self.klass, self.array, self.ptr, self.n = klass, np.empty((0, 4)), None, 0

    def resize(self, n: int) -> None:
        if n > self.array.shape[0]:
            self.array = np.empty((max(n, 2 * self.array.shape[0], 64), 4))
            self.ptr = wrapinstance(self.array.ctypes.data, self.klass)
        self.n = n

    def ndarray(self) -> np.ndarray:
        return self.array[:self.n]

    def drawargs(self) -> tuple:
        return self.ptr, self.n


def shared_array(klass):
    """A TimelineBatch where the Qt binding reads arrays through a pointer; otherwise
    pyqtgraph's own PrimitiveArray; None without either (then callers make Qt objects)."""
    if PrimitiveArray is None:
        return None
    return TimelineBatch(klass) if PrimitiveArray(klass, 4).use_ptr_to_array else PrimitiveArray(klass, 4)
