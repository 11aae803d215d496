"""The approval pack: ``build_pack(plan, path, ...)`` writes a vector PDF an approval board
can read, sign and trace back to the exact plan and simulation seed."""

from __future__ import annotations

import datetime as dt
import io
import os
import secrets
from dataclasses import dataclass
from pathlib import Path

from reportlab import rl_config

from workbench import __version__
from workbench.core.analysis import analyze
from workbench.core.errors import PlanError
from workbench.io import atomic

from . import styles
from .baseline_pages import baseline_pages
from .cautions import cautions
from .charts import chart_pages
from .checkup_pages import checkup_pages
from .context import PackContext
from .cover import contents_of, cover
from .footer import FooterInfo, PackCanvas, footer_drawer
from .layout import LANDSCAPE, PORTRAIT, PackDocument, frame_size, new_page
from .path_pages import full_path, is_long
from .summary import summary
from .tables import activity_table
from .text import elide
from .tradeoff_pages import tradeoff_pages


@dataclass(frozen=True)
class PackInfo:
    pages: int
    seed: int | None
    hash: str
    path: str
    analysis: object = None      # what the pack shows, so the signed pack can become a baseline
    simulation: object = None


def build_pack(plan, path, *, paper: str = "a4", iterations: int = 10_000, seed: int | None = None,
               plan_path=None, progress=None, generated_at: dt.datetime | None = None,
               simulation=None) -> PackInfo:
    """Write the approval pack for ``plan`` to ``path`` and describe what was written.

    ``iterations=0`` leaves the simulation out; ``simulation`` passes a result computed
    elsewhere (its seed is recorded). ``generated_at`` fixes the time printed in the footer.
    Raises PlanError (naming the culprit) for a plan that cannot be scheduled or bad options.
    """
    styles.page_size(paper)
    report = _progress(progress)
    analysis = analyze(_checked(plan))
    sim = simulation if simulation is not None else _simulate(plan, iterations, seed, report)
    footer = _footer(plan, plan_path, generated_at, sim)
    ctx = PackContext(plan, analysis, sim, footer, paper)
    data, pages = render(ctx, report)
    _write(path, data)
    report(100)
    return PackInfo(pages, footer.seed, footer.plan_hash, str(path), analysis, sim)


def render(ctx: PackContext, report=lambda done: None) -> tuple[bytes, int]:
    """The pack's PDF bytes and its page count."""
    buffer = io.BytesIO()
    use_a85 = rl_config.useA85
    rl_config.useA85 = 0            # binary streams: smaller, and no slow pure-Python ASCII85 pass
    # the PDF's own creation date is the generation time printed in the footer (reportlab's
    # invariant mode reads it from SOURCE_DATE_EPOCH; without it, 1 Jan 2000)
    epoch = os.environ.get("SOURCE_DATE_EPOCH")
    os.environ["SOURCE_DATE_EPOCH"] = str(int(ctx.footer.generated_at.timestamp()))
    try:
        doc = _build(ctx, buffer, report)
    finally:
        rl_config.useA85 = use_a85
        if epoch is None:
            os.environ.pop("SOURCE_DATE_EPOCH", None)
        else:
            os.environ["SOURCE_DATE_EPOCH"] = epoch
    report(95)
    return buffer.getvalue(), doc.page


def _build(ctx: PackContext, buffer, report) -> PackDocument:
    doc = PackDocument(buffer, ctx.paper, title=elide(ctx.settings.title, 200), author=elide(ctx.settings.prepared_by, 200),
                       creator=f"Slackline {__version__}", on_page=footer_drawer(ctx.footer))
    doc.build(story(ctx, report), canvasmaker=PackCanvas)
    return doc


def story(ctx: PackContext, report) -> list:
    portrait_w, _ = frame_size(ctx.paper, PORTRAIT)
    parts = new_page(PORTRAIT) + summary(ctx, portrait_w)
    parts += baseline_pages(ctx, frame_size(ctx.paper, LANDSCAPE))
    parts += new_page(PORTRAIT) + checkup_pages(ctx, portrait_w)
    report(72)
    parts += chart_pages(ctx, frame_size(ctx.paper, LANDSCAPE))
    parts += tradeoff_pages(ctx, frame_size(ctx.paper, LANDSCAPE))
    report(80)
    parts += new_page(LANDSCAPE) + activity_table(ctx, frame_size(ctx.paper, LANDSCAPE)[0])   # room for whole dates
    parts += new_page(PORTRAIT) + cautions(ctx, portrait_w)
    parts += (new_page(PORTRAIT) + full_path(ctx, portrait_w)) if is_long(ctx) else []
    report(85)
    return cover(ctx, portrait_w, contents_of(parts)) + parts


def _checked(plan):
    if plan is None or not len(plan):
        raise PlanError("the plan has no activities, so there is nothing to report", "plan")
    return plan


def _simulate(plan, iterations, seed, report):
    if isinstance(iterations, bool) or not isinstance(iterations, int) or iterations < 0:
        raise PlanError(f"iterations must be a whole number of at least 0, not {iterations!r}", "iterations")
    if iterations == 0:
        return None
    if seed is not None and (isinstance(seed, bool) or not isinstance(seed, int) or seed < 0):
        raise PlanError(f"seed must be a whole number of at least 0, not {seed!r}", "seed")
    from workbench.core.montecarlo import simulate

    # seed None: the simulation draws one of at most six digits, to read aloud and retype
    return simulate(plan, iterations=iterations, seed=seed,
                    progress=lambda done, total: report(70 * done / max(total, 1)))


def _footer(plan, plan_path, generated_at, sim) -> FooterInfo:
    from workbench.io.planfile import plan_hash

    when = generated_at or dt.datetime.now(dt.timezone.utc).replace(microsecond=0)
    name = Path(plan_path).name if plan_path else "(plan not saved to a file)"
    return FooterInfo(name, plan_hash(plan), when, __version__, None if sim is None else sim.seed,
                      plan.settings.status_date)


def _progress(progress):
    if progress is None:
        return lambda done: None
    return lambda done: progress(min(100, int(done)), 100)


def _new_part_file(target: Path) -> tuple[int, Path]:
    """A new file beside ``target`` with the usual permissions (the umask applies, as for
    plan and CSV files; a temporary file's 0600 would keep colleagues out of the pack)."""
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    while True:
        tmp = target.with_name(f".{target.name}.{secrets.token_hex(4)}.part")
        try:
            return os.open(tmp, flags, 0o666), tmp
        except FileExistsError:
            continue


def _write(path, data: bytes) -> None:
    """Write atomically through an exclusive temporary file (:mod:`workbench.io.atomic`):
    a half-written pack never replaces a good one, and no planted link is followed."""
    target = Path(path)
    try:
        atomic.write_file(target, data, accept_owner_change=True)
    except OSError as exc:
        raise PlanError(f"cannot write the pack to {target}: {exc.strerror or exc}", "output") from None
