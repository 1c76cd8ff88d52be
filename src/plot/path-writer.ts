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
  } else if (ip < 1000) {
    // Most coordinates and moves: up to three integer digits, written without a reversing pass.
    if (ip >= 100) {
      const h = Math.floor(ip / 100);
      buf[pos++] = 48 + h;
      ip -= h * 100;
      const t = Math.floor(ip / 10);
      buf[pos++] = 48 + t;
      buf[pos++] = 48 + ip - t * 10;
    } else if (ip >= 10) {
      const t = Math.floor(ip / 10);
      buf[pos++] = 48 + t;
      buf[pos++] = 48 + ip - t * 10;
    } else buf[pos++] = 48 + ip;
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
    const t = Math.floor(fp / 10);
    buf[pos++] = 48 + t;
    if (fp - t * 10 !== 0) buf[pos++] = 48 + fp - t * 10;
  }
}

/** Append a plain string (ASCII only). */
export function writeAscii(s: string): void {
  ensure(s.length);
  for (let i = 0; i < s.length; i++) buf[pos++] = s.charCodeAt(i) & 0x7f;
}

// The latest paths written here, so that the SVG writer's check of path data (isSafePathData in svg.ts) need
// not rescan tens of thousands of characters per curve on every frame: what this module writes holds only
// command letters, digits, "-", "." and spaces by construction. Bounded to 8·10⁶ characters (about 8 MB: the
// paths of a few frames; a figure has a few dozen paths).
const RECENT_MAX_CHARS = 8_000_000;
const recent = new Set<string>();
const recentOrder: string[] = [];
let recentChars = 0;

/** The path written since beginPath(). */
export function finishPath(): string {
  const d = decoder.decode(buf.subarray(0, pos));
  // Short paths are checked faster than remembered.
  if (d.length >= 256 && d.length <= RECENT_MAX_CHARS / 4 && !recent.has(d)) {
    recent.add(d);
    recentOrder.push(d);
    recentChars += d.length;
    while (recentChars > RECENT_MAX_CHARS) {
      const old = recentOrder.shift() as string;
      recent.delete(old);
      recentChars -= old.length;
    }
  }
  return d;
}

/** Whether `d` equals path data lately returned by finishPath (so it is well-formed and safe by construction). */
export function isRecentPath(d: string): boolean {
  return recent.has(d);
}

export const CH = { M: 77, L: 76, Z: 90, l: 108, h: 104, v: 118, space: 32 } as const;
