"""Checking a plan file about to be saved reads back, without building the plan twice.

Saving never writes a file that could not be opened again. The plain check loads the
bytes as a new plan: for a million activities that is a second copy of every activity and
link, as slow as opening the file. Here the activity and link lists are decoded in bulk
(``plan_bulk``) and compared, column by column, with the plan being saved; when every
value is the same, the plan file reader runs over the decoded file with the plan's own
activity and link records in place of new ones (every whole-plan check still runs: ids,
repeated links, references, loops; the network the plan's last analysis compiled is
reused when its ids and links are these very ones). Anything else (a list that differs, a row the bulk
checks doubt, text with a surrogate escape) is loaded the plain way, which names what is
wrong exactly as before.
"""

from __future__ import annotations

from dataclasses import fields
from operator import attrgetter

from workbench.core.model import Activity

from .errors import PlanFileError
from .paused_gc import paused_gc
from .plan_bulk import ACTIVITY_KEYS, LINK_KEYS, bulk_plan_data
from .plan_checks import may_hold_surrogates
from .plan_codec import VERSION, plan_from_dict

_VALUES = ACTIVITY_KEYS[:9]       # the values a plain row holds (the constraints are null)


class _Same(list):
    """Records already checked equal to the file's rows: ``build`` hands them over."""

    def build(self, careful) -> list:
        return list(self)


def _same(rows, records, keys) -> bool:
    cols = rows.columns()
    return (len(rows) == len(records) and bool(rows.plain().all())
            and all(cols[k] == list(map(attrgetter(k), records)) for k in keys))


def _bare(acts) -> bool:
    """Every other field of every activity at its default (no constraint, resource need,
    progress or cost): a record the file's rows alone describe, so handing it over is
    the same as building it from the file."""
    for f in fields(Activity):
        if f.name not in _VALUES:
            column = list(map(attrgetter(f.name), acts))
            if column.count(f.default) != len(column):
                return False
    return True


def quick_read_back(data: bytes, plan) -> bool:
    """True when ``data`` was read back as ``plan``'s file (raising PlanFileError as the
    reader would); False when the caller must load it the plain way."""
    if may_hold_surrogates(data):
        return False
    with paused_gc():
        parsed = bulk_plan_data(data, VERSION)
        if parsed is None or "activities" not in parsed or "links" not in parsed:
            return False
        acts, links = plan.activities, plan.links
        if not (_bare(acts) and _same(parsed["activities"], acts, _VALUES) and _same(parsed["links"], links, LINK_KEYS)):
            return False
        parsed["activities"], parsed["links"] = _Same(acts), _Same(links)
        try:
            plan_from_dict(parsed, getattr(plan, "_analyzer", None))   # its network, when current
        except PlanFileError:
            return False                # the plain load says what is wrong, in its own words
    return True
