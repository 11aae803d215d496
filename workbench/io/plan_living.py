"""The living-schedule sections of a version-3 ``.slw``: progress, baselines, odds trend.

Layout (each section optional when read, always written; see docs/file-format.md)::

    "progress_rule": "retained logic",          (or "progress override")
    "progress": [{"id": "A", "actual_start": {"date": "2027-01-04"}, "actual_finish": null,
                  "remaining_optimistic": null, "remaining_most_likely": null,
                  "remaining_pessimistic": null, "remaining": 4.0, "percent_complete": null}, ...],
    "baselines": [{"name": ..., "recorded": date, "approved": bool, "status_date": date|null,
                   "plan_hash": text, "finish": date, "deadline": date|null,
                   "pert": figures|null, "simulation": figures|null,
                   "activities": [{"id", "start", "finish", "optimistic", "most_likely",
                                   "pessimistic", "duration"}, ...],
                   "links": [{"pred", "succ", "type", "lag"}, ...]}, ...],
    "odds_trend": [{"status_date", "deadline", "pert_probability", "simulation_probability",
                    "p50", "p80", "p90", "plan_hash", "iterations", "seed"}, ...]

``figures`` is ``{"p50", "p80", "p90": dates, "probability": number|null,
"iterations": whole|null, "seed": whole|null}``.
"""

from __future__ import annotations

from dataclasses import replace

from workbench.core.baseline import Baseline, BaselineActivity, OddsFigures, TrendPoint
from workbench.core.model import PROGRESS_RULES, Activity, Link
from workbench.core.progress_fields import Progress

from .errors import PlanFileError
from .fields import Fields, show

PROGRESS_KEYS = ("remaining_optimistic", "remaining_most_likely", "remaining_pessimistic", "remaining",
                 "percent_complete")


def _point(value):
    if value is None:
        return None
    return {"date": value.isoformat()} if hasattr(value, "isoformat") else {"offset": float(value)}


def _num(value):
    return None if value is None else float(value)


def _day(value):
    return None if value is None else value.isoformat()


# --- writing ---------------------------------------------------------------------
def living_to_dict(plan) -> dict:
    acts = [dict(id=a.id, actual_start=_point(a.progress.actual_start), actual_finish=_point(a.progress.actual_finish),
                 **{k: _num(getattr(a.progress, k)) for k in PROGRESS_KEYS})
            for a in plan.activities if a.progress is not None and not a.progress.is_empty]
    return {"progress_rule": plan.settings.progress_rule, "progress": acts,
            "baselines": [baseline_to_dict(b) for b in plan.baselines],
            "odds_trend": [trend_to_dict(p) for p in plan.odds_trend]}


def _figures(f: OddsFigures | None):
    if f is None:
        return None
    return {"p50": f.p50.isoformat(), "p80": f.p80.isoformat(), "p90": f.p90.isoformat(),
            "probability": _num(f.probability), "iterations": f.iterations, "seed": f.seed}


def baseline_to_dict(b: Baseline) -> dict:
    return {"name": b.name, "recorded": b.recorded.isoformat(), "approved": bool(b.approved),
            "status_date": _day(b.status_date), "plan_hash": b.plan_hash, "finish": b.finish.isoformat(),
            "deadline": _day(b.deadline), "pert": _figures(b.pert), "simulation": _figures(b.simulation),
            "activities": [{"id": a.id, "start": a.start.isoformat(), "finish": a.finish.isoformat(),
                            "optimistic": _num(a.optimistic), "most_likely": _num(a.most_likely),
                            "pessimistic": _num(a.pessimistic), "duration": _num(a.duration)}
                           for a in b.activities],
            "links": [{"pred": l.pred, "succ": l.succ, "type": l.type, "lag": float(l.lag)} for l in b.links]}


def trend_to_dict(p: TrendPoint) -> dict:
    return {"status_date": p.status_date.isoformat(), "deadline": _day(p.deadline),
            "pert_probability": _num(p.pert_probability), "simulation_probability": _num(p.simulation_probability),
            "p50": p.p50.isoformat(), "p80": p.p80.isoformat(), "p90": p.p90.isoformat(),
            "plan_hash": p.plan_hash, "iterations": int(p.iterations), "seed": int(p.seed)}


# --- reading ---------------------------------------------------------------------
def _whole(f: Fields, key: str, required: bool = False):
    value = f.raw(key)
    if value is None and not required:
        return None
    if isinstance(value, bool) or not isinstance(value, int) or value < 0:
        raise f.error(key, f"must be a whole number \u2265 0, got {show(value)}")
    return value


def _chance(f: Fields, key: str):
    value = f.number(key)
    if value is not None and not 0.0 <= value <= 1.0:
        raise f.error(key, f"must lie between 0 and 1, got {value:g}")
    return value


def progress_from(top: Fields, settings, acts: list[Activity]) -> tuple:
    """(settings with the progress rule, activities with their progress) from the plan
    file's top level."""
    rule = top.text("progress_rule", "retained logic")
    if rule not in PROGRESS_RULES:
        raise top.error("progress_rule", f"must be \"retained logic\" or \"progress override\", got {show(rule)}")
    entries, acts = top.raw_list("progress"), list(acts)
    index = {a.id: i for i, a in enumerate(acts)} if entries else {}   # most plans list no progress
    for pos, raw in enumerate(entries, 1):
        e = Fields.entry(raw, "progress of activity", pos)
        act_id = e.text("id", required=True)
        if act_id not in index:
            raise e.error("id", f"names unknown activity {act_id!r}")
        p = Progress(e.point("actual_start"), e.point("actual_finish"), *(e.number(k) for k in PROGRESS_KEYS))
        e.done()
        i = index[act_id]
        if acts[i].progress is not None:
            raise e.error("id", f"activity {act_id} has progress listed twice")
        acts[i] = acts[i].with_(progress=p)
        _validated(acts[i])
    return replace(settings, progress_rule=rule), acts


def _validated(act: Activity) -> None:
    from workbench.core.errors import PlanError
    try:
        act.validated()
    except PlanError as exc:
        raise PlanFileError(f"progress: {exc}", exc.culprit) from exc


def _figures_from(value, where: str, method: str):
    if value is None:
        return None
    f = Fields(value, where)
    out = OddsFigures(method, f.date("p50", True), f.date("p80", True), f.date("p90", True), _chance(f, "probability"),
                      _whole(f, "iterations"), _whole(f, "seed"))
    f.done()
    return out


def baseline_from(raw, position: int) -> Baseline:
    f = Fields.entry(raw, "baseline", position, key="name")
    acts = []
    for i, x in enumerate(f.raw_list("activities"), 1):
        e = Fields.entry(x, f"{f.where}: activity", i)
        acts.append(BaselineActivity(e.text("id", required=True), e.date("start", True), e.date("finish", True),
                                     e.number("optimistic"), e.number("most_likely"), e.number("pessimistic"),
                                     e.number("duration")))
        e.done()
    links = []
    for i, x in enumerate(f.raw_list("links"), 1):
        e = Fields.entry(x, f"{f.where}: link", i)
        links.append(Link(e.text("pred", required=True), e.text("succ", required=True), e.text("type", "FS"),
                          e.number("lag", default=0.0)))
        e.done()
    approved = f.raw("approved", False)
    if not isinstance(approved, bool):
        raise f.error("approved", f"must be true or false, got {show(approved)}")
    b = Baseline(f.text("name", required=True), f.date("recorded", True), f.date("finish", True), f.text("plan_hash"),
                 tuple(acts), tuple(links), _figures_from(f.raw("pert"), f"{f.where} pert", "pert"),
                 _figures_from(f.raw("simulation"), f"{f.where} simulation", "simulation"),
                 f.date("deadline"), f.date("status_date"), approved)
    f.done()
    return b


def trend_from(raw, position: int) -> TrendPoint:
    f = Fields.entry(raw, "odds trend point", position)
    p = TrendPoint(f.date("status_date", True), f.date("deadline"), _chance(f, "pert_probability"),
                   _chance(f, "simulation_probability"), f.date("p50", True), f.date("p80", True), f.date("p90", True),
                   f.text("plan_hash"), _whole(f, "iterations") or 0, _whole(f, "seed") or 0)
    f.done()
    return p


def baselines_from(items) -> list[Baseline]:
    out = [baseline_from(x, i) for i, x in enumerate(items, 1)]
    names = [b.name for b in out]
    for name in names:
        if names.count(name) > 1:
            raise PlanFileError(f"baselines: the name {name!r} is used twice", "baselines")
    if sum(b.approved for b in out) > 1:
        raise PlanFileError("baselines: more than one is marked approved", "baselines")
    return out


def trend_from_list(items) -> list[TrendPoint]:
    return sorted((trend_from(x, i) for i, x in enumerate(items, 1)), key=lambda p: p.status_date)
