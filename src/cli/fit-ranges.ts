// Axis ranges for a quick figure from CSV files: the decades that enclose every positive data point, so a
// figure made from files alone shows all of them without the user choosing ranges first.
import type { Curve } from "../project/types";

/** Mass range (eV) and coupling range (GeV⁻¹) of a figure, ends at whole decades. */
export interface FittedRanges {
  massRangeEv: [number, number];
  gRange: [number, number];
}

function decades(lo: number, hi: number, minDecades: number): [number, number] {
  let a = Math.floor(Math.log10(lo));
  let b = Math.ceil(Math.log10(hi));
  // A flat or point-like data set still gets a readable axis: widen symmetrically to minDecades.
  while (b - a < minDecades) {
    a -= 1;
    if (b - a < minDecades) b += 1;
  }
  // Number("1e-5") is the double nearest 10⁻⁵; 10 ** -5 is one ulp below it.
  return [Number(`1e${a}`), Number(`1e${b}`)];
}

/**
 * The smallest whole-decade ranges that contain every finite, positive point of the given curves (hidden
 * ones included, so toggling visibility in the app later does not need a refit). Non-positive values cannot
 * go on a log axis and are ignored here. Returns undefined when no curve has a usable point.
 * @param minDecades smallest span of each axis in decades. @default 1
 */
export function fitRanges(
  curves: readonly Pick<Curve, "massEv" | "gInvGeV">[],
  minDecades = 1,
): FittedRanges | undefined {
  let mLo = Infinity;
  let mHi = -Infinity;
  let gLo = Infinity;
  let gHi = -Infinity;
  for (const c of curves) {
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
  }
  if (!(mLo <= mHi)) return undefined;
  return { massRangeEv: decades(mLo, mHi, minDecades), gRange: decades(gLo, gHi, minDecades) };
}
