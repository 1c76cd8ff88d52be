// Direct labels (legend "on-plot"): where each curve's and model's label goes beside its own line, clear of the data,
// the other labels and the plot edge, with a leader line when it had to move away. Pure and deterministic.
import type { PlotRect } from "./layout";
import {
  emptyGrid,
  markFill,
  markStroke,
  fillScratch,
  type OccupancyGrid,
  type Shape,
  type Subpath,
} from "./occupancy";

/** Side of a placement cell, scene px: finer than the legend's 4 px, since a label is only a text line or two high. */
export const LABEL_CELL_PX = 2;

/** Most anchor points tried along one item's lines (spread evenly over its visible length). */
export const MAX_ANCHORS = 96;

/**
 * Cost weights (our own): text over a line costs most (it hides both), over another item's translucent fill less
 * (still readable), far less than a short leader; labels never overlap.
 */
const COST_LINE = 3;
const COST_FILL = 3;
/** Per cell of another line a leader crosses. */
const COST_LEADER_CROSS = 1;
const COST_LABEL = 1000;
/** Rings tried beyond the place beside the line (each one text size further out, with a leader line). */
const RINGS = 10;
/** Per ring away from the line: a label on clear paper beside its line is always preferred. */
const COST_RING = 0.3;
/** Slight preferences that break ties the same way every time: near the middle of the line, then the position order. */
const COST_FROM_MIDDLE = 0.1;
const COST_POSITION = 0.004;
/** Per narrower wrapping of the text: the label keeps its widest form where that has room. */
const COST_VARIANT = 0.15;

/**
 * The eight positions around an anchor, as unit directions: above, below, right, left, then the diagonals. A box
 * at a position touches the gap circle with its nearest edge or corner.
 */
const POSITIONS: readonly [number, number][] = [
  [0, -1],
  [0, 1],
  [1, 0],
  [-1, 0],
  [1, -1],
  [-1, -1],
  [1, 1],
  [-1, 1],
];

/** One thing to label: a curve or a model, with what it draws. */
export interface LabelItem {
  /** "curve:<id>" or "model:<id>": the key the placement reports and the app moves. */
  key: string;
  /** The label's box size, scene px (text measured by the caller). */
  widthPx: number;
  heightPx: number;
  /** Other sizes the same text can take (wrapped narrower), tried after the first at a slight extra cost. */
  alternatives?: readonly { widthPx: number; heightPx: number }[];
  /** The lines the label sits beside (anchors, and where a leader points), scene px. */
  lines: readonly Subpath[];
  /** Everything the item draws; its own fills do not count against its own label (a label may sit in its band). */
  shapes: readonly Shape[];
  /** Air kept around the item's lines, px (an exclusion's hatches stand this far out on its excluded side). */
  haloPx?: number;
  /** With `pinned`: which size to use (0 the item's own, k its alternative k − 1). @default 0 */
  pinnedVariant?: number;
  /** A place the user chose: the box centre, scene px; placed there (kept inside the plot), never moved. */
  pinned?: { x: number; y: number };
}

/** Where a label went. */
export interface PlacedLabel {
  key: string;
  /** The text box, scene px. */
  box: PlotRect;
  /** Where a leader line from the box ends (a point of the item's line), or null for a label beside its line. */
  leaderTo: { x: number; y: number } | null;
  pinned: boolean;
  /** Which size was used: 0 the item's own, k its alternative k − 1. */
  variant: number;
  /** Fraction of the box over other items' drawn pixels (0 when clear; for tests and notes). */
  covered: number;
}

export interface PlaceLabelsInput {
  items: readonly LabelItem[];
  plot: PlotRect;
  /** Gap between a line and its label, px (text size and the hatches on an exclusion's side). */
  gapPx: number;
  /** Text size, px: sets the rings' step (one more step away per ring). */
  sizePx: number;
  /** @default LABEL_CELL_PX */
  cellPx?: number;
}

/** Summed-area table of a grid's occupied cells: sum over [0, c) × [0, r) at (r · (cols + 1) + c). */
function integral(g: OccupancyGrid, occupied: (i: number) => boolean): Float64Array {
  const w = g.cols + 1;
  const s = new Float64Array(w * (g.rows + 1));
  for (let r = 0; r < g.rows; r++) {
    let row = 0;
    for (let c = 0; c < g.cols; c++) {
      row += occupied(r * g.cols + c) ? 1 : 0;
      s[(r + 1) * w + c + 1] = s[r * w + c + 1] + row;
    }
  }
  return s;
}

/** Fraction of the cells a box touches that are occupied (cells cut by the box edge count whole: cautious). */
function coverOf(sat: Float64Array, g: OccupancyGrid, b: PlotRect): number {
  const c0 = Math.max(0, Math.floor((b.x - g.x0) / g.cellPx));
  const c1 = Math.min(g.cols, Math.ceil((b.x + b.w - g.x0) / g.cellPx));
  const r0 = Math.max(0, Math.floor((b.y - g.y0) / g.cellPx));
  const r1 = Math.min(g.rows, Math.ceil((b.y + b.h - g.y0) / g.cellPx));
  if (c1 <= c0 || r1 <= r0) return 0;
  const w = g.cols + 1;
  const sum = sat[r1 * w + c1] - sat[r0 * w + c1] - sat[r1 * w + c0] + sat[r0 * w + c0];
  return sum / ((c1 - c0) * (r1 - r0));
}

function overlapArea(a: PlotRect, b: PlotRect): number {
  const w = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

function inside(b: PlotRect, plot: PlotRect): boolean {
  return b.x >= plot.x && b.y >= plot.y && b.x + b.w <= plot.x + plot.w && b.y + b.h <= plot.y + plot.h;
}

/** A box of the given size with its centre at (cx, cy), moved the least to lie inside the plot. */
function clampedBox(cx: number, cy: number, w: number, h: number, plot: PlotRect): PlotRect {
  const x = Math.min(Math.max(cx - w / 2, plot.x), Math.max(plot.x, plot.x + plot.w - w));
  const y = Math.min(Math.max(cy - h / 2, plot.y), Math.max(plot.y, plot.y + plot.h - h));
  return { x, y, w, h };
}

/** An anchor on an item's line: the point and its place along the visible line (0..1). */
interface Anchor {
  x: number;
  y: number;
  t: number;
}

function within(x: number, y: number, plot: PlotRect): boolean {
  return x >= plot.x && x <= plot.x + plot.w && y >= plot.y && y <= plot.y + plot.h;
}

/** The part of segment a→b inside the plot (Liang–Barsky), or null. */
function clipSegment(xa: number, ya: number, xb: number, yb: number, plot: PlotRect): number[] | null {
  const dx = xb - xa;
  const dy = yb - ya;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, xa - plot.x],
    [dx, plot.x + plot.w - xa],
    [-dy, ya - plot.y],
    [dy, plot.y + plot.h - ya],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return null;
    } else {
      const r = q / p;
      if (p < 0) t0 = Math.max(t0, r);
      else t1 = Math.min(t1, r);
    }
  }
  if (!(t0 <= t1) || !Number.isFinite(dx + dy)) return null;
  return [xa + t0 * dx, ya + t0 * dy, xa + t1 * dx, ya + t1 * dy];
}

/** Calls `visit` with each visible (clipped) segment of the lines. */
function eachVisible(lines: readonly Subpath[], plot: PlotRect, visit: (seg: number[]) => void): void {
  for (const s of lines)
    for (let k = 1; k < s.xs.length; k++) {
      const seg = clipSegment(s.xs[k - 1], s.ys[k - 1], s.xs[k], s.ys[k], plot);
      if (seg) visit(seg);
    }
}

/** Visible length of the lines, px. */
function visibleLength(lines: readonly Subpath[], plot: PlotRect): number {
  let len = 0;
  eachVisible(lines, plot, ([xa, ya, xb, yb]) => (len += Math.hypot(xb - xa, yb - ya)));
  return len;
}

/** Points spread evenly along the visible line (at most MAX_ANCHORS, at least 2 px apart). */
function anchorsOf(lines: readonly Subpath[], plot: PlotRect): Anchor[] {
  const total = visibleLength(lines, plot);
  if (!(total > 0)) return [];
  const step = Math.max(2, total / MAX_ANCHORS);
  const out: Anchor[] = [];
  let walked = 0;
  let next = step / 2;
  eachVisible(lines, plot, ([xa, ya, xb, yb]) => {
    const len = Math.hypot(xb - xa, yb - ya);
    while (len > 0 && next <= walked + len) {
      const f = (next - walked) / len;
      out.push({ x: xa + f * (xb - xa), y: ya + f * (yb - ya), t: next / total });
      next += step;
    }
    walked += len;
  });
  return out;
}

/** The point of the lines nearest to (x, y), inside the plot; null when no segment is visible. */
function nearestOnLines(lines: readonly Subpath[], x: number, y: number, plot: PlotRect) {
  let best: { x: number; y: number } | null = null;
  let bestD = Infinity;
  for (const s of lines)
    for (let k = 0; k < s.xs.length; k++) {
      const [xa, ya] = [s.xs[k], s.ys[k]];
      const [xb, yb] = k + 1 < s.xs.length ? [s.xs[k + 1], s.ys[k + 1]] : [xa, ya];
      const dx = xb - xa;
      const dy = yb - ya;
      const l2 = dx * dx + dy * dy;
      const f = l2 > 0 ? Math.min(1, Math.max(0, ((x - xa) * dx + (y - ya) * dy) / l2)) : 0;
      const px = xa + f * dx;
      const py = ya + f * dy;
      if (!within(px, py, plot)) continue;
      const d = Math.hypot(px - x, py - y);
      if (d < bestD) [best, bestD] = [{ x: px, y: py }, d];
    }
  return best;
}

/** Distance from a point to a box (0 inside). */
function distToBox(b: PlotRect, x: number, y: number): number {
  const dx = Math.max(b.x - x, 0, x - (b.x + b.w));
  const dy = Math.max(b.y - y, 0, y - (b.y + b.h));
  return Math.hypot(dx, dy);
}

/** Marks the cells of the lines and of the lines shifted by ±halo across and along (a band about the line). */
function markHalo(g: OccupancyGrid, subpaths: readonly Subpath[], haloPx: number): void {
  markStroke(g, subpaths);
  if (!(haloPx > 0)) return;
  const shifted = (dx: number, dy: number) =>
    subpaths.map((s) => ({
      xs: Array.from(s.xs, (x) => x + dx),
      ys: Array.from(s.ys, (y) => y + dy),
      closed: s.closed,
    }));
  for (const [dx, dy] of [
    [haloPx, 0],
    [-haloPx, 0],
    [0, haloPx],
    [0, -haloPx],
  ])
    markStroke(g, shifted(dx, dy));
}

/** Per item: whether a cell counts against its label (any stroke, or another item's fill). */
function itemCovers(items: readonly LabelItem[], plot: PlotRect, cellPx: number) {
  const strokes = emptyGrid(plot, cellPx);
  const fillCount = new Uint16Array(strokes.cells.length);
  const ownFills: (Uint8Array | null)[] = [];
  const scratch = fillScratch(strokes);
  for (const it of items) {
    let own: OccupancyGrid | null = null;
    for (const sh of it.shapes) {
      if (sh.stroke) markHalo(strokes, sh.subpaths, it.haloPx ?? 0);
      if (sh.fill) {
        own ??= emptyGrid(plot, cellPx);
        markFill(own, sh.subpaths, scratch);
      }
    }
    if (own) for (let i = 0; i < own.cells.length; i++) fillCount[i] += own.cells[i];
    ownFills.push(own ? own.cells : null);
  }
  const lineSat = integral(strokes, (i) => strokes.cells[i] === 1);
  // Items without a fill of their own share one table of every fill.
  const allFills = integral(strokes, (i) => fillCount[i] > 0);
  const fillSats = ownFills.map((own) => (own ? integral(strokes, (i) => fillCount[i] - own[i] > 0) : allFills));
  return { grid: strokes, lineSat, fillSats };
}

type Covers = ReturnType<typeof itemCovers>;

/** Weighted share of a box over drawn content that is not the item's own: lines, and other items' fills. */
function coverCost(cover: Covers, k: number, box: PlotRect): { cost: number; covered: number } {
  const lines = coverOf(cover.lineSat, cover.grid, box);
  const fills = coverOf(cover.fillSats[k], cover.grid, box);
  // A line through the text costs by the cells it crosses, not by the share of the box: one thin line across a
  // label hides as much of it in a wide box as in a narrow one. One crossing of the box's height costs COST_LINE.
  const crossings = (lines * box.w * box.h) / (cover.grid.cellPx * Math.max(box.h, cover.grid.cellPx));
  return { cost: COST_LINE * crossings + COST_FILL * fills, covered: Math.max(lines, fills) };
}

/** The box of size w × h at a position around (x, y), its nearest edge or corner `d` px away. */
function boxAt(x: number, y: number, pos: readonly [number, number], d: number, w: number, h: number): PlotRect {
  const [ux, uy] = pos;
  const diag = ux !== 0 && uy !== 0 ? Math.SQRT1_2 : 1;
  const cx = x + ux * (d * diag + w / 2);
  const cy = y + uy * (d * diag + h / 2);
  return { x: cx - w / 2, y: cy - h / 2, w, h };
}

/** The cheapest box for one unpinned item, or null when none of its line is visible. */
function bestPlace(item: LabelItem, k: number, input: PlaceLabelsInput, cover: Covers, placed: PlacedLabel[]) {
  const { plot, gapPx, sizePx } = input;
  const anchors = anchorsOf(item.lines, plot);
  if (anchors.length === 0) return null;
  const sizes = [{ widthPx: item.widthPx, heightPx: item.heightPx }, ...(item.alternatives ?? [])];
  let best: { box: PlotRect; cost: number; covered: number; anchor: Anchor; ring: number; v: number } | null = null;
  for (let ring = 0; ring <= RINGS; ring++) {
    for (let v = 0; v < sizes.length; v++)
      for (const a of anchors)
        for (let p = 0; p < POSITIONS.length; p++) {
          const { widthPx: w, heightPx: h } = sizes[v];
          const box = boxAt(a.x, a.y, POSITIONS[p], gapPx + ring * sizePx, w, h);
          if (!inside(box, plot)) continue;
          const c = coverCost(cover, k, box);
          let cost =
            c.cost + COST_VARIANT * v + COST_RING * ring + COST_FROM_MIDDLE * Math.abs(a.t - 0.5) + COST_POSITION * p;
          // The dearer parts only for a box that can still win (the scan of the leader is the costly one).
          if (best && cost >= best.cost) continue;
          for (const q of placed) cost += (COST_LABEL * overlapArea(box, q.box)) / (w * h);
          if (best && cost >= best.cost) continue;
          if (ring > 0) cost += COST_LEADER_CROSS * leaderCrossings(cover, box, a, gapPx);
          if (!best || cost < best.cost - 1e-12) best = { box, cost, covered: c.covered, anchor: a, ring, v };
        }
    // A clear place ends the search; further rings only while every place so far covers something.
    if (best && best.cost < COST_RING * (ring + 1)) break;
  }
  if (!best) {
    // The label is larger than every free place: beside the line's middle, kept inside the plot.
    const a = anchors[Math.floor(anchors.length / 2)];
    const { widthPx: w, heightPx: h } = item;
    const box = clampedBox(a.x, a.y - gapPx - h / 2, w, h, plot);
    return { key: item.key, box, leaderTo: null, pinned: false, variant: 0, covered: coverCost(cover, k, box).covered };
  }
  const leaderTo = best.ring > 0 ? { x: best.anchor.x, y: best.anchor.y } : null;
  return { key: item.key, box: best.box, leaderTo, pinned: false, variant: best.v, covered: best.covered };
}

/** Cells of drawn lines a leader from the box to the anchor passes over (its last `endPx`, at its own line, left out). */
function leaderCrossings(cover: Covers, box: PlotRect, a: Anchor, endPx: number): number {
  const from = leaderStart(box, a);
  const len = Math.hypot(a.x - from.x, a.y - from.y) - endPx;
  const g = cover.grid;
  let n = 0;
  for (let d = 0; d < len; d += g.cellPx) {
    const f = d / (len + endPx);
    const c = Math.floor((from.x + f * (a.x - from.x) - g.x0) / g.cellPx);
    const r = Math.floor((from.y + f * (a.y - from.y) - g.y0) / g.cellPx);
    if (c >= 0 && r >= 0 && c < g.cols && r < g.rows && g.cells[r * g.cols + c]) n++;
  }
  return n;
}

/** A pinned label: at the user's place, kept inside the plot, with a leader when it is away from its line. */
function pinnedPlace(item: LabelItem, k: number, input: PlaceLabelsInput, cover: Covers) {
  const p = item.pinned as { x: number; y: number };
  const v = item.pinnedVariant ?? 0;
  const size = v > 0 ? (item.alternatives?.[v - 1] ?? item) : item;
  const box = clampedBox(p.x, p.y, size.widthPx, size.heightPx, input.plot);
  const near = nearestOnLines(item.lines, box.x + box.w / 2, box.y + box.h / 2, input.plot);
  const away = near !== null && distToBox(box, near.x, near.y) > 1.5 * input.gapPx;
  const covered = coverCost(cover, k, box).covered;
  return { key: item.key, box, leaderTo: away ? near : null, pinned: true, variant: size === item ? 0 : v, covered };
}

/**
 * Places every item's label: pinned ones where the user put them, then the others greedily (items with the
 * least visible line first, as they have the fewest places), each at the cheapest candidate. Candidates sit on
 * the normal through points spread along the item's visible line, on either side, beside the line or one or two
 * rings further out (then with a leader line); a box must lie inside the plot; the cost counts the share of the
 * box over drawn pixels (any line, other items' fills), overlap with labels placed before, the ring, and slight
 * preferences (middle of the line, upper side) that make ties deterministic. Items with no visible line get none.
 * @returns one entry per labelled item, in the order of `items`
 */
export function placeDirectLabels(input: PlaceLabelsInput): PlacedLabel[] {
  const { items, plot } = input;
  const cover = itemCovers(items, plot, input.cellPx ?? LABEL_CELL_PX);
  const out = new Map<number, PlacedLabel>();
  const placed: PlacedLabel[] = [];
  items.forEach((it, k) => {
    if (!it.pinned) return;
    const p = pinnedPlace(it, k, input, cover);
    out.set(k, p);
    placed.push(p);
  });
  const order = items
    .map((it, k) => ({ k, len: it.pinned ? -1 : visibleLength(it.lines, plot) }))
    .filter((o) => o.len >= 0)
    .sort((a, b) => a.len - b.len || a.k - b.k);
  for (const { k } of order) {
    const p = bestPlace(items[k], k, input, cover, placed);
    if (!p) continue;
    out.set(k, p);
    placed.push(p);
  }
  return [...out.entries()].sort((a, b) => a[0] - b[0]).map(([, p]) => p);
}

/** Where a leader line leaves a box towards a point: the box edge on the segment from its centre. */
export function leaderStart(box: PlotRect, to: { x: number; y: number }): { x: number; y: number } {
  const cx = box.x + box.w / 2;
  const cy = box.y + box.h / 2;
  const dx = to.x - cx;
  const dy = to.y - cy;
  const fx = dx !== 0 ? box.w / 2 / Math.abs(dx) : Infinity;
  const fy = dy !== 0 ? box.h / 2 / Math.abs(dy) : Infinity;
  const f = Math.min(1, fx, fy);
  return { x: cx + dx * f, y: cy + dy * f };
}
