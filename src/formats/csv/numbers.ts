// Reading numbers in place from the text, correctly rounded, with the unit's power of ten folded into the
// exponent, so the import allocates nothing per row (Clinger's fast path, then the engine's Number()).
import { MAX_EXACT_POW10, POW10 } from "../../physics/pow10";

export const ERR_NONE = 0;
const ERR_EMPTY = 1;
const ERR_NAN = 2;
export const ERR_RANGE = 3;
/** How the last readNumber ended: its error code and the first character that cannot continue the number. */
export const read = { err: ERR_NONE, end: 0 };

/**
 * Reads a number starting at t[s] and stopping at the first character that cannot continue it (read.end),
 * times 10^shift, correctly rounded; NaN with `read.err` set when no number starts there. Accepts a leading
 * + or − (also U+2212); the decimal point is `,` when `comma`, else `.` (never both: a file has one mark). The shift is applied to the decimal
 * exponent, so `1.5` μeV becomes exactly the double nearest 1.5e-6. Callers check what follows read.end.
 */
// Hot loop: long on purpose (one pass per character, called for every cell of every file).
export function readNumber(t: string, s: number, e: number, shift: number, comma: boolean): number {
  read.err = ERR_NONE;
  read.end = s;
  if (s >= e) {
    read.err = ERR_EMPTY;
    return NaN;
  }
  let i = s;
  let c = t.charCodeAt(i);
  let neg = false;
  if (c === 45 || c === 0x2212) {
    neg = true;
    i++;
  } else if (c === 43) i++;
  let mant = 0;
  let sig = 0;
  let exp10 = 0;
  let digits = 0;
  let point = false;
  let long = false;
  let hasExp = false;
  for (; i < e; i++) {
    c = t.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      digits++;
      if (sig === 0 && c === 48) {
        if (point) exp10--;
      } else if (sig < 15) {
        mant = mant * 10 + (c - 48);
        sig++;
        if (point) exp10--;
      } else {
        long = true;
      }
    } else if (c === (comma ? 44 : 46) && !point) {
      point = true;
    } else {
      hasExp = c === 101 || c === 69;
      break;
    }
  }
  const mantEnd = i;
  read.end = i;
  if (digits === 0) {
    read.err = ERR_NAN;
    return NaN;
  }
  let exp = 0;
  if (hasExp) {
    i++;
    let eneg = false;
    c = i < e ? t.charCodeAt(i) : 0;
    if (c === 45 || c === 0x2212) {
      eneg = true;
      i++;
    } else if (c === 43) i++;
    const first = i;
    for (; i < e; i++) {
      c = t.charCodeAt(i);
      if (c < 48 || c > 57) break;
      if (exp < 100000) exp = exp * 10 + (c - 48);
    }
    read.end = i;
    if (i === first) {
      read.err = ERR_NAN;
      return NaN;
    }
    if (eneg) exp = -exp;
  }
  if (!long) {
    if (mant === 0) return neg ? -0 : 0;
    const total = exp10 + exp + shift;
    // Clinger's fast path: an integer below 10¹⁵ and 10^|total| ≤ 10²² are exact doubles, so one IEEE
    // multiplication or division gives the correctly rounded result.
    if (total >= 0 && total <= MAX_EXACT_POW10) return neg ? -(mant * POW10[total]) : mant * POW10[total];
    if (total < 0 && total >= -MAX_EXACT_POW10) return neg ? -(mant / POW10[-total]) : mant / POW10[-total];
  }
  let str = t.slice(s, mantEnd);
  if (comma) str = str.replace(",", ".");
  if (str.charCodeAt(0) === 0x2212) str = "-" + str.slice(1);
  if (exp !== 0 || shift !== 0) str += "e" + (exp + shift);
  const v = Number(str);
  if (!Number.isFinite(v)) {
    read.err = ERR_RANGE;
    return NaN;
  }
  return v;
}

/**
 * True when the whole string is written as a plain or scientific number (with `,` as decimal point when
 * `comma`), even one beyond the range of a double (it may fit once the unit's prefix is applied).
 */
export function isNumberText(text: string, comma = false): boolean {
  const s = text.trim();
  readNumber(s, 0, s.length, 0, comma);
  return (read.err === ERR_NONE || read.err === ERR_RANGE) && read.end === s.length;
}

/** The number a string holds (same grammar as the importer), or NaN. */
export function readNumberText(text: string, comma = false): number {
  const s = text.trim();
  const v = readNumber(s, 0, s.length, 0, comma);
  return read.err === ERR_NONE && read.end === s.length ? v : NaN;
}

/** The rejection reason for the field t[s, e). */
export function fieldReason(t: string, s: number, e: number, outOfRange: boolean): string {
  if (s >= e) return "empty field";
  const raw = t.slice(s, e);
  const shown = raw.length > 40 ? raw.slice(0, 40) + "…" : raw;
  return outOfRange ? `out of range: "${shown}"` : `not a number: "${shown}"`;
}
