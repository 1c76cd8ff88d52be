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
