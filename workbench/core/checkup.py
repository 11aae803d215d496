"""Checkup: is this schedule sound enough to sign?

``run_checkup(plan)`` grades the plan against the DCMA 14-point schedule assessment
(DCMA-EA PAM 200.1, EVMS Program Analysis Pamphlet, Defense Contract Management Agency,
October 2012, section 4; thresholds recalled [memory]) and against checks of our own on
the estimates and the odds (common practice). Thresholds are the plan's own where it set
them (``Plan.checkup_thresholds``), else the defaults (:mod:`.checkup_limits`).

>>> from workbench.core.checkup import run_checkup
>>> run_checkup(plan).summary_text()
'Checkup: 9 of 13 pass'
"""

from __future__ import annotations

import numpy as np

from . import checkup_cpt, checkup_estimates, checkup_logic, checkup_odds, checkup_progress, checkup_status
from .checkup_frame import CheckupFrame
from .checkup_limits import thresholds_of
from .checkup_result import Checkup

STANDARD_CHECKS = (
    checkup_logic.missing_logic, checkup_logic.leads, checkup_logic.lags, checkup_logic.link_types,
    checkup_logic.hard_constraints, checkup_logic.high_float, checkup_logic.negative_float,
    checkup_logic.long_durations, checkup_status.invalid_dates, checkup_logic.resources,
    checkup_status.missed_activities, checkup_cpt.critical_path_test, checkup_logic.cpli,
    checkup_status.bei,
)
STANDARD_IDS = ("missing_logic", "leads", "lags", "link_types", "hard_constraints", "high_float",
                "negative_float", "long_durations", "invalid_dates", "resources", "missed_activities",
                "critical_path_test", "cpli", "bei")
OWN_IDS = ("false_certainty", "suspicious_ranges", "merge_hot_spots", "odds_disagreement")


def frame_for(plan, analysis=None) -> CheckupFrame:
    """The shared input of every metric (analyses the plan when no analysis is given)."""
    if analysis is None:
        from .analysis import analyze
        analysis = analyze(plan)
    facts = checkup_progress.progress_facts(plan, analysis.calendar)
    incomplete = ~facts.done if facts.has_progress else np.ones(len(analysis.schedule.ids), dtype=bool)
    return CheckupFrame(plan, analysis, thresholds_of(plan), facts, incomplete)


def run_checkup(plan, analysis=None, simulation=None, *, simulation_stale: bool = False,
                with_simulation: bool = True, earlier_odds: list | None = None) -> Checkup:
    """Every check on ``plan``. ``analysis``: its current analysis (computed when None);
    ``simulation``: the last simulation result, or None; ``simulation_stale``: the plan
    changed since that run (the checks using it say so). ``with_simulation=False`` leaves the
    simulation-based checks not applicable without looking at the run (cheap);
    ``earlier_odds``: the simulation-based checks computed earlier from the last run (see
    :func:`odds_checks`), reused as they are — marked stale with ``simulation_stale``."""
    frame = frame_for(plan, analysis)
    checks = [check(frame) for check in STANDARD_CHECKS]
    arrays = checkup_estimates.estimate_arrays(plan)
    checks += [checkup_estimates.false_certainty(frame, arrays), checkup_estimates.suspicious_ranges(frame, arrays)]
    if earlier_odds is not None:
        checks += [checkup_odds.as_stale(c) if simulation_stale else c for c in earlier_odds]
    else:
        checks += odds_checks(frame, simulation if with_simulation else None, simulation_stale)
    seed = None if simulation is None else simulation.seed
    return Checkup(checks, seed, simulation_stale)


def odds_checks(frame: CheckupFrame, simulation, stale: bool = False) -> list:
    """The two simulation-based checks (not applicable without a usable run)."""
    spots = checkup_odds.hot_spots_for(frame, simulation) or []
    return [checkup_odds.merge_check(frame, simulation, spots, stale),
            checkup_odds.odds_check(frame, simulation, spots, stale)]
