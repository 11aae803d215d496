"""The approval pack prints names in the planners' own scripts: embedded Unicode fonts with
a fallback, right-to-left text in reading order, read back from the PDF (issue 20, item 18).
Names are invented."""

from __future__ import annotations

import datetime as dt
import re
import unicodedata

import pytest
from pypdf import PdfReader

from workbench.core.model import Activity, Link, Plan, Settings
from workbench.reports import fonts
from workbench.reports.pack import build_pack

LEFT_TO_RIGHT = {
    "GR": "Σκυροδέτηση πλάκας",          # Greek
    "RU": "Монтаж опалубки",             # Cyrillic
    "PL": "Zbrojenie ścian żelbetowych",  # Polish
    "ZH": "浇筑混凝土",                    # Chinese (fallback font)
    "JA": "型枠の組立て",                  # Japanese kana and kanji (fallback font)
}
RIGHT_TO_LEFT = {
    "HE": "יציקת בטון",                   # Hebrew
    "AR": "صب الخرسانة",                  # Arabic (joined letter forms)
}
WHEN = dt.datetime(2027, 3, 1, 8, 0, tzinfo=dt.timezone.utc)


@pytest.fixture(scope="module")
def pack_text(tmp_path_factory):
    names = {**LEFT_TO_RIGHT, **RIGHT_TO_LEFT, "KO": "콘크리트 타설"}
    ids = list(names)
    acts = [Activity(i, names[i], optimistic=1, most_likely=2, pessimistic=3) for i in ids]
    links = [Link(a, b) for a, b in zip(ids, ids[1:])]
    plan = Plan(Settings(title="Ωμέγα 工程 – مرفأ", start=dt.date(2027, 3, 1)), acts, links)
    path = tmp_path_factory.mktemp("scripts") / "pack.pdf"
    build_pack(plan, path, iterations=0, generated_at=WHEN)
    reader = PdfReader(str(path))
    found = {item.title: reader.get_destination_page_number(item) for item in reader.outline}
    table = range(found["Activities"], found["Assumptions and cautions"])
    return reader.pages[0].extract_text(), "\n".join(reader.pages[p].extract_text() for p in table)


@pytest.mark.parametrize("act_id", sorted(LEFT_TO_RIGHT))
def test_left_to_right_names_read_back_as_typed(pack_text, act_id):
    assert LEFT_TO_RIGHT[act_id] in pack_text[1]


@pytest.mark.parametrize("act_id", sorted(RIGHT_TO_LEFT))
def test_right_to_left_names_read_back_as_typed(pack_text, act_id):
    """pypdf returns right-to-left text in reading order; Arabic comes back in its joined
    presentation forms, which NFKC maps to the letters typed."""
    assert RIGHT_TO_LEFT[act_id] in unicodedata.normalize("NFKC", pack_text[1])


@pytest.mark.parametrize("logical, drawn", [("יציקת בטון", "ןוטב תקיצי"), ("Bay 3 שלב", "Bay 3 בלש"),
                                            ("ab", "ab")])
def test_right_to_left_text_is_drawn_in_reverse(logical, drawn):
    """A PDF draws glyphs left to right, so right-to-left runs are handed over reversed
    (the Unicode bidirectional algorithm; left-to-right runs inside keep their order)."""
    assert fonts.visual(logical) == drawn


def test_arabic_is_drawn_joined_and_reversed():
    drawn = fonts.visual("صب")
    assert all("\ufe70" <= ch <= "\ufeff" for ch in drawn)          # presentation forms B
    assert unicodedata.normalize("NFKC", drawn[::-1]) == "صب"


def test_arabic_letters_take_their_joined_forms(pack_text):
    assert re.search("[\ufe70-\ufeff]", pack_text[1])       # Arabic presentation forms B


def test_the_title_mixes_scripts_on_the_cover(pack_text):
    assert "Ωμέγα 工程" in pack_text[0]


def test_a_script_no_bundled_font_holds_prints_the_replacement_mark(pack_text):
    assert "\ufffd" in pack_text[1] and "콘크리트" not in pack_text[1]


def test_the_pack_never_prints_question_marks_for_covered_scripts(pack_text):
    for name in LEFT_TO_RIGHT.values():
        assert "?" not in name
    assert "??" not in pack_text[1]


def test_fallback_runs_switch_font_only_where_needed():
    assert fonts.runs("Crane lift \U0001F600") == [("Crane lift \U0001F600", fonts.FONT)]   # DejaVu has it
    assert fonts.runs("Slab 浇筑 B2") == [("Slab ", fonts.FONT), ("浇筑", fonts.FALLBACK), (" B2", fonts.FONT)]
    assert fonts.runs("Plain text") == [("Plain text", fonts.FONT)]


def test_a_canvas_that_lays_out_text_itself_gets_it_in_drawn_order_kept():
    """The Present slides draw the pack's painters through Qt, which applies the
    bidirectional algorithm itself: reordered text is marked to stay as it stands."""
    drawn = []

    class LaysOutItself:
        def drawString(self, x, y, text):  # noqa: N802 (reportlab's name)
            drawn.append(text)

    fonts.draw(LaysOutItself(), 0, 0, fonts.visual("יציקת"))
    fonts.draw(LaysOutItself(), 0, 0, "Pour slab")
    assert drawn == ["\u202dתקיצי\u202c", "Pour slab"]
