"""Odds geometry (Qt-free): shaded areas, the inverse date, zero variance, simulation bars."""

import datetime as dt
import math

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st
from scipy.stats import norm

from workbench.core.calendar import WorkCalendar
from workbench.core.model import Settings
from workbench.core.pert import PertOdds
from workbench.figures import odds as fo

# R1 (reference-cases.md): Hillier & Lieberman, PERT/CPM chapter — published mean 44, variance 9.
R1 = PertOdds(44.0, 9.0, ("A", "B", "C", "E", "F", "J", "L", "N"))


class Samples:
    """A finished-run stand-in built from finish samples (the geometry reads only these)."""

    def __init__(self, finish, seed=7):
        self.finish = np.asarray(finish, dtype=float)
        self.seed = seed

    def percentile(self, p):
        return float(np.percentile(self.finish, p))


def _area(shade):
    return float(np.trapezoid(shade.y, shade.x)) if shade.x.size else 0.0


@pytest.mark.parametrize("question", [
    fo.Question("by", 47.0), fo.Question("after", 47.0), fo.Question("between", 41.0, 47.0),
    fo.Question("between", 47.0, 41.0), fo.Question("by", 38.5), fo.Question("after", 50.2),
])
def test_shaded_area_equals_displayed_probability(question):
    lo, hi = fo.axis_span(R1)
    shade = fo.pert_shade(R1, question, lo, hi)
    assert abs(_area(shade) - shade.probability) < 1e-3
    assert abs(shade.area() - shade.probability) < 1e-3


def test_by_47_is_phi_of_one():
    # Hillier & Lieberman house-building bid (reference R1): P(T <= 47) = Φ(1) = 0.8413
    shade = fo.pert_shade(R1, fo.Question("by", 47.0), *fo.axis_span(R1))
    assert shade.probability == pytest.approx(0.841345, abs=1e-6)


@settings(max_examples=60, deadline=None)
@given(mean=st.floats(1, 500), sd=st.floats(0.05, 50), a=st.floats(-3, 3), b=st.floats(-3, 3),
       mode=st.sampled_from(fo.MODES))
def test_area_matches_probability_property(mean, sd, a, b, mode):
    odds = PertOdds(mean, sd * sd, ("X",))
    q = fo.Question(mode, mean + a * sd, mean + b * sd)
    shade = fo.pert_shade(odds, q, *fo.axis_span(odds))
    assert abs(_area(shade) - shade.probability) < 1e-3
    assert 0.0 <= shade.probability <= 1.0


@settings(max_examples=60, deadline=None)
@given(mean=st.floats(1, 500), sd=st.floats(0.01, 50), p=st.floats(0.001, 0.999))
def test_inverse_offset_satisfies_probability(mean, sd, p):
    odds = PertOdds(mean, sd * sd, ("X",))
    x = fo.pert_offset_at(odds, p)
    assert odds.prob_by(x) == pytest.approx(p, abs=1e-9)


def test_inverse_90_reference_value():
    # Φ⁻¹(0.9) = 1.281552 (reference R4, scipy.stats.norm)
    assert fo.pert_offset_at(R1, 0.9) == pytest.approx(44 + 3 * 1.281552, abs=1e-5)


def test_inverse_date_is_first_day_reaching_p():
    cal = WorkCalendar(Settings(start=dt.date(2026, 3, 2)))
    x = fo.pert_offset_at(R1, 0.9)
    end = fo.day_end(cal, x)
    assert R1.prob_by(end) >= 0.9 > R1.prob_by(end - 1)
    day = fo.date_of(cal, x)
    assert cal.offset_through(day) == pytest.approx(end)


def test_zero_variance_is_an_honest_step():
    odds = PertOdds(20.0, 0.0, ("A", "B"))
    lo, hi = fo.axis_span(odds)
    curve = fo.pert_curve(odds, lo, hi)
    assert curve.step and not np.isnan(curve.cumulative).any() and not np.isnan(curve.density).any()
    assert list(curve.cumulative) == [0.0, 0.0, 1.0, 1.0]
    for q, expect in [(fo.Question("by", 19.0), 0.0), (fo.Question("by", 20.0), 1.0),
                      (fo.Question("after", 20.0), 0.0), (fo.Question("between", 19.0, 21.0), 1.0)]:
        shade = fo.pert_shade(odds, q, lo, hi)
        assert shade.probability == expect and shade.x.size == 0
    assert fo.pert_offset_at(odds, 0.9) == 20.0
    cal = WorkCalendar(Settings(start=dt.date(2026, 3, 2)))
    lines = fo.readout_lines(odds, fo.Question("by", 19.0), cal, "days")
    assert not any("nan" in line.lower() for line in lines)
    assert any("−∞" in line for line in lines)


def test_curve_is_the_normal_density():
    lo, hi = fo.axis_span(R1)
    curve = fo.pert_curve(R1, lo, hi)
    assert lo <= 44 - 12 and hi >= 44 + 12
    assert np.allclose(curve.density, norm.pdf(curve.x, 44, 3))
    assert float(np.trapezoid(curve.density, curve.x)) == pytest.approx(1.0, abs=1e-3)


def test_question_rejects_bad_input():
    with pytest.raises(ValueError, match="mode"):
        fo.Question("before", 3.0).validated()
    with pytest.raises(ValueError, match="second"):
        fo.Question("between", 3.0).validated()


@pytest.mark.parametrize("text,expect", [("90", 0.9), ("90 %", 0.9), ("0.8", 0.8), ("97,5", 0.975)])
def test_parse_confidence(text, expect):
    assert fo.parse_confidence(text) == pytest.approx(expect)


@pytest.mark.parametrize("text", ["abc", "100", "0", "-5", "150 %"])
def test_parse_confidence_rejects(text):
    with pytest.raises(ValueError, match="confidence"):
        fo.parse_confidence(text)


def test_sim_figure_bars_share_the_density_axis():
    rng = np.random.default_rng(3)
    res = Samples(rng.normal(44, 3, 20_000))
    fig = fo.sim_figure(res, bins=40)
    assert float(np.sum(fig.heights * np.diff(fig.edges))) == pytest.approx(1.0)
    assert fig.ecdf_y[-1] == 1.0 and np.all(np.diff(fig.ecdf_x) >= 0)
    assert fig.markers["P50"] < fig.markers["P80"] < fig.markers["P90"]
    assert fig.markers["P90"] == pytest.approx(44 + 3 * 1.2816, abs=0.15)  # R4: Φ⁻¹(0.9) = 1.281552 (scipy.stats.norm)


@pytest.mark.parametrize("question", [fo.Question("by", 46.0), fo.Question("after", 42.3),
                                      fo.Question("between", 40.0, 47.7)])
def test_sim_shade_area_tracks_the_simulated_answer(question):
    rng = np.random.default_rng(5)
    res = Samples(rng.normal(44, 3, 50_000))
    fig = fo.sim_figure(res, bins=60)
    shade = fo.sim_shade(fig, question)
    assert shade.area() == pytest.approx(shade.probability, abs=1e-9)
    # the histogram's partial bins differ from the exact count by at most one bin's mass
    assert abs(shade.probability - fo.sim_probability(res, question)) < 0.03


def test_comparison_rows_and_merge_bias_note():
    rng = np.random.default_rng(9)
    res = Samples(rng.normal(45.0, 2.8, 20_000))
    rows = fo.comparison_rows(R1, res, fo.Question("by", 47.0))
    labels = [r.label for r in rows]
    assert labels == ["Mean finish", "P50", "P80", "P90", "P(finish by)"]
    assert rows[0].pert == 44.0 and rows[0].sim == pytest.approx(45.0, abs=0.1)
    assert rows[-1].pert == pytest.approx(0.8413, abs=1e-4)  # R1/R4: P(T ≤ 47) = Φ(1) = 0.841345
    assert rows[-1].sim == pytest.approx(norm.cdf(47, 45, 2.8), abs=0.01)
    note = fo.merge_bias_note(R1, res, "weeks")
    assert "later than PERT" in note and "merge" in note
    cal = WorkCalendar(Settings(start=dt.date(2026, 3, 2), unit="weeks"))
    cells = fo.comparison_cells(rows, cal, "weeks")
    assert cells[-1][1].startswith("0.8413")


def test_readout_names_path_and_tie_note():
    odds = PertOdds(10.0, 4.0, ("A", "C"), tied=2, note="2 critical paths tie at 10; ...")
    cal = WorkCalendar(Settings(start=dt.date(2026, 3, 2)))
    lines = fo.readout_lines(odds, fo.Question("by", 12.0), cal, "days")
    text = "\n".join(lines)
    assert "0.8413 (84.1 %)" in text and "+1.000" in text  # R4: Φ(1) = 0.841345 (scipy.stats.norm)
    assert "Path: A-C" in text and "tie" in text


def test_headline_names_the_deadline():
    cal = WorkCalendar(Settings(start=dt.date(2026, 3, 2)))
    day = fo.format_date(cal.finish_date(10.0))
    assert fo.question_headline(fo.Question("by", 10.0), cal, 10.0) == f"Finish by the deadline, {day}?"
    assert fo.question_headline(fo.Question("by", 10.0), cal, 12.0) == f"Finish by {day}?"


def test_geometry_agrees_with_a_real_simulation():
    from workbench.core.analysis import analyze
    from workbench.core.montecarlo import simulate
    from support.plans import house_plan

    plan = house_plan()
    odds = analyze(plan).pert
    result = simulate(plan, 4000, seed=21)
    q = fo.Question("by", 47.0)
    assert fo.sim_probability(result, q) == pytest.approx(result.prob_by(47.0)[0], abs=1e-12)
    fig = fo.sim_figure(result)
    assert fig.markers["P90"] == result.percentile(90) and fig.seed == 21
    assert float(np.sum(fig.heights * np.diff(fig.edges))) == pytest.approx(1.0)
    # merge bias on the published network (reference R1): later mean, lower P(T <= 47)
    rows = fo.comparison_rows(odds, result, q)
    assert rows[0].sim > rows[0].pert and rows[-1].sim < rows[-1].pert
    lo, hi = fo.Question("between", 42.0, 47.0).bounds()
    between = fo.sim_probability(result, fo.Question("between", lo, hi))
    assert between == pytest.approx(result.prob_between(lo, hi), abs=1e-12)
    after = fo.sim_probability(result, fo.Question("after", 44.0))
    assert after == pytest.approx(1.0 - result.prob_by(44.0)[0], abs=1e-12)


def test_curve_height_follows_the_density():
    lo, hi = fo.axis_span(R1)
    curve = fo.pert_curve(R1, lo, hi)
    assert fo.curve_height(curve, 47.0) == pytest.approx(norm.pdf(47, 44, 3), rel=1e-3)
    assert fo.curve_height(curve, hi + 5) == 0.0
    step = fo.pert_curve(PertOdds(5.0, 0.0, ("A",)), 0, 10)
    assert fo.curve_height(step, 5.0) == 0.0


def test_merge_bias_note_names_the_risk_events_that_struck():
    rng = np.random.default_rng(4)
    res = Samples(rng.normal(45.0, 2.8, 5000))
    res.risk_report = [{"id": "R1", "fired": 0.2}, {"id": "R2", "fired": 0.0}]
    note = fo.merge_bias_note(R1, res, "weeks")
    assert "Risk events, which PERT leaves out, also add delay: R1 (20 % of runs)." in note
    assert "R2" not in note
    res.risk_report = []
    assert "Risk events" not in fo.merge_bias_note(R1, res, "weeks")
