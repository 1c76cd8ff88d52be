// E/N as the project stores it: text holding an exact fraction or a decimal ("8/3", "-1/3", "0.5"), and its value.
// Kept apart from the schema so the migration steps and the defaults can read E/N without importing the schema.

/** Longest E/N text a project holds (PROJECT_LIMITS.rational). */
export const MAX_RATIONAL_CHARS = 64;

// One pass: optional sign, then "p/q" (integers, spaces around "/" allowed) or a decimal with exponent.
const RATIONAL_RE =
  /^\s*([+\-\u2212]?)(?:(\d+)\s*\/\s*([+\-\u2212]?)(\d+)|((?:\d+\.?\d*|\.\d+)(?:[eE][+\-\u2212]?\d+)?))\s*$/;

/**
 * Numeric value of E/N text as the E/N field stores it ("8/3", "-1/3", "0.5", "1e-1"; spaces around "/" and a
 * Unicode minus are tolerated); NaN when it is neither a number nor a fraction, the denominator is 0, or the
 * value is not finite.
 */
export function rationalValue(s: string): number {
  if (typeof s !== "string" || s.length > MAX_RATIONAL_CHARS) return Number.NaN;
  const m = RATIONAL_RE.exec(s);
  if (!m) return Number.NaN;
  const sign = m[1] === "" || m[1] === "+" ? 1 : -1;
  let v: number;
  if (m[2] !== undefined) {
    const den = Number(m[4]) * (m[3] === "" || m[3] === "+" ? 1 : -1);
    if (den === 0) return Number.NaN;
    v = (sign * Number(m[2])) / den;
  } else {
    v = sign * Number(m[5].replace("\u2212", "-"));
  }
  return Number.isFinite(v) ? v : Number.NaN;
}

/** Whether a string is E/N text accepted by {@link rationalValue}. */
export function isRationalText(s: string): boolean {
  return !Number.isNaN(rationalValue(s));
}
