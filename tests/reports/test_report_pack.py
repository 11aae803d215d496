"""The approval pack as a reader gets it: sections, numbers, vector charts, footer,
determinism and clear errors. Plans are invented (tests/test_report_plans.py)."""

from __future__ import annotations

import datetime as dt
import re
from dataclasses import replace

import pytest
from pypdf import PdfReader

from support.plans import footbridge_plan, long_plan
from workbench.core.analysis import analyze
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.formatting import format_date
from workbench.figures.odds import format_probability
from workbench.io.planfile import plan_hash
from workbench.reports.pack import build_pack

WHEN = dt.datetime(2027, 2, 23, 9, 30, tzinfo=dt.timezone.utc)
SECTIONS = ["Cover", "Summary", "Checkup", "Timeline", "Network", "Odds", "S-curve", "Drivers", "Activities",
            "Assumptions and cautions"]


def _build(plan, tmp_path, name="pack.pdf", **kw):
    kw.setdefault("iterations", 0)
    kw.setdefault("generated_at", WHEN)
    path = tmp_path / name
    info = build_pack(plan, path, **kw)
    return info, PdfReader(str(path)), path


def _sections(reader) -> dict[str, int]:
    return {item.title: reader.get_destination_page_number(item) for item in reader.outline}


def _text(reader, page: int) -> str:
    return reader.pages[page].extract_text() or ""


@pytest.fixture(scope="module")
def pack(tmp_path_factory):
    return _build(footbridge_plan(), tmp_path_factory.mktemp("pack"), plan_path="/plans/footbridge.slw")


def test_pack_has_every_section_in_order(pack):
    info, reader, _ = pack
    found = _sections(reader)
    assert list(found) == SECTIONS
    assert list(found.values()) == sorted(found.values())
    assert info.pages == len(reader.pages)


def test_text_pages_portrait_and_chart_pages_landscape(pack):
    _, reader, _ = pack
    found = _sections(reader)
    for name, page in found.items():
        box = reader.pages[page].mediabox
        landscape = float(box.width) > float(box.height)
        assert landscape == (name in ("Timeline", "Network", "Odds", "S-curve", "Drivers", "Activities")), name


def test_summary_shows_title_critical_path_and_screen_probability(pack):
    _, reader, _ = pack
    plan = footbridge_plan()
    analysis = analyze(plan)
    cover = _text(reader, 0)
    summary = _text(reader, _sections(reader)["Summary"])
    assert plan.settings.title in cover
    assert "Ada Marsh" in cover and "Project sponsor" in cover and "Signature" in cover
    path_line = " \u2013 ".join(analysis.pert.path)
    assert path_line in summary
    assert format_probability(analysis.probability_by_deadline()) in summary
    assert format_date(analysis.finish_date) in summary


def test_chart_pages_are_vector_without_images(pack):
    _, reader, _ = pack
    found = _sections(reader)
    chart_pages = range(found["Timeline"], found["Drivers"])   # no simulation: no drivers chart
    for number in chart_pages:
        page = reader.pages[number]
        ops = page.get_contents().get_data().decode("latin-1")
        drawing = re.findall(r"(?<=\s)(?:m|l|c|re)(?=\s)", ops)   # path operators: move, line, curve, rect
        assert len(drawing) >= 30, (number, len(drawing))
        assert re.search(r"(?<=\s)[SfB]\*?(?=\s)", ops), number       # and paths actually painted
        xobjects = page["/Resources"].get("/XObject", {})
        images = [k for k, v in xobjects.items() if v.get_object().get("/Subtype") == "/Image"]
        assert not images, number


def test_footer_on_every_page(pack):
    info, reader, _ = pack
    total = len(reader.pages)
    for number in range(total):
        text = _text(reader, number)
        assert re.search(rf"Page {number + 1} of\s+{total}\b", text), number   # the total is a form
        assert "footbridge.slw" in text
        assert info.hash in text and "Slackline" in text and "Tue 23 Feb 2027 09:30" in text
    assert info.hash == plan_hash(footbridge_plan())


def test_same_plan_and_time_give_identical_bytes(tmp_path):
    _, _, first = _build(footbridge_plan(), tmp_path, "a.pdf")
    _, _, second = _build(footbridge_plan(), tmp_path, "b.pdf")
    assert first.read_bytes() == second.read_bytes()
    _, _, later = _build(footbridge_plan(), tmp_path, "c.pdf", generated_at=WHEN + dt.timedelta(hours=1))
    assert later.read_bytes() != first.read_bytes()


def test_changed_plan_changes_hash_in_footer(tmp_path):
    info_a, _, _ = _build(footbridge_plan(), tmp_path, "a.pdf")
    edited = footbridge_plan()
    edited.replace_activity("W3", edited.activity("W3").with_(most_likely=13))
    info_b, reader, _ = _build(edited, tmp_path, "b.pdf")
    assert info_a.hash != info_b.hash
    assert info_b.hash in _text(reader, 0)


def test_long_plan_tiles_timeline_with_labels_and_axis_on_every_page(tmp_path):
    plan = long_plan(150)
    _, reader, _ = _build(plan, tmp_path)
    found = _sections(reader)
    timeline = range(found["Timeline"], found["Network"])
    assert len(timeline) > 1
    seen = set()
    for number in timeline:
        text = _text(reader, number)
        ids = set(re.findall(r"\bA\d+\b", text))
        assert ids, number                                   # row labels on every tile
        assert re.search(r"\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b", text), number
        seen |= ids
    assert seen == set(plan.ids())


def test_activity_table_header_repeats_on_every_page(tmp_path):
    plan = long_plan(150)
    _, reader, _ = _build(plan, tmp_path)
    found = _sections(reader)
    pages = range(found["Activities"], found["Assumptions and cautions"])
    assert len(pages) >= 2
    for number in pages:
        text = _text(reader, number)
        assert all(h in text for h in ("ES", "EF", "LS", "LF", "Total", "Free")), number
    rows = "".join(_text(reader, n) for n in pages)
    assert all(re.search(rf"\b{i}\b", rows) for i in plan.ids())


def test_paper_sizes(tmp_path):
    _, letter, _ = _build(footbridge_plan(), tmp_path, "l.pdf", paper="letter")
    box = letter.pages[0].mediabox
    assert (round(float(box.width)), round(float(box.height))) == (612, 792)
    _, a4, _ = _build(footbridge_plan(), tmp_path, "a.pdf", paper="a4")
    box = a4.pages[0].mediabox
    assert (round(float(box.width)), round(float(box.height))) == (595, 842)


@pytest.mark.parametrize("kw, words", [
    ({"paper": "a3"}, "paper"),
    ({"iterations": -5}, "iterations"),
    ({"iterations": 10, "seed": -1}, "seed"),
])
def test_bad_options_raise_plan_error(tmp_path, kw, words):
    with pytest.raises(PlanError, match=words):
        build_pack(footbridge_plan(), tmp_path / "x.pdf", **kw)
    assert not (tmp_path / "x.pdf").exists()


def test_bad_plans_raise_plan_error(tmp_path):
    with pytest.raises(PlanError, match="no activities"):
        build_pack(Plan(Settings(title="Empty")), tmp_path / "x.pdf", iterations=0)
    loop = Plan(Settings(title="Loop"), [Activity("A", duration=1), Activity("B", duration=2)],
                [Link("A", "B"), Link("B", "A")])
    with pytest.raises(PlanError, match="loop"):
        build_pack(loop, tmp_path / "x.pdf", iterations=0)


def test_unwritable_target_is_a_plan_error_and_keeps_old_file(tmp_path, monkeypatch):
    with pytest.raises(PlanError, match="cannot write the pack"):
        build_pack(footbridge_plan(), tmp_path / "missing" / "x.pdf", iterations=0)
    with pytest.raises(PlanError, match="cannot write the pack"):
        build_pack(footbridge_plan(), tmp_path, iterations=0)      # a folder, not a file
    target = tmp_path / "old.pdf"
    target.write_bytes(b"previous pack")

    def refuse(src, dst):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr("workbench.reports.pack.os.replace", refuse)
    with pytest.raises(PlanError, match="No space left"):
        build_pack(footbridge_plan(), target, iterations=0)
    assert target.read_bytes() == b"previous pack"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["old.pdf"]     # no temporary file left


def test_names_outside_the_pdf_fonts_do_not_break_the_pack(tmp_path):
    plan = footbridge_plan()
    plan.replace_activity("S1", plan.activity("S1").with_(name="Survey \u2192 deck \u6865 \u03c3"))
    _, reader, _ = _build(plan, tmp_path)
    table = "".join(_text(reader, n) for n in range(len(reader.pages)))
    assert "Survey -> deck" in table


def test_progress_reaches_the_end(tmp_path):
    seen = []
    _build(footbridge_plan(), tmp_path, progress=lambda done, total: seen.append((done, total)))
    assert seen and seen[-1] == (100, 100)
    assert [d for d, _ in seen] == sorted(d for d, _ in seen)


def test_network_tiles_show_every_node_whole_somewhere():
    from workbench.figures.network_layout import layout_plan
    from workbench.reports.network_pages import tiles

    plan = long_plan(60)
    layout = layout_plan(plan, analyze(plan))
    views = tiles(layout, 700.0, 400.0, 0.5)
    assert len(views) > 1
    for x, y, w, h in layout.boxes:
        assert any(v.x0 <= x and x + w <= v.x0 + v.w and v.y0 <= y and y + h <= v.y0 + v.h for v in views)


@pytest.mark.parametrize("deadline", [None, 400.0])
def test_activity_table_says_floats_are_measured_to_the_deadline(tmp_path, deadline):
    """With a deadline the critical path can carry float (or negative float): the table
    says where floats are measured to, and leaves it unsaid without a deadline."""
    plan = footbridge_plan()
    plan.set_settings(replace(plan.settings, deadline=deadline))
    _, reader, _ = _build(plan, tmp_path)
    found = _sections(reader)
    text = " ".join(_text(reader, n) for n in range(found["Activities"], found["Assumptions and cautions"]))
    text = re.sub(r"\s+", " ", text)
    assert ("floats are measured to it" in text) == (deadline is not None)


def test_the_pdfs_own_creation_date_is_the_generation_time(pack):
    """A signed pack's file properties agree with its footer (not a fixed placeholder)."""
    _, reader, _ = pack
    assert reader.metadata.creation_date.replace(tzinfo=dt.timezone.utc) == WHEN.replace(second=0)
    assert reader.metadata.modification_date.replace(tzinfo=dt.timezone.utc) == WHEN.replace(second=0)


def test_a_timeline_page_that_starts_inside_a_group_names_it(tmp_path):
    """Groups of 30 rows tiled across pages: a page whose first row belongs to a group
    begun on an earlier page says which group continues there."""
    plan = long_plan(150)
    _, reader, _ = _build(plan, tmp_path)
    found = _sections(reader)
    timeline = range(found["Timeline"], found["Network"])
    continued = [re.search(r"(Stage \d+) \(continued\)", _text(reader, n)) for n in timeline]
    assert continued[0] is None                              # the first page starts with a group row
    mid = [m.group(1) for m in continued[1:] if m]
    assert mid, "no page starts inside a group"
    for number, match in zip(timeline, continued):
        if match:                                            # and it is the group of that page's first row
            ids = [int(i) for i in re.findall(r"\bA(\d+)\b", _text(reader, number))]
            assert match.group(1) == f"Stage {min(ids) // 30}"


def test_network_detail_pages_name_the_boxes_links_lead_to_off_the_page(tmp_path):
    """A link that leaves a detail page ends in a tag with the id of the box it leads to
    ("-> B1"), or starts with the id it comes from ("A4 ->")."""
    from workbench.core.demo import demo_plan
    plan = demo_plan()
    _, reader, _ = _build(plan, tmp_path)
    found = _sections(reader)
    details = [n for n in range(found["Network"] + 1, found["Odds"])]
    assert len(details) >= 2
    links = {(link.pred, link.succ) for link in plan.links}
    tagged = 0
    for number in details:
        text = _text(reader, number)
        ids = set(re.findall(r"\b([A-Z]\d+)\b", text))
        for target in re.findall(r"-> ([A-Z]\d+)", text):
            assert any((p, target) in links for p in ids), (number, target)
            tagged += 1
        for source in re.findall(r"\b([A-Z]\d+) ->", text):
            assert any((source, s) in links for s in ids), (number, source)
            tagged += 1
    assert tagged >= len(details)
