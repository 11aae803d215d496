"""The odds charts say the deadline's date in their legend: the line sits at the end of that
day, where the next working day's tick begins, so the axis alone would suggest a later date."""

import datetime as dt

from pypdf import PdfReader

from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.montecarlo import simulate
from workbench.reports.pack import build_pack


def friday_deadline_plan() -> Plan:
    acts = [Activity("A", optimistic=3, most_likely=5, pessimistic=9), Activity("B", optimistic=2, most_likely=4, pessimistic=8)]
    # Mon 1 Mar 2027 + 10 working days: the deadline is the end of Fri 12 Mar 2027
    return Plan(Settings(title="Deadline legend", start=dt.date(2027, 3, 1), deadline=dt.date(2027, 3, 12)),
                acts, [Link("A", "B")])


def test_the_odds_legends_name_the_deadline_day(tmp_path):
    plan = friday_deadline_plan()
    build_pack(plan, tmp_path / "pack.pdf", simulation=simulate(plan, 2000, seed=5))
    text = " ".join(" ".join(p.extract_text().split()) for p in PdfReader(str(tmp_path / "pack.pdf")).pages)
    assert text.count("Deadline: end of Fri 12 Mar 2027") >= 2          # the density and the S-curve charts
