// Which curves a point (m_a, g_aγγ) lies in: below an exclusion or projection curve interpolated linearly in
// log-log space at that mass, or inside a closed region. Per-curve preparation is cached by data array.
import type { Curve } from "../../data/types";
import { rescaleFactor } from "../../plot/physics-settings";

interface Prepared {
  /** log10 mass and log10 g of the usable points (> 0), sorted by mass for lines, file order for regions. */
  lm: Float64Array;
  lg: Float64Array;
}

const cache = new WeakMap<Float64Array, { g: Float64Array; sorted: boolean; prep: Prepared }>();

function prepare(c: Pick<Curve, "massEv" | "gInvGeV" | "role">): Prepared {
  const sorted = c.role !== "region";
  const hit = cache.get(c.massEv);
  if (hit && hit.g === c.gInvGeV && hit.sorted === sorted) return hit.prep;
  const idx: number[] = [];
  for (let i = 0; i < c.massEv.length; i++) if (c.massEv[i] > 0 && c.gInvGeV[i] > 0 && Number.isFinite(c.massEv[i]) && Number.isFinite(c.gInvGeV[i])) idx.push(i);
  if (sorted) idx.sort((a, b) => c.massEv[a] - c.massEv[b]);
  const lm = new Float64Array(idx.length);
  const lg = new Float64Array(idx.length);
  idx.forEach((k, j) => {
    lm[j] = Math.log10(c.massEv[k]);
    lg[j] = Math.log10(c.gInvGeV[k]);
  });
  const prep = { lm, lg };
  cache.set(c.massEv, { g: c.gInvGeV, sorted, prep });
  return prep;
}

/**
 * The curve's coupling (GeV⁻¹, rescaling applied) at a mass, interpolated linearly in log-log space; null
 * outside the curve's mass range (nothing is claimed there).
 */
export function curveGAt(c: Pick<Curve, "massEv" | "gInvGeV" | "role" | "rescale">, massEv: number): number | null {
  const { lm, lg } = prepare(c);
  const n = lm.length;
  if (n === 0 || !(massEv > 0)) return null;
  const x = Math.log10(massEv);
  if (x < lm[0] || x > lm[n - 1]) return null;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (lm[mid] <= x) lo = mid;
    else hi = mid;
  }
  const t = lm[hi] === lm[lo] ? 0 : (x - lm[lo]) / (lm[hi] - lm[lo]);
  // At a vertical step (equal masses) take the lower value: the stronger limit at that mass.
  const y = lm[hi] === lm[lo] ? Math.min(lg[lo], lg[hi]) : lg[lo] + t * (lg[hi] - lg[lo]);
  return 10 ** y * rescaleFactor(c.rescale);
}

/** True when (m, g) lies inside the closed polygon of a region curve (even-odd rule in log-log space). */
export function insideRegion(c: Pick<Curve, "massEv" | "gInvGeV" | "role" | "rescale">, massEv: number, gInvGeV: number): boolean {
  const { lm, lg } = prepare(c);
  const n = lm.length;
  if (n < 3 || !(massEv > 0 && gInvGeV > 0)) return false;
  const x = Math.log10(massEv);
  const y = Math.log10(gInvGeV / rescaleFactor(c.rescale));
  let inside = false;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    if (lg[i] > y !== lg[j] > y && x < ((lm[j] - lm[i]) * (y - lg[i])) / (lg[j] - lg[i]) + lm[i]) inside = !inside;
  }
  return inside;
}

export interface PointHit {
  curveId: string;
  label: string;
  role: Curve["role"];
}

/** The visible curves that exclude (exclusion), reach (projection) or contain (region) the point. */
export function curvesAtPoint(curves: readonly Curve[], massEv: number, gInvGeV: number): PointHit[] {
  const out: PointHit[] = [];
  for (const c of curves) {
    if (!c.visible) continue;
    let hit: boolean;
    if (c.role === "region") hit = insideRegion(c, massEv, gInvGeV);
    else {
      const limit = curveGAt(c, massEv);
      hit = limit !== null && gInvGeV >= limit;
    }
    if (hit) out.push({ curveId: c.id, label: c.label, role: c.role });
  }
  return out;
}
