"""Landscape chart pages: Timeline, Network, Odds and Drivers."""

from __future__ import annotations

from .timeline_pages import timeline_pages


def chart_pages(ctx, frame: tuple[float, float]) -> list:
    return timeline_pages(ctx, frame)
