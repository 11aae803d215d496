"""A re-analysis repaints only the Activities rows whose figures moved: the rows reported
cover every changed cell, and sorting and filtering stay right."""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from support.ui import sample_plan, ui_env  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity
from workbench.ui.activities import columns as C
from workbench.ui.activities.changed_rows import MAX_RUNS, changed_rows, row_runs
from workbench.ui.activities.filter_model import ActivityFilterModel
from workbench.ui.activities.table_model import COMPUTED, ID_ROLE, ActivityTableModel
from workbench.ui.session import Session


def covered(runs, n):
    mask = np.zeros(n, dtype=bool)
    for first, last in runs:
        mask[first:last + 1] = True
    return mask


@settings(max_examples=200, deadline=None)
@given(st.lists(st.tuples(st.one_of(st.just(float('nan')), st.floats(-1e6, 1e6)), st.booleans(),
                          st.sampled_from([None, "done", "started"])), min_size=1, max_size=300),
       st.data())
def test_changed_rows_are_exactly_the_rows_that_differ(rows, data):
    n = len(rows)
    old = {"f": np.array([r[0] for r in rows]), "b": np.array([r[1] for r in rows]), "s": [r[2] for r in rows]}
    flips = data.draw(st.lists(st.integers(0, n - 1), max_size=n))
    new = {"f": old["f"].copy(), "b": old["b"].copy(), "s": list(old["s"])}
    for i in flips:
        field = data.draw(st.sampled_from("fbs"))
        if field == "f":
            new["f"][i] = new["f"][i] + 1.0 if np.isfinite(new["f"][i]) else 0.0
        elif field == "b":
            new["b"][i] = not new["b"][i]
        else:
            new["s"][i] = "late" if new["s"][i] != "late" else None
    ids = [f"A{i}" for i in range(n)]
    got = changed_rows(old, new, ids, list(ids))
    same = lambda x, y: x == y or (x != x and y != y)      # NaN stays NaN: unchanged
    expected = [i for i in range(n) if not all(same(old[k][i], new[k][i]) for k in "fbs")]
    assert got is not None and got.tolist() == expected
    runs = row_runs(got)
    mask = covered(runs, n)
    assert mask[got].all()
    if len(runs) < MAX_RUNS:
        assert mask.sum() == len(got)          # nothing repainted that did not change
    assert all(a <= b for a, b in runs) and runs == sorted(runs)


def test_nothing_to_compare_means_every_row():
    cols = {"f": np.arange(3.0)}
    assert changed_rows({}, cols, [], ["a", "b", "c"]) is None
    assert changed_rows(cols, cols, ["a", "b", "c"], ["a", "c", "b"]) is None      # rows moved
    assert changed_rows(cols, {"g": np.arange(3.0)}, ["a", "b", "c"], ["a", "b", "c"]) is None
    assert changed_rows(cols, {"f": np.arange(4.0)}, ["a", "b", "c"], ["a", "b", "c"]) is None
    assert changed_rows(cols, {"f": np.array([0.0, np.nan, 2.0])}, list("abc"), list("abc")).tolist() == [1]
    assert changed_rows({"f": np.array([np.nan])}, {"f": np.array([np.nan])}, ["a"], ["a"]).tolist() == []


def test_many_scattered_rows_make_one_range():
    rows = np.arange(0, 4 * MAX_RUNS, 2)
    assert row_runs(rows) == [(0, int(rows[-1]))]
    assert row_runs(np.array([3, 4, 5, 9])) == [(3, 5), (9, 9)]
    assert row_runs(np.array([], dtype=int)) == []


def computed_texts(model):
    return {(r, c): model.index(r, c).data() for r in range(model.rowCount()) for c in COMPUTED}


@pytest.mark.parametrize("edit", [dict(pessimistic=7.0), dict(most_likely=4.0), dict(optimistic=1.0)])
def test_an_estimate_edit_reports_every_changed_cell_and_only_those_rows(qapp, edit):
    session = Session(sample_plan())
    model = ActivityTableModel(session)
    before = computed_texts(model)
    ranges = []
    model.dataChanged.connect(lambda tl, br, roles=(): ranges.append((tl.row(), br.row(), tl.column(), br.column())))
    session.push(EditActivity("R", **edit))
    after = computed_texts(model)
    moved = {key for key in after if after[key] != before[key]}
    assert moved, "the edit should move some figures"
    for r, c in moved:
        assert any(r0 <= r <= r1 and c0 <= c <= c1 for r0, r1, c0, c1 in ranges), (r, c)
    reported = {r for r0, r1, c0, c1 in ranges if c0 == COMPUTED[0] for r in range(r0, r1 + 1)}
    assert reported == {r for r, _ in moved}      # no row repainted that did not change


def test_sorted_and_filtered_table_follows_an_edit(qapp):
    session = Session(sample_plan())
    model = ActivityTableModel(session)
    proxy = ActivityFilterModel()
    proxy.setSourceModel(model)
    col = C.INDEX["total_float"]
    proxy.sort(col)
    proxy.set_critical_only(True)
    session.push(EditActivity("P", optimistic=1.0, most_likely=1.0, pessimistic=2.0))   # the buying branch drops off
    shown = [proxy.index(r, 0).data(ID_ROLE) for r in range(proxy.rowCount())]
    critical = [i for i, c in zip(session.analysis.schedule.ids, session.analysis.schedule.critical) if c]
    assert sorted(shown) == sorted(critical) and "P" not in shown
    proxy.set_critical_only(False)
    floats = [model.value(proxy.mapToSource(proxy.index(r, 0)).row(), "total_float") for r in range(proxy.rowCount())]
    assert floats == sorted(floats)
