"""The pack's Trade-off page: present with cost data (curve, options, the applied option),
absent without; its numbers agree with the core."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from pypdf import PdfReader

from support.plans import footbridge_plan
from workbench.core.demo import demo_plan
from workbench.io.planfile import load_plan
from workbench.reports.pack import build_pack

WHEN = dt.datetime(2027, 2, 23, 9, 30, tzinfo=dt.timezone.utc)
SAMPLE = Path(__file__).resolve().parents[1] / "data" / "clinic_costs_v3.slw"


def _pack(plan, tmp_path):
    path = tmp_path / "pack.pdf"
    build_pack(plan, path, iterations=0, generated_at=WHEN)
    reader = PdfReader(str(path))
    titles = {item.title: reader.get_destination_page_number(item) for item in reader.outline}
    return reader, titles


def test_page_with_cost_data(tmp_path):
    reader, titles = _pack(demo_plan(), tmp_path)
    assert "Trade-off" in titles
    text = " ".join(reader.pages[titles["Trade-off"]].extract_text().split())      # cells wrap
    for phrase in ("what it costs to buy time", "mean-schedule plan: crash the mean to the deadline", "90 % plan",
                   "No trade-off option has been applied", "decision rests with"):
        assert phrase in text, phrase


def test_applied_option_is_named(tmp_path):
    plan = load_plan(SAMPLE)
    reader, titles = _pack(plan, tmp_path)
    text = reader.pages[titles["Trade-off"]].extract_text()
    b = plan.settings.bought
    assert f"Applied option: {b.label}" in text and f"{b.cost:,.0f} extra" in text


def test_no_page_without_cost_data(tmp_path):
    _, titles = _pack(footbridge_plan(), tmp_path)
    assert "Trade-off" not in titles


def test_chances_read_as_in_the_window(tmp_path):
    """'53.0 % ± 1.2 points', as the Trade-off view and the Odds pages write a chance."""
    import re
    reader, titles = _pack(load_plan(SAMPLE), tmp_path)
    text = " ".join(reader.pages[titles["Trade-off"]].extract_text().split())
    found = re.findall(r"\d+(?:\.\d)?\s?% \u00b1 \d+(?:\.\d)?\s?(?:%|points)", text)
    assert len(found) >= 4, text                        # textbook, 50/80/90 % plans, the applied option
    assert all(re.fullmatch(r"\d+(\.\d)? % \u00b1 \d+(\.\d)? points", f) for f in found), found
