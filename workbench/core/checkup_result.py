"""What a checkup found: one :class:`Check` per metric, gathered in a :class:`Checkup`.

A check's ``status`` is ``"pass"``, ``"fail"`` or ``"n/a"`` (not applicable: the plan lacks
what the metric needs, and the note says what). Marks that read without colour:
:data:`MARKS`.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from .checkup_limits import STANDARD_NAME, STANDARD_SOURCE

PASS, FAIL, NA = "pass", "fail", "n/a"
MARKS = {PASS: "\u2713 pass", FAIL: "\u2717 fail", NA: "\u2013 n/a"}
STANDARD, OWN_ESTIMATES, OWN_ODDS = "standard", "estimates", "odds"


@dataclass
class Check:
    id: str
    name: str
    status: str
    value: float | None = None          # in the threshold's unit (%, count, ratio)
    threshold: str = ""                 # e.g. "<= 5 %"
    value_text: str = ""                # e.g. "14.3 % (9 of 63 links)"
    offenders: list[str] = field(default_factory=list)
    note: str = ""
    source: str = ""                    # the standard, "common practice" or our own
    family: str = STANDARD              # standard / estimates / odds
    changed: bool = False               # the plan's threshold differs from the default
    uses_simulation: bool = False

    @property
    def mark(self) -> str:
        return MARKS[self.status]

    @property
    def figure(self) -> str:
        """The figure in a few characters, for a slide: "14.5 %", "3", "1.05", "41 pts"."""
        if self.value is None or self.threshold in ("pass", "informational"):
            return ""
        if self.threshold.endswith("%"):
            return f"{self.value:.1f} %"
        if self.threshold.endswith("points"):
            return f"{self.value:.0f} pts"
        if self.id in ("cpli", "bei"):
            return f"{self.value:.2f}"
        return f"{self.value:g}"

    def to_dict(self) -> dict:
        """The JSON contract of one check in ``slackline check --json``."""
        value = None if self.value is None else round(float(self.value), 6)
        return {"id": self.id, "name": self.name, "value": value, "threshold": self.threshold,
                "status": self.status, "offenders": list(self.offenders), "note": self.note}


@dataclass
class Checkup:
    checks: list[Check]
    simulation_seed: int | None = None
    simulation_stale: bool = False

    def __iter__(self):
        return iter(self.checks)

    def __len__(self) -> int:
        return len(self.checks)

    def get(self, check_id: str) -> Check:
        for check in self.checks:
            if check.id == check_id:
                return check
        raise KeyError(check_id)

    def count(self, status: str) -> int:
        return sum(1 for c in self.checks if c.status == status)

    @property
    def applicable(self) -> int:
        return len(self.checks) - self.count(NA)

    @property
    def failed(self) -> list[Check]:
        return [c for c in self.checks if c.status == FAIL]

    def summary_text(self) -> str:
        """The summary strip's words: "Checkup: 9 of 14 pass"."""
        return f"Checkup: {self.count(PASS)} of {self.applicable} pass"

    def to_dict(self) -> dict:
        """The JSON contract of ``slackline check --json``."""
        return {"standard": {"name": STANDARD_NAME, "source": STANDARD_SOURCE},
                "checks": [c.to_dict() for c in self.checks]}
