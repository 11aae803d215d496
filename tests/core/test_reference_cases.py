"""The engine against published check values (see /work/shared/reference-cases.md).

Each check names its source beside it. R1's three-point estimates are recalled, not read
in the book ([memory]); its published totals (mean, variance, path, floats) are checked.
"""

import datetime as dt
import math

import numpy as np
import pytest
from scipy.stats import norm

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.core.pert import PertOdds

MONDAY = dt.date(2027, 1, 4)

# R1 — Hillier & Lieberman, Introduction to Operations Research, PERT/CPM chapter
# (house-building bid). Names and predecessors published; (a, m, b) are [memory].
R1 = {
    "A": ("", (1, 2, 3)), "B": ("A", (2, 3.5, 8)), "C": ("B", (6, 9, 18)),
    "D": ("C", (4, 5.5, 10)), "E": ("C", (1, 4.5, 5)), "F": ("E", (4, 4, 10)),
    "G": ("D", (5, 6.5, 11)), "H": ("E,G", (5, 8, 17)), "I": ("C", (3, 7.5, 9)),
    "J": ("F,I", (3, 9, 9)), "K": ("J", (4, 4, 4)), "L": ("J", (1, 5.5, 7)),
    "M": ("H", (1, 2, 3)), "N": ("K,L", (5, 5.5, 9)),
}


def _plan(table, unit="weeks", **settings):
    acts, links = [], []
    for act_id, (preds, est) in table.items():
        if isinstance(est, tuple):
            a, m, b = est
            acts.append(Activity(act_id, optimistic=a, most_likely=m, pessimistic=b))
        else:
            acts.append(Activity(act_id, duration=est))
        links += [Link(p, act_id) for p in preds.split(",") if p]
    return Plan(Settings(title="reference", start=MONDAY, unit=unit, **settings), acts, links)


def _by_id(analysis, values):
    return dict(zip(analysis.schedule.ids, np.round(values, 9).tolist()))


@pytest.fixture(scope="module")
def r1():
    return analyze(_plan(R1), deadline=47)


def test_r1_published_critical_path_and_mean(r1):
    # Hillier & Lieberman (R1): critical path A-B-C-E-F-J-L-N, mean 44 weeks.
    assert r1.schedule.finish == pytest.approx(44.0)
    assert r1.pert.path == tuple("ABCEFJLN")
    assert r1.schedule.paths == [list("ABCEFJLN")]


def test_r1_published_variance_and_odds(r1):
    # Hillier & Lieberman (R1): variance 9, P(T <= 47) = Phi(1) = 0.8413.
    # The variance rests on the [memory] estimates, which reproduce the published total.
    assert r1.pert.variance == pytest.approx(9.0)
    assert r1.pert.sd == pytest.approx(3.0)
    assert r1.probability_by_deadline() == pytest.approx(0.8413, abs=5e-5)


def test_r1_published_total_float(r1):
    # Hillier & Lieberman (R1): D, G, H, M = 4; I = 2; K = 1; others 0.
    expected = {k: 0.0 for k in R1} | {"D": 4, "G": 4, "H": 4, "M": 4, "I": 2, "K": 1}
    # The deadline of 47 adds 3 weeks to every float; without it the published values.
    plain = analyze(_plan(R1))
    assert _by_id(plain, plain.schedule.total_float) == expected
    assert _by_id(r1, r1.schedule.total_float) == {k: v + 3 for k, v in expected.items()}


def test_r1_free_float(r1):
    # R1 (computed from the published network): M = 4, I = 2, K = 1; others 0.
    expected = {k: 0.0 for k in R1} | {"M": 4, "I": 2, "K": 1}
    assert _by_id(r1, r1.schedule.free_float) == expected


# R2 — Hendrickson, Project Management for Construction, ch. 10, nine-activity example.
R2 = {"A": ("", 4), "B": ("", 3), "C": ("A", 8), "D": ("A", 7), "E": ("B,C", 9),
      "F": ("B,C", 12), "G": ("D,E", 2), "H": ("D,E", 5), "I": ("F,G", 6)}


def test_r2_published_critical_path_and_duration():
    # Hendrickson (R2): critical path A-C-F-I, 30 days.
    result = analyze(_plan(R2, unit="days"))
    assert result.schedule.finish == pytest.approx(30.0)
    assert result.schedule.paths == [list("ACFI")]
    assert result.pert.variance == 0.0  # fixed durations


def test_r2_starts_and_floats():
    # Hendrickson (R2), computed: ES/LS, total/free float per activity.
    s = analyze(_plan(R2, unit="days"))
    es = dict(A=0, B=0, C=4, D=4, E=12, F=12, G=21, H=21, I=24)
    ls = dict(A=0, B=9, C=4, D=15, E=13, F=12, G=22, H=25, I=24)
    tf = {k: 0 for k in R2} | dict(B=9, D=11, E=1, G=1, H=4)
    ff = {k: 0 for k in R2} | dict(B=9, D=10, E=0, G=1, H=4)
    assert _by_id(s, s.schedule.es) == es
    assert _by_id(s, s.schedule.ls) == ls
    assert _by_id(s, s.schedule.total_float) == tf
    assert _by_id(s, s.schedule.free_float) == ff


# R3 — all four link types with lags (own example, checked by hand).
def _r3_plan():
    acts = [Activity(k, duration=d) for k, d in dict(A=10, B=6, C=8, D=5, E=2).items()]
    links = [Link("A", "B", "SS", 3), Link("A", "C", "FF", 2), Link("B", "D", "FS", 1),
             Link("C", "D", "SF", 9), Link("C", "E", "FS", 0), Link("D", "E", "FS", 0)]
    return Plan(Settings(title="R3", start=MONDAY), acts, links)


def test_r3_four_link_types():
    # R3 (hand-checked): project 17; ES/LS A 0/0, B 3/3, C 4/6, D 10/10, E 15/15;
    # total and free float: C 2, others 0.
    s = analyze(_r3_plan())
    assert s.schedule.finish == 17
    assert _by_id(s, s.schedule.es) == dict(A=0, B=3, C=4, D=10, E=15)
    assert _by_id(s, s.schedule.ls) == dict(A=0, B=3, C=6, D=10, E=15)
    assert _by_id(s, s.schedule.total_float) == dict(A=0, B=0, C=2, D=0, E=0)
    assert _by_id(s, s.schedule.free_float) == dict(A=0, B=0, C=2, D=0, E=0)
    assert s.schedule.paths == [list("ABDE")]


# R4 — standard normal distribution: exact values from scipy.stats.norm.
R4_CDF = [(0, 0.5), (1, 0.841345), (1.645, 0.950015), (1.96, 0.975002),
          (2.326, 0.989991), (3, 0.998650), (3.39, 0.999651)]
R4_PPF = [(0.8, 0.841621), (0.9, 1.281552), (0.95, 1.644854)]


@pytest.mark.parametrize("z, phi", R4_CDF)
def test_r4_cdf(z, phi):
    # R4: Phi(z) to 6 places (scipy.stats.norm; handbook tables to 4 places).
    unit = PertOdds(mean=0.0, variance=1.0, path=())
    assert unit.prob_by(z) == pytest.approx(phi, abs=1e-6)
    assert unit.prob_by(z) == pytest.approx(norm.cdf(z), abs=1e-12)
    scaled = PertOdds(mean=44.0, variance=9.0, path=())  # R1's mean and variance
    assert scaled.prob_by(44.0 + 3.0 * z) == pytest.approx(phi, abs=1e-6)
    assert scaled.prob_after(44.0 + 3.0 * z) == pytest.approx(1 - phi, abs=1e-6)


@pytest.mark.parametrize("p, z", R4_PPF)
def test_r4_inverse(p, z):
    # R4: Phi^-1(p) to 6 places (scipy.stats.norm.ppf).
    unit = PertOdds(mean=0.0, variance=1.0, path=())
    assert unit.duration_at(p) == pytest.approx(z, abs=1e-6)
    assert PertOdds(44.0, 9.0, ()).duration_at(p) == pytest.approx(44.0 + 3.0 * z, abs=1e-5)


def test_r4_handbook_rounding_differs_in_fourth_place():
    # R4 (common practice): a table rounds z to 0.01 first; Phi(1.645) ~ 0.9500 vs
    # Phi(1.65) = 0.9505 from a 4-place handbook table.
    unit = PertOdds(0.0, 1.0, ())
    assert round(unit.prob_by(1.65), 4) == 0.9505
    assert math.isclose(unit.prob_by(1.645), 0.950015, abs_tol=1e-6)
