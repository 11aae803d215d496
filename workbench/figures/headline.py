"""The headline figures of a plan, worded once for the window's summary strip, Present
mode's summary slide and the approval pack's cover, so all three say the same.

Once a simulation is current it leads: its chance of meeting the deadline, its mean
finish and its date at the target confidence, with PERT beside each as the single-path
estimate (PERT follows one path and so is optimistic where paths merge). A simulation
made before the latest change is out of date: PERT (which follows every edit) leads, and
the note says what the old simulation gave and that it should be run again. Without a
simulation PERT leads and the note says how to get one.
"""

from __future__ import annotations

from dataclasses import dataclass

from workbench.core.date_text import show_date

SIMULATION = "simulation"
CAUTION = ("Estimates are judgement; PERT assumes one path and independent durations; the "
           "decision rests with the organisation's own approval rules.")
PERT = "PERT"


@dataclass(frozen=True)
class Figure:
    """One headline figure: a caption, the leading value, and the other method beside it."""

    caption: str
    value: str
    beside: str = ""


@dataclass(frozen=True)
class Headline:
    source: str          # SIMULATION or PERT: which method leads
    stale: bool          # a simulation exists but was made before the latest change
    finish: Figure
    odds: Figure
    target: Figure
    note: str
    caution: str = CAUTION

    def figures(self) -> tuple[Figure, Figure, Figure]:
        return self.finish, self.odds, self.target


def percent(p: float) -> str:
    """A chance as people say it: whole per cents, a decimal only near the ends."""
    if p >= 0.9995:
        return "> 99.9 %"
    if p <= 0.0005:
        return "< 0.1 %"
    return f"{p * 100:.1f} %" if p < 0.1 or p > 0.9 else f"{p * 100:.0f} %"


def confidence_name(q: float) -> str:
    return "P" + f"{100.0 * float(q):.4f}".rstrip("0").rstrip(".")


def _sim_values(analysis, sim, conf: float) -> dict:
    cal = analysis.calendar
    chance = None if analysis.deadline is None else sim.prob_by(analysis.deadline)[0]
    return {"finish": show_date(cal.finish_date(sim.mean)),
            "odds": chance,
            "target": show_date(cal.finish_date(sim.percentile(100.0 * conf)))}


def _pert_values(analysis, conf: float) -> dict:
    return {"finish": show_date(analysis.finish_date),
            "odds": analysis.probability_by_deadline(),
            "target": show_date(analysis.date_at(conf))}


def _odds_text(chance: float | None, by: str) -> str:
    return "no deadline set" if chance is None else f"{percent(chance)}{by}"


def headline(analysis, simulation=None, stale: bool = False) -> Headline:
    """The headline of ``analysis``; ``simulation`` the latest run (or None), ``stale``
    True when the plan changed after it ran."""
    conf = float(analysis.plan.settings.target_confidence)
    by = "" if analysis.deadline is None else f" by {show_date(analysis.date_of_duration(analysis.deadline))}"
    pert = _pert_values(analysis, conf)
    label = confidence_name(conf)
    if simulation is not None and not stale:
        sim = _sim_values(analysis, simulation, conf)
        odds_beside = "" if pert["odds"] is None else f"PERT (single path): {percent(pert['odds'])}"
        return Headline(
            SIMULATION, False,
            Figure("Mean finish (simulation)", sim["finish"], f"PERT (single path): {pert['finish']}"),
            Figure("Chance of meeting the deadline (simulation)", _odds_text(sim["odds"], by), odds_beside),
            Figure(f"{label} finish (simulation)", sim["target"], f"PERT (single path): {pert['target']}"),
            f"Simulation of {simulation.iterations:,} runs (seed {simulation.seed}); PERT beside it "
            "follows the critical path alone and is optimistic where paths merge.")
    note = ("No simulation yet: PERT follows the critical path alone and is optimistic where "
            "paths merge; run a simulation (Odds) for the odds over every path.")
    if simulation is not None:
        old = _sim_values(analysis, simulation, conf)
        said = f"{_odds_text(old['odds'], '')}, {label} {old['target']}"
        note = (f"Simulation out of date: the plan changed after it ran (it gave {said}); "
                "run it again. The figures above are PERT's, on the plan as it is now.")
    return Headline(
        PERT, simulation is not None,
        Figure("Project finish (PERT)", pert["finish"]),
        Figure("Chance of meeting the deadline (PERT)", _odds_text(pert["odds"], by)),
        Figure(f"{label} finish (PERT)", pert["target"]),
        note)
