// Where a model line or band meets a curve: the exact mass intervals where the band is wholly or partly excluded
// (within reach, inside a region), solved per segment in log-log space sheared by v = ln g − ln m (O(n) per pair).
import { bisectLeft } from "d3-array";
import { resolveConstants, type AxionConstants } from "../../physics/constants";
import { assemble } from "./assemble";
import { polygonAreaShare, sortedAreaShare } from "./area";
import { eOverNWithAbsIn, modelLevels, normalizedOfLevel, type Levels } from "./levels";
import { polygonOverlap, polygonRangeOver } from "./polygon";
import { preparePolygon, prepareSorted } from "./prepare";
import { sortedOverlap, sortedRangeOver } from "./sorted";
import type { OverlapCurve, OverlapDetail, OverlapModel, OverlapOptions, OverlapResult } from "./types";

export type { Interval, OverlapCurve, OverlapDetail, OverlapModel, OverlapOptions, OverlapResult } from "./types";

function levelsFor(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions): { L: Levels; lnFactor: number } {
  const c: AxionConstants = opts.constants ?? model.constants ?? resolveConstants({ ref: model.ref });
  const factor = curve.gFactor ?? 1;
  const lnFactor = factor > 0 && Number.isFinite(factor) ? Math.log(factor) : 0;
  return { L: modelLevels(model, c, lnFactor), lnFactor };
}

/**
 * The share of the model band's area (log m × log g over the curve's mass range, theory spread included) that
 * the curve excludes (reaches, contains): 1 when the whole band is covered everywhere. Null for a line without
 * spread (use the mass share), a band reaching g = 0, or a curve with too few usable points.
 */
export function overlapAreaShare(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions = {}): number | null {
  if (!Number.isFinite(model.eOverNMin) || !Number.isFinite(model.eOverNMax)) return null;
  const { L } = levelsFor(model, curve, opts);
  if (curve.role === "region") {
    const p = preparePolygon(curve.massEv, curve.gInvGeV);
    return p.n < 3 ? null : polygonAreaShare(p, L);
  }
  const p = prepareSorted(curve.massEv, curve.gInvGeV);
  return p.n < 2 ? null : sortedAreaShare(p, L);
}

/**
 * The overlap of a model line or band with one curve, with the detail the overlap table needs.
 *
 * Semantics (closed convention: the curve itself belongs to the excluded side):
 * - exclusion: at a mass m inside the curve's mass range, with G(m) the curve interpolated linearly in
 *   log-log space, an E/N is excluded when its g(m) ≥ G(m). `whole` where the band's lower edge has
 *   g_low(m) ≥ G(m); `part` where g_high(m) ≥ G(m) > g_low(m). Points are sorted by mass first.
 * - projection: the same comparison, read as "within reach".
 * - region: the points in file order form a closed polygon in log-log space (even-odd rule, boundary
 *   included); `whole` where the band's vertical segment [g_low, g_high] at m lies inside it entirely
 *   (a line: where its point is inside), `part` where the segment meets the region without lying inside.
 * - the band edges are those of bandEdges (theory spread: c_γ ± kσ and K ± kσ). When the lower edge is 0
 *   (cancellation) `whole` is empty: no finite limit or bounded region covers g → 0.
 * - Nothing is claimed outside the curve's mass range; isolated touching points are not reported.
 * - Gap merging (`mergeGaps`, opt-in, default off): two intervals of the same kind are joined when the gap between
 *   them is narrower (in ln m) than one sample spacing: for exclusion and projection curves the smaller
 *   width of the two curve segments holding the gap's ends; for regions the smallest x-width of the
 *   polygon edges spanning either end (0 at a vertical edge, so a drawn notch is never bridged). Such a
 *   gap rests on a single sample and is not resolved by the data. Whole intervals are merged first; what
 *   remains of the band's partial overlap fills the rest.
 *
 * Complexity: O(n) per call for n points (crossing lists of a region are sorted, O(k log k) for k crossings);
 * the per-curve preparation (logs, sorting) is cached on the curve's arrays, which must not be mutated.
 *
 * @param model E/N interval (min = max for a line), theory spread k (@default 0), reference (@default "2019").
 * @param curve masses in eV, couplings in GeV⁻¹, role; optional `gFactor` (@default 1) rescales the couplings.
 * @param opts custom constants; `mergeGaps` (@default false).
 */
export function overlapDetail(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions = {}): OverlapDetail {
  const { L, lnFactor } = levelsFor(model, curve, opts);
  const merge = opts.mergeGaps ?? false;
  const cancels = L.lo === -Infinity;
  const line = model.eOverNMin === model.eOverNMax;
  const empty: OverlapDetail = {
    whole: [],
    part: [],
    partEOverN: [],
    partEOverNThroughout: curve.role === "region" ? null : [],
    none: [],
    massRangeEv: null,
    cancels,
    line,
    bridgedGapsEv: [],
    skippedPoints: 0,
  };
  if (!Number.isFinite(model.eOverNMin) || !Number.isFinite(model.eOverNMax)) return empty;

  if (curve.role === "region") {
    const p = preparePolygon(curve.massEv, curve.gInvGeV);
    empty.skippedPoints = p.skipped;
    if (p.n < 3 || !(p.xMax > p.xMin)) return empty;
    const toMass = (x: number): number => (x <= p.xMin ? p.massMin : x >= p.xMax ? p.massMax : Math.exp(x));
    const raw = polygonOverlap(p, L, merge);
    const range = polygonRangeOver(p, raw.part);
    const partEOverN = range.min.map((vMin, q) =>
      eOverNWithAbsIn(
        L,
        normalizedOfLevel(vMin + lnFactor, L.kLow) - L.dc,
        normalizedOfLevel(range.max[q] + lnFactor, L.kHigh) + L.dc,
      ),
    );
    return assemble(raw, [p.xMin, p.xMax], toMass, partEOverN, null, cancels, line, p.skipped);
  }

  const p = prepareSorted(curve.massEv, curve.gInvGeV);
  empty.skippedPoints = p.skipped;
  if (p.n < 2 || !(p.x[p.n - 1] > p.x[0])) return empty;
  const toMass = (x: number): number => {
    // Boundaries at a sample keep the sample's own mass (no exp∘log round-off at the range ends).
    const j = bisectLeft(p.x, x);
    if (j < p.n && p.x[j] === x) return p.mass[j];
    return Math.min(p.mass[p.n - 1], Math.max(p.mass[0], Math.exp(x)));
  };
  const raw = sortedOverlap(p, L, merge);
  const partEOverN: [number, number][][] = [];
  const throughout: [number, number][][] = [];
  for (let i = 0; i < raw.part.length; i += 2) {
    const [vMin, vMax] = sortedRangeOver(p, raw.part[i], raw.part[i + 1]);
    // Somewhere: the E/N's own spread top reaches the curve's lowest point; throughout: its spread bottom
    // stays above the curve's highest point.
    partEOverN.push(eOverNWithAbsIn(L, normalizedOfLevel(vMin + lnFactor, L.kLow) - L.dc, Infinity));
    throughout.push(eOverNWithAbsIn(L, normalizedOfLevel(vMax + lnFactor, L.kHigh) + L.dc, Infinity));
  }
  return assemble(raw, [p.x[0], p.x[p.n - 1]], toMass, partEOverN, throughout, cancels, line, p.skipped);
}

/**
 * Mass intervals (eV) where a model line or band overlaps a curve: `whole` where every E/N of the interval
 * is excluded (within reach, inside the region), `part` where some but not all are. Ascending, disjoint,
 * intervals only merged across gaps narrower than one sample with `mergeGaps`; `part` is empty for a line without theory spread. See
 * {@link overlapDetail} for the exact semantics and the extra detail (E/N sub-intervals, cancellation).
 * @param model E/N interval, theory spread `sigmas` (@default 0), `ref` (@default "2019").
 * @param curve masses in eV, couplings in GeV⁻¹, role.
 * @param opts custom constants (`constants`), `mergeGaps` (@default false).
 */
export function overlap(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions = {}): OverlapResult {
  const d = overlapDetail(model, curve, opts);
  return { whole: d.whole, part: d.part };
}
