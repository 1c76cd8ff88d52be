// Axis ranges for a quick figure from CSV files: the decades that enclose every positive data point, so a
// figure made from files alone shows all of them without the user choosing ranges first.
import type { Curve } from "../project/types";
import { cachedPrepared, viewsOf, type PreparedCurve } from "../plot/thinning/index";
import { levelValues, rangeMinMax } from "../plot/thinning/pyramid";

/** Mass range (eV) and coupling range (GeV⁻¹) of a figure, ends at whole decades. */
export interface FittedRanges {
  massRangeEv: [number, number];
  gRange: [number, number];
}

/** Whole decades around log10 values lo ≤ hi, at least minDecades wide. */
function decades(lo: number, hi: number, minDecades: number): [number, number] {
  let a = Math.floor(lo);
  let b = Math.ceil(hi);
  // A flat or point-like data set still gets a readable axis: widen symmetrically to minDecades.
  while (b - a < minDecades) {
    a -= 1;
    if (b - a < minDecades) b += 1;
  }
  // Number("1e-5") is the double nearest 10⁻⁵; 10 ** -5 is one ulp below it.
  return [Number(`1e${a}`), Number(`1e${b}`)];
}

/** log10 extents: mass low, high, coupling low, high. */
type Extent = [number, number, number, number];

const scratch = { min: 0, max: 0 };

/** Widens x[k], x[k + 1] by the lowest and highest of a[0, n). */
function widenBy(x: Extent, k: number, a: Float64Array, n: number): void {
  let lo = x[k];
  let hi = x[k + 1];
  for (let i = 0; i < n; i++) {
    const v = a[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  x[k] = lo;
  x[k + 1] = hi;
}

/**
 * Widens `x` by a prepared curve's extent: its ends for mass when sorted, the g_aγγ view's pyramid for the
 * coupling when built (a CSV curve prepared by a parse worker), else a scan of its log10 arrays.
 */
function widenPrepared(x: Extent, p: PreparedCurve): void {
  const n = p.n;
  if (n === 0) return;
  const { lm, lg } = p;
  if (p.sorted) {
    x[0] = Math.min(x[0], lm[0]);
    x[1] = Math.max(x[1], lm[n - 1]);
  } else widenBy(x, 0, lm, n);
  const view = viewsOf(p).get(0);
  if (view && view.v === lg) {
    if (view.pyramid?.levels.length) levelValues(view.pyramid, lg);
    rangeMinMax(lg, view.pyramid, 0, n, scratch);
    x[2] = Math.min(x[2], lg[scratch.min]);
    x[3] = Math.max(x[3], lg[scratch.max]);
  } else widenBy(x, 2, lg, n);
}

/** Widens `x` by the curve's usable points (as prepareCurve selects them), read from the data arrays. */
function widenRaw(x: Extent, c: Pick<Curve, "massEv" | "gInvGeV">): void {
  let mLo = Infinity;
  let mHi = -Infinity;
  let gLo = Infinity;
  let gHi = -Infinity;
  const n = Math.min(c.massEv.length, c.gInvGeV.length);
  for (let i = 0; i < n; i++) {
    const m = c.massEv[i];
    const g = c.gInvGeV[i];
    if (!(m > 0 && g > 0 && Number.isFinite(m) && Number.isFinite(g))) continue;
    if (m < mLo) mLo = m;
    if (m > mHi) mHi = m;
    if (g < gLo) gLo = g;
    if (g > gHi) gHi = g;
  }
  if (!(mLo <= mHi)) return;
  x[0] = Math.min(x[0], Math.log10(mLo));
  x[1] = Math.max(x[1], Math.log10(mHi));
  x[2] = Math.min(x[2], Math.log10(gLo));
  x[3] = Math.max(x[3], Math.log10(gHi));
}

/**
 * The smallest whole-decade ranges that contain every finite, positive point of the given curves (hidden
 * ones included, so toggling visibility in the app later does not need a refit). Non-positive values cannot
 * go on a log axis and are ignored here. Returns undefined when no curve has a usable point.
 * Curves already prepared for drawing are read through their log10 arrays (log10 is monotonic, so the
 * lowest logarithm is that of the lowest value): no second pass over their data.
 * @param minDecades smallest span of each axis in decades. @default 1
 */
export function fitRanges(
  curves: readonly Pick<Curve, "massEv" | "gInvGeV">[],
  minDecades = 1,
): FittedRanges | undefined {
  const x: Extent = [Infinity, -Infinity, Infinity, -Infinity];
  for (const c of curves) {
    const p = cachedPrepared(c.massEv, c.gInvGeV, true) ?? cachedPrepared(c.massEv, c.gInvGeV, false);
    if (p) widenPrepared(x, p);
    else widenRaw(x, c);
  }
  if (!(x[0] <= x[1])) return undefined;
  return { massRangeEv: decades(x[0], x[1], minDecades), gRange: decades(x[2], x[3], minDecades) };
}
