"""Plan model: every bad value is refused with a message naming the activity and field;
edits keep links consistent and announce themselves."""

import datetime as dt
import math

import pytest

from workbench.core import Activity, Link, Plan, PlanError, Settings

BAD_ACTIVITIES = [
    (Activity("A;B", duration=1), "A;B", "must not contain"),
    (Activity(" A", duration=1), " A", "must not contain spaces"),
    (Activity("A 1", duration=1), "A 1", "must not contain spaces"),
    (Activity("X" * 41, duration=1), "X" * 40, "at most 40"),
    (Activity("A", duration=2e6), "A", "beyond 1,000,000 plan units"),
    (Activity("A", optimistic=1, most_likely=2, pessimistic=1e300), "A", "beyond"),
    (Activity("A", duration=2, start_no_earlier=1e308), "A", "beyond"),
    (Activity("A", duration=2, finish_no_later=dt.date(9999, 12, 31)), "activity A", "outside 1900"),
    (Activity("A\tB", duration=1), "A\tB", "tabs"),
    (Activity("", duration=1), "id", "empty id"),
    (Activity("A", duration=-1), "A", "duration must not be negative"),
    (Activity("A", duration=math.nan), "A", "finite"),
    (Activity("A", duration=True), "A", "must be a number"),
    (Activity("A", duration="3"), "A", "must be a number"),
    (Activity("A"), "A", "needs a duration or a three-point estimate"),
    (Activity("A", optimistic=1, most_likely=2), "A", "needs optimistic, most likely and pessimistic"),
    (Activity("A", optimistic=3, most_likely=2, pessimistic=5), "A", "out of order"),
    (Activity("A", optimistic=-1, most_likely=2, pessimistic=5), "A", "must not be negative"),
    (Activity("A", optimistic=1, most_likely=2, pessimistic=math.inf), "A", "pessimistic must be a finite"),
    (Activity("A", duration=2, distribution="bogus"), "A", "unknown distribution"),
    (Activity("A", duration=2, start_no_earlier="soon"), "A", "start no earlier"),
]


@pytest.mark.parametrize("act, culprit, words", BAD_ACTIVITIES)
def test_bad_activity_is_named(act, culprit, words):
    with pytest.raises(PlanError, match=words) as err:
        act.validated()
    assert err.value.culprit == culprit
    with pytest.raises(PlanError):
        Plan(Settings(), [act])


@pytest.mark.parametrize("act", [
    Activity("A", duration=0), Activity("A", duration=2.5), Activity("A", optimistic=1, most_likely=1, pessimistic=1),
    Activity("A", optimistic=1, most_likely=2, pessimistic=9, duration=4), Activity("A-1.b", duration=1, start_no_earlier=2.0),
])
def test_good_activity_passes(act):
    assert act.validated() is act


@pytest.mark.parametrize("link, words", [
    (Link("A", "B", "XY"), "unknown link type 'XY'"),
    (Link("A", "A"), "A is linked to itself"),
    (Link("A", "B", "FS", math.nan), "lag of the link from A must be a finite number"),
    (Link("A", "B", "FS", "2"), "lag of the link from A must be a number"),
])
def test_bad_link_is_named(link, words):
    with pytest.raises(PlanError, match=words):
        link.validated()


def _plan():
    acts = [Activity(x, duration=1) for x in "ABC"]
    return Plan(Settings(), acts, [Link("A", "B"), Link("B", "C", "SS", 2)])


def test_unknown_and_duplicate_ids():
    with pytest.raises(PlanError, match="unknown activity 'Z'"):
        Plan(Settings(), [Activity("A", duration=1)], [Link("A", "Z")])
    with pytest.raises(PlanError, match="duplicate activity id 'A'"):
        Plan(Settings(), [Activity("A", duration=1), Activity("A", duration=2)])


def test_rename_carries_links_and_remove_restores_them():
    plan = _plan()
    events = []
    plan.subscribe(lambda event, info: events.append((event, info["kind"])))
    plan.replace_activity("B", Activity("B2", duration=3))
    assert plan.links == [Link("A", "B2"), Link("B2", "C", "SS", 2)]
    row, act, removed = plan.remove_activity("B2")
    assert plan.links == [] and plan.ids() == ["A", "C"]
    plan.restore_activity(row, act, removed)
    assert plan.ids() == ["A", "B2", "C"] and plan.links == [Link("A", "B2"), Link("B2", "C", "SS", 2)]
    assert events[:2] == [("about_to_change", "activity_changed"), ("changed", "activity_changed")]


def test_pert_moments():
    # te = (a + 4m + b) / 6 and variance ((b - a) / 6)^2 (PERT, common practice).
    act = Activity("A", optimistic=6, most_likely=9, pessimistic=18)
    assert act.mean == 10 and act.variance == 4
    assert Activity("M", duration=0).is_milestone and not act.is_milestone
