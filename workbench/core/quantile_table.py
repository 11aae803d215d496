"""A fast beta-PERT quantile function: a table over (shape, probability), interpolated.

Beta-PERT on [a, b] with mode m has α = 1 + 4s, β = 5 − 4s where s = (m − a)/(b − a) is
the *shape*. The table holds the standard beta quantile x(s, u) on a grid of
``SHAPES`` shapes (0 … 1) by ``CELLS + 1`` probabilities (0, 1/CELLS, … 1), computed once
with ``scipy.special.betaincinv``. A draw is interpolated linearly in u and in s. Near
u = 0 and u = 1 the quantile behaves like a power u^(1/α) and linear interpolation is
poor, so in the outer ``TAIL_CELLS`` cells at either end (0.4 % of draws) the position
within the cell is taken on that power scale instead. Accuracy is measured by
``max_error`` (units of b − a) and documented in docs/simulation.md.
"""

from __future__ import annotations

import functools

import numpy as np

SHAPES = 65
CELLS = 4096
TAIL_CELLS = 8


def pert_shape_parameters(shape) -> tuple[np.ndarray, np.ndarray]:
    """Beta parameters α = 1 + 4s, β = 5 − 4s of beta-PERT with shape s = (m − a)/(b − a)."""
    s = np.asarray(shape, dtype=float)
    return 1.0 + 4.0 * s, 5.0 - 4.0 * s


def exact_quantile(shape, u) -> np.ndarray:
    """The standard beta-PERT quantile on [0, 1], computed exactly (slow; for tails and tests).

    The upper half uses the mirrored distribution so precision near u = 1 is kept.
    """
    from scipy import special  # only when the table is computed (the cache usually has it)

    alpha, beta = pert_shape_parameters(shape)
    alpha, beta, u = np.broadcast_arrays(alpha, beta, np.asarray(u, dtype=float))
    out = special.betaincinv(alpha, beta, u)
    upper = u > 0.5
    if np.any(upper):
        out = np.array(out, dtype=float)
        out[upper] = 1.0 - special.betaincinv(beta[upper], alpha[upper], 1.0 - u[upper])
    return out


def _cache_file(shapes: int, cells: int):
    import os
    import scipy
    from pathlib import Path

    folder = os.environ.get("SLACKLINE_CACHE_DIR")
    if not folder:
        from platformdirs import user_cache_dir
        folder = user_cache_dir("Slackline", appauthor=False)
    return Path(folder) / f"beta-pert-quantiles-{shapes}x{cells}-scipy-{scipy.__version__}.npy"


def _cached(shapes: int, cells: int, compute) -> np.ndarray:
    """The table's exact values, from the user's cache folder when a previous run saved them.

    Building them takes about half a second; a damaged or foreign cache file is ignored.
    """
    import os

    path = _cache_file(shapes, cells)
    try:
        values = np.load(path, allow_pickle=False)
        if values.shape == (shapes, cells + 1) and np.isfinite(values).all():
            return values
    except (OSError, ValueError):
        pass
    values = compute()
    try:
        path.parent.mkdir(parents=True, exist_ok=True)
        import tempfile  # an exclusive, unpredictable name: no planted link is followed
        fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=path.parent)
        try:
            with os.fdopen(fd, "wb") as fh:
                np.save(fh, values, allow_pickle=False)
            os.replace(tmp, path)
        except OSError:
            os.unlink(tmp)
            raise
    except OSError:
        pass  # a read-only home folder only costs the half second next time
    return values


class QuantileTable:
    """Interpolated beta-PERT quantiles x(s, u) ∈ [0, 1]; build once with :func:`beta_pert_table`."""

    def __init__(self, shapes: int = SHAPES, cells: int = CELLS, tail_cells: int = TAIL_CELLS):
        self.shapes, self.cells, self.tail_cells = shapes, cells, tail_cells
        s = np.linspace(0.0, 1.0, shapes)[:, None]
        u = (np.arange(cells + 1) / cells)[None, :]
        values = _cached(shapes, cells, lambda: exact_quantile(s, u))
        step = np.zeros_like(values)          # difference to the next shape row
        step[:-1] = values[1:] - values[:-1]
        # Each cell stores its start and width as one complex number (x_k + i·(x_k+1 − x_k)),
        # single precision, so one gather fetches both; the row at shape s is cells + w·steps.
        self.pairs = self._cells(values)
        self.step_pairs = self._cells(step)
        self.tail_limit = 0.5 - tail_cells / cells

    @staticmethod
    def _cells(values: np.ndarray) -> np.ndarray:
        return (values[:, :-1] + 1j * np.diff(values, axis=1)).astype(np.complex64).ravel()

    def rows(self, shape) -> tuple[np.ndarray, np.ndarray]:
        """Per shape: offset of its lower table row in the flat table and the weight of the next."""
        q = np.clip(np.asarray(shape, dtype=float), 0.0, 1.0) * (self.shapes - 1)
        r = np.minimum(q.astype(np.int64), self.shapes - 2)
        return r * self.cells, (q - r).astype(np.float32)

    def quantile(self, shape, u: np.ndarray) -> np.ndarray:
        """x(s, u) for shapes (k,) and probabilities u (k, m) in [0, 1); returns (k, m)."""
        shape = np.asarray(shape, dtype=float)
        base, weight = self.rows(shape)
        return self.quantile_rows(base[:, None], weight[:, None], shape, u)

    def quantile_rows(self, base: np.ndarray, weight: np.ndarray, shape: np.ndarray, u: np.ndarray) -> np.ndarray:
        """As :meth:`quantile` with the rows already looked up (``base``, ``weight``: (k, 1))."""
        t = u * self.cells
        k = t.astype(np.intp)
        np.minimum(k, self.cells - 1, out=k)
        t -= k                                   # fraction within the cell
        tails = self._tail_cells(k)
        k += base
        cell = self.step_pairs.take(k)
        cell *= weight
        cell += self.pairs.take(k)               # start (real) and width (imag) of the cell
        x = np.multiply(cell.imag, t, out=t)
        x += cell.real
        tail = self._tail_fractions(shape, u, tails)
        if tail is not None:
            cells, frac = tail
            x.ravel()[cells] = cell.real.ravel()[cells] + frac * cell.imag.ravel()[cells]
        return x

    def _tail_cells(self, k: np.ndarray) -> np.ndarray:
        """Flat positions of the draws in the outer ``tail_cells`` cells at either end (cell
        index k < tail_cells or k ≥ cells − tail_cells, the same as |u − ½| ≥ tail_limit)."""
        inner = k - self.tail_cells
        return np.flatnonzero(inner.view(np.uintp).ravel() >= self.cells - 2 * self.tail_cells)

    def _tail_fractions(self, shape: np.ndarray, u: np.ndarray, cells: np.ndarray | None = None):
        """In the outer cells, the position within the cell on a power scale.

        There x(u) ≈ c·u^(1/α) (lower end) or 1 − c·(1 − u)^(1/β) (upper end), so x is
        nearly linear in y = u^(1/α) (or (1 − u)^(1/β)): interpolate in y instead of u.
        """
        flat = u.ravel()
        if cells is None:
            cells = np.flatnonzero(np.abs(flat - 0.5) >= self.tail_limit)
        if not cells.size:
            return None
        alpha, beta = pert_shape_parameters(shape[cells // u.shape[1]])
        uc = flat[cells]
        k = np.minimum(np.floor(uc * self.cells), self.cells - 1)
        low = uc < 0.5
        p = np.where(low, 1.0 / alpha, 1.0 / beta)
        v, v0, v1 = (np.where(low, q, 1.0 - q) for q in (uc, k / self.cells, (k + 1) / self.cells))
        y, y0, y1 = v ** p, v0 ** p, v1 ** p
        return cells, (y - y0) / (y1 - y0)

    def max_error(self, shapes=None, probabilities=None) -> float:
        """Largest |table − exact| over a grid of shapes and probabilities (units of b − a)."""
        s = np.linspace(0.0, 1.0, 161) if shapes is None else np.asarray(shapes, dtype=float)
        if probabilities is None:
            probabilities = np.concatenate([np.linspace(0.0, 1.0, 8001)[:-1],
                                            np.geomspace(1e-12, 1e-2, 200), 1.0 - np.geomspace(1e-12, 1e-2, 200)])
        u = np.broadcast_to(np.asarray(probabilities, dtype=float), (s.size, np.size(probabilities)))
        return float(np.abs(self.quantile(s, u.copy()) - exact_quantile(s[:, None], u)).max())


@functools.lru_cache(maxsize=1)
def beta_pert_table() -> QuantileTable:
    """The shared table, built on first use (about half a second) and kept for the process."""
    return QuantileTable()
