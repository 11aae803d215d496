"""Trade-off chart geometry shared by the window and the pack: the cost curves against the
finish (plan units from the start; the caller labels them as dates), the deadline, the
optimum, and the confidence plans as points of cost against chance."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

DIRECT, INDIRECT, TOTAL = "#0072B2", "#56B4E9", "#D55E00"
DEADLINE, OPTIMUM, CHANCE = "#CC79A7", "#000000", "#E69F00"


@dataclass
class CurveLines:
    durations: np.ndarray
    direct: np.ndarray
    indirect: np.ndarray
    total: np.ndarray
    optimum: tuple[float, float]          # (duration, total cost)
    deadline: float | None


def curve_lines(result) -> CurveLines:
    """Direct, indirect and total cost at every breakpoint (and the deadline, where the
    penalty bends the total), shortest first; past the normal finish the curve stops."""
    pts = result.curve.points
    xs = sorted({p.duration for p in pts} | ({result.deadline} if result.deadline is not None
                                             and pts[0].duration < result.deadline < pts[-1].duration else set()))
    direct = np.array([result.curve.at(x).direct_cost for x in xs])
    xs = np.array(xs, float)
    indirect = result.indirect_cost * xs
    total = np.array([result.total_cost(x, d) for x, d in zip(xs, direct)])
    o = result.optimum
    return CurveLines(xs, direct, indirect, total, (o.duration, result.total_cost(o.duration, o.direct_cost)),
                      result.deadline)


@dataclass
class ChancePoint:
    label: str
    chance: float
    standard_error: float
    extra_cost: float
    textbook: bool = False


def chance_points(result) -> list[ChancePoint]:
    """The textbook crash to the deadline and every reachable confidence plan."""
    out = []
    d = result.to_deadline
    if d is not None:
        out.append(ChancePoint("crash the mean to the deadline", d.chance, d.standard_error,
                               d.point.direct_cost - result.problem.base_cost, True))
    for c in result.confidence:
        if c.reachable:
            out.append(ChancePoint(f"{c.target:.0%} plan", c.chance_out_of_sample, c.standard_error, c.extra_cost))
    return out
