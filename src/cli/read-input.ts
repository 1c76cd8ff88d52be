// Reading the renderer's input files: a failure as one line naming the file, and a CSV file decoded and parsed
// as the app's import does. Small on purpose: the parse workers load this module and the CSV parser only.
import { readFileSync } from "node:fs";
import { basename } from "node:path";
import {
  decodeImportBytes,
  formatProblem,
  parseCurveBytes,
  parseCurveText,
  type CurveParseResult,
} from "../formats/csv";
import type { CliOptions } from "./args";

/** A problem with the user's input or options: reported on stderr, exit code 2, nothing written. */
export class InputError extends Error {}

/** A file's bytes; an InputError naming the file when it cannot be read. */
export function readBytes(path: string): Buffer {
  try {
    return readFileSync(path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === "ENOENT"
        ? "no such file"
        : code === "EISDIR"
          ? "is a directory"
          : code === "EACCES"
            ? "permission denied"
            : (e as Error).message;
    throw new InputError(`${path}: cannot read the file (${why})`);
  }
}

/** Reads and parses one CSV input as the app's import would (the worker threads call this too). */
export function parseCsvFile(path: string, opts: Pick<CliOptions, "massUnit" | "couplingUnit">): CurveParseResult {
  const bytes = readBytes(path);
  const parseOpts = { fileName: basename(path), massUnit: opts.massUnit, couplingUnit: opts.couplingUnit };
  // A UTF-8 file without a byte order mark (most): clean numeric lines read straight from the bytes.
  const fromBytes = parseCurveBytes(bytes, parseOpts);
  if (fromBytes) return fromBytes;
  // Decoded as the app's import decodes it (UTF-16 by its BOM, UTF-8, else Windows-1252).
  const d = decodeImportBytes(bytes);
  if (!d.ok) throw new InputError(formatProblem(path, d.problem));
  return parseCurveText(d.text, { ...parseOpts, encoding: d.encoding });
}
