"""Progress records → offsets and remaining work, for all activities at once (see
:mod:`.progress`). Refusals name the first activity at fault."""

from __future__ import annotations

import datetime as dt

import numpy as np

from .errors import PlanError
from .progress_fields import DONE, IN_PROGRESS, NOT_STARTED

EPS = 1e-9
ONE_DAY = np.timedelta64(1, "D")


def resolve(frame, acts, calendar, led: np.ndarray, means: np.ndarray) -> None:
    """Fill ``frame`` (state, actual offsets, remaining three points) for ``frame.rows``.
    A milestone's actual date is read like its planned one: the evening it happens, or the
    morning it opens when nothing leads to it."""
    rows = frame.rows
    progs = [acts[i].progress for i in rows.tolist()]
    ids = [acts[i].id for i in rows.tolist()]
    mile = means[rows] <= 0.0
    fed = led[rows]
    start, late_start = _points(calendar, [p.actual_start for p in progs], mile & fed, frame, ids, "actual start")
    end, late_end = _points(calendar, [p.actual_finish for p in progs], ~(mile & ~fed), frame, ids, "actual finish")
    late = [(*x, key) for x, key in ((late_start, "actual_start"), (late_end, "actual_finish")) if x is not None]
    if late:                                # the first activity in plan order at fault
        k, message, key = min(late)
        raise PlanError(message, ids[k], key)
    back = np.flatnonzero(end < start - EPS)
    if back.size:
        k = int(back[0])
        raise PlanError(f"activity {ids[k]}: actual finish {_shown(progs[k].actual_finish)} is before its actual "
                        f"start {_shown(progs[k].actual_start)}", ids[k], "actual_finish")
    state = np.where(~np.isnan(end), DONE, np.where(~np.isnan(start), IN_PROGRESS, NOT_STARTED)).astype(np.int8)
    frame.state[rows], frame.actual_start[rows], frame.actual_finish[rows] = state, start, end
    done = state == DONE
    frame.remaining[done] = (end - start)[done, None]
    for k in np.flatnonzero(~done).tolist():
        frame.remaining[k] = _left(acts[int(rows[k])], progs[k], frame)


def _points(calendar, values: list, through: np.ndarray, frame, ids: list, what: str):
    """Offsets of actual dates or offsets (NaN where none), and the first one after the
    status date as (position, message), or None."""
    late_ones = []
    try:                                # the common case: offsets and blanks only
        out = np.array(values, dtype=float)
        kind = np.where(np.isnan(out), 0, 1)
    except TypeError:                   # some dates among them
        out = np.full(len(values), np.nan)
        kind = np.fromiter((0 if v is None else 2 if isinstance(v, dt.date) else 1 for v in values), np.int8,
                           len(values))
        plain = np.flatnonzero(kind == 1)
        out[plain] = np.fromiter((values[k] for k in plain.tolist()), float, plain.size)
    plain = np.flatnonzero(kind == 1)
    if plain.size:
        late = plain[out[plain] > frame.status_offset + EPS]
        if late.size:
            k = int(late[0])
            late_ones.append((k, f"activity {ids[k]}: {what} at offset {out[k]:g} is after the status date "
                                 f"{frame.status_date.isoformat()} (offset {frame.status_offset:g})"))
    dated = np.flatnonzero(kind == 2)
    if dated.size:
        days = np.array([values[k] for k in dated.tolist()], dtype="datetime64[D]")
        late = np.flatnonzero(days > np.datetime64(frame.status_date, "D"))
        if late.size:
            k = int(dated[late[0]])
            late_ones.append((k, f"activity {ids[k]}: {what} {values[k].isoformat()} is after the status date "
                                 f"{frame.status_date.isoformat()}"))
        out[dated] = calendar.offsets_before(days + np.where(through[dated], ONE_DAY, 0 * ONE_DAY))
    return out, min(late_ones) if late_ones else None


def _shown(value) -> str:
    return value.isoformat() if isinstance(value, dt.date) else f"offset {value:g}"


def estimate(act) -> tuple[float, float, float]:
    if act.has_estimate:
        return act.optimistic, act.most_likely, act.pessimistic
    d = float(act.duration or 0.0)
    return d, d, d


def _left(act, p, frame) -> tuple[float, float, float]:
    """Remaining three points of work in progress (see progress_fields for the order);
    work not started keeps its estimate."""
    if p.actual_start is None:
        return estimate(act)
    if p.has_remaining_estimate:
        return p.remaining_optimistic, p.remaining_most_likely, p.remaining_pessimistic
    if p.remaining is not None:
        return p.remaining, p.remaining, p.remaining
    if p.percent_complete is None:
        frame.warnings.append(f"activity {act.id} is in progress with no remaining estimate: "
                              f"its whole estimate is taken as remaining")
    share = 1.0 - (p.percent_complete or 0.0) / 100.0
    return tuple(share * x for x in estimate(act))
