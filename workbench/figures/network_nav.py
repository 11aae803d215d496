"""Moving the selection through a Network drawing with the arrow keys. No Qt.

Right goes to a successor, Left to a predecessor (the one drawn nearest in height),
Up and Down to the node above or below in the same column.
"""

from __future__ import annotations

import numpy as np

DIRECTIONS = ("left", "right", "up", "down")


def step(layout, row: int, direction: str) -> int:
    """The row to select after a move from ``row``; ``row`` itself when there is none."""
    if direction not in DIRECTIONS:
        raise ValueError(f"unknown direction {direction!r} (use left, right, up or down)")
    if row < 0 or row >= len(layout.nodes):
        return 0 if layout.nodes else -1
    y = layout.boxes[:, 1]
    if direction in ("left", "right"):
        preds, succs = layout.neighbours(row)
        options = np.array(succs if direction == "right" else preds, dtype=np.int64)
        if not options.size:
            return row
        return int(options[np.argmin(np.abs(y[options] - y[row]))])
    column = np.flatnonzero(layout.boxes[:, 0] == layout.boxes[row, 0])
    if direction == "up":
        above = column[y[column] < y[row]]
        return int(above[np.argmax(y[above])]) if above.size else row
    below = column[y[column] > y[row]]
    return int(below[np.argmin(y[below])]) if below.size else row
