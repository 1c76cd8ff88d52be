// Curves at pixel resolution: per-curve cached log10 arrays, column thinning (first/min/max/last per pixel
// column, with a block min/max pyramid so zoomed-out redraws skip most points), Douglas–Peucker importance
// for unsorted curves and regions, and clipping to a generous rectangle so no coordinate gets huge.

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

interface ViewArrays {
  /** log10 of the y-view value without its constant offset: lg + slope·lm. */
  v: Float64Array;
  pyramid: Pyramid | null;
  /** Douglas–Peucker importance in (lm, v) space (unsorted curves and regions). */
  importance: Float64Array | null;
}

/** Block argmin/argmax of v at levels of 16, 256, 4096, … points. */
export interface Pyramid {
  levels: { min: Int32Array; max: Int32Array }[];
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

/** The view arrays of a prepared curve for a y-view slope (built once, then cached on the curve). */
export function viewArrays(prep: PreparedCurve, slope: number, closed: boolean): ViewArrays {
  let va = prep.views.get(slope);
  if (!va) {
    let v = prep.lg;
    if (slope !== 0) {
      v = new Float64Array(prep.n);
      for (let i = 0; i < prep.n; i++) v[i] = prep.lg[i] + slope * prep.lm[i];
    }
    va = { v, pyramid: null, importance: null };
    prep.views.set(slope, va);
  }
  if (prep.sorted && !va.pyramid) va.pyramid = buildPyramid(va.v);
  if (!prep.sorted && !va.importance) va.importance = dpImportance(prep.lm, va.v, closed);
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

/** Argmin and argmax of v over [lo, hi) (hi > lo) into qMin/qMax, using the pyramid's whole blocks. */
function rangeMinMax(v: Float64Array, pyr: Pyramid | null, lo: number, hi: number): void {
  let mn = lo;
  let mx = lo;
  let a = lo + 1;
  let b = hi;
  if (!pyr || pyr.levels.length === 0 || hi - lo < 2 * BLOCK) {
    for (let i = a; i < b; i++) {
      const x = v[i];
      if (x < v[mn]) mn = i;
      else if (x > v[mx]) mx = i;
    }
    qMin = mn;
    qMax = mx;
    return;
  }
  while (a < b && a & BLOCK_MASK) {
    const x = v[a];
    if (x < v[mn]) mn = a;
    else if (x > v[mx]) mx = a;
    a++;
  }
  while (b > a && b & BLOCK_MASK) {
    b--;
    const x = v[b];
    if (x < v[mn]) mn = b;
    else if (x > v[mx]) mx = b;
  }
  let la = a >> BLOCK_SHIFT;
  let lb = b >> BLOCK_SHIFT;
  const levels = pyr.levels;
  for (let L = 0; la < lb; L++) {
    const { min, max } = levels[L];
    if (L === levels.length - 1) {
      for (let k = la; k < lb; k++) {
        if (v[min[k]] < v[mn]) mn = min[k];
        if (v[max[k]] > v[mx]) mx = max[k];
      }
      break;
    }
    while (la < lb && la & BLOCK_MASK) {
      if (v[min[la]] < v[mn]) mn = min[la];
      if (v[max[la]] > v[mx]) mx = max[la];
      la++;
    }
    while (lb > la && lb & BLOCK_MASK) {
      lb--;
      if (v[min[lb]] < v[mn]) mn = min[lb];
      if (v[max[lb]] > v[mx]) mx = max[lb];
    }
    la >>= BLOCK_SHIFT;
    lb >>= BLOCK_SHIFT;
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
  const n = lm.length;
  if (n === 0) return new Int32Array(0);
  const start = Math.max(0, lowerBound(lm, p.lmLo) - 1);
  const end = Math.min(n, upperBound(lm, p.lmHi) + 1);
  const { colL0, colK } = p;
  let count = 0;
  let i = start;
  while (i < end) {
    const c = Math.floor((lm[i] - colL0) * colK);
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
      for (let k = i; k < j; k++) count = pushIdx(count, k);
    } else {
      rangeMinMax(v, pyr, i, j);
      let a = qMin < qMax ? qMin : qMax;
      let b = qMin < qMax ? qMax : qMin;
      count = pushIdx(count, i);
      if (a === i) a = -1;
      if (b === last) b = -1;
      if (a > i && a < last) count = pushIdx(count, a);
      if (b > i && b < last && b !== a) count = pushIdx(count, b);
      count = pushIdx(count, last);
    }
    i = j;
  }
  return idxScratch.slice(0, count);
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
  for (let side = 0; side < 4 && cur.n > 0; side++) cur = clipHalf(cur, side, r);
  return cur;
}

function inside(x: number, y: number, side: number, r: Rect): boolean {
  return side === 0 ? x >= r.x0 : side === 1 ? x <= r.x1 : side === 2 ? y >= r.y0 : y <= r.y1;
}

function clipHalf(p: Polyline, side: number, r: Rect): Polyline {
  const { xs, ys, n, closed } = p;
  let all = true;
  for (let i = 0; i < n && all; i++) if (!inside(xs[i], ys[i], side, r)) all = false;
  if (all) return p;
  const ox = new Float64Array(n * 2 + 2);
  const oy = new Float64Array(n * 2 + 2);
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
}

/**
 * The pixels of a prepared curve for one frame: sorted curves thinned per column of 1/resolution scene px;
 * unsorted curves and closed regions simplified to ≤ 0.5 device px (Douglas–Peucker, tolerance divided by
 * the larger px-per-decade so it holds on both axes); then clipped to the plot ± 2 plot sizes.
 */
export function curvePixels(prep: PreparedCurve, closed: boolean, p: PixelParams): Polyline {
  const res = p.resolution && p.resolution > 0 ? p.resolution : 1;
  const thin = p.thin !== false;
  const va = thin ? viewArrays(prep, p.slope, closed) : null;
  let v: Float64Array;
  let idx: Int32Array | null = null;
  if (va) {
    v = va.v;
    if (prep.sorted) {
      idx = thinColumns(prep.lm, v, va.pyramid, {
        lmLo: (p.plot.x - p.ax) / p.bx,
        lmHi: (p.plot.x + p.plot.w - p.ax) / p.bx,
        colL0: (p.plot.x - p.ax) / p.bx,
        colK: p.bx * res,
      });
    } else if (va.importance) {
      const tolPx = 0.5 / res;
      idx = simplifyIndices(va.importance, tolPx / Math.max(Math.abs(p.bx), Math.abs(p.by)));
    }
  } else {
    v = prep.lg;
  }
  const n = idx ? idx.length : prep.n;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const { ax, bx, ay, by, slope, yOffset } = p;
  const lm = prep.lm;
  const lg = prep.lg;
  const direct = !va && slope !== 0;
  for (let k = 0; k < n; k++) {
    const i = idx ? idx[k] : k;
    xs[k] = ax + bx * lm[i];
    ys[k] = ay + by * ((direct ? lg[i] + slope * lm[i] : v[i]) + yOffset);
  }
  const pl = p.plot;
  const m = 2 * Math.max(pl.w, pl.h);
  return clipToRect({ xs, ys, n, closed }, { x0: pl.x - m, y0: pl.y - m, x1: pl.x + pl.w + m, y1: pl.y + pl.h + m });
}

/** Path data "M x y L x y …" (numbers rounded to 2 decimals), closed with Z for polygons. */
export function pathData(poly: Polyline, extra = ""): string {
  const { xs, ys, n } = poly;
  if (n === 0) return "";
  let d = "M" + Math.round(xs[0] * 100) / 100 + " " + Math.round(ys[0] * 100) / 100;
  for (let k = 1; k < n; k++) d += "L" + Math.round(xs[k] * 100) / 100 + " " + Math.round(ys[k] * 100) / 100;
  return d + extra + (poly.closed ? "Z" : "");
}
