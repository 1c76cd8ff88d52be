// Streaming JSON writer for the compact link object: the bytes JSON.stringify would give, with curve columns
// written as digits straight into the buffer (no string or array per value), handed on in chunks.
import { isPlainObject } from "../../project/json";
import { NumberColumn, deltaForm } from "./numbers";
import { POW10 } from "../../physics/pow10";

// The compact JSON goes out in chunks of about this size (the deflater takes them as they come).
export const CHUNK_BYTES = 1 << 20;

const UTF8 = new TextEncoder();

/**
 * Writes the compact object as UTF-8 JSON, byte for byte what JSON.stringify gives for it (with each
 * NumberColumn in its link form), in chunks handed to `emit`. Numbers of curve data are written as ASCII
 * digits straight into the buffer: no string per value, no array of millions of numbers.
 */
export class JsonWriter {
  private buf = new Uint8Array(64 * 1024);
  private pos = 0;

  constructor(private readonly emit: (chunk: Uint8Array) => void) {}

  /** Makes room for `n` more bytes: grows the buffer up to CHUNK_BYTES, then hands full chunks on. */
  private room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    if (this.buf.length >= CHUNK_BYTES) {
      this.emit(this.buf.subarray(0, this.pos));
      this.buf = new Uint8Array(Math.max(CHUNK_BYTES, n));
      this.pos = 0;
      return;
    }
    const grown = new Uint8Array(Math.max(Math.min(this.buf.length * 2, CHUNK_BYTES), this.pos + n));
    grown.set(this.buf.subarray(0, this.pos));
    this.buf = grown;
  }

  end(): void {
    if (this.pos > 0) this.emit(this.buf.subarray(0, this.pos));
    this.pos = 0;
  }

  private byte(b: number): void {
    this.room(1);
    this.buf[this.pos++] = b;
  }

  private text(s: string): void {
    this.room(s.length * 3);
    this.pos += UTF8.encodeInto(s, this.buf.subarray(this.pos)).written;
  }

  /** ASCII text (digits, signs, exponents): one byte per character. */
  private ascii(s: string): void {
    this.room(s.length);
    const b = this.buf;
    let p = this.pos;
    for (let i = 0; i < s.length; i++) b[p++] = s.charCodeAt(i);
    this.pos = p;
  }

  /** An integer-valued double below 2⁵³ in magnitude, as JSON.stringify writes it (−0 as "0"). */
  private int(v: number): void {
    this.room(17);
    const b = this.buf;
    let p = this.pos;
    if (v < 0) {
      b[p++] = 45;
      v = -v;
    }
    if (v >= 1e8) {
      // Two parts of at most 8 digits each in int32 range; the split is exact for integers (v < 2⁵³).
      let hi = Math.floor(v / 1e8);
      let lo = v - hi * 1e8;
      if (lo >= 1e8) {
        hi += 1;
        lo -= 1e8;
      } else if (lo < 0) {
        hi -= 1;
        lo += 1e8;
      }
      p = writeDigits(b, p, hi, 0);
      p = writeDigits(b, p, lo, 8);
    } else p = writeDigits(b, p, v, 0);
    this.pos = p;
  }

  value(v: unknown): void {
    if (v instanceof NumberColumn) this.column(v.values);
    else if (Array.isArray(v)) {
      this.byte(91);
      for (let i = 0; i < v.length; i++) {
        if (i > 0) this.byte(44);
        const item: unknown = v[i];
        // As JSON.stringify: holes, undefined and functions in arrays become null.
        if (item === undefined || typeof item === "function" || typeof item === "symbol") this.ascii("null");
        else this.value(item);
      }
      this.byte(93);
    } else if (isPlainObject(v)) {
      this.byte(123);
      let first = true;
      for (const key of Object.keys(v)) {
        const item = v[key];
        if (item === undefined || typeof item === "function" || typeof item === "symbol") continue;
        if (!first) this.byte(44);
        first = false;
        this.text(JSON.stringify(key));
        this.byte(58);
        this.value(item);
      }
      this.byte(125);
    } else this.text(JSON.stringify(v) ?? "null");
  }

  /** Curve data: the decimal delta form {"e":[…],"d":[…]} when exact and at least 4 values, else a number list. */
  private column(a: Float64Array): void {
    const delta = a.length >= 4 ? deltaForm(a) : null;
    if (delta) {
      const { m, ex } = delta;
      this.ascii('{"e":[');
      for (let i = 0; i < ex.length; i++) {
        if (i > 0) this.byte(44);
        this.int(i === 0 ? ex[0] : ex[i] - ex[i - 1]);
      }
      this.ascii('],"d":[');
      for (let i = 0; i < m.length; i++) {
        if (i > 0) this.byte(44);
        this.int(i === 0 ? m[0] : m[i] - m[i - 1]);
      }
      this.ascii("]}");
      return;
    }
    this.byte(91);
    for (let i = 0; i < a.length; i++) {
      if (i > 0) this.byte(44);
      const x = a[i];
      // String(x) is JSON's number form for finite x (ECMA-262 Number::toString); JSON writes null otherwise.
      this.ascii(Number.isFinite(x) ? String(x) : "null");
    }
    this.byte(93);
  }
}

/** Writes the digits of a non-negative integer v < 2³¹ at p, left-padded with zeros to `width`; returns the new end. */
function writeDigits(b: Uint8Array, p: number, v: number, width: number): number {
  let len = 1;
  while (len < 10 && v >= POW10[len]) len++;
  if (len < width) len = width;
  let q = v | 0;
  for (let j = p + len - 1; j >= p; j--) {
    const t = (q / 10) | 0;
    b[j] = 48 + q - t * 10;
    q = t;
  }
  return p + len;
}
