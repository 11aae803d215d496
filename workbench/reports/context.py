"""Everything the pack's sections read, gathered once: plan, analysis, simulation, trace."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass

from .footer import FooterInfo


@dataclass
class PackContext:
    plan: object                 # core Plan
    analysis: object             # core Analysis
    simulation: object | None    # SimulationResult or None
    footer: FooterInfo
    paper: str

    @property
    def settings(self):
        return self.plan.settings

    @property
    def unit(self) -> str:
        return self.plan.settings.unit

    def date_of(self, offset: float) -> dt.date:
        """The calendar day by whose end a project of this duration finishes."""
        return self.analysis.date_of_duration(offset)

    def name_of(self, act_id: str, limit: int = 160) -> str:
        """An activity's name, shortened with an ellipsis past ``limit`` characters so one
        pasted essay cannot push a table row off the page."""
        name = self.plan.activity(act_id).name
        return name if len(name) <= limit else name[: limit - 1] + "\u2026"

    def deadline(self) -> float | None:
        return self.analysis.deadline
