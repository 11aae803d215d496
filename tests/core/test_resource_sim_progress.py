"""Resource-aware simulation of a plan with progress: it starts from the status date as the
logic-only simulation does (actuals fixed, only the remaining work uncertain, done work
holding no crew). With more units than any activity asks for it must equal the logic-only
simulation for the same seed — finish distribution and criticality (issue 19's own check,
on progressed plans drawn the way tests/core/test_progress_props.py draws them)."""

import datetime as dt

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from workbench.core import Activity, Calendar, Link, Plan, Settings, analyze
from workbench.core.levelling import level
from workbench.core.model import Resource
from workbench.core.montecarlo import simulate
from workbench.core.progress_fields import Progress

MONDAY = dt.date(2027, 1, 4)
EVERY_DAY = Calendar(workdays=(0, 1, 2, 3, 4, 5, 6))


@st.composite
def progressed(draw, units=1e6):
    n = draw(st.integers(2, 10))
    acts = []
    for i in range(n):
        a = draw(st.sampled_from([0, 1, 2, 3, 5]))
        spread = draw(st.sampled_from([(0, 0), (1, 2), (0, 4), (2, 6)]))
        need = (("crew", float(draw(st.integers(1, 3)))),) if draw(st.booleans()) else ()
        acts.append(Activity(f"T{i}", optimistic=a, most_likely=a + spread[0], pessimistic=a + spread[1],
                             resources=need))
    pairs = [(i, j) for i in range(n) for j in range(i + 1, n)]
    chosen = draw(st.lists(st.sampled_from(pairs), unique=True, max_size=2 * n))
    links = [Link(f"T{i}", f"T{j}", draw(st.sampled_from(("FS", "SS", "FF", "SF"))), float(draw(st.integers(-2, 4))))
             for i, j in chosen]
    crews = [Resource("crew", "Crew", units)]
    plain = Plan(Settings(start=MONDAY, calendar=EVERY_DAY), acts, links, resources=crews)
    sched = analyze(plain).schedule
    T = draw(st.integers(1, max(1, int(np.ceil(sched.finish)) + 1)))
    moved = []
    for i, act in enumerate(plain.activities):
        es, ef = float(sched.es[i]), float(sched.ef[i])
        if ef <= T and es < T:
            act = act.with_(progress=Progress(actual_start=es, actual_finish=ef))
        elif es < T:
            act = act.with_(progress=Progress(actual_start=es, remaining=float(draw(st.integers(0, 6)))))
        moved.append(act)
    rule = draw(st.sampled_from(["retained logic", "progress override"]))
    s = Settings(start=MONDAY, calendar=EVERY_DAY, status_date=MONDAY + dt.timedelta(days=T - 1), progress_rule=rule)
    return Plan(s, moved, plain.links, resources=crews)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(progressed(), st.integers(0, 2**16))
def test_with_unlimited_units_a_progressed_plan_gives_the_logic_only_run(plan, seed):
    logic = simulate(plan, 64, seed=seed)
    aware = simulate(plan, 64, seed=seed, resources=True)
    assert aware.resource_aware
    assert np.allclose(logic.sorted_finish(), aware.sorted_finish(), rtol=0, atol=1e-9)
    assert np.array_equal(logic.criticality, aware.criticality)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(progressed(units=3.0))
def test_levelling_from_the_status_date_keeps_actuals_and_starts_the_rest_after_it(plan):
    analysis = analyze(plan)
    result = level(plan, analysis=analysis)
    frame = analysis.progress
    T = frame.status_offset
    for i, act in enumerate(plan.activities):
        if frame.state[i] == 2:                      # done: on its actual dates
            assert result.starts[i] == pytest.approx(frame.actual_start[i])
        else:                                        # remaining work after the status date
            assert result.starts[i] >= T - 1e-9


def test_a_finish_floor_from_started_work_moves_with_each_sampled_duration():
    """A started, SF link A → B with lag 6: B must finish by A's actual start + 6, so B's
    start depends on B's sampled duration in every iteration (by hand: EF_B ≥ 0 + 6)."""
    acts = [Activity("A", duration=8, progress=Progress(actual_start=0.0), resources=(("crew", 1.0),)),
            Activity("B", optimistic=1, most_likely=3, pessimistic=9, resources=(("crew", 1.0),)),
            Activity("C", duration=1)]
    links = [Link("A", "B", "SF", 6.0), Link("B", "C")]
    s = Settings(start=MONDAY, calendar=EVERY_DAY, status_date=MONDAY + dt.timedelta(days=1))
    plan = Plan(s, acts, links, resources=[Resource("crew", "Crew", 10.0)])
    logic = simulate(plan, 300, seed=5)
    aware = simulate(plan, 300, seed=5, resources=True)
    assert np.allclose(logic.sorted_finish(), aware.sorted_finish(), rtol=0, atol=1e-9)
    assert np.ptp(aware.sorted_finish()) > 1.0          # the floor really moved with B's duration
