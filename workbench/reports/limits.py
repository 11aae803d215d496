"""How much of a very large plan the approval pack prints, so a pack of any plan is
written in bounded time and stays a document a board can leaf through. Past these
limits a section shows the activities with the least total float (every critical one
first) and says so; the full figures are in the window and in ``slackline export``."""

from __future__ import annotations

import numpy as np

TIMELINE_PAGES = 60            # landscape Timeline pages, rows and time windows together
TIMELINE_WINDOWS = 6           # pages across the same rows, for a very long time span
TABLE_ROWS = 2_500             # rows of the activity table (about 70 landscape pages)
NETWORK_ACTIVITIES = 5_000     # larger networks get no diagram (laying one out takes minutes)
NETWORK_DETAIL_PAGES = 40      # detail pages after the overview (past it: the critical path's only)


def least_float(schedule, count: int) -> np.ndarray:
    """Plan rows of the ``count`` activities with the least total float (ties: plan
    order), returned in plan order."""
    total = np.asarray(schedule.total_float, dtype=float)
    if count >= total.size:
        return np.arange(total.size)
    chosen = np.argsort(total, kind="stable")[:count]
    return np.sort(chosen)


def summarised(shown: int, total: int, what: str) -> str:
    """The sentence a summarised section prints under its heading."""
    return (f"This plan has {total:,} activities, too many to print in full: {what} shows the "
            f"{shown:,} with the least total float, every critical activity among them. The "
            f"window and 'slackline export' give all of them.")
