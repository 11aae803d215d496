"""Errors raised by the core. Every message names the culprit (activity, link, field)."""

from __future__ import annotations


class PlanError(ValueError):
    """A plan (or an edit to it) is invalid. ``culprit`` names the activity, row or field;
    ``field``, when known, the activity's field at fault (its attribute name, e.g.
    ``"actual_finish"``), so a window can mark the very cell."""

    def __init__(self, message: str, culprit: str | None = None, field: str | None = None):
        super().__init__(message)
        self.culprit = culprit
        self.field = field


class CycleError(PlanError):
    """The links form a loop. ``loop`` lists the activity ids in order, first repeated last."""

    def __init__(self, loop: list[str]):
        self.loop = list(loop)
        text = " \u2192 ".join(self.loop)
        super().__init__(f"the links form a loop: {text}", culprit=self.loop[0] if loop else None)


class StatusDateMissing(PlanError):
    """An activity has progress but the plan has no status date. The message says so and
    stops there: how to give one depends on where the planner is, so each surface adds its
    own way with :meth:`with_way` (the command line its option, the window its menu)."""

    def __init__(self, act_id: str):
        super().__init__(f"activity {act_id} has progress, so the plan needs a status date", act_id)

    def with_way(self, way: str) -> str:
        """The message followed by ``way``, how to give the status date where the planner is."""
        return f"{self}: {way}"
