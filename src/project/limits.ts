// The size limits of a project, apart from the schema so that code which only checks a size (the autosave
// reader) does not load the schema and its validator.
import { MAX_RATIONAL_CHARS } from "./rational-text";

/** Size limits of a project; anything beyond is refused (or, for text, cut) rather than trusted. */
export const PROJECT_LIMITS = {
  models: 500,
  curves: 500,
  /** Points per curve. */
  points: 5_000_000,
  fermions: 200,
  id: 100,
  label: 500,
  citation: 100_000,
  fileName: 1_000,
  rational: MAX_RATIONAL_CHARS,
  /** Members of a model set or between-lines band (distinct E/N values). */
  members: 20_000,
} as const;

/**
 * Smallest and largest custom figure size, mm: what the schema accepts, restore clamps to and the plot draws
 * (keeps a typo from making a 0 px or 10 m figure; 1000 mm at 300 dpi is 11,811 px, within what browsers draw).
 */
export const CUSTOM_MM_LIMITS: readonly [number, number] = [20, 1000];

/** Legend text size factor (Figure.legendScale). */
export const LEGEND_SCALE_LIMITS: readonly [number, number] = [0.7, 1.5];
