// Per-curve preparation for the overlap (usable points, logs, sheared values), cached on the never mutated data arrays.

/** An exclusion or projection curve sorted by mass: x = ln m ascending, v = ln g − ln m. */
export interface SortedPrep {
  n: number;
  x: Float64Array;
  v: Float64Array;
  mass: Float64Array;
  skipped: number;
}

/** A closed region in file order, same coordinates. */
export interface PolygonPrep {
  n: number;
  x: Float64Array;
  v: Float64Array;
  xMin: number;
  xMax: number;
  massMin: number;
  massMax: number;
  skipped: number;
}

interface CacheEntry {
  g: Float64Array;
  sorted?: SortedPrep;
  polygon?: PolygonPrep;
}

const prepCache = new WeakMap<Float64Array, CacheEntry>();

function usable(m: number, g: number): boolean {
  return m > 0 && g > 0 && Number.isFinite(m) && Number.isFinite(g);
}

function cacheEntry(massEv: Float64Array, gInvGeV: Float64Array): CacheEntry {
  let entry = prepCache.get(massEv);
  if (!entry || entry.g !== gInvGeV) {
    entry = { g: gInvGeV };
    prepCache.set(massEv, entry);
  }
  return entry;
}

export function prepareSorted(massEv: Float64Array, gInvGeV: Float64Array): SortedPrep {
  const entry = cacheEntry(massEv, gInvGeV);
  if (entry.sorted) return entry.sorted;
  const len = Math.min(massEv.length, gInvGeV.length);
  const idx: number[] = [];
  let ordered = true;
  for (let i = 0; i < len; i++) {
    if (!usable(massEv[i], gInvGeV[i])) continue;
    if (idx.length > 0 && massEv[i] < massEv[idx[idx.length - 1]]) ordered = false;
    idx.push(i);
  }
  // Array.prototype.sort is stable, so points of equal mass keep their file order (a vertical step).
  if (!ordered) idx.sort((p, q) => massEv[p] - massEv[q]);
  const n = idx.length;
  const x = new Float64Array(n);
  const v = new Float64Array(n);
  const mass = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const m = massEv[idx[k]];
    mass[k] = m;
    x[k] = Math.log(m);
    v[k] = Math.log(gInvGeV[idx[k]]) - x[k];
  }
  entry.sorted = { n, x, v, mass, skipped: len - n + Math.abs(massEv.length - gInvGeV.length) };
  return entry.sorted;
}

export function preparePolygon(massEv: Float64Array, gInvGeV: Float64Array): PolygonPrep {
  const entry = cacheEntry(massEv, gInvGeV);
  if (entry.polygon) return entry.polygon;
  const len = Math.min(massEv.length, gInvGeV.length);
  const xs: number[] = [];
  const vs: number[] = [];
  let massMin = Infinity;
  let massMax = -Infinity;
  for (let i = 0; i < len; i++) {
    if (!usable(massEv[i], gInvGeV[i])) continue;
    const xi = Math.log(massEv[i]);
    xs.push(xi);
    vs.push(Math.log(gInvGeV[i]) - xi);
    massMin = Math.min(massMin, massEv[i]);
    massMax = Math.max(massMax, massEv[i]);
  }
  const n = xs.length;
  entry.polygon = {
    n,
    x: Float64Array.from(xs),
    v: Float64Array.from(vs),
    xMin: n > 0 ? Math.log(massMin) : NaN,
    xMax: n > 0 ? Math.log(massMax) : NaN,
    massMin,
    massMax,
    skipped: len - n + Math.abs(massEv.length - gInvGeV.length),
  };
  return entry.polygon;
}
