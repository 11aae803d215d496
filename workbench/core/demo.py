"""The demo plan: fitting out the Kestrel Vale community clinic (an invented scenario).

Forty-odd activities in seven groups, all four link types, lags (one negative), a
regional holiday calendar stored as dates, a committed opening date a little after the
PERT finish, sign-off names, one risk event and one correlation group, and four crews whose limits
make levelling hold a few activities back. Three streams of
work (the building and its services, the X-ray unit on a long delivery, the new staff)
run side by side and merge only at the inspection near the end, so a simulation's mean
finish sits visibly above the single-path PERT mean.

>>> from workbench.core.demo import demo_plan
>>> plan = demo_plan()
"""

from __future__ import annotations

import datetime as dt

from .calendar import public_holidays
from .model import Activity, Calendar, CorrelationGroup, Link, Plan, Resource, Risk, Settings, SignOff

REGION = "GB-ENG"
START = dt.date(2027, 3, 1)
COMMITTED_OPENING = dt.date(2027, 9, 10)

# id, name, group, (optimistic, most likely, pessimistic) in working days, or a fixed duration
ACTIVITIES = [
    ("M0", "Go-ahead from the health partnership board", "Approvals", 0),
    ("A1", "Confirm the clinical brief with the practice leads", "Approvals", (3, 5, 8)),
    ("A2", "Planning consent for the change of use", "Approvals", (15, 20, 35)),
    ("A3", "Fire safety design review", "Approvals", (5, 8, 14)),
    ("A4", "Appoint the fit-out contractor", "Approvals", (10, 15, 25)),
    ("D1", "Measured survey of the former bank building", "Design", (4, 6, 10)),
    ("D2", "Room layouts and room data sheets", "Design", (8, 12, 20)),
    ("D3", "Mechanical and electrical design", "Design", (10, 15, 25)),
    ("D4", "Tender drawings and specification", "Design", (5, 7, 12)),
    ("B1", "Contractor mobilisation and site set-up", "Building works", (3, 5, 8)),
    ("B2", "Strip-out of the banking hall", "Building works", (8, 10, 16)),
    ("B3", "Structural openings and steelwork", "Building works", (10, 14, 24)),
    ("B4", "Partitions, doors and suspended ceilings", "Building works", (12, 16, 26)),
    ("B5", "Hygienic floor finishes", "Building works", (6, 8, 13)),
    ("B6", "Painting and wall protection", "Building works", (6, 9, 14)),
    ("B7", "Replace the passenger lift", "Building works", (15, 20, 35)),
    ("B8", "Step-free entrance and ramp", "Building works", (5, 7, 12)),
    ("S1", "Electrical first fix", "Services", (8, 10, 16)),
    ("S2", "Plumbing and medical gas first fix", "Services", (8, 11, 18)),
    ("S3", "Ventilation plant and ductwork", "Services", (12, 16, 28)),
    ("S4", "Second fix and circuit testing", "Services", (8, 10, 15)),
    ("S5", "Commission heating, ventilation and water systems", "Services", (5, 7, 12)),
    ("S6", "Fire alarm and emergency lighting certificates", "Services", (2, 3, 6)),
    ("E1", "Specify imaging and treatment-room equipment", "Equipment", (5, 8, 12)),
    ("E2", "Manufacture and deliver the X-ray unit", "Equipment", (65, 80, 130)),
    ("E3", "Order consulting-room furniture and couches", "Equipment", (15, 20, 30)),
    ("E4", "Lead lining of the imaging room", "Equipment", (4, 5, 8)),
    ("E5", "Install and calibrate the X-ray unit", "Equipment", (4, 6, 10)),
    ("E6", "Radiation protection survey", "Equipment", (2, 3, 5)),
    ("E7", "Fit out the consulting rooms", "Equipment", (4, 5, 8)),
    ("I1", "Data cabling and wireless access points", "IT", (5, 7, 10)),
    ("I2", "Move patient records to the shared system", "IT", (15, 20, 35)),
    ("I3", "Telephony and nurse call", "IT", (4, 6, 10)),
    ("I4", "IT acceptance tests", "IT", (3, 4, 7)),
    ("P1", "Recruit reception, nursing and radiography staff", "People", (60, 75, 115)),
    ("P2", "Induction and equipment training", "People", (5, 8, 12)),
    ("P3", "Trial clinic days with volunteer patients", "People", (3, 5, 8)),
    ("X0", "Set up the temporary clinic in portable cabins", "Opening", (5, 7, 10)),
    ("X1", "Run the temporary clinic until trial days begin", "Opening", 60),
    ("O1", "Deep clean", "Opening", (2, 3, 4)),
    ("O2", "Care regulator inspection", "Opening", (1, 2, 4)),
    ("O3", "Clinic opens to patients", "Opening", 0),
]

# predecessor, successor, type, lag (working days)
LINKS = [
    ("M0", "A1"), ("M0", "D1"), ("A1", "A2"), ("A1", "D2"), ("D1", "D2"),
    ("D2", "D3", "SS", 5), ("D2", "D3", "FF", 3), ("D2", "A3"), ("D3", "D4"), ("A3", "D4"),
    ("D4", "A4"), ("A4", "B1"), ("A2", "B1"), ("B1", "B2"), ("B2", "B3"), ("B3", "B4"),
    ("B4", "B5"), ("B4", "B6", "SS", 8), ("B4", "B6", "FF", 2), ("B2", "B7"), ("B2", "B8"),
    ("B4", "S1", "SS", 4), ("B4", "S2", "SS", 5), ("B3", "S3"), ("S1", "S4"), ("S2", "S4"),
    ("B4", "S4", "FF", 3), ("S3", "S5"), ("S4", "S5"), ("S5", "S6"), ("A1", "E1"),
    ("E1", "E2"), ("E1", "E3"), ("B4", "E4"), ("E2", "E5"), ("E4", "E5"), ("E5", "E6"),
    ("E3", "E7"), ("B5", "E7"), ("S1", "I1", "SS", 3), ("A1", "I2", "FS", 10), ("I1", "I3"),
    ("I2", "I4"), ("I3", "I4"), ("A2", "P1"), ("P1", "P2"), ("I4", "P2"), ("E6", "P2"),
    ("P2", "P3"), ("E7", "P3"), ("S6", "P3"), ("A1", "X0"), ("X0", "X1"),
    ("P3", "X1", "SF", 0), ("B6", "O1", "FS", -2), ("B7", "O1"), ("B8", "O1"), ("S6", "O1"),
    ("O1", "O2"), ("P3", "O2"), ("E6", "O2"), ("O2", "O3"),
]

# Our own invented figures: id → (normal direct cost, crash cost, crash factor). The crash
# estimate is the normal three points times the factor (overtime, a second crew, an
# expediting fee, an agency recruiter); no factor: the activity cannot be shortened.
COSTS = {
    "A1": (4000, None, None), "A2": (6500, None, None), "A3": (5000, 7500, 0.7),
    "A4": (8000, 12000, 0.6), "D1": (3500, 5000, 0.7), "D2": (14000, 19000, 0.75),
    "D3": (26000, 34000, 0.75), "D4": (9000, 12500, 0.7), "B1": (12000, 15000, 0.6),
    "B2": (38000, 47000, 0.75), "B3": (64000, 80000, 0.75), "B4": (92000, 112000, 0.8),
    "B5": (28000, 34000, 0.75), "B6": (21000, 27000, 0.7), "B7": (85000, 98000, 0.85),
    "B8": (18000, 22000, 0.7), "S1": (31000, 38000, 0.75), "S2": (36000, 44000, 0.75),
    "S3": (74000, 88000, 0.8), "S4": (27000, 33000, 0.75), "S5": (15000, 19500, 0.7),
    "S6": (4500, None, None), "E1": (3000, 4000, 0.75), "E2": (240000, 270000, 0.8),
    "E3": (46000, 50000, 0.75), "E4": (12000, 14500, 0.8), "E5": (9000, 11500, 0.8),
    "E6": (2500, None, None), "E7": (8000, 10000, 0.75), "I1": (16000, 19000, 0.75),
    "I2": (22000, 28000, 0.75), "I3": (11000, 13000, 0.8), "I4": (3000, None, None),
    "P1": (18000, 30000, 0.8), "P2": (9500, 12000, 0.75), "P3": (6000, None, None),
    "X0": (14000, 17000, 0.7), "X1": (60000, None, None), "O1": (3000, 4500, 0.67),
    "O2": (1500, None, None), "M0": (0, None, None), "O3": (0, None, None),
}
INDIRECT_PER_DAY = 2400.0      # site management, the project office, the temporary clinic's lease
LATE_PER_DAY = 3000.0          # running the temporary clinic past the committed opening

# The crews: how many of each the contractor has on site, and who needs how many.
RESOURCES = [
    Resource("elec", "Electricians", 4.0),
    Resource("plumb", "Plumbers and gas fitters", 3.0),
    Resource("joiner", "Joiners and ceiling fixers", 6.0),
    Resource("hoist", "Hoist and lifting crew", 1.0),
]
NEEDS = {
    "B3": (("hoist", 1.0), ("joiner", 2.0)), "B4": (("joiner", 4.0),), "B5": (("joiner", 2.0),),
    "B6": (("joiner", 2.0),), "B7": (("hoist", 1.0),), "B8": (("joiner", 2.0),),
    "S1": (("elec", 3.0),), "S2": (("plumb", 3.0),), "S4": (("elec", 3.0),), "S5": (("plumb", 2.0),),
    "S6": (("elec", 1.0),), "I1": (("elec", 2.0),), "I3": (("elec", 2.0),), "E4": (("joiner", 2.0),),
    "E7": (("joiner", 2.0),),
}

SIGN_OFF = [
    SignOff("Priya Natarajan", "Director of Clinical Services"),
    SignOff("Tomasz Wren", "Estates and Facilities Manager"),
    SignOff("Aoife Marsh", "Finance Business Partner"),
]


def _activity(row) -> Activity:
    act_id, name, group, estimate = row
    needs = NEEDS.get(act_id, ())
    if isinstance(estimate, tuple):
        a, m, b = (float(x) for x in estimate)
        act = Activity(act_id, name, group, optimistic=a, most_likely=m, pessimistic=b, resources=needs)
    else:
        act = Activity(act_id, name, group, duration=float(estimate), resources=needs)
    return _costed(act)


def _costed(act: Activity) -> Activity:
    cost, crash_cost, factor = COSTS[act.id]
    if factor is None:
        return act.with_(cost=float(cost))
    a, m, b = (round(float(x) * factor, 1) for x in (act.optimistic, act.most_likely, act.pessimistic))
    return act.with_(cost=float(cost), crash_cost=float(crash_cost), crash_optimistic=a,
                     crash_most_likely=m, crash_pessimistic=b)


def _link(row) -> Link:
    pred, succ, *rest = row
    kind, lag = (rest + ["FS", 0])[:2] if rest else ("FS", 0)
    return Link(pred, succ, kind, float(lag))


def demo_settings() -> Settings:
    holidays = tuple(public_holidays(REGION, [START.year, START.year + 1]))
    return Settings(
        title="Kestrel Vale community clinic fit-out", start=START, unit="days",
        calendar=Calendar(workdays=(0, 1, 2, 3, 4), holidays=holidays, region=REGION),
        deadline=COMMITTED_OPENING, target_confidence=0.8, distribution="beta-pert",
        revision="B", prepared_by="Kestrel Vale Health Partnership project office",
        sign_off=list(SIGN_OFF), indirect_cost=INDIRECT_PER_DAY, late_penalty=LATE_PER_DAY,
    )


def demo_plan() -> Plan:
    """A fresh copy of the demo plan (safe to edit)."""
    risks = [Risk("R1", "Asbestos found behind the banking-hall panelling", 0.2, 5.0, 10.0, 20.0, ("B2",))]
    together = [CorrelationGroup("Fit-out contractor's productivity", ("B3", "B4", "B5", "B6"), 0.5)]
    return Plan(demo_settings(), [_activity(r) for r in ACTIVITIES], [_link(r) for r in LINKS],
                risks, together, resources=RESOURCES)
