"""Duration distributions for the simulation, sampled by inverse CDF from uniform scores.

Every distribution maps a score u in [0, 1) to a duration through its quantile function,
so a duration's rank equals its score's rank (the basis of correlation and sensitivity).

- ``beta-pert``: beta on [a, b] with α = 1 + 4(m − a)/(b − a), β = 1 + 4(b − m)/(b − a);
  mean (a + 4m + b)/6, variance (b − a)²·αβ/252 (fast table, see ``quantile_table``);
- ``triangular``: on [a, b] with mode m (closed-form quantile);
- ``uniform``: on [a, b];
- ``normal``: mean te = (a + 4m + b)/6, sd (b − a)/6, truncated at zero;
- ``fixed``: always te (or the fixed duration), as the critical-path schedule uses.

A degenerate estimate (a = b) or an activity with a single duration is fixed.
"""

from __future__ import annotations

import numpy as np

from .errors import PlanError
from .model import DISTRIBUTIONS
from .quantile_table import beta_pert_table


def check_family(name, culprit: str, what: str) -> str:
    if name not in DISTRIBUTIONS:
        raise PlanError(f"{what}: unknown distribution {name!r} (use one of {', '.join(DISTRIBUTIONS)})", culprit)
    return name


def _is_number(v) -> bool:
    return isinstance(v, (int, float, np.floating, np.integer)) and not isinstance(v, bool) and bool(np.isfinite(v))


def _check_rows(families, a, m, b, names, what: str) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Validate all rows at once; the first bad one is named in a PlanError."""
    unknown = [i for i, f in enumerate(families) if f not in DISTRIBUTIONS]
    if unknown:
        check_family(families[unknown[0]], names[unknown[0]], f"{what} {names[unknown[0]]}")
    try:
        arrays = tuple(np.asarray(v, dtype=float).reshape(len(families)) for v in (a, m, b))
    except (TypeError, ValueError):
        arrays = None
    if arrays is None or not all(np.isfinite(x).all() for x in arrays):
        i = next(i for i in range(len(families)) if not all(_is_number(v) for v in (a[i], m[i], b[i])))
        raise PlanError(f"{what} {names[i]}: the three-point estimate must be three finite numbers, "
                        f"not {(a[i], m[i], b[i])}", names[i])
    x, y, z = arrays
    bad = np.flatnonzero((x < 0) | (x > y) | (y > z))
    if bad.size:
        i = int(bad[0])
        raise PlanError(f"{what} {names[i]}: estimates must satisfy 0 \u2264 optimistic {x[i]:g} \u2264 most likely "
                        f"{y[i]:g} \u2264 pessimistic {z[i]:g}", names[i])
    return arrays


class DurationModel:
    """Quantile functions of a list of three-point estimates, each with its own family."""

    def __init__(self, families, a, m, b, names=None, what="activity"):
        n = len(families)
        names = list(names) if names is not None else [str(i) for i in range(n)]
        self.a, self.m, self.b = _check_rows(list(families), a, m, b, names, what)
        self.names = names
        self.te = (self.a + 4.0 * self.m + self.b) / 6.0
        fam = np.array(families, dtype=object)
        self.family = np.where(self.b - self.a <= 0.0, "fixed", fam).astype(object) if n else fam
        self.uncertain = np.flatnonzero(self.family != "fixed")
        self.fixed = np.flatnonzero(self.family == "fixed")
        fam_u = self.family[self.uncertain]
        self.groups = {f: np.flatnonzero(fam_u == f) for f in DISTRIBUTIONS[:-1] if np.any(fam_u == f)}
        self._prepare()

    @classmethod
    def for_plan(cls, plan, distribution: str | None = None) -> "DurationModel":
        """Per activity: its own distribution, else ``distribution``, else the plan default."""
        default = check_family(distribution or plan.settings.distribution, "distribution", "settings")
        fams, a, m, b, names = [], [], [], [], []
        for act in plan.activities:
            fams.append(act.distribution or default)
            if act.has_estimate:
                a.append(act.optimistic), m.append(act.most_likely), b.append(act.pessimistic)
            else:
                d = float(act.duration or 0.0)
                a.append(d), m.append(d), b.append(d)
            names.append(act.id)
        return cls(fams, a, m, b, names)

    def _prepare(self) -> None:
        u = self.uncertain
        self.lo, self.span = self.a[u], self.b[u] - self.a[u]
        self.shape = (self.m[u] - self.a[u]) / np.where(self.span > 0, self.span, 1.0)
        if "beta-pert" in self.groups:
            rows = self.groups["beta-pert"]
            self.table = beta_pert_table()
            base, weight = self.table.rows(self.shape[rows])
            self._beta = (rows, base[:, None], weight[:, None], self.shape[rows])
        if "normal" in self.groups:
            rows = self.groups["normal"]
            mu, sd = self.te[u][rows], self.span[rows] / 6.0
            from scipy import special  # only the normal family needs it (keeps start-up quick)

            self._normal = (rows, mu[:, None], sd[:, None], special.ndtr(-mu / sd)[:, None])

    @property
    def size(self) -> int:
        return self.a.size

    def sample(self, scores: np.ndarray) -> np.ndarray:
        """Durations (n, k) for scores (n_uncertain, k) in [0, 1); fixed rows get te."""
        if self.uncertain.size == self.size:
            return self.quantiles(scores)
        k = scores.shape[1]
        out = np.empty((self.size, k))
        if self.fixed.size:
            out[self.fixed] = self.te[self.fixed, None]
        if self.uncertain.size:
            out[self.uncertain] = self.quantiles(scores)
        return out

    def quantiles(self, u: np.ndarray) -> np.ndarray:
        """The uncertain rows' durations for their scores u (n_uncertain, k)."""
        if len(self.groups) == 1 and "beta-pert" in self.groups:
            _, base, weight, shape = self._beta
            x = self.table.quantile_rows(base, weight, shape, u)
        else:
            x = np.empty_like(u)
            for family, rows in self.groups.items():
                x[rows] = self._standard(family, rows, u[rows])
        if "normal" in self.groups:   # already in plan units
            rows = self.groups["normal"]
            held = x[rows]
            x *= self.span[:, None]
            x += self.lo[:, None]
            x[rows] = held
            return x
        x *= self.span[:, None]
        x += self.lo[:, None]
        return x

    def _standard(self, family: str, rows: np.ndarray, u: np.ndarray) -> np.ndarray:
        """Quantiles on [0, 1] (normal: in plan units)."""
        if family == "beta-pert":
            _, base, weight, shape = self._beta
            return self.table.quantile_rows(base, weight, shape, u)
        if family == "uniform":
            return u
        if family == "triangular":
            c = self.shape[rows][:, None]
            return np.where(u < c, np.sqrt(u * c), 1.0 - np.sqrt((1.0 - u) * (1.0 - c)))
        from scipy import special

        _, mu, sd, p0 = self._normal
        return np.maximum(mu + sd * special.ndtri(p0 + u * (1.0 - p0)), 0.0)

    def moments(self) -> tuple[np.ndarray, np.ndarray]:
        """Exact mean and variance of each row's distribution (for checks and reports)."""
        mean, var = self.te.copy(), np.zeros(self.size)
        a, m, b = self.a, self.m, self.b
        for i in self.uncertain:
            mean[i], var[i] = _moments(self.family[i], a[i], m[i], b[i])
        return mean, var


def _moments(family: str, a: float, m: float, b: float) -> tuple[float, float]:
    span = b - a
    if family == "beta-pert":
        alpha, beta = 1 + 4 * (m - a) / span, 1 + 4 * (b - m) / span
        return (a + 4 * m + b) / 6, span * span * alpha * beta / 252.0
    if family == "triangular":
        return (a + m + b) / 3, (a * a + b * b + m * m - a * b - a * m - b * m) / 18.0
    if family == "uniform":
        return (a + b) / 2, span * span / 12.0
    mu, sd = (a + 4 * m + b) / 6, span / 6
    from scipy import stats  # slow to import: only for the normal family's exact moments

    dist = stats.truncnorm(-mu / sd, np.inf, loc=mu, scale=sd)
    return float(dist.mean()), float(dist.var())
