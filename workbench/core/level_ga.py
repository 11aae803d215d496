"""A genetic algorithm over activity lists for resource levelling (S. Hartmann, "A
competitive genetic algorithm for resource-constrained project scheduling", Naval
Research Logistics 45, 1998).

An individual is an activity list in which every activity comes after its predecessors;
the serial scheme turns it into a schedule, which forward–backward improvement then
justifies (both count against the budget), and its finish is the fitness. Two parents make
two children by two-point crossover (the first q₁ activities of one parent, the next ones
up to q₂ in the other parent's order, the rest in the first's: every predecessor stays
first); a child's neighbouring
activities swap with a small probability when no link joins them. Parents and children
compete together and the best keep their places (ranking; a schedule found twice keeps
one place). The first generation is the
priority rules' lists, the improved schedule's list and lists drawn by randomly perturbed
latest-finish priorities. Every schedule the algorithm builds counts against the budget.
"""

from __future__ import annotations

import numpy as np

POPULATION = 40
MUTATION = 0.05
COST = 3                   # schedules per individual: the serial scheme, then back and forth


def _list_of(starts) -> list[int]:
    return sorted(range(len(starts)), key=lambda j: (starts[j], j))


class _Evaluator:
    def __init__(self, lev, budget: int, justified: bool = True):
        self.lev, self.left, self.justified = lev, budget, justified
        self.best, self.best_span = None, float("inf")

    def __call__(self, order: list[int]) -> tuple[float, list[int]]:
        key = [0] * len(order)
        for pos, j in enumerate(order):
            key[j] = pos
        before = self.lev.schedules
        starts = self.lev.forward(key)
        if self.justified:
            starts = self.lev.justify(starts)
        self.left -= self.lev.schedules - before
        span = self.lev.makespan(starts)
        if span < self.best_span:
            self.best, self.best_span = starts, span
        return span, _list_of(starts)      # the list as the scheme really ordered it


def _crossover(mother: list[int], father: list[int], q1: int, q2: int) -> list[int]:
    """Two-point crossover: positions before q1 from the mother, up to q2 the father's
    next ones in his order, the rest the mother's in hers (predecessors stay first)."""
    child = mother[:q1]
    taken = set(child)
    for j in father:
        if len(child) >= q2:
            break
        if j not in taken:
            child.append(j)
            taken.add(j)
    return child + [j for j in mother if j not in taken]


def _mutate(order: list[int], linked: set, rng) -> list[int]:
    order = list(order)
    for i in np.flatnonzero(rng.random(len(order) - 1) < MUTATION).tolist():
        a, b = order[i], order[i + 1]
        if (a, b) not in linked and (b, a) not in linked:
            order[i], order[i + 1] = b, a
    return order


def _first_generation(lev, start, evaluate, rng) -> list[tuple[float, list[int]]]:
    people = [evaluate(_list_of(start))]
    lft = np.asarray(lev.priority("lft"))
    spread = float(np.ptp(lft)) or 1.0
    for rule in ("float", "successors"):
        if evaluate.left >= COST:
            people.append(evaluate(_list_of(lev.priority(rule))))
    while len(people) < POPULATION and evaluate.left >= COST:
        noisy = lft + rng.random(lft.size) * spread * rng.uniform(0.05, 3.0)   # up to nearly random
        people.append(evaluate(_list_of(noisy)))
    return people


def _survivors(people):
    """The best POPULATION individuals, each schedule once (copies crowd out the search)."""
    seen, out = set(), []
    for p in sorted(people, key=lambda p: p[0]):
        key = tuple(p[1])
        if key not in seen:
            seen.add(key)
            out.append(p)
    return out[:POPULATION]


def evolve(lev, start, budget: int, seed: int = 0) -> list[float]:
    """The best schedule found within ``budget`` schedules, starting from ``start``
    (never worse than it), then improved once more by forward–backward justification
    when the budget has room left for it: never more than ``budget`` schedules."""
    if budget < COST:
        return start
    rng = np.random.default_rng(seed)
    evaluate = _Evaluator(lev, budget)
    evaluate.best, evaluate.best_span = start, lev.makespan(start)
    linked = set(zip(lev.problem.src, lev.problem.dst))
    people = _first_generation(lev, start, evaluate, rng)
    n = lev.problem.n
    while evaluate.left >= 2 * COST and len(people) > 1:
        perm = rng.permutation(len(people))
        children = []
        for a, b in zip(perm[::2], perm[1::2]):
            if evaluate.left < 2 * COST:
                break
            q1, q2 = sorted(int(x) for x in rng.integers(1, n, size=2))
            mother, father = people[a][1], people[b][1]
            children.append(evaluate(_mutate(_crossover(mother, father, q1, q2), linked, rng)))
            children.append(evaluate(_mutate(_crossover(father, mother, q1, q2), linked, rng)))
        if not children:
            break
        people = _survivors(people + children)
    return lev.improve(evaluate.best, rounds=max(evaluate.left, 0) // COST)
