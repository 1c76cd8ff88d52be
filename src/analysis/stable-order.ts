// The order that sorts an array of numbers ascending, equal values keeping their positions, without a comparator
// call per step: a typed array's native sort of the values with each position packed into their lowest bits
// (positive keys), else of the values alone with each value's place found by binary search. Both are faster in
// a fresh worker than a comparator sort or a merge sort written here, whose loops run cold (bench/NOTES.md).

/** Groups of keys equal above the packed bits up to this size are put in order by insertion. */
const SMALL_GROUP = 32;

/** Whether a Uint32Array over a Float64Array holds each double's low word first (as on x86 and ARM). */
const LITTLE_ENDIAN = new Uint8Array(Uint32Array.of(1).buffer)[0] === 1;

/**
 * Positions 0…n−1 of `keys` ordered by key, ties by position (the order `(a, b) => keys[a] − keys[b] || a − b`
 * gives). The keys must not be NaN, nor include both −0 and +0.
 */
export function stableOrder(keys: Float64Array): Uint32Array {
  const n = keys.length;
  const bits = Math.max(1, Math.ceil(Math.log2(Math.max(n, 2))));
  return bits <= 32 && LITTLE_ENDIAN && allPositiveFinite(keys) ? packedOrder(keys, bits) : searchOrder(keys);
}

function allPositiveFinite(keys: Float64Array): boolean {
  for (let i = 0; i < keys.length; i++) if (!(keys[i] > 0 && keys[i] < Infinity)) return false;
  return true;
}

/**
 * Positive finite doubles order as their bit patterns do: each key's lowest `bits` mantissa bits are replaced
 * by its position, so one native sort orders by key and, among keys equal above those bits, by position; such
 * groups (near-equal keys, rare in data) are then put in key order, ties kept by position.
 */
function packedOrder(keys: Float64Array, bits: number): Uint32Array {
  const n = keys.length;
  const keyWords = new Uint32Array(keys.buffer, keys.byteOffset, 2 * n);
  const packed = new Float64Array(n);
  const words = new Uint32Array(packed.buffer);
  const mask = bits >= 32 ? 0xffffffff : 2 ** bits - 1;
  const high = ~mask;
  // Two loops in all (this one and the next): in a fresh worker they run cold, so fewer is faster.
  for (let i = 0; i < n; i++) {
    words[2 * i] = (keyWords[2 * i] & high) | i;
    words[2 * i + 1] = keyWords[2 * i + 1];
  }
  packed.sort();
  const order = new Uint32Array(n);
  let from = 0;
  for (let j = 0; j < n; j++) {
    order[j] = words[2 * j] & mask;
    // A group ends where the bits above the positions change.
    if (j > from && (words[2 * j + 1] !== words[2 * from + 1] || (words[2 * j] & high) !== (words[2 * from] & high))) {
      if (j - from > 1) orderGroup(keys, order, from, j);
      from = j;
    }
  }
  if (n - from > 1) orderGroup(keys, order, from, n);
  return order;
}

/** Puts order[from, to) (positions ascending) in key order, ties by position. */
function orderGroup(keys: Float64Array, order: Uint32Array, from: number, to: number): void {
  if (to - from > SMALL_GROUP) {
    let ordered = true;
    for (let k = from + 1; k < to && ordered; k++) ordered = keys[order[k - 1]] <= keys[order[k]];
    if (!ordered) order.subarray(from, to).sort((a, b) => keys[a] - keys[b] || a - b);
    return;
  }
  // Insertion: a strict comparison keeps equal keys in position order.
  for (let k = from + 1; k < to; k++) {
    const p = order[k];
    const v = keys[p];
    let q = k - 1;
    while (q >= from && keys[order[q]] > v) {
      order[q + 1] = order[q];
      q--;
    }
    order[q + 1] = p;
  }
}

/** Any keys: a native sort of the values, then each value's place by binary search. */
function searchOrder(keys: Float64Array): Uint32Array {
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
