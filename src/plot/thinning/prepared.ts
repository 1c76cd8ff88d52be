// The per-curve arrays the thinning draws from: the shared preparation (analysis/prepared-curve.ts) and, per y
// view, the derived arrays (the pyramid of sorted curves; importance, order and culling boxes of unsorted ones).
import type { PreparedCurve } from "../../analysis/prepared-curve";
import { buildPyramid, type Pyramid } from "./pyramid";
import { dpImportance } from "./douglas-peucker";

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
  /** Run sizes in log10 mass and in v (see thinRunsLog). */
  tx: number;
  ty: number;
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

// The y views of each prepared curve (the preparation itself is shared with the analysis, which has no views).
const viewCache = new WeakMap<PreparedCurve, Map<number, ViewArrays>>();

/** The y views built so far for a prepared curve, by slope (0: g_aγγ; −1: |E/N − c_γ| ∝ g/m). */
export function viewsOf(prep: PreparedCurve): Map<number, ViewArrays> {
  let views = viewCache.get(prep);
  if (!views) {
    views = new Map();
    viewCache.set(prep, views);
  }
  return views;
}

/** The view arrays of a prepared curve for a y-view slope (built once, then cached on the curve). */
export function viewArrays(prep: PreparedCurve, slope: number): ViewArrays {
  const views = viewsOf(prep);
  let va = views.get(slope);
  if (!va) {
    let v = prep.lg;
    if (slope !== 0) {
      v = new Float64Array(prep.n);
      for (let i = 0; i < prep.n; i++) v[i] = prep.lg[i] + slope * prep.lm[i];
    }
    va = { v, pyramid: null, importance: null, boxes: null, levels: new Map(), order: null, impDesc: null };
    views.set(slope, va);
  }
  if (prep.sorted && !va.pyramid) va.pyramid = buildPyramid(va.v);
  if (!prep.sorted && !va.importance) {
    const imp = dpImportance(prep.lm, va.v);
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
