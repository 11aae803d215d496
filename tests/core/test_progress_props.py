"""Property tests of scheduling from the status date (hypothesis).

Random networks of all four link types with lags get random progress consistent with
logic: the plan is scheduled without progress, a status offset T is drawn, and activities
that finished by T in that schedule are done on those dates, those that started before T
are in progress with a random remaining estimate. The rules checked are the ones in
docs/progress.md, from the update practice in GAO-16-89G (2015), best practice 9
("updating the schedule using actual progress and logic"): actuals are fixed, nothing
unfinished before the status date, and the logic still holds for the remaining work.
"""

import datetime as dt

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from workbench.core import Activity, Calendar, Link, Plan, Settings, analyze
from workbench.core.progress_fields import DONE, IN_PROGRESS, NOT_STARTED, Progress

TOL = 1e-7
TYPES = ("FS", "SS", "FF", "SF")
MONDAY = dt.date(2027, 1, 4)
EVERY_DAY = Calendar(workdays=(0, 1, 2, 3, 4, 5, 6))
PROPS = settings(max_examples=80, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@st.composite
def networks(draw, max_n=10):
    n = draw(st.integers(1, max_n))
    acts = []
    for i in range(n):
        a = draw(st.sampled_from([0, 1, 2, 3, 5]))
        spread = draw(st.sampled_from([(0, 0), (1, 2), (0, 4), (2, 6)]))
        acts.append(Activity(f"T{i}", optimistic=a, most_likely=a + spread[0], pessimistic=a + spread[1]))
    pairs = [(i, j) for i in range(n) for j in range(i + 1, n)]
    chosen = draw(st.lists(st.sampled_from(pairs), unique=True, max_size=2 * n)) if pairs else []
    links = [Link(f"T{i}", f"T{j}", draw(st.sampled_from(TYPES)), float(draw(st.integers(-2, 4))))
             for i, j in chosen]
    return Plan(Settings(title="random", start=MONDAY, calendar=EVERY_DAY), acts, links)


@st.composite
def progressed(draw):
    """(plan with progress, plain plan, status offset T)."""
    plain = draw(networks())
    sched = analyze(plain).schedule
    T = draw(st.integers(1, max(1, int(np.ceil(sched.finish)) + 1)))
    acts = []
    for i, act in enumerate(plain.activities):
        es, ef = float(sched.es[i]), float(sched.ef[i])
        if ef <= T and es < T:
            acts.append(act.with_(progress=Progress(actual_start=es, actual_finish=ef)))
        elif es < T:
            left = draw(st.sampled_from(["three", "fixed", "percent", "none"]))
            acts.append(act.with_(progress=_in_progress(draw, es, left)))
        else:
            acts.append(act)
    rule = draw(st.sampled_from(["retained logic", "progress override"]))
    status = MONDAY + dt.timedelta(days=T - 1)   # every day works: the end of this day is offset T
    settings_ = Settings(title="random", start=MONDAY, calendar=EVERY_DAY, status_date=status, progress_rule=rule)
    return Plan(settings_, acts, plain.links), plain, T


def _in_progress(draw, start: float, left: str) -> Progress:
    if left == "three":
        a = draw(st.sampled_from([0.0, 1.0, 2.0]))
        return Progress(actual_start=start, remaining_optimistic=a, remaining_most_likely=a + 1,
                        remaining_pessimistic=a + 3)
    if left == "fixed":
        return Progress(actual_start=start, remaining=float(draw(st.integers(0, 6))))
    if left == "percent":
        return Progress(actual_start=start, percent_complete=float(draw(st.integers(0, 100))))
    return Progress(actual_start=start)


def _start_time(analysis, i: int) -> float:
    """When an activity's start happened or will happen: its actual start when started."""
    frame = analysis.progress
    return float(frame.actual_start[i]) if frame.state[i] != NOT_STARTED else float(analysis.schedule.es[i])


@PROPS
@given(progressed())
def test_done_work_sits_on_its_actuals_without_float(case):
    plan, _, _ = case
    a = analyze(plan)
    s, frame = a.schedule, a.progress
    for i in np.flatnonzero(frame.state == DONE):
        assert abs(s.es[i] - frame.actual_start[i]) <= TOL and abs(s.ef[i] - frame.actual_finish[i]) <= TOL
        assert s.total_float[i] == 0 and s.free_float[i] == 0 and not s.critical[i]


@PROPS
@given(progressed())
def test_nothing_unfinished_is_scheduled_before_the_status_offset(case):
    plan, _, T = case
    a = analyze(plan)
    assert a.progress.status_offset == T
    unfinished = a.progress.state != DONE
    assert np.all(a.schedule.es[unfinished] >= T - TOL)
    assert np.all(a.schedule.total_float[unfinished] >= -TOL)     # no deadline: no negative float


@PROPS
@given(progressed())
def test_every_link_holds_for_remaining_work_under_retained_logic(case):
    plan, _, _ = case
    plan.settings.progress_rule = "retained logic"
    a = analyze(plan)
    s, idx = a.schedule, {x: i for i, x in enumerate(a.schedule.ids)}
    for link in plan.links:
        i, j = idx[link.pred], idx[link.succ]
        if a.progress.state[j] == DONE:
            continue            # actuals are facts; the links cannot move them
        pred = float(s.ef[i]) if link.type in ("FS", "FF") else _start_time(a, i)
        succ = float(s.es[j]) if link.type in ("FS", "SS") else float(s.ef[j])
        assert succ >= pred + link.lag - TOL, (link, pred, succ)


@PROPS
@given(progressed())
def test_progress_override_frees_started_work_from_unfinished_predecessors(case):
    plan, _, T = case
    plan.settings.progress_rule = "progress override"
    a = analyze(plan)
    state = a.progress.state
    for j in np.flatnonzero(state == IN_PROGRESS):
        into = [l for l in plan.links if l.succ == plan.activities[j].id]
        if all(state[plan.row_of(l.pred)] != DONE for l in into):
            assert abs(a.schedule.es[j] - T) <= TOL      # only the status date holds it


@PROPS
@given(networks(), st.sampled_from([None, 0, 5]))
def test_without_progress_the_results_equal_todays_exactly(plain, status_days):
    before = analyze(plain)
    if status_days is not None:
        plain.settings.status_date = MONDAY + dt.timedelta(days=status_days)
    after = analyze(plain)
    assert after.progress is None
    for name in ("es", "ef", "ls", "lf", "total_float", "free_float", "critical"):
        assert np.array_equal(getattr(before.schedule, name), getattr(after.schedule, name)), name
    assert before.pert == after.pert and before.to_dict() == after.to_dict()


@PROPS
@given(progressed())
def test_remaining_work_starts_as_early_as_its_binding_constraint_allows(case):
    """Tightness: each unfinished activity starts exactly at the latest of the status offset
    and what its links require (under override, only done predecessors' links count)."""
    plan, _, T = case
    a = analyze(plan)
    s, state, idx = a.schedule, a.progress.state, {x: i for i, x in enumerate(a.schedule.ids)}
    need = {j: float(T) for j in np.flatnonzero(state != DONE).tolist()}
    for link in plan.links:
        i, j = idx[link.pred], idx[link.succ]
        if j not in need or (plan.settings.progress_rule == "progress override"
                             and state[j] == IN_PROGRESS and state[i] != DONE):
            continue
        pred = float(s.ef[i]) if link.type in ("FS", "FF") else _start_time(a, i)
        back = float(s.durations[j]) if link.type in ("FF", "SF") else 0.0
        need[j] = max(need[j], pred + link.lag - back)
    for j, earliest in need.items():
        assert abs(s.es[j] - earliest) <= TOL, (s.ids[j], s.es[j], earliest)
