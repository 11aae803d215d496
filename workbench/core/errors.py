"""Errors raised by the core. Every message names the culprit (activity, link, field)."""

from __future__ import annotations


class PlanError(ValueError):
    """A plan (or an edit to it) is invalid. ``culprit`` names the activity, row or field."""

    def __init__(self, message: str, culprit: str | None = None):
        super().__init__(message)
        self.culprit = culprit


class CycleError(PlanError):
    """The links form a loop. ``loop`` lists the activity ids in order, first repeated last."""

    def __init__(self, loop: list[str]):
        self.loop = list(loop)
        text = " \u2192 ".join(self.loop)
        super().__init__(f"the links form a loop: {text}", culprit=self.loop[0] if loop else None)
