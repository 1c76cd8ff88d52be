// The per-curve preparation the thinning draws from: log10 arrays cached per data array, and per y view the
// derived arrays (the pyramid of sorted curves; importance, order and culling boxes of unsorted ones).
import { buildPyramid, type Pyramid } from "./pyramid";
import { dpImportance } from "./douglas-peucker";

/** Points of one curve in log10, in drawing order, with the derived arrays of each y view. */
export interface PreparedCurve {
  /** Number of drawable points (positive and finite mass and coupling). */
  n: number;
  /** Points dropped because they cannot go on a log axis (≤ 0, NaN, ±∞). */
  skipped: number;
  /** log10 mass (eV), ascending when `sorted`. */
  lm: Float64Array;
  /** log10 g_aγγ (GeV⁻¹) before rescaling (a rescale only shifts the curve in log space). */
  lg: Float64Array;
  sorted: boolean;
  /** Per y-view slope (0: g_aγγ; −1: |E/N − c_γ| ∝ g/m): the view's log values and their helpers. */
  views: Map<number, ViewArrays>;
}

/** The arrays of one y view of a prepared curve (exported for prepare-transfer.ts, which moves them between threads). */
export interface ViewArrays {
  /** log10 of the y-view value without its constant offset: lg + slope·lm. */
  v: Float64Array;
  pyramid: Pyramid | null;
  /** Douglas–Peucker importance in (lm, v) space (unsorted curves and regions). */
  importance: Float64Array | null;
  /** Per chunk of {@link BOX_CHUNK} points: lm min, lm max, v min, v max (unsorted curves), for culling. */
  boxes: Float64Array | null;
  /** Selections of unsorted curves per tolerance level (see {@link curvePixels}), most recent last. */
  levels: Map<string, LevelSelection>;
  /** Unsorted curves: indices by decreasing importance, and the importances in that order. */
  order: Int32Array | null;
  impDesc: Float64Array | null;
  /** The last Douglas–Peucker selection drawn (its size and its indices ascending), updated frame to frame. */
  dpSelection?: { k: number; idx: Int32Array };
}

/** Run-thinned indices of one tolerance level, computed lazily per chunk of RUN_CHUNK points (runs.ts). */
export interface LevelSelection {
  perChunk: (Int32Array | undefined)[];
}

/** Points per bounding box of an unsorted curve: off-screen boxes are skipped without mapping their points. */
export const BOX_CHUNK = 64;

function chunkBoxes(lm: Float64Array, v: Float64Array): Float64Array {
  const nc = Math.ceil(lm.length / BOX_CHUNK);
  const out = new Float64Array(nc * 4);
  for (let c = 0; c < nc; c++) {
    const s = c * BOX_CHUNK;
    const e = Math.min(lm.length, s + BOX_CHUNK);
    let a = Infinity;
    let b = -Infinity;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = s; i < e; i++) {
      if (lm[i] < a) a = lm[i];
      if (lm[i] > b) b = lm[i];
      if (v[i] < lo) lo = v[i];
      if (v[i] > hi) hi = v[i];
    }
    out[4 * c] = a;
    out[4 * c + 1] = b;
    out[4 * c + 2] = lo;
    out[4 * c + 3] = hi;
  }
  return out;
}

interface CacheEntry {
  g: Float64Array;
  sorted?: PreparedCurve;
  file?: PreparedCurve;
}

// Keyed by the mass array: curve data is replaced as a whole, never mutated, so identity is a safe key.
const cache = new WeakMap<Float64Array, CacheEntry>();

/**
 * The log10 arrays of a curve, cached per data array: `sorted` orders by mass (stable, so equal masses keep
 * file order); otherwise file order is kept. Non-positive and non-finite points are skipped (and counted).
 */
export function prepareCurve(massEv: Float64Array, gInvGeV: Float64Array, sorted: boolean): PreparedCurve {
  let entry = cache.get(massEv);
  if (!entry || entry.g !== gInvGeV) {
    entry = { g: gInvGeV };
    cache.set(massEv, entry);
  }
  const key = sorted ? "sorted" : "file";
  const hit = entry[key];
  if (hit) return hit;
  const len = Math.min(massEv.length, gInvGeV.length);
  let idx = new Uint32Array(len);
  let n = 0;
  for (let i = 0; i < len; i++) {
    const m = massEv[i];
    const g = gInvGeV[i];
    if (m > 0 && g > 0 && m < Infinity && g < Infinity) idx[n++] = i;
  }
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
  const prep: PreparedCurve = { n, skipped: len - n, lm, lg, sorted, views: new Map() };
  entry[key] = prep;
  return prep;
}

/**
 * Puts a curve prepared elsewhere (in a worker, see prepare-transfer.ts) into the cache, so prepareCurve and
 * the scene builder use it for these arrays. The caller vouches that it is what prepareCurve would build; an
 * entry already cached for the same arrays and order is kept.
 */
export function installPrepared(massEv: Float64Array, gInvGeV: Float64Array, prep: PreparedCurve): void {
  let entry = cache.get(massEv);
  if (!entry || entry.g !== gInvGeV) {
    entry = { g: gInvGeV };
    cache.set(massEv, entry);
  }
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

/** The view arrays of a prepared curve for a y-view slope (built once, then cached on the curve). */
export function viewArrays(prep: PreparedCurve, slope: number, closed: boolean): ViewArrays {
  let va = prep.views.get(slope);
  if (!va) {
    let v = prep.lg;
    if (slope !== 0) {
      v = new Float64Array(prep.n);
      for (let i = 0; i < prep.n; i++) v[i] = prep.lg[i] + slope * prep.lm[i];
    }
    va = { v, pyramid: null, importance: null, boxes: null, levels: new Map(), order: null, impDesc: null };
    prep.views.set(slope, va);
  }
  if (prep.sorted && !va.pyramid) va.pyramid = buildPyramid(va.v);
  if (!prep.sorted && !va.importance) {
    const imp = dpImportance(prep.lm, va.v, closed);
    va.importance = imp;
    va.boxes = chunkBoxes(prep.lm, va.v);
    const order = new Int32Array(prep.n);
    for (let i = 0; i < prep.n; i++) order[i] = i;
    order.sort((a, b) => (imp[a] > imp[b] ? -1 : imp[a] < imp[b] ? 1 : a - b));
    const impDesc = new Float64Array(prep.n);
    for (let k = 0; k < prep.n; k++) impDesc[k] = imp[order[k]];
    va.order = order;
    va.impDesc = impDesc;
  }
  return va;
}
