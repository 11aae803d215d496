"""Predecessor cells read by columns (ids as row indices, checked with numpy) give the same
plan, or the same problems, as the row reader; the network compiled while importing is the
one a fresh analysis compiles."""

import numpy as np
import pytest
from hypothesis import given, settings as hsettings, strategies as st

from workbench.core.analysis import analyze
from tests.io.test_table_bulk import CLEAN, HEADER, SETTINGS, _change, bulk_taken, outcome, row_reader_outcome, write

CELLS = [
    ("spaces round the ids", "DRAW ; ORDER", True),
    ("no spaces", "DRAW;ORDER", True),
    ("tab", "DRAW;\tORDER", True),
    ("stray separators", ";DRAW;;ORDER;", True),
    ("space inside an id", "DR AW;ORDER", False),
    ("unknown id", "DRAW;ORDRE", False),
    ("repeat", "DRAW;DRAW", False),
    ("repeat with spaces", "DRAW ; DRAW", False),
    ("itself", "DRAW;ERECT", False),
]


@pytest.mark.parametrize("label, cell, by_columns", CELLS, ids=[c[0] for c in CELLS])
def test_predecessor_cells_read_by_columns_as_by_rows(tmp_path, monkeypatch, label, cell, by_columns):
    lines = _change(3, "DRAW; ORDER", cell)
    assert bulk_taken(lines) is by_columns
    path = write(tmp_path, lines)
    assert outcome(path) == row_reader_outcome(path, monkeypatch)


ROWS = st.lists(st.lists(st.integers(0, 7), max_size=4), min_size=1, max_size=8)


@hsettings(max_examples=60, deadline=None)
@given(preds=ROWS, space=st.sampled_from([";", "; ", " ;"]))
def test_random_predecessor_lists_read_alike(tmp_path_factory, preds, space):
    """Random predecessor lists (unknown ids, repeats, self links and loops included)."""
    tmp_path = tmp_path_factory.mktemp("t")
    lines = [f"T{i},Task {i},1,2,3,,{space.join(f'T{p}' for p in cell)}" for i, cell in enumerate(preds)]
    path = write(tmp_path, lines)
    with pytest.MonkeyPatch.context() as m:
        assert outcome(path) == row_reader_outcome(path, m)


def test_imported_plan_analyses_as_a_fresh_one(tmp_path):
    from workbench.io.tabular import read_table

    plan = read_table(write(tmp_path, CLEAN), SETTINGS)
    assert plan._analyzer is not None            # kept from the import
    kept = analyze(plan)
    plan._analyzer = None
    fresh = analyze(plan)
    for name in ("es", "ef", "ls", "lf", "total_float", "free_float", "critical"):
        assert np.array_equal(getattr(kept.schedule, name), getattr(fresh.schedule, name)), name
    assert kept.schedule.paths == fresh.schedule.paths


EDGES = [
    ("space before an id", lambda lines: [lines[0].replace("SITE,", " SITE,", 1)] + lines[1:]),
    ("tab after a name", lambda lines: [lines[0].replace("Site survey", "Site survey\t", 1)] + lines[1:]),
    ("spaces round a number", lambda lines: [lines[0].replace(",2,", ", 2 ,", 1)] + lines[1:]),
    ("formula guard in the first row", lambda lines: [lines[0].replace("Site survey", "'=Site survey", 1)] + lines[1:]),
    ("formula guard in the last row", lambda lines: lines[:-1] + [lines[-1].replace("Handover", "'+Handover", 1)]),
]


@pytest.mark.parametrize("label, edit", EDGES, ids=[e[0] for e in EDGES])
def test_cells_with_spaces_or_guards_read_alike(tmp_path, monkeypatch, label, edit):
    path = write(tmp_path, edit(list(CLEAN)))
    assert outcome(path) == row_reader_outcome(path, monkeypatch)
