"""The beta-PERT quantile table is saved once and read back; a damaged cache is rebuilt."""

import numpy as np

from workbench.core import quantile_table as qt


def test_cache_written_then_reused_and_damage_ignored(tmp_path, monkeypatch):
    monkeypatch.setenv("SLACKLINE_CACHE_DIR", str(tmp_path))
    calls = []

    def compute():
        calls.append(1)
        s = np.linspace(0.0, 1.0, 5)[:, None]
        u = (np.arange(9) / 8)[None, :]
        return qt.exact_quantile(s, u)

    first = qt._cached(5, 8, compute)
    path = qt._cache_file(5, 8)
    assert path.exists() and len(calls) == 1
    second = qt._cached(5, 8, compute)
    assert len(calls) == 1 and np.array_equal(first, second)
    path.write_bytes(b"not an array")
    third = qt._cached(5, 8, compute)
    assert len(calls) == 2 and np.array_equal(first, third)
