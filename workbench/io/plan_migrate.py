"""Plan file versions and the chain of upgrades between them.

Each layout change bumps ``VERSION`` and adds one function ``UPGRADES[n]`` that turns
version-n data into version n+1 data. Loading runs the chain from the file's version to
the current one; saving always writes the current version. A file from a newer version
is refused (never guessed at), naming both versions.

Version 1 (the first layout): settings at the top level, a three-point estimate as a
list ``"estimate": [a, m, b]``, predecessors as text per activity (``"after": "A; B SS 2"``),
an untagged deadline (a number is an offset, a ``YYYY-MM-DD`` string a date); no risks,
correlations, constraints or sign-off list.

Version 2: version 1's content in the tagged layout of ``plan_codec``, with risks,
correlations, constraints and a sign-off list.

Version 3 (current): version 2 plus the living-schedule, cost and resource sections
(progress, baselines, odds trend, costs and crash estimates, resources, checkup
thresholds). Each section is optional in the data ``plan_codec`` reads and always
written; the upgrade from 2 adds each section's empty form, one step per section
(``V3_STEPS``).
"""

from __future__ import annotations

from workbench.core.errors import PlanError

from .cost_section import add_empty_costs
from .errors import PlanFileError
from .fields import Fields, parse_iso_date, show
from .predecessors import parse_predecessors

FORMAT = "slackline-workbook"
VERSION = 3


def file_version(data) -> int:
    """Check the format name and version field; return the version."""
    if not isinstance(data, dict):
        raise PlanFileError(f"not a Slackline plan file: the top level is {show(data)}, not an object {{...}}")
    if "format" not in data:
        raise PlanFileError("not a Slackline plan file: it has no 'format' field")
    if data["format"] != FORMAT:
        raise PlanFileError(f"not a Slackline plan file: format is {show(data['format'])}, expected \"{FORMAT}\"")
    version = data.get("version")
    if isinstance(version, bool) or not isinstance(version, int):
        raise PlanFileError(f"plan file: field 'version' must be a whole number, got {show(version)}")
    if version > VERSION:
        raise PlanFileError(f"this plan file is version {version}, written by a newer Slackline; "
                            f"this Slackline reads plan file versions up to {VERSION}. Please update Slackline.")
    if version < 1:
        raise PlanFileError(f"plan file: unknown version {version} (known versions are 1 to {VERSION})")
    return version


def upgrade(data) -> dict:
    """Bring plan file data of any known version to the current layout."""
    version = file_version(data)
    while version < VERSION:
        data = UPGRADES[version](data)
        version += 1
    return data


# --- version 1 → 2 ---------------------------------------------------------------
def _deadline_v1(top: Fields):
    value = top.raw("deadline")
    if value is None:
        return None
    if isinstance(value, (int, float)) and not isinstance(value, bool):
        return {"offset": value}
    if parse_iso_date(value) is not None:
        return {"date": value}
    raise top.error("deadline", f"must be a number of units or a date written YYYY-MM-DD, got {show(value)}")


def _estimate_v1(f: Fields) -> dict:
    est = f.raw("estimate")
    if est is None:
        return {"optimistic": None, "most_likely": None, "pessimistic": None}
    if not isinstance(est, list) or len(est) != 3:
        raise f.error("estimate", f"must be three numbers [optimistic, most likely, pessimistic], got {show(est)}")
    return dict(zip(("optimistic", "most_likely", "pessimistic"), est))


def _activity_v1(raw, position: int) -> tuple[dict, list[dict]]:
    f = Fields.entry(raw, "activity", position)
    act_id = f.text("id", required=True)
    act = {"id": act_id, "name": f.raw("name", ""), "group": "", "notes": f.raw("notes", ""),
           **_estimate_v1(f), "duration": f.raw("duration"), "distribution": None,
           "start_no_earlier": None, "finish_no_later": None}
    try:
        links = parse_predecessors(f.text("after"), act_id)
    except PlanError as exc:
        raise PlanFileError(f"{exc} (field 'after')", act_id) from exc
    f.done()
    return act, [{"pred": l.pred, "succ": l.succ, "type": l.type, "lag": l.lag} for l in links]


def upgrade_1_to_2(data: dict) -> dict:
    top = Fields(data, "plan file (version 1)")
    top.raw("format"), top.raw("version")
    acts, links = [], []
    for i, raw in enumerate(top.raw_list("activities"), 1):
        act, into = _activity_v1(raw, i)
        acts.append(act)
        links.extend(into)
    settings = {
        "title": top.raw("title", "Untitled plan"), "start": top.raw("start"), "unit": top.raw("unit", "days"),
        "calendar": {"workdays": top.raw("workdays", [0, 1, 2, 3, 4]), "holidays": top.raw("holidays", []), "region": ""},
        "deadline": _deadline_v1(top), "status_date": None, "target_confidence": 0.9,
        "distribution": "beta-pert", "revision": "", "prepared_by": "", "sign_off": [],
    }
    top.done()
    return {"format": FORMAT, "version": 2, "settings": settings, "activities": acts, "links": links,
            "risks": [], "correlations": []}


# --- version 2 → 3 ---------------------------------------------------------------
# One step per section that version 3 adds; each takes version-2 data (a dict) and returns
# it with that section's empty form filled in.
def _v3_resources(data: dict) -> dict:
    """Resources: a version-2 plan has none (and its activities need none)."""
    return dict(data, resources=[])


V3_STEPS: list = [_v3_resources]


def _add_checkup_section(data: dict) -> dict:
    from .checkup_section import add_checkup_section
    return add_checkup_section(data)


V3_STEPS.append(_add_checkup_section)

V3_STEPS.append(add_empty_costs)     # the costs section (issue 15)


def living_sections_v3(data: dict) -> dict:
    """Progress, baselines and the odds trend (the living schedule): empty in version 2."""
    return dict(data, progress_rule="retained logic", progress=[], baselines=[], odds_trend=[])


V3_STEPS.append(living_sections_v3)


def upgrade_2_to_3(data: dict) -> dict:
    data = dict(data, version=3)
    for step in V3_STEPS:
        data = step(data)
    return data


UPGRADES = {1: upgrade_1_to_2, 2: upgrade_2_to_3}
