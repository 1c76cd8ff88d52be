// Checks on a file before it is read: size cap, empty file, known binary formats, and the text encoding
// (UTF-8, UTF-16 with a byte order mark).
import type { ImportProblem } from "./types";

/** Largest file the import accepts: 200 MB (200 × 2²⁰ bytes), about 8 million rows of two numbers. */
export const MAX_IMPORT_BYTES = 200 * 1024 * 1024;

/** What the importer learns from a file's name, size and first bytes before reading it. */
export type FileCheck =
  { ok: true; encoding: "utf-8" | "utf-16le" | "utf-16be" } | { ok: false; problem: ImportProblem };

const MAGIC: [number[], string][] = [
  [
    [0x50, 0x4b, 0x03, 0x04],
    "a ZIP archive (a spreadsheet workbook such as .xlsx or .ods?); save the sheet as CSV first",
  ],
  [[0x25, 0x50, 0x44, 0x46], "a PDF document, not a text table"],
  [[0x1f, 0x8b], "gzip-compressed; unpack it first"],
  [[0x89, 0x50, 0x4e, 0x47], "a PNG image, not a text table"],
  [[0xff, 0xd8, 0xff], "a JPEG image, not a text table"],
  [[0xd0, 0xcf, 0x11, 0xe0], "an old binary spreadsheet (.xls?); save the sheet as CSV first"],
];

/**
 * Checks before reading a file: size cap ({@link MAX_IMPORT_BYTES}), empty file, known binary formats, NUL
 * bytes or mostly non-text in the first bytes (pass at least the first 4 KiB). Detects a UTF-16 BOM.
 */
export function checkImportFile(file: { name?: string; size: number; firstBytes: Uint8Array }): FileCheck {
  if (file.size === 0) return { ok: false, problem: { code: "empty", message: "the file is empty" } };
  if (file.size > MAX_IMPORT_BYTES) {
    const mb = (file.size / (1024 * 1024)).toFixed(0);
    return {
      ok: false,
      problem: {
        code: "too-large",
        message: `the file is ${mb} MB; the import takes files up to ${MAX_IMPORT_BYTES / (1024 * 1024)} MB`,
      },
    };
  }
  const b = file.firstBytes;
  if (b.length >= 2 && b[0] === 0xff && b[1] === 0xfe) return { ok: true, encoding: "utf-16le" };
  if (b.length >= 2 && b[0] === 0xfe && b[1] === 0xff) return { ok: true, encoding: "utf-16be" };
  for (const [sig, what] of MAGIC) {
    if (b.length >= sig.length && sig.every((x, i) => b[i] === x)) {
      return { ok: false, problem: { code: "binary", message: `the file looks like ${what}` } };
    }
  }
  if (b.includes(0)) return { ok: false, problem: binaryProblem() };
  // Cut a character split at the end of the sample so it does not count as an error.
  let end = b.length;
  for (let k = 1; k <= 3 && end - k >= 0; k++) {
    const x = b[end - k];
    if ((x & 0xc0) === 0xc0) {
      end -= k;
      break;
    }
    if ((x & 0x80) === 0) break;
  }
  const text = new TextDecoder("utf-8").decode(b.subarray(0, end));
  if (looksBinary(text)) return { ok: false, problem: binaryProblem() };
  return { ok: true, encoding: "utf-8" };
}

export function binaryProblem(): ImportProblem {
  return { code: "binary", message: "the file holds binary data, not a text table (CSV, UTF-8)" };
}

/** NUL characters, or more than 10 % control characters or undecodable bytes (U+FFFD). */
export function looksBinary(sample: string): boolean {
  let bad = 0;
  const n = Math.min(sample.length, 8192);
  for (let i = 0; i < n; i++) {
    const c = sample.charCodeAt(i);
    if (c === 0) return true;
    if ((c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13) || c === 0xfffd) bad++;
  }
  return n > 0 && bad / n > 0.1;
}
