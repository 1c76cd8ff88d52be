// Parsing a UTF-8 curve file from its bytes: the clean numeric lines are read straight from the bytes
// (fastBytes), everything else is decoded and read as text, so the result is parseCurveText's on the decoded file.
import { checkImportFile } from "./file-check";
import { fastBytes } from "./fast-lines";
import { Parser } from "./parser";
import type { CurveParseOptions, CurveParseResult } from "./types";

/** Bytes read as text first, for detection, the header and the binary check (then up to the next line feed). */
const FIRST_BYTES = 64 * 1024;

/**
 * What parseCurveText gives for the bytes decoded as UTF-8 (as decodeImportBytes decodes a file without a
 * byte order mark), with `encoding: "utf-8"`; null when that is not how the file would be read (rejected by
 * checkImportFile, a byte order mark, or not valid UTF-8): the caller decodes it with decodeImportBytes.
 */
export function parseCurveBytes(bytes: Uint8Array, opts: CurveParseOptions = {}): CurveParseResult | null {
  const len = bytes.length;
  const check = checkImportFile({ size: len, firstBytes: bytes.subarray(0, 4096) });
  if (!check.ok || check.encoding !== "utf-8" || bytes[0] === 0xef) return null;
  // Lines are decoded one by one: a line feed never falls inside a UTF-8 sequence, so the pieces decode as the
  // whole file would (ignoreBOM: a U+FEFF after the start is kept, as in one decode of the file).
  const decoder = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true });
  const parser = new Parser({ sizeHint: len, ...opts, encoding: "utf-8" });
  const lastLf = bytes.lastIndexOf(10);
  const limit = lastLf + 1;
  let pos = lastLf < FIRST_BYTES ? len : bytes.indexOf(10, FIRST_BYTES) + 1;
  try {
    parser.push(decoder.decode(bytes.subarray(0, pos)));
    while (pos < len && !parser.isStopped()) {
      if (!parser.takesBytes()) {
        parser.push(decoder.decode(bytes.subarray(pos)));
        break;
      }
      pos = fastBytes(parser, bytes, pos, limit);
      if (pos >= len) break;
      // A line the fast path leaves (or the last one, without a line feed): as text.
      const lf = bytes.indexOf(10, pos);
      const end = lf < 0 ? len : lf + 1;
      parser.push(decoder.decode(bytes.subarray(pos, end)));
      pos = end;
    }
    // A file stopped early is still read as Windows-1252 when its rest is not UTF-8, as decodeImportBytes would.
    if (pos < len) decoder.decode(bytes.subarray(pos));
  } catch (e) {
    if (e instanceof TypeError) return null;
    throw e;
  }
  return parser.finish();
}
