// Automatic legend placement: the inner corner where the legend box covers the least drawn content, read
// from the scene's curve and model paths on a coarse occupancy grid over the plot area (our own rule).
import type { Curve } from "../project/types";
import type { SceneNode } from "./scene-types";
import type { LegendCorner, PlotRect } from "./layout";
import { drawsSorted, preparedOf } from "./curves";
import { viewArrays, type PreparedCurve } from "./thinning/index";

/** Corners in the order ties are broken: the first of equally covered corners wins. */
export const LEGEND_CORNERS: readonly LegendCorner[] = ["top-right", "top-left", "bottom-right", "bottom-left"];

/** Side of one occupancy cell, scene px: a few px, coarser than a stroke, finer than a legend row. */
export const OCCUPANCY_CELL_PX = 4;

/**
 * Above this fraction of the legend box covered in every corner, the corners count as crowded and the
 * legend goes outside right when the figure leaves room for it (our own threshold; keeping a legend off the
 * data is common practice).
 */
export const CROWDED_COVERAGE = 0.35;

/**
 * Outside right is room enough when the plot area keeps at least this fraction of the figure width with the
 * legend beside it (and no legend label is cut): a slide usually has it, a single column only for a narrow
 * legend.
 */
export const OUTSIDE_MIN_PLOT_FRACTION = 0.6;

/**
 * Thinning resolution (columns per scene px) of the curve paths the placement reads. Fixed, so the screen
 * (whose resolution follows the display) and every export pick the same corner; two px per column is well
 * under a cell, so the cells a curve crosses hardly differ from those of the finer drawn path.
 */
export const PLACEMENT_RESOLUTION = 0.5;

/**
 * Most points of a curve drawn in file order (or a region) that the placement thins itself. Thinning such a
 * curve at a new zoom level costs time in proportion to its points (run thinning, cached per level); the
 * placement's own level would double that for every big region on every such zoom. Beyond this many points
 * the placement reads the curve's most important points instead (see {@link placementCurve}).
 */
export const PLACEMENT_MAX_POINTS = 4_000;

// Per prepared curve and y-view slope: the arrays of its PLACEMENT_MAX_POINTS most important points, kept so
// that the plot cache (keyed by array identity) prepares them once.
const standIns = new WeakMap<PreparedCurve, Map<number, { massEv: Float64Array; gInvGeV: Float64Array }>>();

/**
 * The curve the placement reads in place of `curve`: the curve itself when it is drawn in mass order or has
 * at most PLACEMENT_MAX_POINTS usable points; otherwise the same curve reduced to its PLACEMENT_MAX_POINTS
 * most important points in the y view of `slope` (the Douglas–Peucker order the drawing already has, in file
 * order, ends included), which outlines it far finer than the 4 px cells need. Depends on the data and the
 * view only, never on the resolution, so screen and export still agree.
 */
export function placementCurve<C extends Pick<Curve, "role" | "keepOrder" | "massEv" | "gInvGeV">>(
  curve: C,
  slope: number,
): C {
  if (drawsSorted(curve)) return curve;
  const prep = preparedOf(curve);
  if (prep.n <= PLACEMENT_MAX_POINTS) return curve;
  let bySlope = standIns.get(prep);
  if (!bySlope) {
    bySlope = new Map();
    standIns.set(prep, bySlope);
  }
  let arrays = bySlope.get(slope);
  if (!arrays) {
    const order = viewArrays(prep, slope, curve.role === "region").order as Int32Array;
    const keep = order.slice(0, PLACEMENT_MAX_POINTS).sort();
    const massEv = new Float64Array(keep.length);
    const gInvGeV = new Float64Array(keep.length);
    for (let k = 0; k < keep.length; k++) {
      massEv[k] = 10 ** prep.lm[keep[k]];
      gInvGeV[k] = 10 ** prep.lg[keep[k]];
    }
    arrays = { massEv, gInvGeV };
    bySlope.set(slope, arrays);
  }
  return { ...curve, massEv: arrays.massEv, gInvGeV: arrays.gInvGeV };
}

/** Cells of the plot area that hold drawn content: 1 where a line crosses the cell or the cell's centre is inside a fill. */
export interface OccupancyGrid {
  /** Top-left corner of cell (0, 0), scene px (the plot area's). */
  x0: number;
  y0: number;
  cellPx: number;
  cols: number;
  rows: number;
  /** Row-major, cols × rows. */
  cells: Uint8Array;
}

/** One subpath of SVG path data: its vertices in scene px and whether it was closed with Z. */
export interface Subpath {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  closed: boolean;
}

/** A subpath read from path data (plain arrays). */
export interface ParsedSubpath extends Subpath {
  xs: number[];
  ys: number[];
}

/** Drawn content given as vertices rather than path data (what the scene builder has before writing it). */
export interface Shape {
  subpaths: readonly Subpath[];
  /** Painted fill (nonzero winding) and painted stroke. */
  fill: boolean;
  stroke: boolean;
}

// ------------------------------------------------------------------------------------------------ path data

/** Numbers each command takes, by upper-case letter code; -1 for characters that are not commands. */
const PARAMS = (() => {
  const t = new Int8Array(128).fill(-1);
  const set = (ch: string, k: number) => {
    t[ch.charCodeAt(0)] = k;
    t[ch.toLowerCase().charCodeAt(0)] = k;
  };
  set("M", 2);
  set("L", 2);
  set("H", 1);
  set("V", 1);
  set("C", 6);
  set("S", 4);
  set("Q", 4);
  set("T", 2);
  set("A", 7);
  set("Z", 0);
  return t;
})();

function isSeparator(c: number): boolean {
  return c === 32 || c === 44 || c === 9 || c === 10 || c === 13;
}

// Reader state of parsePathData (synchronous, so module variables are safe); plain functions over module
// variables keep the number reader out of a closure, which V8 optimises poorly.
let src = "";
let at = 0;
let num = 0;

/** Reads one number at `at` into `num` (separators before it skipped); false when there is none. */
function readNumber(): boolean {
  const d = src;
  let i = at;
  let c = d.charCodeAt(i);
  while (isSeparator(c)) c = d.charCodeAt(++i);
  let neg = false;
  if (c === 43 || c === 45) {
    neg = c === 45;
    c = d.charCodeAt(++i);
  }
  let v = 0;
  let digits = 0;
  while (c >= 48 && c <= 57) {
    v = v * 10 + (c - 48);
    digits++;
    c = d.charCodeAt(++i);
  }
  if (c === 46) {
    c = d.charCodeAt(++i);
    let scale = 1;
    while (c >= 48 && c <= 57) {
      v = v * 10 + (c - 48);
      scale *= 10;
      digits++;
      c = d.charCodeAt(++i);
    }
    v /= scale;
  }
  if (digits === 0) return false;
  if (c === 101 || c === 69) {
    let j = i + 1;
    let e = d.charCodeAt(j);
    let eneg = false;
    if (e === 43 || e === 45) {
      eneg = e === 45;
      e = d.charCodeAt(++j);
    }
    if (e >= 48 && e <= 57) {
      let ex = 0;
      while (e >= 48 && e <= 57) {
        ex = ex * 10 + (e - 48);
        e = d.charCodeAt(++j);
      }
      v *= 10 ** (eneg ? -ex : ex);
      i = j;
    }
  }
  num = neg ? -v : v;
  at = i;
  return true;
}

/**
 * The subpaths of SVG path data (SVG 1.1 path grammar: absolute and relative M, L, H, V, Z; curve and arc
 * commands are followed to their end point, a chord, since the scene draws none). Numbers may run together
 * as the compact curve form writes them ("l.5-.25"). Stops at the first character it cannot read.
 * @param d path data in scene px
 */
export function parsePathData(d: string): ParsedSubpath[] {
  const out: ParsedSubpath[] = [];
  const n = d.length;
  src = d;
  at = 0;
  let xs: number[] = [];
  let ys: number[] = [];
  let cur: ParsedSubpath | null = null;
  let x = 0;
  let y = 0;
  let sx = 0;
  let sy = 0;
  let cmd = 0;
  let k = -1;
  let rel = false;
  const end: number[] = [0, 0, 0, 0, 0, 0, 0];
  while (at < n) {
    const c = d.charCodeAt(at);
    if (isSeparator(c)) {
      at++;
      continue;
    }
    const kc = c < 128 ? PARAMS[c] : -1;
    if (kc >= 0) {
      cmd = c & ~32;
      rel = c !== cmd;
      k = kc;
      at++;
      if (k === 0) {
        if (cur) cur.closed = true;
        cur = null;
        x = sx;
        y = sy;
        continue;
      }
    } else if (k <= 0) {
      break;
    }
    for (let j = 0; j < k; j++) {
      if (!readNumber()) {
        src = "";
        return out;
      }
      end[j] = num;
    }
    if (cmd === 77) {
      x = sx = rel ? x + end[0] : end[0];
      y = sy = rel ? y + end[1] : end[1];
      xs = [x];
      ys = [y];
      cur = { xs, ys, closed: false };
      out.push(cur);
      // Further pairs after M are line-tos (SVG 1.1 §8.3.2).
      cmd = 76;
      continue;
    }
    if (cmd === 72) x = rel ? x + end[0] : end[0];
    else if (cmd === 86) y = rel ? y + end[0] : end[0];
    else {
      x = rel ? x + end[k - 2] : end[k - 2];
      y = rel ? y + end[k - 1] : end[k - 1];
    }
    if (!cur) {
      // A drawing command right after Z starts a new subpath at the current point.
      xs = [sx];
      ys = [sy];
      cur = { xs, ys, closed: false };
      out.push(cur);
    }
    xs.push(x);
    ys.push(y);
  }
  // Drop the reference to the (possibly long) path text.
  src = "";
  return out;
}

// ---------------------------------------------------------------------------------------------- occupancy grid

/**
 * An empty grid of `cellPx` cells over the plot area (the last column and row may stick out past it).
 * @param cellPx side of a cell, scene px. @default OCCUPANCY_CELL_PX
 */
export function emptyGrid(plot: PlotRect, cellPx: number = OCCUPANCY_CELL_PX): OccupancyGrid {
  const cols = Math.max(1, Math.ceil(plot.w / cellPx));
  const rows = Math.max(1, Math.ceil(plot.h / cellPx));
  return { x0: plot.x, y0: plot.y, cellPx, cols, rows, cells: new Uint8Array(cols * rows) };
}

/**
 * Marks every cell a segment passes through (exact grid traversal after clipping to the grid), so the cost
 * is the number of cells crossed. Stroke width is not added: strokes are a px or two, under a cell.
 */
export function markSegment(g: OccupancyGrid, xa: number, ya: number, xb: number, yb: number): void {
  const { cols, rows, cells } = g;
  // Grid units: cell (c, r) is [c, c+1) × [r, r+1).
  const u0 = (xa - g.x0) / g.cellPx;
  const v0 = (ya - g.y0) / g.cellPx;
  const du = (xb - g.x0) / g.cellPx - u0;
  const dv = (yb - g.y0) / g.cellPx - v0;
  if (!Number.isFinite(u0 + v0 + du + dv)) return;
  // Liang–Barsky clip of u0 + t·du, v0 + t·dv (t ∈ [0, 1]) to [0, cols] × [0, rows].
  let t0 = 0;
  let t1 = 1;
  if (du === 0) {
    if (u0 < 0 || u0 > cols) return;
  } else {
    let ta = -u0 / du;
    let tb = (cols - u0) / du;
    if (ta > tb) [ta, tb] = [tb, ta];
    if (ta > t0) t0 = ta;
    if (tb < t1) t1 = tb;
  }
  if (dv === 0) {
    if (v0 < 0 || v0 > rows) return;
  } else {
    let ta = -v0 / dv;
    let tb = (rows - v0) / dv;
    if (ta > tb) [ta, tb] = [tb, ta];
    if (ta > t0) t0 = ta;
    if (tb < t1) t1 = tb;
  }
  if (t0 > t1) return;
  const ua = u0 + t0 * du;
  const va = v0 + t0 * dv;
  const ub = u0 + t1 * du;
  const vb = v0 + t1 * dv;
  let c = Math.min(cols - 1, Math.max(0, Math.floor(ua)));
  let r = Math.min(rows - 1, Math.max(0, Math.floor(va)));
  const cEnd = Math.min(cols - 1, Math.max(0, Math.floor(ub)));
  const rEnd = Math.min(rows - 1, Math.max(0, Math.floor(vb)));
  if (c === cEnd && r === rEnd) {
    cells[r * cols + c] = 1;
    return;
  }
  const stepC = cEnd > c ? 1 : cEnd < c ? -1 : 0;
  const stepR = rEnd > r ? 1 : rEnd < r ? -1 : 0;
  // Amanatides–Woo: the parameter along the segment (same t as above) of the next column and row boundary.
  let tMaxC = stepC === 0 ? Infinity : ((stepC > 0 ? c + 1 : c) - u0) / du;
  let tMaxR = stepR === 0 ? Infinity : ((stepR > 0 ? r + 1 : r) - v0) / dv;
  const tDeltaC = stepC === 0 ? Infinity : 1 / Math.abs(du);
  const tDeltaR = stepR === 0 ? Infinity : 1 / Math.abs(dv);
  // One step per column or row boundary crossed, so the loop ends at (cEnd, rEnd) after exactly that many.
  for (let steps = Math.abs(cEnd - c) + Math.abs(rEnd - r); ; steps--) {
    cells[r * cols + c] = 1;
    if (steps === 0) break;
    if (c === cEnd || (r !== rEnd && tMaxR <= tMaxC)) {
      r += stepR;
      tMaxR += tDeltaR;
    } else {
      c += stepC;
      tMaxC += tDeltaC;
    }
  }
}

/** Marks the cells every segment of the subpaths crosses (closed ones with their closing segment). */
export function markStroke(g: OccupancyGrid, subpaths: readonly Subpath[]): void {
  for (const s of subpaths) {
    const m = s.xs.length;
    for (let k = 1; k < m; k++) markSegment(g, s.xs[k - 1], s.ys[k - 1], s.xs[k], s.ys[k]);
    if (s.closed && m > 2) markSegment(g, s.xs[m - 1], s.ys[m - 1], s.xs[0], s.ys[0]);
  }
}

/** Scratch of {@link markFill}: winding steps per cell and the span of crossed columns per row. */
export interface FillScratch {
  wind: Int32Array;
  rowMin: Int32Array;
  rowMax: Int32Array;
}

/** Fresh {@link FillScratch} for a grid. */
export function fillScratch(g: OccupancyGrid): FillScratch {
  return {
    wind: new Int32Array(g.rows * g.cols),
    rowMin: new Int32Array(g.rows).fill(g.cols),
    rowMax: new Int32Array(g.rows).fill(-1),
  };
}

/**
 * Marks the cells whose centre lies inside the filled area of the subpaths (each closed for filling, as SVG
 * fills open subpaths; nonzero winding, SVG's default fill rule). Per edge, one winding step in the first cell
 * right of its crossing of each row's centre line; a running sum along the row gives the winding at every
 * cell centre (left of a row's first step it is 0, right of its last step constant). Cost: vertices + row
 * crossings + the cells between a row's first and last step, without sorting.
 * @param scratch reusable buffers for this grid's size (all zero / empty spans between calls)
 */
export function markFill(g: OccupancyGrid, subpaths: readonly Subpath[], scratch: FillScratch = fillScratch(g)): void {
  const { cols, rows, cellPx, x0, y0, cells } = g;
  const { wind, rowMin, rowMax } = scratch;
  let rLo = rows;
  let rHi = -1;
  for (const s of subpaths) {
    const m = s.xs.length;
    if (m < 3) continue;
    const xs = s.xs;
    const ys = s.ys;
    for (let k = 0; k < m; k++) {
      const j = k === 0 ? m - 1 : k - 1;
      const xa = xs[j];
      const ya = ys[j];
      const xb = xs[k];
      const yb = ys[k];
      if (ya === yb || !Number.isFinite(xa + ya + xb + yb)) continue;
      const dir = yb > ya ? 1 : -1;
      const lo = ya < yb ? ya : yb;
      const hi = ya < yb ? yb : ya;
      // Rows whose centre y0 + (r + ½)·cell lies in [lo, hi).
      const r0 = Math.max(0, Math.ceil((lo - y0) / cellPx - 0.5));
      const r1 = Math.min(rows - 1, Math.ceil((hi - y0) / cellPx - 0.5) - 1);
      if (r1 < r0) continue;
      if (r0 < rLo) rLo = r0;
      if (r1 > rHi) rHi = r1;
      const slope = (xb - xa) / (yb - ya);
      for (let r = r0; r <= r1; r++) {
        const x = xa + (y0 + (r + 0.5) * cellPx - ya) * slope;
        // First cell whose centre is right of x; a crossing left of the grid counts for the whole row, one
        // right of it for none.
        const c = Math.max(0, Math.floor((x - x0) / cellPx + 0.5));
        if (c >= cols) continue;
        wind[r * cols + c] += dir;
        if (c < rowMin[r]) rowMin[r] = c;
        if (c > rowMax[r]) rowMax[r] = c;
      }
    }
  }
  for (let r = rLo; r <= rHi; r++) {
    const c0 = rowMin[r];
    const c1 = rowMax[r];
    if (c1 < 0) continue;
    const base = r * cols;
    let w = 0;
    for (let c = c0; c <= c1; c++) {
      w += wind[base + c];
      wind[base + c] = 0;
      if (w !== 0) cells[base + c] = 1;
    }
    if (w !== 0 && c1 + 1 < cols) cells.fill(1, base + c1 + 1, base + cols);
    rowMin[r] = cols;
    rowMax[r] = -1;
  }
}

function paints(colour: string | undefined): boolean {
  return colour !== undefined && colour !== "" && colour !== "none" && colour !== "transparent";
}

/**
 * The occupancy grid of scene nodes over the plot area: strokes of paths and rects mark the cells they cross,
 * fills the cells whose centre they cover; text is ignored. Deterministic, O(path vertices + row crossings +
 * grid cells).
 * @param nodes the drawn content (the scene's curve and model nodes)
 * @param plot the plot area, scene px
 * @param cellPx side of a cell, scene px. @default OCCUPANCY_CELL_PX
 */
export function occupancyGrid(
  nodes: readonly SceneNode[],
  plot: PlotRect,
  cellPx: number = OCCUPANCY_CELL_PX,
  shapes: readonly Shape[] = [],
): OccupancyGrid {
  const g = emptyGrid(plot, cellPx);
  const scratch = fillScratch(g);
  for (const shape of shapes) {
    if (shape.fill) markFill(g, shape.subpaths, scratch);
    if (shape.stroke) markStroke(g, shape.subpaths);
  }
  for (const node of nodes) {
    if (node.kind === "text") continue;
    const stroke =
      paints(node.stroke) && (node.strokeWidth ?? 1) > 0 && (node.kind === "rect" || (node.strokeOpacity ?? 1) > 0);
    // An absent fill is black in SVG, for paths and rects alike.
    const fill = paints(node.fill ?? "#000") && (node.fillOpacity ?? 1) > 0;
    if (!stroke && !fill) continue;
    const subpaths: Subpath[] =
      node.kind === "path"
        ? parsePathData(node.d)
        : [
            {
              xs: [node.x, node.x + node.w, node.x + node.w, node.x],
              ys: [node.y, node.y, node.y + node.h, node.y + node.h],
              closed: true,
            },
          ];
    if (fill) markFill(g, subpaths, scratch);
    if (stroke) markStroke(g, subpaths);
  }
  return g;
}

/**
 * Fraction (0..1) of a box's area over occupied cells, each cell counted by its overlap with the box; the
 * part of the box outside the grid counts as empty.
 */
export function coveredFraction(g: OccupancyGrid, box: PlotRect): number {
  if (!(box.w > 0 && box.h > 0)) return 0;
  const { x0, y0, cellPx, cols, rows, cells } = g;
  const c0 = Math.max(0, Math.floor((box.x - x0) / cellPx));
  const c1 = Math.min(cols - 1, Math.floor((box.x + box.w - x0) / cellPx));
  const r0 = Math.max(0, Math.floor((box.y - y0) / cellPx));
  const r1 = Math.min(rows - 1, Math.floor((box.y + box.h - y0) / cellPx));
  let area = 0;
  for (let r = r0; r <= r1; r++) {
    const cy0 = y0 + r * cellPx;
    const oh = Math.min(cy0 + cellPx, box.y + box.h) - Math.max(cy0, box.y);
    if (oh <= 0) continue;
    let ow = 0;
    for (let c = c0; c <= c1; c++) {
      if (!cells[r * cols + c]) continue;
      const cx0 = x0 + c * cellPx;
      const w = Math.min(cx0 + cellPx, box.x + box.w) - Math.max(cx0, box.x);
      if (w > 0) ow += w;
    }
    area += ow * oh;
  }
  return area / (box.w * box.h);
}

// ---------------------------------------------------------------------------------------------------- choice

/** The outcome of automatic placement, with each corner's coverage for tests and tooltips. */
export interface LegendChoice {
  place: LegendCorner | "outside-right";
  /** Fraction of the legend box over drawn content in each corner. */
  coverage: Record<LegendCorner, number>;
  /** Every corner covers more than {@link CROWDED_COVERAGE}. */
  crowded: boolean;
}

export interface LegendPlaceInput {
  /** Drawn content to keep clear: the curve and model nodes (not grid, highlight or axes). */
  nodes: readonly SceneNode[];
  /** More drawn content, as vertices (the scene builder's curves, without writing and reading path data). */
  shapes?: readonly Shape[];
  /** Plot area, scene px. */
  plot: PlotRect;
  /** The legend box (scene px) in each inner corner. */
  boxes: Record<LegendCorner, PlotRect>;
  /** Whether the figure leaves room for the legend outside right; asked only when every corner is crowded. */
  outsideFits: () => boolean;
  /** @default OCCUPANCY_CELL_PX */
  cellPx?: number;
  /** @default CROWDED_COVERAGE */
  crowdedCoverage?: number;
}

/**
 * Where an "auto" legend goes: the inner corner whose box covers the least drawn content (ties in the order
 * of {@link LEGEND_CORNERS}); when every corner covers more than `crowdedCoverage` of the box, outside right
 * if the figure leaves room, else still the least covered corner. A pure function of its input.
 */
export function pickLegendPlace(input: LegendPlaceInput): LegendChoice {
  const grid = occupancyGrid(input.nodes, input.plot, input.cellPx ?? OCCUPANCY_CELL_PX, input.shapes);
  const coverage = {} as Record<LegendCorner, number>;
  let best: LegendCorner = LEGEND_CORNERS[0];
  for (const corner of LEGEND_CORNERS) {
    coverage[corner] = coveredFraction(grid, input.boxes[corner]);
    if (coverage[corner] < coverage[best]) best = corner;
  }
  const crowded = coverage[best] > (input.crowdedCoverage ?? CROWDED_COVERAGE);
  return { place: crowded && input.outsideFits() ? "outside-right" : best, coverage, crowded };
}
