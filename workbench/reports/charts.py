"""Landscape chart pages: Timeline, Network, Odds and Drivers."""

from __future__ import annotations


def chart_pages(ctx, frame: tuple[float, float]) -> list:
    return []
