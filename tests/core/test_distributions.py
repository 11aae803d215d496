"""Duration distributions of the simulation against scipy.stats and published moments."""

import numpy as np
import pytest
from scipy import stats

from workbench.core.distributions import DurationModel
from workbench.core.errors import PlanError
from workbench.core.quantile_table import beta_pert_table, exact_quantile

# Stratified probabilities: the midpoints of N equal cells, so a sample mean over them is a
# quadrature of the quantile function (error far below Monte Carlo noise).
N = 400_000
MID = ((np.arange(N) + 0.5) / N)[None, :]


def model(family, a, m, b):
    return DurationModel([family], [a], [m], [b], ["X"])


def test_beta_pert_moments_match_scipy_r5():
    # R5 (common practice; scipy.stats.beta): (6, 9, 18) → α = 2, β = 4, mean 10, variance 4.5714.
    mean, var = model("beta-pert", 6, 9, 18).moments()
    ref = stats.beta(2, 4, loc=6, scale=12)
    assert mean[0] == pytest.approx(10.0) and mean[0] == pytest.approx(ref.mean())
    assert var[0] == pytest.approx(ref.var()) and var[0] == pytest.approx(4.5714, abs=1e-4)
    assert var[0] != pytest.approx(((18 - 6) / 6) ** 2, abs=0.1)  # not the PERT ((b − a)/6)² = 4


@pytest.mark.parametrize("abm", [(6, 9, 18), (0, 0, 10), (3, 10, 10), (1, 2, 3), (2, 3.5, 8), (0.5, 0.7, 40)])
def test_table_sampler_moments_match_scipy_beta(abm):
    # scipy.stats.beta moments of beta-PERT (α = 1 + 4(m − a)/(b − a), β = 1 + 4(b − m)/(b − a)).
    a, m, b = abm
    d = model("beta-pert", a, m, b).sample(MID.copy())[0]
    ref = stats.beta(1 + 4 * (m - a) / (b - a), 1 + 4 * (b - m) / (b - a), loc=a, scale=b - a)
    assert d.mean() == pytest.approx(ref.mean(), abs=1e-4 * (b - a))
    assert d.var() == pytest.approx(ref.var(), rel=1e-3)


def test_table_accuracy_against_scipy_beta_ppf():
    # scipy.stats.beta.ppf on shapes between and on the table's grid; documented bound 5e-4 (b − a).
    table = beta_pert_table()
    shapes = np.array([0.0, 0.013, 0.25, 1 / 3, 0.5, 0.61, 0.9871, 1.0])
    u = np.concatenate([np.linspace(0, 1, 4001)[:-1], np.geomspace(1e-12, 1e-3, 60), 1 - np.geomspace(1e-12, 1e-3, 60)])
    got = table.quantile(shapes, np.tile(u, (shapes.size, 1)))
    want = stats.beta.ppf(u[None, :], 1 + 4 * shapes[:, None], 5 - 4 * shapes[:, None])
    assert np.abs(got - want).max() < 5e-4
    assert table.max_error(shapes=np.linspace(0, 1, 21)) < 5e-4
    assert np.allclose(exact_quantile(shapes[:, None], u[None, :200]), want[:, :200], atol=1e-12)


def test_sampler_is_monotone_in_the_score():
    d = model("beta-pert", 2, 3.5, 8).sample(MID[:, ::97].copy())[0]
    assert np.all(np.diff(d) >= 0) and d.min() >= 2 and d.max() <= 8


def test_triangular_moments_r5_and_quantile_vs_scipy():
    # R5 (Johnson, Kotz & Balakrishnan): triangular (6, 9, 18) has mean 11, variance 6.5.
    mdl = model("triangular", 6, 9, 18)
    mean, var = mdl.moments()
    assert (mean[0], var[0]) == (pytest.approx(11.0), pytest.approx(6.5))
    d = mdl.sample(MID.copy())[0]
    assert d.mean() == pytest.approx(11.0, abs=1e-4) and d.var() == pytest.approx(6.5, rel=1e-4)
    u = np.linspace(0.001, 0.999, 999)
    assert np.allclose(mdl.sample(u[None, :].copy())[0], stats.triang.ppf(u, 0.25, loc=6, scale=12), atol=1e-9)


def test_uniform_and_truncated_normal_against_scipy():
    u = np.linspace(0.001, 0.999, 999)[None, :]
    assert np.allclose(model("uniform", 2, 5, 10).sample(u.copy())[0], stats.uniform.ppf(u[0], 2, 8))
    # normal: mean te = 3, sd (b − a)/6 = 1.5, truncated at zero (scipy.stats.truncnorm).
    got = model("normal", 0, 2.25, 9).sample(u.copy())[0]
    want = stats.truncnorm.ppf(u[0], -3 / 1.5, np.inf, loc=3, scale=1.5)
    assert np.allclose(got, want, atol=1e-9)
    mean, var = model("normal", 0, 2.25, 9).moments()
    assert mean[0] == pytest.approx(stats.truncnorm.mean(-2, np.inf, loc=3, scale=1.5))


def test_degenerate_and_fixed_rows_give_te():
    mdl = DurationModel(["beta-pert", "fixed", "triangular"], [4, 1, 2], [4, 2, 3], [4, 9, 4], ["A", "B", "C"])
    assert mdl.uncertain.tolist() == [2]
    d = mdl.sample(np.array([[0.3, 0.9]]))
    assert d[0].tolist() == [4, 4] and d[1].tolist() == [pytest.approx(3.0)] * 2


@pytest.mark.parametrize("family,a,m,b,text", [
    ("gamma", 1, 2, 3, "unknown distribution"),
    ("beta-pert", 5, 3, 4, "estimates must satisfy"),
    ("triangular", -1, 0, 1, "estimates must satisfy"),
    ("uniform", 1, float("nan"), 3, "finite numbers"),
])
def test_bad_parameters_name_the_activity(family, a, m, b, text):
    with pytest.raises(PlanError, match=text) as err:
        DurationModel([family], [a], [m], [b], ["Pour slab"])
    assert err.value.culprit == "Pour slab" and "Pour slab" in str(err.value)
