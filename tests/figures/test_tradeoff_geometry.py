"""Trade-off chart geometry: lines through every breakpoint, points merged where they
coincide, round ticks and short money labels."""

import pytest

from workbench.core.demo import demo_plan
from workbench.core.tradeoff import tradeoff
from workbench.figures import tradeoff as ftr


@pytest.fixture(scope="module")
def result():
    return tradeoff(demo_plan(), targets=[0.5, 0.9], iterations=300, seed=5)


def test_curve_lines_hold_every_breakpoint_and_the_optimum(result):
    lines = ftr.curve_lines(result)
    assert set(p.duration for p in result.curve.points) <= set(lines.durations.tolist())
    assert lines.total == pytest.approx(lines.direct + lines.indirect + result.penalty *
                                        (lines.durations - result.deadline).clip(min=0))
    assert min(lines.total) == pytest.approx(lines.optimum[1])


def test_chance_points_and_merging(result):
    pts = ftr.chance_points(result)
    assert pts[0].textbook and [p.label for p in pts[1:]] == ["50 % plan", "90 % plan"]
    same = [ftr.ChancePoint("a", 0.9, 0.01, 0.0), ftr.ChancePoint("b", 0.9, 0.01, 0.0, True)]
    assert [p.label for p in ftr.merged(same)] == ["a; b"]


def test_ticks_and_money():
    assert ftr.nice_ticks(0, 1.0e6, 6) == [0, 200000, 400000, 600000, 800000, 1000000]
    assert ftr.nice_ticks(3, 3) == [3]
    assert [ftr.money(v) for v in (950, 5000, 12500, 1250000, -30000)] == ["950", "5k", "12.5k", "1.25M", "-30k"]
    lo, hi = ftr.cost_span([0.0, 0.0])
    assert lo < 0 < hi
