"""The critical path test of the DCMA 14-point assessment (DCMA-EA PAM 200.1, Oct 2012, §4)
[memory]: add a large delay to a critical activity; a sound network moves the project finish
by exactly that much. A critical activity whose finish leads nowhere (no successor through
its finish: "dangling"), or that is critical only because of a constraint, fails.

Every critical activity is tested when there are at most :data:`MAX_TESTED`; beyond that the
ones most likely to fail (no finish-to-start or finish-to-finish successor) come first, then
a spread along the critical path. All tested delays run as one block of forward passes
(one column per tested activity), as the simulation does.
"""

from __future__ import annotations

import numpy as np

from .checkup_frame import CheckupFrame, names, _source
from .checkup_limits import differs
from .checkup_result import FAIL, NA, PASS, Check
from .cpm import constraint_bounds, forward

MAX_TESTED = 48


def tested_activities(frame: CheckupFrame) -> np.ndarray:
    """Indices of the critical activities to delay, at most :data:`MAX_TESTED`."""
    s, net = frame.schedule, frame.net
    crit = np.flatnonzero(s.critical & frame.incomplete)
    if crit.size <= MAX_TESTED:
        return crit
    from_finish = np.zeros(len(frame.ids), dtype=bool)
    from_finish[net.src[net.src_fin == 1.0]] = True
    open_ended = crit[~from_finish[crit]]
    rest = crit[from_finish[crit]]
    room = max(0, MAX_TESTED - open_ended.size)
    spread = rest[np.linspace(0, rest.size - 1, room).astype(int)] if room and rest.size else rest[:0]
    return np.unique(np.concatenate((open_ended[:MAX_TESTED], spread)))


def finish_moves(frame: CheckupFrame, tested: np.ndarray, delay: float) -> np.ndarray:
    """How far the project finish moves when each tested activity alone is ``delay`` longer."""
    s, net = frame.schedule, frame.net
    d = np.repeat(s.durations[:, None], tested.size, axis=1)
    d[tested, np.arange(tested.size)] += delay
    floor, _ = constraint_bounds(frame.plan, frame.analysis.calendar)
    es = forward(net, net.link_offsets(d), np.maximum(floor, 0.0))
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
    moved = finish_moves(frame, tested, delay)
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
