"""Resource-aware simulation with more units than any activity could ask for: the same seed
must give the logic-only simulation, finish distribution and criticality alike (issue 19's
own test)."""

import numpy as np

from workbench.core.demo import demo_plan
from workbench.core.model import Resource
from workbench.core.montecarlo import simulate


def roomy_demo():
    plan = demo_plan().copy()
    plan.set_resources([Resource(r.id, r.name, 1e5) for r in plan.resources])
    return plan


def test_unlimited_units_give_the_logic_only_run_for_the_same_seed():
    plan = roomy_demo()
    logic = simulate(plan, 500, seed=3)
    aware = simulate(plan, 500, seed=3, resources=True)
    assert aware.resource_aware and not logic.resource_aware
    assert np.array_equal(logic.sorted_finish(), aware.sorted_finish())
    assert logic.percentiles == aware.percentiles
    # the finish milestone O3 ties with O2 that leads into it: both are on every run's critical path
    assert dict(zip(logic.ids, logic.criticality)) == dict(zip(aware.ids, aware.criticality))
    assert dict(zip(aware.ids, aware.criticality))["O3"] == 1.0
