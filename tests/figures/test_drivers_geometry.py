"""Drivers geometry (Qt-free): ranking, folding, tornado rectangles."""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from workbench.figures import drivers as fd


def test_folding_keeps_top_n_in_order():
    ids = list("ABCDEFG")
    vals = [0.1, 0.9, 0.5, 0.0, 0.7, 0.3, 0.2]
    bars = fd.ranked(ids, ids, vals, top=3)
    assert [b.act_id for b in bars[:3]] == ["B", "E", "C"]
    assert bars[3].is_folded and bars[3].label == "4 others" and bars[3].folded == 4
    assert bars[3].value == 0.3  # the largest of the rest
    assert len(bars) == 4


def test_single_leftover_is_not_folded():
    bars = fd.ranked(list("ABC"), list("ABC"), [0.2, 0.1, 0.3], top=2)
    assert [b.act_id for b in bars] == ["C", "A", "B"] and not any(b.is_folded for b in bars)


def test_tornado_orders_by_magnitude_and_signs_sides():
    ids = list("ABCD")
    bars = fd.ranked(ids, ids, [0.2, -0.8, 0.5, np.nan], top=10, magnitude=True)
    assert [b.act_id for b in bars] == ["B", "C", "A", "D"]
    assert bars[-1].value == 0.0  # a never-varying activity counts as zero
    rects = fd.bar_rects(bars)
    assert (rects[0].x0, rects[0].x1) == (-0.8, 0.0)
    assert (rects[1].x0, rects[1].x1) == (0.0, 0.5)
    assert [r.y for r in rects] == [0.0, -1.0, -2.0, -3.0]
    lo, hi = fd.value_span(bars, signed=True)
    assert lo < -0.8 and hi > 0.8 and lo == -hi


@settings(max_examples=80, deadline=None)
@given(vals=st.lists(st.floats(-1, 1), min_size=1, max_size=40), top=st.integers(1, 15),
       magnitude=st.booleans())
def test_folding_property(vals, top, magnitude):
    ids = [f"A{i}" for i in range(len(vals))]
    bars = fd.ranked(ids, ids, vals, top=top, magnitude=magnitude)
    key = (lambda v: abs(v)) if magnitude else (lambda v: v)
    kept = [b for b in bars if not b.is_folded]
    # the top rows are in order and no folded value beats a kept one
    assert all(key(a.value) >= key(b.value) for a, b in zip(kept, kept[1:]))
    represented = len(kept) + sum(b.folded for b in bars if b.is_folded)
    assert represented == len(vals)
    if any(b.is_folded for b in bars):
        assert len(kept) == top and bars[-1].is_folded
        assert key(bars[-1].value) <= key(kept[-1].value)
        rest = sorted((key(v) for i, v in enumerate(vals) if ids[i] not in {b.act_id for b in kept}))
        assert key(bars[-1].value) == pytest.approx(rest[-1])


def test_row_at_maps_y_to_rows():
    bars = fd.ranked(list("AB"), list("AB"), [0.5, 0.2], top=5)
    assert fd.row_at(bars, 0.2) == 0 and fd.row_at(bars, -1.3) == 1 and fd.row_at(bars, -2.6) is None


@pytest.mark.parametrize("values, side", [([0.36, 0.2, 0.05], "right"), ([-0.4, -0.1], "left"),
                                          ([0.3, -0.2], "both")])
def test_tornado_span_leaves_no_empty_half(values, side):
    bars = fd.ranked(list("ABC")[:len(values)], list("ABC")[:len(values)], values, top=10, magnitude=True)
    lo, hi = fd.value_span(bars, signed=True)
    assert lo < 0 < hi                                           # the zero line always shows
    assert lo <= min(values) and hi >= max(values)
    if side == "right":
        assert -lo < 0.1 * hi
    elif side == "left":
        assert hi < 0.1 * -lo
    else:
        assert lo == -hi
