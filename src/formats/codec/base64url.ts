// base64url without padding (RFC 4648 §5) for link payloads; the decoder also takes standard base64 letters.

const B64 = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_";
const B64_INDEX = (() => {
  const t = new Int16Array(128).fill(-1);
  for (let i = 0; i < 64; i++) t[B64.charCodeAt(i)] = i;
  // Standard base64 letters too, in case a tool rewrote the link.
  t["+".charCodeAt(0)] = 62;
  t["/".charCodeAt(0)] = 63;
  return t;
})();

const B64_CODES = Uint8Array.from(B64, (c) => c.charCodeAt(0));
const ASCII = new TextDecoder();

/** base64url without padding (RFC 4648 §5). Written as ASCII bytes and turned into a string once. */
export function base64UrlEncode(bytes: Uint8Array): string {
  const n = bytes.length;
  const full = n - (n % 3);
  const out = new Uint8Array(Math.ceil((n * 4) / 3));
  let o = 0;
  for (let i = 0; i < full; i += 3) {
    const v = (bytes[i] << 16) | (bytes[i + 1] << 8) | bytes[i + 2];
    out[o] = B64_CODES[v >> 18];
    out[o + 1] = B64_CODES[(v >> 12) & 63];
    out[o + 2] = B64_CODES[(v >> 6) & 63];
    out[o + 3] = B64_CODES[v & 63];
    o += 4;
  }
  if (n - full === 1) {
    const v = bytes[full] << 16;
    out[o++] = B64_CODES[v >> 18];
    out[o++] = B64_CODES[(v >> 12) & 63];
  } else if (n - full === 2) {
    const v = (bytes[full] << 16) | (bytes[full + 1] << 8);
    out[o++] = B64_CODES[v >> 18];
    out[o++] = B64_CODES[(v >> 12) & 63];
    out[o++] = B64_CODES[(v >> 6) & 63];
  }
  return ASCII.decode(out.subarray(0, o));
}

/** Length of the base64url text (no padding) of `n` bytes. */
export function base64Length(n: number): number {
  return Math.ceil((n * 4) / 3);
}

/** Bytes of a base64url (or base64) string without padding; null when a character or the length is invalid. */
export function base64UrlDecode(text: string): Uint8Array | null {
  let n = text.length;
  while (n > 0 && text.charCodeAt(n - 1) === 61) n--;
  if (n % 4 === 1) return null;
  const out = new Uint8Array(Math.floor((n * 3) / 4));
  const idx = B64_INDEX;
  const full = n - (n % 4);
  let o = 0;
  for (let i = 0; i < full; i += 4) {
    const c0 = text.charCodeAt(i);
    const c1 = text.charCodeAt(i + 1);
    const c2 = text.charCodeAt(i + 2);
    const c3 = text.charCodeAt(i + 3);
    if ((c0 | c1 | c2 | c3) > 127) return null;
    const a = idx[c0];
    const b = idx[c1];
    const c = idx[c2];
    const d = idx[c3];
    if ((a | b | c | d) < 0) return null;
    const v = (a << 18) | (b << 12) | (c << 6) | d;
    out[o] = v >> 16;
    out[o + 1] = (v >> 8) & 255;
    out[o + 2] = v & 255;
    o += 3;
  }
  const left = n - full;
  if (left > 0) {
    let v = 0;
    for (let j = 0; j < 4; j++) {
      let x = 0;
      if (j < left) {
        const code = text.charCodeAt(full + j);
        x = code < 128 ? idx[code] : -1;
        if (x < 0) return null;
      }
      v = (v << 6) | x;
    }
    out[o] = (v >> 16) & 255;
    if (left > 2) out[o + 1] = (v >> 8) & 255;
  }
  return out;
}
