// Per-curve arrays of the overlap (natural logs, sheared values) on top of the shared preparation (usable
// points and their order, analysis/prepared-curve.ts), cached with it on the never mutated data arrays.
import { prepareCurve, type PreparedCurve } from "../prepared-curve";

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

// The overlap's own arrays (natural logs, sheared values), derived once per shared preparation.
const sortedCache = new WeakMap<PreparedCurve, SortedPrep>();
const polygonCache = new WeakMap<PreparedCurve, PolygonPrep>();

/**
 * x = ln m, v = ln g − ln m and the masses of a prepared curve's points, from its log10 arrays (no second
 * logarithm per point: ×ln 10 is monotonic, so equal and ordered masses stay equal and ordered in x).
 */
function shear(prep: PreparedCurve, massEv: Float64Array) {
  const { n, index, lm, lg } = prep;
  const x = new Float64Array(n);
  const v = new Float64Array(n);
  const mass = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    mass[k] = massEv[index[k]];
    x[k] = lm[k] * Math.LN10;
    v[k] = (lg[k] - lm[k]) * Math.LN10;
  }
  return { x, v, mass };
}

export function prepareSorted(massEv: Float64Array, gInvGeV: Float64Array): SortedPrep {
  // Ordered by mass, stable: points of equal mass keep their file order (a vertical step).
  const prep = prepareCurve(massEv, gInvGeV, true);
  let out = sortedCache.get(prep);
  if (!out) {
    const { x, v, mass } = shear(prep, massEv);
    out = { n: prep.n, x, v, mass, skipped: prep.skipped };
    sortedCache.set(prep, out);
  }
  return out;
}

export function preparePolygon(massEv: Float64Array, gInvGeV: Float64Array): PolygonPrep {
  const prep = prepareCurve(massEv, gInvGeV, false);
  let out = polygonCache.get(prep);
  if (!out) {
    const { x, v, mass } = shear(prep, massEv);
    let massMin = Infinity;
    let massMax = -Infinity;
    for (let k = 0; k < prep.n; k++) {
      massMin = Math.min(massMin, mass[k]);
      massMax = Math.max(massMax, mass[k]);
    }
    const n = prep.n;
    out = {
      n,
      x,
      v,
      xMin: n > 0 ? Math.log(massMin) : NaN,
      xMax: n > 0 ? Math.log(massMax) : NaN,
      massMin,
      massMax,
      skipped: prep.skipped,
    };
    polygonCache.set(prep, out);
  }
  return out;
}
