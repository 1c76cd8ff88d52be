// Exact rationals for anomaly coefficients: strict parsing of user-typed charges and a canonical "p/q" form.
// Built on fraction.js; decimals are refused on purpose because a rounded 0.3333 would silently change E/N.
import Fraction from "fraction.js";

export { Fraction };

/** An exact rational number (a fraction.js Fraction, always reduced, sign carried by the numerator). */
export type Rational = Fraction;

/** Outcome of parsing one rational input. */
export type RationalParse = { ok: true; value: Rational } | { ok: false; reason: string };

// Integers or p/q with optional sign; U+2212 (minus sign) is accepted because physicists paste from PDFs.
const RATIONAL_RE = /^([+-]?)(\d+)(?:\s*\/\s*([+-]?)(\d+))?$/;

/**
 * Parse an exact rational: an integer number, or a string "p", "p/q", "-p/q" (spaces around "/" allowed,
 * Unicode minus accepted). Decimals ("0.5", 0.5) and anything else are refused with a reason.
 */
export function parseRational(input: unknown): RationalParse {
  if (typeof input === "number") {
    if (Number.isSafeInteger(input)) return { ok: true, value: new Fraction(input) };
    if (!Number.isFinite(input)) return { ok: false, reason: "is not a finite number" };
    return { ok: false, reason: 'is not an exact rational; write it as a fraction such as "1/3"' };
  }
  if (typeof input === "bigint") return { ok: true, value: new Fraction(input) };
  if (typeof input !== "string") return { ok: false, reason: "is missing or not a number" };
  const text = input.trim().replace(/\u2212/g, "-");
  if (text === "") return { ok: false, reason: "is empty" };
  const m = RATIONAL_RE.exec(text);
  if (!m) {
    const decimal = /^[+-]?(\d+\.\d*|\.\d+|\d+(\.\d*)?[eE][+-]?\d+)$/.test(text);
    return {
      ok: false,
      reason: decimal
        ? 'is not a rational number (decimals are not exact; write a fraction such as "1/3")'
        : "is not a rational number",
    };
  }
  const [, signP, p, signQ, q] = m;
  if (q !== undefined && /^0+$/.test(q)) return { ok: false, reason: "has a zero denominator" };
  const num = BigInt(p) * (signP === "-" ? -1n : 1n);
  const den = q === undefined ? 1n : BigInt(q) * (signQ === "-" ? -1n : 1n);
  return { ok: true, value: new Fraction(num, den) };
}

/** Canonical text of a rational: reduced "p/q" or "p", sign on p ("-2/3", "0", "44/3"). */
export function toFractionString(r: Rational | number | string): string {
  const f = r instanceof Fraction ? r : new Fraction(r);
  return f.toFraction(false);
}

/** Nearest double of an exact rational. */
export function rationalValue(r: Rational): number {
  return r.valueOf();
}

/** The rational 0. */
