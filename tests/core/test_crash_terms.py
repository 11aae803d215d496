"""Costs and crash estimates on an activity: refusals naming the activity, the linear model."""

import pytest

from workbench.core.crash_terms import cost_slope, crash_range, crashed, missing_crash_data
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Settings

GOOD = dict(optimistic=6, most_likely=8, pessimistic=13, cost=1000, crash_cost=1600,
            crash_optimistic=4, crash_most_likely=5, crash_pessimistic=9)


def act(**changes):
    return Activity("K7", **{**GOOD, **changes})


@pytest.mark.parametrize("changes, message", [
    ({"crash_pessimistic": 14, "crash_most_likely": 5}, "crash pessimistic 14 is longer than the normal pessimistic 13"),
    ({"crash_cost": 900}, "crash cost 900 is below the normal cost 1000"),
    ({"cost": -5, "crash_cost": 10}, "cost must not be negative"),
    ({"crash_cost": -1}, "crash cost must not be negative"),
    ({"crash_pessimistic": None}, "needs crash optimistic, crash most likely and crash pessimistic"),
    ({"cost": None}, "a crash cost needs the normal cost"),
    ({"crash_duration": 5}, "not both"),
    ({"crash_optimistic": 6, "crash_most_likely": 5}, "out of order"),
])
def test_refusals_name_the_activity(changes, message):
    with pytest.raises(PlanError, match=message) as err:
        act(**changes).validated()
    assert err.value.culprit == "K7" and str(err.value).startswith("activity K7:")


def test_fixed_crash_longer_than_the_normal_mean_is_refused():
    with pytest.raises(PlanError, match="longer than the normal one"):
        Activity("F1", duration=5, cost=10, crash_cost=20, crash_duration=6).validated()


def test_half_given_crash_data_is_kept_but_buys_nothing():
    """Typed one cell at a time, a crash cost comes before its estimate or after it: either
    half alone is kept, and the activity cannot be shortened until both are there."""
    only_cost = Activity("F1", duration=5, cost=10, crash_cost=20).validated()
    only_estimate = act(crash_cost=None).validated()
    assert missing_crash_data(only_cost) == "crash estimate" and missing_crash_data(only_estimate) == "crash cost"
    for half in (only_cost, only_estimate):
        assert crash_range(half) == 0 and cost_slope(half) == 0 and crashed(half, 2) is half
    assert missing_crash_data(act()) is None and missing_crash_data(Activity("F2", duration=1)) is None


def test_negative_settings_are_refused():
    with pytest.raises(PlanError, match="indirect cost"):
        Settings(indirect_cost=-1.0).validated()
    with pytest.raises(PlanError, match="late penalty"):
        Settings(late_penalty=float("nan")).validated()


def test_linear_model():
    a = act().validated()
    assert a.mean == pytest.approx(8.5) and crash_range(a) == pytest.approx(8.5 - 5.5)
    assert cost_slope(a) == pytest.approx(600 / 3)
    half = crashed(a, 1.5).validated()
    assert half.mean == pytest.approx(7.0)                       # te falls by the days bought
    assert (half.optimistic, half.most_likely, half.pessimistic) == pytest.approx((5, 6.5, 11))
    assert half.cost == pytest.approx(1300)
    assert crash_range(half) == pytest.approx(1.5) and cost_slope(half) == pytest.approx(200)
    full = crashed(a, 99)
    assert full.mean == pytest.approx(5.5) and full.cost == 1600 and crash_range(full) == 0
    assert crashed(a, 0) is a


def test_without_crash_data_an_activity_cannot_be_shortened():
    a = Activity("N1", duration=4, cost=300).validated()
    assert crash_range(a) == 0 and cost_slope(a) == 0 and crashed(a, 2) is a


def test_buying_time_is_one_command_and_undoes_exactly():
    from workbench.core.buy_time import BuyTimeCommand
    from workbench.core.demo import demo_plan
    from workbench.io.planfile import dumps

    plan = demo_plan()
    before = dumps(plan)
    cmd = BuyTimeCommand({"A4": 2.0, "E2": 3.0, "X1": 1.0}, "test option", 1234.0, 0.9, 0.01)
    cmd.do(plan)
    assert plan.activity("A4").mean == pytest.approx(demo_plan().activity("A4").mean - 2.0)
    assert "shortened by 3 days" in plan.activity("E2").notes
    assert plan.activity("X1") == demo_plan().activity("X1")     # cannot be shortened: untouched
    assert plan.settings.bought.crashed == (("A4", 2.0), ("E2", 3.0))
    cmd.undo(plan)
    assert dumps(plan) == before
