"""The time–cost curve against a published textbook crashing example.

Source: F. S. Hillier and G. J. Lieberman, *Introduction to Operations Research*, the
chapter on project management with PERT/CPM, section on time–cost trade-offs: the
Reliable Construction Co. house-building project (14 activities, weeks, costs in dollars).
All figures below are [memory]: the precedence list, the normal and crash times and
costs, the six paths with their lengths (40, 31, 43, 44, 41, 42 weeks), and the book's
answer: to finish in 40 weeks instead of 44, crash J (wallboard) by 2 weeks and F
(interior plumbing) by 2 weeks for $140,000 — found both by marginal cost analysis
(J, J, F, F at $30,000, $30,000, $40,000, $40,000) and by the linear programme.
"""

import datetime as dt

import pytest

from workbench.core import analyze
from workbench.core.cost_curve import cost_curve
from workbench.core.model import Activity, Link, Plan, Settings

# id: (name, predecessors, normal weeks, crash weeks, normal cost, crash cost)   [memory]
RELIABLE = {
    "A": ("Excavate", "", 2, 1, 180_000, 280_000),
    "B": ("Lay the foundation", "A", 4, 2, 320_000, 420_000),
    "C": ("Put up the rough wall", "B", 10, 7, 620_000, 860_000),
    "D": ("Put up the roof", "C", 6, 4, 260_000, 340_000),
    "E": ("Install the exterior plumbing", "C", 4, 3, 410_000, 570_000),
    "F": ("Install the interior plumbing", "E", 5, 3, 180_000, 260_000),
    "G": ("Put up the exterior siding", "D", 7, 4, 900_000, 1_020_000),
    "H": ("Do the exterior painting", "EG", 9, 6, 200_000, 380_000),
    "I": ("Do the electrical work", "C", 7, 5, 210_000, 270_000),
    "J": ("Put up the wallboard", "FI", 8, 6, 430_000, 490_000),
    "K": ("Install the flooring", "J", 4, 3, 160_000, 200_000),
    "L": ("Do the interior painting", "J", 5, 3, 250_000, 350_000),
    "M": ("Install the exterior fixtures", "H", 2, 1, 100_000, 200_000),
    "N": ("Install the interior fixtures", "KL", 6, 3, 330_000, 510_000),
}
NORMAL_COST = 4_550_000      # the sum of the normal costs


def reliable_plan() -> Plan:
    acts = [Activity(i, name=n, duration=d, crash_duration=cd, cost=c, crash_cost=cc)
            for i, (n, _, d, cd, c, cc) in RELIABLE.items()]
    links = [Link(p, i) for i, (_, preds, *_rest) in RELIABLE.items() for p in preds]
    # The book's weeks are taken as plan units: the curve is arithmetic on units, not dates.
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, links)


def path_length(path: str) -> int:
    return sum(RELIABLE[i][2] for i in path)


def test_the_six_paths_and_the_critical_one():
    # The book's path table: ABCDGHM 40, ABCEHM 31, ABCEFJKN 43, ABCEFJLN 44, ABCIJKN 41, ABCIJLN 42.
    lengths = {p: path_length(p) for p in ("ABCDGHM", "ABCEHM", "ABCEFJKN", "ABCEFJLN", "ABCIJKN", "ABCIJLN")}
    assert lengths == {"ABCDGHM": 40, "ABCEHM": 31, "ABCEFJKN": 43, "ABCEFJLN": 44, "ABCIJKN": 41, "ABCIJLN": 42}
    result = analyze(reliable_plan())
    assert result.schedule.finish == pytest.approx(44.0)
    critical = {i for i, c in zip(reliable_plan().ids(), result.schedule.critical) if c}
    assert critical == set("ABCEFJLN")
    assert "".join(result.pert.path) == "ABCEFJLN"


def test_crashing_to_forty_weeks_costs_what_the_book_says():
    curve = cost_curve(reliable_plan())
    assert curve.normal == pytest.approx(44.0)
    forty = curve.at(40.0)
    assert forty.direct_cost == pytest.approx(NORMAL_COST + 140_000)
    assert curve.crashed(forty) == pytest.approx({"F": 2.0, "J": 2.0})


def test_the_curve_from_forty_four_to_forty_weeks():
    # Marginal cost analysis in the book: J then J ($30,000 a week each), then F then F ($40,000).
    curve = cost_curve(reliable_plan())
    upper = [(round(p.duration, 9), round(p.direct_cost, 3), curve.crashed(p))
             for p in curve.points if p.duration >= 40.0 - 1e-9]
    assert upper == [(40.0, NORMAL_COST + 140_000, {"F": 2.0, "J": 2.0}),
                     (42.0, NORMAL_COST + 60_000, {"J": 2.0}),
                     (44.0, NORMAL_COST, {})]
    assert curve.at(43.0).direct_cost == pytest.approx(NORMAL_COST + 30_000)
    assert curve.at(41.0).direct_cost == pytest.approx(NORMAL_COST + 100_000)
