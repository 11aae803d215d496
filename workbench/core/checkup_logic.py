"""The DCMA 14-point assessment's metrics on logic, constraints, float and durations, and the
critical path length index (DCMA-EA PAM 200.1, EVMS Program Analysis Pamphlet, Defense
Contract Management Agency, October 2012, section 4; thresholds recalled [memory]).

Counts are over activities still to do (all of them without progress); link metrics count
links into activities still to do, and name each link's successor as the offender.
"""

from __future__ import annotations

import numpy as np

from .checkup_frame import CheckupFrame, count_check, names, share_check, _source
from .checkup_limits import STANDARD_SHORT, differs
from .checkup_progress import NEEDS
from .checkup_result import FAIL, NA, PASS, Check

EPS = 1e-9


def plan_ends(frame: CheckupFrame, has_pred: np.ndarray, has_succ: np.ndarray) -> tuple[int | None, int | None]:
    """The plan's own first activity (no predecessor, earliest start, first in plan order)
    and last activity (no successor, finishing at the project finish, last in plan order)."""
    s = frame.schedule
    first = last = None
    starts = np.flatnonzero(~has_pred)
    if starts.size:
        first = int(starts[np.argmin(s.es[starts])])          # argmin: first of the earliest
    ends = np.flatnonzero(~has_succ & (s.ef >= s.finish - EPS))
    if ends.size:
        last = int(ends[-1])
    return first, last


def missing_logic(frame: CheckupFrame) -> Check:
    net, n = frame.net, len(frame.ids)
    has_pred = np.bincount(net.dst, minlength=n) > 0
    has_succ = np.bincount(net.src, minlength=n) > 0
    assessed = frame.incomplete.copy()
    first, last = plan_ends(frame, has_pred, has_succ)
    for end in (first, last):
        if end is not None:
            assessed[end] = False
    bad = assessed & ~(has_pred & has_succ)
    ends = ", ".join(frame.ids[i] for i in dict.fromkeys(e for e in (first, last) if e is not None))
    note = f"The plan's first and last activities ({ends}) are left out." if ends else ""
    offenders = frame.ids_of(bad)
    if offenders:
        note = f"Without a predecessor or a successor: {names(offenders)}. " + note
    return share_check(frame, "missing_logic", "Logic", int(bad.sum()), int(assessed.sum()),
                       "missing_logic_pct", "activities", offenders, note.strip())


def _links_to_do(frame: CheckupFrame) -> np.ndarray:
    return frame.incomplete[frame.net.dst]


def _link_names(frame: CheckupFrame, links: np.ndarray) -> tuple[list[str], str]:
    """Successor ids (unique, plan order) and a note naming the first few links."""
    net, ids, plan_links = frame.net, frame.ids, frame.plan.links
    succ = sorted(set(net.dst[links].tolist()))
    shown = [f"{ids[net.src[k]]} \u2192 {ids[net.dst[k]]} ({plan_links[k].type} {frame.lags[k]:+g})"
             for k in links[:3].tolist()]
    more = f" and {links.size - 3} more" if links.size > 3 else ""
    return [ids[i] for i in succ], ("; ".join(shown) + more) if shown else ""


def leads(frame: CheckupFrame) -> Check:
    links = np.flatnonzero(_links_to_do(frame) & (frame.lags < -EPS))
    offenders, note = _link_names(frame, links)
    return count_check(frame, "leads", "Leads", offenders, "leads_count", "activities after a lead",
                       f"Links with a negative lag: {note}." if note else "")


def lags(frame: CheckupFrame) -> Check:
    counted = _links_to_do(frame)
    links = np.flatnonzero(counted & (frame.lags > EPS))
    offenders, note = _link_names(frame, links)
    return share_check(frame, "lags", "Lags", int(links.size), int(counted.sum()), "lags_pct", "links",
                       offenders, f"Links with a positive lag: {note}." if note else "")


def link_types(frame: CheckupFrame) -> Check:
    net = frame.net
    counted = _links_to_do(frame)
    fs = (net.src_fin == 1.0) & (net.dst_fin == 0.0)
    other = np.flatnonzero(counted & ~fs)
    offenders, note = _link_names(frame, other)
    return share_check(frame, "link_types", "Relationship types", int((counted & fs).sum()), int(counted.sum()),
                       "fs_links_pct", "links finish-to-start", offenders,
                       f"Other links: {note}." if note else "", at_least=True)


def hard_constraints(frame: CheckupFrame) -> Check:
    acts = frame.plan.activities
    hard = np.fromiter((a.finish_no_later is not None for a in acts), bool, len(acts)) & frame.incomplete
    offenders = frame.ids_of(hard)
    note = "Finish-no-later constraints can hold logic back; start-no-earlier ones are soft and not counted."
    return share_check(frame, "hard_constraints", "Hard constraints", len(offenders), int(frame.incomplete.sum()),
                       "hard_constraints_pct", "activities", offenders, note)


def high_float(frame: CheckupFrame) -> Check:
    days = frame.limit("high_float_days")
    above = frame.days_to_units(days)
    high = frame.incomplete & (frame.schedule.total_float > above + EPS)
    note = f"Total float above {days:g} working days" + _in_units(frame, above) + "."
    return share_check(frame, "high_float", "High float", int(high.sum()), int(frame.incomplete.sum()),
                       "high_float_pct", "activities", frame.ids_of(high), note, also=("high_float_days",))


def negative_float(frame: CheckupFrame) -> Check:
    neg = frame.incomplete & (frame.schedule.total_float < -EPS)
    offenders = frame.ids_of(neg)
    note = "Negative float: the deadline or a finish-no-later constraint cannot be met on logic." if offenders else ""
    return count_check(frame, "negative_float", "Negative float", offenders, "negative_float_count",
                       "activities with negative float", note)


def long_durations(frame: CheckupFrame) -> Check:
    days = frame.limit("long_duration_days")
    above = frame.days_to_units(days)
    d = frame.schedule.durations
    counted = frame.incomplete & (d > 0)
    long = counted & (d > above + EPS)
    note = f"Planned (PERT mean) duration above {days:g} working days" + _in_units(frame, above) + "; milestones aside."
    return share_check(frame, "long_durations", "High duration", int(long.sum()), int(counted.sum()),
                       "long_durations_pct", "activities", frame.ids_of(long), note, also=("long_duration_days",))


def _in_units(frame: CheckupFrame, units: float) -> str:
    return f" ({units:.4g} weeks)" if frame.unit == "weeks" else ""


def resources(frame: CheckupFrame) -> Check:
    """Informational: activities without resources or cost (the plan has neither yet)."""
    pool = getattr(frame.plan, "resources", None)
    if not pool:
        note = "The plan carries no resources or costs yet, so this metric does not apply."
        return Check("resources", "Resources", NA, None, "informational", "not applicable", [], note,
                     STANDARD_SHORT)
    acts = frame.plan.activities
    bare = [a.id for a in acts if not getattr(a, "resources", None) and not getattr(a, "cost", None)
            and a.mean > 0]
    return Check("resources", "Resources", NA, float(len(bare)), "informational",
                 f"{len(bare)} activities without resources or cost", bare,
                 "Informational: the standard sets no threshold.", STANDARD_SHORT)


def cpli(frame: CheckupFrame) -> Check:
    """(remaining critical path length + total float to the deadline) / remaining length."""
    limit, a = frame.limit("cpli_min"), frame.analysis
    name, threshold = "Critical path length index (CPLI)", f">= {frame.limit('cpli_min'):g}"
    facts = frame.progress
    origin = facts.status_offset if facts.has_progress else 0.0
    length = a.schedule.finish - origin
    if a.deadline is None or length <= EPS:
        why = "Set a deadline to measure it." if a.deadline is None else "No critical path remains."
        return Check("cpli", name, NA, None, threshold, "not applicable", [], why, _source("cpli_min"))
    value = (length + (a.deadline - a.schedule.finish)) / length
    status = PASS if value >= limit - 1e-9 else FAIL
    note = "Measured from the status date." if facts.has_progress else (
        f"Measured from the project start; the status part {NEEDS}.")
    offenders = list(a.pert.path) if status == FAIL else []
    return Check("cpli", name, status, value, threshold,
                 f"{value:.3f} (critical path {length:.4g} {frame.unit}, float to the deadline "
                 f"{a.deadline - a.schedule.finish:+.4g})", offenders, note, _source("cpli_min"),
                 changed=differs("cpli_min", limit))
