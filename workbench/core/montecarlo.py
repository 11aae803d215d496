"""Monte Carlo schedule risk: many sets of sampled durations through the critical-path engine.

``simulate(plan, iterations, seed)`` samples every activity's duration (``distributions``),
correlates ranks (``correlation``), adds risk events (``risk_events``) and runs the same
forward and backward passes as the critical-path engine on 2-D arrays (activities ×
iterations), block by block so memory stays bounded. A second, cheaper pass regenerates
the scores to compute rank sensitivities once the finish ranks are known. The method and
every index are described in docs/simulation.md.
"""

from __future__ import annotations

import datetime as dt
import functools
import os

import numpy as np

from .analysis import check_in_calendar, moments
from .calendar import WorkCalendar
from .correlation import CorrelationModel
from .block_passes import BlockPasses
from .cpm import Analyzer
from .distributions import DurationModel, check_family
from .errors import PlanError
from .progress import engine_inputs, progress_frame
from .risk_events import RiskModel
from .score_stream import CHUNK, ScoreStream
from .order_stats import average_ranks
from .sim_result import SimulationResult

BLOCK_BYTES = 48 * 2**20       # working memory aimed at per block
MAX_BLOCK = 2048               # iterations


@functools.lru_cache(maxsize=1)
def keep_heap() -> bool:
    """Ask glibc to keep freed block-sized arrays on the heap instead of returning them to
    the system after every block (by default it unmaps or trims them, and the next block
    pays page faults for fresh memory: measured ~40 % of the run time). The process keeps
    up to 128 MB of freed heap for reuse. Once per process; a no-op elsewhere."""
    try:
        import ctypes
        import ctypes.util
        libc = ctypes.CDLL(ctypes.util.find_library("c") or "libc.so.6")
        mallopt = libc.mallopt
    except (OSError, AttributeError):
        return False
    m_trim_threshold, m_top_pad, m_mmap_threshold = -1, -2, -3
    return bool(mallopt(m_mmap_threshold, 32 * 2**20) and mallopt(m_trim_threshold, 128 * 2**20)
                and mallopt(m_top_pad, 64 * 2**20))


class SimulationCancelled(Exception):
    """The run was cancelled between blocks; no result is produced."""


def default_block_size(activities: int, links: int, budget: int = BLOCK_BYTES) -> int:
    """Iterations per block so that the block's arrays take about ``budget`` bytes: per
    iteration and activity the score, the duration, four sampling temporaries and the
    five rows of the block passes (links cost no memory per iteration)."""
    per_iteration = 8 * 11 * max(activities, 1)
    chunks = max(1, budget // (per_iteration * CHUNK))
    return int(min(chunks * CHUNK, MAX_BLOCK))


def available_memory() -> int | None:
    """Bytes the system can still give this process (Linux: MemAvailable), or None when unknown."""
    try:
        with open("/proc/meminfo", encoding="ascii") as info:
            for line in info:
                if line.startswith("MemAvailable:"):
                    return int(line.split()[1]) * 1024
    except (OSError, ValueError, IndexError):
        pass
    try:
        return os.sysconf("SC_AVPHYS_PAGES") * os.sysconf("SC_PAGE_SIZE")
    except (OSError, ValueError, AttributeError):
        return None


def memory_needed(activities: int, block: int, iterations: int, keep_durations: bool) -> int:
    """Bytes a run holds at its peak: the block's arrays (per activity and iteration: the
    eleven of :func:`default_block_size`, the block's scores, a chunk's scores and its
    centred copy), per-activity sums, the finishes, and kept durations if asked."""
    n = max(activities, 1)
    per_block = 8 * n * (12 * block + 2 * CHUNK)
    fixed = 8 * n * 24 + 8 * 3 * iterations
    return per_block + fixed + (8 * n * iterations if keep_durations else 0)


def memory_plan(activities: int, links: int, iterations: int, keep_durations: bool, block_size=None) -> int:
    """The block size for this run, chosen so the run fits the memory available now;
    PlanError naming the figure needed when even the smallest block would not fit."""
    free = available_memory()
    budget = BLOCK_BYTES if free is None else max(1, min(BLOCK_BYTES, free // 4))
    block = int(block_size) if block_size else default_block_size(activities, links, budget)
    if block <= 0:
        raise PlanError(f"block size must be positive, not {block_size!r}", "block_size")
    need = memory_needed(activities, min(block, iterations + CHUNK), iterations, keep_durations)
    if free is not None and need > 0.8 * free:
        raise PlanError(f"simulating {activities:,} activities {iterations:,} times needs about "
                        f"{_size(need)} of memory at once, and this computer has {_size(free)} free; close "
                        f"other programs or simulate fewer activities"
                        + (" (or keep fewer sampled durations)" if keep_durations else ""), "memory")
    return block


def _size(n: int) -> str:
    return f"{n / 2**30:.1f} GB" if n >= 2**30 else f"{n / 2**20:.0f} MB"


class Accumulators:
    """Per-activity sums over iterations, added chunk by chunk in chunk order."""

    def __init__(self, n: int, scored: int, shift_d: np.ndarray, shift_f: float):
        self.critical = np.zeros(n, dtype=np.int64)
        self.s_d, self.s_dd, self.s_df = np.zeros(n), np.zeros(n), np.zeros(n)
        self.s_u, self.s_uu, self.s_ur = np.zeros(scored), np.zeros(scored), np.zeros(scored)
        self.shift_d, self.shift_f = shift_d[:, None], shift_f
        self._centred = np.empty(n * CHUNK)

    # Products go through einsum, not BLAS: a threaded matrix-vector product leaves its
    # threads spinning after every call, which cost as much CPU as the whole schedule.
    def add_pass1(self, d: np.ndarray, finish: np.ndarray) -> None:
        """One chunk (at most CHUNK iterations), centred into a contiguous buffer so every
        block size sums the same numbers in the same order."""
        dc = self._centred[: d.size].reshape(d.shape)
        np.subtract(d, self.shift_d, out=dc)
        self.s_d += dc.sum(axis=1)
        self.s_dd += np.einsum("ij,ij->i", dc, dc)
        self.s_df += np.einsum("ij,j->i", dc, finish - self.shift_f)

    def add_pass2(self, u: np.ndarray, centred_rank: np.ndarray) -> None:
        self.s_u += u.sum(axis=1)
        self.s_uu += np.einsum("ij,ij->i", u, u)
        self.s_ur += np.einsum("ij,j->i", u, centred_rank)


class MonteCarlo:
    """A plan prepared for simulation: compiled network, duration, correlation and risk models."""

    def __init__(self, plan, distribution=None, deadline=None, resources: bool = False, status_date=None):
        plan.settings.validated()
        family = check_family(distribution or plan.settings.distribution, "distribution", "settings")
        self.plan = plan
        self.calendar = WorkCalendar(plan.settings)
        self.analyzer = Analyzer.for_plan(plan, self.calendar)
        self.means, self.variances = moments(plan)
        self.progress = progress_frame(plan, self.calendar, status_date, self.means, self.analyzer.net)
        self.durations = DurationModel.for_plan(plan, family)
        if self.progress is not None:      # only the remaining work is uncertain
            self._from_status(family)
        self.net = self.analyzer.net
        ids = self.net.ids
        self.correlation = CorrelationModel(plan.correlations, ids, self.durations.uncertain)
        self.risks = RiskModel(plan.risks, ids, family)
        if self.progress is not None:      # risk events no longer strike done work
            self.risks.targets = [t[~self.analyzer.done[t]] for t in self.risks.targets]
        chosen = plan.settings.deadline if deadline is None else deadline
        self.deadline = self.calendar.resolve(_check_deadline(chosen), finish=True)
        self.schedule = self.analyzer.run(self.means, deadline=self.deadline)
        check_in_calendar(self.schedule, self.calendar, self.deadline)
        self.passes = BlockPasses(self.net, self.analyzer.floor, self.analyzer.fnlt,
                                  self.analyzer.finish_floor, self.analyzer.done)
        self.resource_aware = bool(resources)
        if resources:                    # crews hold work back in every iteration
            from .analysis import analyze
            from .resource_sim import ResourcePasses
            self.passes = ResourcePasses(plan, analyze(plan, status_date=status_date))

    def _from_status(self, family) -> None:
        frame, base = self.progress, self.analyzer
        self.analyzer = base.from_status(engine_inputs(frame, base.net, base.floor))
        self.means, self.variances = frame.moments(self.means, self.variances)
        dm = self.durations
        a, m, b = frame.three_points(dm.a, dm.m, dm.b)
        families = [act.distribution or family for act in self.plan.activities]
        self.durations = DurationModel(families, a, m, b, dm.names)

    def run_block(self, scores, occurrence, delay_scores, valid=None):
        """Durations and finish of one block (activities × iterations), and per activity
        the number of its first ``valid`` iterations (all by default) in which it is critical."""
        d = self.durations.sample(scores[: self.durations.uncertain.size])
        fired = delay = None
        if self.risks.size:
            fired, delay = self.risks.draw(occurrence, delay_scores)
            self.risks.apply(d, delay)
        finish, critical = self.passes.run(d, self.deadline, valid)
        return d, finish, critical, fired, delay


def _check_deadline(value):
    if value is None or isinstance(value, dt.date):
        return value
    if isinstance(value, bool) or not isinstance(value, (int, float, np.integer, np.floating)) or not np.isfinite(value):
        raise PlanError(f"deadline must be an offset or a date, not {value!r}", "deadline")
    return float(value)


def _check_iterations(iterations) -> int:
    if isinstance(iterations, bool) or not isinstance(iterations, (int, np.integer)) or iterations <= 0:
        raise PlanError(f"iterations must be a positive whole number, not {iterations!r}", "iterations")
    return int(iterations)


def _chunks(iterations: int, block_size: int):
    """(first chunk, chunk count, first iteration, last iteration) per block."""
    total = -(-iterations // CHUNK)
    per_block = max(1, -(-block_size // CHUNK))
    for first in range(0, total, per_block):
        count = min(per_block, total - first)
        yield first, count, first * CHUNK, min((first + count) * CHUNK, iterations)


def simulate(plan, iterations: int = 10_000, seed=None, *, distribution=None, deadline=None,
             block_size=None, progress=None, cancel=None, keep_durations: bool = False,
             resources: bool = False, status_date=None) -> SimulationResult:
    """Simulate the plan's finish ``iterations`` times; see the module and docs/simulation.md.

    ``seed`` (int) makes the run reproducible; without one a seed is drawn and recorded.
    ``block_size`` (iterations per block, rounded up to whole chunks of 64) changes memory
    use only, never the results. ``progress(done, total)`` is called between blocks, where
    total counts both passes (2 × iterations); ``cancel()`` returning True raises
    :class:`SimulationCancelled`. ``keep_durations`` also returns every sampled duration
    (activities × iterations; for small runs and charts). ``resources``: schedule every
    iteration with the plan's resources (:mod:`.resource_sim`), same samples for a seed.
    A plan with progress is simulated from its status date (or ``status_date``): actuals
    are fixed and only the remaining work is uncertain (see :mod:`.progress`).
    """
    iterations = _check_iterations(iterations)
    seed = _check_seed(seed)
    mc = MonteCarlo(plan, distribution, deadline, resources, status_date)
    keep_heap()
    n = mc.net.size
    block = memory_plan(n, mc.net.src.size, iterations, keep_durations, block_size)
    stream = ScoreStream(seed, mc.durations.uncertain.size, mc.correlation, mc.risks.size)
    acc = Accumulators(n, mc.durations.uncertain.size, mc.means, mc.schedule.finish)
    kept = np.empty((n, iterations)) if keep_durations else None
    tick = _Ticker(progress, cancel, 2 * iterations)
    finish = _main_pass(mc, stream, acc, iterations, block, tick, kept)
    _sensitivity_pass(mc, stream, acc, finish, block, tick)
    return SimulationResult.build(mc, seed, finish, acc, block, kept)


SEED_RANGE = 1_000_000


def _check_seed(seed) -> int:
    if seed is None:     # drawn, and short enough to read aloud and retype (up to six digits)
        return int(np.random.SeedSequence().entropy % SEED_RANGE)
    if isinstance(seed, bool) or not isinstance(seed, (int, np.integer)) or seed < 0:
        raise PlanError(f"seed must be a non-negative whole number, not {seed!r}", "seed")
    return int(seed)


def _main_pass(mc, stream, acc, iterations, block, tick, kept) -> np.ndarray:
    """Schedule every block; keep the finishes; add per-chunk sums in chunk order."""
    finish = np.empty(iterations)
    for first, count, lo, hi in _chunks(iterations, block):
        tick.check()
        d, fin, critical, fired, delay = mc.run_block(*stream.block(first, count), valid=hi - lo)
        finish[lo:hi] = fin[: hi - lo]
        acc.critical += critical
        if kept is not None:
            kept[:, lo:hi] = d[:, : hi - lo]
        for c0 in range(0, hi - lo, CHUNK):
            sl = slice(c0, min(c0 + CHUNK, hi - lo))
            acc.add_pass1(d[:, sl], fin[sl])
            if fired is not None:
                mc.risks.record(fired[:, sl], delay[:, sl], fin[sl])
        tick.advance(hi - lo)
    return finish


def _sensitivity_pass(mc, stream, acc, finish, block, tick) -> None:
    """Regenerate the scores and correlate them with the finish ranks (bounded memory)."""
    iterations = finish.size
    rank = average_ranks(finish)
    rank -= rank.mean()
    acc.var_rank = float(np.mean(rank * rank))
    for first, count, lo, hi in _chunks(iterations, block):
        tick.check()
        for j, scores in enumerate(stream.chunks(first, count)):
            c0 = lo + j * CHUNK
            c1 = min(c0 + CHUNK, hi)
            acc.add_pass2(scores[:, : c1 - c0], rank[c0:c1])
        tick.advance(hi - lo)


class _Ticker:
    def __init__(self, progress, cancel, total: int):
        self.progress, self.cancel, self.total, self.done = progress, cancel, total, 0

    def check(self) -> None:
        if self.cancel is not None and self.cancel():
            raise SimulationCancelled("the simulation was cancelled")

    def advance(self, k: int) -> None:
        self.done += k
        if self.progress is not None:
            self.progress(self.done, self.total)
