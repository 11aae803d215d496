"""Loading chart geometry: the title in plain words (how far over, not "peak 5 of 4"), the
over-allocated steps exactly where core.loading finds the periods (by hand)."""

import numpy as np

from workbench.core.loading import Loading
from workbench.figures.loading import loading_figure


def _load(use, avail, over=()):
    times = np.arange(len(use) + 1, dtype=float)
    return Loading("elec", "Electricians", times, np.append(use, 0.0), np.append(avail, avail[-1]), list(over))


def test_an_over_allocated_resource_says_by_how_much():
    # 0–1: 3 of 4; 1–3: 6 of 4 (over by 2); 3–4: 5 of 4 (over by 1) — by hand
    fig = loading_figure(_load([3.0, 6.0, 6.0, 5.0], [4.0] * 4, [(1.0, 4.0, 6.0, 4.0)]))
    assert fig.title == "Electricians: over-allocated by 2 units (6 in use, 4 available)"
    assert fig.over_mask.tolist()[:4] == [False, True, True, True]


def test_one_unit_over_is_singular_and_a_resource_within_its_units_says_so():
    fig = loading_figure(_load([5.0, 2.0], [4.0, 4.0], [(0.0, 1.0, 5.0, 4.0)]))
    assert fig.title == "Electricians: over-allocated by 1 unit (5 in use, 4 available)"
    fine = loading_figure(_load([3.0, 2.0], [4.0, 4.0]))
    assert fine.title == "Electricians: within its 4 available (peak 3 in use)"
    assert not fine.over_mask.any()


def test_over_is_measured_against_the_units_available_then():
    # availability drops to 1 in the second step: 2 in use there is the excess, not the peak
    fig = loading_figure(_load([3.0, 2.0], [4.0, 1.0], [(1.0, 2.0, 2.0, 1.0)]))
    assert fig.title == "Electricians: over-allocated by 1 unit (2 in use, 1 available)"
