// Block argmin/argmax pyramid of a sorted curve's y values, and the range query column thinning asks it:
// whole blocks are compared through their stored extremes, so a wide pixel column costs O(log n).

/** Block argmin/argmax of v at levels of 16, 256, 4096, … points. */
export interface Pyramid {
  levels: { min: Int32Array; max: Int32Array }[];
  /** The values at those indices, per level, for the v they were read from (derived on first use). */
  values?: { v: Float64Array; min: Float64Array[]; max: Float64Array[] };
}

export const BLOCK_SHIFT = 4;
const BLOCK = 1 << BLOCK_SHIFT;
const BLOCK_MASK = BLOCK - 1;

/** Block argmin/argmax pyramid of v (O(n) once per curve and view). */
export function buildPyramid(v: Float64Array): Pyramid {
  const levels: Pyramid["levels"] = [];
  const n = v.length;
  let nb = (n + BLOCK_MASK) >> BLOCK_SHIFT;
  if (nb < 2) return { levels };
  let min = new Int32Array(nb);
  let max = new Int32Array(nb);
  for (let b = 0; b < nb; b++) {
    const s = b << BLOCK_SHIFT;
    const e = Math.min(n, s + BLOCK);
    let mn = s;
    let mx = s;
    for (let i = s + 1; i < e; i++) {
      const x = v[i];
      if (x < v[mn]) mn = i;
      if (x > v[mx]) mx = i;
    }
    min[b] = mn;
    max[b] = mx;
  }
  levels.push({ min, max });
  while (nb > BLOCK) {
    const pb = nb;
    nb = (pb + BLOCK_MASK) >> BLOCK_SHIFT;
    const nmin = new Int32Array(nb);
    const nmax = new Int32Array(nb);
    for (let b = 0; b < nb; b++) {
      const s = b << BLOCK_SHIFT;
      const e = Math.min(pb, s + BLOCK);
      let mn = min[s];
      let mx = max[s];
      for (let k = s + 1; k < e; k++) {
        if (v[min[k]] < v[mn]) mn = min[k];
        if (v[max[k]] > v[mx]) mx = max[k];
      }
      nmin[b] = mn;
      nmax[b] = mx;
    }
    min = nmin;
    max = nmax;
    levels.push({ min, max });
  }
  return { levels };
}

/** Where {@link rangeMinMax} puts its answer (one object reused by the caller, so the hot loop allocates nothing). */
export interface MinMaxIndex {
  min: number;
  max: number;
}

/** Columns shorter than this are scanned point by point (the pyramid's bookkeeping costs more there). */
const PYRAMID_MIN_SPAN = 64;

/** The v values of a pyramid level's argmin/argmax, built on first use (they are not transferred between threads). */
export function levelValues(pyr: Pyramid, v: Float64Array): void {
  if (pyr.values && pyr.values.v === v) return;
  pyr.values = { v, min: pyr.levels.map((l) => gather(v, l.min)), max: pyr.levels.map((l) => gather(v, l.max)) };
}

/** v at each index (a plain loop: Float64Array.from with a mapping function calls it per element, ~5× slower). */
function gather(v: Float64Array, idx: Int32Array): Float64Array {
  const out = new Float64Array(idx.length);
  for (let k = 0; k < idx.length; k++) out[k] = v[idx[k]];
  return out;
}

/**
 * Argmin and argmax of v over [lo, hi) (hi > lo) into `out`: the first index of the lowest and of the
 * highest value, as a scan would give, whatever order the pyramid's blocks are visited in (ties go to the
 * lower index). Whole blocks are compared through their stored values, so a column costs O(log) plus the
 * partial blocks at its two ends.
 */
// A hot loop, long on purpose: the scans are written out so V8 keeps them tight.
export function rangeMinMax(v: Float64Array, pyr: Pyramid | null, lo: number, hi: number, out: MinMaxIndex): void {
  let mn = lo;
  let mx = lo;
  let vmn = v[lo];
  let vmx = vmn;
  let a = lo + 1;
  let b = hi;
  if (!pyr || pyr.levels.length === 0 || hi - lo < PYRAMID_MIN_SPAN) {
    for (let i = a; i < b; i++) {
      const x = v[i];
      if (x < vmn) {
        vmn = x;
        mn = i;
      } else if (x > vmx) {
        vmx = x;
        mx = i;
      }
    }
    out.min = mn;
    out.max = mx;
    return;
  }
  while (a < b && a & BLOCK_MASK) {
    const x = v[a];
    if (x < vmn) {
      vmn = x;
      mn = a;
    } else if (x > vmx) {
      vmx = x;
      mx = a;
    }
    a++;
  }
  const tail = b;
  b = Math.max(a, b & ~BLOCK_MASK);
  // The tail after the whole blocks comes last in index order: strict comparisons keep the earlier index.
  let la = a >> BLOCK_SHIFT;
  let lb = b >> BLOCK_SHIFT;
  const levels = pyr.levels;
  const values = pyr.values as NonNullable<Pyramid["values"]>;
  for (let L = 0; la < lb; L++) {
    const { min, max } = levels[L];
    const vmin = values.min[L];
    const vmax = values.max[L];
    const top = L === levels.length - 1;
    const ea = top ? lb : Math.min(lb, (la + BLOCK_MASK) & ~BLOCK_MASK);
    const sb = top ? lb : Math.max(ea, lb & ~BLOCK_MASK);
    for (let k = la; k < ea; k++) {
      const x = vmin[k];
      if (x < vmn || (x === vmn && min[k] < mn)) {
        vmn = x;
        mn = min[k];
      }
      const y = vmax[k];
      if (y > vmx || (y === vmx && max[k] < mx)) {
        vmx = y;
        mx = max[k];
      }
    }
    for (let k = sb; k < lb; k++) {
      const x = vmin[k];
      if (x < vmn || (x === vmn && min[k] < mn)) {
        vmn = x;
        mn = min[k];
      }
      const y = vmax[k];
      if (y > vmx || (y === vmx && max[k] < mx)) {
        vmx = y;
        mx = max[k];
      }
    }
    if (top) break;
    la = ea >> BLOCK_SHIFT;
    lb = sb >> BLOCK_SHIFT;
    if (ea === sb) break;
  }
  for (let i = b; i < tail; i++) {
    const x = v[i];
    if (x < vmn) {
      vmn = x;
      mn = i;
    } else if (x > vmx) {
      vmx = x;
      mx = i;
    }
  }
  out.min = mn;
  out.max = mx;
}
