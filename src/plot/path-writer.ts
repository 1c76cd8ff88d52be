// Writes SVG path data into a reused byte buffer and decodes it once: a hot path of every redraw.

// Why bytes: number → string conversion of non-integers is the slowest step of a redraw in V8, and digits
// written as bytes are several times faster. The value is exactly q / 100 for every coordinate q given in
// hundredths of a pixel (leading zeros dropped).
let buf = new Uint8Array(1 << 16);
let pos = 0;
const decoder = new TextDecoder("latin1");

function ensure(n: number): void {
  if (pos + n <= buf.length) return;
  const grown = new Uint8Array(Math.max(buf.length * 2, pos + n));
  grown.set(buf.subarray(0, pos));
  buf = grown;
}

/** Start a new path (the buffer is shared: finish one path before starting the next). */
export function beginPath(): void {
  pos = 0;
}

/**
 * Append an integer count of hundredths as a decimal number: 12345 → "123.45", -50 → "-.5", 300 → "3".
 * Fractions drop the leading zero (".5"; SVG 1.1 path grammar allows it) as the compact paths are mostly
 * small relative moves.
 */
export function writeHundredths(q: number): void {
  ensure(24);
  pos = putHundredths(buf, pos, q);
}

/**
 * Writes q hundredths at b[p…] and returns the new position (b must have 24 bytes free). A pure function
 * of its arguments, small enough for V8 to inline into the path loops, for |q| < 10⁵ (coordinates and moves
 * of up to 999.99 px: nearly all of them); the rest goes to {@link putHundredthsWide}.
 */
function putHundredths(b: Uint8Array, p: number, q: number): number {
  if (!(q > -100000 && q < 100000)) return putHundredthsWide(b, p, q);
  if (q < 0) {
    b[p++] = 45;
    q = -q;
  }
  // q is a whole number of hundredths (callers round), so this is floor(q / 100) and the remainder.
  const ip = (q / 100) | 0;
  const fp = q - ip * 100;
  if (ip >= 100) {
    const h = (ip / 100) | 0;
    b[p++] = 48 + h;
    const r = ip - h * 100;
    const t = (r / 10) | 0;
    b[p++] = 48 + t;
    b[p++] = 48 + r - t * 10;
  } else if (ip >= 10) {
    const t = (ip / 10) | 0;
    b[p++] = 48 + t;
    b[p++] = 48 + ip - t * 10;
  } else if (ip > 0 || fp === 0) b[p++] = 48 + ip;
  if (fp !== 0) {
    b[p++] = 46;
    const t = (fp / 10) | 0;
    b[p++] = 48 + t;
    if (fp - t * 10 !== 0) b[p++] = 48 + fp - t * 10;
  }
  return p;
}

/** {@link putHundredths} for any magnitude (and 0 for NaN and ±∞). */
function putHundredthsWide(b: Uint8Array, p: number, q: number): number {
  if (!(q === q) || q === Infinity || q === -Infinity) q = 0;
  if (q < 0) {
    b[p++] = 45;
    q = -q;
  }
  let ip = Math.floor(q / 100);
  const fp = q - ip * 100;
  const start = p;
  if (ip === 0 && fp === 0) b[p++] = 48;
  while (ip > 0) {
    const d = ip % 10;
    b[p++] = 48 + d;
    ip = (ip - d) / 10;
  }
  for (let a = start, z = p - 1; a < z; a++, z--) {
    const t = b[a];
    b[a] = b[z];
    b[z] = t;
  }
  if (fp !== 0) {
    b[p++] = 46;
    const t = Math.floor(fp / 10);
    b[p++] = 48 + t;
    if (fp - t * 10 !== 0) b[p++] = 48 + fp - t * 10;
  }
  return p;
}

/** Bytes one vertex can take in {@link compactPath} or {@link absolutePath}: a letter, two numbers, a space. */
const VERTEX_BYTES = 2 + 2 * 24;

function appendAscii(b: Uint8Array, p: number, s: string): number {
  for (let i = 0; i < s.length; i++) b[p++] = s.charCodeAt(i) & 0x7f;
  return p;
}

/**
 * Path data of a polyline in one pass: an absolute "M" then relative moves between positions rounded to
 * 0.01 px ("l dx dy", or "h dx" / "v dy" when one coordinate repeats), so every vertex lands exactly on its
 * rounded absolute position; repeated vertices are dropped. `extra` (absolute commands) goes before the
 * closing Z. Starts a new path (as beginPath) and returns it finished.
 */
export function compactPath(xs: Float64Array, ys: Float64Array, n: number, closed: boolean, extra = ""): string {
  pos = 0;
  ensure(n * VERTEX_BYTES + extra.length + 2);
  let p = putCompact(buf, 0, xs, ys, 0, n);
  if (extra) p = appendAscii(buf, p, extra);
  if (closed) buf[p++] = 90; /* Z */
  pos = p;
  return finishPath();
}

/**
 * Several polylines in one path data, each written as {@link compactPath} writes one (closed polygons unless
 * `closed` is false): polyline k holds the vertices [ends[k − 1], ends[k]) (from 0 for the first).
 */
export function compactPolygons(
  xs: Float64Array,
  ys: Float64Array,
  ends: Int32Array,
  count: number,
  closed = true,
): string {
  pos = 0;
  ensure((count ? ends[count - 1] : 0) * VERTEX_BYTES + count);
  let p = 0;
  let from = 0;
  for (let k = 0; k < count; k++) {
    if (ends[k] > from) {
      p = putCompact(buf, p, xs, ys, from, ends[k]);
      if (closed) buf[p++] = 90; /* Z */
    }
    from = ends[k];
  }
  pos = p;
  return finishPath();
}

/** Writes vertices [from, to) (to > from) at b[p…] as "M x y" and relative moves; returns the new position. */
// A hot loop, long on purpose: the number writer is inlined by V8 and the moves are chosen per vertex.
function putCompact(b: Uint8Array, p: number, xs: Float64Array, ys: Float64Array, from: number, to: number): number {
  let px = Math.round(xs[from] * 100);
  let py = Math.round(ys[from] * 100);
  b[p++] = 77; /* M */
  p = putHundredths(b, p, px);
  b[p++] = 32; /* space */
  p = putHundredths(b, p, py);
  for (let k = from + 1; k < to; k++) {
    const qx = Math.round(xs[k] * 100);
    const qy = Math.round(ys[k] * 100);
    const dx = qx - px;
    const dy = qy - py;
    if (dx === 0) {
      if (dy !== 0) {
        b[p++] = 118; /* v */
        p = putHundredths(b, p, dy);
      }
    } else if (dy === 0) {
      b[p++] = 104; /* h */
      p = putHundredths(b, p, dx);
    } else {
      b[p++] = 108; /* l */
      p = putHundredths(b, p, dx);
      // A minus sign separates the two numbers by itself.
      if (dy > 0) b[p++] = 32; /* space */
      p = putHundredths(b, p, dy);
    }
    px = qx;
    py = qy;
  }
  return p;
}

/** Path data "M x y L x y …" with absolute coordinates rounded to 0.01 px, closed with Z when asked. */
export function absolutePath(xs: Float64Array, ys: Float64Array, n: number, closed: boolean, extra = ""): string {
  pos = 0;
  ensure(n * VERTEX_BYTES + extra.length + 2);
  const b = buf;
  let p = 0;
  for (let k = 0; k < n; k++) {
    b[p++] = k === 0 ? 77 /* M */ : 76; /* L */
    p = putHundredths(b, p, Math.round(xs[k] * 100));
    b[p++] = 32; /* space */
    p = putHundredths(b, p, Math.round(ys[k] * 100));
  }
  if (extra) p = appendAscii(b, p, extra);
  if (closed) b[p++] = 90; /* Z */
  pos = p;
  return finishPath();
}

/** Append a plain string (ASCII only). */
export function writeAscii(s: string): void {
  ensure(s.length);
  for (let i = 0; i < s.length; i++) buf[pos++] = s.charCodeAt(i) & 0x7f;
}

/** The path written since beginPath(). */
export function finishPath(): string {
  return decoder.decode(buf.subarray(0, pos));
}
