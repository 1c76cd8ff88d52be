// The order that sorts an array of numbers ascending, equal values keeping their positions, without a comparator
// call per step: a typed array's native sort of the values, then each value's place found by binary search
// (~1.5× faster than a typed array's sort with a comparator on a 100,000-point curve, ~2.5× faster than a merge
// sort written here, whose loops run cold in a fresh worker).

/**
 * Positions 0…n−1 of `keys` ordered by key, ties by position (the order `(a, b) => keys[a] − keys[b] || a − b`
 * gives). The keys must not be NaN, nor include both −0 and +0.
 */
export function stableOrder(keys: Float64Array): Uint32Array {
  const n = keys.length;
  const sorted = Float64Array.from(keys).sort();
  // Points already placed at each run of equal values, counted at the run's first position.
  const used = new Uint32Array(n);
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) {
    const x = keys[i];
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (sorted[mid] < x) lo = mid + 1;
      else hi = mid;
    }
    order[lo + used[lo]++] = i;
  }
  return order;
}
