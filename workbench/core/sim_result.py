"""The result of a Monte Carlo run: finish samples, odds, dates and per-activity indices.

Definitions (see docs/simulation.md): percentiles are empirical (the smallest simulated
finish reached in at least p % of iterations); criticality = share of iterations in which
the activity is critical; sensitivity = Spearman rank correlation of its sampled duration
with the finish; cruciality = Pearson correlation of its duration with the finish;
ssi = criticality × sd(duration) / sd(finish); merge bias = simulated mean − PERT mean.
"""

from __future__ import annotations

import datetime as dt
import math
from dataclasses import dataclass, field

import numpy as np
from scipy.stats import binom

from .calendar import round_offset
from .near_paths import near_critical_paths
from .pert import pert_odds

PERCENTILES = (5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95)


def _correlation(cov, var_x, var_y) -> np.ndarray:
    denom = np.sqrt(np.maximum(var_x, 0.0) * max(float(var_y), 0.0))
    ok = denom > 1e-12
    out = np.zeros(np.shape(cov))
    out[ok] = np.clip(cov[ok] / denom[ok], -1.0, 1.0)
    return out


@dataclass
class SimulationResult:
    iterations: int
    seed: int
    ids: list[str]
    finish: np.ndarray
    criticality: np.ndarray
    sensitivity: np.ndarray
    cruciality: np.ndarray
    ssi: np.ndarray
    duration_mean: np.ndarray
    duration_sd: np.ndarray
    pert_mean: float
    pert_sd: float
    deadline: float | None
    calendar: object
    schedule: object = field(repr=False)
    floor: np.ndarray = field(repr=False)
    variances: np.ndarray = field(repr=False)
    risk_report: list = field(default_factory=list)
    correlation_repaired: bool = False
    correlation_note: str = ""
    block_size: int = 0
    unit: str = "days"
    durations: np.ndarray | None = field(default=None, repr=False)
    target_confidence: float = 0.8
    resource_aware: bool = False

    @classmethod
    def build(cls, mc, seed, finish, acc, block, kept) -> "SimulationResult":
        n, iters = mc.net.size, finish.size
        mean_f, var_f = float(finish.mean()), float(finish.var())
        mean_d = acc.s_d / iters
        var_d = np.maximum(acc.s_dd / iters - mean_d**2, 0.0)
        cov_df = acc.s_df / iters - mean_d * (mean_f - acc.shift_f)
        crit = acc.critical / iters
        sens = np.zeros(n)
        unc = mc.durations.uncertain
        if unc.size:
            sens[unc] = _score_correlation(acc, finish)
        sd_f = math.sqrt(var_f)
        ssi = crit * np.sqrt(var_d) / sd_f if sd_f > 0 else np.zeros(n)
        pert = pert_odds(mc.schedule, mc.variances)
        return cls(iters, int(seed), list(mc.net.ids), finish, crit, sens, _correlation(cov_df, var_d, var_f), ssi,
                   mean_d + mc.means, np.sqrt(var_d), float(mc.schedule.finish), pert.sd, mc.deadline,
                   mc.calendar, mc.schedule, mc.analyzer.floor, mc.variances,
                   mc.risks.report(float(finish.sum()), iters), mc.correlation.repaired, mc.correlation.note(),
                   block, mc.plan.settings.unit, kept, float(mc.plan.settings.target_confidence),
                   getattr(mc, "resource_aware", False))

    # --- the finish distribution ------------------------------------------------
    @property
    def mean(self) -> float:
        return float(self.finish.mean())

    @property
    def sd(self) -> float:
        return float(self.finish.std(ddof=1)) if self.iterations > 1 else 0.0

    @property
    def merge_bias(self) -> float:
        """Simulated mean finish − PERT mean (the critical-path finish on te)."""
        return self.mean - self.pert_mean

    def sorted_finish(self) -> np.ndarray:
        if getattr(self, "_sorted", None) is None:
            self._sorted = np.sort(self.finish)
        return self._sorted

    def percentile(self, p: float) -> float:
        """The smallest simulated finish reached in at least p % of iterations (0 ≤ p ≤ 100)."""
        if not 0.0 <= p <= 100.0:
            raise ValueError(f"percentile must lie between 0 and 100, not {p}")
        s = self.sorted_finish()
        k = max(0, math.ceil(p / 100.0 * s.size - 1e-9) - 1)
        return float(s[min(k, s.size - 1)])

    @property
    def percentiles(self) -> dict[str, float]:
        return {f"P{p}": self.percentile(p) for p in PERCENTILES}

    def prob_by(self, d: float) -> tuple[float, float]:
        """P(finish ≤ d) and its standard error √(p(1 − p)/N)."""
        k = int(np.searchsorted(self.sorted_finish(), float(d) + 1e-9, side="right"))
        p = k / self.iterations
        return p, math.sqrt(p * (1.0 - p) / self.iterations)

    def prob_between(self, d1: float, d2: float) -> float:
        """P(d1 < finish ≤ d2); zero when d2 ≤ d1."""
        if d2 <= d1:
            return 0.0
        return self.prob_by(d2)[0] - self.prob_by(d1)[0]

    def histogram(self, bins: int = 40) -> tuple[np.ndarray, np.ndarray]:
        return np.histogram(self.finish, bins=bins)

    def ecdf(self) -> tuple[np.ndarray, np.ndarray]:
        """Distinct finish values x and the share of iterations finishing by each, F(x)."""
        x, counts = np.unique(self.finish, return_counts=True)
        return x, np.cumsum(counts) / self.iterations

    # --- convergence -----------------------------------------------------------
    @property
    def mean_stderr(self) -> float:
        return self.sd / math.sqrt(self.iterations)

    def percentile_interval(self, p: float, level: float = 0.95) -> tuple[float, float]:
        """Distribution-free interval for the p-th percentile from order statistics:
        ranks j, k from the binomial(N, p/100) quantiles at (1 ∓ level)/2."""
        n, q, s = self.iterations, p / 100.0, self.sorted_finish()
        j = int(binom.ppf((1.0 - level) / 2.0, n, q))
        k = int(binom.ppf((1.0 + level) / 2.0, n, q)) + 1
        return float(s[min(max(j, 1), n) - 1]), float(s[min(max(k, 1), n) - 1])

    @property
    def convergence(self) -> dict:
        p = 100.0 * self.target_confidence
        lo, hi = self.percentile_interval(p)
        return {"mean_stderr": self.mean_stderr, "percentile": p, "level": 0.95, "interval": [lo, hi]}

    # --- paths ------------------------------------------------------------------
    def near_critical(self, threshold: float, limit: int = 50) -> list[dict]:
        """Paths of the critical-path schedule (on PERT means) within ``threshold`` of its finish."""
        return near_critical_paths(self.schedule, self.floor, self.variances, threshold, limit)[0]

    # --- dates and export ---------------------------------------------------
    def date_of(self, offset: float) -> dt.date:
        return self.calendar.finish_date(offset)

    def by_id(self, values: np.ndarray) -> dict[str, float]:
        return {a: round(float(v), 6) for a, v in zip(self.ids, values)}

    def to_dict(self) -> dict:
        """The JSON contract of ``slackline simulate --json`` (offsets in plan units)."""
        pct = {k: round_offset(v) for k, v in self.percentiles.items()}
        out = {
            "iterations": self.iterations, "seed": self.seed, "unit": self.unit,
            "mean": round_offset(self.mean), "sd": round_offset(self.sd), "mean_date": self.date_of(self.mean).isoformat(),
            "percentiles": pct, "percentile_dates": {k: self.date_of(v).isoformat() for k, v in pct.items()},
            "pert_mean": round_offset(self.pert_mean), "pert_sd": round_offset(self.pert_sd),
            "merge_bias": round_offset(self.merge_bias),
            "criticality": self.by_id(self.criticality), "sensitivity": self.by_id(self.sensitivity),
            "cruciality": self.by_id(self.cruciality), "ssi": self.by_id(self.ssi),
            "risks": self.risk_report, "convergence": self.convergence,
            "near_critical": self.near_critical(self.pert_sd, limit=10),
        }
        if self.deadline is not None:
            p, err = self.prob_by(self.deadline)
            out.update(deadline=round_offset(self.deadline), deadline_date=self.date_of(self.deadline).isoformat(),
                       probability=p, probability_stderr=err)
        if self.correlation_repaired:
            out["correlation_note"] = self.correlation_note
        if self.resource_aware:
            out["resource_aware"] = True
        return out


def _score_correlation(acc, finish: np.ndarray) -> np.ndarray:
    """Pearson correlation of each uniform score with the finish rank: the rank of a score
    stands in for the rank of the duration it produces (same order)."""
    n = finish.size
    mean_u = acc.s_u / n
    var_u = acc.s_uu / n - mean_u**2
    return _correlation(acc.s_ur / n, var_u, acc.var_rank)
