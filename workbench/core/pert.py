"""PERT odds on the critical path: a normal finish with the path's mean and variance.

Single-path PERT assumes the chosen path decides the finish and that durations are
independent; it is optimistic where near-critical paths merge (see ``montecarlo``).
A zero variance gives an exact step (0 or 1), never NaN.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .normal import ndtr, ndtri  # the standard normal CDF and its inverse (no scipy import)


@dataclass(frozen=True)
class PertOdds:
    mean: float
    variance: float
    path: tuple[str, ...]
    tied: int = 1            # how many critical paths tie on the mean
    note: str = ""           # which path was used, when several tie

    @property
    def sd(self) -> float:
        return math.sqrt(self.variance)

    def z(self, duration: float) -> float:
        """Standard score of a duration; ±inf when the variance is zero (0 when equal)."""
        if self.variance <= 0.0:
            diff = duration - self.mean
            return 0.0 if abs(diff) <= 1e-12 else math.copysign(math.inf, diff)
        return (duration - self.mean) / self.sd

    def prob_by(self, duration: float) -> float:
        """P(T ≤ duration)."""
        if self.variance <= 0.0:
            return 1.0 if duration >= self.mean - 1e-12 else 0.0
        return float(ndtr((duration - self.mean) / self.sd))

    def prob_after(self, duration: float) -> float:
        """P(T > duration)."""
        if self.variance <= 0.0:
            return 1.0 - self.prob_by(duration)
        return float(ndtr((self.mean - duration) / self.sd))

    def prob_between(self, low: float, high: float) -> float:
        """P(low < T ≤ high); zero when high ≤ low."""
        if high <= low:
            return 0.0
        return max(0.0, self.prob_by(high) - self.prob_by(low))

    def duration_at(self, probability: float) -> float:
        """The duration reached with the given probability: mean + sd · Φ⁻¹(p)."""
        if not 0.0 < probability < 1.0:
            raise ValueError(f"probability must lie strictly between 0 and 1, not {probability}")
        if self.variance <= 0.0:
            return self.mean
        return float(self.mean + self.sd * ndtri(probability))


def pert_odds(schedule, variances) -> PertOdds:
    """Odds for a schedule computed on PERT means; ``variances`` per activity (array)."""
    from .cpm import max_weight_indices

    chosen = max_weight_indices(schedule, variances)
    path = [schedule.ids[i] for i in chosen]
    var = float(np.sum(np.asarray(variances, dtype=float)[chosen])) if chosen else 0.0
    tied = max(1, len(schedule.paths))
    note = ""
    if tied > 1:
        more = "+" if schedule.paths_truncated else ""
        note = (f"{tied}{more} critical paths tie at {schedule.finish:g}; "
                f"the one with the largest variance is used: {'-'.join(path)}")
    return PertOdds(schedule.finish, var, tuple(path), tied, note)
