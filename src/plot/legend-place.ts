// Automatic legend placement (our own rule): a free inner corner, read from the scene's curves and models as vertices
// on a coarse occupancy grid over the plot area; else outside right or below.
import type { Curve } from "../project/types";
import type { LegendCorner, PlotRect } from "./layout";
import { drawsSorted, preparedOf } from "./curves";
import { viewArrays, type PreparedCurve } from "./thinning/index";
import { coveredFraction, occupancyGrid, OCCUPANCY_CELL_PX, type Shape } from "./occupancy";

/** Corners in the order ties are broken: the first of equally covered corners wins. */
export const LEGEND_CORNERS: readonly LegendCorner[] = ["top-right", "top-left", "bottom-right", "bottom-left"];

/**
 * Largest fraction of the legend box that may lie over drawn content for an inner corner to count as free: a
 * line grazing the box's edge cells (one 4 px cell row of a 30-row box is 3 %), never a curve through it
 * (our own tolerance; keeping the legend off the data is common practice). Above it in every corner, the
 * legend goes outside right or below the plot.
 */
export const LEGEND_MAX_COVERAGE = 0.02;

/**
 * An automatic legend goes outside right only when the plot area keeps at least this fraction of the figure
 * width beside it and no entry had to be cut there: a slide usually has it, a single column only for a
 * narrow legend; otherwise it goes below the plot. (0.58 rather than 0.6 since outward ticks widened the left
 * margin by a tick length: a slide with a short legend still takes it.)
 */
export const OUTSIDE_MIN_PLOT_FRACTION = 0.58;

/**
 * Thinning resolution (columns per scene px) of the curve paths the placement reads. Fixed, so the screen
 * (whose resolution follows the display) and every export pick the same corner; two px per column is well
 * under a cell, so the cells a curve crosses hardly differ from those of the finer drawn path.
 */
export const PLACEMENT_RESOLUTION = 0.5;

/**
 * Most points of a curve drawn in file order (or a region) that the placement thins itself. Thinning such a
 * curve at a new zoom level costs time in proportion to its points (run thinning, cached per level); the
 * placement's own level would double that for every big region on every such zoom. Beyond this many points
 * the placement reads the curve's most important points instead (see {@link placementCurve}).
 */
export const PLACEMENT_MAX_POINTS = 4_000;

// Per prepared curve and y-view slope: the arrays of its PLACEMENT_MAX_POINTS most important points, kept so
// that the plot cache (keyed by array identity) prepares them once.
const standIns = new WeakMap<PreparedCurve, Map<number, { massEv: Float64Array; gInvGeV: Float64Array }>>();

/**
 * The curve the placement reads in place of `curve`: the curve itself when it is drawn in mass order or has
 * at most PLACEMENT_MAX_POINTS usable points; otherwise the same curve reduced to its PLACEMENT_MAX_POINTS
 * most important points in the y view of `slope` (the Douglas–Peucker order the drawing already has, in file
 * order, ends included), which outlines it far finer than the 4 px cells need. Depends on the data and the
 * view only, never on the resolution, so screen and export still agree.
 */
export function placementCurve<C extends Pick<Curve, "role" | "keepOrder" | "massEv" | "gInvGeV">>(
  curve: C,
  slope: number,
): C {
  if (drawsSorted(curve)) return curve;
  const prep = preparedOf(curve);
  if (prep.n <= PLACEMENT_MAX_POINTS) return curve;
  let bySlope = standIns.get(prep);
  if (!bySlope) {
    bySlope = new Map();
    standIns.set(prep, bySlope);
  }
  let arrays = bySlope.get(slope);
  if (!arrays) {
    const order = viewArrays(prep, slope).order as Int32Array;
    const keep = order.slice(0, PLACEMENT_MAX_POINTS).sort();
    const massEv = new Float64Array(keep.length);
    const gInvGeV = new Float64Array(keep.length);
    for (let k = 0; k < keep.length; k++) {
      massEv[k] = 10 ** prep.lm[keep[k]];
      gInvGeV[k] = 10 ** prep.lg[keep[k]];
    }
    arrays = { massEv, gInvGeV };
    bySlope.set(slope, arrays);
  }
  return { ...curve, massEv: arrays.massEv, gInvGeV: arrays.gInvGeV };
}

/** Where an automatic legend can end up. */
export type AutoLegendPlace = LegendCorner | "outside-right" | "below";

/** The outcome of automatic placement, with each corner's coverage for tests and tooltips. */
export interface LegendChoice {
  place: AutoLegendPlace;
  /** Fraction of the legend box over drawn content in each corner. */
  coverage: Record<LegendCorner, number>;
  /** Every corner covers more than {@link LEGEND_MAX_COVERAGE}. */
  crowded: boolean;
}

export interface LegendPlaceInput {
  /** Drawn content to keep clear, as vertices: the curves and models (not grid, highlight or axes). */
  shapes: readonly Shape[];
  /** Plot area, scene px. */
  plot: PlotRect;
  /** The legend box (scene px) in each inner corner. */
  boxes: Record<LegendCorner, PlotRect>;
  /** Whether the figure leaves room for the legend outside right; asked only when every corner is crowded. */
  outsideFits: () => boolean;
  /** @default OCCUPANCY_CELL_PX */
  cellPx?: number;
  /** @default LEGEND_MAX_COVERAGE */
  maxCoverage?: number;
}

/**
 * Where an "auto" legend goes: the inner corner whose box covers the least drawn content (ties in the order
 * of {@link LEGEND_CORNERS}) when that is at most `maxCoverage` of the box; otherwise outside right if the
 * figure leaves room, else below the plot, so the legend never hides data. A pure function of its input.
 */
export function pickLegendPlace(input: LegendPlaceInput): LegendChoice {
  const grid = occupancyGrid(input.shapes, input.plot, input.cellPx ?? OCCUPANCY_CELL_PX);
  const coverage = {} as Record<LegendCorner, number>;
  let best: LegendCorner = LEGEND_CORNERS[0];
  for (const corner of LEGEND_CORNERS) {
    coverage[corner] = coveredFraction(grid, input.boxes[corner]);
    // Fractions of equal areas may differ in the last bit (1 vs 0.9999999999999998): a tie keeps the earlier corner.
    if (coverage[corner] < coverage[best] - 1e-9) best = corner;
  }
  const crowded = coverage[best] > (input.maxCoverage ?? LEGEND_MAX_COVERAGE);
  return { place: !crowded ? best : input.outsideFits() ? "outside-right" : "below", coverage, crowded };
}
