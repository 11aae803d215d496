"""Landscape chart pages: Timeline, Network, Odds and Drivers."""

from __future__ import annotations

from .drivers_pages import drivers_pages
from .resource_pages import resource_pages
from .network_pages import network_pages
from .odds_pages import odds_pages
from .timeline_pages import timeline_pages


def chart_pages(ctx, frame: tuple[float, float]) -> list:
    return (timeline_pages(ctx, frame) + network_pages(ctx, frame) + odds_pages(ctx, frame) + drivers_pages(ctx, frame)
            + resource_pages(ctx, frame))
