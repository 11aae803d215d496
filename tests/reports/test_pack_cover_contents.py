"""The cover lists what the pack holds (its own sections, in order), and for a plan with
crews it says beside the headline what the crews do to the odds — the same sentence and
run as the Resources pages."""

import datetime as dt

from pypdf import PdfReader

from workbench.core import montecarlo
from workbench.core.demo import demo_plan
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.montecarlo import simulate
from workbench.core.resource_odds import ResourceOdds
from workbench.reports.pack import build_pack


def page_text(path, k=0) -> str:
    return " ".join(PdfReader(str(path)).pages[k].extract_text().split())


def contents_line(text: str) -> str:
    return text.split("Contents", 1)[1].split("Sign-off", 1)[0].strip()


def test_the_demo_cover_lists_every_section_and_the_crews(tmp_path, monkeypatch):
    calls = []
    real = montecarlo.simulate

    def counted(plan, *args, **kwargs):
        calls.append(kwargs.get("resources", False))
        return real(plan, *args, **kwargs)

    monkeypatch.setattr(montecarlo, "simulate", counted)
    plan = demo_plan()
    sim = real(plan, 2000, seed=5)
    build_pack(plan, tmp_path / "pack.pdf", simulation=sim)
    text = page_text(tmp_path / "pack.pdf")
    assert contents_line(text) == ("Summary \u00b7 Checkup \u00b7 Timeline \u00b7 Network \u00b7 Odds \u00b7 S-curve "
                                   "\u00b7 Drivers \u00b7 Resources \u00b7 Trade-off \u00b7 Activities "
                                   "\u00b7 Assumptions and cautions")
    assert calls.count(True) == 1                      # the crews' run is made once for cover and pages
    crews = ResourceOdds(sim, real(plan, sim.iterations, sim.seed, resources=True))
    sentence = crews.sentence(float(plan.settings.target_confidence))
    assert f"With the crews: {sentence[:1].lower()}{sentence[1:]}" in text
    everything = " ".join(page_text(tmp_path / "pack.pdf", k) for k in range(len(PdfReader(str(tmp_path / "pack.pdf")).pages)))
    assert everything.count(sentence[1:]) == 2         # on the cover and on the Resources page


def test_a_plain_plan_lists_no_resources_or_trade_off(tmp_path):
    acts = [Activity("A", optimistic=2, most_likely=3, pessimistic=6), Activity("B", duration=4)]
    plan = Plan(Settings(title="Plain", start=dt.date(2027, 3, 1), deadline=20.0), acts, [Link("A", "B")])
    build_pack(plan, tmp_path / "pack.pdf", simulation=simulate(plan, 500, seed=1))
    line = contents_line(page_text(tmp_path / "pack.pdf"))
    assert "Resources" not in line and "Trade-off" not in line and line.startswith("Summary \u00b7 Checkup")
    assert "With the crews" not in page_text(tmp_path / "pack.pdf")
