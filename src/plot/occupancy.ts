// The occupancy grid the automatic legend placement reads: which cells of the plot area hold drawn content, marked
// from shapes given as vertices (curves and models as the scene builder has them), never read back from path data.
import type { PathNode } from "./scene-types";
import type { PlotRect } from "./layout";
import type { Polyline } from "./thinning/index";

/** Side of one occupancy cell, scene px: a few px, coarser than a stroke, finer than a legend row. */
export const OCCUPANCY_CELL_PX = 4;

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

/** One subpath of a drawn shape: its vertices in scene px and whether it is closed. */
export interface Subpath {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  closed: boolean;
}

/** Drawn content given as vertices rather than path data (what the scene builder has before writing it). */
export interface Shape {
  subpaths: readonly Subpath[];
  /** Painted fill (nonzero winding) and painted stroke. */
  fill: boolean;
  stroke: boolean;
}

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

/** A polyline at the positions its path data rounds it to (0.01 px), as the drawn path puts its vertices. */
export function atHundredths(pl: Polyline): Subpath {
  const xs = new Float64Array(pl.n);
  const ys = new Float64Array(pl.n);
  for (let k = 0; k < pl.n; k++) {
    xs[k] = Math.round(pl.xs[k] * 100) / 100;
    ys[k] = Math.round(pl.ys[k] * 100) / 100;
  }
  return { xs, ys, closed: pl.closed };
}

/**
 * A drawn path node as the placement sees it: its subpaths (empty ones left out), and whether its fill and
 * its stroke paint anything (an absent fill is black in SVG).
 */
export function pathShape(
  node: Pick<PathNode, "fill" | "fillOpacity" | "stroke" | "strokeWidth" | "strokeOpacity">,
  subpaths: readonly Subpath[],
): Shape {
  const stroke = paints(node.stroke) && (node.strokeWidth ?? 1) > 0 && (node.strokeOpacity ?? 1) > 0;
  const fill = paints(node.fill ?? "#000") && (node.fillOpacity ?? 1) > 0;
  return { subpaths: subpaths.filter((s) => s.xs.length > 0), fill, stroke };
}

/**
 * The occupancy grid of drawn shapes over the plot area: strokes mark the cells they cross, fills the cells
 * whose centre they cover. Deterministic, O(vertices + row crossings + grid cells).
 * @param shapes the drawn content (the scene's curves and models as vertices)
 * @param plot the plot area, scene px
 * @param cellPx side of a cell, scene px. @default OCCUPANCY_CELL_PX
 */
export function occupancyGrid(
  shapes: readonly Shape[],
  plot: PlotRect,
  cellPx: number = OCCUPANCY_CELL_PX,
): OccupancyGrid {
  const g = emptyGrid(plot, cellPx);
  const scratch = fillScratch(g);
  for (const shape of shapes) {
    if (shape.fill) markFill(g, shape.subpaths, scratch);
    if (shape.stroke) markStroke(g, shape.subpaths);
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
