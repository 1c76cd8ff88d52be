// Which curves a point (m_a, g_aγγ) lies in: below an exclusion or projection curve (log-log interpolation) or
// inside a region; reuses the shared curve preparation, so the first hover after a big import is quick.
import { bisectRight } from "d3-array";
import type { Curve } from "../../project/types";
import { prepareCurve, type PreparedCurve } from "../../analysis/prepared-curve";
import { rescaleFactor } from "../../plot/physics-settings";

/** log10 mass and g of the usable points (> 0, finite), sorted by mass (stable) for lines, file order for regions. */
function prepare(c: Pick<Curve, "massEv" | "gInvGeV" | "role">): PreparedCurve {
  return prepareCurve(c.massEv, c.gInvGeV, c.role !== "region");
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
  // The segment [lo, hi] holding x: lo the last point at or left of x (hi = lo for a single point).
  const hi = Math.min(n - 1, bisectRight(lm, x));
  const lo = Math.max(0, hi - 1);
  const t = lm[hi] === lm[lo] ? 0 : (x - lm[lo]) / (lm[hi] - lm[lo]);
  // At a vertical step (equal masses) take the lower value: the stronger limit at that mass.
  const y = lm[hi] === lm[lo] ? Math.min(lg[lo], lg[hi]) : lg[lo] + t * (lg[hi] - lg[lo]);
  return 10 ** y * rescaleFactor(c.rescale);
}

/** True when (m, g) lies inside the closed polygon of a region curve (even-odd rule in log-log space). */
export function insideRegion(
  c: Pick<Curve, "massEv" | "gInvGeV" | "role" | "rescale">,
  massEv: number,
  gInvGeV: number,
): boolean {
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
