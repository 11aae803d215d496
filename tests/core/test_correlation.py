"""Rank correlation through the Gaussian copula, and repair of impossible matrices."""

import datetime as dt

import numpy as np
import pytest
from scipy import stats

from workbench.core import Activity, CorrelationGroup, Link, Plan, Settings
from workbench.core.correlation import CorrelationModel, nearest_correlation, normal_from_rank
from workbench.core.errors import PlanError
from workbench.core.montecarlo import simulate

MONDAY = dt.date(2027, 1, 4)


def plan_with(groups, n=4):
    acts = [Activity(f"W{i}", optimistic=2, most_likely=4 + i, pessimistic=12) for i in range(n)]
    links = [Link(f"W{i}", f"W{i + 1}") for i in range(n - 1)]
    return Plan(Settings(title="corr", start=MONDAY), acts, links, correlations=groups)


def spearman(durations, i, j):
    return stats.spearmanr(durations[i], durations[j]).statistic


def test_rank_to_normal_map_inverts_the_bivariate_normal_spearman():
    # Spearman of a bivariate normal with correlation r is (6/π)·arcsin(r/2) (Pearson 1907; Kruskal 1958) [memory].
    for rho in (-0.9, -0.3, 0.0, 0.5, 0.8, 1.0):
        r = normal_from_rank(rho)
        assert 6 / np.pi * np.arcsin(r / 2) == pytest.approx(rho)


@pytest.mark.parametrize("rho", [0.6, -0.5, 0.9])
def test_achieved_spearman_is_near_the_requested_one(rho):
    plan = plan_with([CorrelationGroup("site", ("W0", "W1", "W2") if rho > 0 else ("W0", "W1"), rho)])
    res = simulate(plan, 20_000, seed=11, keep_durations=True)
    # sd of a sample Spearman near ρ is below 1/√N ≈ 0.007: allow 0.03
    assert spearman(res.durations, 0, 1) == pytest.approx(rho, abs=0.03)
    assert spearman(res.durations, 1, 3) == pytest.approx(0.0, abs=0.03)
    if rho > 0:
        assert spearman(res.durations, 0, 2) == pytest.approx(rho, abs=0.03)
    assert not res.correlation_repaired


def test_correlation_keeps_each_marginal_distribution():
    plan = plan_with([CorrelationGroup("site", ("W0", "W1"), 0.7)])
    res = simulate(plan, 20_000, seed=5, keep_durations=True)
    # beta-PERT (2, 4, 12): α = 1.8, β = 4.2 (scipy.stats.beta); Kolmogorov–Smirnov against it.
    ref = stats.beta(1.8, 4.2, loc=2, scale=10)
    assert stats.kstest(res.durations[0], ref.cdf).pvalue > 0.001


def test_overlapping_groups_that_cannot_hold_are_repaired_and_reported():
    groups = [CorrelationGroup("a", ("W0", "W1"), 0.95), CorrelationGroup("b", ("W1", "W2"), 0.95),
              CorrelationGroup("c", ("W0", "W2"), -0.95)]
    plan = plan_with(groups)
    model = CorrelationModel(groups, plan.ids(), np.arange(4))
    assert model.repaired and model.repair_change > 0.1 and "nearest valid" in model.note()
    assert np.linalg.eigvalsh(model.matrix).min() > -1e-9
    assert np.allclose(np.diag(model.matrix), 1.0)
    res = simulate(plan, 2000, seed=1)
    assert res.correlation_repaired and "correlation_note" in res.to_dict()


def test_nearest_correlation_matches_higham_example():
    # Higham 2002, IMA J. Numer. Anal. 22: nearest correlation matrix to [[1,1,0],[1,1,1],[0,1,1]]
    # has off-diagonals 0.7607 and 0.1573 [memory]. Also checked: PSD, unit diagonal, and no
    # farther than eigenvalue clipping plus rescaling (a valid correlation matrix).
    a = np.array([[1.0, 1.0, 0.0], [1.0, 1.0, 1.0], [0.0, 1.0, 1.0]])
    x = nearest_correlation(a)
    assert x[0, 1] == pytest.approx(0.7607, abs=2e-4) and x[0, 2] == pytest.approx(0.1573, abs=2e-4)
    vals, vecs = np.linalg.eigh(a)
    clipped = (vecs * np.maximum(vals, 0)) @ vecs.T
    clipped /= np.sqrt(np.outer(np.diag(clipped), np.diag(clipped)))
    assert np.linalg.norm(x - a) <= np.linalg.norm(clipped - a) + 1e-9


def test_fixed_activities_in_a_group_are_ignored():
    acts = [Activity("F", duration=3), Activity("V", optimistic=1, most_likely=2, pessimistic=6)]
    plan = Plan(Settings(start=MONDAY), acts, [], correlations=[CorrelationGroup("g", ("F", "V"), 0.8)])
    res = simulate(plan, 500, seed=2, keep_durations=True)
    assert np.all(res.durations[0] == 3)


@pytest.mark.parametrize("group,text", [
    (CorrelationGroup("weather", ("W0", "W1"), 1.5), "outside"),
    (CorrelationGroup("weather", ("W0", "ZZ"), 0.5), "unknown activity 'ZZ'"),
    (CorrelationGroup("weather", ("W0", "W1"), float("nan")), "must be a number"),
])
def test_bad_groups_name_the_group(group, text):
    with pytest.raises(PlanError, match=text) as err:
        simulate(plan_with([group]), 100, seed=1)
    assert err.value.culprit == "weather"
