"""Scheduling from the status date: actuals fixed, remaining work re-forecast. No Qt.

Progress is known up to the *end* of the status date D, so remaining work is scheduled
from the *status offset* T = the offset at the end of D, which is the start of the next
working day (``WorkCalendar.offset_through(D)``). A plan is analysed from its status
date once any activity has progress; a status date alone only draws the status line.

The critical-path engine runs unchanged on the same compiled network; progress enters
through its inputs (see docs/progress.md):

- *done*: the activity sits on its actuals. Its start floor is the actual start, its
  duration actual finish − actual start, and the links into it are cut (they can no
  longer move it). It carries no float and is never critical.
- *in progress*: the engine schedules its remaining work: start floor T, duration the
  remaining mean. Under **retained logic** (default) the links into it still hold for
  the remaining work (FS: the remaining work waits for the predecessor's finish; SS: it
  waits for the predecessor's start, ...). Under **progress override** the links from
  unfinished predecessors are cut.
- *not started*: start floor max(T, its start-no-earlier offset).
- A link that leaves a started activity from its start (SS, SF) reads the *actual*
  start: it is cut and becomes a floor on the successor's start (SS) or finish (SF).

Floats and the critical path are those of the remaining work.
"""

from __future__ import annotations

import dataclasses
import datetime as dt
from dataclasses import dataclass, field

import numpy as np

from .errors import StatusDateMissing
from .progress_fields import DONE, IN_PROGRESS, NOT_STARTED, STATE_NAMES
from .progress_resolve import resolve

EPS = 1e-9
OVERRIDE = "progress override"


@dataclass
class ProgressFrame:
    """Every activity's progress resolved to offsets (plan order)."""

    status_date: dt.date
    status_offset: float
    rule: str
    state: np.ndarray            # NOT_STARTED / IN_PROGRESS / DONE per activity
    actual_start: np.ndarray     # offsets, NaN where none
    actual_finish: np.ndarray
    rows: np.ndarray             # activities with progress
    remaining: np.ndarray        # (len(rows), 3): remaining a, m, b (done: the actual duration)
    warnings: list[str] = field(default_factory=list)

    def state_names(self) -> list[str]:
        return [STATE_NAMES[s] for s in self.state.tolist()]

    def moments(self, means: np.ndarray, variances: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """PERT mean and variance of what the engine schedules: the remaining work."""
        means, variances = means.copy(), variances.copy()
        a, m, b = self.remaining.T
        means[self.rows] = (a + 4.0 * m + b) / 6.0
        variances[self.rows] = ((b - a) / 6.0) ** 2
        return means, variances

    def three_points(self, a, m, b) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """The simulation's three points: remaining ones where progress is recorded."""
        out = [np.array(x, dtype=float) for x in (a, m, b)]
        for k in range(3):
            out[k][self.rows] = self.remaining[:, k]
        return tuple(out)


def has_progress(plan) -> bool:
    return bool(plan.progress_rows())


def progress_frame(plan, calendar, status_date: dt.date | None = None, means=None,
                   net=None) -> ProgressFrame | None:
    """Resolve the plan's progress against its status date (or ``status_date``, which
    overrides it). None when no activity has progress. Refusals name the activity.
    ``means`` (PERT means in plan order) tells milestones apart and ``net`` (the compiled
    network) which activities have predecessors; both are found when not given."""
    rows = plan.progress_rows()
    if not rows:
        return None
    acts = plan.activities
    day = status_date or plan.settings.status_date
    if day is None:
        first = acts[rows[0]].id
        raise StatusDateMissing(first)
    n, T = len(acts), calendar.offset_through(day)
    frame = ProgressFrame(day, T, plan.settings.progress_rule, np.zeros(n, dtype=np.int8),
                          np.full(n, np.nan), np.full(n, np.nan), np.asarray(rows, dtype=np.int64),
                          np.zeros((len(rows), 3)))
    if means is None:
        means = np.array([a.mean for a in acts])
    led = np.zeros(n, dtype=bool)
    if net is not None:
        led[net.dst] = True
    else:
        index = {a.id: i for i, a in enumerate(acts)}
        led[[index[link.succ] for link in plan.links]] = True
    resolve(frame, acts, calendar, led, np.asarray(means, dtype=float))
    return frame


# --- engine inputs ---------------------------------------------------------------
@dataclass
class EngineInputs:
    """What the unchanged passes need to schedule from the status date."""

    network: object              # the compiled network with cut links' lags at -inf
    floor: np.ndarray            # start floors
    finish_floor: np.ndarray | None   # finish floors (from SF links of started work), or None
    done: np.ndarray             # bool mask


def engine_inputs(frame: ProgressFrame, net, floor: np.ndarray) -> EngineInputs:
    """Floors and cut links for the engine (vectorised over all links; see the module)."""
    state, T = frame.state, frame.status_offset
    done, started = state == DONE, state != NOT_STARTED
    start = frame.actual_start
    floor = np.where(state == NOT_STARTED, np.maximum(floor, T), np.where(done, start, T))
    src, dst, lag = net.src, net.dst, net.lag.copy()
    from_start = net.src_fin == 0                     # SS, SF
    cut = done[dst]
    if frame.rule == OVERRIDE:
        cut |= started[dst] & ~done[src]
    via_start = (state[src] == IN_PROGRESS) & from_start & ~cut
    to_finish = net.dst_fin > 0
    fin_floor = None
    k = np.flatnonzero(via_start & ~to_finish)       # SS: a start floor
    np.maximum.at(floor, dst[k], start[src[k]] + lag[k])
    k = np.flatnonzero(via_start & to_finish)        # SF: a finish floor
    if k.size:
        fin_floor = np.full(net.size, -np.inf)
        np.maximum.at(fin_floor, dst[k], start[src[k]] + lag[k])
    lag[cut | via_start] = -np.inf
    frame.warnings.extend(out_of_sequence(frame, net))
    changed = dataclasses.replace(net, lag=lag, _fin=None, _out=None)
    return EngineInputs(changed, floor, fin_floor, done)


def out_of_sequence(frame: ProgressFrame, net) -> list[str]:
    """Warnings for work started (or finished) before a predecessor's link allows it,
    naming both activities. Accepted: the engine applies the plan's rule."""
    a_s, a_f = frame.actual_start, frame.actual_finish
    src, dst, lag = net.src, net.dst, net.lag
    from_fin, to_fin = net.src_fin > 0, net.dst_fin > 0
    pred_time = np.where(from_fin, a_f[src], a_s[src])     # NaN when that end has not happened
    succ_time = np.where(to_fin, a_f[dst], a_s[dst])
    happened = ~np.isnan(succ_time)
    early = happened & (np.isnan(pred_time) | (pred_time + lag > succ_time + EPS))
    out = []
    for k in np.flatnonzero(early).tolist():
        out.append(_sequence_note(net, k, frame))
    return out


def _sequence_note(net, k: int, frame: ProgressFrame) -> str:
    i, j = int(net.src[k]), int(net.dst[k])
    from_finish, to_finish = net.src_fin[k] > 0, net.dst_fin[k] > 0
    kind = ("SS", "SF", "FS", "FF")[int(from_finish) * 2 + int(to_finish)]
    pred, succ = net.ids[i], net.ids[j]
    verb = "finished" if to_finish else "started"
    end = frame.actual_finish[i] if from_finish else frame.actual_start[i]
    if np.isnan(end):
        why = f"{kind} link: {pred} has not {'finished' if from_finish else 'started'}"
    else:
        why = f"{kind} link with lag {net.lag[k]:g}: not yet elapsed after {pred} {'finished' if from_finish else 'started'}"
    return f"out-of-sequence progress: {succ} {verb} before its predecessor {pred} allows it ({why}); {frame.rule} applies"
