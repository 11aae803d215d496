"""Plan ⇄ plain dict (the current ``.slw`` layout), with field-level validation.

``plan_to_dict`` always writes every field, so ``plan_to_dict(plan_from_dict(d)) == d``
for any dict it wrote. Dates are ISO strings; a constraint or deadline is tagged
``{"offset": 12.5}`` or ``{"date": "2026-03-02"}`` so the two can never be confused.
"""

from __future__ import annotations

import datetime as dt
from operator import attrgetter

import numpy as np

from workbench.core.errors import PlanError
from workbench.core.model import (LINK_TYPES, MAX_UNITS, Activity, Availability, Calendar, CorrelationGroup, Link, Plan,
                                  Resource, Risk, Settings, SignOff)
from workbench.core.cpm import Analyzer
from workbench.core.network import compile_plan

from .cost_section import costs_to_dict, merge_costs, read_costs
from .checkup_section import checkup_from_dict, checkup_to_dict
from .errors import PlanFileError
from .fields import Fields, show
from .plan_checks import refuse_duplicate_links
from .plan_living import baselines_from, living_to_dict, progress_from, trend_from_list
from .plan_migrate import FORMAT, VERSION, upgrade

ACTIVITY_FIELDS = ("id", "name", "group", "notes", "optimistic", "most_likely", "pessimistic",
                   "duration", "distribution", "start_no_earlier", "finish_no_later", "resources")


# --- writing -------------------------------------------------------------
def _point(value):
    if value is None:
        return None
    if isinstance(value, dt.date):
        return {"date": value.isoformat()}
    return {"offset": float(value)}


def _num(value):
    return None if value is None else float(value)


def settings_to_dict(s: Settings) -> dict:
    cal = s.calendar
    return {
        "title": s.title, "start": s.start.isoformat(), "unit": s.unit,
        "calendar": {"workdays": [int(d) for d in cal.workdays],
                     "holidays": [d.isoformat() for d in cal.holidays], "region": cal.region},
        "deadline": _point(s.deadline),
        "status_date": s.status_date.isoformat() if s.status_date else None,
        "target_confidence": float(s.target_confidence), "distribution": s.distribution,
        "revision": s.revision, "prepared_by": s.prepared_by,
        "sign_off": [{"name": p.name, "role": p.role} for p in s.sign_off],
    }


# Activity fields written only when an activity has them (most lines stay short); the fast
# writer (plan_lines) writes an activity holding any of them through activity_to_dict.
OPTIONAL_ACTIVITY_FIELDS = ("resources",)


def activity_to_dict(a: Activity) -> dict:
    out = {"id": a.id, "name": a.name, "group": a.group, "notes": a.notes,
           "optimistic": _num(a.optimistic), "most_likely": _num(a.most_likely),
           "pessimistic": _num(a.pessimistic), "duration": _num(a.duration),
           "distribution": a.distribution,
           "start_no_earlier": _point(a.start_no_earlier), "finish_no_later": _point(a.finish_no_later)}
    if a.resources:          # written only when the activity needs some (most lines stay short)
        out["resources"] = {r: float(u) for r, u in a.resources}
    return out


def resource_to_dict(r: Resource) -> dict:
    return {"id": r.id, "name": r.name, "units": float(r.units), "cost": _num(r.cost),
            "periods": [{"start": _point(p.start), "end": _point(p.end), "units": float(p.units)} for p in r.periods]}


def plan_to_dict(plan: Plan, rows: bool = True) -> dict:
    """The whole plan as JSON-ready data in the current layout (``VERSION``); with
    ``rows=False`` the activity and link lists are left empty (``plan_lines`` writes them)."""
    return {
        "format": FORMAT, "version": VERSION,
        "settings": settings_to_dict(plan.settings),
        "activities": [activity_to_dict(a) for a in plan.activities] if rows else [],
        "links": [{"pred": l.pred, "succ": l.succ, "type": l.type, "lag": float(l.lag)} for l in plan.links] if rows else [],
        "risks": [{"id": r.id, "name": r.name, "probability": float(r.probability),
                   "optimistic": float(r.optimistic), "most_likely": float(r.most_likely),
                   "pessimistic": float(r.pessimistic), "activities": list(r.activities)} for r in plan.risks],
        "correlations": [{"name": c.name, "activities": list(c.activities),
                          "coefficient": float(c.coefficient)} for c in plan.correlations],
        "costs": costs_to_dict(plan),
        "checkup": checkup_to_dict(plan),
        "resources": [resource_to_dict(r) for r in plan.resources],
        **living_to_dict(plan),
    }


# --- reading -------------------------------------------------------------
def _calendar(f: Fields) -> Calendar:
    workdays = f.int_list("workdays", 0, 6, default=[0, 1, 2, 3, 4])
    if len(set(workdays)) != len(workdays):
        raise f.error("workdays", "lists a weekday twice")
    cal = Calendar(tuple(workdays), tuple(f.date_list("holidays")), f.text("region"))
    f.done()
    return cal


def settings_from_dict(data) -> Settings:
    f = Fields(data, "settings")
    s = Settings(title=f.text("title", "Untitled plan"), start=f.date("start", required=True),
                 unit=f.text("unit", "days"), calendar=_calendar(f.sub("calendar")),
                 deadline=f.point("deadline"), status_date=f.date("status_date"),
                 target_confidence=f.number("target_confidence", default=0.9),
                 distribution=f.text("distribution", "beta-pert"),
                 revision=f.text("revision"), prepared_by=f.text("prepared_by"),
                 sign_off=[_sign_off(x) for x in f.sub_list("sign_off")])
    f.done()
    return _core(s.validated)


def _sign_off(f: Fields) -> SignOff:
    person = SignOff(f.text("name"), f.text("role"))
    f.done()
    return person


_ACT_TEXT = ("id", "name", "group", "notes")
_ACT_NUMBERS = ("optimistic", "most_likely", "pessimistic", "duration")
_ACT_ALL = frozenset(_ACT_TEXT + _ACT_NUMBERS + ("distribution", "start_no_earlier", "finish_no_later", "resources"))
_LINK_KEYS = frozenset(("pred", "succ", "type", "lag"))


def _plain_number(value) -> bool:
    return value is None or (type(value) in (int, float) and -MAX_UNITS <= value <= MAX_UNITS)


def _quick_activity(data) -> Activity | None:
    """The common entry built directly; None sends it through the careful reader."""
    if type(data) is not dict or not data.keys() <= _ACT_ALL:
        return None
    get = data.get
    if get("start_no_earlier") is not None or get("finish_no_later") is not None or get("resources"):
        return None
    if not all(type(get(k, "")) is str for k in _ACT_TEXT) or type(get("distribution", "")) not in (str, type(None)):
        return None
    if not all(_plain_number(get(k)) for k in _ACT_NUMBERS):
        return None
    act = Activity(get("id", ""), get("name", ""), get("group", ""), get("notes", ""),
                   *(None if get(k) is None else float(get(k)) for k in _ACT_NUMBERS), get("distribution"))
    return act if act._plainly_valid() else None


def _quick_link(data) -> Link | None:
    if type(data) is not dict or len(data) > 4 or not data.keys() <= _LINK_KEYS:
        return None
    get = data.get
    pred, succ, kind, lag = get("pred"), get("succ"), get("type", "FS"), get("lag", 0.0)
    if type(pred) is not str or type(succ) is not str or type(kind) is not str or type(lag) not in (int, float):
        return None
    if not -MAX_UNITS <= lag <= MAX_UNITS:
        return None
    kind = kind.upper()
    return Link(pred, succ, kind, float(lag)) if kind in LINK_TYPES and pred != succ and pred and succ else None


def activity_from_dict(data, position: int) -> Activity:
    quick = _quick_activity(data)
    if quick is not None:
        return quick
    f = Fields.entry(data, "activity", position)
    act = Activity(id=f.text("id", required=True), name=f.text("name"), group=f.text("group"),
                   notes=f.text("notes"), optimistic=f.number("optimistic"),
                   most_likely=f.number("most_likely"), pessimistic=f.number("pessimistic"),
                   duration=f.number("duration"), distribution=f.text("distribution", None),
                   start_no_earlier=f.point("start_no_earlier"), finish_no_later=f.point("finish_no_later"),
                   resources=_needs(f))
    f.done()
    return _core(act.validated)


def _needs(f: Fields) -> tuple:
    """An activity's ``"resources": {"crew": 2, "crane": 1}`` (absent or {} for none)."""
    raw = f.raw("resources", {})
    if not isinstance(raw, dict):
        raise f.error("resources", f"must be an object of resource ids and units, like {{\"crew\": 2}}, got {show(raw)}")
    out = []
    for res, units in raw.items():
        if isinstance(units, bool) or not isinstance(units, (int, float)):
            raise f.error("resources", f"units of resource {res!r} must be a number, got {show(units)}")
        out.append((res, float(units)))
    return tuple(out)


def resource_from_dict(data, position: int) -> Resource:
    f = Fields.entry(data, "resource", position)
    periods = []
    for k, p in enumerate(f.sub_list("periods"), 1):
        start, end = p.point("start"), p.point("end")
        if start is None or end is None:
            raise f.error("periods", f"period {k} needs a start and an end")
        periods.append(Availability(start, end, p.number("units", required=True)))
        p.done()
    res = Resource(f.text("id", required=True), f.text("name"), f.number("units", default=1.0),
                   f.number("cost"), tuple(periods))
    f.done()
    return _core(res.validated)


def _activities_from_list(items) -> list[Activity]:
    build = getattr(items, "build", None)     # rows decoded in bulk (plan_bulk) check themselves
    if build is not None:
        return build(activity_from_dict)
    return [activity_from_dict(x, i) for i, x in enumerate(items, 1)]


def _links_from_list(items) -> list[Link]:
    """Every link, the common ones built in one tight loop, the rest by :func:`link_from_dict`."""
    if hasattr(items, "build"):               # rows decoded in bulk (plan_bulk)
        return items.build(link_from_dict)
    out, keys, types, limit = [], _LINK_KEYS, LINK_TYPES, MAX_UNITS
    for i, d in enumerate(items, 1):
        if type(d) is dict and d.keys() <= keys:
            pred, succ, kind, lag = d.get("pred"), d.get("succ"), d.get("type", "FS"), d.get("lag", 0.0)
            if (type(pred) is str and type(succ) is str and kind in types and pred and succ and pred != succ
                    and type(lag) in (int, float) and -limit <= lag <= limit):
                out.append(Link(pred, succ, kind, float(lag)))
                continue
        out.append(link_from_dict(d, i))
    return out


def link_from_dict(data, position: int) -> Link:
    quick = _quick_link(data)
    if quick is not None:
        return quick
    f = Fields.entry(data, "link", position)
    link = Link(f.text("pred", required=True), f.text("succ", required=True),
                f.text("type", "FS").upper(), f.number("lag", default=0.0))
    f.done()
    return _core(link.validated)


def risk_from_dict(data, position: int, known: set[str]) -> Risk:
    f = Fields.entry(data, "risk", position)
    risk = Risk(f.text("id", required=True), f.text("name"), f.number("probability", default=0.0),
                f.number("optimistic", default=0.0), f.number("most_likely", default=0.0),
                f.number("pessimistic", default=0.0), tuple(f.text_list("activities")))
    f.done()
    if not 0.0 <= risk.probability <= 1.0:
        raise f.error("probability", f"must lie between 0 and 1, got {risk.probability:g}")
    if not 0.0 <= risk.optimistic <= risk.most_likely <= risk.pessimistic:
        raise f.error("optimistic", "estimates must satisfy 0 \u2264 optimistic \u2264 most_likely \u2264 pessimistic")
    if risk.pessimistic > MAX_UNITS:
        raise f.error("pessimistic", f"delay {risk.pessimistic:g} is beyond {MAX_UNITS:,.0f} plan units")
    f.check_known("activities", risk.activities, known)
    return risk


def correlation_from_dict(data, position: int, known: set[str]) -> CorrelationGroup:
    f = Fields.entry(data, "correlation group", position, key="name")
    group = CorrelationGroup(f.text("name", required=True), tuple(f.text_list("activities")),
                             f.number("coefficient", required=True))
    f.done()
    if not -1.0 <= group.coefficient <= 1.0:
        raise f.error("coefficient", f"must lie between -1 and 1, got {group.coefficient:g}")
    f.check_known("activities", group.activities, known)
    return group


def _core(check):
    """Run a core validation, turning its PlanError into a PlanFileError (same message)."""
    try:
        return check()
    except PlanFileError:
        raise
    except PlanError as exc:
        raise PlanFileError(str(exc), exc.culprit) from exc


def _unique(acts: list[Activity]) -> None:
    if len(set(map(attrgetter("id"), acts))) == len(acts):
        return
    first: dict[str, int] = {}
    for i, act in enumerate(acts, 1):
        if act.id in first:
            raise PlanFileError(f"activity {act.id}: duplicate id (activities {first[act.id]} and {i})", act.id)
        first[act.id] = i


def plan_from_dict(data, compiled=None) -> Plan:
    """Build and check a plan from plan file data (older versions are upgraded first).
    Raises :class:`PlanFileError` naming the activity and field; a loop in the links
    raises it with the loop in order. ``compiled``: an analyzer already compiled for these
    very activity ids and links (a plan being saved and read back), reused when current."""
    top = Fields(upgrade(data), "plan file")
    top.text("format"), top.number("version")
    settings = settings_from_dict(top.raw("settings", {}))
    acts = _activities_from_list(top.raw_list("activities"))
    _unique(acts)
    links = _links_from_list(top.raw_list("links"))
    try:
        plan = _checked_plan(top, settings, acts, links, compiled)
    except PlanFileError:
        refuse_duplicate_links(links)   # a repeated link is named first, as it always was
        raise
    if _repeats(plan._analyzer.net):
        refuse_duplicate_links(links)   # names the repeat
    return plan


def _checked_plan(top: Fields, settings, acts, links, compiled) -> Plan:
    items = top.raw_list("risks")
    known = {a.id for a in acts} if items else None      # found only when something names ids
    risks = [risk_from_dict(x, i, known) for i, x in enumerate(items, 1)]
    items = top.raw_list("correlations")
    if items and known is None:
        known = {a.id for a in acts}
    corr = [correlation_from_dict(x, i, known) for i, x in enumerate(items, 1)]
    settings, per_activity = read_costs(top.raw("costs"), settings)
    _core(settings.validated)
    acts = [_core(a.validated) for a in merge_costs(acts, per_activity)] if per_activity else acts
    checkup = checkup_from_dict(top.raw("checkup"))
    resources = [resource_from_dict(x, i) for i, x in enumerate(top.raw_list("resources"), 1)]
    settings, acts = progress_from(top, settings, acts)
    baselines, trend = baselines_from(top.raw_list("baselines")), trend_from_list(top.raw_list("odds_trend"))
    top.done()
    plan = _core(lambda: Plan(settings, acts, links, risks, corr, validated=True, resources=resources,
                              baselines=baselines, odds_trend=trend))
    plan.checkup_thresholds = checkup
    if compiled is not None and compiled.net.ids == plan.ids() and compiled.links == plan.links:
        analyzer = Analyzer(compiled.net)
    else:
        analyzer = Analyzer(_core(lambda: compile_plan(plan)))
    analyzer.links = list(plan.links)
    plan._analyzer = analyzer           # the first analysis reuses the network compiled here
    return plan


def _repeats(net) -> bool:
    """Does a link of one type join the same two activities twice? (In bulk, on the
    compiled network: a link's type is its pair of finish/start ends.)"""
    if net.src.size < 2:
        return False
    ends = (net.src * len(net.ids) + net.dst) * 4 + net.src_fin.astype(np.int64) * 2 + net.dst_fin.astype(np.int64)
    ends.sort()
    return bool((ends[1:] == ends[:-1]).any())
