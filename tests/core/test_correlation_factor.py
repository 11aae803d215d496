"""A correlation group sharing no activity uses one common factor (O(n)) with the same
correlation structure as the dense matrix; overlapping groups keep the dense repair
(issue 20, item 15)."""

from __future__ import annotations

import datetime as dt

import numpy as np
import pytest
from hypothesis import given, strategies as st
from scipy.stats import spearmanr

from workbench.core.correlation import CorrelationModel, normal_from_rank
from workbench.core.model import Activity, CorrelationGroup, Plan, Settings
from workbench.core.montecarlo import simulate


def _model(groups, n):
    ids = [f"W{i}" for i in range(n)]
    return CorrelationModel(groups, ids, np.arange(n)), ids


@given(k=st.integers(2, 40), rho=st.floats(-0.99, 0.99))
def test_the_factor_weights_give_exactly_the_asked_matrix(k, rho):
    model, ids = _model([CorrelationGroup("g", tuple(f"W{i}" for i in range(k)), rho)], k)
    r = float(normal_from_rank(rho))
    if r < -1.0 / (k - 1):                      # impossible for k activities: dense repair
        assert model.repaired and not model.factors
        return
    if r == 0.0:                                # nothing to mix
        assert not model.active
        return
    (idx, own, common), = model.factors
    weights = own * np.eye(k) + common * np.ones((k, k))
    wanted = (1 - r) * np.eye(k) + r * np.ones((k, k))
    assert np.allclose(weights @ weights.T, wanted, atol=1e-9)
    assert model.mixer is None                  # no dense matrix at all


def test_sampled_rank_correlations_match_the_dense_model():
    """The same group sampled through the factor and through a dense matrix (forced by a
    second, overlapping group with the same coefficient on the same activities)."""
    names = tuple(f"W{i}" for i in range(5))
    factor, _ = _model([CorrelationGroup("g", names, 0.6)], 5)
    dense, _ = _model([CorrelationGroup("g", names, 0.6), CorrelationGroup("h", names, 0.6)], 5)
    assert factor.factors and dense.mixer is not None
    rng = np.random.default_rng(3)
    normals = rng.standard_normal((5, 40_000))
    for model in (factor, dense):
        scores = np.empty((5, 40_000))
        model.apply(scores, normals)
        rho = spearmanr(scores.T).statistic
        off = rho[~np.eye(5, dtype=bool)]
        assert off == pytest.approx(np.full(off.size, 0.6), abs=0.02)


def test_a_negative_pair_and_an_independent_activity():
    model, _ = _model([CorrelationGroup("pair", ("W0", "W1"), -0.7)], 3)
    normals = np.random.default_rng(5).standard_normal((2, 40_000))
    scores = np.full((3, 40_000), 0.5)
    model.apply(scores, normals)
    assert spearmanr(scores[0], scores[1]).statistic == pytest.approx(-0.7, abs=0.02)
    assert np.all(scores[2] == 0.5)             # not in any group: left as drawn


def test_twenty_thousand_activities_in_one_group_simulate_without_a_dense_matrix():
    n = 20_000
    acts = [Activity(f"W{i}", optimistic=1, most_likely=2, pessimistic=5) for i in range(n)]
    plan = Plan(Settings(title="wide", start=dt.date(2027, 3, 1)), acts, [],
                [], [CorrelationGroup("weather", tuple(a.id for a in acts), 0.5)])
    result = simulate(plan, iterations=200, seed=4, keep_durations=True)
    assert result.iterations == 200 and not result.correlation_repaired
    rho = spearmanr(result.durations[:50].T).statistic
    assert np.mean(rho[~np.eye(50, dtype=bool)]) == pytest.approx(0.5, abs=0.06)
