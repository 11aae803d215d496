"""The odds with and without the crews: the logic-only and the resource-aware simulation of
one plan with the same seed (the same sampled durations), side by side in words."""

from __future__ import annotations

from .montecarlo import simulate


class ResourceOdds:
    """The logic-only and the resource-aware simulation of one plan, same seed, side by side."""

    def __init__(self, logic, aware):
        self.logic, self.aware = logic, aware

    def rows(self, confidence: float = 0.8) -> list[tuple[str, str, str]]:
        """(what, logic only, with the crews) rows in words, for a table."""
        from .formatting import format_date, format_percent

        lg, aw = self.logic, self.aware
        rows = [(f"P{int(round(q * 100))}", format_date(lg.date_of(lg.percentile(q * 100))), format_date(aw.date_of(aw.percentile(q * 100))))
                for q in sorted({0.5, 0.8, 0.9, confidence})]
        if lg.deadline is not None:
            rows.append(("Chance of the deadline", format_percent(lg.prob_by(lg.deadline)[0]),
                         format_percent(aw.prob_by(aw.deadline)[0])))
        return rows

    def sentence(self, confidence: float = 0.8) -> str:
        """One sentence on what the crews cost."""
        from .formatting import format_duration, format_percent

        lg, aw = self.logic, self.aware
        q = confidence
        gap = aw.percentile(q * 100) - lg.percentile(q * 100)
        unit = lg.unit
        if abs(gap) < 0.05:
            text = f"The crews cost no time at P{int(round(q * 100))}: the logic, not the resources, sets the date"
        else:
            text = (f"Waiting for crews adds {format_duration(gap, unit)} at P{int(round(q * 100))}: "
                    f"activities the logic lets run together need the same people or machines")
        if lg.deadline is not None:
            a, b = lg.prob_by(lg.deadline)[0], aw.prob_by(aw.deadline)[0]
            if abs(a - b) >= 0.005:
                text += f", and the chance of the deadline falls from {format_percent(a)} to {format_percent(b)}"
        return text + "."


def compare(plan, iterations: int = 2000, seed: int = 1, progress=None, cancel=None) -> ResourceOdds:
    """Both simulations with the same seed (the same sampled durations)."""
    logic = simulate(plan, iterations, seed, cancel=cancel)
    if progress:
        progress(1, 2)
    aware = simulate(plan, iterations, seed, resources=True, cancel=cancel)
    if progress:
        progress(2, 2)
    return ResourceOdds(logic, aware)
