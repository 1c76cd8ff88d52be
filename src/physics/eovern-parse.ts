// Reading a typed E/N: one value ("8/3", "0.5"), an interval ("5/3..44/3") or lines ("5/3 | 44/3"); unlike PQ
// charges, E/N may be a decimal, since it only feeds g_aγγ.

/**
 * Parsed E/N text: the two ends as typed (normalised), their values, and whether they differ; for "a | b"
 * also `lines`, the distinct values (ascending) whose lines bound the region between them.
 */
export type EOverNParse =
  | { ok: true; min: string; max: string; minValue: number; maxValue: number; isBand: boolean; lines?: string[] }
  | { ok: false; error: string };

const FRACTION_RE = /^([+-]?\d+)\/([+-]?\d+)$/;
const DECIMAL_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function normalise(token: string): string {
  return token
    .trim()
    .replace(/\u2212/g, "-")
    .replace(/\s*\/\s*/g, "/");
}

/**
 * Value of a plain number ("0.5", "-2", "1e-1") or fraction ("8/3", "-1/3") as a double; NaN when the text
 * is neither or the denominator is 0. Unicode minus (U+2212) is accepted.
 */
export function rationalToNumber(s: string | number): number {
  if (typeof s === "number") return s;
  const t = normalise(s);
  const frac = FRACTION_RE.exec(t);
  if (frac) {
    const den = Number(frac[2]);
    return den === 0 ? Number.NaN : Number(frac[1]) / den;
  }
  return DECIMAL_RE.test(t) ? Number(t) : Number.NaN;
}

// Separators tried in order; a hyphen counts only with spaces on both sides, so "-1/3" stays a number.
const SEPARATORS: RegExp[] = [/\.\.\.?|…/, /\s*[\u2013\u2014]\s*/, /\s+to\s+/i, /\s+-\s+/];

/**
 * Parse the E/N field of a model row.
 * @param text one value or an interval "a..b" (also "a – b", "a — b", "a to b", "a - b"); the ends are
 *   sorted, so "44/3..5/3" is the same band as "5/3..44/3".
 */
export function parseEOverN(text: string): EOverNParse {
  if (typeof text !== "string") return { ok: false, error: "E/N: expected text" };
  const trimmed = text.trim();
  if (trimmed === "")
    return {
      ok: false,
      error: "E/N: empty; enter a value such as 8/3, an interval such as 5/3..44/3 or lines such as 5/3 | 44/3",
    };
  if (trimmed.includes("|")) return parseLines(trimmed);
  let parts: string[] = [trimmed];
  for (const sep of SEPARATORS) {
    const split = trimmed.split(sep);
    if (split.length > 1) {
      parts = split;
      break;
    }
  }
  const interval = parts.length > 1;
  const what = interval ? "E/N interval" : "E/N";
  if (parts.length > 2) return { ok: false, error: `${what}: "${trimmed}" has more than two ends` };
  const ends: { text: string; value: number }[] = [];
  for (const raw of parts) {
    const token = normalise(raw);
    if (token === "") return { ok: false, error: `${what}: "${trimmed}" is missing an end` };
    const value = rationalToNumber(token);
    if (Number.isNaN(value)) {
      const zeroDen = FRACTION_RE.test(token) && Number(FRACTION_RE.exec(token)?.[2]) === 0;
      return {
        ok: false,
        error: `${what}: "${token}" ${zeroDen ? "has a zero denominator" : "is not a number or fraction"}`,
      };
    }
    if (!Number.isFinite(value)) return { ok: false, error: `${what}: "${token}" is not a finite number` };
    ends.push({ text: token.replace(/^\+/, ""), value });
  }
  const [a, b] =
    ends.length === 2 && ends[1].value < ends[0].value ? [ends[1], ends[0]] : [ends[0], ends[ends.length - 1]];
  return { ok: true, min: a.text, max: b.text, minValue: a.value, maxValue: b.value, isBand: a.value < b.value };
}

/**
 * "a | b | …": the band between the lines of two or more E/N values (each a number or fraction, any order;
 * repeated values count once).
 */
function parseLines(trimmed: string): EOverNParse {
  const what = "E/N lines";
  const seen = new Map<number, string>();
  for (const raw of trimmed.split("|")) {
    const token = normalise(raw);
    if (token === "") return { ok: false, error: `${what}: "${trimmed}" has an empty value next to a "|"` };
    const value = rationalToNumber(token);
    if (!Number.isFinite(value))
      return { ok: false, error: `${what}: "${token}" is not a number or fraction (between lines: 5/3 | 44/3)` };
    if (!seen.has(value)) seen.set(value, token.replace(/^\+/, ""));
  }
  if (seen.size < 2)
    return { ok: false, error: `${what}: "${trimmed}" needs two different values, such as 5/3 | 44/3` };
  const sorted = [...seen.entries()].sort((x, y) => x[0] - y[0]);
  const [lo, hi] = [sorted[0], sorted[sorted.length - 1]];
  return {
    ok: true,
    min: lo[1],
    max: hi[1],
    minValue: lo[0],
    maxValue: hi[0],
    isBand: true,
    lines: sorted.map((x) => x[1]),
  };
}
