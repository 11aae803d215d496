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


def test_two_predecessors_that_tie_are_both_critical_with_the_crews():
    """Two fixed-length branches into one activity finish together in every run: both have
    no float, so both are critical with the crews as without them (not one chosen)."""
    import datetime as dt

    from workbench.core.model import Activity, Link, Plan, Settings
    need = (("crew", 1.0),)
    acts = [Activity("A", duration=3, resources=need), Activity("B", duration=3, resources=need),
            Activity("C", optimistic=1, most_likely=2, pessimistic=4, resources=need)]
    plan = Plan(Settings(start=dt.date(2027, 3, 1)), acts, [Link("A", "C"), Link("B", "C")],
                resources=[Resource("crew", "Crew", 10.0)])
    logic = simulate(plan, 200, seed=4)
    aware = simulate(plan, 200, seed=4, resources=True)
    assert dict(zip(aware.ids, aware.criticality)) == {"A": 1.0, "B": 1.0, "C": 1.0}
    assert np.array_equal(logic.criticality, aware.criticality)
