"""Activity-on-node layout for the Network view and the approval pack. No Qt.

Method: the layered drawing framework of Sugiyama, Tagawa and Toda (1981):

1. layers — columns by longest-path rank (an activity sits one column right of its
   furthest predecessor), or, with ``time_scaled``, columns by early start pushed right
   where the logic needs it;
2. dummy nodes on links that span several columns, so each link keeps a free lane;
3. crossing reduction — alternating downward/upward barycentre sweeps, at most
   ``max_sweeps`` pairs, keeping the order with the fewest crossings (``network_order``);
4. coordinates — median pull plus an order-preserving least-squares fit per column
   (``network_coords``), so nodes never overlap and chains stay straight.

The geometry depends only on the structure (ids, links, groups when bands are shown, and
early starts only in time-scaled mode) and is cached by that key: editing a duration
gives the identical drawing. Units are layout units (x right, y down), for screen and paper.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache

import numpy as np

from ..core.network import compile_network

STEEPNESS = 0.45   # a column gap at least this share of the rise most of its links make
from .network_coords import Placer, label_anchor, route_links
from .network_order import MAX_SWEEPS, LayeredGraph, Sweeper, count_crossings, expand, naive_positions


@dataclass(frozen=True)
class LayoutOptions:
    node_width: float = 216.0
    node_height: float = 132.0
    column_gap: float = 120.0
    row_gap: float = 36.0
    lane: float = 12.0          # height kept free in a column for a link passing through
    lane_gap: float = 8.0
    band_gap: float = 96.0      # space between the contents of two group bands
    band_title: float = 64.0    # room above a band's contents for its name
    time_scaled: bool = False   # columns placed by early start
    bands: bool = False         # one horizontal band per group
    max_sweeps: int = MAX_SWEEPS


@dataclass(frozen=True)
class NodeBox:
    id: str
    row: int            # the activity's row in the plan
    x: float
    y: float
    w: float
    h: float
    layer: int
    critical: bool = False


@dataclass(frozen=True)
class LinkRoute:
    pred: str
    succ: str
    points: tuple[tuple[float, float], ...]
    type: str = "FS"
    lag: float = 0.0
    critical: bool = False
    label: str = ""                     # "SS +2"; empty for FS without lag
    label_at: tuple[float, float] = (0.0, 0.0)


@dataclass(frozen=True)
class GroupBand:
    name: str
    x: float
    y: float
    w: float
    h: float


@dataclass
class Geometry:
    """The cached, structure-only part of a layout."""

    boxes: np.ndarray                   # (n, 4): x, y, w, h
    layer: np.ndarray
    routes: dict[tuple[int, int], tuple]   # (pred row, succ row) → (points, label anchor)
    bands: list[GroupBand]
    width: float
    height: float
    crossings: int
    naive_crossings: int
    column_x: np.ndarray = field(default_factory=lambda: np.zeros(0))   # left edge per column
    column_start: tuple | None = None   # time-scaled: nominal start offset per column


@dataclass
class NetworkLayout:
    nodes: list[NodeBox]
    links: list[LinkRoute]
    bands: list[GroupBand]
    width: float
    height: float
    crossings: int
    naive_crossings: int
    boxes: np.ndarray = field(repr=False)   # (n, 4) x, y, w, h in plan order
    geometry: Geometry | None = field(default=None, repr=False)   # the cached structure part
    band_title: float = 0.0     # height of the strip for a band's name above its nodes

    def index_of(self, act_id: str) -> int:
        for node in self.nodes:
            if node.id == act_id:
                return node.row
        return -1

    def node_at(self, x: float, y: float) -> int:
        """Row of the node under a point, or -1."""
        b = self.boxes
        hit = np.flatnonzero((x >= b[:, 0]) & (x <= b[:, 0] + b[:, 2]) & (y >= b[:, 1]) & (y <= b[:, 1] + b[:, 3]))
        return int(hit[0]) if hit.size else -1

    def neighbours(self, row: int) -> tuple[list[int], list[int]]:
        """Rows of the direct predecessors and successors of a node."""
        ids = {n.id: n.row for n in self.nodes}
        me = self.nodes[row].id
        preds = sorted({ids[l.pred] for l in self.links if l.succ == me})
        succs = sorted({ids[l.succ] for l in self.links if l.pred == me})
        return preds, succs


def link_label(link_type: str, lag: float) -> str:
    """Text shown on a link: its type and lag unless it is a plain FS link without lag."""
    if link_type == "FS" and lag == 0:
        return ""
    if lag == 0:
        return link_type
    sign = "+" if lag > 0 else "\u2212"
    return f"{link_type} {sign}{abs(lag):g}"


def _layers(n: int, src: np.ndarray, dst: np.ndarray, es: tuple | None) -> tuple[np.ndarray, tuple | None]:
    """Column of every node; in time-scaled mode also the nominal start offset of each
    column (early starts binned, then pushed right where the logic needs it)."""
    ids = [str(i) for i in range(n)]
    net = compile_network(ids, src, dst, np.zeros(src.size), np.zeros(src.size, dtype=np.int64))
    level = net.level.astype(np.int64)
    if es is None or not n:
        return level, None
    es_arr = np.asarray(es, dtype=float)
    span = max(float(es_arr.max() - es_arr.min()), 1e-9)
    columns = 1.5 * (int(level.max()) + 1)
    step = span / max(columns - 1, 1.0)
    layer = np.floor((es_arr - es_arr.min()) / step).astype(np.int64)
    for depth in range(1, int(level.max()) + 1):       # push right where the logic needs it
        into = level[dst] == depth
        need = np.zeros(n, dtype=np.int64)
        np.maximum.at(need, dst[into], layer[src[into]] + 1)
        layer = np.maximum(layer, need)
    return layer, tuple(float(es_arr.min()) + step * np.arange(int(layer.max()) + 1))


def _band_ranks(groups: tuple | None, n: int) -> tuple[np.ndarray, list[str]]:
    if groups is None:
        return np.zeros(n, dtype=np.int64), []
    names = list(dict.fromkeys(groups))
    rank = {g: i for i, g in enumerate(names)}
    return np.array([rank[g] for g in groups], dtype=np.int64), names


@lru_cache(maxsize=8)
def structure_geometry(n: int, pairs: tuple[tuple[int, int], ...], groups: tuple | None,
                       es: tuple | None, options: LayoutOptions) -> Geometry:
    """Layout of ``n`` nodes and the (pred row, succ row) pairs; cached by its arguments."""
    arr = np.array(pairs, dtype=np.int64).reshape(-1, 2)
    src, dst = arr[:, 0], arr[:, 1]
    layer, starts = _layers(n, src, dst, es)
    band, names = _band_ranks(groups, n)
    graph = expand(layer, src, dst, band)
    start = naive_positions(graph, src)
    pos, crossings = Sweeper(graph).reduce(start, options.max_sweeps)
    o = options
    height = np.where(graph.owner < 0, o.node_height, o.lane)
    y = _place(graph, pos, height, o) if names else Placer(graph, pos, height, o.row_gap, o.lane_gap).place()
    bands = _stack_bands(graph, y, height, names, o) if names else []
    top = float((y - height / 2).min()) if n else 0.0
    y = y - top
    bands = [GroupBand(b.name, b.x, b.y - top, b.w, b.h) for b in bands]
    column_x = _column_x(graph, y, o, uniform=es is not None)
    routes = route_links(graph, y, column_x, o.node_width, o.node_height)
    boxes = np.column_stack((column_x[layer], y[:n] - o.node_height / 2,
                             np.full(n, o.node_width), np.full(n, o.node_height)))
    width = float(column_x[graph.layers - 1] + o.node_width) if n else 0.0
    full_h = float((y + height / 2).max()) if n else 0.0
    bands = [GroupBand(b.name, -o.column_gap / 3, b.y, width + 2 * o.column_gap / 3, b.h) for b in bands]
    reach = o.column_gap * 0.45
    table = {(int(p[0]), int(p[1])): (tuple(map(tuple, r.tolist())), label_anchor(r, reach))
             for p, r in zip(arr.tolist(), routes)}
    return Geometry(boxes, layer, table, bands, width, full_h, crossings,
                    count_crossings(graph, start), column_x[:graph.layers], starts)


def _column_x(graph: LayeredGraph, y: np.ndarray, o: LayoutOptions, uniform: bool) -> np.ndarray:
    """Left edge of every column. A gap widens where its links travel far up or down, so
    nine links in ten slope no steeper than 1 : ``1/STEEPNESS`` (at most 10 gaps wide);
    time-scaled columns keep equal gaps."""
    gaps = np.full(max(graph.layers, 1), o.column_gap)
    if not uniform and graph.seg_u.size:
        lay = graph.layer[graph.seg_u]
        rise = np.abs(y[graph.seg_v] - y[graph.seg_u])
        for l in np.unique(lay).tolist():
            wanted = STEEPNESS * float(np.quantile(rise[lay == l], 0.9))
            gaps[l] = min(max(o.column_gap, wanted), 10 * o.column_gap)
    return np.concatenate(([0.0], np.cumsum(o.node_width + gaps)))


def _place(graph: LayeredGraph, pos: np.ndarray, height: np.ndarray, o: LayoutOptions) -> np.ndarray:
    """With bands: place each group on its own (links inside the group pull), so every
    band is as compact as its own logic allows; ``_stack_bands`` then stacks them."""
    y = np.zeros(graph.size)
    for rank in np.unique(graph.band).tolist():
        items = np.flatnonzero(graph.band == rank)
        local = np.full(graph.size, -1, dtype=np.int64)
        local[items] = np.arange(items.size)
        inside = (local[graph.seg_u] >= 0) & (local[graph.seg_v] >= 0)
        sub = LayeredGraph(0, graph.layer[items], local[graph.seg_u[inside]], local[graph.seg_v[inside]],
                           [], graph.owner[items], np.zeros(items.size, dtype=np.int64))
        y[items] = Placer(sub, pos[items], height[items], o.row_gap, o.lane_gap).place()
    return y


def _stack_bands(graph, y: np.ndarray, height: np.ndarray, names: list[str], o: LayoutOptions) -> list[GroupBand]:
    """Move each group's items (in place) so the groups occupy separate horizontal bands."""
    bands, bottom = [], None
    below = max(o.band_gap - o.band_title - 8.0, 0.0)
    for rank, name in enumerate(names):
        mine = graph.band == rank
        if not mine.any():
            continue
        top = float((y[mine] - height[mine] / 2).min())
        if bottom is not None:
            y[mine] += bottom + o.band_gap - top
            top = bottom + o.band_gap
        bottom = float((y[mine] + height[mine] / 2).max())
        bands.append(GroupBand(name or "ungrouped", 0.0, top - o.band_title, 0.0, bottom - top + o.band_title + below))
    return bands


def structure_key(plan, options: LayoutOptions, early_starts=None):
    """The arguments the geometry depends on: ids, link pairs, groups, early starts."""
    ids = plan.ids()
    row = {a: i for i, a in enumerate(ids)}
    pairs = tuple(sorted({(row[l.pred], row[l.succ]) for l in plan.links}))
    groups = tuple(a.group for a in plan.activities) if options.bands else None
    es = None
    if options.time_scaled and early_starts is not None:
        es = tuple(float(v) for v in early_starts)
    return len(ids), pairs, groups, es, options


def layout_plan(plan, analysis=None, options: LayoutOptions | None = None) -> NetworkLayout:
    """Lay out a plan; ``analysis`` (a core Analysis) adds critical flags and, in
    time-scaled mode, the early starts. Raises CycleError when the links form a loop."""
    options = options or LayoutOptions()
    schedule = analysis.schedule if analysis is not None else None
    key = structure_key(plan, options, None if schedule is None else schedule.es)
    geo = structure_geometry(*key)
    ids = plan.ids()
    crit = np.zeros(len(ids), dtype=bool) if schedule is None else np.asarray(schedule.critical, dtype=bool)
    layer = geo.layer.tolist()
    nodes = [NodeBox(a, i, *box, layer[i], c) for i, (a, box, c) in enumerate(zip(ids, geo.boxes.tolist(), crit.tolist()))]
    driving = _driving_links(plan, schedule).tolist()
    row = {a: i for i, a in enumerate(ids)}
    links = []
    for k, link in enumerate(plan.links):
        points, anchor = geo.routes[(row[link.pred], row[link.succ])]
        lag = float(link.lag)
        links.append(LinkRoute(link.pred, link.succ, points, link.type, lag, driving[k],
                               link_label(link.type, lag), anchor))
    return NetworkLayout(nodes, links, list(geo.bands), geo.width, geo.height, geo.crossings,
                         geo.naive_crossings, geo.boxes, geo, options.band_title)


def _driving_links(plan, schedule) -> np.ndarray:
    """Critical links: both ends critical and the link leaves no slack (ES_j = ES_i + offset)."""
    count = len(plan.links)
    if schedule is None or not count:
        return np.zeros(count, dtype=bool)
    net = schedule.network
    gap = schedule.es[net.dst] - schedule.es[net.src] - net.link_offsets(schedule.durations)
    crit = np.asarray(schedule.critical, dtype=bool)
    return crit[net.src] & crit[net.dst] & (np.abs(gap) < 1e-6)
