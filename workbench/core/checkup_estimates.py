"""Checks of our own on the three-point estimates (common practice; no published source).

- **False certainty**: work on the critical or a near-critical path (total float at most
  ``near_critical_days`` more than the critical path's, which with a deadline is the float
  to the deadline) entered without a real range: one number (a fixed duration not
  declared ``fixed``), optimistic = most likely = pessimistic, or a range narrower than
  ± ``certainty_band_pct`` of the most likely. Such an estimate hides uncertainty where it
  moves the date, and makes PERT and the simulation too confident.
- **Suspicious ranges**: a pessimistic estimate more than ``range_ratio_max`` times the most
  likely; and, when more than ``end_mode_pct`` of the estimates put the most likely at an end
  of its range, each of those (often a sign the estimates were not really three-point).
"""

from __future__ import annotations

from operator import attrgetter

import numpy as np

from .checkup_frame import CheckupFrame, counted, names, _source
from .checkup_limits import differs
from .checkup_result import FAIL, OWN_ESTIMATES, PASS, Check

EPS = 1e-9


def estimate_arrays(plan) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Optimistic, most likely, pessimistic (NaN without an estimate) and whether the
    activity is declared fixed, in plan order."""
    acts = plan.activities       # numpy reads a missing value (None) as NaN
    a, m, b = (np.array(list(map(attrgetter(k), acts)), dtype=float).reshape(-1)
               for k in ("optimistic", "most_likely", "pessimistic"))
    fixed = np.array([x.distribution == "fixed" for x in acts], dtype=bool).reshape(-1)
    return a, m, b, fixed


def false_certainty(frame: CheckupFrame, arrays=None) -> Check:
    a, m, b, fixed = arrays or estimate_arrays(frame.plan)
    band = frame.limit("certainty_band_pct") / 100.0
    near = frame.limit("near_critical_days")
    s = frame.schedule
    work = frame.incomplete & (s.durations > EPS) & ~fixed
    level = 0.0 if s.deadline is None else s.deadline - s.finish     # the critical path's own float
    close = s.total_float - level <= frame.days_to_units(near) + EPS
    single = np.isnan(m)
    with np.errstate(invalid="ignore"):
        narrow = ~single & ((b - a) < 2.0 * band * m - EPS)
    bad_single = work & close & single
    bad_narrow = work & close & narrow
    offenders = frame.ids_of(bad_single | bad_narrow)
    parts = []
    if bad_single.any():
        parts.append(f"entered as one number: {names(frame.ids_of(bad_single))}")
    if bad_narrow.any():
        parts.append(f"range narrower than \u00b1{band * 100:g} %: {names(frame.ids_of(bad_narrow))}")
    note = (f"Critical or near-critical work (within {near:g} working days of the critical path's float) without a real "
            f"range; declare a duration 'fixed' when it truly is." + (" " + _sentence("; ".join(parts)) + "."
                                                                   if parts else ""))
    limit = frame.limit("false_certainty_count")
    keys = ("certainty_band_pct", "near_critical_days", "false_certainty_count")
    return Check("false_certainty", "False certainty", PASS if len(offenders) <= limit + EPS else FAIL,
                 float(len(offenders)), f"<= {limit:g}", counted(len(offenders), "activities"), offenders, note,
                 _source("certainty_band_pct"), OWN_ESTIMATES, any(differs(k, frame.limit(k)) for k in keys))


def suspicious_ranges(frame: CheckupFrame, arrays=None) -> Check:
    a, m, b, _ = arrays or estimate_arrays(frame.plan)
    ratio, end_pct = frame.limit("range_ratio_max"), frame.limit("end_mode_pct")
    todo = frame.incomplete & ~np.isnan(m)
    with np.errstate(invalid="ignore"):
        wide = todo & (m > EPS) & (b > ratio * m + EPS)
        ranged = todo & (b - a > EPS)
        at_end = ranged & ((np.abs(m - a) <= EPS) | (np.abs(b - m) <= EPS))
    share = 100.0 * at_end.sum() / ranged.sum() if ranged.any() else 0.0
    ends_bad = share > end_pct + 1e-9
    offenders = frame.ids_of(wide | (at_end if ends_bad else np.zeros_like(wide)))
    parts = []
    if wide.any():
        parts.append(f"pessimistic above {ratio:g}\u00d7 the most likely: {names(frame.ids_of(wide))}")
    parts.append(f"most likely at an end of its range in {share:.0f} % of the estimates"
                 + (f" ({names(frame.ids_of(at_end))})" if ends_bad else ""))
    keys = ("range_ratio_max", "end_mode_pct")
    status = FAIL if wide.any() or ends_bad else PASS
    return Check("suspicious_ranges", "Suspicious ranges", status, float(len(offenders)),
                 f"<= {ratio:g}x; <= {end_pct:g} % at an end", counted(len(offenders), "activities"),
                 offenders, _sentence("; ".join(parts)) + ".", _source("range_ratio_max"), OWN_ESTIMATES,
                 any(differs(k, frame.limit(k)) for k in keys))


def _sentence(text: str) -> str:
    """The first letter in capitals, ids left as they are."""
    return text[:1].upper() + text[1:]
