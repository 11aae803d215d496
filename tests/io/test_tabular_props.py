"""Property tests: random plans survive a CSV export and re-import; the predecessor cell
syntax reads back what it writes."""

import datetime as dt
import tempfile
from pathlib import Path

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from workbench.core import DISTRIBUTIONS, Activity, Link, Plan, Settings, analyze
from workbench.io.tabular import export_table, format_predecessors, parse_predecessors, read_table

ID_CHARS = st.characters(blacklist_categories=("Cs", "Zs", "Zl", "Zp", "Cc"), blacklist_characters=";,")
ids = st.text(ID_CHARS, min_size=1, max_size=5).filter(lambda s: s == s.strip())
# cell text: anything printable plus the characters that matter to CSV and formulas;
# the import trims cells, so the plan's own text is drawn trimmed
CELL = st.characters(blacklist_categories=("Cs", "Cc")) | st.sampled_from("\n\t;,\"'=+-@ ")
text = st.text(CELL, max_size=10).map(str.strip)
sizes = st.floats(0, 1e4, allow_nan=False)  # chains of these stay inside the calendar
points = st.none() | sizes | st.dates(dt.date(2000, 1, 1), dt.date(2060, 1, 1))
SETTINGS = Settings(title="random", start=dt.date(2026, 1, 5))


@st.composite
def activities(draw, act_id):
    a, m, b = sorted(draw(st.lists(sizes, min_size=3, max_size=3)))
    if draw(st.booleans()):
        est = dict(optimistic=a, most_likely=m, pessimistic=b, duration=draw(st.none() | sizes))
    else:
        est = dict(duration=draw(sizes))
    return Activity(act_id, draw(text), draw(text), draw(text), **est,
                    distribution=draw(st.none() | st.sampled_from(DISTRIBUTIONS)),
                    start_no_earlier=draw(points), finish_no_later=draw(points))


@st.composite
def plans(draw):
    names = draw(st.lists(ids, min_size=1, max_size=10, unique=True))
    acts = [draw(activities(n)) for n in names]
    links = []
    for j in range(1, len(names)):
        for i in sorted(draw(st.sets(st.integers(0, j - 1), max_size=3))):
            links.append(Link(names[i], names[j], draw(st.sampled_from(["FS", "SS", "FF", "SF"])),
                              draw(st.floats(-30, 30, allow_nan=False))))
    return Plan(SETTINGS, acts, links)


def key(link):
    return (link.pred, link.succ, link.type, link.lag)


@settings(max_examples=120, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(plans())
def test_random_plans_round_trip_through_csv(plan):
    with tempfile.TemporaryDirectory() as folder:
        path = export_table(analyze(plan), Path(folder) / "plan.csv")
        back = read_table(path, SETTINGS)
    assert back.activities == plan.activities
    assert sorted(map(key, back.links)) == sorted(map(key, plan.links))


@given(st.lists(st.tuples(ids, st.sampled_from(["FS", "SS", "FF", "SF"]), st.floats(-1e6, 1e6)),
                max_size=6, unique_by=lambda t: (t[0], t[1])))
def test_predecessor_cell_reads_back(items):
    links = [Link(pred, "SUCC", kind, lag) for pred, kind, lag in items if pred != "SUCC"]
    assert parse_predecessors(format_predecessors(links), "SUCC") == links
