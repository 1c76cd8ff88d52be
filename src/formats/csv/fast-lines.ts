// The CSV parser's fast path for the common clean layout: lines of exactly two plain numbers split by the
// delimiter, nothing else. Any other line is left to the full path (Parser.dataLine), so results are identical.
import { MAX_EXACT_POW10, POW10 } from "../../physics/pow10";

/** What the fast path reads and updates of the parser (parser.ts); fixed by its decide() before data lines. */
export interface FastLineTarget {
  lines: number;
  dataRows: number;
  columnCount: number;
  dataColumnMax: number;
  n: number;
  m: Float64Array;
  g: Float64Array;
  readonly delim: number;
  readonly comma: boolean;
  readonly massCol: number;
  /** Power of ten of the mass unit, folded into the mass's exponent as readNumber does. */
  readonly massShift: number;
  /** Line end: 10 (LF, a CR before it dropped) or 13 (CR alone). */
  readonly nl: number;
  /** No conversion after reading: values in eV and GeV⁻¹ as written (times the mass unit's power of ten). */
  readonly plain: boolean;
  readonly preview: readonly unknown[];
  readonly previewMax: number;
  grow(): void;
  keep(row: number, massV: number, gV: number, t: string, s: number, e: number): void;
  isStopped(): boolean;
}

/** Data rows for which the parser counts columns (its COLUMN_COUNT_ROWS). */
const COLUMN_COUNT_ROWS = 1000;

/**
 * Reads the complete lines of t from `pos` on while each is `number delim number` (no blanks, quotes or
 * comments; a mantissa of at most 15 significant digits and a value Clinger's fast path gives exactly, as
 * readNumber does) and stores them as the full path would. Returns where it stopped: the start of the first
 * line it leaves to the full path (or of an unfinished last line), or t.length.
 * Only for a parser with a single-character delimiter, the mass and coupling in columns 1 and 2 (either
 * order) and no row limit.
 */
// Hot loop: long on purpose (both numbers read inline, no per-row call or allocation).
export function fastLines(p: FastLineTarget, t: string, pos: number): number {
  const len = t.length;
  const delim = p.delim;
  // Bare numbers use a decimal comma only when the comma is not the delimiter (Parser.dataLine's bareComma).
  const mark = p.comma && delim !== 44 ? 44 : 46;
  const nl = p.nl;
  const massFirst = p.massCol === 0;
  const plain = p.plain;
  const previewMax = p.previewMax;
  let m = p.m;
  let g = p.g;
  let n = p.n;
  let lines = p.lines;
  let dataRows = p.dataRows;
  let start = pos;
  line: while (start < len) {
    let i = start;
    let a = 0;
    let b = 0;
    for (let col = 0; col < 2; col++) {
      let c = t.charCodeAt(i);
      let neg = false;
      if (c === 45) {
        neg = true;
        c = t.charCodeAt(++i);
      } else if (c === 43) c = t.charCodeAt(++i);
      let mant = 0;
      let sig = 0;
      let digits = 0;
      let exp10 = 0;
      let point = false;
      for (;;) {
        if (c >= 48 && c <= 57) {
          digits++;
          if (sig === 0 && c === 48) {
            if (point) exp10--;
          } else {
            // A 16th significant digit: readNumber's correctly rounded slow path.
            if (sig === 15) break line;
            mant = mant * 10 + (c - 48);
            sig++;
            if (point) exp10--;
          }
        } else if (c === mark && !point) point = true;
        else break;
        c = t.charCodeAt(++i);
      }
      if (digits === 0) break line;
      if (c === 101 || c === 69) {
        c = t.charCodeAt(++i);
        let eneg = false;
        if (c === 45) {
          eneg = true;
          c = t.charCodeAt(++i);
        } else if (c === 43) c = t.charCodeAt(++i);
        let exp = 0;
        let expDigits = 0;
        while (c >= 48 && c <= 57) {
          if (++expDigits > 5) break line;
          exp = exp * 10 + (c - 48);
          c = t.charCodeAt(++i);
        }
        if (expDigits === 0) break line;
        exp10 += eneg ? -exp : exp;
      }
      let v: number;
      if (mant === 0) v = neg ? -0 : 0;
      else {
        const total = exp10 + ((col === 0) === massFirst ? p.massShift : 0);
        if (total >= 0 && total <= MAX_EXACT_POW10) v = mant * POW10[total];
        else if (total < 0 && total >= -MAX_EXACT_POW10) v = mant / POW10[-total];
        else break line;
        if (neg) v = -v;
      }
      if (col === 0) {
        if (c !== delim) break line;
        a = v;
        i++;
      } else b = v;
    }
    // The line must end right after the second number (a CR before the LF is dropped, as the full path does).
    const c = t.charCodeAt(i);
    let next: number;
    if (c === nl) next = i + 1;
    else if (c === 13 && nl === 10 && t.charCodeAt(i + 1) === 10) next = i + 2;
    else break;
    lines++;
    if (dataRows < COLUMN_COUNT_ROWS) {
      if (p.columnCount < 2) p.columnCount = 2;
      if (p.dataColumnMax < 2) p.dataColumnMax = 2;
    }
    dataRows++;
    const massV = massFirst ? a : b;
    const gV = massFirst ? b : a;
    if (plain && massV > 0 && gV > 0 && p.preview.length >= previewMax) {
      if (n === m.length) {
        p.n = n;
        p.grow();
        m = p.m;
        g = p.g;
      }
      m[n] = massV;
      g[n] = gV;
      n++;
    } else {
      // Conversions, non-positive values and preview rows: the full path's keep().
      p.n = n;
      p.lines = lines;
      p.dataRows = dataRows;
      p.keep(lines, massV, gV, t, start, i);
      m = p.m;
      g = p.g;
      n = p.n;
      if (p.isStopped()) {
        start = next;
        break;
      }
    }
    start = next;
  }
  p.n = n;
  p.lines = lines;
  p.dataRows = dataRows;
  return start;
}

/**
 * fastLines on the file's bytes (ASCII digits, signs, marks and delimiters are the same in UTF-8), for a
 * parser with `plain` values and LF line ends, reading from `pos` up to `limit` (just after a line feed).
 * Stores only rows that need nothing more (both values positive, preview full): it stops at the first other
 * line, which the caller hands to the parser as text. Returns where it stopped (a line start, or `limit`).
 */
// Hot loop: long on purpose (fastLines' loop with bytes; every read stays below `limit`, a line feed ends each line).
export function fastBytes(p: FastLineTarget, t: Uint8Array, pos: number, limit: number): number {
  if (p.preview.length < p.previewMax) return pos;
  const delim = p.delim;
  const mark = p.comma && delim !== 44 ? 44 : 46;
  const massFirst = p.massCol === 0;
  const massShift = p.massShift;
  let m = p.m;
  let g = p.g;
  let n = p.n;
  let lines = p.lines;
  let dataRows = p.dataRows;
  let start = pos;
  line: while (start < limit) {
    let i = start;
    let a = 0;
    let b = 0;
    for (let col = 0; col < 2; col++) {
      let c = t[i];
      if (c === 43) c = t[++i];
      // The significant digits in two small integers (the first nine, then up to six more): integer steps
      // instead of a chain of floating-point multiply-adds, and the same exact mantissa (below 2^53).
      let head = 0;
      let tail = 0;
      let sig = 0;
      let pointAt = -1;
      for (;;) {
        if (c >= 48 && c <= 57) {
          // Leading zeros are not significant (the point's position still counts them).
          if (sig !== 0 || c !== 48) {
            if (sig < 9) head = head * 10 + (c - 48);
            else if (sig < 15) tail = tail * 10 + (c - 48);
            // A 16th significant digit: readNumber's correctly rounded slow path.
            else break line;
            sig++;
          }
        } else if (c === mark && pointAt < 0) pointAt = i;
        else break;
        c = t[++i];
      }
      // No digits, or zero (not positive): the text path.
      if (sig === 0) break line;
      const mant = sig <= 9 ? head : head * POW10[sig - 9] + tail;
      // Every digit after the point lowers the exponent by one.
      let exp10 = pointAt < 0 ? 0 : pointAt + 1 - i;
      if (c === 101 || c === 69) {
        c = t[++i];
        let eneg = false;
        if (c === 45) {
          eneg = true;
          c = t[++i];
        } else if (c === 43) c = t[++i];
        let exp = 0;
        let expDigits = 0;
        while (c >= 48 && c <= 57) {
          if (++expDigits > 5) break line;
          exp = exp * 10 + (c - 48);
          c = t[++i];
        }
        if (expDigits === 0) break line;
        exp10 += eneg ? -exp : exp;
      }
      const total = exp10 + ((col === 0) === massFirst ? massShift : 0);
      let v: number;
      if (total >= 0 && total <= MAX_EXACT_POW10) v = mant * POW10[total];
      else if (total < 0 && total >= -MAX_EXACT_POW10) v = mant / POW10[-total];
      else break line;
      if (col === 0) {
        if (c !== delim) break line;
        a = v;
        i++;
      } else b = v;
    }
    const c = t[i];
    let next: number;
    if (c === 10) next = i + 1;
    else if (c === 13 && t[i + 1] === 10) next = i + 2;
    else break;
    lines++;
    if (dataRows < COLUMN_COUNT_ROWS) {
      if (p.columnCount < 2) p.columnCount = 2;
      if (p.dataColumnMax < 2) p.dataColumnMax = 2;
    }
    dataRows++;
    if (n === m.length) {
      p.n = n;
      p.grow();
      m = p.m;
      g = p.g;
    }
    m[n] = massFirst ? a : b;
    g[n] = massFirst ? b : a;
    n++;
    start = next;
  }
  p.n = n;
  p.lines = lines;
  p.dataRows = dataRows;
  return start;
}
