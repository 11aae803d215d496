"""The approval pack's Checkup page: after the summary, every check with a mark in words,
the failing checks with their first offenders, the standard's name and edition."""

from __future__ import annotations

import datetime as dt

import pytest
from pypdf import PdfReader

from workbench.core.checkup import run_checkup
from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.reports.pack import build_pack

WHEN = dt.datetime(2027, 2, 1, 9, 0, tzinfo=dt.timezone.utc)


@pytest.fixture(scope="module")
def pack(tmp_path_factory):
    plan = demo_plan()
    sim = simulate(plan, 2_000, seed=3)
    path = tmp_path_factory.mktemp("pack") / "pack.pdf"
    build_pack(plan, path, simulation=sim, generated_at=WHEN)
    reader = PdfReader(str(path))
    return plan, sim, [p.extract_text() for p in reader.pages], reader


def test_the_checkup_page_follows_the_summary(pack):
    _, _, pages, reader = pack
    found = {o.title: reader.get_destination_page_number(o) for o in reader.outline}
    assert list(found)[:3] == ["Cover", "Summary", "Checkup"] and found["Checkup"] == 2


def test_every_check_with_its_mark_and_the_standard(pack):
    plan, sim, pages, _ = pack
    text = pages[2]
    assert "DCMA 14-point schedule assessment" in text and "DCMA-EA PAM 200.1" in text and "October 2012" in text
    checkup = run_checkup(plan, simulation=sim)
    for check in checkup:
        assert check.name.split(" (")[0] in text
    assert text.count("FAIL") >= len(checkup.failed) and "PASS" in text and "n/a" in text
    assert checkup.summary_text() in text


def test_failing_checks_name_their_first_offenders(pack):
    _, _, pages, _ = pack
    text = " ".join(pages[2:4])
    assert "Failing checks and their first offenders" in text
    assert "O1 Deep clean" in text                      # the lead B6 -> O1
    assert "E2 Manufacture and deliver the X-ray unit" in text     # a long duration
    assert "PERT assumes one path" in text               # the odds caution stays


def test_the_intro_does_not_call_the_demos_resources_check_not_applicable_yet(pack):
    """The demo has crews now: its Resources metric is measured (25 activities without
    resources) and informational, not something the plan lacks; three checks need progress."""
    text = " ".join(pack[2][2].split())
    assert "3 do not apply to this plan yet; Resources is informational only." in text
