"""Geometry of the Odds view: the finish-time curve, the shaded answer to a question,
the inverse (date at a confidence), simulation bars and S-curve, and the PERT-versus-
simulation table. Pure numpy/scipy — shared by the screen and the printed pack.

All x values are plan offsets (plan units from the project start). A question's date
offsets are "through" offsets: the end of a working day (``WorkCalendar.offset_through``).
"""

from __future__ import annotations

import datetime as dt
import math
from dataclasses import dataclass, field

import numpy as np

from workbench.core.normal import ndtr   # scalar Φ from the standard library: no scipy at start-up

from workbench.core import formatting as fm

MODES = ("by", "after", "between")
PRESETS = (0.8, 0.9)
MARKERS = ("P50", "P80", "P90")
TOLERANCE = 1e-9  # a finish within this of a date counts as by that date (sums of sixths)
CAUTION = (
    "Caution: these odds are only as good as the three-point estimates, which are "
    "judgement. PERT assumes one path decides the finish and that durations are "
    "independent; it is optimistic where paths merge. A committed date rests with the "
    "organisation's own approval rules, not with this chart."
)


# --- the question ---------------------------------------------------------------
@dataclass(frozen=True)
class Question:
    """"Finish by d1", "finish after d1" or "finish between d1 and d2" (offsets)."""

    mode: str
    d1: float
    d2: float | None = None

    def validated(self) -> "Question":
        if self.mode not in MODES:
            raise ValueError(f"question mode must be one of {', '.join(MODES)}, not {self.mode!r}")
        if not math.isfinite(self.d1):
            raise ValueError(f"question date must be a finite offset, not {self.d1}")
        if self.mode == "between":
            if self.d2 is None or not math.isfinite(self.d2):
                raise ValueError("a 'between' question needs a second, finite date")
        return self

    def bounds(self) -> tuple[float, float]:
        """The shaded offsets (low, high) with ±inf for open ends."""
        if self.mode == "by":
            return -math.inf, self.d1
        if self.mode == "after":
            return self.d1, math.inf
        lo, hi = sorted((self.d1, self.d2))
        return lo, hi


def pert_probability(odds, question: Question) -> float:
    """The PERT answer to a question (a step, 0 or 1, when the variance is zero)."""
    q = question.validated()
    if q.mode == "by":
        return odds.prob_by(q.d1)
    if q.mode == "after":
        return odds.prob_after(q.d1)
    lo, hi = q.bounds()
    return odds.prob_between(lo, hi)


def sim_probability(result, question: Question) -> float:
    """The simulation's answer: the share of iterations finishing in the question's range."""
    finish = np.asarray(result.finish, dtype=float)
    lo, hi = question.validated().bounds()
    inside = (finish > lo + TOLERANCE) & (finish <= hi + TOLERANCE)  # as SimulationResult.prob_by
    return float(np.count_nonzero(inside)) / max(1, finish.size)


def sim_answer(result, question: Question) -> tuple[float, float]:
    """The simulation's answer and its standard error (binomial, from the iteration count)."""
    p = sim_probability(result, question)
    n = max(1, np.size(result.finish))
    return p, math.sqrt(p * (1.0 - p) / n)


# --- the PERT curve ------------------------------------------------------------
@dataclass(frozen=True)
class OddsCurve:
    """Density and cumulative probability of the PERT finish on ``x``.

    ``step`` marks a zero-variance plan: the finish is certain, the cumulative curve is a
    step at ``mean`` and there is no density to draw (``density`` is all zero)."""

    x: np.ndarray
    density: np.ndarray
    cumulative: np.ndarray
    mean: float
    sd: float
    step: bool


@dataclass(frozen=True)
class Shade:
    """A closed polygon (x, y) under a density and the probability it stands for."""

    x: np.ndarray
    y: np.ndarray
    probability: float
    pieces: tuple[tuple[float, float], ...] = field(default=())

    def area(self) -> float:
        """The polygon's area (shoelace), for checks."""
        if self.x.size < 3:
            return 0.0
        return 0.5 * abs(float(np.dot(self.x, np.roll(self.y, -1)) - np.dot(self.y, np.roll(self.x, -1))))


def axis_span(odds, result=None, extra=()) -> tuple[float, float]:
    """Offsets to show: mean ± 4σ, the simulation's range and any extra offsets."""
    if odds.variance > 0:
        lo, hi = odds.mean - 4 * odds.sd, odds.mean + 4 * odds.sd
    else:
        pad = max(1.0, 0.1 * abs(odds.mean))
        lo, hi = odds.mean - pad, odds.mean + pad
    if result is not None and np.size(result.finish):
        lo, hi = min(lo, float(np.min(result.finish))), max(hi, float(np.max(result.finish)))
    for value in extra:
        if value is not None and math.isfinite(value):
            lo, hi = min(lo, value), max(hi, value)
    margin = 0.03 * (hi - lo)
    return max(0.0, lo - margin) if lo >= 0 else lo - margin, hi + margin


def pert_curve(odds, lo: float, hi: float, samples: int = 401) -> OddsCurve:
    """The normal finish curve of the PERT path on [lo, hi]."""
    if odds.variance <= 0:
        m = float(odds.mean)
        x = np.array([lo, m, m, hi], dtype=float)
        return OddsCurve(x, np.zeros(4), np.array([0.0, 0.0, 1.0, 1.0]), m, 0.0, True)
    x = np.linspace(lo, hi, samples)
    dens = _normal_pdf(x, odds.mean, odds.sd)
    cum = np.array([ndtr(z) for z in ((x - odds.mean) / odds.sd).tolist()])   # a few hundred points
    return OddsCurve(x, dens, cum, float(odds.mean), float(odds.sd), False)


def curve_height(curve: OddsCurve, x: float) -> float:
    """The density drawn at ``x`` (zero off the curve and for a certain finish)."""
    if curve.step:
        return 0.0
    return float(np.interp(x, curve.x, curve.density, left=0.0, right=0.0))


def _clip(question: Question, lo: float, hi: float) -> tuple[float, float] | None:
    a, b = question.bounds()
    a, b = max(a, lo), min(b, hi)
    return (a, b) if b > a else None


def pert_shade(odds, question: Question, lo: float, hi: float, samples: int = 241) -> Shade:
    """The region under the PERT curve for the question, clipped to [lo, hi]."""
    prob = pert_probability(odds, question)
    piece = _clip(question, lo, hi)
    if odds.variance <= 0 or piece is None:
        return Shade(np.zeros(0), np.zeros(0), prob, ())
    x = np.linspace(piece[0], piece[1], samples)
    y = _normal_pdf(x, odds.mean, odds.sd)
    px = np.concatenate(([piece[0]], x, [piece[1]]))
    py = np.concatenate(([0.0], y, [0.0]))
    return Shade(px, py, prob, (piece,))


# --- the inverse question ------------------------------------------------------
def parse_confidence(text: str) -> float:
    """A typed confidence ("90", "90 %", "0.9") as a probability strictly in (0, 1)."""
    raw = str(text).strip().rstrip("%").strip().replace(",", ".")
    try:
        value = float(raw)
    except ValueError:
        raise ValueError(f"confidence: {text!r} is not a number; type e.g. 85 or 85 %") from None
    if value >= 1.0 or str(text).strip().endswith("%"):
        value /= 100.0
    if not 0.0 < value < 1.0 or not math.isfinite(value):
        raise ValueError(f"confidence: {text!r} must lie strictly between 0 % and 100 %")
    return value


def pert_offset_at(odds, probability: float) -> float:
    """The finish offset reached with the given probability under PERT."""
    return odds.duration_at(probability)


def sim_offset_at(result, probability: float) -> float:
    """The finish offset reached in the given share of iterations."""
    return float(result.percentile(100.0 * probability))


def snap_offset(calendar, offset: float) -> float:
    """The end of the working day (or the week part) nearest to an offset."""
    per = getattr(calendar, "per_unit", 1) or 1
    return round(offset * per) / per


def day_end(calendar, offset: float) -> float:
    """The end of the working day during which ``offset`` falls (never earlier)."""
    per = getattr(calendar, "per_unit", 1) or 1
    return math.ceil(offset * per - 1e-9) / per


# --- simulation geometry ------------------------------------------------------
@dataclass(frozen=True)
class SimFigure:
    """Histogram bars (density-scaled: total area 1), the S-curve and percentile markers."""

    edges: np.ndarray
    heights: np.ndarray
    ecdf_x: np.ndarray
    ecdf_y: np.ndarray
    markers: dict
    iterations: int
    seed: object

    def step_outline(self) -> tuple[np.ndarray, np.ndarray]:
        """The histogram's outline as one stepped polyline from the first to the last edge."""
        x = np.repeat(self.edges, 2)
        y = np.concatenate(([0.0], np.repeat(self.heights, 2), [0.0]))
        return x, y


def sim_figure(result, bins: int = 40) -> SimFigure:
    """Bars and S-curve of a SimulationResult on the offset axis."""
    finish = np.sort(np.asarray(result.finish, dtype=float))
    lo, hi = float(finish[0]), float(finish[-1])
    if hi - lo < 1e-9:
        lo, hi = lo - 0.5, hi + 0.5
    counts, edges = np.histogram(finish, bins=bins, range=(lo, hi))
    heights = counts / (finish.size * np.diff(edges))
    ecdf_y = np.arange(1, finish.size + 1) / finish.size
    markers = {name: sim_offset_at(result, int(name[1:]) / 100.0) for name in MARKERS}
    return SimFigure(edges, heights, finish, ecdf_y, markers, int(finish.size),
                     getattr(result, "seed", None))


def sim_shade(fig: SimFigure, question: Question, probability: float | None = None) -> Shade:
    """The histogram's area inside the question's range, as one stepped polygon per piece."""
    piece = _clip(question, float(fig.edges[0]), float(fig.edges[-1]))
    if piece is None:
        return Shade(np.zeros(0), np.zeros(0), probability or 0.0, ())
    a, b = piece
    inner = fig.edges[(fig.edges > a) & (fig.edges < b)]
    cuts = np.concatenate(([a], inner, [b]))
    mids = 0.5 * (cuts[:-1] + cuts[1:])
    idx = np.clip(np.searchsorted(fig.edges, mids, side="right") - 1, 0, fig.heights.size - 1)
    h = fig.heights[idx]
    px = np.concatenate(([a], np.repeat(cuts, 2)[1:-1], [b]))
    py = np.concatenate(([0.0], np.repeat(h, 2), [0.0]))
    area = float(np.sum(h * np.diff(cuts)))
    return Shade(px, py, area if probability is None else probability, (piece,))


# --- text: readout and comparison --------------------------------------------
format_date = fm.format_date             # one date format everywhere (workbench.core.formatting)
format_probability = fm.format_percent   # one way to write a chance: "85.5 %"


def _normal_pdf(x, mean: float, sd: float):
    """The normal density (scipy.stats.norm.pdf, without importing scipy.stats)."""
    z = (np.asarray(x, dtype=float) - mean) / sd
    return np.exp(-0.5 * z * z) / (sd * math.sqrt(2.0 * math.pi))


def confidence_label(q: float) -> str:
    """'P80', 'P97.5', 'P99.9999': as many decimals as the confidence needs (never 'P100')."""
    return "P" + f"{100.0 * float(q):.4f}".rstrip("0").rstrip(".")


def date_of(calendar, offset: float) -> dt.date:
    """The calendar day by whose end a finish at ``offset`` has happened."""
    return calendar.finish_date(float(offset))


def readout_lines(odds, question: Question, calendar, unit: str) -> list[str]:
    """The numbers beside the curve: the question, z, probability, mean, σ, path."""
    q = question.validated()
    p = pert_probability(odds, q)
    lines = [_question_text(q, calendar), f"PERT probability: {format_probability(p)}"]
    if q.mode == "between":
        lo, hi = q.bounds()
        lines.append(f"z: {_z_text(odds.z(lo))} to {_z_text(odds.z(hi))}")
    else:
        lines.append(f"z: {_z_text(odds.z(q.d1))}")
    lines.append(f"Mean finish: {format_date(date_of(calendar, odds.mean))} "
                 f"({fm.format_duration(odds.mean, unit)} from the start)")
    lines.append(f"σ: {fm.format_duration(odds.sd, unit)}"
                 + ("  (no spread: the finish is certain)" if odds.variance <= 0 else ""))
    lines.append(f"Path: {'-'.join(odds.path)}")
    if odds.note:
        lines.append(f"Note: {odds.note}")
    return lines


def question_headline(q: Question, calendar, deadline: float | None = None) -> str:
    """The question as a reader would ask it: "Finish by Fri 13 Mar 2026?" (naming the
    deadline when the date is the plan's deadline)."""
    if q.mode != "between" and deadline is not None and abs(q.d1 - deadline) < 1e-9:
        word = "by" if q.mode == "by" else "after"
        return f"Finish {word} the deadline, {format_date(date_of(calendar, q.d1))}?"
    if q.mode == "between":
        lo, hi = q.bounds()
        return (f"Finish after {format_date(date_of(calendar, lo))} "
                f"and by {format_date(date_of(calendar, hi))}?")
    word = "by" if q.mode == "by" else "after"
    return f"Finish {word} {format_date(date_of(calendar, q.d1))}?"


def _z_text(z: float) -> str:
    if math.isinf(z):
        return "+∞" if z > 0 else "−∞"
    return f"{z:+.3f}"


def _question_text(q: Question, calendar) -> str:
    if q.mode == "between":
        lo, hi = q.bounds()
        return f"Finish after {format_date(date_of(calendar, lo))} and by {format_date(date_of(calendar, hi))}"
    word = "by" if q.mode == "by" else "after"
    return f"Finish {word} {format_date(date_of(calendar, q.d1))}"


@dataclass(frozen=True)
class ComparisonRow:
    label: str
    pert: float
    sim: float
    kind: str  # "offset" or "probability"


def offset_rows(odds, result) -> list[ComparisonRow]:
    """PERT next to simulation: mean finish, P50, P80, P90 (offsets)."""
    rows = [ComparisonRow("Mean finish", float(odds.mean), float(np.mean(result.finish)), "offset")]
    for name in MARKERS:
        p = int(name[1:]) / 100.0
        rows.append(ComparisonRow(name, pert_offset_at(odds, p), sim_offset_at(result, p), "offset"))
    return rows


def question_row(odds, result, question: Question) -> ComparisonRow:
    """PERT next to simulation: the question's probability."""
    label = {"by": "P(finish by)", "after": "P(finish after)", "between": "P(finish between)"}[question.mode]
    return ComparisonRow(label, pert_probability(odds, question), sim_probability(result, question), "probability")


def comparison_rows(odds, result, question: Question) -> list[ComparisonRow]:
    """The whole comparison: mean, P50, P80, P90 and the question's probability."""
    return offset_rows(odds, result) + [question_row(odds, result, question)]


def comparison_cells(rows, calendar, unit: str) -> list[tuple[str, str, str]]:
    """The comparison as text cells (label, PERT, simulation): dates and chances."""
    def cell(value: float, kind: str) -> str:
        if kind == "probability":
            return format_probability(value)
        return format_date(date_of(calendar, value))
    return [(r.label, cell(r.pert, r.kind), cell(r.sim, r.kind)) for r in rows]


HALF_A_DAY = {"days": 0.5, "weeks": 0.1}   # in plan units (a five-day week)


def merge_bias_gap(odds, result, unit: str) -> float | None:
    """The simulated mean minus PERT's when the gap matters: at least half a working day
    and more than twice the simulation's own noise (standard error of its mean); else None."""
    finish = np.asarray(result.finish, dtype=float)
    gap = float(np.mean(finish)) - float(odds.mean)
    noise = 2.0 * float(np.std(finish)) / math.sqrt(max(1, finish.size))
    if abs(gap) < max(HALF_A_DAY.get(unit, 0.5), noise):
        return None
    return gap


def merge_bias_note(odds, result, unit: str) -> str:
    """Why the simulated finish differs from single-path PERT — said only when the gap
    matters (see :func:`merge_bias_gap`) — and which risk events struck."""
    fired = [r for r in (getattr(result, "risk_report", None) or []) if r.get("fired")]
    risks = ""
    if fired:
        named = ", ".join(f"{r['id']} ({r['fired'] * 100:.0f} % of runs)" for r in fired[:4])
        more = f" and {len(fired) - 4} more" if len(fired) > 4 else ""
        risks = f" Risk events, which PERT leaves out, also add delay: {named}{more}."
    gap = merge_bias_gap(odds, result, unit)
    if gap is None:
        return risks.strip()
    size = fm.format_duration(abs(gap), unit)
    if gap > 0:
        return (f"The simulated mean is {size} later than PERT: the finish waits for "
                "the latest of the paths that merge, and PERT follows only one of them." + risks)
    return (f"The simulated mean is {size} earlier than PERT: the duration distributions "
            "chosen for the simulation have lower means than PERT's te." + risks)
