"""The slides of Present mode, in order: summary, timeline, network, odds, drivers, checkup,
then resources for a plan with resources and trade-off for a plan with cost data and a deadline.

A window view is reused when it offers a ``set_present(True)`` hook (large type, heavy
lines); otherwise the slide draws the approval pack's chart for it, scaled up. The
Network slide is always the pack's diagram shown in parts (``present_network_slide``):
the whole diagram at once would make the ids too small to read on a projector."""

from __future__ import annotations


from workbench.figures import drivers as fdr
from workbench.figures.network_layout import layout_plan
from workbench.reports.drivers_pages import paint_drivers
from workbench.reports.network_pages import overview_view
from workbench.reports.network_paint import NetworkPainter

from workbench.ui.present.chart_slide import PresentChartSlide
from workbench.ui.present.network_slide import PresentNetworkSlide
from workbench.ui.present.odds_slide import PresentOddsSlide
from workbench.ui.present.summary_slide import PresentSummarySlide

PRESENT_TOP = 8      # driver bars on a projector
NO_SIMULATION_HOW = ("To get one: leave Present (Esc), press Run simulation in the Odds view, "
                     "then come back (F5).")
SLIDES = (("Summary", None), ("Timeline", "timeline"), ("Network", "network"), ("Odds", "odds"),
          ("Drivers", "drivers"),
          ("Checkup", "checkup"), ("Resources", "resources"),
          ("Trade-off", "tradeoff"))


def _view_class(package: str):
    """The window's view class of a view package (imported when its slide is first shown)."""
    if package == "timeline":
        from workbench.ui.timeline.view import TimelineView
        return TimelineView
    if package == "network":
        from workbench.ui.network.view import NetworkView
        return NetworkView
    if package == "odds":
        from workbench.ui.odds.view import OddsView
        return OddsView
    from workbench.ui.drivers.view import DriversView
    return DriversView


def window_view(session, package: str):
    """The window's view in Present style, or None when it has no Present hook."""
    cls = _view_class(package)
    if not hasattr(cls, "set_present"):
        return None
    view = cls(session)
    view.set_present(True)
    return view


def paint_network(canvas, ctx, w, h) -> None:
    layout = layout_plan(ctx.plan, ctx.analysis)
    NetworkPainter(ctx, layout, overview_view(layout, w, h)).paint(canvas, w, h)


def paint_drivers_slide(canvas, ctx, w, h) -> None:
    sim = ctx.simulation
    if sim is None:
        canvas.setFont("Helvetica", 14)
        canvas.drawCentredString(w / 2, h / 2 + 10, "No simulation yet.")
        canvas.setFont("Helvetica", 10)
        canvas.drawCentredString(w / 2, h / 2 - 10, NO_SIMULATION_HOW)
        return
    crit = fdr.criticality_bars(sim, ctx.plan, PRESENT_TOP)
    sens = fdr.sensitivity_bars(sim, ctx.plan, PRESENT_TOP)
    paint_drivers(canvas, w, h, crit, sens, set(ctx.analysis.pert.path))


def paint_timeline(canvas, ctx, w, h) -> None:
    """Fallback Timeline: the pack's first tile (only used when the view has no Present hook)."""
    from workbench.figures.timeline import timeline_geometry
    from workbench.reports.timeline_tile import TileSpec, TimelineTile

    geo = timeline_geometry(ctx.analysis, ctx.simulation)
    rows = min(geo.n_rows, 14)
    lo, hi = geo.x_range
    pad = 0.02 * (hi - lo)
    TimelineTile(ctx, geo, TileSpec(0, rows, lo - pad, hi + pad, (h - 70) / max(rows, 1))).paint(canvas, w, h)


FALLBACKS = {"Timeline": paint_timeline, "Network": paint_network, "Drivers": paint_drivers_slide}


def build_slides(session) -> list[tuple[str, object]]:
    """(title, widget) for every slide."""
    slides = []
    for title, dotted in SLIDES:
        if dotted is None:
            slides.append((title, PresentSummarySlide(session)))
            continue
        if title == "Checkup":
            from workbench.ui.present.checkup_slide import PresentCheckupSlide
            slides.append((title, PresentCheckupSlide(session)))
            continue
        if title == "Resources":
            from workbench.ui.present.resources_slide import PresentResourcesSlide, has_resources
            if has_resources(session.plan):
                slides.append((title, PresentResourcesSlide(session)))
            continue
        if title == "Trade-off":
            from workbench.ui.present.tradeoff_slide import PresentTradeoffSlide, has_tradeoff
            if has_tradeoff(session.plan):
                slides.append((title, PresentTradeoffSlide(session)))
            continue
        if title == "Network":      # in parts, so ids stay legible on a projector
            slides.append((title, PresentNetworkSlide(session)))
            continue
        view = window_view(session, dotted)
        if view is None:
            view = PresentOddsSlide(session) if title == "Odds" else PresentChartSlide(session, FALLBACKS[title])
        slides.append((title, view))
    return slides
