"""Progress and baseline columns of an exported table.

A plan with progress exports its progress inputs right after the plan columns (so the
table re-imports to the same progress) and, after the computed columns, each activity's
``state`` and ``remaining_mean``; with a baseline compared, its dates and the variances
(plan units, positive = later). Computed columns are ignored on import.
"""

from __future__ import annotations

import datetime as dt

from workbench.core.progress import has_progress
from workbench.core.progress_json import progress_columns, variance_columns

from .table_export import HEADER, PLAN_COLUMNS, table_rows

PROGRESS_COLUMNS = ("actual_start", "actual_finish", "remaining_optimistic", "remaining_most_likely",
                    "remaining_pessimistic", "remaining", "percent_complete")
PROGRESS_COMPUTED = ("state", "remaining_mean")
VARIANCE_COLUMNS = ("baseline_start", "baseline_finish", "start_variance", "finish_variance")


def _cell(value):
    if value is None or isinstance(value, dt.date):
        return value
    return float(value)


def progress_cells(act) -> list:
    p = act.progress
    if p is None:
        return [None] * len(PROGRESS_COLUMNS)
    return [_cell(getattr(p, k)) for k in PROGRESS_COLUMNS]


def table_layout(analysis, variance=None) -> tuple[tuple, list[list]]:
    """(header, rows) of the export: the plain table, with progress and variance columns
    when the plan has progress or a baseline is compared."""
    rows = table_rows(analysis)
    header = HEADER
    if analysis.progress is not None or has_progress(analysis.plan):
        k = len(PLAN_COLUMNS)
        extra = progress_columns(analysis)
        rows = [r[:k] + progress_cells(a) + r[k:] + [extra["state"][j], extra["remaining_mean"][j]]
                for j, (r, a) in enumerate(zip(rows, analysis.plan.activities))]
        header = HEADER[:k] + PROGRESS_COLUMNS + HEADER[k:] + PROGRESS_COMPUTED
    if variance is not None:
        cols = variance_columns(variance)
        dates = {k: [None if d is None else dt.date.fromisoformat(d) for d in cols[k]]
                 for k in ("baseline_start", "baseline_finish")}
        rows = [r + [dates["baseline_start"][j], dates["baseline_finish"][j],
                     cols["start_variance"][j], cols["finish_variance"][j]] for j, r in enumerate(rows)]
        header = header + VARIANCE_COLUMNS
    return header, rows
