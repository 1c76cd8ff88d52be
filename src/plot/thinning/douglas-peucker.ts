// Douglas–Peucker importance of every point of an unsorted curve or region, and the selection of the k
// most important points for a frame, updated from the previous frame's selection.

import type { ViewArrays } from "./prepared";
import { pushIdx, scratch } from "./scratch";
/** Points per independent Douglas–Peucker chunk: bounds the worst case at O(n · CHUNK) on adversarial data. */
const DP_CHUNK = 2048;

/**
 * Douglas–Peucker importance of every point in (x, y) space: the largest tolerance at which the point is
 * still kept (parent-clamped, so {i : importance[i] > ε} is exactly the DP simplification at ε). Chunk
 * ends and the two ends of the curve are always kept (Infinity).
 */
export function dpImportance(x: Float64Array, y: Float64Array): Float64Array {
  const n = x.length;
  const imp = new Float64Array(n);
  if (n === 0) return imp;
  const stackA = new Int32Array(2 * Math.min(n, DP_CHUNK) + 8);
  const stackB = new Int32Array(stackA.length);
  const stackP = new Float64Array(stackA.length);
  for (let c0 = 0; c0 < n - 1; c0 += DP_CHUNK) {
    const c1 = Math.min(n - 1, c0 + DP_CHUNK);
    imp[c0] = Infinity;
    imp[c1] = Infinity;
    let sp = 0;
    stackA[sp] = c0;
    stackB[sp] = c1;
    stackP[sp] = Infinity;
    sp++;
    while (sp > 0) {
      sp--;
      const a = stackA[sp];
      const b = stackB[sp];
      const parent = stackP[sp];
      if (b - a < 2) continue;
      const ax = x[a];
      const ay = y[a];
      const dx = x[b] - ax;
      const dy = y[b] - ay;
      const len2 = dx * dx + dy * dy;
      let best = -1;
      let bestD2 = -1;
      for (let i = a + 1; i < b; i++) {
        const px = x[i] - ax;
        const py = y[i] - ay;
        let d2: number;
        if (len2 === 0) d2 = px * px + py * py;
        else {
          const t = (px * dx + py * dy) / len2;
          if (t <= 0) d2 = px * px + py * py;
          else if (t >= 1) {
            const qx = px - dx;
            const qy = py - dy;
            d2 = qx * qx + qy * qy;
          } else {
            const cr = px * dy - py * dx;
            d2 = (cr * cr) / len2;
          }
        }
        if (d2 > bestD2) {
          bestD2 = d2;
          best = i;
        }
      }
      const d = Math.sqrt(bestD2);
      const own = d < parent ? d : parent;
      imp[best] = own;
      stackA[sp] = a;
      stackB[sp] = best;
      stackP[sp] = own;
      sp++;
      stackA[sp] = best;
      stackB[sp] = b;
      stackP[sp] = own;
      sp++;
    }
  }
  if (n === 1) imp[0] = Infinity;
  return imp;
}

/** Indices whose importance exceeds a tolerance (in the units the importance was computed in). */
export function simplifyIndices(importance: Float64Array, tolerance: number): Int32Array {
  let count = 0;
  for (let i = 0; i < importance.length; i++) if (importance[i] > tolerance) count = pushIdx(count, i);
  return scratch.idx.slice(0, count);
}

/**
 * The k most important points of an unsorted curve (the Douglas–Peucker simplification at the tolerance that
 * keeps k), in index order. Derived from the last frame's selection: a zoom step changes k by a fraction, so
 * dropping the least important or merging in the next ones in importance order costs O(k) instead of a sort
 * of k indices (~0.2 ms per region and frame at k ≈ 6,000).
 */
export function dpSelection(va: ViewArrays, k: number): Int32Array {
  const order = va.order as Int32Array;
  const imp = va.importance as Float64Array;
  const last = va.dpSelection;
  let idx: Int32Array;
  if (!last || Math.abs(k - last.k) > last.k) {
    idx = order.slice(0, k).sort();
  } else if (k === last.k) {
    return last.idx;
  } else if (k < last.k) {
    // The k most important are those above the importance of the (k+1)-th in the order (ties: by index).
    idx = new Int32Array(k);
    let w = 0;
    for (let q = 0; q < last.idx.length; q++) if (rankBefore(imp, last.idx[q], order, k)) idx[w++] = last.idx[q];
  } else {
    const added = order.slice(last.k, k).sort();
    idx = new Int32Array(k);
    let a = 0;
    let b = 0;
    let w = 0;
    const old = last.idx;
    while (a < old.length && b < added.length) idx[w++] = old[a] < added[b] ? old[a++] : added[b++];
    while (a < old.length) idx[w++] = old[a++];
    while (b < added.length) idx[w++] = added[b++];
  }
  va.dpSelection = { k, idx };
  return idx;
}

/** Whether point i comes before position k of the importance order (decreasing importance, ties by index). */
function rankBefore(imp: Float64Array, i: number, order: Int32Array, k: number): boolean {
  const j = order[k];
  return imp[i] > imp[j] || (imp[i] === imp[j] && i < j);
}
