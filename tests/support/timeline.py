"""Where an activity's bar is in a Timeline view's geometry (shared by the Timeline and menu tests)."""

import numpy as np


def bar_of(view, act_id: str) -> tuple[str, int, float, float]:
    """(kind, row, x0, x1) of ``act_id``'s bar: a critical or an ordinary work bar."""
    geo = view.geometry
    row = geo.row_of[act_id]
    for kind in ("critical", "work"):
        m = geo.marks[kind]
        hit = np.flatnonzero(m.rows == row)
        if hit.size:
            return kind, row, float(m.x0[hit[0]]), float(m.x1[hit[0]])
    raise AssertionError(f"{act_id} has no bar")
