"""The plan file's ``checkup`` section (version 3): the plan's Checkup thresholds.

Written always, with every threshold (the plan's own value or the default), so a reader of
the file sees what the plan is graded against::

    "checkup": {"thresholds": {"missing_logic_pct": 5.0, "leads_count": 0.0, ...}}

Read leniently about absence (no section, or thresholds left out, follow the defaults) and
strictly about content: an unknown threshold or a value out of range names the threshold.
"""

from __future__ import annotations

from workbench.core.checkup_limits import BY_KEY, checked_thresholds, thresholds_of
from workbench.core.errors import PlanError

from .errors import PlanFileError
from .fields import Fields, show

SECTION = "checkup"


def checkup_to_dict(plan) -> dict:
    return {"thresholds": {key: float(value) for key, value in thresholds_of(plan).items()}}


def checkup_from_dict(data) -> dict[str, float]:
    """The plan's own thresholds (those differing from the defaults) from the section."""
    if data is None:
        return {}
    f = Fields(data, "checkup")
    raw = f.raw("thresholds", {})
    f.done()
    if not isinstance(raw, dict):
        raise PlanFileError(f"checkup: field 'thresholds' must be an object {{...}}, got {show(raw)}", "checkup")
    for key, value in raw.items():
        if key not in BY_KEY:
            raise PlanFileError(f"checkup: unknown threshold '{key}'", "checkup")
    try:
        return checked_thresholds(raw)
    except PlanError as exc:
        raise PlanFileError(f"checkup: {exc}", exc.culprit) from exc


def add_checkup_section(data: dict) -> dict:
    """Version 2 → 3 step: an empty section (every threshold at its default)."""
    return dict(data, checkup={"thresholds": {}})
