// The link formats ever written, by version, and the checksum that formats from v3 on carry: the one place to
// change when a new format is added.
import { crc32 } from "../crc32";
import { base64UrlEncode } from "./base64url";
import type { CompactLayout } from "./compact";
import { COMPACT_V1 } from "./v1";
import { COMPACT_V2 } from "./v2";

/**
 * One link format: fragment = "v<version>." + base64url without padding (RFC 4648 §5) of raw DEFLATE
 * (RFC 1951; any level reads the same) of the UTF-8 JSON of the layout's compact object, then, when `checked`,
 * "." + the checksum of everything before it ({@link linkChecksum}).
 */
interface LinkFormat {
  layout: CompactLayout;
  checked: boolean;
}

/**
 * Every link format ever written, by version. A format is frozen once written: a change gets a new version
 * here, and old links keep decoding with their own entry. To add one: write its compact layout (a copy of the
 * newest with the new fields and their base values, as ./v1.ts), add `N: { layout, checked: true }`, and set
 * LINK_FORMAT_VERSION to N. Version 2 (unchecked) is the layout with the model kinds of project schema
 * version 2; version 3 is that layout checked. Links of version 3 written before the model kinds (v1's
 * object) read the same through it: every key v2 adds has a base value equal to what v1 drew.
 */
export const LINK_FORMATS: Readonly<Record<number, LinkFormat>> = {
  1: { layout: COMPACT_V1, checked: false },
  2: { layout: COMPACT_V2, checked: false },
  3: { layout: COMPACT_V2, checked: true },
};

/** Link format this build writes ("v3." prefix). */
export const LINK_FORMAT_VERSION: number = 3;

/** Characters of the checksum at the end of a checked link (4 bytes in base64url). */
export const CHECKSUM_CHARS = 6;

/**
 * The checksum of a checked link: CRC-32 (ISO 3309 / ITU-T V.42, as in zlib and PNG) of the ASCII text
 * before it ("v3." and the payload), big-endian, in base64url. CRC-32 rather than a hash such as FNV-1a:
 * it detects every change of up to 32 consecutive bits for certain (Peterson and Brown, Proc. IRE 49 (1961)
 * 228), so any one wrong bit, character or swapped pair of neighbours is caught, not just very probably.
 */
export function linkChecksum(text: string): string {
  const c = crc32(new TextEncoder().encode(text));
  return base64UrlEncode(Uint8Array.of(c >>> 24, (c >>> 16) & 255, (c >>> 8) & 255, c & 255));
}
