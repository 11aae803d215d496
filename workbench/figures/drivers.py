"""Geometry of the Drivers view: which activities drive the finish.

Two rankings from a simulation: the criticality index (share of iterations in which an
activity lies on the critical path, 0..1) and the sensitivity (correlation of an
activity's duration with the project finish, −1..1, drawn as a tornado: negative to the
left of zero, positive to the right). The top N rows are kept in order and the rest are
folded into one "N others" row carrying the largest remaining value. Pure numpy.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np


@dataclass(frozen=True)
class DriverBar:
    """One horizontal bar: an activity, or the folded rest (``act_id`` None)."""

    label: str
    act_id: str | None
    value: float
    folded: int = 0  # how many activities the row stands for when folded

    @property
    def is_folded(self) -> bool:
        return self.act_id is None


@dataclass(frozen=True)
class BarRect:
    """A bar rectangle in chart units: row 0 at the top, x from ``x0`` to ``x1``."""

    bar: DriverBar
    row: int
    x0: float
    x1: float
    height: float = 0.7

    @property
    def y(self) -> float:
        """Centre of the row; rows go downwards (negative y), the top row at y = 0."""
        return -float(self.row)


def ranked(ids, labels, values, top: int = 10, magnitude: bool = False) -> list[DriverBar]:
    """Activities sorted by value (or by |value|), largest first; ties keep plan order.

    Not-a-number values (an activity that never varies) count as zero. Beyond ``top``
    the rest become one folded row valued at the largest remaining value.
    """
    vals = np.nan_to_num(np.asarray(values, dtype=float), nan=0.0)
    key = np.abs(vals) if magnitude else vals
    order = np.argsort(-key, kind="stable")
    top = max(1, int(top))
    bars = [DriverBar(str(labels[i]), str(ids[i]), float(vals[i])) for i in order[:top]]
    rest = order[top:]
    if rest.size == 1:
        i = rest[0]
        bars.append(DriverBar(str(labels[i]), str(ids[i]), float(vals[i])))
    elif rest.size > 1:
        lead = rest[0]  # the largest remaining, by the same key
        bars.append(DriverBar(f"{rest.size} others", None, float(vals[lead]), int(rest.size)))
    return bars


def _labels(plan, ids) -> list[str]:
    names = {}
    if plan is not None:
        names = {a.id: a.name for a in plan.activities}
    return [f"{i} {names[i]}".strip() if names.get(i) else str(i) for i in ids]


def criticality_bars(result, plan=None, top: int = 10) -> list[DriverBar]:
    """Criticality index per activity, highest first. Milestones are left out when the plan
    is given: a start or finish milestone is on every path (100 %) and drives nothing."""
    ids = list(result.ids)
    keep = _not_milestones(plan, ids)
    ids = [ids[i] for i in keep]
    return ranked(ids, _labels(plan, ids), np.asarray(result.criticality, dtype=float)[keep], top)


def _not_milestones(plan, ids) -> list[int]:
    if plan is None:
        return list(range(len(ids)))
    milestone = {a.id for a in plan.activities if a.is_milestone}
    return [i for i, a in enumerate(ids) if a not in milestone]


def sensitivity_bars(result, plan=None, top: int = 10) -> list[DriverBar]:
    """Sensitivity per activity, largest magnitude first (the tornado's order)."""
    ids = list(result.ids)
    return ranked(ids, _labels(plan, ids), result.sensitivity, top, magnitude=True)


def bar_rects(bars: list[DriverBar]) -> list[BarRect]:
    """Rectangles from zero to the value: negatives extend left, positives right."""
    out = []
    for row, bar in enumerate(bars):
        x0, x1 = sorted((0.0, bar.value))
        out.append(BarRect(bar, row, x0, x1))
    return out


def value_span(bars: list[DriverBar], signed: bool) -> tuple[float, float]:
    """The x range to show: [0, 1] for an index; for a tornado symmetric [−m, m] when
    bars point both ways, and only the side they point to (with a sliver of the other, so
    the zero line shows) when all point one way: no half-chart left empty."""
    if not signed:
        return 0.0, 1.18
    m = max((abs(b.value) for b in bars), default=0.0)
    m = max(m, 0.05)
    room = 1.3 * m            # room for the value printed beyond the longest bar
    if all(b.value >= 0 for b in bars):
        return -0.08 * m, room
    if all(b.value <= 0 for b in bars):
        return -room, 0.08 * m
    return -room, room


def row_at(bars: list[DriverBar], y: float) -> int | None:
    """The row under a y coordinate (rows at y = 0, −1, −2, …), or None outside."""
    row = int(round(-y))
    return row if 0 <= row < len(bars) and abs(-y - row) <= 0.5 else None
