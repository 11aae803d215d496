"""What every checkup metric reads, computed once per checkup: the schedule's arrays,
which activities are still to do, the thresholds and how to turn counts into a :class:`Check`."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from operator import attrgetter

import numpy as np

from .checkup_limits import BY_KEY, COMMON_PRACTICE, STANDARD_SHORT, differs
from .checkup_progress import ProgressFacts
from .checkup_result import FAIL, PASS, STANDARD, Check

NAMES_IN_NOTE = 5


@dataclass
class CheckupFrame:
    plan: object
    analysis: object
    limits: dict
    progress: ProgressFacts
    incomplete: np.ndarray          # bool per activity: not finished (all of them without progress)

    @property
    def ids(self) -> list[str]:
        return self.analysis.schedule.ids

    @property
    def schedule(self):
        return self.analysis.schedule

    @property
    def net(self):
        return self.analysis.schedule.network

    @cached_property
    def lags(self) -> np.ndarray:
        """Each link's lag as the plan gives it, in link order. (The schedule's network is the
        engine's: from a status date it marks links that progress has passed with a lag of
        minus infinity, which is no lead the planner entered.)"""
        links = self.plan.links
        return np.fromiter(map(attrgetter("lag"), links), dtype=float, count=len(links))

    @property
    def unit(self) -> str:
        return self.plan.settings.unit

    def days_to_units(self, days: float) -> float:
        """Working days in the plan's unit (a week is as many days as the calendar works)."""
        return float(days) / self.analysis.calendar.per_unit

    def ids_of(self, mask) -> list[str]:
        ids = self.ids
        return [ids[i] for i in np.flatnonzero(mask).tolist()]

    def limit(self, key: str) -> float:
        return self.limits[key]


def share_text(count: int, total: int, things: str) -> str:
    if not total:
        return f"none to count (0 {things.split()[0]})"
    return f"{100.0 * count / total:.1f} % ({count} of {total} {things})"


SINGULAR = {"activities": "activity", "links": "link", "merges": "merge"}


def counted(count: int, things: str) -> str:
    """"1 activity", "3 activities": ``things`` is plural, its first word turned singular for one."""
    if count == 1:
        first, _, rest = things.partition(" ")
        things = " ".join(x for x in (SINGULAR.get(first, first), rest) if x)
    return f"{count} {things}"


def names(ids: list[str], limit: int = NAMES_IN_NOTE) -> str:
    shown = ", ".join(ids[:limit])
    return shown + (f" and {len(ids) - limit} more" if len(ids) > limit else "")


def share_check(frame: CheckupFrame, check_id: str, name: str, count: int, total: int, key: str,
                things: str, offenders: list[str], note: str = "", at_least: bool = False,
                also: tuple[str, ...] = ()) -> Check:
    """A check on a percentage of ``total`` against threshold ``key`` (≤, or ≥ with ``at_least``)."""
    limit = frame.limit(key)
    pct = 100.0 * count / total if total else (100.0 if at_least else 0.0)
    ok = pct >= limit - 1e-9 if at_least else pct <= limit + 1e-9
    sign = ">=" if at_least else "<="
    return Check(check_id, name, PASS if ok else FAIL, pct, f"{sign} {limit:g} %",
                 share_text(count, total, things), offenders, note, _source(key),
                 changed=any(differs(k, frame.limit(k)) for k in (key, *also)))


def count_check(frame: CheckupFrame, check_id: str, name: str, offenders: list[str], key: str,
                things: str, note: str = "", family: str = STANDARD) -> Check:
    """A check on a count of offenders against threshold ``key`` (at most)."""
    limit = frame.limit(key)
    count = len(offenders)
    return Check(check_id, name, PASS if count <= limit + 1e-9 else FAIL, float(count), f"<= {limit:g}",
                 counted(count, things), offenders, note, _source(key), family, differs(key, limit))


def _source(key: str) -> str:
    return STANDARD_SHORT if BY_KEY[key].published else COMMON_PRACTICE
