// Checks on a file before it is read: size cap, empty file, known binary formats, and the text encoding
// (UTF-8, UTF-16 with a byte order mark).
import type { ImportProblem } from "./types";

/** Largest file the import accepts: 200 MB (200 × 2²⁰ bytes), about 8 million rows of two numbers. */
export const MAX_IMPORT_BYTES = 200 * 1024 * 1024;

/** The encodings the import reads: UTF-16 by its byte order mark, UTF-8 when valid, else Windows-1252. */
export type ImportEncoding = "utf-8" | "utf-16le" | "utf-16be" | "windows-1252";

/** What the importer learns from a file's name, size and first bytes before reading it. */
export type FileCheck = { ok: true; encoding: ImportEncoding } | { ok: false; problem: ImportProblem };

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
 * bytes or mostly non-text in the first bytes (pass at least the first 4 KiB); the encoding (see ImportEncoding).
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
  let encoding: ImportEncoding = "utf-8";
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(b.subarray(0, end));
  } catch {
    // Not UTF-8: Windows-1252, the single-byte encoding spreadsheets on most desktops write (a superset of
    // Latin-1 for printable characters; the WHATWG Encoding Standard maps the label "latin1" to it).
    encoding = "windows-1252";
    text = new TextDecoder(encoding).decode(b);
  }
  // A Latin-1 table is mostly ASCII (digits, delimiters): mostly high bytes is binary data, not text.
  if (looksBinary(text) || (encoding === "windows-1252" && nonAsciiShare(text) > 0.1)) {
    return { ok: false, problem: binaryProblem() };
  }
  return { ok: true, encoding };
}

/** Decoded text of a whole file held in memory (the command line's path), or why it cannot be read. */
export function decodeImportBytes(
  bytes: Uint8Array,
): { ok: true; text: string; encoding: ImportEncoding } | { ok: false; problem: ImportProblem } {
  const check = checkImportFile({ size: bytes.length, firstBytes: bytes.subarray(0, 4096) });
  if (!check.ok) return check;
  if (check.encoding === "utf-8") {
    try {
      return { ok: true, text: new TextDecoder("utf-8", { fatal: true }).decode(bytes), encoding: "utf-8" };
    } catch {
      return { ok: true, text: new TextDecoder("windows-1252").decode(bytes), encoding: "windows-1252" };
    }
  }
  return { ok: true, text: new TextDecoder(check.encoding).decode(bytes), encoding: check.encoding };
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

function nonAsciiShare(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) > 127) n++;
  return text.length > 0 ? n / text.length : 0;
}
