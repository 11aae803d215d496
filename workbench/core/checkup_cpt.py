"""The critical path test of the DCMA 14-point assessment (DCMA-EA PAM 200.1, Oct 2012, §4)
[memory]: add a large delay to a critical activity; a sound network moves the project finish
by exactly that much. A critical activity whose finish leads nowhere (no successor through
its finish: "dangling"), or that is critical only because of a constraint, fails.

Every critical activity is tested at once, from one backward pass: a delay Δ to activity i
lengthens every path through its finish by Δ, and lets its start come only from links into
its start (finish-to-finish and start-to-finish links into it now arrive Δ earlier), so the
new finish is max(finish, ES'_i + Δ + R_i): ES'_i is the latest of its start floor and its
arrivals through links into its start, R_i the longest way from its start through its
finish to any end (its duration, or a finish-to-start/finish-to-finish link and the longest
tail after it). That is exact whenever the delay outweighs start-no-earlier floors
downstream; a floor can only make the real finish later, so a pass is always a pass, and
each failure (up to :data:`MAX_VERIFIED`) is confirmed by the engine's own forward passes,
one column per delayed activity, as the simulation runs them.
"""

from __future__ import annotations

import numpy as np

from .checkup_frame import CheckupFrame, names, _source
from .checkup_limits import differs
from .checkup_result import FAIL, NA, PASS, Check
from .cpm import backward, constraint_bounds, forward

MAX_VERIFIED = 48


def tested_activities(frame: CheckupFrame) -> np.ndarray:
    """Indices of the critical activities still to do (all of them are tested)."""
    return np.flatnonzero(frame.schedule.critical & frame.incomplete)


def quick_moves(frame: CheckupFrame, tested: np.ndarray, delay: float) -> np.ndarray:
    """How far the finish moves when each tested activity alone is ``delay`` longer (exact
    when the delay outweighs start floors; see the module)."""
    s, net = frame.schedule, frame.net
    d = s.durations
    off = net.link_offsets(d)
    tail = s.finish - backward(net, off, np.full(d.size, s.finish) - d)     # longest from each start
    reach = d.copy()
    fin = np.flatnonzero(net.src_fin == 1.0)
    np.maximum.at(reach, net.src[fin], off[fin] + tail[net.dst[fin]])
    start = floors(frame)
    into = np.flatnonzero(net.dst_fin == 0.0)
    np.maximum.at(start, net.dst[into], s.es[net.src[into]] + off[into])
    return np.maximum(s.finish, start[tested] + delay + reach[tested]) - s.finish


def floors(frame: CheckupFrame) -> np.ndarray:
    """Each activity's earliest allowed start (project start or start-no-earlier), a copy."""
    analyzer = getattr(frame.plan, "_analyzer", None)       # the analysis's own, when current
    if analyzer is not None and analyzer.net is frame.net:
        return analyzer.floor.copy()
    return np.maximum(constraint_bounds(frame.plan, frame.analysis.calendar)[0], 0.0)


def finish_moves(frame: CheckupFrame, tested: np.ndarray, delay: float) -> np.ndarray:
    """How far the project finish moves when each tested activity alone is ``delay`` longer."""
    s, net = frame.schedule, frame.net
    d = np.repeat(s.durations[:, None], tested.size, axis=1)
    d[tested, np.arange(tested.size)] += delay
    es = forward(net, net.link_offsets(d), floors(frame))
    return (es + d).max(axis=0) - s.finish


def critical_path_test(frame: CheckupFrame) -> Check:
    key = "critical_path_delay_days"
    days = frame.limit(key)
    delay = frame.days_to_units(days)
    tested = tested_activities(frame)
    name, threshold = "Critical path test", "pass"
    if not tested.size:
        return Check("critical_path_test", name, NA, None, threshold, "not applicable", [],
                     "No critical activity is left to test.", _source(key))
    moved = quick_moves(frame, tested, delay)
    wrong = np.abs(moved - delay) > 1e-6 * max(1.0, delay)
    check = np.flatnonzero(wrong)[:MAX_VERIFIED]
    if check.size:                                   # confirm failures with the engine itself
        moved[check] = finish_moves(frame, tested[check], delay)
        wrong = np.abs(moved - delay) > 1e-6 * max(1.0, delay)
    offenders = [frame.ids[i] for i in tested[wrong].tolist()]
    note = (f"Each of {tested.size} critical activities was made {days:g} working days longer; "
            f"the finish must move by exactly as much.")
    if offenders:
        worst = int(np.argmax(np.abs(moved - delay)))
        note += (f" It did not for {names(offenders)} (e.g. {frame.ids[tested[worst]]}: "
                 f"{moved[worst]:.4g} {frame.unit} instead of {delay:.4g}).")
    return Check("critical_path_test", name, FAIL if offenders else PASS, float(len(offenders)), threshold,
                 f"{tested.size - len(offenders)} of {tested.size} delays moved the finish fully",
                 offenders, note, _source(key), changed=differs(key, days))
