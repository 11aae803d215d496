"""The plan model: activities, links, settings. Pure Python, no Qt.

Containers announce changes to listeners (``Plan.subscribe``) so that adapters in
other layers can follow them one-to-one. The parts live in ``activity`` (Activity, Link),
``plan_settings`` (Settings and what it holds, Resource) and ``plan_checks`` (limits and
shared checks); every one of them is also importable from here.
"""

from __future__ import annotations

import copy
from dataclasses import replace
from operator import attrgetter
from typing import Callable, Iterable

from .errors import PlanError
from .plan_checks import (  # noqa: F401  (the plan's parts are named from here too)
    _BAD_ID, _PLAIN, DISTRIBUTIONS, EARLIEST_DATE, LATEST_DATE, LINK_TYPES, MAX_ID_LENGTH, MAX_UNITS,
    PROGRESS_RULES, TEXT_LIMITS, UNITS, Offset, check_date, check_id, check_kind, check_length,
    check_number as _check_number)
from .activity import Activity, Link, check_activity_text, check_demands  # noqa: F401
from .plan_settings import (  # noqa: F401
    Availability, BoughtTime, Calendar, CorrelationGroup, Resource, Risk, Settings, SignOff,
    check_settings_text)


Listener = Callable[[str, dict], None]


class Plan:
    """An ordered set of activities, the links between them and the plan settings.

    Listeners receive ``(event, info)`` pairs. Events: ``about_to_change`` and
    ``changed`` around any modification, with ``info['kind']`` one of
    ``activity_inserted``, ``activity_removed``, ``activity_changed``, ``activity_moved``,
    ``links_changed``, ``settings_changed``, ``reset``; plus the row index where it applies.
    """

    def __init__(self, settings: Settings | None = None, activities: Iterable[Activity] = (),
                 links: Iterable[Link] = (), risks: Iterable[Risk] = (),
                 correlations: Iterable[CorrelationGroup] = (), *, validated: bool = False,
                 resources: Iterable[Resource] = (), baselines: Iterable = (), odds_trend: Iterable = (),
                 ends_known: bool = False):
        """``validated=True``: the caller (a file reader) has validated every activity and
        link already; only duplicate ids and link ends are checked again (``ends_known``:
        the caller has also found every link's ends among these activities)."""
        self.settings = settings or Settings()
        if not validated:
            check_settings_text(self.settings)
        self._activities: list[Activity] = []
        self._index: dict[str, int] = {}
        self.links: list[Link] = []
        self.risks: list[Risk] = list(risks)
        self.correlations: list[CorrelationGroup] = list(correlations)
        self.checkup_thresholds: dict[str, float] = {}   # Checkup thresholds this plan changed
        self.resources: list[Resource] = [r.validated() for r in resources]
        self.baselines: list = list(baselines)      # core.baseline.Baseline, oldest first
        self.odds_trend: list = list(odds_trend)    # core.baseline.TrendPoint, by status date
        self._listeners: list[Listener] = []
        self._analyzer = None  # the engine's compiled network for this plan (see analysis.analyze)
        if validated:
            self._take_checked(list(activities), list(links), ends_known)
        else:
            for act in activities:
                self._append(check_activity_text(act.validated()))
            for link in links:
                self._check_link(link)
                self.links.append(link)
        self._check_all_demands()

    def _take_checked(self, acts: list[Activity], links: list[Link], ends_known: bool = False) -> None:
        """Activities and links a file reader has validated: only duplicate ids and link
        ends are checked here, in bulk, falling back to one at a time to name a culprit."""
        self._index = dict(zip(map(attrgetter("id"), acts), range(len(acts))))
        if len(self._index) == len(acts):
            self._activities = acts
        else:
            self._index = {}
            for act in acts:
                self._append(act)       # raises, naming the duplicate
        self.links = links
        if ends_known and len(self._index) == len(acts):
            return
        ends = set(map(attrgetter("pred"), links))
        ends.update(map(attrgetter("succ"), links))
        if not ends <= self._index.keys():
            for link in links:
                if link.pred not in self._index or link.succ not in self._index:
                    self._check_link(link)   # raises, naming the unknown end

    # --- reading -------------------------------------------------------
    @property
    def activities(self) -> tuple[Activity, ...]:
        return tuple(self._activities)

    def __len__(self) -> int:
        return len(self._activities)

    def __contains__(self, act_id: str) -> bool:
        return act_id in self._index

    def activity(self, act_id: str) -> Activity:
        try:
            return self._activities[self._index[act_id]]
        except KeyError:
            raise PlanError(f"no activity with id {act_id!r}", act_id) from None

    def row_of(self, act_id: str) -> int:
        return self._index[act_id]

    def ids(self) -> list[str]:
        return [a.id for a in self._activities]

    def predecessors(self, act_id: str) -> list[Link]:
        return [l for l in self.links if l.succ == act_id]

    def successors(self, act_id: str) -> list[Link]:
        return [l for l in self.links if l.pred == act_id]

    # --- listeners -----------------------------------------------------
    def subscribe(self, listener: Listener) -> None:
        self._listeners.append(listener)

    def unsubscribe(self, listener: Listener) -> None:
        if listener in self._listeners:
            self._listeners.remove(listener)

    def _emit(self, event: str, **info) -> None:
        self._progress_rows = None          # any change may touch progress: found again when asked
        for listener in list(self._listeners):
            listener(event, info)

    def progress_rows(self) -> list[int]:
        """Rows of the activities with progress (kept until the plan next changes)."""
        rows = getattr(self, "_progress_rows", None)
        if rows is None:
            rows = self._progress_rows = [i for i, a in enumerate(self._activities)
                                          if a.progress is not None and not a.progress.is_empty]
        return rows

    # --- changing (commands call these) ---------------------------------
    def _append(self, act: Activity) -> None:
        if act.id in self._index:
            raise PlanError(f"duplicate activity id {act.id!r}", act.id)
        self._index[act.id] = len(self._activities)
        self._activities.append(act)

    def _reindex(self) -> None:
        self._index = {a.id: i for i, a in enumerate(self._activities)}

    def _check_link(self, link: Link) -> None:
        link.validated()
        for end in (link.pred, link.succ):
            if end not in self._index:
                raise PlanError(f"link {link.pred} \u2192 {link.succ}: unknown activity {end!r}", link.succ if end == link.pred else end)

    def resource(self, res_id: str) -> Resource:
        for r in self.resources:
            if r.id == res_id:
                return r
        raise PlanError(f"no resource with id {res_id!r}", res_id)

    def _check_demand(self, act: Activity) -> None:
        """Each resource an activity needs exists and can ever supply the units asked for."""
        if not act.resources:
            return
        known = {r.id: r for r in self.resources}
        for res, units in act.resources:
            if res not in known:
                raise PlanError(f"activity {act.id}: unknown resource {res!r}"
                                + (f" (resources: {', '.join(sorted(known))})" if known else " (the plan has no resources)"), act.id)
            most = known[res].most_units
            if units > most:
                raise PlanError(f"activity {act.id}: needs {units:g} units of {res} but at most {most:g} ever exist; "
                                f"it could never be scheduled", act.id)

    def _check_all_demands(self) -> None:
        ids = [r.id for r in self.resources]
        if len(set(ids)) != len(ids):
            dup = next(i for i in ids if ids.count(i) > 1)
            raise PlanError(f"duplicate resource id {dup!r}", dup)
        for act in self._activities:
            if act.resources:
                self._check_demand(act)

    def set_resources(self, resources: list[Resource]) -> list[Resource]:
        """Replace the plan's resources (checked against every activity's needs first)."""
        new, old = [r.validated() for r in resources], self.resources
        self.resources = new
        try:
            self._check_all_demands()
        finally:
            self.resources = old
        self._emit("about_to_change", kind="settings_changed")
        self.resources = new
        self._emit("changed", kind="settings_changed")
        return old

    def insert_activity(self, row: int, act: Activity) -> None:
        check_activity_text(act.validated())
        self._check_demand(act)
        if act.id in self._index:
            raise PlanError(f"duplicate activity id {act.id!r}", act.id)
        row = max(0, min(row, len(self._activities)))
        self._emit("about_to_change", kind="activity_inserted", row=row)
        self._activities.insert(row, act)
        self._reindex()
        self._emit("changed", kind="activity_inserted", row=row)

    def remove_activity(self, act_id: str) -> tuple[int, Activity, list[tuple[int, Link]]]:
        """Remove an activity and its links; return what is needed to put them back."""
        row = self.row_of(act_id)
        removed = [(i, l) for i, l in enumerate(self.links) if act_id in (l.pred, l.succ)]
        self._emit("about_to_change", kind="activity_removed", row=row)
        act = self._activities.pop(row)
        self.links = [l for l in self.links if act_id not in (l.pred, l.succ)]
        self._reindex()
        self._emit("changed", kind="activity_removed", row=row)
        return row, act, removed

    def restore_activity(self, row: int, act: Activity, links: list[tuple[int, Link]]) -> None:
        self._emit("about_to_change", kind="activity_inserted", row=row)
        self._activities.insert(row, act)
        self._reindex()
        for i, link in sorted(links):
            self.links.insert(i, link)
        self._emit("changed", kind="activity_inserted", row=row)

    def replace_activity(self, act_id: str, new: Activity) -> Activity:
        """Replace an activity (possibly renaming it: links follow the new id)."""
        check_activity_text(new.validated())
        self._check_demand(new)
        row = self.row_of(act_id)
        if new.id != act_id and new.id in self._index:
            raise PlanError(f"duplicate activity id {new.id!r}", new.id)
        self._emit("about_to_change", kind="activity_changed", row=row)
        old = self._activities[row]
        self._activities[row] = new
        if new.id != act_id:
            self.links = [Link(new.id if l.pred == act_id else l.pred, new.id if l.succ == act_id else l.succ, l.type, l.lag)
                          for l in self.links]
            self._reindex()
        self._emit("changed", kind="activity_changed", row=row)
        return old

    def move_activity(self, src: int, dst: int) -> None:
        self._emit("about_to_change", kind="activity_moved", row=src, to=dst)
        act = self._activities.pop(src)
        self._activities.insert(dst, act)
        self._reindex()
        self._emit("changed", kind="activity_moved", row=src, to=dst)

    def set_links(self, links: list[Link]) -> list[Link]:
        """Replace all links at once (validated first); return the old list."""
        for link in links:
            self._check_link(link)
        self._emit("about_to_change", kind="links_changed")
        old, self.links = self.links, list(links)
        self._emit("changed", kind="links_changed")
        return old

    def set_settings(self, settings: Settings) -> Settings:
        check_settings_text(settings.validated())
        self._emit("about_to_change", kind="settings_changed")
        old, self.settings = self.settings, settings
        self._emit("changed", kind="settings_changed")
        return old

    def set_checkup_thresholds(self, values: dict[str, float]) -> dict[str, float]:
        """Replace the plan's own Checkup thresholds (validated; see core.checkup_limits);
        return the old ones. Announced as a settings change."""
        from .checkup_limits import checked_thresholds

        values = checked_thresholds(values)
        self._emit("about_to_change", kind="settings_changed")
        old, self.checkup_thresholds = self.checkup_thresholds, values
        self._emit("changed", kind="settings_changed")
        return old

    def set_baselines(self, baselines: list) -> list:
        """Replace the baselines at once; return the old list."""
        self._emit("about_to_change", kind="baselines_changed")
        old, self.baselines = self.baselines, list(baselines)
        self._emit("changed", kind="baselines_changed")
        return old

    def set_odds_trend(self, points: list) -> list:
        """Replace the odds trend at once; return the old list."""
        self._emit("about_to_change", kind="odds_trend_changed")
        old, self.odds_trend = self.odds_trend, list(points)
        self._emit("changed", kind="odds_trend_changed")
        return old

    def reset(self, other: "Plan") -> None:
        """Take over the whole content of ``other`` (an import, a revert)."""
        self._emit("about_to_change", kind="reset")
        self.settings = other.settings
        self._activities = list(other._activities)
        self.links = list(other.links)
        self.risks = list(other.risks)
        self.correlations = list(other.correlations)
        self.checkup_thresholds = dict(getattr(other, "checkup_thresholds", {}))
        self.resources = list(other.resources)
        self.baselines = list(getattr(other, "baselines", ()))
        self.odds_trend = list(getattr(other, "odds_trend", ()))
        self._reindex()
        self._emit("changed", kind="reset")

    def snapshot(self) -> "Plan":
        """A copy another thread may read while this plan is edited (an autosave): the
        lists are copied (activities, links, risks and correlation groups are immutable),
        everything else deep-copied; no listeners. Cheap: nothing is validated again."""
        shallow = ("_activities", "links", "risks", "correlations", "_index")
        new = object.__new__(Plan)
        for name, value in self.__dict__.items():
            if name in shallow:
                value = type(value)(value)
            elif name not in ("_listeners", "_analyzer"):
                value = copy.deepcopy(value)
            new.__dict__[name] = value
        new._listeners, new._analyzer = [], None
        return new

    def copy(self) -> "Plan":
        twin = Plan(replace(self.settings, calendar=replace(self.settings.calendar),
                            sign_off=list(self.settings.sign_off)),
                    self._activities, self.links, self.risks, self.correlations, resources=self.resources,
                    baselines=self.baselines, odds_trend=self.odds_trend)
        twin.checkup_thresholds = dict(self.checkup_thresholds)
        return twin
