// One preparation of a curve's points for all that read them (the drawing, the hover readout, the overlap):
// the points a log axis can show, in mass order or file order, with their log10 values, cached per data array.
import { stableOrder } from "./stable-order";

/** The usable points of one curve, in drawing order, with their log10 values. */
export interface PreparedCurve {
  /** Number of usable points (mass and coupling positive and finite). */
  n: number;
  /**
   * Points left out: those a log axis cannot show (≤ 0, NaN, ±∞) and, when the two arrays differ in length,
   * the values of the longer one that have no partner.
   */
  skipped: number;
  /** Position of each usable point in the data arrays, in drawing order. */
  index: Uint32Array;
  /** log10 mass (eV), ascending when `sorted`. */
  lm: Float64Array;
  /** log10 g_aγγ (GeV⁻¹) before rescaling (a rescale only shifts the curve in log space). */
  lg: Float64Array;
  /** Ordered by mass (stable: equal masses keep file order) rather than kept in file order. */
  sorted: boolean;
}

interface CacheEntry {
  g: Float64Array;
  sorted?: PreparedCurve;
  file?: PreparedCurve;
}

// Keyed by the mass array: curve data is replaced as a whole, never mutated, so identity is a safe key.
const cache = new WeakMap<Float64Array, CacheEntry>();

function entryOf(massEv: Float64Array, gInvGeV: Float64Array): CacheEntry {
  let entry = cache.get(massEv);
  if (!entry || entry.g !== gInvGeV) {
    entry = { g: gInvGeV };
    cache.set(massEv, entry);
  }
  return entry;
}

/**
 * The prepared points of a curve, cached per data array: `sorted` orders by mass (stable, so equal masses keep
 * file order); otherwise file order is kept. Points that cannot go on a log axis (mass or coupling ≤ 0, NaN or
 * ±∞) are skipped (and counted).
 */
export function prepareCurve(massEv: Float64Array, gInvGeV: Float64Array, sorted: boolean): PreparedCurve {
  const entry = entryOf(massEv, gInvGeV);
  const key = sorted ? "sorted" : "file";
  const hit = entry[key];
  if (hit) return hit;
  const len = Math.min(massEv.length, gInvGeV.length);
  // One pass: the usable points, their logarithms and whether they already come in mass order.
  let idx = new Uint32Array(len);
  let lm = new Float64Array(len);
  let lg = new Float64Array(len);
  let n = 0;
  let ordered = true;
  let prev = 0;
  for (let i = 0; i < len; i++) {
    const m = massEv[i];
    const g = gInvGeV[i];
    if (m > 0 && g > 0 && m < Infinity && g < Infinity) {
      if (m < prev) ordered = false;
      prev = m;
      idx[n] = i;
      lm[n] = Math.log10(m);
      lg[n] = Math.log10(g);
      n++;
    }
  }
  if (sorted && !ordered) {
    // Reorder the computed points rather than take logarithms again: log10 of the same double is the same.
    const keys = new Float64Array(n);
    for (let k = 0; k < n; k++) keys[k] = massEv[idx[k]];
    const perm = stableOrder(keys);
    const si = new Uint32Array(n);
    const sm = new Float64Array(n);
    const sg = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const q = perm[k];
      si[k] = idx[q];
      sm[k] = lm[q];
      sg[k] = lg[q];
    }
    idx = si;
    lm = sm;
    lg = sg;
  } else if (n < len) {
    idx = idx.slice(0, n);
    lm = lm.slice(0, n);
    lg = lg.slice(0, n);
  }
  const skipped = Math.max(massEv.length, gInvGeV.length) - n;
  const prep: PreparedCurve = { n, skipped, index: idx, lm, lg, sorted };
  entry[key] = prep;
  return prep;
}

/**
 * Puts a curve prepared elsewhere (in a worker, see plot/prepare-transfer.ts) into the cache, so prepareCurve
 * returns it for these arrays. The caller vouches that it is what prepareCurve would build; an entry already
 * cached for the same arrays and order is kept.
 */
export function installPrepared(massEv: Float64Array, gInvGeV: Float64Array, prep: PreparedCurve): void {
  const entry = entryOf(massEv, gInvGeV);
  const key = prep.sorted ? "sorted" : "file";
  if (!entry[key]) entry[key] = prep;
}

/** The prepared curve cached for these arrays and order, if any (nothing is computed). */
export function cachedPrepared(
  massEv: Float64Array,
  gInvGeV: Float64Array,
  sorted: boolean,
): PreparedCurve | undefined {
  const entry = cache.get(massEv);
  return entry && entry.g === gInvGeV ? entry[sorted ? "sorted" : "file"] : undefined;
}
