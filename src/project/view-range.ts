// The visible ranges a figure can show: positive, finite, at least MIN_RANGE_DECADES wide and within 10^±300, so
// that log scales, zoom steps and the saved project never meet an empty or degenerate range.

/**
 * Narrowest range shown, in decades (10^0.02 ≈ 1.047: ends 4.7 % apart). Narrower ranges give a log scale of
 * (almost) zero width, whose zoom and tick arithmetic divides by it; the figure's zoom stops here too.
 */
export const MIN_RANGE_DECADES = 0.02;
/** Largest |log10| of a range end (doubles reach 10^±308; ticks and labels need a little room). */
const MAX_ABS_LOG10 = 300;

/**
 * A range as a figure can show it: ends swapped into order, widened about its logarithmic centre to
 * MIN_RANGE_DECADES when narrower, and kept within 10^±300; null when an end is not a positive finite number.
 */
export function saneRange(r: readonly [number, number]): [number, number] | null {
  const lo = Math.min(r[0], r[1]);
  const hi = Math.max(r[0], r[1]);
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo > 0)) return null;
  const l0 = Math.log10(lo);
  const l1 = Math.log10(hi);
  if (l1 - l0 >= MIN_RANGE_DECADES && l0 >= -MAX_ABS_LOG10 && l1 <= MAX_ABS_LOG10) return [lo, hi];
  const span = Math.min(2 * MAX_ABS_LOG10, Math.max(MIN_RANGE_DECADES, l1 - l0));
  const c = Math.min(MAX_ABS_LOG10 - span / 2, Math.max(-MAX_ABS_LOG10 + span / 2, (l0 + l1) / 2));
  return [10 ** (c - span / 2), 10 ** (c + span / 2)];
}
