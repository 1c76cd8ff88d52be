// Exclusion and projection curves (sorted by mass) against the model levels: one pass over the segments.
import { bisectLeft, bisectRight } from "d3-array";
import { pushMerged, type Flat } from "./intervals";
import { finish, type Raw } from "./assemble";
import type { Levels } from "./levels";
import type { SortedPrep } from "./prepare";

/** Appends the part of the segment (x0, a)–(x1, b) where v ≤ L. */
function segmentAtOrBelow(out: Flat, x0: number, x1: number, a: number, b: number, L: number): void {
  if (a <= L && b <= L) {
    pushMerged(out, x0, x1);
    return;
  }
  if (a > L && b > L) return;
  let xc = x0 + ((L - a) / (b - a)) * (x1 - x0);
  xc = Math.min(x1, Math.max(x0, xc));
  if (a <= L) pushMerged(out, x0, xc);
  else pushMerged(out, xc, x1);
}

/** Sheared curve value at x by linear interpolation (x inside the range; on a step, the lower side). */
function sortedValueAt(p: SortedPrep, x: number): number {
  let i = bisectRight(p.x, x) - 1;
  if (i < 0) i = 0;
  if (i >= p.n - 1) return p.v[p.n - 1];
  const x0 = p.x[i];
  const x1 = p.x[i + 1];
  if (!(x1 > x0)) return Math.min(p.v[i], p.v[i + 1]);
  return p.v[i] + ((x - x0) / (x1 - x0)) * (p.v[i + 1] - p.v[i]);
}

/** Width in ln m of the curve segment holding the gap's start (x_j ≤ lo < x_j+1) and end (x_k < hi ≤ x_k+1). */
function localSpacing(p: SortedPrep, lo: number, hi: number): number {
  const j = bisectRight(p.x, lo) - 1;
  const k = bisectLeft(p.x, hi) - 1;
  const w = (i: number): number => (i >= 0 && i + 1 < p.n ? p.x[i + 1] - p.x[i] : Infinity);
  return Math.min(w(j), w(k));
}

export function sortedOverlap(p: SortedPrep, L: Levels, merge: boolean): Raw {
  const whole: Flat = [];
  const touch: Flat = [];
  for (let i = 0; i + 1 < p.n; i++) {
    const x0 = p.x[i];
    const x1 = p.x[i + 1];
    if (!(x1 > x0)) continue; // a vertical step: its two sides are handled by the neighbouring segments
    const a = p.v[i];
    const b = p.v[i + 1];
    segmentAtOrBelow(whole, x0, x1, a, b, L.lo);
    segmentAtOrBelow(touch, x0, x1, a, b, L.hi);
  }
  const bridge = (lo: number, hi: number): boolean => hi - lo < localSpacing(p, lo, hi);
  return finish(whole, touch, merge, bridge);
}

// The E/N detail is taken over the interval's interior: a vertical step or edge exactly at an end belongs to
// the neighbouring interval (it is what ends this one), so the ends are moved in by a negligible amount.
export const INSET = 1e-12;

/** Lowest and highest sheared curve value over the interior of [lo, hi]: at its ends or at a sample inside. */
export function sortedRangeOver(p: SortedPrep, lo: number, hi: number): [number, number] {
  const x0 = lo + INSET * (hi - lo);
  const x1 = hi - INSET * (hi - lo);
  const a = sortedValueAt(p, x0);
  const b = sortedValueAt(p, x1);
  let min = Math.min(a, b);
  let max = Math.max(a, b);
  for (let j = bisectLeft(p.x, x0); j < p.n && p.x[j] <= x1; j++) {
    min = Math.min(min, p.v[j]);
    max = Math.max(max, p.v[j]);
  }
  return [min, max];
}
