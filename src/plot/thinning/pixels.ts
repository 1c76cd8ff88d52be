// The public thinning step: a prepared curve to the pixels of one frame (column thinning for sorted curves,
// Douglas–Peucker or run thinning for the rest, then culling and clipping).
import { bisector, descending } from "d3-array";
import {
  allInside,
  clipHalf,
  clipScratch,
  clipToRect,
  cullOutside,
  CULL_MARGIN_PX,
  type Polyline,
  type Rect,
} from "./clip";
import { thinColumnsInto } from "./columns";
import { dpSelection } from "./douglas-peucker";
import type { PreparedCurve } from "../../analysis/prepared-curve";
import { viewArrays, type ViewArrays } from "./prepared";
import { gatherRuns, levelOf } from "./runs";
import type { RunDeferral } from "./deferred-runs";
import { ensureBuffers, scratch } from "./scratch";

export interface PixelParams {
  /** x = ax + bx·log10 m; y = ay + by·(v + yOffset), with v = log10 g + slope·log10 m. */
  ax: number;
  bx: number;
  ay: number;
  by: number;
  /** y-view slope (0 or −1) and the constant log10 offset (view factor and rescale). */
  slope: number;
  yOffset: number;
  /** Plot area (scene px). */
  plot: { x: number; y: number; w: number; h: number };
  /** Device pixels per scene pixel (on-screen scale × devicePixelRatio; 1 for export). @default 1 */
  resolution?: number;
  /** Thin at all (false draws every point, for comparisons). @default true */
  thin?: boolean;
  /**
   * Return views of the module's scratch buffers instead of new arrays: valid only until the next call
   * (the scene builder turns each into path data at once). @default false
   */
  reuse?: boolean;
  /**
   * On screen: leave a big file-order curve's first run thinning at a new level to a worker, listing it here,
   * and draw a stand-in meanwhile (see deferred-runs.ts). Exports never pass it.
   */
  deferRuns?: RunDeferral;
}

/** Map the selected indices to pixels in scratch.x/y. */
function mapSelected(prep: PreparedCurve, v: Float64Array, sel: Int32Array, count: number, p: PixelParams): void {
  ensureBuffers(count);
  const bufX = scratch.x;
  const bufY = scratch.y;
  const { ax, bx, ay, by, yOffset } = p;
  const lm = prep.lm;
  for (let k = 0; k < count; k++) {
    const i = sel[k];
    bufX[k] = ax + bx * lm[i];
    bufY[k] = ay + by * (v[i] + yOffset);
  }
}

/** Error budget of unsorted curves in device px: Douglas–Peucker alone, or run thinning alone. */
const DP_ONLY_PX = 0.5;
const RUNS_PX = 0.5;
/** Tolerance of the Douglas–Peucker stand-in for chunks no level has yet, in device px (one frame or a few). */
const STAND_IN_PX = 1;

/** Every point in scratch.x/y (thin: false, for comparisons). */
function allPixels(prep: PreparedCurve, p: PixelParams): number {
  const n = prep.n;
  ensureBuffers(n);
  const bufX = scratch.x;
  const bufY = scratch.y;
  for (let i = 0; i < n; i++) {
    bufX[i] = p.ax + p.bx * prep.lm[i];
    bufY[i] = p.ay + p.by * (prep.lg[i] + p.slope * prep.lm[i] + p.yOffset);
  }
  return n;
}

/** A sorted curve's column-thinned pixels in scratch.x/y; returns their count. */
function sortedPixels(prep: PreparedCurve, p: PixelParams, res: number): number {
  const pl = p.plot;
  const va = viewArrays(prep, p.slope);
  const colL0 = (pl.x - p.ax) / p.bx;
  const colK = p.bx * res;
  return thinColumnsInto(prep.lm, va.v, va.pyramid, { lmLo: colL0, lmHi: (pl.x + pl.w - p.ax) / p.bx, colL0, colK }, p);
}

// Over a decreasing array, the first index whose value is ≤ t: the count of entries above t.
const countAbove = bisector<number, number>(descending).left;

/** An unsorted curve's pixels (Douglas–Peucker or run thinning, whichever keeps fewer) in scratch.x/y. */
function unsortedPixels(prep: PreparedCurve, p: PixelParams, res: number, cullRect: Rect): number {
  const pl = p.plot;
  const va: ViewArrays = viewArrays(prep, p.slope);
  const lmLo = (cullRect.x0 - p.ax) / p.bx;
  const lmHi = (cullRect.x1 - p.ax) / p.bx;
  const vLo = (cullRect.y1 - p.ay) / p.by - p.yOffset;
  const vHi = (cullRect.y0 - p.ay) / p.by - p.yOffset;
  const scale = Math.max(Math.abs(p.bx), Math.abs(p.by));
  // Candidate A, Douglas–Peucker: the points above the tolerance are a prefix of the importance order.
  const k = countAbove(va.impDesc as Float64Array, DP_ONLY_PX / res / scale);
  const limit = Math.max(256, 2 * (pl.w + pl.h) * res);
  // Candidate B for noisy outlines (DP keeps almost everything): run thinning, cached per level with the
  // run size rounded down to a power of √2 (a finer level keeps a few more points; the bound holds).
  let n = 0;
  let useA = k <= limit;
  if (!useA) {
    const pow = (t: number) => 2 ** (Math.floor(2 * Math.log2(t)) / 2);
    const tx = pow(RUNS_PX / res / Math.abs(p.bx));
    const ty = pow(RUNS_PX / res / Math.abs(p.by));
    const standInTol = STAND_IN_PX / res / scale;
    n = gatherRuns(prep, va, levelOf(va, tx, ty), { lmLo, lmHi, vLo, vHi, map: p, standInTol, defer: p.deferRuns });
    useA = n >= k;
  }
  if (useA) {
    n = k;
    mapSelected(prep, va.v, dpSelection(va, k), n, p);
  }
  return n;
}

/**
 * The pixels of a prepared curve for one frame.
 * Sorted curves: per column of 1/resolution scene px the first, lowest, highest and last point, at their
 * own positions (moving them to the column centre would widen a spike that ends a column into a visible
 * notch).
 * Unsorted curves and closed regions: Douglas–Peucker at 0.5 device px while it keeps few points (smooth
 * outlines; the tolerance is divided by the larger px-per-decade so it holds on both axes), else run thinning
 * at 0.5 device px when that keeps fewer (noisy outlines, computed only for chunks near the plot and cached
 * per level); either way ≤ 0.5 device px from the full curve.
 * Then points beyond the plot (+ margin) are culled exactly and the rest clipped to the plot ± 2 plot sizes.
 * With `thin: false` every point is drawn (for comparisons only).
 */
export function curvePixels(prep: PreparedCurve, closed: boolean, p: PixelParams): Polyline {
  const res = p.resolution && p.resolution > 0 ? p.resolution : 1;
  const pl = p.plot;
  const far = 2 * Math.max(pl.w, pl.h);
  const farRect = { x0: pl.x - far, y0: pl.y - far, x1: pl.x + pl.w + far, y1: pl.y + pl.h + far };
  const mg = CULL_MARGIN_PX;
  const cullRect = { x0: pl.x - mg, y0: pl.y - mg, x1: pl.x + pl.w + mg, y1: pl.y + pl.h + mg };
  let n: number;
  if (p.thin === false) n = allPixels(prep, p);
  else n = cullOutside(prep.sorted ? sortedPixels(prep, p, res) : unsortedPixels(prep, p, res, cullRect), cullRect);
  const bufX = scratch.x;
  const bufY = scratch.y;
  if (!p.reuse) return clipToRect({ xs: bufX.slice(0, n), ys: bufY.slice(0, n), n, closed }, farRect);
  let cur: Polyline = { xs: bufX, ys: bufY, n, closed };
  if (!allInside(bufX, bufY, n, farRect)) {
    for (let side = 0, k = 0; side < 4 && cur.n > 0; side++) {
      const next = clipHalf(cur, side, farRect, clipScratch[k]);
      if (next !== cur) k ^= 1;
      cur = next;
    }
  }
  return { xs: cur.xs.subarray(0, cur.n), ys: cur.ys.subarray(0, cur.n), n: cur.n, closed };
}
