// Run thinning of curves drawn in file order: runs of points within a small box keep their extremes; levels
// are thinned a chunk at a time near the plot and cached per tolerance.

import type { PixelMap } from "./columns";
import type { PreparedCurve } from "../../analysis/prepared-curve";
import { BOX_CHUNK, type LevelSelection, type ViewArrays } from "./prepared";
import { ensureBuffers, scratch } from "./scratch";

/** Points per chunk of a run-thinning level: a chunk edge ends a run, which costs ≤ 2 extra points per chunk. */
export const RUN_CHUNK = 1024;

/** Selections cached per curve and view; older levels are dropped beyond this. */
const MAX_LEVELS = 24;

// Working space of thinRunsLog (its result is a copy): levels are thinned a chunk at a time, on every zoom.
let runScratch = new Int32Array(RUN_CHUNK);

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

export function levelOf(va: ViewArrays, key: string): LevelSelection {
  const hit = va.levels.get(key);
  if (hit) {
    va.levels.delete(key);
    va.levels.set(key, hit);
    return hit;
  }
  const sel: LevelSelection = { perChunk: [] };
  va.levels.set(key, sel);
  if (va.levels.size > MAX_LEVELS) va.levels.delete(va.levels.keys().next().value as string);
  return sel;
}

/**
 * Run-thinned pixels of the visible part of an unsorted curve into scratch.x/y. A chunk whose box lies
 * wholly beyond one edge of the cull rectangle (log space) contributes only its first and last point: the
 * path between them stays beyond that edge, so this is exact culling, found without touching its points.
 * Visible chunks are thinned on first use and kept in the level.
 */
export function gatherRuns(
  prep: PreparedCurve,
  va: ViewArrays,
  sel: LevelSelection,
  tx: number,
  ty: number,
  lmLo: number,
  lmHi: number,
  vLo: number,
  vHi: number,
  map: PixelMap,
): number {
  const boxes = va.boxes as Float64Array;
  const n = prep.n;
  const lm = prep.lm;
  const v = va.v;
  const { ax, bx, ay, by, yOffset } = map;
  const per = RUN_CHUNK / BOX_CHUNK;
  const nc = Math.ceil(n / RUN_CHUNK);
  let count = 0;
  for (let c = 0; c < nc; c++) {
    const s = c * RUN_CHUNK;
    const e = Math.min(n, s + RUN_CHUNK);
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
    const off = b < lmLo || a > lmHi || hi < vLo || lo > vHi;
    let idx = off ? null : sel.perChunk[c];
    if (!off && !idx) {
      idx = thinRunsLog(lm.subarray(s, e), v.subarray(s, e), tx, ty);
      for (let k = 0; k < idx.length; k++) idx[k] += s;
      sel.perChunk[c] = idx;
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
  return count;
}
