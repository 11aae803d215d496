"""Text longer than Slackline lets a planner type (``model.TEXT_LIMITS``).

The limits guard *entry*: an edit, a paste, a new activity. A plan that already holds
longer text — a file written before the limits, or by another tool, a spreadsheet — is
never refused for it: it opens with every character kept, and :func:`long_texts` says
which activity and field run over, so the window and the command line can tell the
planner. Only an edit that changes such a text asks for it within the limit
(:func:`check_entered`); editing anything else of that activity keeps the text whole.
"""

from __future__ import annotations

from dataclasses import dataclass

from .model import TEXT_LIMITS, Activity, Plan, Settings, check_length

ACTIVITY_TEXTS = ("name", "group", "notes")


@dataclass(frozen=True)
class LongText:
    owner: str      # "activity K1", "settings", "settings: sign-off row 2"
    field: str      # a TEXT_LIMITS key
    length: int

    @property
    def limit(self) -> int:
        return TEXT_LIMITS[self.field]

    def __str__(self) -> str:
        return f"{self.owner}: {self.field} ({self.length:,} characters; limit {self.limit:,})"


def _settings_texts(settings: Settings):
    yield "settings", "title", settings.title
    yield "settings", "revision", settings.revision
    yield "settings", "prepared by", settings.prepared_by
    for k, person in enumerate(settings.sign_off, 1):
        yield f"settings: sign-off row {k}", "sign-off name", person.name
        yield f"settings: sign-off row {k}", "sign-off role", person.role


def long_texts(plan: Plan) -> list[LongText]:
    """Every text of ``plan`` longer than its entry limit, settings first, then the
    activities in plan order."""
    found = [LongText(owner, name, len(value)) for owner, name, value in _settings_texts(plan.settings)
             if len(value) > TEXT_LIMITS[name]]
    for act in plan.activities:
        for name in ACTIVITY_TEXTS:
            value = getattr(act, name)
            if len(value) > TEXT_LIMITS[name]:
                found.append(LongText(f"activity {act.id}", name, len(value)))
    return found


def describe(found: list[LongText], shown: int = 5, gap: str = "") -> str:
    """What the planner is told, one text per line ('' when nothing runs over); ``gap``
    goes between the heading, the list and the closing sentence (a blank line in a dialog)."""
    if not found:
        return ""
    lines = [f"- {item}" for item in found[:shown]]
    if len(found) > shown:
        lines.append(f"- and {len(found) - shown:,} more")
    count = "1 text is" if len(found) == 1 else f"{len(found):,} texts are"
    return (f"{count} longer than Slackline lets you type:\n{gap}" + "\n".join(lines)
            + f"\n{gap}Every character is kept, and saving keeps them. An edit to one of these texts "
            "asks you to shorten it to its limit.")


def check_entered(activity: Activity, before: Activity | None = None) -> None:
    """PlanError when a text of ``activity`` entered now (new, or changed from ``before``)
    runs over its limit, naming the activity and field."""
    for name in ACTIVITY_TEXTS:
        value = getattr(activity, name)
        if before is None or value != getattr(before, name):
            check_length(value, f"activity {activity.id}", name, activity.id)


def check_entered_settings(settings: Settings, before: Settings | None = None) -> None:
    """PlanError when a settings text changed from ``before`` runs over its limit."""
    old = {(owner, name): value for owner, name, value in _settings_texts(before)} if before is not None else {}
    for owner, name, value in _settings_texts(settings):
        if old.get((owner, name)) != value:
            check_length(value, owner, name, "sign_off" if "sign-off" in name else name)
