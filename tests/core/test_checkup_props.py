"""Property tests of Checkup on random finish-to-start networks (hypothesis)."""

import datetime as dt

import numpy as np
from hypothesis import given, settings, strategies as st

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.core.checkup import frame_for, run_checkup
from workbench.core.checkup_cpt import finish_moves
from workbench.core.merge_spots import link_shares


@st.composite
def networks(draw):
    n = draw(st.integers(2, 14))
    durations = draw(st.lists(st.integers(0, 20), min_size=n, max_size=n))
    acts = [Activity(f"T{i}", duration=float(d)) for i, d in enumerate(durations)]
    links = []
    for j in range(1, n):
        for i in draw(st.sets(st.integers(0, j - 1), max_size=3)):
            links.append(Link(f"T{i}", f"T{j}", "FS", float(draw(st.integers(0, 3)))))
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, links)


@settings(max_examples=60, deadline=None)
@given(networks())
def test_finish_to_start_networks_pass_the_critical_path_test(plan):
    # through finish-to-start links every critical activity's finish drives the project finish
    assert run_checkup(plan).get("critical_path_test").status in ("pass", "n/a")


@settings(max_examples=60, deadline=None)
@given(networks(), st.floats(1.0, 1000.0))
def test_a_delay_never_moves_the_finish_by_more_than_itself(plan, delay):
    frame = frame_for(plan)
    crit = np.flatnonzero(frame.schedule.critical)
    moved = finish_moves(frame, crit, delay)
    assert np.all(moved <= delay + 1e-6) and np.all(moved >= -1e-9)


@settings(max_examples=40, deadline=None)
@given(networks(), st.integers(0, 2**31 - 1))
def test_link_shares_are_shares_and_one_run_matches_the_engine(plan, seed):
    a = analyze(plan)
    net = a.schedule.network
    rng = np.random.default_rng(seed)
    d = a.schedule.durations[:, None] + rng.uniform(0, 3, (len(plan), 5))
    shares, arrival = link_shares(net, np.zeros(len(plan)), np.full(len(plan), np.inf), d)
    assert np.all((shares >= 0) & (shares <= 1))
    same = link_shares(net, np.zeros(len(plan)), np.full(len(plan), np.inf), a.schedule.durations[:, None])[0]
    # on the plan's own durations a link is critical exactly when the engine's schedule says so
    crit = a.schedule.critical
    tight = np.abs(a.schedule.es[net.dst] - (a.schedule.es[net.src] + net.link_offsets(a.schedule.durations))) <= 1e-9
    assert np.array_equal(same == 1.0, crit[net.src] & crit[net.dst] & tight)


@settings(max_examples=40, deadline=None)
@given(networks())
def test_every_check_has_a_status_and_offenders_are_plan_ids(plan):
    checkup = run_checkup(plan)
    ids = set(plan.ids())
    for check in checkup:
        assert check.status in ("pass", "fail", "n/a")
        assert set(check.offenders) <= ids
    assert checkup.count("pass") + checkup.count("fail") == checkup.applicable


@st.composite
def mixed_networks(draw):
    """All four link types, lags of either sign, some start-no-earlier floors."""
    n = draw(st.integers(2, 12))
    acts = [Activity(f"T{i}", duration=float(draw(st.integers(0, 15))),
                     start_no_earlier=draw(st.one_of(st.none(), st.floats(0, 30))))
            for i in range(n)]
    links = []
    for j in range(1, n):
        for i in draw(st.sets(st.integers(0, j - 1), max_size=3)):
            links.append(Link(f"T{i}", f"T{j}", draw(st.sampled_from(["FS", "SS", "FF", "SF"])),
                              float(draw(st.integers(-4, 6)))))
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, links)


@settings(max_examples=80, deadline=None)
@given(mixed_networks(), st.sampled_from([600.0, 5000.0]))
def test_the_one_pass_moves_equal_the_engine_for_a_large_delay(plan, delay):
    from workbench.core.checkup_cpt import quick_moves
    frame = frame_for(plan)
    crit = np.flatnonzero(frame.schedule.critical)
    assert np.allclose(quick_moves(frame, crit, delay), finish_moves(frame, crit, delay), atol=1e-6)
