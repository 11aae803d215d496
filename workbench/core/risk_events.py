"""Risk events: with a probability, a three-point delay is added to each listed activity.

In an iteration a risk fires when its occurrence score is below its probability; it then
draws one delay (from the plan's distribution family, like an activity) and adds it to
the duration of every activity it lists. The report says how often each risk fired and its
*finish impact*: mean finish over iterations where it fired minus mean finish where it did
not (None when it always or never fired).
"""

from __future__ import annotations

import math

import numpy as np

from .distributions import DurationModel, check_family
from .errors import PlanError


def _check_risk(risk, index: dict) -> None:
    name = risk.id or "(unnamed)"
    p = risk.probability
    if isinstance(p, bool) or not isinstance(p, (int, float)) or not math.isfinite(p) or not 0.0 <= p <= 1.0:
        raise PlanError(f"risk {name}: probability must lie between 0 and 1, not {p!r}", name)
    for act in risk.activities:
        if act not in index:
            raise PlanError(f"risk {name}: unknown activity {act!r}", name)


class RiskModel:
    """Sampling and bookkeeping of a plan's risk events."""

    def __init__(self, risks, ids: list[str], family: str):
        index = {a: i for i, a in enumerate(ids)}
        for risk in risks:
            _check_risk(risk, index)
        self.risks = list(risks)
        self.size = len(self.risks)
        check_family(family, "distribution", "settings")
        self.probability = np.array([float(r.probability) for r in self.risks])
        self.delays = DurationModel([family] * self.size, [r.optimistic for r in self.risks],
                                    [r.most_likely for r in self.risks], [r.pessimistic for r in self.risks],
                                    [r.id for r in self.risks], what="risk")
        self.targets = [np.array(sorted({index[a] for a in r.activities}), dtype=np.int64) for r in self.risks]
        self.fired = np.zeros(self.size, dtype=np.int64)
        self.finish_fired = np.zeros(self.size)
        self.delay_fired = np.zeros(self.size)

    def draw(self, occurrence: np.ndarray, delay_scores: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """Per risk and iteration: fired (bool) and the delay added (0 where not fired)."""
        fired = occurrence < self.probability[:, None]
        delay = self.delays.sample(delay_scores[self.delays.uncertain]) if self.size else occurrence
        return fired, np.where(fired, delay, 0.0)

    def apply(self, durations: np.ndarray, delay: np.ndarray) -> None:
        for r, rows in enumerate(self.targets):
            if rows.size:
                durations[rows] += delay[r]

    def record(self, fired: np.ndarray, delay: np.ndarray, finish: np.ndarray) -> None:
        self.fired += fired.sum(axis=1)
        self.finish_fired += np.einsum("ij,j->i", fired.astype(float), finish)   # no BLAS threads
        self.delay_fired += delay.sum(axis=1)

    def report(self, finish_total: float, iterations: int) -> list[dict]:
        out = []
        for r, risk in enumerate(self.risks):
            k = int(self.fired[r])
            impact = None
            if 0 < k < iterations:
                impact = self.finish_fired[r] / k - (finish_total - self.finish_fired[r]) / (iterations - k)
            out.append({"id": risk.id, "name": risk.name, "probability": float(risk.probability),
                        "fired": k / iterations, "mean_delay": self.delay_fired[r] / k if k else None,
                        "finish_impact": impact, "activities": list(risk.activities)})
        return out
