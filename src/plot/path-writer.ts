// Writes SVG path data into a reused byte buffer and decodes it once: number → string conversion of
// non-integers is the slowest step of a redraw in V8, and digits written as bytes are several times faster.
// The value is exactly q / 100 for every coordinate q given in hundredths of a pixel (leading zeros dropped).

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

/** Append one ASCII character (a command letter or a separator). */
export function writeChar(code: number): void {
  ensure(1);
  buf[pos++] = code;
}

/**
 * Append an integer count of hundredths as a decimal number: 12345 → "123.45", -50 → "-.5", 300 → "3".
 * Fractions drop the leading zero (".5"; SVG 1.1 path grammar allows it) as the compact paths are mostly
 * small relative moves.
 */
export function writeHundredths(q: number): void {
  ensure(24);
  if (!(q === q) || q === Infinity || q === -Infinity) q = 0;
  if (q < 0) {
    buf[pos++] = 45;
    q = -q;
  }
  let ip = Math.floor(q / 100);
  const fp = q - ip * 100;
  if (ip === 0) {
    if (fp === 0) buf[pos++] = 48;
  } else {
    const start = pos;
    while (ip > 0) {
      const d = ip % 10;
      buf[pos++] = 48 + d;
      ip = (ip - d) / 10;
    }
    for (let a = start, b = pos - 1; a < b; a++, b--) {
      const t = buf[a];
      buf[a] = buf[b];
      buf[b] = t;
    }
  }
  if (fp !== 0) {
    buf[pos++] = 46;
    buf[pos++] = 48 + Math.floor(fp / 10);
    if (fp % 10) buf[pos++] = 48 + (fp % 10);
  }
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

export const CH = { M: 77, L: 76, Z: 90, l: 108, h: 104, v: 118, space: 32 } as const;
