"""Which rows of the Activities table an analysis changed, so that a re-analysis repaints
(and re-filters, re-sorts) only those rows instead of all of them."""

from __future__ import annotations

import numpy as np

MAX_RUNS = 64   # more separate runs than this: one range from the first to the last


def changed_rows(old: dict, new: dict, old_ids, new_ids) -> np.ndarray | None:
    """Rows whose computed values differ between two column sets ({key: values per row}),
    or None when that cannot be told (no earlier columns, other rows or other columns)."""
    if not old or not new or old.keys() != new.keys() or list(old_ids) != list(new_ids):
        return None
    mask = np.zeros(len(new_ids), dtype=bool)
    for key, values in new.items():
        diff = _differs(old[key], values, len(mask))
        if diff is None:
            return None
        mask |= diff
    return np.flatnonzero(mask)


def _differs(a, b, n: int) -> np.ndarray | None:
    if a is b or (isinstance(a, list) and isinstance(b, list) and a == b):
        return np.zeros(n, dtype=bool)
    a, b = _array(a), _array(b)
    if a.shape != (n,) or b.shape != (n,):
        return None
    diff = np.asarray(a != b, dtype=bool)
    if a.dtype.kind == "f" and b.dtype.kind == "f":
        diff &= ~(np.isnan(a) & np.isnan(b))
    return diff


def _array(values) -> np.ndarray:
    if isinstance(values, np.ndarray):
        return values
    out = np.empty(len(values), dtype=object)
    out[:] = values
    return out


def row_runs(rows: np.ndarray) -> list[tuple[int, int]]:
    """Sorted rows as (first, last) runs of neighbours; past MAX_RUNS one covering run."""
    if not len(rows):
        return []
    breaks = np.flatnonzero(np.diff(rows) > 1)
    if len(breaks) >= MAX_RUNS:
        return [(int(rows[0]), int(rows[-1]))]
    firsts = np.concatenate(([rows[0]], rows[breaks + 1]))
    lasts = np.concatenate((rows[breaks], [rows[-1]]))
    return list(zip(firsts.tolist(), lasts.tolist()))
