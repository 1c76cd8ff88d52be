// Column thinning of curves sorted by mass: per pixel column the first, lowest, highest and last point
// (at most 4 per column, no spike lost), found through the pyramid in O(columns · log n).

import { bisectLeft, bisectRight } from "d3-array";
import { levelValues, rangeMinMax, type MinMaxIndex, type Pyramid } from "./pyramid";
import { ensureBuffers, ensureIdx, scratch } from "./scratch";

// The answer of rangeMinMax, reused column after column.
const extremes: MinMaxIndex = { min: 0, max: 0 };
/**
 * Pixel column of a log10 mass: floor((lm − colL0)·colK), where colK = px per decade × resolution. The
 * thinning and its tests both use this exact expression, so there is no disagreement at column edges.
 */
export function pixelColumn(lm: number, colL0: number, colK: number): number {
  return Math.floor((lm - colL0) * colK);
}

/** Column geometry of a thinning: the visible log10-mass window and the column width. */
export interface ColumnParams {
  /** Visible window in log10 mass (eV); one point beyond each end is kept so lines enter the frame. */
  lmLo: number;
  lmHi: number;
  /** Origin of the column grid (log10 mass at the left edge of the plot). */
  colL0: number;
  /** Columns per decade: px per decade × resolution. */
  colK: number;
}

/**
 * Indices of a sorted curve kept by column thinning: per pixel column the first, the lowest, the highest
 * and the last point (in index order, duplicates merged), so at most 4 per column and no spike is lost.
 * Runs in O(columns · log) plus the partial blocks, not O(points).
 * @param lm ascending log10 masses. @param v log10 y values (any monotone y map keeps the same indices).
 */
export function thinColumns(lm: Float64Array, v: Float64Array, pyr: Pyramid | null, p: ColumnParams): Int32Array {
  // Count first: the call may replace scratch.idx with a larger buffer.
  const count = thinColumnsInto(lm, v, pyr, p);
  return scratch.idx.slice(0, count);
}

/** An affine map of (log10 m, v) to pixels: x = ax + bx·lm, y = ay + by·(v + yOffset). */
export interface PixelMap {
  ax: number;
  bx: number;
  ay: number;
  by: number;
  yOffset: number;
}

/**
 * {@link thinColumns} leaving the indices in scratch.idx, or with `map` the kept points' pixels in scratch.x/y
 * (written while their values are at hand: a second pass over the indices would fetch them from memory
 * again); returns their count.
 */
// A hot loop, long on purpose: one pass per column with the pixel mapping inlined.
export function thinColumnsInto(
  lm: Float64Array,
  v: Float64Array,
  pyr: Pyramid | null,
  p: ColumnParams,
  map: PixelMap | null = null,
): number {
  const n = lm.length;
  if (n === 0) return 0;
  const start = Math.max(0, bisectLeft(lm, p.lmLo) - 1);
  const end = Math.min(n, bisectRight(lm, p.lmHi) + 1);
  const { colL0, colK } = p;
  if (pyr && pyr.levels.length) levelValues(pyr, v);
  const q = extremes;
  // At most 4 points per column, and the visible columns plus the two beyond the ends.
  const bound = Math.min(end - start, 4 * (Math.max(0, Math.ceil((p.lmHi - p.lmLo) * colK)) + 8));
  if (map) ensureBuffers(bound);
  else ensureIdx(bound);
  const ax = map ? map.ax : 0;
  const bx = map ? map.bx : 0;
  const ay = map ? map.ay : 0;
  const by = map ? map.by : 0;
  const yOffset = map ? map.yOffset : 0;
  const ox = scratch.x;
  const oy = scratch.y;
  const oi = scratch.idx;
  let count = 0;
  let i = start;
  while (i < end) {
    const li = lm[i];
    const c = Math.floor((li - colL0) * colK);
    let j = i + 1;
    if (j < end && Math.floor((lm[j] - colL0) * colK) <= c) {
      // Gallop, then bisect, to the first index of the next column.
      let lo = j;
      let step = 1;
      let hi = lo + step;
      while (hi < end && Math.floor((lm[hi] - colL0) * colK) <= c) {
        lo = hi;
        step *= 2;
        hi = lo + step;
      }
      if (hi > end) hi = end;
      while (hi - lo > 1) {
        const mid = (lo + hi) >>> 1;
        if (Math.floor((lm[mid] - colL0) * colK) <= c) lo = mid;
        else hi = mid;
      }
      j = hi;
    }
    const last = j - 1;
    if (j - i <= 4) {
      for (let k = i; k < j; k++) {
        if (map) {
          ox[count] = ax + bx * lm[k];
          oy[count] = ay + by * (v[k] + yOffset);
        } else oi[count] = k;
        count++;
      }
    } else {
      rangeMinMax(v, pyr, i, j, q);
      let a = q.min < q.max ? q.min : q.max;
      let b = q.min < q.max ? q.max : q.min;
      if (a === i) a = -1;
      if (b === last) b = -1;
      const keepA = a > i && a < last;
      const keepB = b > i && b < last && b !== a;
      if (map) {
        ox[count] = ax + bx * li;
        oy[count] = ay + by * (v[i] + yOffset);
        count++;
        if (keepA) {
          ox[count] = ax + bx * lm[a];
          oy[count] = ay + by * (v[a] + yOffset);
          count++;
        }
        if (keepB) {
          ox[count] = ax + bx * lm[b];
          oy[count] = ay + by * (v[b] + yOffset);
          count++;
        }
        ox[count] = ax + bx * lm[last];
        oy[count] = ay + by * (v[last] + yOffset);
        count++;
      } else {
        oi[count++] = i;
        if (keepA) oi[count++] = a;
        if (keepB) oi[count++] = b;
        oi[count++] = last;
      }
    }
    i = j;
  }
  return count;
}
