// Curves at pixel resolution: per-curve cached log10 arrays, column thinning (first/min/max/last per pixel
// column, with a block min/max pyramid so zoomed-out redraws skip most points), Douglas–Peucker importance
// for unsorted curves and regions, and clipping to a generous rectangle so no coordinate gets huge.
import { absolutePath, compactPath } from "./path-writer";

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

/** Run-thinned indices of one tolerance level, computed lazily per chunk of {@link RUN_CHUNK} points. */
interface LevelSelection {
  perChunk: (Int32Array | undefined)[];
}

/** Points per chunk of a run-thinning level: a chunk edge ends a run, which costs ≤ 2 extra points per chunk. */
export const RUN_CHUNK = 1024;

/** Selections cached per curve and view; older levels are dropped beyond this. */
const MAX_LEVELS = 24;

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

/** Block argmin/argmax of v at levels of 16, 256, 4096, … points. */
export interface Pyramid {
  levels: { min: Int32Array; max: Int32Array }[];
  /** The values at those indices, per level, for the v they were read from (derived on first use). */
  values?: { v: Float64Array; min: Float64Array[]; max: Float64Array[] };
}

const BLOCK_SHIFT = 4;
const BLOCK = 1 << BLOCK_SHIFT;
const BLOCK_MASK = BLOCK - 1;

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

// Results of rangeMinMax, kept in module variables so the hot loop allocates nothing.
let qMin = 0;
let qMax = 0;

/** Columns shorter than this are scanned point by point (the pyramid's bookkeeping costs more there). */
const PYRAMID_MIN_SPAN = 64;

/** The v values of a pyramid level's argmin/argmax, built on first use (they are not transferred between threads). */
function levelValues(pyr: Pyramid, v: Float64Array): void {
  if (pyr.values && pyr.values.v === v) return;
  pyr.values = {
    v,
    min: pyr.levels.map((l) => Float64Array.from(l.min, (i) => v[i])),
    max: pyr.levels.map((l) => Float64Array.from(l.max, (i) => v[i])),
  };
}

/**
 * Argmin and argmax of v over [lo, hi) (hi > lo) into qMin/qMax: the first index of the lowest and of the
 * highest value, as a scan would give, whatever order the pyramid's blocks are visited in (ties go to the
 * lower index). Whole blocks are compared through their stored values, so a column costs O(log) plus the
 * partial blocks at its two ends.
 */
function rangeMinMax(v: Float64Array, pyr: Pyramid | null, lo: number, hi: number): void {
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
    qMin = mn;
    qMax = mx;
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
  qMin = mn;
  qMax = mx;
}

/** First index i in [0, n) with a[i] ≥ x (n when none). */
export function lowerBound(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** First index i in [0, n) with a[i] > x (n when none). */
export function upperBound(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Pixel column of a log10 mass: floor((lm − colL0)·colK), where colK = px per decade × resolution. The
 * thinning and its tests both use this exact expression, so there is no disagreement at column edges.
 */
export function pixelColumn(lm: number, colL0: number, colK: number): number {
  return Math.floor((lm - colL0) * colK);
}

let idxScratch = new Int32Array(4096);

function pushIdx(count: number, i: number): number {
  if (count >= idxScratch.length) {
    const grown = new Int32Array(idxScratch.length * 2);
    grown.set(idxScratch);
    idxScratch = grown;
  }
  idxScratch[count] = i;
  return count + 1;
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
  // Count first: the call may replace idxScratch with a larger buffer.
  const count = thinColumnsInto(lm, v, pyr, p);
  return idxScratch.slice(0, count);
}

/** An affine map of (log10 m, v) to pixels: x = ax + bx·lm, y = ay + by·(v + yOffset). */
interface PixelMap {
  ax: number;
  bx: number;
  ay: number;
  by: number;
  yOffset: number;
}

/**
 * {@link thinColumns} leaving the indices in idxScratch, or with `map` the kept points' pixels in bufX/bufY
 * (written while their values are at hand: a second pass over the indices would fetch them from memory
 * again); returns their count.
 */
function thinColumnsInto(
  lm: Float64Array,
  v: Float64Array,
  pyr: Pyramid | null,
  p: ColumnParams,
  map: PixelMap | null = null,
): number {
  const n = lm.length;
  if (n === 0) return 0;
  const start = Math.max(0, lowerBound(lm, p.lmLo) - 1);
  const end = Math.min(n, upperBound(lm, p.lmHi) + 1);
  const { colL0, colK } = p;
  if (pyr && pyr.levels.length) levelValues(pyr, v);
  // At most 4 points per column, and the visible columns plus the two beyond the ends.
  const bound = Math.min(end - start, 4 * (Math.max(0, Math.ceil((p.lmHi - p.lmLo) * colK)) + 8));
  if (map) ensureBuffers(bound);
  else if (idxScratch.length < bound) idxScratch = new Int32Array(bound);
  const ax = map ? map.ax : 0;
  const bx = map ? map.bx : 0;
  const ay = map ? map.ay : 0;
  const by = map ? map.by : 0;
  const yOffset = map ? map.yOffset : 0;
  const ox = bufX;
  const oy = bufY;
  const oi = idxScratch;
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
      rangeMinMax(v, pyr, i, j);
      let a = qMin < qMax ? qMin : qMax;
      let b = qMin < qMax ? qMax : qMin;
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

/** Points per independent Douglas–Peucker chunk: bounds the worst case at O(n · CHUNK) on adversarial data. */
const DP_CHUNK = 2048;

/**
 * Douglas–Peucker importance of every point in (x, y) space: the largest tolerance at which the point is
 * still kept (parent-clamped, so {i : importance[i] > ε} is exactly the DP simplification at ε). Chunk
 * ends and the two ends of the curve are always kept (Infinity).
 */
export function dpImportance(x: Float64Array, y: Float64Array, _closed: boolean): Float64Array {
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
  return idxScratch.slice(0, count);
}

/** A polyline in scene px. */
export interface Polyline {
  xs: Float64Array;
  ys: Float64Array;
  n: number;
  closed: boolean;
}

/** Axis-aligned rectangle (scene px). */
export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * Clip a polyline or polygon to a rectangle (Sutherland–Hodgman, one half-plane at a time). Used with a
 * rectangle a few plot sizes larger than the plot: whatever it removes lies outside the visible area, the
 * edges it adds run along its far-away border, so strokes and fills inside the plot are unchanged while no
 * coordinate gets huge and long invisible stretches collapse to two points.
 */
export function clipToRect(poly: Polyline, r: Rect): Polyline {
  let cur = poly;
  for (let side = 0; side < 4 && cur.n > 0; side++) cur = clipHalf(cur, side, r, null);
  return cur;
}

function inside(x: number, y: number, side: number, r: Rect): boolean {
  return side === 0 ? x >= r.x0 : side === 1 ? x <= r.x1 : side === 2 ? y >= r.y0 : y <= r.y1;
}

// Two scratch polylines the frame path (curvePixels with `reuse`) clips between, so a redraw allocates nothing.
const clipScratch = [
  { xs: new Float64Array(4096), ys: new Float64Array(4096) },
  { xs: new Float64Array(4096), ys: new Float64Array(4096) },
];

/** One Sutherland–Hodgman pass; into `into` (grown as needed) or new arrays when it is null. */
function clipHalf(p: Polyline, side: number, r: Rect, into: { xs: Float64Array; ys: Float64Array } | null): Polyline {
  const { xs, ys, n, closed } = p;
  let all = true;
  for (let i = 0; i < n && all; i++) if (!inside(xs[i], ys[i], side, r)) all = false;
  if (all) return p;
  const size = n * 2 + 2;
  if (into && into.xs.length < size) {
    into.xs = new Float64Array(size * 2);
    into.ys = new Float64Array(size * 2);
  }
  const ox = into ? into.xs : new Float64Array(size);
  const oy = into ? into.ys : new Float64Array(size);
  let k = 0;
  const edge = side === 0 ? r.x0 : side === 1 ? r.x1 : side === 2 ? r.y0 : r.y1;
  const cross = (i: number, j: number) => {
    const x0 = xs[i];
    const y0 = ys[i];
    const x1 = xs[j];
    const y1 = ys[j];
    if (side < 2) {
      const t = (edge - x0) / (x1 - x0);
      ox[k] = edge;
      oy[k] = y0 + t * (y1 - y0);
    } else {
      const t = (edge - y0) / (y1 - y0);
      ox[k] = x0 + t * (x1 - x0);
      oy[k] = edge;
    }
    k++;
  };
  let prev = closed ? n - 1 : 0;
  let prevIn = inside(xs[prev], ys[prev], side, r);
  let first = 0;
  if (!closed) {
    if (prevIn) {
      ox[k] = xs[0];
      oy[k] = ys[0];
      k++;
    }
    first = 1;
  }
  for (let i = first; i < n; i++) {
    const curIn = inside(xs[i], ys[i], side, r);
    if (curIn !== prevIn) cross(prev, i);
    if (curIn) {
      ox[k] = xs[i];
      oy[k] = ys[i];
      k++;
    }
    prev = i;
    prevIn = curIn;
  }
  return { xs: ox, ys: oy, n: k, closed };
}

/** How to turn a prepared curve into pixels. */
export interface PixelParams {
  /** x = ax + bx·log10 m; y = ay + by·(v + yOffset), with v = log10 g + slope·log10 m. */
  ax: number;
  bx: number;
  ay: number;
  by: number;
  /** y-view slope (0 or −1) and the constant log10 offset (view factor and rescale). */
  slope: number;
  yOffset: number;
  /** Plot area (scene px). */
  plot: { x: number; y: number; w: number; h: number };
  /** Device pixels per scene pixel (on-screen scale × devicePixelRatio; 1 for export). @default 1 */
  resolution?: number;
  /** Thin at all (false draws every point, for comparisons). @default true */
  thin?: boolean;
  /**
   * Return views of the module's scratch buffers instead of new arrays: valid only until the next call
   * (the scene builder turns each into path data at once). @default false
   */
  reuse?: boolean;
}

/**
 * Off-plot culling keeps everything within this many scene px of the plot area, more than half of any
 * stroke width with round joins, so culling never changes a visible pixel.
 */
export const CULL_MARGIN_PX = 16;

let bufX = new Float64Array(4096);
let bufY = new Float64Array(4096);
let bufC = new Uint8Array(4096);

/** Room for n points in bufX/bufY/bufC; the first `keep` points survive a growth. */
function ensureBuffers(n: number, keep = 0): void {
  if (bufX.length >= n) return;
  let size = bufX.length;
  while (size < n) size *= 2;
  const ox = bufX;
  const oy = bufY;
  bufX = new Float64Array(size);
  bufY = new Float64Array(size);
  bufC = new Uint8Array(size);
  if (keep > 0) {
    bufX.set(ox.subarray(0, keep));
    bufY.set(oy.subarray(0, keep));
  }
}

/**
 * Drops, in place, every interior point that lies beyond the same edge of the cull rectangle as the last
 * kept point and the next point. The removed loop lies in that outer half-plane, so fills (any winding rule)
 * and strokes inside the rectangle are unchanged — exact culling, not an approximation.
 * @returns the new count.
 */
function cullOutside(n: number, r: Rect): number {
  if (n <= 2) return n;
  for (let k = 0; k < n; k++) {
    const x = bufX[k];
    const y = bufY[k];
    bufC[k] = (x < r.x0 ? 1 : x > r.x1 ? 2 : 0) | (y < r.y0 ? 4 : y > r.y1 ? 8 : 0);
  }
  let w = 1;
  let last = bufC[0];
  for (let k = 1; k < n - 1; k++) {
    const c = bufC[k];
    if (last & c & bufC[k + 1]) continue;
    bufX[w] = bufX[k];
    bufY[w] = bufY[k];
    w++;
    last = c;
  }
  bufX[w] = bufX[n - 1];
  bufY[w] = bufY[n - 1];
  return w + 1;
}

// Working space of thinRunsLog (its result is a copy): levels are thinned a chunk at a time, on every zoom.
let runScratch = new Int32Array(RUN_CHUNK);

/**
 * Run thinning for curves that are not sorted by mass: consecutive points whose bounding box is at most
 * `tx` wide (then the run keeps its first, lowest, highest and last point, in order) or at most `ty` tall
 * (then first, leftmost, rightmost, last). Every removed point lies in its run's box and the kept polyline
 * crosses that box from one extreme to the other, so old and new are within tx (resp. ty) of each other
 * (Hausdorff). Works on log coordinates (tx, ty in decades: through the affine maps this is run thinning in
 * px with τ = tx·bx = ty·|by|) or directly on px.
 * @returns the kept indices, ascending.
 */
export function thinRunsLog(lm: Float64Array, v: Float64Array, tx: number, ty: number): Int32Array {
  const n = lm.length;
  if (runScratch.length < n) runScratch = new Int32Array(n);
  const out = runScratch;
  let w = 0;
  let i = 0;
  while (i < n) {
    let xmin = lm[i];
    let xmax = xmin;
    let ymin = v[i];
    let ymax = ymin;
    let ixmin = i;
    let ixmax = i;
    let iymin = i;
    let iymax = i;
    let j = i + 1;
    for (; j < n; j++) {
      const x = lm[j];
      const y = v[j];
      const nxmin = x < xmin ? x : xmin;
      const nxmax = x > xmax ? x : xmax;
      const nymin = y < ymin ? y : ymin;
      const nymax = y > ymax ? y : ymax;
      if (nxmax - nxmin > tx && nymax - nymin > ty) break;
      if (x < xmin) ixmin = j;
      else if (x > xmax) ixmax = j;
      if (y < ymin) iymin = j;
      else if (y > ymax) iymax = j;
      xmin = nxmin;
      xmax = nxmax;
      ymin = nymin;
      ymax = nymax;
    }
    const last = j - 1;
    if (last - i < 4) {
      for (let k = i; k <= last; k++) out[w++] = k;
    } else {
      const narrow = xmax - xmin <= tx;
      const a = narrow ? Math.min(iymin, iymax) : Math.min(ixmin, ixmax);
      const b = narrow ? Math.max(iymin, iymax) : Math.max(ixmin, ixmax);
      out[w++] = i;
      if (a !== i && a !== last) out[w++] = a;
      if (b !== i && b !== last && b !== a) out[w++] = b;
      out[w++] = last;
    }
    i = j;
  }
  return out.slice(0, w);
}

function levelOf(va: ViewArrays, key: string): LevelSelection {
  const hit = va.levels.get(key);
  if (hit) {
    va.levels.delete(key);
    va.levels.set(key, hit);
    return hit;
  }
  const sel: LevelSelection = { perChunk: [] };
  va.levels.set(key, sel);
  if (va.levels.size > MAX_LEVELS) va.levels.delete(va.levels.keys().next().value as string);
  return sel;
}

/**
 * Run-thinned indices of the visible part of an unsorted curve into idxScratch. A chunk whose box lies
 * wholly beyond one edge of the cull rectangle (log space) contributes only its first and last point: the
 * path between them stays beyond that edge, so this is exact culling, found without touching its points.
 * Visible chunks are thinned on first use and kept in the level.
 */
function gatherRuns(
  prep: PreparedCurve,
  va: ViewArrays,
  sel: LevelSelection,
  tx: number,
  ty: number,
  lmLo: number,
  lmHi: number,
  vLo: number,
  vHi: number,
  map: PixelMap,
): number {
  const boxes = va.boxes as Float64Array;
  const n = prep.n;
  const lm = prep.lm;
  const v = va.v;
  const { ax, bx, ay, by, yOffset } = map;
  const per = RUN_CHUNK / BOX_CHUNK;
  const nc = Math.ceil(n / RUN_CHUNK);
  let count = 0;
  for (let c = 0; c < nc; c++) {
    const s = c * RUN_CHUNK;
    const e = Math.min(n, s + RUN_CHUNK);
    let a = Infinity;
    let b = -Infinity;
    let lo = Infinity;
    let hi = -Infinity;
    const b0 = c * per;
    const b1 = Math.min(boxes.length >> 2, b0 + per);
    for (let k = b0; k < b1; k++) {
      if (boxes[4 * k] < a) a = boxes[4 * k];
      if (boxes[4 * k + 1] > b) b = boxes[4 * k + 1];
      if (boxes[4 * k + 2] < lo) lo = boxes[4 * k + 2];
      if (boxes[4 * k + 3] > hi) hi = boxes[4 * k + 3];
    }
    const off = b < lmLo || a > lmHi || hi < vLo || lo > vHi;
    let idx = off ? null : sel.perChunk[c];
    if (!off && !idx) {
      idx = thinRunsLog(lm.subarray(s, e), v.subarray(s, e), tx, ty);
      for (let k = 0; k < idx.length; k++) idx[k] += s;
      sel.perChunk[c] = idx;
    }
    // The pixels of the kept points, written here rather than in a second pass over their indices.
    ensureBuffers(count + (idx ? idx.length : 2), count);
    const ox = bufX;
    const oy = bufY;
    if (!idx) {
      ox[count] = ax + bx * lm[s];
      oy[count] = ay + by * (v[s] + yOffset);
      count++;
      if (e - 1 > s) {
        ox[count] = ax + bx * lm[e - 1];
        oy[count] = ay + by * (v[e - 1] + yOffset);
        count++;
      }
      continue;
    }
    for (let k = 0; k < idx.length; k++) {
      const i = idx[k];
      ox[count] = ax + bx * lm[i];
      oy[count] = ay + by * (v[i] + yOffset);
      count++;
    }
  }
  return count;
}

/**
 * The k most important points of an unsorted curve (the Douglas–Peucker simplification at the tolerance that
 * keeps k), in index order. Derived from the last frame's selection: a zoom step changes k by a fraction, so
 * dropping the least important or merging in the next ones in importance order costs O(k) instead of a sort
 * of k indices (~0.2 ms per region and frame at k ≈ 6,000).
 */
function dpSelection(va: ViewArrays, k: number): Int32Array {
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

/** Map selected indices (idxScratch[0..count)) to pixels in bufX/bufY. */
function mapSelected(prep: PreparedCurve, v: Float64Array, count: number, p: PixelParams): void {
  ensureBuffers(count);
  const { ax, bx, ay, by, yOffset } = p;
  const lm = prep.lm;
  for (let k = 0; k < count; k++) {
    const i = idxScratch[k];
    bufX[k] = ax + bx * lm[i];
    bufY[k] = ay + by * (v[i] + yOffset);
  }
}

/** Error budget of unsorted curves in device px: Douglas–Peucker alone, or run thinning alone. */
const DP_ONLY_PX = 0.5;
const RUNS_PX = 0.5;

/**
 * The pixels of a prepared curve for one frame.
 * Sorted curves: per column of 1/resolution scene px the first, lowest, highest and last point, at their
 * own positions (moving them to the column centre would widen a spike that ends a column into a visible
 * notch).
 * Unsorted curves and closed regions: Douglas–Peucker at 0.5 device px while it keeps few points (smooth
 * outlines; the tolerance is divided by the larger px-per-decade so it holds on both axes), else run thinning
 * at 0.5 device px when that keeps fewer (noisy outlines, computed only for chunks near the plot and cached
 * per level); either way ≤ 0.5 device px from the full curve.
 * Then points beyond the plot (+ margin) are culled exactly and the rest clipped to the plot ± 2 plot sizes.
 * With `thin: false` every point is drawn (for comparisons only).
 */
export function curvePixels(prep: PreparedCurve, closed: boolean, p: PixelParams): Polyline {
  const res = p.resolution && p.resolution > 0 ? p.resolution : 1;
  const pl = p.plot;
  const far = 2 * Math.max(pl.w, pl.h);
  const farRect = { x0: pl.x - far, y0: pl.y - far, x1: pl.x + pl.w + far, y1: pl.y + pl.h + far };
  const mg = CULL_MARGIN_PX;
  const cullRect = { x0: pl.x - mg, y0: pl.y - mg, x1: pl.x + pl.w + mg, y1: pl.y + pl.h + mg };
  let n: number;

  if (p.thin === false) {
    n = prep.n;
    ensureBuffers(n);
    for (let i = 0; i < n; i++) {
      bufX[i] = p.ax + p.bx * prep.lm[i];
      bufY[i] = p.ay + p.by * (prep.lg[i] + p.slope * prep.lm[i] + p.yOffset);
    }
  } else if (prep.sorted) {
    const va = viewArrays(prep, p.slope, closed);
    const colL0 = (pl.x - p.ax) / p.bx;
    const colK = p.bx * res;
    n = thinColumnsInto(prep.lm, va.v, va.pyramid, { lmLo: colL0, lmHi: (pl.x + pl.w - p.ax) / p.bx, colL0, colK }, p);
    n = cullOutside(n, cullRect);
  } else {
    const va = viewArrays(prep, p.slope, closed);
    const lmLo = (cullRect.x0 - p.ax) / p.bx;
    const lmHi = (cullRect.x1 - p.ax) / p.bx;
    const vLo = (cullRect.y1 - p.ay) / p.by - p.yOffset;
    const vHi = (cullRect.y0 - p.ay) / p.by - p.yOffset;
    const scale = Math.max(Math.abs(p.bx), Math.abs(p.by));
    const impDesc = va.impDesc as Float64Array;
    // Candidate A, Douglas–Peucker: the points above the tolerance are a prefix of the importance order.
    const tA = DP_ONLY_PX / res / scale;
    let lo = 0;
    let hi = impDesc.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (impDesc[mid] > tA) lo = mid + 1;
      else hi = mid;
    }
    const k = lo;
    const limit = Math.max(256, 2 * (pl.w + pl.h) * res);
    // Candidate B for noisy outlines (DP keeps almost everything): run thinning, cached per level with the
    // run size rounded down to a power of √2 (a finer level keeps a few more points; the bound holds).
    n = 0;
    let useA = k <= limit;
    if (!useA) {
      const pow = (t: number) => 2 ** (Math.floor(2 * Math.log2(t)) / 2);
      const tx = pow(RUNS_PX / res / Math.abs(p.bx));
      const ty = pow(RUNS_PX / res / Math.abs(p.by));
      n = gatherRuns(prep, va, levelOf(va, `B${tx},${ty}`), tx, ty, lmLo, lmHi, vLo, vHi, p);
      useA = n >= k;
    }
    if (useA) {
      const sel = dpSelection(va, k);
      if (idxScratch.length < k) idxScratch = new Int32Array(k * 2);
      idxScratch.set(sel);
      n = k;
      mapSelected(prep, va.v, n, p);
    }
    n = cullOutside(n, cullRect);
  }
  if (!p.reuse) return clipToRect({ xs: bufX.slice(0, n), ys: bufY.slice(0, n), n, closed }, farRect);
  let cur: Polyline = { xs: bufX, ys: bufY, n, closed };
  if (!allInside(bufX, bufY, n, farRect)) {
    for (let side = 0, k = 0; side < 4 && cur.n > 0; side++) {
      const next = clipHalf(cur, side, farRect, clipScratch[k]);
      if (next !== cur) k ^= 1;
      cur = next;
    }
  }
  return { xs: cur.xs.subarray(0, cur.n), ys: cur.ys.subarray(0, cur.n), n: cur.n, closed };
}

function allInside(xs: Float64Array, ys: Float64Array, n: number, r: Rect): boolean {
  for (let i = 0; i < n; i++) {
    const x = xs[i];
    const y = ys[i];
    if (x < r.x0 || x > r.x1 || y < r.y0 || y > r.y1) return false;
  }
  return true;
}

/** Path data "M x y L x y …" with absolute coordinates rounded to 2 decimals, closed with Z for polygons. */
export function pathData(poly: Polyline, extra = ""): string {
  return poly.n === 0 ? "" : absolutePath(poly.xs, poly.ys, poly.n, poly.closed, extra);
}

/**
 * Compact path data for long curves: an absolute "M" then relative moves between the positions rounded to
 * 0.01 px ("l dx dy", or "h dx" / "v dy" when one coordinate repeats), so every vertex lands exactly on its
 * rounded absolute position (no drift) in about half the characters; repeated vertices are dropped.
 * @param extra path data appended before the closing Z (absolute commands).
 */
export function pathDataCompact(poly: Polyline, extra = ""): string {
  return poly.n === 0 ? "" : compactPath(poly.xs, poly.ys, poly.n, poly.closed, extra);
}
