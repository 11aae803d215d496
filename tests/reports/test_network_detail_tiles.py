"""The pack's Network detail pages: each page draws its own boxes whole, no page is
left with a stray box when its neighbours could share, and boxes show dates."""

import datetime as dt
import re

import numpy as np
import pytest
from pypdf import PdfReader

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.core.demo import demo_plan
from workbench.figures.network_layout import layout_plan
from workbench.reports.network_pages import DETAIL_NOTE_SPACE, HEADING_SPACE, cuts, detail_scale, tiles
from workbench.reports.pack import build_pack

PAGE = (770.0, 449.0 - HEADING_SPACE - DETAIL_NOTE_SPACE)     # an A4 landscape frame


def _layered(n, width, seed):
    """A random layered plan: ``width`` activities a layer, 1-3 links from the layer before."""
    rng = np.random.default_rng(seed)
    ids = [f"N{i}" for i in range(n)]
    acts = [Activity(i, optimistic=m * 0.8, most_likely=m, pessimistic=m * 1.6)
            for i, m in zip(ids, rng.uniform(1, 20, n).round(1))]
    links = set()
    for j in range(width, n):
        lo = (j // width - 1) * width
        for i in rng.choice(np.arange(lo, lo + width), size=rng.integers(1, 4), replace=False):
            links.add((ids[int(i)], ids[j]))
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, [Link(a, b) for a, b in sorted(links)])


def _views(plan):
    layout = layout_plan(plan, analyze(plan))
    return layout, tiles(layout, *PAGE, detail_scale(layout, PAGE[1]))


@pytest.mark.parametrize("plan", [demo_plan(), _layered(60, 6, 1), _layered(200, 12, 2)],
                         ids=["demo", "layered-60", "layered-200"])
def test_every_box_is_drawn_whole_on_exactly_one_page_that_fits_the_paper(plan):
    layout, views = _views(plan)
    owners = [0] * len(layout.boxes)
    for v in views:
        assert v.w * v.scale <= PAGE[0] + 1e-6 and v.h * v.scale <= PAGE[1] + 1e-6
        for row in v.rows:
            x, y, w, h = layout.boxes[row]
            assert v.x0 <= x and x + w <= v.x0 + v.w and v.y0 <= y and y + h <= v.y0 + v.h
            owners[row] += 1
    assert owners == [1] * len(layout.boxes)


@pytest.mark.parametrize("plan", [demo_plan(), _layered(60, 6, 1)], ids=["demo", "layered-60"])
def test_no_page_is_left_nearly_empty(plan):
    layout, views = _views(plan)
    average = len(layout.boxes) / len(views)
    assert min(len(v.rows) for v in views) >= max(2, average / 4)


def test_cuts_fall_in_gaps_and_share_the_length_evenly():
    starts, ends = np.array([0, 30, 60, 90]), np.array([20, 50, 80, 110])
    windows = cuts(starts, ends, 0, 110, 70)
    assert windows == [(0, 55.0), (55.0, 110)]           # not 0-85 and a sliver of 85-110
    for a, b in windows:
        assert not any(s < a < e or s < b < e for s, e in zip(starts, ends))


def test_detail_pages_show_dates_and_no_offsets(tmp_path):
    plan = demo_plan()
    path = tmp_path / "pack.pdf"
    build_pack(plan, str(path), iterations=0, generated_at=dt.datetime(2027, 2, 1, tzinfo=dt.timezone.utc))
    reader = PdfReader(str(path))
    pages = [p.extract_text() for p in reader.pages]
    details = [t for t in pages if "Network, detail" in t]
    assert details
    a = analyze(plan)
    i = a.schedule.index("A1")
    es = a.dates()["early_start"][i].astype(dt.date)
    assert any(f"{es.day} {es:%b}" in t for t in details)              # A1's early start, a date
    for text in details:
        assert not re.search(r"\b(ES|EF|LS|LF)\s+-?\d", text), text          # an offset, not a date
        assert re.search(r"detail \d+ of \d+: \w{3} \d{1,2} \w{3} \d{4} to", text)
