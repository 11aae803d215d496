"""Label placement: a placed label never covers another, a fixed obstacle or a curve,
and stays inside the plot; a label with no free place is left out (None)."""

import numpy as np
from hypothesis import given, strategies as st

from workbench.figures import label_place as lp


def _dense(xs, ys, step=0.25):
    """Points every ``step`` pixels along a polyline: a brute-force stand-in for the curve."""
    out = []
    for x0, y0, x1, y1 in zip(xs[:-1], ys[:-1], xs[1:], ys[1:]):
        n = max(2, int(np.hypot(x1 - x0, y1 - y0) / step) + 2)
        t = np.linspace(0.0, 1.0, n)
        out.append(np.column_stack([x0 + (x1 - x0) * t, y0 + (y1 - y0) * t]))
    return np.vstack(out)


def _hits_by_sampling(rect, xs, ys) -> bool:
    pts = _dense(xs, ys)
    return bool(np.any((pts[:, 0] >= rect[0]) & (pts[:, 0] <= rect[2]) & (pts[:, 1] >= rect[1]) & (pts[:, 1] <= rect[3])))


coords = st.floats(0, 200, allow_nan=False)


@given(st.lists(st.tuples(coords, coords), min_size=2, max_size=12), coords, coords,
       st.floats(2, 60), st.floats(2, 40))
def test_curve_meets_agrees_with_dense_sampling(points, x, y, w, h):
    xs, ys = np.array(points).T
    rect = (x, y, x + w, y + h)
    sampled = _hits_by_sampling(rect, xs, ys)
    exact = lp.curve_meets(rect, xs, ys)
    if sampled:
        assert exact                      # sampling found a point inside: so must the exact test
    if exact and not sampled:             # only a sliver thinner than the sampling step may differ
        grown = (rect[0] - 0.5, rect[1] - 0.5, rect[2] + 0.5, rect[3] + 0.5)
        assert _hits_by_sampling(grown, xs, ys)


def test_a_histogram_step_counts_as_a_line():
    xs, ys = np.array([0.0, 50.0, 50.0, 100.0]), np.array([80.0, 80.0, 10.0, 10.0])   # an upright step at x=50
    assert lp.curve_meets((45, 30, 55, 40), xs, ys)
    assert not lp.curve_meets((60, 30, 90, 40), xs, ys)


@given(st.lists(st.tuples(coords, coords, st.floats(10, 80), st.floats(8, 20)), min_size=1, max_size=15),
       st.lists(st.tuples(coords, coords), min_size=2, max_size=10), st.lists(coords, max_size=4))
def test_placed_labels_touch_nothing_and_stay_inside(points, curve, verticals):
    bounds = (0.0, 0.0, 260.0, 220.0)
    obstacles = lp.Obstacles()
    xs, ys = np.array(curve).T
    obstacles.curve(xs, ys)
    for x in verticals:
        obstacles.vertical_line(x, 0.0, 220.0)
    candidates = [lp.around_point(x, y, w, h) for x, y, w, h in points]
    chosen = lp.place(candidates, bounds, obstacles)
    placed = [c[k] for c, k in zip(candidates, chosen) if k is not None]
    for i, rect in enumerate(placed):
        assert lp.inside(rect, bounds)
        assert not _hits_by_sampling(rect, xs, ys)
        assert not any(lp.rects_meet(rect, line) for line in obstacles.rects)
        assert not any(lp.rects_meet(rect, other) for other in placed[i + 1:])


def test_a_label_with_no_room_is_left_out_and_the_next_still_placed():
    bounds = (0.0, 0.0, 100.0, 40.0)
    obstacles = lp.Obstacles()
    chosen = lp.place([lp.around_point(50, 20, 300, 12), lp.around_point(20, 10, 20, 8)], bounds, obstacles)
    assert chosen[0] is None and chosen[1] is not None


def test_beside_line_tries_both_sides_from_the_top_down():
    options = lp.beside_line(100, 0, 200, 40, 10, steps=3, left_first=True)
    assert options[0][2] < 100 < options[1][0]          # left, then right
    assert options[0][1] < options[2][1] < options[4][1]
