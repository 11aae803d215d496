"""Property tests: random plans survive the .slw file exactly (and the hash follows content)."""

import datetime as dt

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from workbench.core import (DISTRIBUTIONS, Activity, Calendar, CorrelationGroup, Link, Plan, Risk,
                            Settings, SignOff)
from workbench.io.planfile import dumps, loads, plan_from_dict, plan_hash, plan_to_dict

ID_CHARS = st.characters(blacklist_categories=("Cs", "Zs", "Zl", "Zp", "Cc"), blacklist_characters=";,")
ids = st.text(ID_CHARS, min_size=1, max_size=6)
text = st.text(st.characters(blacklist_categories=("Cs",)), max_size=12)
sizes = st.floats(0, 1e5, allow_nan=False, allow_infinity=False)
dates = st.dates(dt.date(1990, 1, 1), dt.date(2090, 12, 31))
points = st.none() | sizes | dates


@st.composite
def activities(draw, act_id):
    a, m, b = sorted(draw(st.lists(sizes, min_size=3, max_size=3)))
    three = draw(st.booleans())
    return Activity(act_id, draw(text), draw(text), draw(text),
                    a if three else None, m if three else None, b if three else None,
                    draw(st.none() | sizes) if three else draw(sizes),
                    draw(st.none() | st.sampled_from(DISTRIBUTIONS)), draw(points), draw(points))


@st.composite
def settings_(draw):
    workdays = tuple(sorted(draw(st.sets(st.integers(0, 6), min_size=1))))
    cal = Calendar(workdays, tuple(draw(st.lists(dates, max_size=4))), draw(text))
    return Settings(draw(text), draw(dates), draw(st.sampled_from(["days", "weeks"])), cal, draw(points),
                    draw(st.none() | dates), draw(st.floats(0.01, 0.99)), draw(st.sampled_from(DISTRIBUTIONS)),
                    draw(text), draw(text), [SignOff(draw(text), draw(text)) for _ in range(draw(st.integers(0, 2)))])


@st.composite
def links(draw, names):
    """Links only from earlier to later activities, so there is never a loop."""
    out = []
    for j in range(1, len(names)):
        for i in draw(st.sets(st.integers(0, j - 1), max_size=3)):
            lag = draw(st.floats(-50, 50, allow_nan=False))
            out.append(Link(names[i], names[j], draw(st.sampled_from(["FS", "SS", "FF", "SF"])), lag))
    return out


@st.composite
def plans(draw, max_size=12, extras=True):
    names = draw(st.lists(ids, min_size=1, max_size=max_size, unique=True))
    acts = [draw(activities(n)) for n in names]
    risks, corr = [], []
    if extras:
        for k in range(draw(st.integers(0, 2))):
            a, m, b = sorted(draw(st.lists(sizes, min_size=3, max_size=3)))
            members = tuple(draw(st.lists(st.sampled_from(names), max_size=3)))
            risks.append(Risk(f"R{k}", draw(text), draw(st.floats(0, 1)), a, m, b, members))
        if len(names) > 1 and draw(st.booleans()):
            corr.append(CorrelationGroup(draw(text), tuple(names[:2]), draw(st.floats(-1, 1))))
    return Plan(draw(settings_()), acts, draw(links(names)), risks, corr)


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(plans())
def test_random_plans_round_trip_through_the_file_text(plan):
    data = plan_to_dict(plan)
    back = loads(dumps(plan))
    assert plan_to_dict(back) == data
    assert plan_to_dict(plan_from_dict(data)) == data
    assert back.activities == plan.activities and back.links == plan.links
    assert back.risks == plan.risks and back.correlations == plan.correlations
    assert plan_hash(back) == plan_hash(plan)


@settings(max_examples=60, deadline=None)
@given(plans(max_size=6, extras=False), st.floats(0.001, 10))
def test_hash_changes_when_an_estimate_changes(plan, bump):
    first = plan.activities[0]
    new = first.with_(duration=(first.duration or 0.0) + bump) if not first.has_estimate else \
        first.with_(pessimistic=first.pessimistic + bump)
    if new == first:  # the bump vanished in rounding of a huge number
        return
    changed = plan.copy()
    changed.replace_activity(first.id, new)
    assert plan_hash(changed) != plan_hash(plan)


@settings(max_examples=80, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(plans())
def test_the_pieces_an_autosave_writes_are_the_plan_file_bytes(plan):
    from workbench.io.planfile import encode_parts, encode_plan
    assert b"".join(encode_parts(plan)) == encode_plan(plan)
