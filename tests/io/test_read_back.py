"""The save's quick read-back accepts exactly what loading the file accepts: it agrees with
the plain load on every plan (the same plan read back, or the same refusal), and hands
anything it cannot vouch for to the plain load."""

import datetime as dt

import pytest
from hypothesis import given, settings as hsettings, strategies as st

from workbench.core.model import Activity, Link, Plan, Settings
from workbench.io import planfile
from workbench.io.errors import PlanFileError
from workbench.io.plan_codec import plan_to_dict
from workbench.io.read_back import quick_read_back

START = Settings(start=dt.date(2027, 3, 1))


def plain_plan(n: int, links=()) -> Plan:
    acts = [Activity(f"A{i}", f"Step {i}", "", "", 1.0, 2.0 + i, 4.0 + i) for i in range(n)]
    return Plan(START, acts, [Link(f"A{p}", f"A{s}", t, lag) for p, s, t, lag in links])


def plain_answer(data: bytes):
    try:
        return plan_to_dict(planfile.loads(data, "not saved"))
    except PlanFileError as exc:
        return str(exc)


def test_plain_plan_is_read_back_quickly_and_loads_the_same():
    plan = plain_plan(4, [(0, 1, "FS", 0.0), (1, 2, "SS", 1.5), (0, 3, "FF", -2.0)])
    data = planfile.dumps(plan).encode()
    assert quick_read_back(data, plan) is True
    assert plain_answer(data) == plan_to_dict(plan)


@pytest.mark.parametrize("change", [
    dict(start_no_earlier=2.0), dict(finish_no_later=dt.date(2027, 5, 3)), dict(cost=100.0),
    dict(crash_duration=1.0), dict(distribution="uniform"),
])
def test_an_activity_beyond_the_plain_rows_is_loaded_the_plain_way(change):
    plan = plain_plan(3, [(0, 1, "FS", 0.0)])
    plan._activities[1] = plan._activities[1].with_(**change)
    data = planfile.dumps(plan).encode()
    quick = quick_read_back(data, plan)
    assert quick is ("distribution" in change)       # a distribution is written in the plain row
    assert plain_answer(data) == plan_to_dict(plan)


def test_rows_that_differ_from_the_plan_are_not_vouched_for():
    plan = plain_plan(3, [(0, 1, "FS", 0.0)])
    other = plain_plan(3, [(0, 2, "FS", 0.0)])
    assert quick_read_back(planfile.dumps(other).encode(), plan) is False
    renamed = plain_plan(3, [(0, 1, "FS", 0.0)])
    renamed._activities[2] = renamed._activities[2].with_(name="Other")
    assert quick_read_back(planfile.dumps(renamed).encode(), plan) is False


def test_a_loop_or_repeated_link_is_refused_in_the_plain_loads_words(tmp_path):
    for extra in ([Link("A2", "A0")], [Link("A0", "A1")]):
        plan = plain_plan(3, [(0, 1, "FS", 0.0), (1, 2, "FS", 0.0)])
        plan.links.extend(extra)          # bypasses the checks, as a buggy caller might
        data = planfile.dumps(plan).encode()
        assert quick_read_back(data, plan) is False
        with pytest.raises(PlanFileError) as refused:
            planfile.save_plan(plan, tmp_path / "x.slw")
        assert str(refused.value) == plain_answer(data)


LINKS = st.lists(st.tuples(st.integers(0, 5), st.integers(0, 5), st.sampled_from(["FS", "SS", "FF", "SF"]),
                           st.sampled_from([0.0, 1.0, -0.5])), max_size=12)


@hsettings(max_examples=60, deadline=None)
@given(n=st.integers(1, 6), links=LINKS)
def test_quick_read_back_agrees_with_the_plain_load(n, links):
    """Any plan (loops and repeats included, as a buggy caller could leave): when the quick
    read-back vouches for the bytes, the plain load reads back the very same plan."""
    kept = [(p, s, t, lag) for p, s, t, lag in links if p < n and s < n and p != s]
    plan = plain_plan(n)
    plan.links.extend(Link(f"A{p}", f"A{s}", t, lag) for p, s, t, lag in kept)
    data = planfile.dumps(plan).encode()
    if quick_read_back(data, plan):
        assert plain_answer(data) == plan_to_dict(plan)
    else:
        assert isinstance(plain_answer(data), str)     # refused: the plain load names why


def _file_with_links(links) -> bytes:
    plan = plain_plan(3)
    plan.links.extend(Link(p, s, t) for p, s, t in links)
    return planfile.dumps(plan).encode()


@pytest.mark.parametrize("links, words", [
    ([("A0", "A1", "FS"), ("A0", "A1", "FS")], "link A0 \u2192 A1 (FS) appears twice (links 1 and 2)"),
    ([("A0", "A1", "SS"), ("A1", "A0", "FS"), ("A0", "A1", "SS")], "link A0 \u2192 A1 (SS) appears twice (links 1 and 3)"),
    ([("A0", "A1", "SS"), ("A0", "A1", "FF"), ("A0", "A1", "SF"), ("A0", "A1", "FS")], None),
])
def test_a_repeated_link_is_named_before_any_later_problem(links, words):
    """Repeats are found on the compiled network, in bulk; a repeat is still named first,
    even when the links also make a loop (which the compiler would meet first)."""
    data = _file_with_links(links)
    if words is None:
        assert len(planfile.loads(data).links) == len(links)       # four types: four links
    else:
        with pytest.raises(PlanFileError) as refused:
            planfile.loads(data, "plan.slw")
        assert str(refused.value) == f"plan.slw: {words}; keep one of them"
