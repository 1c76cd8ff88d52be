// Deferred run thinning: on screen, the first thinning of a big file-order curve at a new zoom level is left to
// a worker (src/worker/run-jobs.ts) while the frame draws a stand-in; exports never defer, so they never see one.
import type { PreparedCurve } from "../../analysis/prepared-curve";
import type { LevelSelection, ViewArrays } from "./prepared";

/** The chunks of one level that a frame drew with a stand-in, for the worker to thin. */
export interface RunJob {
  /** The curve and y view thinned (prep.lm, va.v); the view's identity keys the worker's copy of its arrays. */
  prep: PreparedCurve;
  va: ViewArrays;
  /** The level the answer goes into, its run sizes (see thinRunsLog) and the chunk numbers it lacks. */
  level: LevelSelection;
  chunks: number[];
}

/**
 * Given by the caller of the thinning (buildScene's `deferRuns`) to defer big first thinnings; collects what
 * was deferred in this build. A build that deferred nothing drew exactly what an export would draw.
 */
export interface RunDeferral {
  jobs: RunJob[];
}

/**
 * Points of a curve's visible chunks still to thin at a level from which the thinning is deferred. Run thinning
 * costs ~10–50 ns a point here once optimised (far more when its code first runs): below this the round trip
 * and the second frame cost more than thinning at once.
 */
export const DEFER_MIN_POINTS = 16_384;

/** A stand-in chunk beyond this many √2 steps of the level asked for is not used (Douglas–Peucker instead). */
const MAX_STAND_IN_STEPS = 4;

/**
 * A stand-in for chunk c of a level: the same chunk thinned at the nearest other level of this view (a finer one
 * on a tie: it keeps the error bound). One √2 step coarser is within 0.71 px instead of 0.5 px. Null when no
 * level near enough has it.
 */
export function nearestLevelChunk(va: ViewArrays, level: LevelSelection, c: number): Int32Array | null {
  let best: Int32Array | null = null;
  let bestSteps = MAX_STAND_IN_STEPS + 1e-9;
  let bestFiner = false;
  for (const other of va.levels.values()) {
    const idx = other.perChunk[c];
    if (other === level || !idx) continue;
    // Levels are powers of √2 apart: 2·|log2 ratio| counts the steps.
    const steps = 2 * (Math.abs(Math.log2(other.tx / level.tx)) + Math.abs(Math.log2(other.ty / level.ty)));
    const finer = other.tx <= level.tx && other.ty <= level.ty;
    if (steps < bestSteps - 1e-9 || (Math.abs(steps - bestSteps) <= 1e-9 && finer && !bestFiner)) {
      best = idx;
      bestSteps = steps;
      bestFiner = finer;
    }
  }
  return best;
}

/**
 * Puts a worker's answer into its level: the indices of chunks[k] are indices[offsets[k] … offsets[k+1]), what
 * thinRunChunk gives here for the same arrays. Chunks the level got meanwhile (a synchronous build) are kept.
 */
export function installRunChunks(
  level: LevelSelection,
  chunks: ArrayLike<number>,
  offsets: Int32Array,
  indices: Int32Array,
): void {
  for (let k = 0; k < chunks.length; k++) {
    const c = chunks[k];
    if (!level.perChunk[c]) level.perChunk[c] = indices.subarray(offsets[k], offsets[k + 1]);
  }
}
