"""A fixed set of simulated scenarios for crashing (common random numbers).

Every scenario draws one score per activity, as the simulation does (same seeding, same
correlation, same risk events). A crashed activity's duration in a scenario is the straight
line between its normal and its crash duration *at that score*: with f the share of its
crash range bought, d = (1 − f)·Q_normal(u) + f·Q_crash(u). So its mean moves exactly as
the PERT means of the deterministic curve do, its optimistic and pessimistic ends move on
the straight line between the normal and crash points, and every scenario's durations are
linear in the days bought — which is what lets a linear programme optimise over scenarios.
Risk delays are added whatever is crashed.
"""

from __future__ import annotations

import numpy as np

from .block_passes import BlockPasses
from .crash_terms import crash_points, normal_points
from .distributions import DurationModel
from .montecarlo import MonteCarlo
from .score_stream import CHUNK, ScoreStream

MET = 1e-9     # a finish this close past the deadline still counts as on time


def _crash_model(problem, families) -> DurationModel:
    pts = []
    for act_id in problem.ids:
        act = problem.plan.activity(act_id)
        pts.append(crash_points(act) if act.crash_cost is not None and act.has_crash else normal_points(act))
    a, m, b = zip(*pts) if pts else ((), (), ())
    return DurationModel(families, a, m, b, problem.ids)


class ScenarioSet:
    """``iterations`` scenarios from ``seed``: normal and crash durations (activities ×
    scenarios, network order) at the same scores, and the deadline they are judged by."""

    def __init__(self, problem, iterations: int, seed: int, deadline: float):
        self.problem, self.iterations, self.seed, self.deadline = problem, int(iterations), int(seed), float(deadline)
        mc = MonteCarlo(problem.plan, deadline=deadline)
        families = list(mc.durations.family)
        self.normal, self.crash = self._draw(mc, _crash_model(problem, families))
        span = problem.span
        self.gain = np.where(span[:, None] > 0, (self.normal - self.crash) / np.where(span > 0, span, 1.0)[:, None], 0.0)
        self.passes = BlockPasses(problem.net, problem.floor, problem.fnlt)

    def _draw(self, mc, crash_model: DurationModel) -> tuple[np.ndarray, np.ndarray]:
        n, N = mc.net.size, self.iterations
        chunks = -(-N // CHUNK)
        stream = ScoreStream(self.seed, mc.durations.uncertain.size, mc.correlation, mc.risks.size)
        scores, occurrence, delay_scores = stream.block(0, chunks)
        full = np.random.Generator(np.random.PCG64(np.random.SeedSequence(self.seed, spawn_key=(2**31,)))).random((n, chunks * CHUNK))
        full[mc.durations.uncertain] = scores
        normal = mc.durations.sample(full[mc.durations.uncertain])
        crash = crash_model.sample(full[crash_model.uncertain])
        if mc.risks.size:
            _, delay = mc.risks.draw(occurrence, delay_scores)
            mc.risks.apply(normal, delay)
            mc.risks.apply(crash, delay)
        return normal[:, :N].copy(), crash[:, :N].copy()

    def durations(self, days: np.ndarray, which=None) -> np.ndarray:
        cols = slice(None) if which is None else which
        return self.normal[:, cols] - self.gain[:, cols] * np.asarray(days, float)[:, None]

    def finishes(self, days: np.ndarray) -> np.ndarray:
        d = np.ascontiguousarray(self.durations(days))
        finish, _ = self.passes.run(d, None)
        return finish.copy()

    def chance(self, days: np.ndarray) -> float:
        return float(np.mean(self.finishes(days) <= self.deadline + MET))
