"""The criticality chart leaves milestones out: a start or finish milestone is critical in
every iteration (100 %) and would crowd real drivers off the top rows."""

import numpy as np

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.figures.drivers import criticality_bars


def test_milestones_are_left_out_and_the_rest_keep_their_order():
    plan = demo_plan()
    result = simulate(plan, 1000, seed=4)
    milestones = {a.id for a in plan.activities if a.is_milestone}
    assert milestones and all(result.criticality[list(result.ids).index(m)] > 0.99 for m in ("M0",))
    bars = criticality_bars(result, plan, top=len(plan))
    shown = [b.act_id for b in bars if b.act_id]
    assert not set(shown) & milestones and len(shown) == len(plan) - len(milestones)
    values = [b.value for b in bars]
    assert values == sorted(values, reverse=True)
    others = [i for i in result.ids if i not in milestones]
    expected = sorted(others, key=lambda i: -result.criticality[list(result.ids).index(i)])
    assert np.allclose([result.criticality[list(result.ids).index(i)] for i in expected], values)


def test_without_the_plan_every_activity_is_ranked():
    plan = demo_plan()
    result = simulate(plan, 500, seed=4)
    assert len(criticality_bars(result, None, top=len(plan))) == len(plan)
