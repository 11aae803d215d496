"""Checks of our own on the odds, from the last simulation run (common practice; no published
source): merge hot spots (see :mod:`.merge_spots`) and odds disagreement — PERT's chance of
the deadline and the simulation's differ by more than ``odds_gap_points``, with one sentence
on why (merge bias, risk events, correlated durations)."""

from __future__ import annotations

from dataclasses import replace

from .checkup_frame import CheckupFrame, counted, names, _source
from .checkup_limits import differs
from .checkup_result import FAIL, NA, OWN_ODDS, PASS, Check
from .merge_spots import merge_hot_spots, replay_runs, sampled_durations

NO_RUN = "Needs a simulation: run one (Odds view, or --iterations on the command line)."
CHANGED = "The plan's activities changed since the last simulation: run it again."


STALE = ", made before the latest edit: run it again to bring it up to date."


def as_stale(check: Check) -> Check:
    """A simulation-based check from an earlier run, saying the plan changed since."""
    if not check.uses_simulation or check.status == NA or STALE in check.note:
        return check
    return replace(check, note=check.note.rstrip(".") + STALE)


def _run_note(frame: CheckupFrame, result, stale: bool) -> str:
    note = f"From the simulation of {result.iterations:,} runs (seed {result.seed})"
    return note + (STALE if stale else ".")


def _usable(frame: CheckupFrame, result) -> str:
    if result is None:
        return NO_RUN
    if list(result.ids) != list(frame.ids):
        return CHANGED
    return ""


def _na(check_id: str, name: str, threshold: str, note: str) -> Check:
    return Check(check_id, name, NA, None, threshold, "not applicable", [], note,
                 _source("merge_branch_pct"), OWN_ODDS, uses_simulation=True)


def hot_spots_for(frame: CheckupFrame, result):
    """Merge hot spots of the run (None when there is no usable run)."""
    if _usable(frame, result):
        return None
    d = sampled_durations(result, frame.plan)
    return merge_hot_spots(frame.plan, d, frame.limit("merge_branch_pct") / 100.0, frame.analysis.calendar)


def _describe(spot, unit: str) -> str:
    branches = ", ".join(f"{'-'.join(_short(path))} ({share * 100:.0f} %)" for _, share, path in spot.branches)
    return f"{spot.merge} where {branches} meet adds {spot.bias:.2f} {unit}"


def _short(path: list[str]) -> list[str]:
    return path if len(path) <= 4 else [path[0], "\u2026", *path[-2:]]


def merge_check(frame: CheckupFrame, result, spots, stale: bool) -> Check:
    limit, pct = frame.limit("merge_hot_spots_count"), frame.limit("merge_branch_pct")
    threshold = f"<= {limit:g}"
    why = _usable(frame, result)
    if why:
        return _na("merge_hot_spots", "Merge hot spots", threshold, why)
    offenders = [s.merge for s in spots]
    runs = result.iterations if getattr(result, "durations", None) is not None else replay_runs(result, frame.plan)
    measured = f" (measured on {runs:,} of its runs, replayed at its seed)" if runs < result.iterations else ""
    note = (f"Merges where paths each critical in at least {pct:g} % of runs converge{measured}"
            + (": " + "; ".join(_describe(s, frame.unit) for s in spots[:3]) + "." if spots else ": none.")
            + " " + _run_note(frame, result, stale))
    keys = ("merge_branch_pct", "merge_hot_spots_count")
    return Check("merge_hot_spots", "Merge hot spots", PASS if len(spots) <= limit + 1e-9 else FAIL,
                 float(len(spots)), threshold, counted(len(spots), "merges"), offenders, note,
                 _source("merge_branch_pct"), OWN_ODDS, any(differs(k, frame.limit(k)) for k in keys), True)


def odds_check(frame: CheckupFrame, result, spots, stale: bool) -> Check:
    gap_limit = frame.limit("odds_gap_points")
    threshold = f"<= {gap_limit:g} points"
    why = _usable(frame, result)
    if why or result.deadline is None:
        return _na("odds_disagreement", "Odds disagreement", threshold, why or "Set a deadline to compare the odds.")
    pert = frame.analysis.pert.prob_by(result.deadline)
    sim = result.prob_by(result.deadline)[0]
    gap = 100.0 * abs(pert - sim)
    status = PASS if gap <= gap_limit + 1e-9 else FAIL
    note = (f"PERT gives {pert * 100:.0f} % and the simulation {sim * 100:.0f} % by the deadline"
            + (": " + reasons(frame, result, spots) if status == FAIL else ".") + " " + _run_note(frame, result, stale))
    offenders = [s.merge for s in spots] if status == FAIL else []
    return Check("odds_disagreement", "Odds disagreement", status, gap, threshold, f"{gap:.1f} points",
                 offenders, note, _source("odds_gap_points"), OWN_ODDS, differs("odds_gap_points", gap_limit), True)


def reasons(frame: CheckupFrame, result, spots) -> str:
    """Why PERT and the simulation differ, largest cause first, as the rest of one sentence."""
    unit = frame.unit
    from_risks = sum((r.get("fired") or 0.0) * (r.get("finish_impact") or 0.0) for r in result.risk_report or ())
    from_merges = result.merge_bias - max(from_risks, 0.0)
    causes = []
    if from_merges > 0.05 and spots:
        causes.append((from_merges, f"merge bias adds about {from_merges:.1f} {unit} "
                                    f"(mostly at {names([s.merge for s in spots], 3)})"))
    elif from_merges > 0.05:
        causes.append((from_merges, f"merging paths add about {from_merges:.1f} {unit}"))
    if from_risks > 0.05:
        fired = [r["id"] for r in result.risk_report if r.get("fired")]
        causes.append((from_risks, f"risk events ({names(fired, 3)}), which PERT leaves out, add about "
                                   f"{from_risks:.1f} {unit}"))
    corr = getattr(frame.plan, "correlations", None)
    if corr and result.pert_sd > 0 and result.sd > 1.1 * result.pert_sd:
        causes.append((0.0, f"correlated durations widen the spread (sd {result.sd:.1f} against "
                            f"PERT's {result.pert_sd:.1f} {unit})"))
    if not causes:
        return (f"the simulation's spread (sd {result.sd:.1f} {unit}) differs from PERT's single path "
                f"({result.pert_sd:.1f} {unit}).")
    causes.sort(key=lambda c: -c[0])
    return "; ".join(text for _, text in causes) + "."
