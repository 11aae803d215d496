"""Rank correlation between activity durations through a Gaussian copula.

Method: each correlation group asks for a Spearman rank correlation ρ between every pair
of its activities. Scores are drawn as independent standard normals; the pair's normal
correlation is r = 2·sin(πρ/6), the inverse of Spearman's ρ = (6/π)·arcsin(r/2) for a
bivariate normal (Pearson 1907; Kruskal 1958). The normal scores are mixed by a square
root of the matrix R (z' = L z with L Lᵀ = R) and mapped to uniform scores u = Φ(z'), so
each duration keeps its own distribution and the ranks carry the correlation.

A group that shares no activity with another asks for the same correlation between all
its pairs, R = (1 − r)·I + r·11ᵀ. Its symmetric square root is √(1 − r)·I + c·11ᵀ with
c = (√(1 + (k − 1)·r) − √(1 − r)) / k for k activities, so z' = √(1 − r)·z + c·Σz: one
common factor, O(k) per iteration instead of a dense k × k matrix. Only activities in
overlapping groups go through the dense matrix below.

A pair named by several groups takes the coefficient of the last of them. Overlapping
groups can ask for an impossible matrix (not positive semi-definite); it is then replaced
by the nearest correlation matrix in the Frobenius norm (Higham 2002, alternating
projections with Dykstra's correction) and the result says it was repaired and by how much.
"""

from __future__ import annotations

import math

import numpy as np
from scipy import special

from .errors import PlanError

PSD_TOL = 1e-10


def nearest_correlation(a: np.ndarray, tol: float = 1e-10, max_iter: int = 500) -> np.ndarray:
    """The nearest correlation matrix to symmetric ``a`` (Higham 2002, Algorithm 3.3)."""
    y = np.array(a, dtype=float)
    ds = np.zeros_like(y)
    for _ in range(max_iter):
        r = y - ds
        vals, vecs = np.linalg.eigh((r + r.T) / 2.0)
        x = (vecs * np.maximum(vals, 0.0)) @ vecs.T
        ds = x - r
        y_new = x.copy()
        np.fill_diagonal(y_new, 1.0)
        change = np.linalg.norm(y_new - y) / max(np.linalg.norm(y), 1e-300)
        y = y_new
        if change < tol:
            break
    return (y + y.T) / 2.0


def normal_from_rank(rho) -> np.ndarray:
    """Normal correlation giving Spearman correlation ``rho``: 2·sin(πρ/6)."""
    return 2.0 * np.sin(np.pi * np.asarray(rho, dtype=float) / 6.0)


class CorrelationModel:
    """Mixes the normal scores of correlated activities; rows index the uncertain activities.

    ``rows`` are every correlated row in order (one normal score each); groups that share
    no activity with another use a common factor, the rest one dense matrix."""

    def __init__(self, groups, ids: list[str], uncertain: np.ndarray):
        index = {a: i for i, a in enumerate(ids)}
        row_of = {int(act): r for r, act in enumerate(uncertain)}
        pairs = []
        for g in groups:
            coefficient = _check_group(g, index)
            rows = sorted({row_of[index[a]] for a in g.activities if index[a] in row_of})
            pairs.append((rows, float(normal_from_rank(coefficient))))
        self.rows = np.array(sorted({r for rows, _ in pairs for r in rows}), dtype=np.int64)
        self.repaired, self.repair_change = False, 0.0
        self.mixer, self.factors, self.dense = None, [], np.zeros(0, dtype=np.int64)
        pos = {int(r): i for i, r in enumerate(self.rows)}
        alone, shared = _split(pairs)
        self.factors = [_factor(np.array([pos[x] for x in rows], dtype=np.int64), r) for rows, r in alone
                        if len(rows) >= 2 and r != 0.0]
        if shared:
            self._build(shared, pos)

    def _build(self, pairs, pos) -> None:
        dense_rows = sorted({x for rows, _ in pairs for x in rows})
        local = {x: i for i, x in enumerate(dense_rows)}
        k = len(dense_rows)
        wanted = np.eye(k)
        for rows, r in pairs:
            idx = np.array([local[x] for x in rows], dtype=np.int64)
            wanted[np.ix_(idx, idx)] = r
        np.fill_diagonal(wanted, 1.0)
        matrix = wanted
        if np.linalg.eigvalsh(wanted).min() < -PSD_TOL:
            matrix = nearest_correlation(wanted)
            self.repaired = True
            self.repair_change = float(np.abs(matrix - wanted).max())
        self.matrix = matrix
        if np.allclose(matrix, np.eye(k)):
            return
        vals, vecs = np.linalg.eigh(matrix)
        root = vecs * np.sqrt(np.maximum(vals, 0.0))
        root /= np.sqrt((root * root).sum(axis=1))[:, None]   # unit diagonal exactly
        self.mixer = root
        self.dense = np.array([pos[x] for x in dense_rows], dtype=np.int64)

    @property
    def active(self) -> bool:
        return self.mixer is not None or bool(self.factors)

    def apply(self, scores: np.ndarray, normals: np.ndarray) -> None:
        """Overwrite the correlated rows of uniform ``scores`` from independent ``normals``
        (one row of normals per entry of ``rows``)."""
        mixed = normals.copy()
        for idx, own, common in self.factors:
            mixed[idx] = own * normals[idx] + common * normals[idx].sum(axis=0)
        if self.mixer is not None:
            mixed[self.dense] = self.mixer @ normals[self.dense]
        scores[self.rows] = special.ndtr(mixed)

    def note(self) -> str:
        if not self.repaired:
            return ""
        return (f"the correlation groups asked for an impossible combination; the nearest valid "
                f"matrix was used (largest change {self.repair_change:.3f} in normal-score correlation)")


def _split(pairs):
    """Groups sharing no row with another group and asking for a possible correlation
    (alone), and all the others (shared)."""
    seen: dict[int, int] = {}
    for rows, _ in pairs:
        for x in rows:
            seen[x] = seen.get(x, 0) + 1
    alone, shared = [], []
    for rows, r in pairs:
        possible = len(rows) < 2 or r >= -1.0 / (len(rows) - 1)     # else the dense repair says so
        (alone if possible and all(seen[x] == 1 for x in rows) else shared).append((rows, r))
    return alone, shared


def _factor(idx: np.ndarray, r: float):
    """(rows, own weight, common weight) of the symmetric root of an equicorrelation matrix
    (r ≥ −1/(k − 1), checked by :func:`_split`)."""
    k = idx.size
    own = math.sqrt(1.0 - r)
    common = (math.sqrt(max(1.0 + (k - 1) * r, 0.0)) - own) / k
    return idx, own, common


def _check_group(group, index: dict) -> float:
    name = getattr(group, "name", "") or "(unnamed)"
    coefficient = group.coefficient
    if isinstance(coefficient, bool) or not isinstance(coefficient, (int, float)) or not math.isfinite(coefficient):
        raise PlanError(f"correlation group {name}: coefficient must be a number, not {coefficient!r}", name)
    if not -1.0 <= coefficient <= 1.0:
        raise PlanError(f"correlation group {name}: coefficient {coefficient:g} lies outside [-1, 1]", name)
    for act in group.activities:
        if act not in index:
            raise PlanError(f"correlation group {name}: unknown activity {act!r}", name)
    return float(coefficient)
