// Run thinning of curves drawn in file order: runs of points within a small box keep their extremes; levels
// are thinned a chunk at a time near the plot and cached per tolerance.

import type { PixelMap } from "./columns";
import type { PreparedCurve } from "../../analysis/prepared-curve";
import { BOX_CHUNK, type LevelSelection, type ViewArrays } from "./prepared";
import { DEFER_MIN_POINTS, nearestLevelChunk, type RunDeferral } from "./deferred-runs";
import { ensureBuffers, scratch } from "./scratch";

/** Points per chunk of a run-thinning level: a chunk edge ends a run, which costs ≤ 2 extra points per chunk. */
export const RUN_CHUNK = 1024;

/** Selections cached per curve and view; older levels are dropped beyond this. */
const MAX_LEVELS = 24;

// Working space of thinRunsLog (its result is a copy): levels are thinned a chunk at a time, on every zoom.
let runScratch = new Int32Array(RUN_CHUNK);
// Which chunks of the curve being gathered are near the plot (1) or wholly beyond one edge (0).
let visible = new Uint8Array(1024);

/**
 * Run thinning for curves that are not sorted by mass: consecutive points whose bounding box is at most
 * `tx` wide (then the run keeps its first, lowest, highest and last point, in order) or at most `ty` tall
 * (then first, leftmost, rightmost, last). Every removed point lies in its run's box and the kept polyline
 * crosses that box from one extreme to the other, so old and new are within tx (resp. ty) of each other
 * (Hausdorff). Works on log coordinates (tx, ty in decades: through the affine maps this is run thinning in
 * px with τ = tx·bx = ty·|by|) or directly on px.
 * @returns the kept indices, ascending.
 */
export function thinRunsLog(lm: Float64Array, v: Float64Array, tx: number, ty: number): Int32Array {
  const n = lm.length;
  if (runScratch.length < n) runScratch = new Int32Array(n);
  const out = runScratch;
  let w = 0;
  let i = 0;
  while (i < n) {
    let xmin = lm[i];
    let xmax = xmin;
    let ymin = v[i];
    let ymax = ymin;
    let ixmin = i;
    let ixmax = i;
    let iymin = i;
    let iymax = i;
    let j = i + 1;
    for (; j < n; j++) {
      const x = lm[j];
      const y = v[j];
      const nxmin = x < xmin ? x : xmin;
      const nxmax = x > xmax ? x : xmax;
      const nymin = y < ymin ? y : ymin;
      const nymax = y > ymax ? y : ymax;
      if (nxmax - nxmin > tx && nymax - nymin > ty) break;
      if (x < xmin) ixmin = j;
      else if (x > xmax) ixmax = j;
      if (y < ymin) iymin = j;
      else if (y > ymax) iymax = j;
      xmin = nxmin;
      xmax = nxmax;
      ymin = nymin;
      ymax = nymax;
    }
    const last = j - 1;
    if (last - i < 4) {
      for (let k = i; k <= last; k++) out[w++] = k;
    } else {
      const narrow = xmax - xmin <= tx;
      const a = narrow ? Math.min(iymin, iymax) : Math.min(ixmin, ixmax);
      const b = narrow ? Math.max(iymin, iymax) : Math.max(ixmin, ixmax);
      out[w++] = i;
      if (a !== i && a !== last) out[w++] = a;
      if (b !== i && b !== last && b !== a) out[w++] = b;
      out[w++] = last;
    }
    i = j;
  }
  return out.slice(0, w);
}

/**
 * Chunk c of a level (absolute indices, ascending): what the scene builder and the runs worker (run-jobs.ts) both
 * compute, so a level filled by the worker is the one a synchronous build makes.
 */
export function thinRunChunk(lm: Float64Array, v: Float64Array, c: number, tx: number, ty: number): Int32Array {
  const s = c * RUN_CHUNK;
  const e = Math.min(lm.length, s + RUN_CHUNK);
  const idx = thinRunsLog(lm.subarray(s, e), v.subarray(s, e), tx, ty);
  for (let k = 0; k < idx.length; k++) idx[k] += s;
  return idx;
}

/** The level of run sizes (tx, ty) of a view, made most recent (created empty when new). */
export function levelOf(va: ViewArrays, tx: number, ty: number): LevelSelection {
  const key = `B${tx},${ty}`;
  const hit = va.levels.get(key);
  if (hit) {
    va.levels.delete(key);
    va.levels.set(key, hit);
    return hit;
  }
  const sel: LevelSelection = { tx, ty, perChunk: [] };
  va.levels.set(key, sel);
  if (va.levels.size > MAX_LEVELS) va.levels.delete(va.levels.keys().next().value as string);
  return sel;
}

/** What gatherRuns needs of the frame: the cull rectangle in (lm, v), the pixel map, and a deferral if any. */
export interface RunFrame {
  lmLo: number;
  lmHi: number;
  vLo: number;
  vHi: number;
  map: PixelMap;
  /** Importance above which a point is kept in a Douglas–Peucker stand-in (log units). */
  standInTol: number;
  defer?: RunDeferral;
}

/**
 * Marks in `visible` the chunks near the cull rectangle: a chunk whose box lies wholly beyond one edge (log space)
 * contributes only its first and last point, since the path between them stays beyond that edge (exact culling,
 * found without touching its points). Returns how many points of visible chunks the level still lacks.
 */
function markVisible(va: ViewArrays, sel: LevelSelection, n: number, f: RunFrame): number {
  const boxes = va.boxes as Float64Array;
  const per = RUN_CHUNK / BOX_CHUNK;
  const nc = Math.ceil(n / RUN_CHUNK);
  if (visible.length < nc) visible = new Uint8Array(nc);
  let missing = 0;
  for (let c = 0; c < nc; c++) {
    let a = Infinity;
    let b = -Infinity;
    let lo = Infinity;
    let hi = -Infinity;
    const b0 = c * per;
    const b1 = Math.min(boxes.length >> 2, b0 + per);
    for (let k = b0; k < b1; k++) {
      if (boxes[4 * k] < a) a = boxes[4 * k];
      if (boxes[4 * k + 1] > b) b = boxes[4 * k + 1];
      if (boxes[4 * k + 2] < lo) lo = boxes[4 * k + 2];
      if (boxes[4 * k + 3] > hi) hi = boxes[4 * k + 3];
    }
    const on = !(b < f.lmLo || a > f.lmHi || hi < f.vLo || lo > f.vHi);
    visible[c] = on ? 1 : 0;
    if (on && !sel.perChunk[c]) missing += Math.min(n, (c + 1) * RUN_CHUNK) - c * RUN_CHUNK;
  }
  return missing;
}

/**
 * Run-thinned pixels of the visible part of an unsorted curve into scratch.x/y (chunks beyond the plot: their
 * ends only, see markVisible). Visible chunks are thinned on first use and kept in the level, unless `f.defer` is
 * given and they add up to DEFER_MIN_POINTS or more: then they are listed for the worker and drawn meanwhile from
 * the nearest level that has them, or else as their points above the Douglas–Peucker stand-in tolerance.
 */
// A hot loop, long on purpose: the pixel mapping is written out per source of indices.
export function gatherRuns(prep: PreparedCurve, va: ViewArrays, sel: LevelSelection, f: RunFrame): number {
  const n = prep.n;
  const lm = prep.lm;
  const v = va.v;
  const { ax, bx, ay, by, yOffset } = f.map;
  const nc = Math.ceil(n / RUN_CHUNK);
  const defer = markVisible(va, sel, n, f) >= DEFER_MIN_POINTS && !!f.defer;
  const deferred: number[] = [];
  const imp = va.importance as Float64Array;
  let count = 0;
  for (let c = 0; c < nc; c++) {
    const s = c * RUN_CHUNK;
    const e = Math.min(n, s + RUN_CHUNK);
    let idx = visible[c] ? sel.perChunk[c] : null;
    if (visible[c] && !idx) {
      if (!defer) idx = sel.perChunk[c] = thinRunChunk(lm, v, c, sel.tx, sel.ty);
      else {
        deferred.push(c);
        idx = nearestLevelChunk(va, sel, c);
      }
    }
    if (!idx && visible[c]) {
      // Douglas–Peucker stand-in: the chunk's ends and its points above the stand-in tolerance.
      ensureBuffers(count + (e - s), count);
      const ox = scratch.x;
      const oy = scratch.y;
      for (let i = s; i < e; i++) {
        if (i !== s && i !== e - 1 && !(imp[i] > f.standInTol)) continue;
        ox[count] = ax + bx * lm[i];
        oy[count] = ay + by * (v[i] + yOffset);
        count++;
      }
      continue;
    }
    // The pixels of the kept points, written here rather than in a second pass over their indices.
    ensureBuffers(count + (idx ? idx.length : 2), count);
    const ox = scratch.x;
    const oy = scratch.y;
    if (!idx) {
      ox[count] = ax + bx * lm[s];
      oy[count] = ay + by * (v[s] + yOffset);
      count++;
      if (e - 1 > s) {
        ox[count] = ax + bx * lm[e - 1];
        oy[count] = ay + by * (v[e - 1] + yOffset);
        count++;
      }
      continue;
    }
    for (let k = 0; k < idx.length; k++) {
      const i = idx[k];
      ox[count] = ax + bx * lm[i];
      oy[count] = ay + by * (v[i] + yOffset);
      count++;
    }
  }
  if (deferred.length) f.defer?.jobs.push({ prep, va, level: sel, chunks: deferred });
  return count;
}
