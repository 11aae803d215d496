"""The merge-bias sentence is said only when the simulated and PERT means differ enough
to matter: half a working day, and more than the simulation's own noise."""

from types import SimpleNamespace

import numpy as np

from workbench.core.pert import PertOdds
from workbench.figures import odds as fo

PERT = PertOdds(44.0, 9.0, ("A", "B", "C"))


def _runs(mean, sd=3.0, n=20_000, seed=2):
    finish = np.random.default_rng(seed).normal(0.0, 1.0, n)
    finish = (finish - finish.mean()) / finish.std() * sd + mean      # exact mean and spread
    return SimpleNamespace(finish=finish, risk_report=[])


def test_a_negligible_gap_is_not_explained():
    note = fo.merge_bias_note(PERT, _runs(44.01), "days")
    assert note == "" and "merge" not in note
    assert fo.merge_bias_gap(PERT, _runs(44.3), "days") is None          # under half a day


def test_a_gap_that_matters_is_explained_in_rounded_units():
    note = fo.merge_bias_note(PERT, _runs(45.2667), "days")
    assert note.startswith("The simulated mean is 1.3 days later than PERT") and "merge" in note
    weeks = fo.merge_bias_note(PERT, _runs(44.3), "weeks")
    assert weeks.startswith("The simulated mean is 0.3 weeks later")
    assert fo.merge_bias_note(PERT, _runs(44.05), "weeks") == ""          # a quarter of a day


def test_a_gap_inside_the_simulations_noise_is_not_explained():
    few = _runs(44.8, sd=10.0, n=100)                                     # noise 2 x 10 / 10 = 2 days
    assert fo.merge_bias_gap(PERT, few, "days") is None


def test_an_earlier_simulated_mean_is_not_blamed_on_merging_paths():
    note = fo.merge_bias_note(PERT, _runs(42.0), "days")
    assert "2 days earlier than PERT" in note and "merge" not in note


def test_risk_events_are_named_even_when_the_means_agree():
    runs = _runs(44.0)
    runs.risk_report = [{"id": "R7", "fired": 0.15}]
    assert fo.merge_bias_note(PERT, runs, "days") == (
        "Risk events, which PERT leaves out, also add delay: R7 (15 % of runs).")
