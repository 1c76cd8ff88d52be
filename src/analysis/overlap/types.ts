// The types of the overlap computation: a model (E/N interval and theory spread), a curve, and the interval lists
// returned for them.
import type { AxionConstants, RefId } from "../../physics/constants";
import type { CurveRole } from "../../project/types";

/** A closed mass interval [lo, hi] in eV, lo < hi. */
export type Interval = [number, number];

/** The model side of an overlap: an E/N interval (min = max for a model line) and its theory spread. */
export interface OverlapModel {
  eOverNMin: number;
  eOverNMax: number;
  /** k in ±kσ for the theory spread (c_γ and K varied). @default 0 */
  sigmas?: number;
  /** Published reference set. @default "2019" */
  ref?: RefId;
  /** A complete user-entered set of constants; wins over `ref`. */
  constants?: AxionConstants;
  /**
   * The E/N values of a "between lines" band: the region between their lines, lower edge min |E/N − c_γ| (0
   * only when a line itself reaches g = 0), instead of every E/N of [min, max]. Absent for lines and intervals.
   */
  between?: number[];
}

/** The curve side: data in internal units (eV, GeV⁻¹) and its role. */
export interface OverlapCurve {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  role: CurveRole;
  /**
   * Multiplies every coupling of the curve before comparing (the rescaling √(ρ_assumed/ρ_shown)/√f), without
   * copying the data, so the per-curve preparation is reused. @default 1
   */
  gFactor?: number;
}

/** Extra options of {@link overlap} and {@link overlapDetail}. */
export interface OverlapOptions {
  /** A complete set of constants; wins over the model's `constants` and `ref`. */
  constants?: AxionConstants;
  /**
   * Merge intervals whose gap is narrower than one curve sample spacing (see {@link overlapDetail}); the
   * bridged gaps are listed in `bridgedGapsEv`, never counted as excluded by the table. @default false
   */
  mergeGaps?: boolean;
}

/** The two lists every caller gets: intervals in eV, ascending, disjoint and merged. */
export interface OverlapResult {
  /** Masses where every E/N of the band is excluded (within reach, inside the region). */
  whole: Interval[];
  /** Masses where some but not all E/N values are (always empty for a line without theory spread). */
  part: Interval[];
}

/** {@link OverlapResult} with the detail the overlap table shows. */
export interface OverlapDetail extends OverlapResult {
  /**
   * For each `part` interval (same order): the E/N values of the model's interval that are excluded (within
   * reach, inside) somewhere in that mass interval, as one or two ascending E/N intervals. With a theory
   * spread an E/N counts when its own spread band gets there. For a region this is the hull over the
   * region's cross-sections, so it may be wider than the truth when the region has several lobes.
   */
  partEOverN: [number, number][][];
  /**
   * For exclusion and projection curves: the E/N values excluded (within reach) at every mass of each `part`
   * interval, even at the worst end of the theory spread (often empty or a single point, because a part
   * interval usually runs from "none" to "whole"); null for regions.
   */
  partEOverNThroughout: [number, number][][] | null;
  /** Masses of the curve's range where nothing is claimed to overlap. */
  none: Interval[];
  /** The curve's mass range [min, max] in eV (null with fewer than two usable points). */
  massRangeEv: Interval | null;
  /**
   * True when the band's lower edge is g = 0: c_γ (or any c_γ ± kσ) lies in the E/N interval, the coupling
   * cancels, and no finite limit (no bounded region) can cover the whole band, so `whole` is empty.
   */
  cancels: boolean;
  /** True when E/N min = max (a model line; with a theory spread it still has a width). */
  line: boolean;
  /** Gaps (eV) that were bridged because they were narrower than one sample spacing. */
  bridgedGapsEv: Interval[];
  /** Points skipped because mass or coupling was not a positive finite number (cannot go on a log axis). */
  skippedPoints: number;
}
