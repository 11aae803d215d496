"""Plans for the tests: invented ones (no outside source) and one published reference network (R1)."""

from __future__ import annotations

import datetime as dt

from workbench.core.model import Activity, Calendar, Link, Plan, Settings, SignOff

# (id, name, group, optimistic, most likely, pessimistic, predecessors)
FOOTBRIDGE = (
    ("S1", "Survey the old deck", "Design", 3, 4, 8, ""),
    ("S2", "Load test of the piers", "Design", 4, 6, 12, "S1"),
    ("D1", "Outline design", "Design", 8, 10, 16, "S1"),
    ("D2", "Detailed design", "Design", 10, 14, 24, "D1;S2"),
    ("P1", "Planning consent", "Approvals", 15, 20, 40, "D1"),
    ("P2", "River authority permit", "Approvals", 10, 15, 30, "D1"),
    ("T1", "Tender the steelwork", "Procurement", 8, 10, 14, "D2"),
    ("T2", "Fabricate the new deck", "Procurement", 20, 25, 35, "T1"),
    ("W1", "Site set-up and fencing", "Works", 2, 3, 5, "P1;P2"),
    ("W2", "Remove the old deck", "Works", 4, 5, 9, "W1"),
    ("W3", "Repair the piers", "Works", 8, 12, 20, "W2;S2"),
    ("W4", "Lift in the new deck", "Works", 2, 3, 6, "W3;T2"),
    ("W5", "Surfacing and railings", "Works", 5, 7, 10, "W4"),
    ("W6", "Lighting", "Works", 3, 4, 7, "W4"),
    ("H1", "Safety inspection", "Handover", 1, 2, 4, "W5;W6"),
    ("H2", "Opening", "Handover", 0, 0, 0, "H1"),
)


def plan_from_rows(rows, title="Riverside footbridge renewal", deadline=82.0, **settings) -> Plan:
    acts = [Activity(i, name=n, group=g, optimistic=a, most_likely=m, pessimistic=b)
            for i, n, g, a, m, b, _ in rows]
    links = [Link(p.strip(), i) for i, *_, preds in rows for p in preds.split(";") if p.strip()]
    base = dict(title=title, start=dt.date(2027, 3, 1), deadline=deadline, revision="C",
                prepared_by="Planning office", status_date=dt.date(2027, 2, 22),
                calendar=Calendar(holidays=(dt.date(2027, 4, 2), dt.date(2027, 4, 5))),
                sign_off=[SignOff("Ada Marsh", "Project sponsor"), SignOff("Tom Reyes", "Finance lead")])
    base.update(settings)
    return Plan(Settings(**base), acts, links)


def footbridge_plan(**settings) -> Plan:
    return plan_from_rows(FOOTBRIDGE, **settings)


def long_plan(n: int = 120, seed: int = 3) -> Plan:
    """A long chain-and-branch plan (n activities) for tiling checks."""
    import random

    rnd = random.Random(seed)
    rows = []
    for k in range(n):
        preds = [f"A{j}" for j in {k - 1, k - rnd.randint(2, 6)} if 0 <= j < k]
        a = rnd.randint(1, 5)
        rows.append((f"A{k}", f"Work package {k} with a longer descriptive name", f"Stage {k // 30}",
                     a, a + rnd.randint(0, 4), a + rnd.randint(5, 12), ";".join(preds)))
    return plan_from_rows(rows, title="Long plan", deadline=None)


# House-building bid, Hillier & Lieberman (reference R1); three-point estimates [memory]
R1 = {"A": ("", 1, 2, 3), "B": ("A", 2, 3.5, 8), "C": ("B", 6, 9, 18), "D": ("C", 4, 5.5, 10),
      "E": ("C", 1, 4.5, 5), "F": ("E", 4, 4, 10), "G": ("D", 5, 6.5, 11), "H": ("E,G", 5, 8, 17),
      "I": ("C", 3, 7.5, 9), "J": ("F,I", 3, 9, 9), "K": ("J", 4, 4, 4), "L": ("J", 1, 5.5, 7),
      "M": ("H", 1, 2, 3), "N": ("K,L", 5, 5.5, 9)}


def house_plan(deadline=47.0) -> Plan:
    acts = [Activity(k, name=f"step {k}", optimistic=a, most_likely=m, pessimistic=b)
            for k, (_, a, m, b) in R1.items()]
    links = [Link(p, k) for k, (ps, *_) in R1.items() for p in ps.split(",") if p]
    return Plan(Settings(title="House", start=dt.date(2026, 3, 2), unit="weeks", deadline=deadline),
                acts, links)


def small_plan():
    # A → B → D is critical (2 + 5 + 1); A → C → D has 3 days of float
    acts = [Activity(id="A", name="Dig trench", duration=2.0), Activity(id="B", name="Lay cable", duration=5.0),
            Activity(id="C", name="Order lamps", duration=2.0), Activity(id="D", name="Switch on", duration=1.0)]
    links = [Link("A", "B"), Link("A", "C"), Link("B", "D"), Link("C", "D", "SS", 2.0)]
    return Plan(Settings(title="Lamps"), acts, links)
