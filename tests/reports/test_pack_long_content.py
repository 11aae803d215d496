"""Long content in the approval pack flows over pages instead of crashing it: a long
critical path, long cover texts, huge names, plans too large to print in full
(issue 20, items 1, 9 and 11). Plans are invented."""

from __future__ import annotations

import datetime as dt
import re

import pytest
from pypdf import PdfReader

from workbench.core.model import TEXT_LIMITS, Activity, Link, Plan, Settings, SignOff
from workbench.core.errors import PlanError
from workbench.reports import fonts, limits, tables
from workbench.reports.pack import build_pack

WHEN = dt.datetime(2027, 3, 1, 8, 0, tzinfo=dt.timezone.utc)


def _chain(n: int, name=lambda i: f"Pour bay {i}", **settings) -> Plan:
    acts = [Activity(f"B{i}", name(i), optimistic=1, most_likely=2, pessimistic=4) for i in range(n)]
    links = [Link(f"B{i}", f"B{i + 1}") for i in range(n - 1)]
    return Plan(Settings(title="Quay wall", start=dt.date(2027, 3, 1), **settings), acts, links)


def _pack(plan, tmp_path, name="pack.pdf"):
    path = tmp_path / name
    info = build_pack(plan, path, iterations=0, generated_at=WHEN)
    return info, PdfReader(str(path))


def _sections(reader) -> dict[str, int]:
    return {item.title: reader.get_destination_page_number(item) for item in reader.outline}


def test_a_2000_activity_critical_path_flows_over_pages_in_order(tmp_path):
    plan = _chain(2000)
    _, reader = _pack(plan, tmp_path)
    found = _sections(reader)
    first = found["Critical path in full"]
    text = " ".join(reader.pages[p].extract_text() for p in range(first, len(reader.pages)))
    listed = re.findall(r"\bB\d+\b", text)
    assert listed == [f"B{i}" for i in range(2000)]          # all of it, once, in order
    assert len(reader.pages) - first >= 2                   # continued on a next page
    summary = re.sub(r"\s+", " ", reader.pages[found["Summary"]].extract_text())
    assert "2,000 activities" in summary and "Critical path in full" in summary


def test_a_path_with_the_longest_ids_fits_the_odds_side_panel(tmp_path):
    ids = lambda i: f"{'Q' * 34}{i:05d}"                    # 39 characters, near the id limit
    acts = [Activity(ids(i), "x", optimistic=1, most_likely=2, pessimistic=3) for i in range(160)]
    links = [Link(ids(i), ids(i + 1)) for i in range(159)]
    info, reader = _pack(Plan(Settings(title="t", start=dt.date(2027, 3, 1)), acts, links), tmp_path)
    assert info.pages == len(reader.pages)


def test_long_cover_texts_are_shortened_with_an_ellipsis(tmp_path):
    settings = dict(revision="R" * TEXT_LIMITS["revision"], prepared_by="Planning office " * 12,
                    sign_off=[SignOff("N" * 200, "Role " * 40)])
    plan = _chain(3, **settings)
    plan.settings.title = "Quay wall " * 30
    _, reader = _pack(plan, tmp_path)
    cover = reader.pages[0].extract_text()
    assert "..." in cover
    assert "Planning office" in cover


def test_text_past_the_entry_limits_is_refused_at_entry_naming_the_field():
    from workbench.core.commands import AddActivity, SetSettings, settings_with
    plan = _chain(3)
    with pytest.raises(PlanError, match="prepared by"):
        SetSettings(settings_with(plan.settings, prepared_by="x" * (TEXT_LIMITS["prepared by"] + 1))).do(plan)
    with pytest.raises(PlanError, match="revision"):
        SetSettings(settings_with(plan.settings, revision="x" * (TEXT_LIMITS["revision"] + 1))).do(plan)
    with pytest.raises(PlanError) as err:
        AddActivity(Activity("K1", "n" * (TEXT_LIMITS["name"] + 1), duration=1)).do(plan)
    assert err.value.culprit == "K1" and "name" in str(err.value)


def test_fitting_a_huge_name_measures_only_a_few_times(monkeypatch):
    calls = []
    real = fonts.width
    monkeypatch.setattr(fonts, "width", lambda *a: calls.append(len(a[0])) or real(*a))
    out = tables.fit("w" * 1_000_000, 120.0)
    assert out.endswith("...") and len(out) < 60
    assert len(calls) <= 12 and max(calls) < 1300          # bisection over a bounded head


def test_fit_keeps_the_longest_head_that_fits():
    text = "Excavate and shore the eastern trench"
    for width in (30.0, 60.0, 90.0, 500.0):
        out = tables.fit(text, width)
        assert fonts.width(out, tables.styles.FONT, tables.FONT_SIZE) <= width
        if out != text:
            cut = len(out) - 3
            while text[cut] == " ":                           # fit() drops trailing spaces
                cut += 1
            longer = text[:cut + 1] + "..."
            assert fonts.width(longer, tables.styles.FONT, tables.FONT_SIZE) > width


def test_a_plan_too_large_to_print_in_full_is_summarised_and_says_so(tmp_path, monkeypatch):
    monkeypatch.setattr(limits, "TABLE_ROWS", 60)
    monkeypatch.setattr(limits, "TIMELINE_PAGES", 2)
    monkeypatch.setattr(limits, "NETWORK_ACTIVITIES", 50)
    plan = _chain(60)
    plan = Plan(plan.settings, list(plan.activities) + [Activity(f"S{i}", "spare", duration=1) for i in range(60)],
                plan.links)
    _, reader = _pack(plan, tmp_path)
    found = _sections(reader)
    assert found["Network"] - found["Timeline"] == 2
    table = " ".join(reader.pages[p].extract_text() for p in range(found["Activities"], found["Assumptions and cautions"]))
    assert "120 activities" in table and "least total float" in table
    assert "B59" in table and "S0 " not in table            # the critical chain first, spare work left out
    network = reader.pages[found["Network"]].extract_text()
    assert "none is printed" in network


def test_a_span_of_a_million_days_takes_a_few_timeline_pages(tmp_path):
    plan = Plan(Settings(title="Long", start=dt.date(2027, 3, 1)), [Activity("X", "Very long", duration=1_000_000.0)])
    _, reader = _pack(plan, tmp_path)
    found = _sections(reader)
    assert found["Network"] - found["Timeline"] <= limits.TIMELINE_WINDOWS


def test_too_many_network_detail_pages_keep_the_critical_ones_and_say_so(tmp_path, monkeypatch):
    monkeypatch.setattr(limits, "NETWORK_DETAIL_PAGES", 2)
    plan = _chain(150)
    _, reader = _pack(plan, tmp_path)
    found = _sections(reader)
    overview = re.sub(r"\s+", " ", reader.pages[found["Network"]].extract_text())
    assert "the 2 detail pages that follow show the critical path's boxes only" in overview
    assert found["Odds"] - found["Network"] == 3
