// The number codec of curve data in links: exact decimal "delta" form (digit steps and exponent steps) or plain lists.
import { isPlainObject } from "../../project/json";
import { ShapeError } from "./compact";
import { MAX_EXACT_POW10, POW10 } from "../../physics/pow10";

// Curve data (massEv, gInvGeV): either a JSON number array, or, when every value has at most 15 significant
// digits (data typed or digitised with few digits), the "decimal delta" form { e: [...], d: [...] } where
// value i = M_i × 10^(E_i) with M_i = d_0 + … + d_i and E_i = e_0 + … + e_i (all M_i with the same number of
// digits, so sorted data give small steps that compress about twice as well as the plain numbers). Both forms
// are exact: the digits are those of JavaScript's shortest round-trip decimal, and every value is checked
// to read back to the same double before the form is used. (The JSON writer writes the bytes directly; the
// text is the same as the first string-based encoder's, which tests/formats/link-large.test.ts keeps.)

// Largest digit count whose integers stay exact in a double (10¹⁵ < 2⁵³ ≈ 9.007·10¹⁵).
const MAX_DELTA_DIGITS = 15;

/**
 * Curve data on their way into the compact object: the JSON writer turns them straight into bytes (decimal
 * delta form or number list), so millions of values never become intermediate JS arrays or strings.
 */
export class NumberColumn {
  constructor(readonly values: Float64Array) {}
}

export function encodeNumbers(v: unknown): unknown {
  return new NumberColumn(v instanceof Float64Array ? v : Float64Array.from(v as ArrayLike<number>));
}

/**
 * round(|x| · 10^s) for |s| ≤ 22, NaN otherwise. When |x| has at most 15 significant digits and s puts them
 * left of the point, the one rounding of the product or quotient is too small to move the result off the
 * integer (relative error ≤ 2⁻⁵² on integers below 10¹⁵, i.e. < 0.25).
 */
function scaledRound(ax: number, s: number): number {
  if (s >= 0) return s <= MAX_EXACT_POW10 ? Math.round(ax * POW10[s]) : NaN;
  return s >= -MAX_EXACT_POW10 ? Math.round(ax / POW10[-s]) : NaN;
}

/**
 * The decimal delta form's integers of a column: value i = m[i] × 10^ex[i] with every m[i] of the same digit
 * count W (the largest shortest-round-trip digit count of the column, padded with zeros), or null when a
 * value needs more than 15 digits or is not finite. The result is exactly that of the first (string-based)
 * v1 encoder: for W ≤ 15 only one W-digit decimal reads back to a given double (their spacing, ≥ 10⁻¹⁵
 * relative, is wider than a double's rounding interval, ≤ 2⁻⁵² relative), so whichever way it is found it
 * is the same. Most values take the fast path: scale by an exact power of ten, round, and check the way back
 * with one exactly rounded operation (an exact integer below 2⁵³ times or over an exact power of ten is
 * correctly rounded, as a decimal-to-double parse is: Clinger, "How to read floating point numbers
 * accurately", PLDI 1990). The rest go through toExponential(), the shortest round-trip digits.
 */
export function deltaForm(a: Float64Array): { m: Float64Array; ex: Int32Array } | null {
  const n = a.length;
  const m = new Float64Array(n);
  const ex = new Int32Array(n);
  let w = 0;
  for (let i = 0; i < n; i++) {
    const x = a[i];
    if (w > 0) {
      if (x === 0) {
        m[i] = 0;
        ex[i] = 1 - w;
        continue;
      }
      const ax = x < 0 ? -x : x;
      let s = w - 1 - Math.floor(Math.log10(ax));
      let mm = scaledRound(ax, s);
      // log10 may land one decade off next to a power of ten: move s by one so that mm has w digits.
      if (mm >= POW10[w]) mm = scaledRound(ax, --s);
      else if (mm < POW10[w - 1]) mm = scaledRound(ax, ++s);
      if (mm >= POW10[w - 1] && mm < POW10[w] && (s >= 0 ? mm / POW10[s] : mm * POW10[-s]) === ax) {
        m[i] = x < 0 ? -mm : mm;
        ex[i] = -s;
        continue;
      }
    }
    // Slow path: the shortest digits of x from toExponential() ("-1.2345e-7"); non-finite values have no "e".
    const t = x.toExponential();
    const eAt = t.indexOf("e");
    if (eAt < 0) return null;
    const neg = t.charCodeAt(0) === 45;
    const dot = t.indexOf(".");
    const digits = dot < 0 ? t.slice(neg ? 1 : 0, eAt) : t.slice(neg ? 1 : 0, dot) + t.slice(dot + 1, eAt);
    const k = digits.length;
    if (k > MAX_DELTA_DIGITS) return null;
    if (k > w) {
      // A wider value: pad everything written so far to the new width (exact: integers stay below 10¹⁵).
      const up = POW10[k - w];
      for (let j = 0; j < i; j++) {
        m[j] *= up;
        ex[j] -= k - w;
      }
      w = k;
    }
    const mm = Number(digits) * POW10[w - k];
    const e = Number(t.slice(eAt + 1)) - (w - 1);
    const signed = neg ? -mm : mm;
    if (Number(`${signed}e${e}`) !== x) return null;
    m[i] = signed;
    ex[i] = e;
  }
  return { m, ex };
}

/** m × 10^e as the double nearest to it: one exactly rounded operation when 10^|e| is exact, else a parse. */
function fromDecimal(m: number, e: number): number {
  if (e >= 0 && e <= MAX_EXACT_POW10) return m * POW10[e];
  if (e < 0 && e >= -MAX_EXACT_POW10) return m / POW10[-e];
  return Number(`${m}e${e}`);
}

/** Inverse of {@link encodeNumbers}; a number array passes through (the schema checks its values). */
export function decodeNumbers(v: unknown): unknown {
  if (Array.isArray(v)) return v;
  if (!isPlainObject(v) || !Array.isArray(v.e) || !Array.isArray(v.d) || v.e.length !== v.d.length) {
    throw new ShapeError("curve data are neither a list of numbers nor a decimal delta list");
  }
  const e = v.e as unknown[];
  const d = v.d as unknown[];
  const out = new Float64Array(e.length);
  let m = 0;
  let ex = 0;
  for (let i = 0; i < e.length; i++) {
    const de = e[i];
    const dd = d[i];
    if (!Number.isSafeInteger(de) || !Number.isSafeInteger(dd))
      throw new ShapeError("curve data contain a step that is not an integer");
    m += dd as number;
    ex += de as number;
    if (!Number.isSafeInteger(m) || Math.abs(ex) > 400) throw new ShapeError("curve data contain a value out of range");
    out[i] = fromDecimal(m, ex);
  }
  return out;
}
