// Interval lists as flat arrays [lo0, hi0, lo1, hi1, …], ascending and disjoint, in ln(mass): union, intersection,
// difference and gap bridging, each one linear merge.

export type Flat = number[];

/** Appends [lo, hi] to an ascending list, merging with the last interval when they touch or overlap. */
export function pushMerged(out: Flat, lo: number, hi: number): void {
  if (!(hi > lo)) return; // empty, or a single touching point: not reported
  const n = out.length;
  if (n > 0 && lo <= out[n - 1]) {
    if (hi > out[n - 1]) out[n - 1] = hi;
    return;
  }
  out.push(lo, hi);
}

export function unionFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let i = 0;
  let j = 0;
  while (i < a.length || j < b.length) {
    if (j >= b.length || (i < a.length && a[i] <= b[j])) {
      pushMerged(out, a[i], a[i + 1]);
      i += 2;
    } else {
      pushMerged(out, b[j], b[j + 1]);
      j += 2;
    }
  }
  return out;
}

export function intersectFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const lo = Math.max(a[i], b[j]);
    const hi = Math.min(a[i + 1], b[j + 1]);
    pushMerged(out, lo, hi);
    if (a[i + 1] < b[j + 1]) i += 2;
    else j += 2;
  }
  return out;
}

export function subtractFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let j = 0;
  for (let i = 0; i < a.length; i += 2) {
    let lo = a[i];
    const hi = a[i + 1];
    while (j < b.length && b[j + 1] <= lo) j += 2;
    let k = j;
    while (k < b.length && b[k] < hi) {
      pushMerged(out, lo, b[k]);
      lo = Math.max(lo, b[k + 1]);
      k += 2;
    }
    pushMerged(out, lo, hi);
  }
  return out;
}

/** Union of intervals given in any order. */
export function unionUnsorted(pairs: Flat): Flat {
  const count = pairs.length / 2;
  const order = Array.from({ length: count }, (_, k) => k);
  order.sort((p, q) => pairs[2 * p] - pairs[2 * q]);
  const out: Flat = [];
  for (const k of order) pushMerged(out, pairs[2 * k], pairs[2 * k + 1]);
  return out;
}

/**
 * Bridges every gap for which `bridge(lo, hi)` says yes; returns the merged list and the gaps bridged.
 */
export function bridgeGaps(list: Flat, bridge: (lo: number, hi: number) => boolean): { merged: Flat; gaps: Flat } {
  const merged: Flat = [];
  const gaps: Flat = [];
  for (let i = 0; i < list.length; i += 2) {
    const n = merged.length;
    if (n > 0 && bridge(merged[n - 1], list[i])) {
      gaps.push(merged[n - 1], list[i]);
      merged[n - 1] = Math.max(merged[n - 1], list[i + 1]);
    } else {
      merged.push(list[i], list[i + 1]);
    }
  }
  return { merged, gaps };
}
