"""Timeline (Gantt chart) geometry: what to draw, where, grouped by style. No Qt.

x is a plan-unit offset (working time from the project start); y is a row number (row 0
at the top, a mark sits on its row's centre line). Dates come from the calendar when
drawing. Marks of one style share a :class:`Marks` (numpy arrays), so screen and paper
can draw each style in one batched call:

- ``critical`` / ``work``: bars [ES, EF]; ``milestone`` / ``milestone_critical``: points at ES;
- ``float``: the slack line [EF, LF] (the drawing adds the upright tick at LF);
- ``free_float``: a mark at EF + free float, where that is short of LF; ``negative_float``: [LF, EF] where LF < EF
  (a deadline or finish-no-later date that cannot be met);
- ``late``: late-date bars [LS, LF] (optional); ``summary`` / ``summary_critical``: group rows;
- ``whisker``: P10–P90 of an activity's finish (when the simulation offers it);
- ``baseline``, ``done``, ``slipped``: the compared baseline's bars, work done so far and
  finishes later than the baseline (see :mod:`.timeline_living`).

Rows follow the table order; the activities of a group are gathered under a summary row
placed where the group first appears. A collapsed group shows only its summary row.
"""

from __future__ import annotations

import math
from operator import attrgetter
from dataclasses import dataclass, field

import numpy as np

from .timeline_living import living_marks

EPS = 1e-9
BAR_KINDS = ("critical", "work", "late", "summary", "summary_critical", "whisker")
SPAN_KINDS = ("float", "negative_float")
POINT_KINDS = ("milestone", "milestone_critical", "free_float")
KINDS = BAR_KINDS + SPAN_KINDS + POINT_KINDS
WHISKER_PERCENTILES = (10.0, 90.0)


@dataclass
class Marks:
    """Marks of one style: on ``rows``, from ``x0`` to ``x1`` (equal for points);
    ``index`` is the activity's plan index (-1 for a group row)."""

    rows: np.ndarray
    x0: np.ndarray
    x1: np.ndarray
    index: np.ndarray

    @classmethod
    def empty(cls) -> "Marks":
        return cls(np.zeros(0, int), np.zeros(0), np.zeros(0), np.zeros(0, int))

    def __len__(self) -> int:
        return int(self.rows.size)

    def take(self, mask) -> "Marks":
        return Marks(self.rows[mask], self.x0[mask], self.x1[mask], self.index[mask])

    def __post_init__(self):
        if self.rows.size > 1 and (np.diff(self.rows) < 0).any():    # kept in row order
            order = np.argsort(self.rows, kind="stable")
            self.rows, self.x0, self.x1, self.index = (a[order] for a in (self.rows, self.x0, self.x1, self.index))

    def within(self, lo_row: float, hi_row: float) -> "Marks":
        """Only the marks on rows lo_row..hi_row (for skipping rows off screen): a slice,
        found in a table of where each row's marks begin (built at the first call, so once
        per geometry, kept while the view moves)."""
        if not self.rows.size:
            return self
        if self.rows[0] < 0 or not (math.isfinite(lo_row) and math.isfinite(hi_row)):
            a = int(self.rows.searchsorted(lo_row, side="left"))
            b = int(self.rows.searchsorted(hi_row, side="right"))
        else:
            starts = self._row_starts()
            last = starts.size - 1
            a = int(starts[min(max(math.ceil(lo_row), 0), last)])
            b = int(starts[min(max(math.floor(hi_row) + 1, 0), last)])
        if a == 0 and b == self.rows.size:
            return self
        part = object.__new__(Marks)      # a slice of sorted rows stays sorted: no re-check
        part.rows, part.x0, part.x1, part.index = self.rows[a:b], self.x0[a:b], self.x1[a:b], self.index[a:b]
        return part

    def _row_starts(self) -> np.ndarray:
        """Index of the first mark on row r or later, for r = 0 .. last row + 1."""
        starts = self.__dict__.get("_starts")
        if starts is None:
            starts = self.__dict__["_starts"] = self.rows.searchsorted(np.arange(int(self.rows[-1]) + 2), side="left")
        return starts


@dataclass
class Row:
    kind: str      # "activity", "milestone" or "group"
    key: str       # activity id or group name
    label: str
    index: int     # plan index; -1 for a group row
    depth: int     # 1 for activities shown under a group
    collapsed: bool = False


@dataclass
class TimelineGeometry:
    index: np.ndarray             # per row: plan index, -1 for a group row
    keys: list[str]               # per row: activity id or group name
    labels: list[str]             # per row: "ID  name" or the group name
    kinds: list[str]              # per row: activity / milestone / group
    depth: np.ndarray
    collapsed: frozenset
    marks: dict[str, Marks]
    connectors: np.ndarray        # (k, 4): x0, y0, x1, y1 segments of link polylines
    lines: dict[str, float]       # "start", "deadline", "status" → offset
    finish: float
    finish_whisker: tuple[float, float] | None
    x_range: tuple[float, float]
    row_of: dict[str, int] = field(default_factory=dict)

    @property
    def n_rows(self) -> int:
        return int(self.index.size)

    def row(self, r: int) -> Row:
        return Row(self.kinds[r], self.keys[r], self.labels[r], int(self.index[r]), int(self.depth[r]),
                   self.kinds[r] == "group" and self.keys[r] in self.collapsed)

    def row_at(self, y: float) -> int | None:
        """The row whose band (centre ± 0.5) holds y, or None."""
        r = int(np.floor(y + 0.5))
        return r if 0 <= r < self.n_rows else None

    def activity_at(self, x: float, y: float, slack: float = 0.0) -> str | None:
        """The activity whose bar (or milestone) on the row at y covers x ± slack."""
        r = self.row_at(y)
        if r is None or self.index[r] < 0:
            return None
        for kind in ("critical", "work", "milestone", "milestone_critical"):
            m = self.marks[kind]
            hit = (m.rows == r) & (m.x0 - slack <= x) & (m.x1 + slack >= x)
            if hit.any():
                return self.keys[r]
        return None


# --- rows -----------------------------------------------------------------------
def _row_order(plan, collapsed, only):
    """Plan index per row (-1 for a group row), depth, and {group row: (name, members)}."""
    acts = plan.activities
    keep = range(len(acts)) if only is None else [i for i, a in enumerate(acts) if a.id in only]
    if not (any(map(attrgetter("group"), acts)) if only is None else any(acts[i].group for i in keep)):
        return np.asarray(keep, dtype=np.int64), np.zeros(len(keep), dtype=np.int64), {}
    members: dict[str, list[int]] = {}
    for i in keep:
        members.setdefault(acts[i].group, []).append(i)
    index, depth, groups = [], [], {}
    for i in keep:
        g = acts[i].group
        if not g:
            index.append(i), depth.append(0)
        elif g not in groups.values():
            groups[len(index)] = g
            index.append(-1), depth.append(0)
            if g not in collapsed:
                index.extend(members[g]), depth.extend([1] * len(members[g]))
    spans = {r: (g, np.asarray(members[g], dtype=np.int64)) for r, g in groups.items()}
    return np.asarray(index, dtype=np.int64), np.asarray(depth, dtype=np.int64), spans


def _row_texts(plan, index, groups, milestone) -> tuple[list[str], list[str], list[str]]:
    acts = plan.activities
    if not groups and len(index) == len(acts) and bool((index == np.arange(len(acts))).all()):   # plain rows in plan order
        keys = [a.id for a in acts]
        labels = [f"{a.id}  {a.name}" if a.name else a.id for a in acts]
        kinds = ["milestone" if m else "activity" for m in np.asarray(milestone, dtype=bool).tolist()]
        return keys, labels, kinds
    keys, labels, kinds = [], [], []
    for r, i in enumerate(index.tolist()):
        if i < 0:
            name = groups[r][0]
            keys.append(name), labels.append(name), kinds.append("group")
        else:
            a = acts[i]
            keys.append(a.id)
            labels.append(f"{a.id}  {a.name}" if a.name else a.id)
            kinds.append("milestone" if milestone[i] else "activity")
    return keys, labels, kinds


# --- marks ----------------------------------------------------------------------
def _activity_marks(s, rows, idx, late_bars: bool) -> dict[str, Marks]:
    es, ef, ls, lf = s.es[idx], s.ef[idx], s.ls[idx], s.lf[idx]
    tf, ff, crit = s.total_float[idx], s.free_float[idx], s.critical[idx]
    ms = (ef - es) <= EPS
    free = (ff > EPS) & (ff < tf - EPS)   # where free float equals total float the tick says it
    return {
        "critical": Marks(rows, es, ef, idx).take(~ms & crit),
        "work": Marks(rows, es, ef, idx).take(~ms & ~crit),
        "milestone": Marks(rows, es, es, idx).take(ms & ~crit),
        "milestone_critical": Marks(rows, es, es, idx).take(ms & crit),
        "float": Marks(rows, ef, lf, idx).take(tf > EPS),
        "free_float": Marks(rows, ef + ff, ef + ff, idx).take(free),
        "negative_float": Marks(rows, lf, ef, idx).take(lf < ef - EPS),
        "late": Marks(rows, ls, lf, idx).take(~ms) if late_bars else Marks.empty(),
    }


def _summary_marks(s, groups) -> dict[str, Marks]:
    """A group row spans its members' earliest ES to latest EF; critical if any member is."""
    rows = np.asarray(sorted(groups), dtype=np.int64)
    members = [groups[r][1] for r in rows.tolist()]
    x0 = np.asarray([s.es[m].min() for m in members], dtype=float)
    x1 = np.asarray([s.ef[m].max() for m in members], dtype=float)
    crit = np.asarray([bool(s.critical[m].any()) for m in members], dtype=bool)
    m = Marks(rows, x0, x1, np.full(rows.size, -1, dtype=np.int64))
    return {"summary": m.take(~crit), "summary_critical": m.take(crit)}


def _whisker_marks(simulation, s, rows, idx) -> Marks:
    """P10–P90 of each activity's finish, if the simulation result offers it."""
    table = activity_finish_percentiles(simulation, s.ids)
    if table is None:
        return Marks.empty()
    lo, hi = table
    return Marks(rows, lo[idx], hi[idx], idx)


def activity_finish_percentiles(simulation, ids) -> tuple[np.ndarray, np.ndarray] | None:
    """(P10, P90) arrays of activity finishes from a simulation result, or None.

    Uses ``activity_finish_percentile(p)`` (array per activity) or an ``activity_finish``
    array (activities × iterations) when the result has one and matches these ids.
    """
    if simulation is None or list(getattr(simulation, "ids", [])) != list(ids):
        return None
    lo_p, hi_p = WHISKER_PERCENTILES
    getter = getattr(simulation, "activity_finish_percentile", None)
    if callable(getter):
        return np.asarray(getter(lo_p), float), np.asarray(getter(hi_p), float)
    samples = getattr(simulation, "activity_finish", None)
    if samples is not None and np.ndim(samples) == 2 and len(samples) == len(ids):
        lo, hi = np.percentile(samples, [lo_p, hi_p], axis=1)
        return lo, hi
    return None


def finish_whisker(simulation, ids) -> tuple[float, float] | None:
    """(P10, P90) of the project finish from a simulation of this plan, or None."""
    if simulation is None or list(getattr(simulation, "ids", ids)) != list(ids):
        return None
    return tuple(float(simulation.percentile(p)) for p in WHISKER_PERCENTILES)


def _connectors(s, row_pos: np.ndarray, gap: float) -> np.ndarray:
    """Elbow polylines pred end → succ start for links between two visible rows."""
    net = s.network
    if net.src.size == 0:
        return np.zeros((0, 4))
    ya, yb = row_pos[net.src], row_pos[net.dst]
    ok = (ya >= 0) & (yb >= 0)
    src, dst, ya, yb = net.src[ok], net.dst[ok], ya[ok].astype(float), yb[ok].astype(float)
    xa = s.es[src] + s.durations[src] * net.src_fin[ok]
    xb = s.es[dst] + s.durations[dst] * net.dst_fin[ok]
    xm = xa + gap
    segs = np.stack([np.c_[xa, ya, xm, ya], np.c_[xm, ya, xm, yb], np.c_[xm, yb, xb, yb]], axis=1)
    return segs.reshape(-1, 4)


# --- the whole chart ------------------------------------------------------------
def reference_lines(analysis) -> dict[str, float]:
    settings = analysis.plan.settings
    lines = {"start": 0.0}
    if analysis.deadline is not None:
        lines["deadline"] = float(analysis.deadline)
    if settings.status_date is not None:
        lines["status"] = analysis.calendar.offset_through(settings.status_date)
    return lines


def critical_ids(analysis) -> set[str]:
    s = analysis.schedule
    return {s.ids[i] for i in np.flatnonzero(s.critical)}


def timeline_geometry(analysis, simulation=None, *, collapsed=(), late_bars: bool = False,
                      connectors: bool = False, only=None, variance=None) -> TimelineGeometry:
    """Geometry of the Timeline for an :class:`~workbench.core.analysis.Analysis`.

    ``collapsed``: group names shown as their summary row only; ``only``: ids to show
    (e.g. :func:`critical_ids`), None for all; ``late_bars``/``connectors``: optional layers;
    ``variance`` (against a baseline) adds the baseline bars and slip marks, progress the done work
    (see :mod:`.timeline_living`).
    """
    s, plan = analysis.schedule, analysis.plan
    collapsed = frozenset(collapsed)
    index, depth, groups = _row_order(plan, collapsed, None if only is None else set(only))
    act_rows = np.flatnonzero(index >= 0)
    idx = index[act_rows]
    marks = _activity_marks(s, act_rows, idx, late_bars)
    marks.update(_summary_marks(s, groups) if groups else {"summary": Marks.empty(), "summary_critical": Marks.empty()})
    marks["whisker"] = _whisker_marks(simulation, s, act_rows, idx)
    marks.update(living_marks(analysis, variance, act_rows, idx, Marks))
    keys, labels, kinds = _row_texts(plan, index, groups, (s.ef - s.es) <= EPS)
    row_pos = np.full(len(s.ids), -1, dtype=np.int64)
    row_pos[idx] = act_rows
    links = _connectors(s, row_pos, 0.25) if connectors else np.zeros((0, 4))
    lines = reference_lines(analysis)
    whisker = finish_whisker(simulation, s.ids)
    geo = TimelineGeometry(index, keys, labels, kinds, depth, collapsed, marks, links, lines,
                           float(s.finish), whisker, _x_range(s, lines, whisker, marks))
    rows = act_rows.tolist()
    geo.row_of = dict(zip(keys, rows)) if len(rows) == len(keys) else {keys[r]: r for r in rows}
    return geo


def _x_range(s, lines, whisker, marks) -> tuple[float, float]:
    values = [0.0, float(s.finish), *lines.values(), *(whisker or ())]
    for m in marks.values():
        if len(m):
            values += [float(m.x0.min()), float(m.x1.max())]
    lo, hi = min(values), max(values)
    return lo, hi if hi > lo else lo + 1.0


def bar_span(geo: TimelineGeometry, row: int) -> tuple[float, float] | None:
    """(ES, EF) of the bar on a row, or None when the row has no bar (group, milestone)."""
    for kind in ("critical", "work"):
        m = geo.marks[kind]
        hit = np.flatnonzero(m.rows == row)
        if hit.size:
            return float(m.x0[hit[0]]), float(m.x1[hit[0]])
    return None


def dragged_estimate(activity, length: float, step: float = 0.1, resolution: float | None = None) -> dict:
    """Field changes giving ``activity`` the PERT mean ``length`` by moving its most likely
    value (snapped to ``step``); a fixed duration changes the duration itself.

    With ``resolution`` (the plan's smallest unit of time: 1 working day, or a day's share
    of a week) the dragged length is first snapped to it, and the most likely is solved to
    hundredths, so a drag gives 32 days, not the noise of 32.3.

    The optimistic value stays; the most likely never drops below it; when it would pass
    the pessimistic value, the pessimistic widens to it.
    """
    length = max(0.0, float(length))
    if resolution:
        length, step = _snap(length, resolution), min(step, 0.01)
    if not activity.has_estimate:
        return {"duration": _snap(length, step)}
    a, b = activity.optimistic, activity.pessimistic
    m = max(a, _snap((6.0 * length - a - b) / 4.0, step))
    if m <= b:
        return {"most_likely": m}
    m = max(a, _snap((6.0 * length - a) / 5.0, step))
    return {"most_likely": m, "pessimistic": max(b, m)}


def _snap(value: float, step: float) -> float:
    snapped = round(max(0.0, value) / step) * step
    return round(snapped, 9)
