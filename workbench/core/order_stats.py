"""Ranks and binomial quantiles for the simulation summary, without ``scipy.stats``.

Importing ``scipy.stats`` costs most of a second at every start of the command line; the
two functions needed from it are small. Both give the same numbers as
``scipy.stats.rankdata`` (method "average") and ``scipy.stats.binom.ppf``.
"""

from __future__ import annotations

import numpy as np


def average_ranks(values) -> np.ndarray:
    """Ranks 1..n of ``values``, ties sharing the mean of the ranks they span."""
    a = np.ravel(np.asarray(values))
    sorter = np.argsort(a, kind="mergesort")
    inverse = np.empty(sorter.size, dtype=np.intp)
    inverse[sorter] = np.arange(sorter.size, dtype=np.intp)
    a = a[sorter]
    new = np.r_[True, a[1:] != a[:-1]]
    dense = new.cumsum()[inverse]
    bounds = np.r_[np.flatnonzero(new), new.size]
    return 0.5 * (bounds[dense] + bounds[dense - 1] + 1)


def binomial_quantile(q: float, n: int, p: float) -> float:
    """The smallest k with P(X ≤ k) ≥ q for X ~ binomial(n, p), for 0 < q < 1."""
    from scipy import special  # the CDF and its inverse (much lighter than scipy.stats)

    k = np.ceil(special.bdtrik(q, n, p))
    below = max(k - 1.0, 0.0)
    return float(below if special.bdtr(below, n, p) >= q else k)
