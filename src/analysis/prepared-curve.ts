// One preparation of a curve's points for all that read them (the drawing, the hover readout, the overlap):
// the points a log axis can show, in mass order or file order, with their log10 values, cached per data array.

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

/** Whether a point can go on log axes: mass and coupling positive and finite. */
function usablePoint(massEv: number, gInvGeV: number): boolean {
  return massEv > 0 && gInvGeV > 0 && massEv < Infinity && gInvGeV < Infinity;
}

/**
 * The prepared points of a curve, cached per data array: `sorted` orders by mass (stable, so equal masses keep
 * file order); otherwise file order is kept. Points that cannot go on a log axis are skipped (and counted).
 */
export function prepareCurve(massEv: Float64Array, gInvGeV: Float64Array, sorted: boolean): PreparedCurve {
  const entry = entryOf(massEv, gInvGeV);
  const key = sorted ? "sorted" : "file";
  const hit = entry[key];
  if (hit) return hit;
  const len = Math.min(massEv.length, gInvGeV.length);
  let idx = new Uint32Array(len);
  let n = 0;
  for (let i = 0; i < len; i++) if (usablePoint(massEv[i], gInvGeV[i])) idx[n++] = i;
  idx = idx.subarray(0, n);
  if (sorted) {
    let ordered = true;
    for (let k = 1; k < n && ordered; k++) if (massEv[idx[k]] < massEv[idx[k - 1]]) ordered = false;
    if (!ordered) idx = Uint32Array.from(idx).sort((a, b) => massEv[a] - massEv[b] || a - b);
  }
  const lm = new Float64Array(n);
  const lg = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    lm[k] = Math.log10(massEv[idx[k]]);
    lg[k] = Math.log10(gInvGeV[idx[k]]);
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
