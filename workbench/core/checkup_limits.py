"""Checkup thresholds: the published defaults, our own defaults, and a plan's own values.

The standard's thresholds are those of the DCMA 14-point schedule assessment (DCMA-EA
PAM 200.1, EVMS Program Analysis Pamphlet, Defense Contract Management Agency, October
2012, section 4); the figures were recalled [memory], not re-read in the pamphlet. The
thresholds of our own checks are common practice. A plan stores only the thresholds its
organisation changed (``Plan.checkup_thresholds``); the rest follow the defaults.
Durations are in working days whatever the plan's unit (converted when checking).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .errors import PlanError

STANDARD_NAME = "DCMA 14-point schedule assessment"
STANDARD_SOURCE = ("DCMA-EA PAM 200.1, EVMS Program Analysis Pamphlet, Defense Contract "
                   "Management Agency, October 2012, section 4")
STANDARD_SHORT = "DCMA-EA PAM 200.1 (Oct 2012) \u00a74"
COMMON_PRACTICE = "common practice"


@dataclass(frozen=True)
class Limit:
    """One editable threshold: its key, default, what it means, its unit and range."""

    key: str
    default: float
    label: str
    unit: str            # "%", "count", "ratio", "working days", "points", "times"
    published: bool      # True: the standard's figure; False: our own (common practice)
    high: float = 100.0

    def checked(self, value) -> float:
        if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value):
            raise PlanError(f"checkup threshold {self.key}: must be a number, not {value!r}", self.key)
        if not 0.0 <= float(value) <= self.high:
            raise PlanError(f"checkup threshold {self.key}: {value:g} lies outside 0\u2013{self.high:g} "
                            f"({self.unit})", self.key)
        return float(value)


LIMITS: tuple[Limit, ...] = (
    Limit("missing_logic_pct", 5.0, "activities without a predecessor or successor, at most", "%", True),
    Limit("leads_count", 0.0, "links with a negative lag, at most", "count", True, 1e6),
    Limit("lags_pct", 5.0, "links with a positive lag, at most", "%", True),
    Limit("fs_links_pct", 90.0, "finish-to-start links, at least", "%", True),
    Limit("hard_constraints_pct", 5.0, "activities with a finish-no-later constraint, at most", "%", True),
    Limit("high_float_days", 44.0, "total float counted as high, above", "working days", True, 1e5),
    Limit("high_float_pct", 5.0, "activities with high float, at most", "%", True),
    Limit("negative_float_count", 0.0, "activities with negative float, at most", "count", True, 1e6),
    Limit("long_duration_days", 44.0, "duration counted as long, above", "working days", True, 1e5),
    Limit("long_durations_pct", 5.0, "activities with a long duration, at most", "%", True),
    Limit("invalid_dates_count", 0.0, "activities with invalid dates, at most", "count", True, 1e6),
    Limit("missed_activities_pct", 5.0, "activities that missed their baseline finish, at most", "%", True),
    Limit("critical_path_delay_days", 600.0, "delay added in the critical path test", "working days", True, 1e5),
    Limit("cpli_min", 0.95, "critical path length index, at least", "ratio", True, 10.0),
    Limit("bei_min", 0.95, "baseline execution index, at least", "ratio", True, 10.0),
    Limit("certainty_band_pct", 5.0, "a range narrower than \u00b1 this share of the most likely is false certainty",
          "%", False),
    Limit("near_critical_days", 10.0, "total float counted as near-critical, at most", "working days", False, 1e5),
    Limit("false_certainty_count", 0.0, "near-critical activities without a real range, at most", "count", False, 1e6),
    Limit("range_ratio_max", 3.0, "pessimistic as a multiple of the most likely, at most", "times", False, 1e3),
    Limit("end_mode_pct", 25.0, "estimates with the most likely at an end of the range, at most", "%", False),
    Limit("merge_branch_pct", 10.0, "share of runs a converging path must be critical in to count", "%", False),
    Limit("merge_hot_spots_count", 0.0, "merge hot spots, at most", "count", False, 1e6),
    Limit("odds_gap_points", 10.0, "gap between PERT's and the simulation's chance, at most", "points", False),
)

BY_KEY = {limit.key: limit for limit in LIMITS}


def default_thresholds() -> dict[str, float]:
    return {limit.key: limit.default for limit in LIMITS}


def checked_thresholds(values) -> dict[str, float]:
    """A plan's own thresholds, validated; values equal to the default are dropped (they
    follow the default). Raises PlanError naming the threshold."""
    if not isinstance(values, dict):
        raise PlanError(f"checkup thresholds must be a table of names and numbers, not {values!r}", "checkup")
    out = {}
    for key, value in values.items():
        limit = BY_KEY.get(key)
        if limit is None:
            raise PlanError(f"unknown checkup threshold {key!r} (known: {', '.join(BY_KEY)})", str(key))
        value = limit.checked(value)
        if value != limit.default:
            out[key] = value
    return out


def thresholds_of(plan) -> dict[str, float]:
    """Every threshold for ``plan``: its own values over the defaults."""
    values = default_thresholds()
    values.update(getattr(plan, "checkup_thresholds", None) or {})
    return values


def differs(key: str, value: float) -> bool:
    """Whether a threshold differs from the standard's published figure (or our default)."""
    return not math.isclose(value, BY_KEY[key].default, rel_tol=0.0, abs_tol=1e-12)
