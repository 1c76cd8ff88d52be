// Short random ids for models and curves: unique enough within one project, short enough for share links.
// Uses the Web Crypto random source where present (browsers, Node ≥ 19) and Math.random otherwise.

const ALPHABET = "0123456789abcdefghijklmnopqrstuvwxyz";

/** `n` random bytes; crypto.getRandomValues works in insecure contexts too (unlike randomUUID). */
function randomBytes(n: number): Uint8Array {
  const out = new Uint8Array(n);
  const c = (globalThis as { crypto?: { getRandomValues?: (a: Uint8Array) => Uint8Array } }).crypto;
  if (c?.getRandomValues) c.getRandomValues(out);
  else for (let i = 0; i < n; i++) out[i] = Math.floor(Math.random() * 256);
  return out;
}

/**
 * A fresh id such as "m-k3x9q2af": the prefix, a dash and `length` base-36 characters.
 * 8 characters give 36⁸ ≈ 2.8·10¹² values, so a clash within one project is negligible.
 * @param prefix short tag of the kind of object ("m" model, "c" curve). @default "id"
 * @param length number of random characters. @default 8
 */
export function newId(prefix = "id", length = 8): string {
  const bytes = randomBytes(length);
  let s = "";
  // 252 = 7·36: rejecting bytes ≥ 252 keeps every character equally likely.
  for (let i = 0; s.length < length; i++) {
    const b = i < bytes.length ? bytes[i] : randomBytes(1)[0];
    if (b < 252) s += ALPHABET[b % 36];
  }
  return `${prefix}-${s}`;
}

/**
 * An id not in `taken`: `wanted` itself when free, else `wanted-2`, `wanted-3`, … (deterministic, used
 * when repairing projects whose ids clash).
 */
export function uniqueId(wanted: string, taken: ReadonlySet<string>): string {
  if (!taken.has(wanted)) return wanted;
  for (let n = 2; ; n++) {
    const candidate = `${wanted}-${n}`;
    if (!taken.has(candidate)) return candidate;
  }
}
