"""The standard normal distribution for scalars, from the standard library.

PERT odds need only Φ and Φ⁻¹ of single numbers; ``scipy.special`` would cost a third of a
second at every start of the command line for two scalar calls.
"""

from __future__ import annotations

import math
from statistics import NormalDist

_STANDARD = NormalDist()


def ndtr(z: float) -> float:
    """Φ(z), the standard normal CDF (accurate in both tails: erfc, not 1 − erf)."""
    return 0.5 * math.erfc(-float(z) / math.sqrt(2.0))


def ndtri(p: float) -> float:
    """Φ⁻¹(p); −inf at 0, +inf at 1, NaN outside [0, 1]."""
    p = float(p)
    if 0.0 < p < 1.0:
        return _STANDARD.inv_cdf(p)
    if p == 0.0:
        return -math.inf
    if p == 1.0:
        return math.inf
    return math.nan
